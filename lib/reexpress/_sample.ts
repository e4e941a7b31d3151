/**
 * Sample checks for the λ fits and profiles. Private to `lib/reexpress`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { checkSize, finiteCopy } from "../stats/_input.ts";
import { _requirePositive } from "./_checks.ts";

/** Finite, at least 3 values, not all equal, and (for Box–Cox) positive. */
export function _lambdaSample(
  x: ArrayLike<number>,
  what: string,
  positive: boolean,
): Float64Array {
  checkSize(x.length, 3, Number.POSITIVE_INFINITY, what);
  const v = finiteCopy(x, what);
  if (positive) _requirePositive(v, what);
  let min = Infinity;
  let max = -Infinity;
  for (const t of v) {
    if (t < min) min = t;
    if (t > max) max = t;
  }
  if (min === max) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what} on ${v.length} identical values (all ${min}): ` +
        `no power changes the shape of a sample with no spread; check the column or its units`,
      { value: min },
    );
  }
  return v;
}

/** Validate a λ grid: finite numbers. */
export function _lambdaGrid(lambdas: ArrayLike<number>, what: string): Float64Array {
  const out = new Float64Array(lambdas.length);
  for (let i = 0; i < lambdas.length; i++) {
    const t = lambdas[i];
    if (typeof t !== "number" || !Number.isFinite(t)) {
      throw new PlumbError(
        "bad-option",
        `Cannot evaluate ${what} at λ = ${t} (position ${i}): every λ must be a finite number`,
        { position: i, lambda: t },
      );
    }
    out[i] = t;
  }
  return out;
}
