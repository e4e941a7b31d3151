/**
 * The result of screening one sample, as plain data: where the values came
 * from, the moments, every test's outcome, the QQ and histogram data and the
 * reading. Computed by the chain; shown by the renderers.
 *
 * @module
 */
import type { HistogramData } from "../stats/histogram_data.ts";
import type { Moments } from "../stats/moments.ts";
import type { QqData } from "../stats/qq_data.ts";
import type { SerialDependence } from "../stats/serial_dependence.ts";
import type { TestResult } from "../stats/result.ts";
import type { Censoring } from "./censoring.ts";
import type { Reading } from "./reading.ts";

/** One test's outcome: its result, or why it was not run. */
export interface TestOutcome {
  /** The test's name. */
  readonly test: string;
  /** The result, when the test applies at this n. */
  readonly result?: TestResult;
  /** Why the test was not run (e.g. too few values), in words. */
  readonly skipped?: string;
}

/** Where the analysed values came from and what was left out. */
export interface SampleOrigin {
  /** What is analysed, for titles: the column, its group and any re-expression. */
  readonly label: string;
  /** The column's name. */
  readonly column: string;
  /** The group's value, when the chain is split by a column. */
  readonly group?: string;
  /** The re-expression applied, in words (e.g. `"log(x)"`), if any. */
  readonly transform?: string;
  /** Missing cells left out. */
  readonly missingDropped: number;
  /** Text cells left out on request. */
  readonly textDropped: number;
  /** The source row (1-based data row) of each value, aligned with the values. */
  readonly rows?: ArrayLike<number>;
  /**
   * What the reading and the write-up must say about where these values came
   * from (e.g. that they are a model's residuals, or serially dependent): one
   * sentence each, without a final period. They lead the reading's points.
   */
  readonly notes?: readonly string[];
}

/** A seeded random subsample: how many values, drawn with which seed. */
export interface Subsample {
  /** Values in the subsample. */
  readonly size: number;
  /** The seed of the draw (the same seed draws the same values). */
  readonly seed: number;
}

/** The check of serial dependence in a named order, with the values in that order. */
export interface SerialCheck {
  /** The order's column, or `"file order"` when asked for explicitly. */
  readonly order: string;
  /** What the order column holds: `"numbers"`, `"date-times"`, or `"file"`. */
  readonly kind: "numbers" | "date-times" | "file";
  /** Values left out of the check because their order cell is missing. */
  readonly unordered: number;
  /** Rows of the table sharing their order value with another (kept in file order among themselves). */
  readonly tied: number;
  /** The lag-1 autocorrelation and runs tests and the decision. */
  readonly result: SerialDependence;
  /** The median the runs were counted about. */
  readonly median: number;
  /**
   * The values in order for the plot: every value up to 1000, else 500
   * equal slices by position with each slice's mean, lowest and highest.
   */
  readonly points: {
    readonly position: readonly number[];
    readonly value: readonly number[];
    readonly low: readonly number[];
    readonly high: readonly number[];
  };
}

/** Everything plumbline computes about one sample. */
export interface Analysis {
  /** Where the values came from. */
  readonly origin: SampleOrigin;
  /** Values analysed. */
  readonly n: number;
  /** Mean, sd, skewness and kurtosis with standard errors. */
  readonly moments: Moments;
  /**
   * The Shapiro–Wilk result the verdict rests on. Above 5000 values it comes
   * from a seeded random subsample, and its `n` is the subsample's size
   * (see {@linkcode Analysis.subsample}); {@linkcode Analysis.n} stays the
   * full count.
   */
  readonly primary: TestResult;
  /**
   * The seeded random subsample the primary test ran on, when the sample was
   * larger than that test's calibrated range; `null` when it used every value.
   */
  readonly subsample: Subsample | null;
  /** Every test, in a fixed order, run or skipped. */
  readonly tests: readonly TestOutcome[];
  /** The QQ plot's data (thinned for display when n is large). */
  readonly qq: QqData;
  /** The histogram and fitted normal curve. */
  readonly histogram: HistogramData;
  /** The shape in words. */
  readonly reading: Reading;
  /**
   * Present when any value is censored ("<0.05", ">1000"): the counts by side,
   * the limits and the maximum-likelihood mean and sd. Then `n` counts the
   * censored values too, and `primary` is the censored-sample test.
   */
  readonly censoring?: Censoring;
  /** Serial dependence in the order the user named, when one was named. */
  readonly serial?: SerialCheck;
}
