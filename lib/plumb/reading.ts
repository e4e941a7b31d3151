/**
 * The reading: the shape of a sample in plain words, computed from the
 * numbers with the sample size in view. This module gathers the facts; the
 * thresholds and the verdict rule are in `reading_rules.ts`, the evidence
 * (step, outliers, cluster, Shapiro–Wilk geometry) in `reading_evidence.ts`,
 * and the words in `reading_words.ts`.
 *
 * Facts and their sources:
 * - skew and tails are named only when G1 or G2 stands out from its
 *   standard error (|G| > 2.576 SE); strength as in `reading_rules.ts`;
 * - the cause of a departure, in this order: a pile-up at an end (at least
 *   3 values and 2% of them exactly at the minimum or maximum, common
 *   practice), a separate cluster, outliers whose removal leaves a sample
 *   consistent with normal, then skew, tails, a hint of two peaks (Sarle's
 *   bimodality coefficient above 5/9 with negative G2; Pfister et al. 2013,
 *   Frontiers in Psychology 4:700), or unnamed small departures;
 * - a re-expression is offered as the remedy only for skew and unnamed
 *   departures: a power does not remove a pile-up, a separate group, a few
 *   wild values, rounding or symmetric tails;
 * - envelope exits are described, not counted in the verdict: a pointwise
 *   band's exits are strongly correlated between neighbours.
 *
 * @module
 */
