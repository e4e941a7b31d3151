/**
 * The full screening of one sample: moments, every normality test that
 * applies at this n, the QQ data with its envelope, the histogram, and the
 * reading. Plain data, computed once per chain and cached there.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { seededRandom } from "../numeric/random.ts";
import { andersonDarling } from "../stats/anderson_darling.ts";
import { dagostinoPearson, type DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import { type HistogramData, histogramData } from "../stats/histogram_data.ts";
import { jarqueBera } from "../stats/jarque_bera.ts";
import { lilliefors } from "../stats/lilliefors.ts";
import { type Moments, moments } from "../stats/moments.ts";
import { type QqData, qqData, type QqOptions } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { shapiroFrancia } from "../stats/shapiro_francia.ts";
import { SHAPIRO_WILK_MAX_N, shapiroWilk } from "../stats/shapiro_wilk.ts";
import { type Reading, readShape } from "./reading.ts";

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
   * The Shapiro–Wilk result the verdict rests on (on a seeded subsample of
   * 5000 when n > 5000; the result's warnings say so).
   */
  readonly primary: TestResult;
  /** Every test, in a fixed order, run or skipped. */
  readonly tests: readonly TestOutcome[];
  /** The QQ plot's data (thinned for display when n is large). */
  readonly qq: QqData;
  /** The histogram and fitted normal curve. */
  readonly histogram: HistogramData;
  /** The shape in words. */
  readonly reading: Reading;
}

/** Options for {@linkcode analyse}. */
export interface AnalyseOptions {
  /**
   * QQ envelope options (level, pointwise or simultaneous, thinning).
   * @default {}
   */
  readonly qq?: QqOptions;
  /**
   * Seed for the Shapiro–Wilk subsample when n > 5000.
   * @default 1
   */
  readonly seed?: number;
}

/** The smallest sample plumbline analyses: moments need 4 values. */
export const ANALYSE_MIN_N = 4;

/** A seeded random subsample of `size` values (partial Fisher–Yates shuffle). */
export function _subsample(x: Float64Array, size: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  const idx = new Int32Array(x.length).map((_, i) => i);
  const out = new Float64Array(size);
  for (let i = 0; i < size; i++) {
    const j = i + rng.integer(x.length - i);
    const t = idx[i];
    idx[i] = idx[j];
    idx[j] = t;
    out[i] = x[idx[i]];
  }
  return out;
}

function _run(name: string, f: () => TestResult): TestOutcome {
  try {
    return Object.freeze({ test: name, result: f() });
  } catch (e) {
    if (e instanceof PlumbError && (e.code === "too-few" || e.code === "too-many")) {
      return Object.freeze({ test: name, skipped: e.message });
    }
    throw e;
  }
}

/**
 * Screen one sample for normality: every test, the QQ data, the histogram
 * and the reading.
 *
 * For n > 5000, Shapiro–Wilk (whose p-value approximation is calibrated up
 * to n = 5000, Royston 1995) runs on a seeded random subsample of 5000
 * values, and says so in its warnings and in the reading; every other test
 * uses all values.
 *
 * @param values the sample (finite numbers, at least 4, not all equal)
 * @param origin where the values came from, for labels and counts
 * @param options QQ options and the subsample seed
 *
 * @example
 * ```ts
 * import { analyse } from "./analysis.ts";
 * const a = analyse(new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1]), {
 *   label: "fill", column: "fill", missingDropped: 0, textDropped: 0,
 * });
 * if (a.primary.test !== "Shapiro–Wilk" || a.n !== 10) throw new Error("analysis");
 * ```
 */
export function analyse(
  values: Float64Array,
  origin: SampleOrigin,
  options: AnalyseOptions = {},
): Analysis {
  const n = values.length;
  const m = moments(values);
  let primary: TestResult;
  if (n > SHAPIRO_WILK_MAX_N) {
    const sub = shapiroWilk(_subsample(values, SHAPIRO_WILK_MAX_N, options.seed ?? 1));
    primary = Object.freeze({
      ...sub,
      n,
      method:
        `${sub.method}, on a seeded random subsample of ${SHAPIRO_WILK_MAX_N} of the ${n} values`,
      warnings: Object.freeze([
        `Shapiro–Wilk's p-value is calibrated for at most ${SHAPIRO_WILK_MAX_N} values, so W and p ` +
        `come from a seeded random subsample of ${SHAPIRO_WILK_MAX_N}; the other tests use all ${n}`,
        ...sub.warnings,
      ]),
    });
  } else {
    primary = shapiroWilk(values);
  }
  const tests: TestOutcome[] = [
    Object.freeze({ test: "Shapiro–Wilk", result: primary }),
    _run("Shapiro–Francia", () => shapiroFrancia(values)),
    _run("Anderson–Darling", () => andersonDarling(values)),
    _run("Lilliefors", () => lilliefors(values)),
    _run("D'Agostino–Pearson", () => dagostinoPearson(values)),
    _run("Jarque–Bera", () => jarqueBera(values)),
  ];
  const qqOptions: QqOptions = origin.rows
    ? { ...options.qq, rows: origin.rows }
    : { ...options.qq };
  const qq = qqData(values, qqOptions);
  const histogram = histogramData(values);
  const k2 = tests[4].result as DagostinoPearsonResult | undefined;
  const reading = readShape({
    n,
    moments: m,
    primary,
    dagostino: k2,
    qq,
    sortedSample: undefined,
    values,
  });
  return Object.freeze({
    origin: Object.freeze({ ...origin, rows: undefined }),
    n,
    moments: m,
    primary,
    tests: Object.freeze(tests),
    qq,
    histogram,
    reading,
  });
}
