/**
 * The aggregate interface between the statistics and the data: the few
 * things a screening needs to know about one column's finite values, asked
 * the same way whether the values are in memory or stay in a query engine.
 * Everything else (tests, QQ plot, histogram, Box–Cox λ, reading) is
 * computed from these answers.
 *
 * Two implementations: `memoryAggregates(values)` (`lib/plumb/`, over a
 * typed array) and `scanAggregates(...)` (`lib/scan/`, through SQL). Tests
 * written once against this interface run on both
 * (`tests/scan/aggregates_test.ts`).
 *
 * The screening is put together once from these answers:
 * `screenFromAnswers` (`lib/plumb/screening.ts`) takes n, the shape, the
 * order statistics at ranks, the histogram counted by the source and the
 * sorted sample, and decides which test runs on what, builds the QQ data
 * and the reading and assembles the `Analysis`. The in-memory `analyse`
 * answers from its one sorted copy, the scanned screening
 * (`lib/scan/screen.ts`) from one cell pass and one gather that answer the
 * ranks, edges and log sums together; neither goes through one call per
 * answer, which in the engine would cost a pass each.
 *
 * Every answer is exact or states its error: order statistics and counts
 * below an edge are exact; central moments come from compensated central
 * sums (never raw power sums, which lose every digit on x + 1e6); the
 * sample is seeded (the same seed gives the same sample).
 *
 * @module
 */

/** How many finite values a column has, and their range. */
export interface AggregateRange {
  /** Finite values. */
  readonly n: number;
  /** The smallest finite value. */
  readonly min: number;
  /** The largest finite value. */
  readonly max: number;
}

/**
 * The moments of the values in the form the moment-based tests take (the
 * in-memory summary's fields: `stats/moments.ts`).
 */
export interface AggregateShape {
  /** Mean. */
  readonly mean: number;
  /** Standard deviation (divisor n − 1). */
  readonly sd: number;
  /** Skewness g1 = m3 / m2^(3/2). */
  readonly g1: number;
  /** Excess kurtosis g2 = m4 / m2² − 3. */
  readonly g2: number;
  /** The power of two the values were scaled by before summing (0 for ordinary magnitudes). */
  readonly scaleExp: number;
  /** The scaled mean's leading part (the centre the sums were taken about). */
  readonly centreHi: number;
  /** The scaled mean's correction (the rounding left in the centre). */
  readonly centreLo: number;
  /** The scaled standard deviation. */
  readonly sdScaled: number;
}

/** A profile log-likelihood of a power λ (Box–Cox 1964), up to a constant. */
export interface AggregateProfile {
  /** The family. */
  readonly family: "Box–Cox" | "Yeo–Johnson";
  /** Values it covers. */
  readonly n: number;
  /** The profile log-likelihood at λ. */
  h(lambda: number): number;
}

/** The aggregates of one column's finite values. Each call answers from the whole column. */
export interface ColumnAggregates {
  /** Where the values are, in words (`"memory"`, or the engine's name). */
  readonly where: string;
  /** Finite values and their range. */
  range(): Promise<AggregateRange>;
  /**
   * Mean, sd, g1 and g2 from compensated central sums Σ(x − x̄)ʲ, j = 1…4
   * (Neumaier 1974 summation; the rounding left in the mean folded back).
   */
  shape(): Promise<AggregateShape>;
  /** The exact order statistics at 1-based `ranks` (ascending), in that order. */
  orderStatistics(ranks: readonly number[]): Promise<Float64Array>;
  /** For each of `edges` (ascending), how many values lie strictly below it. */
  countsBelow(edges: readonly number[]): Promise<Float64Array>;
  /**
   * A seeded random sample of min(size, n) values, sorted; every value when
   * n ≤ size. The same seed gives the same sample.
   */
  sample(size: number, seed: number): Promise<Float64Array>;
  /**
   * The Box–Cox profile likelihood over every value (positive values only),
   * from sums of the centred logs (in the engine: their power series within
   * each cell of the value grid, with the raw values of cells the series
   * cannot sum).
   */
  boxCoxProfile(): Promise<AggregateProfile>;
}
