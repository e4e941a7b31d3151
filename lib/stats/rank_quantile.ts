/**
 * Sample quantiles at rank p(n + 1), interpolated between neighbours: the
 * definition laboratory reference-interval practice uses for its
 * non-parametric limits (CLSI EP28-A3c, 2010, "Defining, Establishing, and
 * Verifying Reference Intervals in the Clinical Laboratory", the rank
 * r = p(n + 1)), and Definition 6 of Hyndman & Fan (1996), "Sample quantiles
 * in statistical packages", The American Statistician 50:361–365 (R's
 * `quantile(type = 6)`).
 *
 * With h = p(n + 1), j = ⌊h⌋ and g = h − j, the quantile is
 * (1 − g)·x₍ⱼ₎ + g·x₍ⱼ₊₁₎, with x₍₀₎ = x₍₁₎ and x₍ₙ₊₁₎ = x₍ₙ₎: a rank below 1
 * or above n gives the sample minimum or maximum. As in R 4.2.2, j is taken
 * as ⌊h + 4ε⌋ and a g below 4ε counts as 0, so that a rank that should be a
 * whole number but rounds just below it picks the order statistic itself.
 * Checked equal to R 4.2.2 `quantile(type = 6)` (tests/fixtures/
 * stakes_distributions.json).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { checkSize, finiteCopy } from "./_input.ts";

const _FUZZ = 4 * Number.EPSILON;

/**
 * The rank h = p(n + 1) at which the p-quantile sits, and whether it lies
 * inside [1, n] (outside, the quantile is clamped to an extreme value).
 *
 * @param n sample size
 * @param p the probability, in [0, 1]
 */
export function quantileRank(n: number, p: number): { rank: number; inside: boolean } {
  const rank = p * (n + 1);
  return { rank, inside: rank >= 1 - _FUZZ && rank <= n + _FUZZ };
}

/**
 * The p-quantile of an ascending sample, by the rule in the module header.
 * No checks: the caller validates.
 *
 * @param sorted the sample in ascending order, at least one value
 * @param p the probability, in [0, 1]
 */
export function _rankQuantileSorted(sorted: Float64Array, p: number): number {
  const n = sorted.length;
  const h = p * (n + 1);
  const j = Math.floor(h + _FUZZ);
  let g = h - j;
  if (Math.abs(g) < _FUZZ) g = 0;
  if (j < 1) return sorted[0];
  if (j >= n) return sorted[n - 1];
  const a = sorted[j - 1];
  const b = sorted[j];
  return g === 0 || a === b ? a : (1 - g) * a + g * b;
}

/**
 * The p-quantile of a sample at rank p(n + 1), interpolated (R's
 * `quantile(type = 6)`).
 *
 * @param x finite values, at least one
 * @param p the probability, in [0, 1]
 * @example
 * ```ts
 * import { rankQuantile } from "./rank_quantile.ts";
 * // n = 3: the median sits at rank 0.5·4 = 2
 * if (rankQuantile([3, 1, 2], 0.5) !== 2) throw new Error("median");
 * // rank 0.25·4 = 1 exactly
 * if (rankQuantile([3, 1, 2], 0.25) !== 1) throw new Error("quartile");
 * ```
 */
export function rankQuantile(x: ArrayLike<number>, p: number): number {
  if (typeof p !== "number" || !(p >= 0 && p <= 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute a sample quantile at p = ${p}: p must lie in [0, 1], e.g. 0.025`,
      { p },
    );
  }
  const what = "a sample quantile";
  checkSize(x.length, 1, Number.POSITIVE_INFINITY, what);
  return _rankQuantileSorted(sortFloat64(finiteCopy(x, what)), p);
}
