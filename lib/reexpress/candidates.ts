/**
 * The re-expression candidates as plain data (what was tried, how each
 * re-tested, where it ranks) and the words that explain the ranking and the
 * choice. The search itself is in `search.ts`.
 *
 * @module
 */
import { formatNumber } from "../results/format.ts";
import type { TestResult } from "../stats/result.ts";
import type { LambdaFit } from "./lambda_fit.ts";
import type { Reexpression } from "./reexpression.ts";

/** One normality test re-run on a candidate. */
export interface CandidateTest {
  /** The test's name, e.g. `"Shapiro–Wilk"`. */
  readonly test: string;
  /** The result, or `null` when the test does not apply here. */
  readonly result: TestResult | null;
  /** Why the test did not apply (its own message), or `null`. */
  readonly note: string | null;
}

/** One re-expression tried and placed by its departure: plain, frozen data. */
export interface RankedCandidate {
  /** 1 for the chosen candidate, then 2, 3, … */
  readonly rank: number;
  /** What was applied. */
  readonly reexpression: Reexpression;
  /** 1 − W′ of the re-expressed values (0 = exactly on a QQ line). */
  readonly departure: number;
  /** Whether the departure is within the chance margin of the best one. */
  readonly closeToBest: boolean;
  /** Place in the simplicity order (0 = as measured, 6 = fitted Yeo–Johnson). */
  readonly simplicity: number;
  /** Where the candidate came from (a shift rule, a ladder choice, a fitted λ). */
  readonly notes: readonly string[];
}

/**
 * The candidates ranked by departure alone, before any test is re-run on
 * them: everything a choice needs (see `rankReexpressions`).
 */
export interface ReexpressionRanking {
  /** Number of values. */
  readonly n: number;
  /** Every candidate tried, best first. */
  readonly candidates: readonly RankedCandidate[];
  /** The first candidate: the one to carry forward. */
  readonly chosen: RankedCandidate;
  /** Why the chosen one was chosen, in words. */
  readonly reason: string;
  /** The ranking rule, in words. */
  readonly rule: string;
  /** The chance margin used: median 1 − W′ of normal samples of this size. */
  readonly margin: number;
  /** The Box–Cox fit (positive data only), or `null`. */
  readonly boxCox: LambdaFit | null;
  /** The Yeo–Johnson fit (data with zeros or negatives only), or `null`. */
  readonly yeoJohnson: LambdaFit | null;
  /** Re-expressions not tried, and why. */
  readonly skipped: readonly string[];
}

/** One re-expression tried, re-tested and placed: plain, frozen data. */
export interface ReexpressionCandidate extends RankedCandidate {
  /** Moment skewness g1 of the re-expressed values (`null` for n < 4). */
  readonly skewness: number | null;
  /** Moment excess kurtosis g2 of the re-expressed values (`null` for n < 4). */
  readonly excessKurtosis: number | null;
  /** Every normality test, re-run on the re-expressed values. */
  readonly tests: readonly CandidateTest[];
}

/** The outcome of {@linkcode searchReexpressions}: plain, frozen data. */
export interface ReexpressionSearch {
  /** Number of values. */
  readonly n: number;
  /** Every candidate tried, best first. */
  readonly candidates: readonly ReexpressionCandidate[];
  /** The first candidate: the one to carry forward. */
  readonly chosen: ReexpressionCandidate;
  /** Why the chosen one was chosen, in words. */
  readonly reason: string;
  /** The ranking rule, in words. */
  readonly rule: string;
  /** The chance margin used: median 1 − W′ of normal samples of this size. */
  readonly margin: number;
  /** The Box–Cox fit (positive data only), or `null`. */
  readonly boxCox: LambdaFit | null;
  /** The Yeo–Johnson fit (data with zeros or negatives only), or `null`. */
  readonly yeoJohnson: LambdaFit | null;
  /** Re-expressions not tried, and why. */
  readonly skipped: readonly string[];
}

/** Options for {@linkcode searchReexpressions}. */
export interface SearchOptions {
  /**
   * Level of the λ intervals (used to pick the ladder power).
   * @default 0.95
   */
  readonly level?: number;
  /**
   * λ range for the Box–Cox and Yeo–Johnson fits.
   * @default [-5, 5]
   */
  readonly range?: readonly [number, number];
  /**
   * Base of the log candidate.
   * @default "e"
   */
  readonly logBase?: "e" | 10;
}

/** The ranking rule, for reports. */
export const RANKING_RULE =
  "Each candidate's departure is 1 − W′ (one minus the squared QQ correlation). " +
  "Candidates whose departure exceeds the smallest by no more than the median departure " +
  "of truly normal samples of the same size count as equally good; among those the " +
  "simplest is chosen, in the order: as measured, log, square root, reciprocal, a ladder " +
  "power, fitted Box–Cox λ, fitted Yeo–Johnson λ. The rest follow by departure";

/** A departure or λ for the words of a reason: 3 significant digits, exponent form below 1e-3. */
export function _fmt(v: number): string {
  return Math.abs(v) < 1e-3 && v !== 0
    ? v.toExponential(2).replace("e-", "e−").replace(/^-/, "−")
    : formatNumber(v, 3);
}

/** Why the chosen candidate was chosen, in words. */
export function _reason(
  chosen: RankedCandidate,
  best: RankedCandidate,
  all: readonly RankedCandidate[],
  margin: number,
  n: number,
): string {
  const dep = (c: RankedCandidate) => `${c.reexpression.label}: ${_fmt(c.departure)}`;
  const chance = `${_fmt(margin)}, what normal samples of ${n} typically show`;
  const simpler = all.filter((c) => c.simplicity < chosen.simplicity && !c.closeToBest);
  const isAsIs = chosen.reexpression.kind === "identity";
  if (chosen === best) {
    const head = isAsIs
      ? "No re-expression needed: the data as measured are as close to normal as any candidate"
      : `${chosen.reexpression.label} departs least from normal of all candidates ` +
        `(1 − W′ = ${_fmt(chosen.departure)})`;
    const tail = simpler.length === 0 || isAsIs
      ? ""
      : `; every simpler candidate departs by more than the chance margin (${chance}): ` +
        simpler.map(dep).join(", ");
    return head + tail;
  }
  const head = isAsIs
    ? "No re-expression needed: the data as measured"
    : `${chosen.reexpression.label} is chosen: it`;
  const lead = isAsIs ? " depart" : " departs";
  return `${head}${lead} from normal (1 − W′ = ${_fmt(chosen.departure)}) no more than ` +
    `the best candidate, ${dep(best)}, plus the chance margin (${chance}), and ` +
    `${isAsIs ? "keep the original units" : "is simpler to interpret and back-transform"}` +
    (simpler.length > 0 && !isAsIs
      ? `; simpler candidates depart by more: ${simpler.map(dep).join(", ")}`
      : "");
}