import { sortFloat64 } from "../numeric/sort.ts";
import type { DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import type { Moments } from "../stats/moments.ts";
import type { QqData } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { _restLooksNormal } from "../stats/clusters.ts";
import { gatherEvidence } from "./reading_evidence.ts";
import { READING_RULES } from "./reading_rules.ts";
import { readingWords } from "./reading_words.ts";
import type { Subsample } from "../results/analysis.ts";
import type { Reading, ReadingCause, ReadingFacts, ValueAtRow } from "../results/reading.ts";

/** What {@linkcode readShape} needs. */
export interface ReadingInput {
  readonly n: number;
  readonly moments: Moments;
  readonly primary: TestResult;
  readonly dagostino?: DagostinoPearsonResult;
  readonly qq: QqData;
  /** The values (any order); sorted internally when `sortedSample` is absent. */
  readonly values: ArrayLike<number>;
  /**
   * The values already sorted, when the caller has them; from a query
   * source, a sorted seeded sample of them (fewer than `n`, rows unknown),
   * in which ties, far values, clusters and pile-ups are then judged.
   */
  readonly sortedSample?: Float64Array;
  /** Row labels aligned with `values` (1-based data rows), to name outliers by row. */
  readonly rows?: ArrayLike<number>;
  /** The row label of the value at a 0-based position, in place of `rows`. */
  readonly rowLabel?: (position: number) => number;
  /**
   * The measurement step of the data these values come from (residuals
   * inherit their data's step); `null` for none.
   * @default found from the values
   */
  readonly step?: number | null;
  /** The seeded subsample the primary test ran on, when it did not use every value. */
  readonly subsample?: Subsample | null;
  /** That subsample, sorted (the σ estimates behind W are taken on it). */
  readonly subsampleSorted?: Float64Array;
}

/** How many values equal the one at position `at` of the sorted sample (an end). */
function _runLength(sorted: Float64Array, at: number): number {
  const v = sorted[at];
  let k = 0;
  if (at === 0) { while (k < sorted.length && sorted[k] === v) k++; }
  else while (k < sorted.length && sorted[sorted.length - 1 - k] === v) k++;
  return k;
}

/** The smallest gap between distinct values, gaps below 1e-9 of the range counting as ties. */
function _resolution(sorted: Float64Array): number {
  let gap = Infinity;
  // Scaled before subtracting, so that a range beyond ±1.8e308 cannot overflow.
  const tiny = 1e-9 * sorted[sorted.length - 1] - 1e-9 * sorted[0];
  for (let i = 1; i < sorted.length; i++) {
    const d = sorted[i] - sorted[i - 1];
    if (d > tiny && d < gap) gap = d;
  }
  return Math.min(gap, Number.MAX_VALUE);
}

/** Rows of the values that satisfy `pick`, at most `limit`, in data order. */
function _rowsWhere(
  values: ArrayLike<number>,
  rowOf: (position: number) => number,
  pick: (v: number) => boolean,
  limit: number,
): number[] {
  const out: number[] = [];
  for (let i = 0; i < values.length && out.length < limit; i++) {
    if (pick(values[i])) out.push(rowOf(i));
  }
  return out;
}

/**
 * Build the reading of a sample from its moments, tests and QQ data.
 *
 * @param input the numbers (see {@linkcode ReadingInput})
 *
 * @example
 * ```ts
 * import { readShape } from "./reading.ts";
 * import { moments } from "../stats/moments.ts";
 * import { qqData } from "../stats/qq_data.ts";
 * import { shapiroWilk } from "../stats/shapiro_wilk.ts";
 * const x = Array.from({ length: 200 }, (_, i) => Math.exp((i - 100) / 40));
 * const r = readShape({ n: 200, moments: moments(x), primary: shapiroWilk(x), qq: qqData(x), values: x });
 * if (r.facts.skew !== "right" || r.verdict !== "clear-departure") throw new Error(r.headline);
 * ```
 */
export function readShape(input: ReadingInput): Reading {
  const { n, moments: m, primary, qq } = input;
  const rows = input.rows;
  const rowOf = input.rowLabel ?? (rows ? (i: number) => rows[i] : (i: number) => i + 1);
  const rules = READING_RULES;
  const sorted = input.sortedSample ?? sortFloat64(Float64Array.from(input.values));
  // A query source hands over a seeded sample of its values (fewer than n, no rows):
  // ties, far values, clusters and pile-ups are then judged and counted in the sample.
  const ns = sorted.length;
  const sampled = ns < n;
  const rowsWhere: typeof _rowsWhere = sampled ? () => [] : _rowsWhere;
  const ev = gatherEvidence(sorted, {
    moments: m,
    primary,
    step: input.step,
    primarySorted: input.subsampleSorted,
  });

  const skewSeen = Math.abs(m.G1) > rules.seMultiple * m.seG1;
  const skew: ReadingFacts["skew"] = skewSeen ? (m.G1 > 0 ? "right" : "left") : "none";
  const a1 = Math.abs(m.G1);
  const skewStrength = a1 < rules.skewLarge
    ? "slight"
    : a1 <= rules.skewStrong
    ? "moderate"
    : "strong";
  const tailSeen = Math.abs(m.G2) > rules.seMultiple * m.seG2;
  const tails: ReadingFacts["tails"] = tailSeen ? (m.G2 > 0 ? "heavy" : "light") : "as expected";
  const bimodality = (m.G1 * m.G1 + 1) / (m.G2 + (3 * (n - 1) ** 2) / ((n - 2) * (n - 3)));
  const twoPeaks = bimodality > rules.bimodality && m.G2 < 0 && n >= 20;

  // Tails are the lowest and highest 10% of ranks (at least 3 each); the rest is the body.
  const tailSize = Math.max(3, Math.ceil(0.1 * n));
  const lowerTail = { below: 0, above: 0 };
  const upperTail = { below: 0, above: 0 };
  let body = 0;
  for (let k = 0; k < qq.shown; k++) {
    const o = qq.outside[k];
    if (o === 0) continue;
    const r = qq.rank[k];
    if (r <= tailSize) o < 0 ? lowerTail.below++ : lowerTail.above++;
    else if (r > n - tailSize) o < 0 ? upperTail.below++ : upperTail.above++;
    else body++;
  }

  let pileUp: ReadingFacts["pileUp"] = null;
  for (const end of ["minimum", "maximum"] as const) {
    const count = _runLength(sorted, end === "minimum" ? 0 : ns - 1);
    if (count >= rules.pileUpCount && count >= rules.pileUpShare * ns && count < ns) {
      const value = end === "minimum" ? sorted[0] : sorted[ns - 1];
      if (pileUp === null || count > pileUp.count) pileUp = Object.freeze({ end, value, count });
    }
  }

  // Outliers, with their rows; they are the cause when the rest looks normal without them.
  const o = ev.outliers;
  const outlierValues: ValueAtRow[] = [];
  const seen = new Map<number, number>();
  for (let k = 0; k < o.count; k++) {
    const v = o.values[k];
    const skip = seen.get(v) ?? 0;
    seen.set(v, skip + 1);
    const rows = rowsWhere(input.values, rowOf, (x) => x === v, skip + 1);
    const row = rows[skip] ?? rows[0] ?? -1;
    outlierValues.push(Object.freeze({ value: v, row, side: o.sides[k] }));
  }
  const lows = o.sides.filter((s) => s === "low").length;
  const rest = sorted.subarray(lows, ns - (o.count - lows));
  const outliersAlone = o.count > 0 && _restLooksNormal(rest, lows < o.count, ev.rounding.coarse);

  const c = ev.cluster;
  let cluster: ReadingFacts["cluster"] = null;
  if (c.found && c.gap && c.side && c.count) {
    const [lo, hi] = c.gap;
    const inCluster = c.side === "high" ? (v: number) => v >= hi : (v: number) => v <= lo;
    cluster = Object.freeze({
      side: c.side,
      count: c.count,
      share: c.count / ns,
      gap: c.gap,
      rows: Object.freeze(rowsWhere(input.values, rowOf, inCluster, 10)),
    });
  }

  const g = ev.grounds;
  const departs = g.verdict !== "no-clear-departure";
  let cause: ReadingCause = "none";
  if (departs) {
    if (pileUp !== null) cause = "pile-up";
    else if (cluster !== null) cause = "cluster";
    else if (outliersAlone) cause = "outliers";
    else if (skew !== "none" && skewStrength !== "slight") cause = "skew";
    else if (twoPeaks) cause = "two-peaks";
    else if (tails !== "as expected") cause = "tails";
    else if (skew !== "none") cause = "skew";
    else cause = "shape";
  }
  const facts: ReadingFacts = Object.freeze({
    skew,
    skewStrength,
    tails,
    distinct: ev.distinct,
    resolution: _resolution(sorted),
    step: ev.step,
    rounding: ev.rounding,
    tied: ev.rounding.coarse,
    bimodality,
    lowerTail: Object.freeze(lowerTail),
    upperTail: Object.freeze(upperTail),
    bodyExits: body,
    pileUp,
    outliers: Object.freeze({
      count: o.count,
      level: o.alpha,
      values: Object.freeze(outlierValues),
      alone: outliersAlone,
      method: o.method,
    }),
    cluster,
    sigma: Object.freeze({
      slope: ev.geometry.slope,
      sd: ev.geometry.sd,
      ratio: ev.geometry.ratio,
    }),
    cause,
    reexpressionHelps: cause === "skew" || cause === "shape",
    grounds: g,
  });
  const words = readingWords({
    n,
    moments: m,
    primary,
    qq,
    facts,
    twoPeaks,
    subsample: input.subsample,
    sampleOnly: sampled,
  });
  return Object.freeze({ verdict: g.verdict, ...words, facts });
}
