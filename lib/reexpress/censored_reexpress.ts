/**
 * Re-expressing a censored sample: the limits are transformed with the
 * values, and a transformation that reverses order turns "<limit" into
 * ">limit".
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { type CensoredSample, censoredSample } from "../stats/censored_sample.ts";
import { applyReexpression, type Reexpression } from "./reexpression.ts";

/**
 * Apply a re-expression to a censored sample. Every measured value and every
 * limit goes through the same transformation (a value below 0.05 is below
 * ln 0.05 on the log scale). The log, square-root, Box–Cox and Yeo–Johnson
 * re-expressions increase, so the sides stay; the reciprocal 1/x reverses the
 * order of values of one sign, so "<c" becomes ">1/c" and the reverse.
 *
 * Errors: the transformation's own domain errors (`"non-positive"`,
 * `"zero"`), `PlumbError("non-positive")` for 1/x on censored data of both
 * signs (not monotone there, so the sides would be lost), and the sample
 * checks of `censoredSample` on the result (`"constant"`, `"non-finite"` when
 * a value overflows).
 *
 * @param sample a checked sample, in original units
 * @param r the re-expression
 * @example
 * ```ts
 * import { censoredSample } from "../stats/censored_sample.ts";
 * import { censoredReexpress } from "./censored_reexpress.ts";
 * import { reexpression } from "./reexpression.ts";
 * const s = censoredSample([0.05, 0.2, 0.4, 0.9], [-1, 0, 0, 0]);
 * const r = censoredReexpress(s, reexpression("reciprocal"));
 * if (r.censor[0] !== 1 || r.values[0] !== 20) throw new Error("1/x flips the side");
 * ```
 */
export function censoredReexpress(sample: CensoredSample, r: Reexpression): CensoredSample {
  const y = applyReexpression(sample.values, r);
  const censor = censorSidesAfter(r, sample.values, sample.censor);
  return censoredSample(y, censor, { what: `${r.label} on a censored sample` });
}

/**
 * The censoring sides after a re-expression: the same array for an
 * increasing transformation, the sides swapped for 1/x (which reverses the
 * order of values of one sign).
 *
 * Errors: `PlumbError("non-positive")` for 1/x on censored data of both
 * signs (not monotone there, so the sides would be lost).
 *
 * @param r the re-expression
 * @param values the values (and limits) before it
 * @param censor their sides: 0 measured, −1 below the limit, 1 above it
 * @example
 * ```ts
 * import { censorSidesAfter } from "./censored_reexpress.ts";
 * import { reexpression } from "./reexpression.ts";
 * const c = censorSidesAfter(reexpression("reciprocal"), [0.05, 0.2], Int8Array.of(-1, 0));
 * if (c[0] !== 1 || c[1] !== 0) throw new Error("1/x flips the side");
 * ```
 */
export function censorSidesAfter(
  r: Reexpression,
  values: ArrayLike<number>,
  censor: Int8Array,
): Int8Array {
  if (r.kind !== "reciprocal") return censor;
  let neg = false;
  let pos = false;
  let censored = false;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < 0) neg = true;
    if (values[i] > 0) pos = true;
    if (censor[i] !== 0) censored = true;
  }
  if (neg && pos && censored) {
    throw new PlumbError(
      "non-positive",
      `Cannot apply 1/x to censored data of both signs: it does not keep or reverse the ` +
        `order across 0, so the censoring limits would lose their meaning; use Yeo–Johnson`,
    );
  }
  return censor.map((s) => -s);
}
