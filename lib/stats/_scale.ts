/**
 * Exact rescaling by powers of two, so that sums and squares of samples near
 * ±1.8e308 or among subnormals neither overflow nor lose their last bits.
 * Private to `lib/stats` and `lib/reexpress`.
 *
 * @module
 */

/**
 * The exponent e for which `max·2^e` lies in [0.5, 1) (0 for max = 0 or a
 * non-finite max).
 *
 * @param maxAbs the largest |value|
 */
export function _scaleExponent(maxAbs: number): number {
  if (!(maxAbs > 0 && Number.isFinite(maxAbs))) return 0;
  let e = -Math.floor(Math.log2(maxAbs)) - 1;
  // Math.log2 can be off by one near powers of two and among subnormals: correct it.
  while (_ldexp(maxAbs, e) >= 1) e--;
  while (_ldexp(maxAbs, e) < 0.5) e++;
  return e;
}

/**
 * `x·2^e`, exact whenever the result is a normal double, for any e in
 * [−2200, 2200] (the power is applied in two halves, each finite).
 */
export function _ldexp(x: number, e: number): number {
  const half = Math.trunc(e / 2);
  return x * 2 ** half * 2 ** (e - half);
}

/** The largest |value| of a sample. */
export function _maxAbs(x: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) {
    const a = Math.abs(x[i]);
    if (a > m) m = a;
  }
  return m;
}
