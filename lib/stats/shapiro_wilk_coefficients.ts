/**
 * The Shapiro–Wilk coefficients a₁…aₙ by Royston's approximation, computed
 * once per sample size and cached.
 *
 * Method (Royston 1992, "Approximating the Shapiro–Wilk W-test for
 * non-normality", Statistics and Computing 2:117–119; as arranged in
 * Royston 1995, Applied Statistics 44:547–551, Algorithm AS R94):
 *
 * - m_i = Φ⁻¹((i − 3/8)/(n + 1/4)), the Blom approximation to the expected
 *   normal order statistics, and c = m/‖m‖;
 * - with u = 1/√n, the largest coefficient is
 *   aₙ = cₙ + 0.221157u − 0.147981u² − 2.071190u³ + 4.434685u⁴ − 2.706056u⁵,
 *   and for n > 5 the next one is
 *   aₙ₋₁ = cₙ₋₁ + 0.042981u − 0.293762u² − 1.752461u³ + 5.682633u⁴ − 3.582633u⁵;
 * - the remaining coefficients are m_i/√φ, with φ chosen so that Σa² = 1;
 * - for n = 3 the coefficients are exact: a = (−1/√2, 0, 1/√2).
 *
 * The coefficients are antisymmetric (a_i = −a_{n+1−i}); only the upper half
 * is stored. Accuracy: that of the published approximation (Royston reports
 * agreement with the exact coefficients to about 3 decimal places for
 * moderate n); the arithmetic itself is exact to a few ulps.
 *
 * @module
 */
import { blomScoresUpper } from "./plotting_positions.ts";

/** Royston (1992) polynomial for aₙ, in u = 1/√n (constant term excluded). */
const _C1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
/** Royston (1992) polynomial for aₙ₋₁, in u = 1/√n (constant term excluded). */
const _C2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];

/** How many sample sizes the cache keeps (oldest evicted first). */
const _CACHE_LIMIT = 64;
const _cache = new Map<number, Float64Array>();

function _poly(c: readonly number[], x: number): number {
  let r = 0;
  for (let i = c.length - 1; i >= 0; i--) r = r * x + c[i];
  return r;
}

/**
 * The upper half of the Shapiro–Wilk coefficients for a sample of size n:
 * element k is the coefficient of the (k+1)-th largest value, positive and
 * decreasing; the coefficient of the (k+1)-th smallest is its negative.
 * Length ⌊n/2⌋. The returned array is shared and frozen by convention: do
 * not modify it.
 *
 * @param n sample size, 3 ≤ n (the caller checks the upper limit)
 *
 * @example
 * ```ts
 * import { shapiroWilkCoefficients } from "./shapiro_wilk_coefficients.ts";
 * const a = shapiroWilkCoefficients(3);
 * if (Math.abs(a[0] - Math.SQRT1_2) > 1e-16) throw new Error("n = 3 is exact");
 * ```
 */
export function shapiroWilkCoefficients(n: number): Float64Array {
  const hit = _cache.get(n);
  if (hit) return hit;
  const half = Math.floor(n / 2);
  const a = new Float64Array(half);
  if (n === 3) {
    a[0] = Math.SQRT1_2;
  } else {
    // m[k] for k = 0 … half−1 is the (k+1)-th largest expected order statistic (positive).
    const m = blomScoresUpper(n);
    let summ2 = 0;
    for (let k = 0; k < half; k++) summ2 += m[k] * m[k];
    summ2 *= 2;
    const ssumm2 = Math.sqrt(summ2);
    const u = 1 / Math.sqrt(n);
    const an = m[0] / ssumm2 + _poly(_C1, u);
    let first: number;
    let phi: number;
    if (n > 5) {
      const an1 = m[1] / ssumm2 + _poly(_C2, u);
      phi = (summ2 - 2 * m[0] * m[0] - 2 * m[1] * m[1]) /
        (1 - 2 * an * an - 2 * an1 * an1);
      a[0] = an;
      a[1] = an1;
      first = 2;
    } else {
      phi = (summ2 - 2 * m[0] * m[0]) / (1 - 2 * an * an);
      a[0] = an;
      first = 1;
    }
    const rootPhi = Math.sqrt(phi);
    for (let k = first; k < half; k++) a[k] = m[k] / rootPhi;
  }
  if (_cache.size >= _CACHE_LIMIT) {
    const oldest = _cache.keys().next().value;
    if (oldest !== undefined) _cache.delete(oldest);
  }
  _cache.set(n, a);
  return a;
}
