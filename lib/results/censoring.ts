/**
 * What an analysis did with values reported only as below or above a limit
 * ("<0.05", ">1000"): how many, at which limits, and the estimates that take
 * them into account. Plain data, part of an {@linkcode Analysis} whenever a
 * value is censored.
 *
 * @module
 */
import { formatCompact } from "./format.ts";

/** One censoring limit on one side, and how many values sit there. */
export interface CensoringLimit {
  /** The limit, in the units analysed (re-expressed with the values). */
  readonly limit: number;
  /** `"below"` for "<limit" (left-censored), `"above"` for ">limit" (right-censored). */
  readonly side: "below" | "above";
  /** How many values are censored at this limit on this side. */
  readonly count: number;
}

/** Estimates by regression on order statistics, the alternative to maximum likelihood. */
export interface CensoringRos {
  /** Mean of the measured and imputed values together. */
  readonly mean: number;
  /** Standard deviation (divisor n − 1) of the measured and imputed values. */
  readonly sd: number;
  /** The method, with its source. */
  readonly method: string;
}

/** The censoring of a sample and the estimates that account for it. */
export interface Censoring {
  /** Values reported below a limit (left-censored). */
  readonly left: number;
  /** Values reported above a limit (right-censored). */
  readonly right: number;
  /** Values measured (not censored). */
  readonly observed: number;
  /** The censored share of all values, (left + right)/n. */
  readonly fraction: number;
  /** Maximum-likelihood mean under censoring. */
  readonly mean: number;
  /** Maximum-likelihood standard deviation under censoring. */
  readonly sd: number;
  /** Standard error of the ML mean (observed information). */
  readonly seMean: number;
  /** Standard error of the ML standard deviation. */
  readonly seSd: number;
  /** Whether the ML fit converged. */
  readonly converged: boolean;
  /** Every distinct limit, those below first, each side ascending. */
  readonly limits: readonly CensoringLimit[];
  /** How the mean and sd were estimated, with the source. */
  readonly method: string;
  /** The regression-on-order-statistics estimates, for comparison. */
  readonly ros: CensoringRos;
  /** How the displays and the other summaries treat the censored values, in words. */
  readonly handling: string;
  /** Cautions about the censoring (a large censored share, a fit that did not converge). */
  readonly warnings: readonly string[];
}

/**
 * The censoring in a few words: `"12 of 60 values below a limit (<0.05 ×12)"`.
 *
 * @param c the censoring record of an analysis
 * @param n all values
 * @example
 * ```ts
 * import { censoringWords } from "@plumbline/plumbline";
 * const c = { left: 2, right: 0, limits: [{ limit: 0.05, side: "below", count: 2 }] } as const;
 * const w = censoringWords(c, 10);
 * if (w !== "2 of the 10 values censored, reported below a limit (<0.05 ×2)") throw new Error(w);
 * ```
 */
export function censoringWords(
  c: Pick<Censoring, "left" | "right" | "limits">,
  n: number,
): string {
  const k = c.left + c.right;
  const side = c.right === 0
    ? "reported below a limit"
    : c.left === 0
    ? "reported above a limit"
    : `${c.left} below a limit and ${c.right} above one`;
  const shown = c.limits.slice(0, 4).map((l) =>
    `${l.side === "below" ? "<" : ">"}${formatCompact(l.limit)} ×${l.count}`
  );
  const more = c.limits.length > 4 ? ` and ${c.limits.length - 4} more limits` : "";
  return `${k} of the ${n} values censored, ${side} (${shown.join(", ")}${more})`;
}
