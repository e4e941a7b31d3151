/**
 * Jarque–Bera test: skewness and kurtosis against their normal values,
 * judged with the large-sample χ²(2) distribution.
 *
 * @module
 */
import { checkSize, finiteCopy } from "./_input.ts";
import { _sampleShape, type _Shape } from "./moments.ts";
import { freezeResult, type TestResult } from "./result.ts";

const _WHAT = "the Jarque–Bera test";
/** Smallest n: the same floor as the K² test, which uses the same moments. */
const _MIN_N = 8;
/** Below this n the χ²(2) p-value is flagged (common practice; see the doc comment). */
const _ASYMPTOTIC_N = 2000;

/**
 * Jarque–Bera test of normality (Jarque & Bera 1980, "Efficient tests for
 * normality, homoscedasticity and serial independence of regression
 * residuals", Economics Letters 6:255–259): JB = n/6·(g1² + g2²/4) with the
 * moment skewness g1 and excess kurtosis g2. p is the χ²(2) upper tail,
 * exactly exp(−JB/2).
 *
 * That χ²(2) law holds only as n → ∞ and is approached slowly: Jarque &
 * Bera (1987, International Statistical Review 55:163–172) give simulated
 * finite-sample critical values for this reason (from memory). Below 2000
 * values a warning says so; the threshold is common practice, not a
 * published rule. For small samples prefer Shapiro–Wilk or K².
 *
 * Range: n ≥ 8 (the floor plumbline uses for the moment tests). No upper
 * limit and no sort. Checked against scipy 1.10 `jarque_bera` to 1e−9
 * (tests/stats/jarque_bera_test.ts).
 *
 * @param x the sample: finite numbers, at least 8, not all equal
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { jarqueBera } from "@plumbline/plumbline";
 * const r = jarqueBera([1, 2, 2, 3, 3, 3, 4, 4, 5, 9]);
 * if (Math.abs(r.pValue - Math.exp(-r.statistic / 2)) > 1e-15) throw new Error("χ²(2) tail");
 * if (r.warnings.length !== 1) throw new Error("small-n warning expected");
 * ```
 */
export function jarqueBera(x: ArrayLike<number>): TestResult {
  checkSize(x.length, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const s = finiteCopy(x, _WHAT);
  return _jarqueBeraOf(s.length, _sampleShape(s, _WHAT));
}

/**
 * {@linkcode jarqueBera} from the {@linkcode _sampleShape} of a finite,
 * non-constant sample of `n` values (the size is checked here).
 */
export function _jarqueBeraOf(n: number, shape: _Shape): TestResult {
  checkSize(n, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const { g1, g2 } = shape;
  const jb = (n / 6) * (g1 * g1 + (g2 * g2) / 4);
  const warnings: string[] = [];
  if (n < _ASYMPTOTIC_N) {
    warnings.push(
      `With ${n} values the χ²(2) p-value of Jarque–Bera is only a rough guide (the ` +
        `approximation needs thousands of values); rely on Shapiro–Wilk or K² instead`,
    );
  }
  return freezeResult({
    test: "Jarque–Bera",
    statisticName: "JB",
    statistic: jb,
    pValue: Math.exp(-jb / 2),
    n,
    method: "JB = n/6·(g1² + g2²/4); p from the asymptotic χ²(2), exp(−JB/2)",
    warnings,
  });
}
