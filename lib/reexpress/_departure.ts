/**
 * How far a sample is from normal, on a scale comparable across
 * re-expressions and sample sizes. Private to `lib/reexpress`.
 *
 * @module
 */
import { sortFloat64 } from "../numeric/sort.ts";
import { normalScores } from "../stats/plotting_positions.ts";
import { shapiroFranciaNull } from "../stats/shapiro_francia.ts";

/**
 * 1 − r², r the correlation between the ordered sample and Blom's normal
 * scores Φ⁻¹((i − 3/8)/(n + 1/4)): the complement of the Shapiro–Francia
 * statistic W′ (Shapiro & Francia 1972, JASA 67:215–216), computed for any
 * n ≥ 3 (the test's p-value is calibrated only for 5 ≤ n ≤ 5000, the
 * statistic itself is not). 0 for data exactly on a QQ line; NaN for a
 * constant sample. Invariant to x → a + b·x with b > 0 (and b < 0).
 *
 * @param x the values, any order (not modified)
 * @param scores Blom scores for n = x.length, when the caller has them
 */
export function _departure(x: ArrayLike<number>, scores?: Float64Array): number {
  return _departureSorted(sortFloat64(Float64Array.from(x)), scores);
}

/**
 * {@linkcode _departure} of a sample already sorted ascending (not
 * modified): the same value, without a copy or a sort.
 *
 * @param s the values, ascending
 * @param scores Blom scores for n = s.length, when the caller has them
 */
export function _departureSorted(s: Float64Array, scores?: Float64Array): number {
  const n = s.length;
  const m = scores ?? normalScores(n);
  // 1 − r² does not change under x → 2ᵏ·x: rescale so that the largest
  // magnitude is near 1, so that neither the sums nor the squares overflow or
  // underflow for values near ±1e308 or subnormal ones.
  let a = 1;
  let b = 1;
  const big = Math.max(Math.abs(s[0]), Math.abs(s[n - 1]));
  if (big > 0 && Number.isFinite(big)) {
    const k = -Math.floor(Math.log2(big));
    a = 2 ** Math.trunc(k / 2);
    b = 2 ** (k - Math.trunc(k / 2));
  }
  let mean = 0;
  for (let i = 0; i < n; i++) mean += s[i] * a * b;
  mean /= n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const d = s[i] * a * b - mean;
    sxy += d * m[i]; // the scores sum to zero, so they need no centring
    sxx += d * d;
    syy += m[i] * m[i];
  }
  if (!(sxx > 0)) return NaN;
  const r2 = (sxy * sxy) / (sxx * syy);
  return Math.max(0, 1 - r2);
}

/**
 * The median of 1 − W′ for normal samples of size n: e^μ(n), μ(n) the mean of
 * Royston's (1993) normalising approximation for ln(1 − W′)
 * ({@linkcode shapiroFranciaNull}; coefficients from memory, and checked by a
 * seeded simulation in tests/reexpress/search_test.ts). Royston
 * fits 5 ≤ n ≤ 5000; below 5 the value at 5 is used, above 5000 the formula is
 * extrapolated (it keeps the 1/n-type decay seen in simulation).
 */
export function _nullDepartureMedian(n: number): number {
  return Math.exp(shapiroFranciaNull(Math.max(n, 5)).mean);
}
