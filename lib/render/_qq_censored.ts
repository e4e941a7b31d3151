/**
 * What the QQ plot adds for a censored sample: censored values are drawn at
 * their limits in their own colour and shape, apart from the measured
 * points' states, and the titles say how many there are and where the line
 * comes from.
 *
 * @module
 */
import type { CensoredQqData } from "../stats/censored_qq.ts";
import type { QqData } from "../stats/qq_data.ts";
import { formatCount } from "../results/format.ts";
import { PALETTE } from "./theme.ts";

/** Legend labels of censored points (constant text, no user input). */
export const CENSORED_STATES = Object.freeze(
  ["below a limit, drawn at it", "above a limit, drawn at it"] as const,
);

/** The QQ data's censoring, when it has any censored point. */
export function censoredOf(q: QqData): CensoredQqData | undefined {
  const c = q as Partial<CensoredQqData>;
  return c.censor !== undefined && c.censor.length === q.shown ? (q as CensoredQqData) : undefined;
}

/**
 * The point states, colours and shapes with the censored states added:
 * `base` is the expression naming a measured point's state from `out`.
 */
export function censoredStates(
  c: CensoredQqData,
  base: string,
  domain: readonly string[],
  colours: readonly string[],
  shapes: readonly string[],
): { expr: string; domain: string[]; colours: string[]; shapes: string[] } {
  // Only the sides present get a legend entry.
  const sides = [c.censor.includes(-1), c.censor.includes(1)];
  const pick = <T>(both: readonly T[]) => both.filter((_, k) => sides[k]);
  return {
    expr: (sides[0] ? `datum.cen < 0 ? '${CENSORED_STATES[0]}' : ` : "") +
      (sides[1] ? `datum.cen > 0 ? '${CENSORED_STATES[1]}' : ` : "") + `(${base})`,
    domain: [...domain, ...pick(CENSORED_STATES)],
    colours: [...colours, ...pick([PALETTE.muted, PALETTE.muted])],
    shapes: [...shapes, ...pick(["square", "diamond"])],
  };
}

/** The subtitle line for a censored sample. */
export function censoredSubtitle(c: CensoredQqData): string {
  const k = c.censor.filter((s) => s !== 0).length;
  return `grey: ${formatCount(k)} censored, drawn at their limits · line: ML fit`;
}

/** The description's sentence for a censored sample. */
export function censoredSentence(c: CensoredQqData): string {
  const below = c.censor.filter((s) => s < 0).length;
  const above = c.censor.filter((s) => s > 0).length;
  return ` Of the points shown, ${formatCount(below)} are values reported below a limit and ` +
    `${formatCount(above)} above one, drawn in grey at their limits (their true values lie ` +
    `beyond them) and never counted as outside the band; the line is ${c.line}.`;
}
