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
import type { Table } from "../data/table.ts";
import { _applyStep } from "./_apply_step.ts";
import type { Step } from "./steps.ts";

/**
 * A group's values after the chain's steps, the limits with them (1/x
 * swapping the sides); a step's domain error names the table rows.
 */
export function stepGroup(
  group: {
    readonly values: Float64Array;
    readonly censor?: Int8Array;
    readonly rows: ArrayLike<number>;
  },
  steps: readonly Step[],
  where: { readonly column: string; readonly table: Table },
): { values: Float64Array; censor: Int8Array | null } {
  const { column, table } = where;
  const at = {
    column,
    rowLabel: (p: number) => group.rows[p] + 1,
    lineOf: (r: number) => table.lineOf(r),
  };
  let v = group.values;
  let c = group.censor ?? null;
  for (const s of steps) {
    const next = _applyStep(s, v, at);
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
