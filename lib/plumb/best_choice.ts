/**
 * Whether to re-express at all, and with what: the decision behind
 * `.reexpress("best")` and the survey's suggestion. The ranked search picks
 * the candidate that departs least (`reexpress/search.ts`); this module
 * decides whether that candidate is a remedy, and says plainly when it is not.
 *
 * Rules, in order:
 * 1. no clear departure: nothing to fix, the data stay as measured;
 * 2. a departure a power cannot remove (a pile-up at a limit, a separate
 *    cluster, a few outliers, symmetric tails, two mixed groups, coarse
 *    rounding): the data stay as measured, and the note says what to do
 *    instead;
 * 3. the search's choice is the data as measured: they stay;
 * 4. the choice is tested as a chain would test it; if it still departs
 *    clearly (its own verdict, by the same rule), no candidate is adequate
 *    and the data stay as measured, with the choice's W and p in the note;
 * 5. otherwise the choice is applied.
 *
 * @module
 */
import type { ReexpressionRanking } from "../reexpress/candidates.ts";
import { applyReexpression } from "../reexpress/reexpression.ts";
import { formatNumber, formatPClause } from "../results/format.ts";
import type { Reading } from "../results/reading.ts";
import { analyse, ANALYSE_MIN_N } from "./analysis.ts";
import { type Step, stepOf } from "./steps.ts";

/** The decision, as frozen plain data. */
export interface BestChoice {
  /** The step to apply, or `undefined` to keep the data as they are. */
  readonly step: Step | undefined;
  /** Why, in plain words (one sentence, no trailing period). */
  readonly note: string;
}

/** What to do instead of a re-expression, by cause. */
const _INSTEAD: Readonly<Record<string, string>> = Object.freeze({
  "pile-up": "a pile-up at a limit stays a pile-up under any power; use methods for censored data",
  cluster: "a separate group stays separate under any power; find out how those records differ",
  outliers: "a power would bend every value to accommodate a few; check those records first",
  tails: "a power straightens skew, not symmetric tails; consider methods that do not assume " +
    "normality",
  "two-peaks": "a power does not merge two groups; look for the variable that separates them",
  none: "",
});

/**
 * Decide whether, and how, to re-express a sample.
 *
 * @param values the sample as the chain holds it
 * @param reading the sample's reading
 * @param search the ranked candidates (`rankReexpressions(values)`, or a full search)
 *
 * @example
 * ```ts
 * import { analyse } from "./analysis.ts";
 * import { chooseBestStep } from "./best_choice.ts";
 * import { searchReexpressions } from "../reexpress/search.ts";
 * import { normalQuantile } from "@plumbline/plumbline";
 * // lognormal: normal scores, exponentiated
 * const x = Float64Array.from({ length: 200 }, (_, i) => Math.exp(0.6 * normalQuantile((i + 0.5) / 200)));
 * const a = analyse(x, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
 * const c = chooseBestStep(x, a.reading, searchReexpressions(x));
 * if (c.step?.formula !== "ln(x)") throw new Error(c.note);
 * ```
 */
export function chooseBestStep(
  values: Float64Array,
  reading: Reading,
  search: ReexpressionRanking,
): BestChoice {
  const keep = (note: string): BestChoice => Object.freeze({ step: undefined, note });
  if (reading.verdict === "no-clear-departure") {
    return keep("No re-expression needed: no clear departure from normal");
  }
  const f = reading.facts;
  if (!f.reexpressionHelps) {
    const instead = _INSTEAD[f.cause] ?? "";
    return keep(
      `No re-expression applied: the departure comes from ${reading.reason}` +
        (instead ? `, and ${instead}` : ""),
    );
  }
  const chosen = search.chosen.reexpression;
  if (chosen.kind === "identity") {
    return keep(
      "No re-expression applied: the data as measured are as close to normal as any candidate",
    );
  }
  const y = applyReexpression(values, chosen);
  if (y.length >= ANALYSE_MIN_N) {
    const after = analyse(y, {
      label: chosen.label,
      column: "x",
      missingDropped: 0,
      textDropped: 0,
    });
    if (after.reading.verdict === "clear-departure") {
      return keep(
        `No candidate is adequate: the best, ${chosen.label}, still departs clearly from normal ` +
          `(W = ${formatNumber(after.primary.statistic, 4)}, ${
            formatPClause(after.primary.pValue)
          }, ` +
          `from ${after.reading.reason}); the data are kept as they are`,
      );
    }
  }
  return Object.freeze({ step: stepOf(chosen, search.reason), note: search.reason });
}
