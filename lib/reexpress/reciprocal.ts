/**
 * The reciprocal transformation, which is its own inverse.
 *
 * @module
 */
import { finiteCopy } from "../stats/_input.ts";
import { _requireNonZero } from "./_checks.ts";

/**
 * `1/x`. It reverses the order of positive data (the largest value becomes the
 * smallest); Box–Cox at λ = −1, `1 − 1/x`, is the same re-expression with the
 * order kept. On data of both signs it is not monotone, so use it on data of
 * one sign.
 *
 * @param x finite, non-zero values; a zero throws `PlumbError("zero")`
 * @example
 * ```ts
 * import { reciprocal } from "@plumbline/plumbline";
 * const y = reciprocal([2, 4]);
 * if (y[0] !== 0.5 || y[1] !== 0.25) throw new Error("unexpected");
 * ```
 */
export function reciprocal(x: ArrayLike<number>): Float64Array {
  const what = "the reciprocal transformation";
  const v = finiteCopy(x, what);
  _requireNonZero(v, what);
  for (let i = 0; i < v.length; i++) v[i] = 1 / v[i];
  return v;
}

/**
 * Inverse of {@linkcode reciprocal}, which is `1/y` again.
 *
 * @param y values on the reciprocal scale, non-zero
 * @example
 * ```ts
 * import { reciprocalInverse } from "@plumbline/plumbline";
 * if (reciprocalInverse([0.25])[0] !== 4) throw new Error("unexpected");
 * ```
 */
export function reciprocalInverse(y: ArrayLike<number>): Float64Array {
  const what = "the inverse reciprocal transformation";
  const v = finiteCopy(y, what);
  _requireNonZero(v, what);
  for (let i = 0; i < v.length; i++) v[i] = 1 / v[i];
  return v;
}
