/**
 * The square-root transformation and its inverse.
 *
 * @module
 */
import { finiteCopy } from "../stats/_input.ts";
import { _requireNonNegative, _shiftOption } from "./_checks.ts";

/** Options for {@linkcode squareRoot} and {@linkcode squareRootInverse}. */
export interface SquareRootOptions {
  /**
   * A constant added first, `√(x + shift)`.
   * @default 0
   */
  readonly shift?: number;
}

/**
 * `√(x + shift)`; defined at zero, so counts with zeros need no shift.
 *
 * @param x values with `x + shift ≥ 0`; otherwise `PlumbError("non-positive")`
 * @param options the shift
 * @example
 * ```ts
 * import { squareRoot } from "@plumbline/plumbline";
 * const y = squareRoot([0, 4, 9]);
 * if (y[0] !== 0 || y[1] !== 2 || y[2] !== 3) throw new Error("unexpected");
 * ```
 */
export function squareRoot(x: ArrayLike<number>, options: SquareRootOptions = {}): Float64Array {
  const what = "the square-root transformation";
  const shift = _shiftOption(options.shift, what);
  const v = finiteCopy(x, what);
  if (shift !== 0) { for (let i = 0; i < v.length; i++) v[i] += shift; }
  _requireNonNegative(v, what);
  for (let i = 0; i < v.length; i++) v[i] = Math.sqrt(v[i]);
  return v;
}

/**
 * Inverse of {@linkcode squareRoot}: `y² − shift` for y ≥ 0; NaN for y < 0,
 * which no value maps to.
 *
 * @param y values on the square-root scale
 * @param options the shift used in the forward transform
 * @example
 * ```ts
 * import { squareRootInverse } from "@plumbline/plumbline";
 * const x = squareRootInverse([3], { shift: 1 });
 * if (x[0] !== 8) throw new Error("unexpected");
 * ```
 */
export function squareRootInverse(
  y: ArrayLike<number>,
  options: SquareRootOptions = {},
): Float64Array {
  const what = "the inverse square-root transformation";
  const shift = _shiftOption(options.shift, what);
  const v = finiteCopy(y, what);
  for (let i = 0; i < v.length; i++) v[i] = v[i] >= 0 ? v[i] * v[i] - shift : NaN;
  return v;
}
