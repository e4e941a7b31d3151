/**
 * The two power-series kernels of the profile likelihood, written out
 * because the profile calls them once per value per pass: eᵗ − 1, and
 * φ(t) = (t·eᵗ − expm1 t)/t², the derivative kernel (see `_profile.ts`).
 * Private to `lib/reexpress`.
 *
 * @module
 */

/** Taylor coefficients of φ(t) = Σ (j+1)/(j+2)! tʲ, j = 0…10 (|t| < 0.1: remainder < 3e-18). */
const _PHI: Float64Array = (() => {
  const c = new Float64Array(11);
  let fact = 2; // (j + 2)!
  for (let j = 0; j < c.length; j++) {
    c[j] = (j + 1) / fact;
    fact *= j + 3;
  }
  return c;
})();

/** 1/k! for k = 2…13, the Taylor coefficients of expm1 after the linear term. */
const _EXP: Float64Array = (() => {
  const c = new Float64Array(12);
  let f = 1;
  for (let k = 2; k <= 13; k++) {
    f *= k;
    c[k - 2] = 1 / f;
  }
  return c;
})();

/**
 * eᵗ − 1 with relative error below 1e-15: its Taylor series to t¹³ for
 * |t| < 0.25 (truncation below 1e-17 relative), and `Math.exp(t) − 1` beyond,
 * where the subtraction loses at most eᵗ/|eᵗ − 1|·ε ≤ 1e-15. Written out
 * because `Math.expm1` is several times slower than this on small arguments
 * in V8, and the profile calls it once per value per pass.
 */
export function _expm1(t: number): number {
  if (t < 0.25 && t > -0.25) {
    const c = _EXP;
    return t * (1 + t * (c[0] + t * (c[1] + t * (c[2] + t * (c[3] + t * (c[4] + t * (c[5] +
                              t *
                                (c[6] +
                                  t *
                                    (c[7] +
                                      t * (c[8] + t * (c[9] + t * (c[10] + t * c[11]))))))))))));
  }
  return Math.exp(t) - 1;
}

/** φ(t) = (t·eᵗ − expm1 t)/t², with φ(0) = 1/2; `u` is expm1(t). */
export function _phi(t: number, u: number): number {
  if (t < 0.1 && t > -0.1) {
    const c = _PHI;
    return c[0] + t * (c[1] + t * (c[2] + t * (c[3] + t * (c[4] + t * (c[5] + t * (c[6] +
                              t * (c[7] + t * (c[8] + t * (c[9] + t * c[10])))))))));
  }
  return (t * (u + 1) - u) / (t * t);
}
