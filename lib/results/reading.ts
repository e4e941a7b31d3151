/**
 * The reading's result types and the verdict words: the shape of a sample in
 * plain words, as plain data. Shared by the chain (which computes readings),
 * the renderers (which show them) and anything that reports a verdict.
 *
 * @module
 */
import type { RoundingJudgement } from "../stats/rounding.ts";

/** The three verdicts, as stable codes. */
export type Verdict = "no-clear-departure" | "mild-departure" | "clear-departure";

/** The verdicts in words, for display. */
export const VERDICT_WORDS: Readonly<Record<Verdict, string>> = Object.freeze({
  "no-clear-departure": "no clear departure from normal",
  "mild-departure": "mild departure from normal",
  "clear-departure": "clear departure from normal",
});

/** The verdicts in two or three words, for table cells. */
export const VERDICT_SHORT: Readonly<Record<Verdict, string>> = Object.freeze({
  "no-clear-departure": "no clear departure",
  "mild-departure": "mild departure",
  "clear-departure": "clear departure",
});

/** The verdict and what carried it (see `lib/plumb/reading_rules.ts`). */
export interface VerdictGrounds {
  /** The verdict these grounds carried. */
  readonly verdict: Verdict;
  /** Shapiro–Wilk counted as evidence (p < 0.05, and the step not coarse). */
  readonly byTest: boolean;
  /** The skewness counted (stands out, and large enough above 2,000 values). */
  readonly bySkew: boolean;
  /** The kurtosis counted. */
  readonly byTails: boolean;
  /** Outliers counted. */
  readonly byOutliers: boolean;
  /** A cluster counted. */
  readonly byCluster: boolean;
  /** Whether effect sizes decided (more than 2,000 values). */
  readonly effectsDecide: boolean;
}

/**
 * What a departure comes from, most specific first: a pile-up at an end, a
 * separate cluster, a few outliers, skew, tails, a hint of two peaks, or
 * small departures with no single cause (`"shape"`); `"none"` without a
 * departure.
 */
export type ReadingCause =
  | "none"
  | "pile-up"
  | "cluster"
  | "outliers"
  | "skew"
  | "tails"
  | "two-peaks"
  | "shape";

/** A value and the data row it came from. */
export interface ValueAtRow {
  /** The value. */
  readonly value: number;
  /** 1-based data row (the position in the values when no rows were given). */
  readonly row: number;
  /** Below or above the rest. */
  readonly side: "low" | "high";
}

/** The facts a reading was built from, for programs. */
export interface ReadingFacts {
  /** Direction of a skew that stands out from its standard error, or `"none"`. */
  readonly skew: "right" | "left" | "none";
  /** Strength by |G1|. */
  readonly skewStrength: "slight" | "moderate" | "strong";
  /** Tails relative to normal, when G2 stands out from its standard error. */
  readonly tails: "heavy" | "light" | "as expected";
  /** Distinct values (floating-point noise merged). */
  readonly distinct: number;
  /** Smallest gap between distinct values. */
  readonly resolution: number;
  /** The measurement step (inherited from the data, or found), or `null`. */
  readonly step: number | null;
  /** The step against the spread at this n. */
  readonly rounding: RoundingJudgement;
  /** Whether rounding is coarse enough to make the tests reject by itself. */
  readonly tied: boolean;
  /** Sarle's bimodality coefficient. */
  readonly bimodality: number;
  /** QQ points below / above the envelope among the lowest 10% of ranks. */
  readonly lowerTail: { readonly below: number; readonly above: number };
  /** QQ points below / above the envelope among the highest 10% of ranks. */
  readonly upperTail: { readonly below: number; readonly above: number };
  /** QQ points outside the envelope in between. */
  readonly bodyExits: number;
  /** Values piled up exactly at the minimum or maximum, or `null`. */
  readonly pileUp: {
    readonly end: "minimum" | "maximum";
    readonly value: number;
    readonly count: number;
  } | null;
  /** Outliers by the generalized ESD procedure. */
  readonly outliers: {
    readonly count: number;
    readonly level: number;
    readonly values: readonly ValueAtRow[];
    /** Whether the rest, without them, is consistent with a normal distribution. */
    readonly alone: boolean;
    readonly method: string;
  };
  /** A separate cluster at one end, or `null`. */
  readonly cluster: {
    readonly side: "low" | "high";
    readonly count: number;
    /** Its share of the values, 0–1. */
    readonly share: number;
    /** The gap's ends: the nearest value of the rest and of the cluster. */
    readonly gap: readonly [number, number];
    /** Rows of the first (at most 10) of its values, in data order. */
    readonly rows: readonly number[];
  } | null;
  /**
   * The two estimates of σ behind W: the QQ plot's order-statistic slope
   * (Σaᵢx₍ᵢ₎/√(n − 1)) and the sd; W = ratio².
   */
  readonly sigma: { readonly slope: number; readonly sd: number; readonly ratio: number };
  /** What the departure comes from. */
  readonly cause: ReadingCause;
  /** Whether a re-expression is a sensible remedy for this departure. */
  readonly reexpressionHelps: boolean;
  /** What carried the verdict. */
  readonly grounds: VerdictGrounds;
}

/** The shape in words. */
export interface Reading {
  /** The verdict code. */
  readonly verdict: Verdict;
  /** One short line: the main reason for the verdict, with W and n (the verdict itself is in `verdict`). */
  readonly headline: string;
  /** The reason alone, in a few words, for sentences and table cells. */
  readonly reason: string;
  /** The observations, one sentence each, most important first. */
  readonly points: readonly string[];
  /** What the sample size means for the tests. */
  readonly sizeNote: string;
  /** The numbers behind the words. */
  readonly facts: ReadingFacts;
}
