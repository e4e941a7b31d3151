/**
 * The reading's result types and the verdict words: the shape of a sample in
 * plain words, as plain data. Shared by the chain (which computes readings),
 * the renderers (which show them) and anything that reports a verdict.
 *
 * @module
 */

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

/** The facts a reading was built from, for programs. */
export interface ReadingFacts {
  /** Direction of a skew that stands out from noise, or `"none"`. */
  readonly skew: "right" | "left" | "none";
  /** Strength by |G1|. */
  readonly skewStrength: "slight" | "moderate" | "strong";
  /** Tails relative to normal, when G2 stands out from noise. */
  readonly tails: "heavy" | "light" | "as expected";
  /** Distinct values. */
  readonly distinct: number;
  /** Smallest gap between distinct values. */
  readonly resolution: number;
  /** Whether many values repeat. */
  readonly tied: boolean;
  /** Sarle's bimodality coefficient. */
  readonly bimodality: number;
  /** QQ points below / above the envelope in the lower half of the ranks. */
  readonly lowerTail: { readonly below: number; readonly above: number };
  /** QQ points below / above the envelope in the upper half of the ranks. */
  readonly upperTail: { readonly below: number; readonly above: number };
}

/** The shape in words. */
export interface Reading {
  /** The verdict code. */
  readonly verdict: Verdict;
  /** One short line: the main reason for the verdict, with W and n (the verdict itself is in `verdict`). */
  readonly headline: string;
  /** The observations, one sentence each, most important first. */
  readonly points: readonly string[];
  /** What the sample size means for the tests. */
  readonly sizeNote: string;
  /** The numbers behind the words. */
  readonly facts: ReadingFacts;
}
