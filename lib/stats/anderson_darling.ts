/**
 * Anderson–Darling test of normality with mean and variance estimated from
 * the sample.
 *
 * @module
 */
import { formatNumber } from "../results/format.ts";
import { type _EdfPass, _edfPass, _edfSample } from "./_edf_pass.ts";
import { checkSize } from "./_input.ts";
import { roundingWarning } from "./rounding.ts";
import { freezeResult, type TestResult } from "./result.ts";

/** The Anderson–Darling result: {@linkcode TestResult} plus the modified statistic. */
export interface AndersonDarlingResult extends TestResult {
  /** A²* = A²·(1 + 0.75/n + 2.25/n²), the statistic the p-value formula takes. */
  readonly modified: number;
  /**
   * `"none"` when `pValue` is the formula's value; `"at-most"` when A²* is so
   * large that the formula stops decreasing and `pValue` is an upper bound.
   */
  readonly pBound: "none" | "at-most";
}

const _WHAT = "the Anderson–Darling test";
/** Smallest n (common practice; the case-3 p formula is used from about 8 values on). */
const _MIN_N = 8;
/** The exponent of the D'Agostino–Stephens formula for A²* ≥ 0.6. */
function _upperExponent(a: number): number {
  return 1.2937 - 5.709 * a + 0.0186 * a * a;
}
/** Where that exponent is smallest; beyond it the fitted formula turns upward. */
const _VERTEX = 5.709 / (2 * 0.0186);

/**
 * p-value of A²* (case 3: mean and variance estimated), D'Agostino &
 * Stephens (1986, Goodness-of-Fit Techniques, Marcel Dekker), Table 4.9:
 *
 * | A²*          | p                                          |
 * | ------------ | ------------------------------------------ |
 * | < 0.2        | 1 − exp(−13.436 + 101.14·A − 223.73·A²)    |
 * | [0.2, 0.34)  | 1 − exp(−8.318 + 42.796·A − 59.938·A²)     |
 * | [0.34, 0.6)  | exp(0.9177 − 4.279·A − 1.38·A²)            |
 * | ≥ 0.6        | exp(1.2937 − 5.709·A + 0.0186·A²)          |
 */
function _pValue(a: number): { p: number; bound: "none" | "at-most" } {
  if (a < 0.2) return { p: -Math.expm1(-13.436 + 101.14 * a - 223.73 * a * a), bound: "none" };
  if (a < 0.34) return { p: -Math.expm1(-8.318 + 42.796 * a - 59.938 * a * a), bound: "none" };
  if (a < 0.6) return { p: Math.exp(0.9177 - 4.279 * a - 1.38 * a * a), bound: "none" };
  if (a <= _VERTEX) return { p: Math.exp(_upperExponent(a)), bound: "none" };
  return { p: Math.exp(_upperExponent(_VERTEX)), bound: "at-most" };
}

/**
 * Anderson–Darling test of normality, mean and standard deviation
 * estimated (Anderson & Darling 1954, "A test of goodness of fit", JASA
 * 49:765–769; Stephens 1974, JASA 69:730–737, "case 3").
 *
 * With the sorted sample standardised as zᵢ = (x₍ᵢ₎ − x̄)/s (s with n − 1),
 * A² = −n − (1/n)·Σ (2i−1)·[ln Φ(zᵢ) + ln(1 − Φ(z₍ₙ₊₁₋ᵢ₎))], evaluated in
 * one pass as Σ [(2i−1)·ln Φ(zᵢ) + (2n−2i+1)·ln Q(zᵢ)] with compensated
 * summation. Both logarithms come from one upper-tail value per point
 * (Cody's normal tail, then its asymptotic series past |z| = 30), so far
 * outliers give a finite, accurate A² where log(Φ) of a rounded Φ would be
 * −∞. The mean is carried in two parts, so data like 1e9 + small noise lose
 * no accuracy.
 *
 * p comes from the modified statistic A²* = A²(1 + 0.75/n + 2.25/n²) by
 * D'Agostino & Stephens' piecewise exponential formulas (Table 4.9), which
 * they give to about two significant digits. The last piece's exponent has
 * its minimum at A²* = 153.5 (p ≈ 1e−190); beyond it the fitted curve turns
 * up, so plumbline reports that minimum as an upper bound (`pBound:
 * "at-most"`) rather than an increasing p.
 *
 * Range: n ≥ 8 (common practice); no upper limit; sorting is the main cost.
 * Adds a warning when the measurement step is coarse against the spread
 * (`rounding.ts`).
 * A² checked against scipy 1.10 `anderson` and p against statsmodels 0.13
 * `normal_ad` to 1e−9 (tests/stats/anderson_darling_test.ts).
 *
 * @param x the sample: finite numbers, at least 8, not all equal
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { andersonDarling } from "@plumbline/plumbline";
 * const r = andersonDarling([4.2, 3.9, 5.1, 4.8, 4.4, 3.6, 5.0, 4.1, 4.6, 4.3]);
 * if (!(r.statistic > 0 && r.modified > r.statistic)) throw new Error("A² and A²*");
 * if (!(r.pValue > 0.1)) throw new Error("these look normal");
 * ```
 */
export function andersonDarling(x: ArrayLike<number>): AndersonDarlingResult {
  const { sorted, shape } = _edfSample(x, _WHAT, _MIN_N);
  return _andersonDarlingOf(_edfPass(sorted, shape), roundingWarning(sorted, false));
}

/**
 * {@linkcode andersonDarling} from the EDF pass over the sorted sample
 * (shared with Lilliefors) and its ties warning; the size is checked here.
 */
export function _andersonDarlingOf(
  pass: _EdfPass,
  ties: string | undefined,
): AndersonDarlingResult {
  const n = pass.n;
  checkSize(n, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const a2 = -n - pass.adSum / n;
  const modified = a2 * (1 + 0.75 / n + 2.25 / (n * n));
  const { p, bound } = _pValue(modified);
  const warnings: string[] = [];
  if (ties !== undefined) warnings.push(ties);
  if (bound === "at-most") {
    warnings.push(
      `A²* = ${formatNumber(modified, 4)} is far beyond the range of the p-value formula: ` +
        `p is only known to be below ${formatNumber(p, 2)}`,
    );
  }
  return freezeResult({
    test: "Anderson–Darling",
    statisticName: "A²",
    statistic: a2,
    pValue: p,
    n,
    method: "A² with estimated mean and sd; p from A²* = A²(1 + 0.75/n + 2.25/n²) by " +
      "D'Agostino & Stephens (1986), Table 4.9",
    warnings,
    modified,
    pBound: bound,
  });
}
