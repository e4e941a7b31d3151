/**
 * The ladder of interpretable powers and the rung nearest a fitted λ.
 *
 * @module
 */
import type { LambdaFit } from "./lambda_fit.ts";

/**
 * Tukey's ladder of powers as Box–Cox exponents: −2 (reciprocal square),
 * −1 (reciprocal), −½ (reciprocal root), 0 (log), ½ (square root),
 * 1 (as measured), 2 (square) (Tukey, J. W. (1977), *Exploratory Data
 * Analysis*, Addison-Wesley, ch. 3).
 */
export const LADDER_POWERS: readonly number[] = Object.freeze([-2, -1, -0.5, 0, 0.5, 1, 2]);

/**
 * The ladder power nearest the fit's λ̂ among those inside its interval, or
 * `null` when none is inside. An open interval end counts as extending to
 * infinity on that side. Ties (λ̂ exactly midway) go to the power nearer 1,
 * the smaller change to the data.
 *
 * @param fit a Box–Cox or Yeo–Johnson fit
 * @example
 * ```ts
 * import { nearestLadderPower } from "./ladder.ts";
 * import { boxCoxFit } from "@plumbline/plumbline";
 * const p = nearestLadderPower(boxCoxFit([1.2, 2.9, 0.8, 5.1, 1.7, 3.3, 0.6, 9.4, 2.2, 1.4]));
 * if (p !== 0) throw new Error(`expected the log, got ${p}`);
 * ```
 */
export function nearestLadderPower(fit: LambdaFit): number | null {
  const lo = fit.ci[0] ?? -Infinity;
  const hi = fit.ci[1] ?? Infinity;
  let best: number | null = null;
  for (const p of LADDER_POWERS) {
    if (p < lo || p > hi) continue;
    if (best === null) {
      best = p;
      continue;
    }
    const d = Math.abs(p - fit.lambda) - Math.abs(best - fit.lambda);
    if (d < 0 || (d === 0 && Math.abs(p - 1) < Math.abs(best - 1))) best = p;
  }
  return best;
}
