/**
 * The Yeo–Johnson power transformation and its inverse.
 *
 * @module
 */
import { finiteCopy } from "../stats/_input.ts";
import { _inversePowerTerm, _powerTerm, _requireLambda } from "./_checks.ts";

/**
 * Yeo–Johnson transform (Yeo, I.-K. & Johnson, R. A. (2000), "A new family of
 * power transformations to improve normality or symmetry", Biometrika
 * 87:954–959, eq. 2.1): for x ≥ 0, `((x+1)^λ − 1)/λ` (λ ≠ 0) or `ln(x+1)`
 * (λ = 0); for x < 0, `−((1−x)^(2−λ) − 1)/(2−λ)` (λ ≠ 2) or `−ln(1−x)` (λ = 2).
 * Defined for every real x; λ = 1 is the identity.
 *
 * Computed as `expm1(λ·log1p(x))/λ` (and its mirror), accurate to a few ulps
 * for every λ, including near 0 and 2 (by the Taylor series of expm1(t)/t for |t| < 1e-5).
 *
 * @param x finite values of any sign
 * @param lambda the power λ, finite
 * @example
 * ```ts
 * import { yeoJohnson } from "@plumbline/plumbline";
 * const y = yeoJohnson([-3, 0, 3], 1);
 * if (y[0] !== -3 || y[1] !== 0 || Math.abs(y[2] - 3) > 1e-15) throw new Error("unexpected");
 * ```
 */
export function yeoJohnson(x: ArrayLike<number>, lambda: number): Float64Array {
  const what = "the Yeo–Johnson transformation";
  _requireLambda(lambda, what);
  const v = finiteCopy(x, what);
  const mu = 2 - lambda;
  for (let i = 0; i < v.length; i++) {
    const t = v[i];
    v[i] = t >= 0 ? _powerTerm(Math.log1p(t), lambda) : -_powerTerm(Math.log1p(-t), mu);
  }
  return v;
}

/**
 * Inverse Yeo–Johnson transform: for y ≥ 0, `expm1(log1p(λy)/λ)` (λ ≠ 0) or
 * `expm1(y)`; for y < 0, `−expm1(log1p(−(2−λ)y)/(2−λ))` (λ ≠ 2) or `−expm1(−y)`.
 *
 * Values outside the transform's range give NaN (for example y ≥ −1/λ when
 * λ < 0 has no preimage beyond +∞).
 *
 * @param y transformed values
 * @param lambda the power λ used in {@linkcode yeoJohnson}
 * @example
 * ```ts
 * import { yeoJohnson, yeoJohnsonInverse } from "@plumbline/plumbline";
 * const back = yeoJohnsonInverse(yeoJohnson([-2, 0.5], 0.3), 0.3);
 * if (Math.abs(back[0] + 2) > 1e-14 || Math.abs(back[1] - 0.5) > 1e-15) throw new Error("unexpected");
 * ```
 */
export function yeoJohnsonInverse(y: ArrayLike<number>, lambda: number): Float64Array {
  const what = "the inverse Yeo–Johnson transformation";
  _requireLambda(lambda, what);
  const v = finiteCopy(y, what);
  const mu = 2 - lambda;
  for (let i = 0; i < v.length; i++) {
    const t = v[i];
    v[i] = t >= 0
      ? Math.expm1(_inversePowerTerm(t, lambda))
      : -Math.expm1(_inversePowerTerm(-t, mu));
  }
  return v;
}
