/**
 * The full screening of one sample: moments, every normality test that
 * applies at this n, the QQ data with its envelope, the histogram, and the
 * reading. Plain data, computed once per chain and cached there.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { seededRandom } from "../numeric/random.ts";
import { sortedCopy } from "../numeric/sort.ts";
import { checkFinite, checkSize } from "../stats/_input.ts";
import { _andersonDarlingSorted } from "../stats/anderson_darling.ts";
import { _dagostinoPearsonOf, type DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import { _histogramDataSorted, type HistogramData } from "../stats/histogram_data.ts";
import { _jarqueBeraOf } from "../stats/jarque_bera.ts";
import { _lillieforsSorted } from "../stats/lilliefors.ts";
import { _momentsOf, _sampleShape, type Moments } from "../stats/moments.ts";
import { _qqDataSorted, type QqData, type QqOptions } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { _shapiroFranciaSorted } from "../stats/shapiro_francia.ts";
import { _shapiroWilkSorted, SHAPIRO_WILK_MAX_N, shapiroWilk } from "../stats/shapiro_wilk.ts";
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

/** The name input errors give, as `moments()` would (the first step of the analysis). */
const _MOMENTS = "the skewness and kurtosis summary";

/**
 * A seeded random subsample of `size` values (partial Fisher–Yates shuffle).
 * The shuffled index array is kept sparse (only the positions the shuffle
 * has touched), so the memory used grows with `size`, not with `x.length`.
 */
export function _subsample(x: Float64Array, size: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  const moved = new Map<number, number>(); // position → index now there, where not the identity
  const out = new Float64Array(size);
  for (let i = 0; i < size; i++) {
    const j = i + rng.integer(x.length - i);
    const atJ = moved.get(j) ?? j;
    moved.set(j, moved.get(i) ?? i);
    moved.delete(i);
    out[i] = x[atJ];
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
  // Validate once, with the messages the moments summary gives, then share
  // the work: one summary of the values in their own order (moments, K²,
  // Jarque–Bera, QQ line), one radix-sorted copy (every order-statistic
  // test, the QQ points, the quartiles, the reading) and one summary of the
  // sorted copy (Anderson–Darling, Lilliefors).
  checkSize(n, ANALYSE_MIN_N, Number.POSITIVE_INFINITY, _MOMENTS);
  checkFinite(values, _MOMENTS);
  const shape = _sampleShape(values, _MOMENTS);
  const m = _momentsOf(n, shape);
  const sorted = sortedCopy(values);
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
    primary = _shapiroWilkSorted(sorted);
  }
  const sortedShape = _sampleShape(sorted, _MOMENTS);
  const tests: TestOutcome[] = [
    Object.freeze({ test: "Shapiro–Wilk", result: primary }),
    _run("Shapiro–Francia", () => _shapiroFranciaSorted(sorted)),
    _run("Anderson–Darling", () => _andersonDarlingSorted(sorted, sortedShape)),
    _run("Lilliefors", () => _lillieforsSorted(sorted, sortedShape)),
    _run("D'Agostino–Pearson", () => _dagostinoPearsonOf(n, shape)),
    _run("Jarque–Bera", () => _jarqueBeraOf(n, shape)),
  ];
  const qqOptions: QqOptions = origin.rows
    ? { ...options.qq, rows: origin.rows }
    : { ...options.qq };
  const qq = _qqDataSorted(values, sorted, shape, qqOptions);
  const histogram = _histogramDataSorted(values, sorted);
  const k2 = tests[4].result as DagostinoPearsonResult | undefined;
  const reading = readShape({
    n,
    moments: m,
    primary,
    dagostino: k2,
    qq,
    sortedSample: sorted,
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
