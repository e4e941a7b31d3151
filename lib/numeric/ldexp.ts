/**
 * Exact scaling by powers of two, for sums of squares and higher powers that
 * must neither overflow (values near ±1.8e308) nor underflow (subnormal
 * values): scale the sample so that its largest magnitude is near 1, compute,
 * and scale the results back. Multiplying by a power of two is exact whenever
 * the result is a normal number, so nothing is lost on the way.
 *
 * @module
 */

/** Below 2⁻²⁰⁰ or above 2²⁰⁰ a largest magnitude is rescaled: x⁴ then stays representable. */
const _RESCALE_BELOW = 2 ** -200;
const _RESCALE_ABOVE = 2 ** 200;

/**
 * v · 2ᵏ, in two steps so that neither factor overflows for |k| up to about
 * 2000; exact whenever the result and the middle step are normal numbers
 * (the C library's `ldexp`).
 *
 * @param v the value
 * @param k the power of two
 * @example
 * ```ts
 * import { ldexp } from "./ldexp.ts";
 * // 0.75·2¹⁰²⁴ is finite although 2¹⁰²⁴ alone is not
 * if (ldexp(0.75, 1024) !== 0.75 * 2 ** 1000 * 2 ** 24) throw new Error("ldexp");
 * ```
 */
export function ldexp(v: number, k: number): number {
  const h = Math.trunc(k / 2);
  return v * 2 ** h * 2 ** (k - h);
}

/**
 * The power k to scale a sample by, given its largest magnitude: 0 when the
 * magnitude lies in [2⁻²⁰⁰, 2²⁰⁰] (nothing to do), otherwise the k that brings
 * it into [½, 1).
 *
 * @param largest the sample's largest magnitude, finite and > 0
 * @example
 * ```ts
 * import { rescaleExponent } from "./ldexp.ts";
 * if (rescaleExponent(5) !== 0 || rescaleExponent(2 ** 300) !== -300) throw new Error("k");
 * ```
 */
export function rescaleExponent(largest: number): number {
  if (largest > _RESCALE_ABOVE || largest < _RESCALE_BELOW) return -Math.floor(Math.log2(largest));
  return 0;
}
