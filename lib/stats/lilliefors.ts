/**
 * Lilliefors test: the Kolmogorov–Smirnov distance to the normal with mean
 * and standard deviation estimated from the sample.
 *
 * @module
 */
import { type _EdfPass, _edfPass, _edfSample } from "./_edf_pass.ts";
import { checkSize } from "./_input.ts";
import { roundingWarning } from "./rounding.ts";
import { freezeResult, type TestResult } from "./result.ts";

/** The Lilliefors result: {@linkcode TestResult} plus what kind of p it is. */
export interface LillieforsResult extends TestResult {
  /**
   * `"none"` when `pValue` is the Dallal–Wilkinson approximation (p ≤ 0.1);
   * `"at-least"` when the approximation is past its range and only
   * "p > 0.1" is known, in which case `pValue` is 0.1.
   */
  readonly pBound: "none" | "at-least";
}

const _WHAT = "the Lilliefors test";
/** Smallest n: Dallal & Wilkinson's simulations start at n = 5 (from memory). */
const _MIN_N = 5;
/** The largest p the Dallal–Wilkinson formula is calibrated for. */
const _P_CALIBRATED = 0.1;

/**
 * Dallal & Wilkinson (1986, "An analytic approximation to the distribution
 * of Lilliefors's test statistic for normality", The American Statistician
 * 40:294–296): for n ≤ 100,
 * p = exp(−7.01256·D²·(n + 2.78019) + 2.99587·D·√(n + 2.78019) − 0.122119
 * + 0.974598/√n + 1.67997/n); for n > 100 the same with D·(n/100)^0.49 in
 * place of D and 100 in place of n. Stated for p ≤ 0.1. On that range p
 * decreases in D (the exponent's turning point lies where p > 1).
 */
function _dallalWilkinson(d: number, n: number): number {
  let dd = d;
  let m = n;
  if (n > 100) {
    dd = d * (n / 100) ** 0.49;
    m = 100;
  }
  const m2 = m + 2.78019;
  return Math.exp(
    -7.01256 * dd * dd * m2 + 2.99587 * dd * Math.sqrt(m2) - 0.122119 +
      0.974598 / Math.sqrt(m) + 1.67997 / m,
  );
}

/**
 * Lilliefors test of normality (Lilliefors 1967, "On the Kolmogorov–Smirnov
 * test for normality with mean and variance unknown", JASA 62:399–402).
 *
 * D = sup |Fₙ(x) − Φ((x − x̄)/s)| (s with n − 1), exact: with the sorted
 * values, D = maxᵢ max(i/n − Φ(zᵢ), Φ(zᵢ) − (i−1)/n), which covers both
 * sides of every step of the empirical distribution function, ties
 * included. One pass after sorting.
 *
 * p: the Dallal–Wilkinson (1986) approximation, which they calibrated for
 * p ≤ 0.1 only. When it gives more than 0.1, plumbline does not invent a
 * number: it reports `pValue = 0.1` with `pBound: "at-least"` and a warning,
 * which is enough for any test at the 10% level or stricter. For a p-value
 * over the whole range use Anderson–Darling or Shapiro–Wilk, which are also
 * more powerful.
 *
 * Range: n ≥ 5; no upper limit. Adds a warning when the measurement step
 * is coarse against the spread (`rounding.ts`). D and p checked against statsmodels 0.13
 * `lilliefors(pvalmethod="approx")` to 1e−9 (tests/stats/lilliefors_test.ts).
 *
 * @param x the sample: finite numbers, at least 5, not all equal
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { lilliefors } from "@plumbline/plumbline";
 * const r = lilliefors([1, 1.2, 1.1, 1.3, 9, 9.2, 9.1, 9.3, 9.4, 1.4, 1.05, 9.05]);
 * if (!(r.statistic > 0.2 && r.pValue < 0.05 && r.pBound === "none")) throw new Error("two clusters");
 * const calm = lilliefors([4.2, 3.9, 5.1, 4.8, 4.4, 3.6, 5.0, 4.1, 4.6, 4.3]);
 * if (calm.pBound !== "at-least" || calm.pValue !== 0.1) throw new Error("only p > 0.1 is known");
 * ```
 */
export function lilliefors(x: ArrayLike<number>): LillieforsResult {
  const { sorted, shape } = _edfSample(x, _WHAT, _MIN_N);
  return _lillieforsOf(_edfPass(sorted, shape), roundingWarning(sorted, false));
}

/**
 * {@linkcode lilliefors} from the EDF pass over the sorted sample (shared
 * with Anderson–Darling) and its ties warning; the size is checked here.
 */
export function _lillieforsOf(pass: _EdfPass, ties: string | undefined): LillieforsResult {
  const n = pass.n;
  checkSize(n, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const d = pass.ksDistance;
  const pDw = _dallalWilkinson(d, n);
  const calibrated = pDw <= _P_CALIBRATED;
  const warnings: string[] = [];
  if (ties !== undefined) warnings.push(ties);
  if (!calibrated) {
    warnings.push(
      `p > 0.1: the Dallal–Wilkinson approximation is calibrated only for p ≤ 0.1, so ` +
        `p is reported as 0.1, a lower bound; use Anderson–Darling or Shapiro–Wilk for a full p`,
    );
  }
  return freezeResult({
    test: "Lilliefors",
    statisticName: "D",
    statistic: d,
    pValue: calibrated ? pDw : _P_CALIBRATED,
    n,
    method: "Kolmogorov–Smirnov D with estimated mean and sd; p by Dallal & Wilkinson (1986), " +
      "reported as a lower bound of 0.1 beyond its calibrated range",
    warnings,
    pBound: calibrated ? "none" : "at-least",
  });
}
