/**
 * Logarithms of the standard normal tails and the normal hazard, accurate
 * where the tails themselves underflow. Censored-data likelihoods need
 * ln Φ(z) and φ(z)/Φ(z) for a limit many standard deviations from the mean
 * (a trial step of an optimiser easily puts it at z = −60, where Φ(z) is
 * below the smallest double).
 *
 * Method, by range (Q(z) = 1 − Φ(z), φ the density):
 * - z < 0: ln Q(z) = log1p(−Φ(z)), with Φ from {@linkcode normalCdf}
 *   (Cody 1993, ACM TOMS 19:22–32, Algorithm 715), whose relative accuracy
 *   carries over;
 * - 0 ≤ z ≤ 37: ln Q(z) = ln(normalSf(z)), the same source;
 * - z > 37: ln Q(z) = −z²/2 − ln √(2π) + ln R(z), with Mills' ratio
 *   R(z) = Q(z)/φ(z) from Laplace's continued fraction
 *   R(z) = 1/(z + 1/(z + 2/(z + 3/(z + …)))) (Abramowitz & Stegun 1964,
 *   *Handbook of Mathematical Functions*, 26.2.14), evaluated backwards from
 *   its 30th term: at z ≥ 37 the truncation error is far below 1e-16.
 *
 * The hazard h(z) = φ(z)/Q(z) is φ/Q for z ≤ 37 and 1/R(z) beyond; it tends
 * to 0 as z → −∞ and behaves like z as z → +∞ (h(z) − z → 0).
 *
 * Accuracy: against mpmath at 50 digits, ln Q and ln Φ agree to 1e-14
 * relative and h to 1e-14 relative on z ∈ [−1e4, 1e4]
 * (tests/numeric/normal_log_test.ts). NaN in gives NaN out; ln Q(−∞) = 0,
 * ln Q(+∞) = −∞, h(−∞) = 0, h(+∞) = +∞.
 *
 * @module
 */
import { normalCdf, normalPdf, normalSf } from "./normal.ts";

/** ln √(2π). */
const _LN_SQRT_2PI = 0.9189385332046728;
/** Where the continued fraction takes over from Cody's upper tail. */
const _CF_FROM = 37;
/** Terms of the continued fraction evaluated (backwards). */
const _CF_TERMS = 30;

/** 1/R(z) = φ(z)/Q(z) for finite z ≥ 37, by Laplace's continued fraction for Mills' ratio R. */
function _inverseMills(z: number): number {
  let t = z;
  for (let k = _CF_TERMS; k >= 1; k--) t = z + k / t;
  return t;
}

/**
 * ln Q(z) = ln P(Z > z) for a standard normal Z, finite for every finite z.
 *
 * @param z any number
 * @returns ln(1 − Φ(z)), in (−∞, 0]
 * @example
 * ```ts
 * import { normalLogSf } from "./normal_log.ts";
 * // ln Q(40) = −804.6084420137538 (mpmath, 50 digits); Q(40) itself underflows
 * if (Math.abs(normalLogSf(40) / -804.6084420137538 - 1) > 1e-14) throw new Error("ln Q(40)");
 * ```
 */
export function normalLogSf(z: number): number {
  if (Number.isNaN(z)) return NaN;
  if (z < 0) return Math.log1p(-normalCdf(z));
  if (z <= _CF_FROM) return Math.log(normalSf(z));
  if (z === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
  return -0.5 * z * z - _LN_SQRT_2PI - Math.log(_inverseMills(z));
}

/**
 * ln Φ(z) = ln P(Z ≤ z) for a standard normal Z: {@linkcode normalLogSf} at −z.
 *
 * @param z any number
 * @returns ln Φ(z), in (−∞, 0]
 * @example
 * ```ts
 * import { normalLogCdf } from "./normal_log.ts";
 * if (normalLogCdf(0) !== Math.log(0.5)) throw new Error("ln Φ(0)");
 * ```
 */
export function normalLogCdf(z: number): number {
  return normalLogSf(-z);
}

/**
 * The standard normal hazard h(z) = φ(z)/Q(z) (the inverse Mills ratio),
 * the derivative of −ln Q(z). For a left-censored value the matching
 * quantity φ(z)/Φ(z) is h(−z).
 *
 * @param z any number
 * @returns h(z) ≥ 0, with h(z) > z for every z
 * @example
 * ```ts
 * import { normalHazard } from "./normal_log.ts";
 * // h(0) = φ(0)/½ = √(2/π)
 * if (Math.abs(normalHazard(0) - Math.sqrt(2 / Math.PI)) > 1e-15) throw new Error("h(0)");
 * ```
 */
export function normalHazard(z: number): number {
  if (Number.isNaN(z)) return NaN;
  if (z === Number.NEGATIVE_INFINITY) return 0;
  if (z <= _CF_FROM) return normalPdf(z) / normalSf(z);
  if (z === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  return _inverseMills(z);
}
