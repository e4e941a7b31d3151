/**
 * The rules behind the reading, in one place: every threshold the verdict
 * and the shape words use, with its source, and the verdict itself as a
 * pure function of the evidence. The words live in the reading's prose.
 *
 * The verdict rule (calibrated by `tools/sim/verdict_rates.ts`, 2,000
 * seeded samples per cell; its table is in README):
 * - evidence of a departure is any of: Shapiro–Wilk p < 0.05 (not used when
 *   the measurement step is coarse against the spread, where rounding alone
 *   makes it reject); a skewness G1 or excess kurtosis G2 that stands out
 *   from its own standard error under normality (|G| > 2.576 SE, two-sided
 *   1%; Joanes & Gill 1998, The Statistician 47:183–189, for G1, G2 and
 *   their standard errors); outliers by the generalized ESD procedure at the
 *   1% level (Rosner 1983); a separate cluster (`clusters.ts`);
 * - above 2,000 values effect sizes decide: a skewness or kurtosis counts
 *   only when it is also large enough to matter (|G1| ≥ 0.25 or |G2| ≥ 0.5,
 *   common practice), because the tests then flag departures too small to
 *   matter; outliers and clusters still count;
 * - "clear departure" needs strong evidence of a large effect: a cluster;
 *   or |G1| ≥ 0.5 or |G2| ≥ 1 standing out from its standard error, with
 *   p < 0.01 (or a coarse step, or more than 2,000 values); or outliers with
 *   p < 0.01. Any other departure is "mild"; no evidence is "no clear
 *   departure".
 * With 2,000 normal samples per cell the rule gives something other than
 * "no clear departure" to at most 7% of them at every n from 3 to 10⁶,
 * and finds a lognormal (σ = 0.5) at n = 50 in 93% of samples.
 *
 * Skewness strength by |G1|: below 0.5 slight, 0.5–1 moderate, above 1
 * strong (Bulmer 1979, Principles of Statistics, Dover, p. 63; from memory).
 * Tails are "clearly" heavy or light when |G2| ≥ 1 (common practice).
 *
 * @module
 */
import type { Verdict, VerdictGrounds } from "../results/reading.ts";

/** Every threshold of the reading, with its source in the module header. */
export const READING_RULES = Object.freeze({
  /** Shapiro–Wilk p below this is evidence of a departure. */
  pDeparture: 0.05,
  /** Shapiro–Wilk p below this is strong evidence. */
  pStrong: 0.01,
  /** An effect stands out when beyond this many standard errors (two-sided 1%). */
  seMultiple: 2.576,
  /** Above this many values effect sizes decide. */
  largeN: 2000,
  /** |G1| at which skew starts to matter, is large, is strong. */
  skewSome: 0.25,
  skewLarge: 0.5,
  skewStrong: 1,
  /** |G2| at which tails start to matter, are large ("clearly"). */
  tailsSome: 0.5,
  tailsLarge: 1,
  /** Level of the generalized ESD procedure for outliers. */
  outlierAlpha: 0.01,
  /** Below this many values the tests have little power; below the second, modest power. */
  littlePower: 20,
  modestPower: 50,
  /** Values at one end that make a pile-up: at least this many and this share (common practice). */
  pileUpCount: 3,
  pileUpShare: 0.02,
  /** Sarle's bimodality coefficient above this (the uniform's 5/9) hints at two peaks. */
  bimodality: 5 / 9,
});

/** The evidence the verdict weighs. */
export interface VerdictEvidence {
  /** Values analysed. */
  readonly n: number;
  /** Shapiro–Wilk p (on at most 5,000 values). */
  readonly p: number;
  /** Skewness G1 and its standard error; absent below 4 values. */
  readonly G1?: number;
  readonly seG1?: number;
  /** Excess kurtosis G2 and its standard error; absent below 4 values. */
  readonly G2?: number;
  readonly seG2?: number;
  /** Outliers found by the generalized ESD procedure at the 1% level. */
  readonly outliers: number;
  /** Whether a separate cluster was found. */
  readonly cluster: boolean;
  /** Whether the measurement step is coarse against the spread (p then unused). */
  readonly coarse: boolean;
}

export type { VerdictGrounds };

/**
 * The verdict from the evidence, by the rule in this module's header.
 *
 * @param e the evidence
 *
 * @example
 * ```ts
 * import { decideVerdict } from "./reading_rules.ts";
 * // plumb([1, 2, 3, 4, 5, 6]): p = 0.96, nothing stands out
 * const g = decideVerdict({ n: 6, p: 0.96, G1: 0, seG1: 0.85, G2: -1.2, seG2: 1.74, outliers: 0, cluster: false, coarse: false });
 * if (g.verdict !== "no-clear-departure") throw new Error(g.verdict);
 * ```
 */
export function decideVerdict(e: VerdictEvidence): VerdictGrounds {
  const r = READING_RULES;
  const effectsDecide = e.n > r.largeN;
  const stands = (g?: number, se?: number) =>
    g !== undefined && se !== undefined && Math.abs(g) > r.seMultiple * se;
  const skewStands = stands(e.G1, e.seG1);
  const tailsStand = stands(e.G2, e.seG2);
  const skewSome = Math.abs(e.G1 ?? 0) >= r.skewSome;
  const tailsSome = Math.abs(e.G2 ?? 0) >= r.tailsSome;
  const skewLarge = skewStands && Math.abs(e.G1 ?? 0) >= r.skewLarge;
  const tailsLarge = tailsStand && Math.abs(e.G2 ?? 0) >= r.tailsLarge;
  const testSays = !e.coarse && e.p < r.pDeparture;
  const bySkew = skewStands && (!effectsDecide || skewSome);
  const byTails = tailsStand && (!effectsDecide || tailsSome);
  const byTest = testSays && (!effectsDecide || skewSome || tailsSome);
  const byOutliers = e.outliers > 0;
  const byCluster = e.cluster;
  let verdict: Verdict = "no-clear-departure";
  if (byTest || bySkew || byTails || byOutliers || byCluster) {
    const strong = effectsDecide || e.coarse || e.p < r.pStrong;
    const clear = byCluster || ((skewLarge || tailsLarge) && strong) ||
      (byOutliers && !e.coarse && e.p < r.pStrong);
    verdict = clear ? "clear-departure" : "mild-departure";
  }
  return Object.freeze({
    verdict,
    byTest,
    bySkew,
    byTails,
    byOutliers,
    byCluster,
    effectsDecide,
  });
}
