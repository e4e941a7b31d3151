/**
 * One group's values on the chain's scale, with their censoring sides, and
 * the group's centre for the pooled within-group residuals.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { censorSidesAfter } from "../reexpress/censored_reexpress.ts";
import { censoredNormalFit } from "../stats/censored_fit.ts";
import { censoredSample } from "../stats/censored_sample.ts";
import { _meanSd } from "../stats/moments.ts";
import type { Step } from "./steps.ts";

/** The values after the chain's steps, the limits with them (1/x swapping the sides). */
export function stepGroup(
  values: Float64Array,
  censor: Int8Array | null,
  steps: readonly Step[],
  apply: (s: Step, x: Float64Array) => Float64Array = (s, x) => s.apply(x),
): { values: Float64Array; censor: Int8Array | null } {
  let v = values;
  let c = censor;
  for (const s of steps) {
    const next = apply(s, v);
    if (c) c = censorSidesAfter(s.reexpression, v, c);
    v = next;
  }
  return { values: v, censor: c };
}

/**
 * A group's centre for the pooled residuals: the mean, or with censored
 * values the maximum-likelihood mean under censoring (a residual keeps its
 * value's side, its limit shifted by the same centre). `null` when the group
 * has too few values for a centre (fewer than 2, or fewer than 3 measured
 * with censoring): its values then stay out of the pooled residuals.
 */
export function groupCentre(v: Float64Array, c: Int8Array | null): number | null {
  if (v.length < 2) return null;
  if (c === null) return _meanSd(v).mean;
  try {
    return censoredNormalFit(censoredSample(v, c)).mean;
  } catch (e) {
    if (e instanceof PlumbError && (e.code === "too-few" || e.code === "constant")) return null;
    throw e;
  }
}
