/**
 * The Box–Cox power transformation and its inverse.
 *
 * @module
 */
import { finiteCopy } from "../stats/_input.ts";
import { _inversePowerTerm, _powerTerm, _requireLambda, _requirePositive } from "./_checks.ts";

/**
 * Box–Cox transform: `(x^λ − 1)/λ` for λ ≠ 0 and `ln x` for λ = 0
 * (Box, G. E. P. & Cox, D. R. (1964), "An analysis of transformations",
 * JRSS B 26:211–252, eq. 1).
 *
 * Computed as `expm1(λ·ln x)/λ` (by its Taylor series when |λ·ln x| < 1e-5), which keeps full relative accuracy as λ → 0
 * (where the two-term form cancels) and is continuous in λ at 0.
 *
 * @param x positive, finite values; zeros or negatives throw
 *   `PlumbError("non-positive")`, non-finite values `PlumbError("non-finite")`
 * @param lambda the power λ, finite
 * @example
 * ```ts
 * import { boxCox } from "@plumbline/plumbline";
 * const y = boxCox([1, 4, 9], 0.5);
 * if (Math.abs(y[2] - 4) > 1e-15) throw new Error("unexpected");
 * ```
 */
export function boxCox(x: ArrayLike<number>, lambda: number): Float64Array {
  const what = "the Box–Cox transformation";
  _requireLambda(lambda, what);
  const v = finiteCopy(x, what);
  _requirePositive(v, what);
  for (let i = 0; i < v.length; i++) v[i] = _powerTerm(Math.log(v[i]), lambda);
  return v;
}

/**
 * Inverse Box–Cox transform: `(1 + λy)^(1/λ)` for λ ≠ 0 and `exp y` for λ = 0,
 * computed as `exp(log1p(λy)/λ)` (series for |λy| < 1e-5).
 *
 * Values outside the transform's range (`1 + λy < 0`) have no preimage and
 * give NaN; `1 + λy = 0` gives 0 when λ > 0 and +∞ when λ < 0.
 *
 * @param y transformed values
 * @param lambda the power λ used in {@linkcode boxCox}
 * @example
 * ```ts
 * import { boxCoxInverse } from "@plumbline/plumbline";
 * const x = boxCoxInverse([4], 0.5);
 * if (Math.abs(x[0] - 9) > 1e-13) throw new Error("unexpected");
 * ```
 */
export function boxCoxInverse(y: ArrayLike<number>, lambda: number): Float64Array {
  const what = "the inverse Box–Cox transformation";
  _requireLambda(lambda, what);
  const v = finiteCopy(y, what);
  for (let i = 0; i < v.length; i++) v[i] = Math.exp(_inversePowerTerm(v[i], lambda));
  return v;
}
