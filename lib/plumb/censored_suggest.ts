/**
 * The re-expression a survey row suggests for a column with censored values:
 * the ladder power nearest the censored maximum-likelihood λ.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { censoredBoxCoxFit, censoredYeoJohnsonFit } from "../reexpress/censored_lambda_fit.ts";
import { nearestLadderPower } from "../reexpress/ladder.ts";
import { reexpression } from "../reexpress/reexpression.ts";
import { formatCompact } from "../results/format.ts";
import { censoredSample } from "../stats/censored_sample.ts";
import { stepOf } from "./steps.ts";

/**
 * Suggest a re-expression for a censored sample: Box–Cox λ by censored
 * maximum likelihood when every value and limit is positive (Yeo–Johnson
 * otherwise), then Tukey's ladder power nearest λ̂ inside its 95% interval
 * (`nearestLadderPower`), written as a formula in `x`; `"none better than
 * x"` when that power is 1, the rounded λ̂ when no ladder power is inside.
 *
 * @param values the values, with each censored value's limit
 * @param censor the side of each value (0 measured, −1 below, 1 above its limit)
 * @example
 * ```ts
 * import { normalQuantile } from "@plumbline/plumbline";
 * import { suggestCensoredReexpression } from "./censored_suggest.ts";
 * // lognormal normal-score sample, the lowest values reported as "<0.3"
 * const x = Float64Array.from({ length: 40 }, (_, i) => Math.exp(normalQuantile((i + 0.5) / 40)));
 * const c = Int8Array.from(x, (v) => (v < 0.3 ? -1 : 0));
 * x.forEach((_, i) => { if (c[i]) x[i] = 0.3; });
 * const s = suggestCensoredReexpression(x, c);
 * if (s !== "ln(x)") throw new Error(s);
 * ```
 */
export function suggestCensoredReexpression(values: Float64Array, censor: Int8Array): string {
  const sample = censoredSample(values, censor, { what: "a re-expression suggestion" });
  const positive = values.every((v) => v > 0);
  let fit;
  try {
    fit = positive ? censoredBoxCoxFit(sample) : censoredYeoJohnsonFit(sample);
  } catch (e) {
    if (e instanceof PlumbError && e.code === "no-convergence") return "none found (λ not located)";
    throw e;
  }
  const ladder = nearestLadderPower(fit);
  if (ladder === 1) return "none better than x";
  const family = positive ? "box-cox" : "yeo-johnson";
  const lambda = ladder ?? +formatCompact(fit.lambda, 2).replace("\u2212", "-");
  const r = !positive
    ? reexpression(family, { lambda })
    : lambda === 0
    ? reexpression("log")
    : lambda === 0.5
    ? reexpression("square-root")
    : lambda === -1
    ? reexpression("reciprocal")
    : reexpression(family, { lambda });
  return stepOf(r).formula;
}
