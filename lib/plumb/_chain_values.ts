/**
 * The steps of a chain that must choose between the methods for measured
 * and for censored values: the values after a re-expression (limits with
 * them), the analysis, QQ data with options of the caller's own, and the
 * refusals of steps that need every value measured.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { censorSidesAfter } from "../reexpress/censored_reexpress.ts";
import type { Analysis, SampleOrigin } from "../results/analysis.ts";
import { censoredNormalFit } from "../stats/censored_fit.ts";
import { censoredQqData } from "../stats/censored_qq.ts";
import { censoredSample } from "../stats/censored_sample.ts";
import { type QqData, qqData, type QqOptions } from "../stats/qq_data.ts";
import type { AnalyseOptions } from "./analysis.ts";
import { analyseSides } from "./censored_analysis.ts";
import { allRowLabels, type Loaded } from "./_loaded.ts";
import type { Step } from "./steps.ts";

/** The values after one step: limits transformed with the values, 1/x swapping the sides. */
export function stepValues(
  from: Loaded,
  step: Step | null,
  apply: (s: Step, x: Float64Array) => Float64Array = (s, x) => s.apply(x),
): Loaded {
  if (step === null) return from;
  const values = apply(step, from.values);
  const censor = from.censor && censorSidesAfter(step.reexpression, from.values, from.censor);
  return { ...from, values, censor };
}

/** The analysis: by the censored methods when any value is censored. */
export function analyseValues(
  v: Loaded,
  origin: Omit<SampleOrigin, "rows" | "missingDropped" | "textDropped">,
  options: AnalyseOptions,
): Analysis {
  const full: SampleOrigin = { ...origin, missingDropped: v.missing, textDropped: v.text };
  return analyseSides(v.values, v.censor ?? null, full, { ...options, rowLabel: v.rowLabel });
}

/** QQ data with options of the caller's own: the censored form when any value is censored. */
export function qqOfValues(v: Loaded, options: QqOptions, label: string): QqData {
  const merged = { ...options, rows: allRowLabels(v) };
  if (v.censor === undefined) return qqData(v.values, merged);
  const s = censoredSample(v.values, v.censor, { what: `a QQ plot of ${label}` });
  return censoredQqData(s, censoredNormalFit(s), merged);
}

/** The measured values: all of them, or those not censored. */
export function measuredValues(v: Loaded): Float64Array {
  const { values, censor } = v;
  return censor === undefined ? values : values.filter((_, i) => censor[i] === 0);
}

/** What a step that needs measured values says when some are censored. */
export interface CensoredRefusal {
  /** What cannot be done, after "Cannot". */
  readonly what: string;
  /** Why, after "and". */
  readonly why: string;
  /** What to do instead. */
  readonly instead: string;
}

/** What each step that needs measured values says when some are censored. */
export const REFUSALS = Object.freeze(
  {
    search: {
      what: "search and rank re-expressions",
      why: "the ranking uses tests for measured values",
      instead: 'name one instead, e.g. .reexpress("log"), and the censoring is carried through',
    },
    lambda: {
      what: "draw the λ explorer",
      why: "its profile and panels use methods for measured values",
      instead: 'name a re-expression instead, e.g. .reexpress("log"); the censoring is kept',
    },
    stakes: {
      what: "compute the stakes",
      why: "its intervals and limits treat every value as measured",
      instead: "use analysis().censoring for the maximum-likelihood mean and sd",
    },
    model: {
      what: "fit a model",
      why: "least squares treats every value as measured",
      instead: "screen the column itself, or a column without censored cells",
    },
  } satisfies Record<string, CensoredRefusal>,
);

/**
 * The values for a step whose methods need measured values; when some are
 * censored, `PlumbError("censored")` saying why and what works instead.
 */
export function refuseCensored(
  v: Loaded,
  label: string,
  column: string,
  refusal: CensoredRefusal,
): Float64Array {
  if (v.censor === undefined) return v.values;
  const k = v.censor.reduce((t, s) => t + (s === 0 ? 0 : 1), 0);
  throw new PlumbError(
    "censored",
    `Cannot ${refusal.what} for ${label}: ${k} of its values are censored, and ${refusal.why}; ` +
      refusal.instead,
    { column, censored: k },
  );
}

/** The stakes by group refuse a column with censored values (see `REFUSALS.stakes`). */
export function refuseCensoredGroups(
  groups: readonly { readonly censor?: Int8Array }[],
  column: string,
  groupBy: string,
): void {
  const censored = groups.reduce((k, g) => k + (g.censor?.filter((s) => s !== 0).length ?? 0), 0);
  if (censored === 0) return;
  const { what, why, instead } = REFUSALS.stakes;
  throw new PlumbError(
    "censored",
    `Cannot ${what} for ${column} by ${groupBy}: ${censored} of its values are censored, and ` +
      `${why}; ${instead} of each group`,
    { column, censored },
  );
}
