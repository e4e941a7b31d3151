/**
 * One column's screening put together from the answers of the aggregate
 * interface (`results/aggregates.ts`): which test runs on which values, what
 * a subsample makes each result say, the QQ data, the reading and the
 * `Analysis` itself. Written once for values held in memory (`analyse` in
 * `analysis.ts`) and for values that stay in a query engine (`screenColumn`
 * in `lib/scan/screen.ts`); each source answers in its own way (a prepared
 * sort in memory, SQL passes in the engine), and the same code builds the
 * result from the answers.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { randomSubsample } from "../numeric/random.ts";
import type { Selected } from "../numeric/select.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import type { Analysis, SampleOrigin, Subsample, TestOutcome } from "../results/analysis.ts";
import { NORMALITY_TESTS, type PreparedSample } from "../stats/battery.ts";
import type { DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import type { HistogramData } from "../stats/histogram_data.ts";
import { _momentsOf, type _Shape } from "../stats/moments.ts";
import { _qqBuild } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { SHAPIRO_WILK_MAX_N } from "../stats/shapiro_wilk.ts";
import type { AnalyseOptions } from "./analysis.ts";
import { readShape } from "./reading.ts";

/**
 * The values the tests that need them in order (Shapiro–Wilk,
 * Shapiro–Francia, Anderson–Darling, Lilliefors) run on: every value, held
 * in memory and prepared once; or a sorted seeded sample drawn by the
 * source, which is every value when its length is n.
 */
export type ScreeningValues =
  | {
    /** Every value, prepared once (sorted copy, moment summary, shared passes). */
    readonly every: PreparedSample;
    /** Seed of the subsample Shapiro–Wilk takes beyond its calibrated range. */
    readonly seed: number;
  }
  | {
    /** The seeded sample, sorted; every value when its length is n. */
    readonly sample: Float64Array;
    /** Its seed (the same seed draws the same sample). */
    readonly seed: number;
    /** Who drew it, in words for the note (`"the SQL engine"`). */
    readonly drawnBy: string;
  };

/** What a source answers about one column's finite values (see `ColumnAggregates`). */
export interface ScreeningAnswers {
  /** Finite values. */
  readonly n: number;
  /** Their moment summary over every value, from compensated central sums. */
  readonly shape: _Shape;
  /**
   * The exact order statistics at 1-based ranks (ascending), each with its
   * 0-based position in the values (−1 where the source does not know it).
   */
  readonly orderStatistics: (ranks: readonly number[]) => Selected;
  /** The histogram of every value, made when asked (the source counts the bins). */
  readonly histogram: () => HistogramData;
  /** What the tests that need the values in order run on. */
  readonly values: ScreeningValues;
}

/** Options of {@linkcode screenFromAnswers}: those of `analyse` that do not concern the source. */
export type ScreeningOptions = Pick<AnalyseOptions, "qq" | "envelope" | "step" | "rowLabel">;

/** Run one test; a sample too small or too large for it gives a skipped outcome with the reason. */
export function _runTest(name: string, f: () => TestResult): TestOutcome {
  try {
    return Object.freeze({ test: name, result: f() });
  } catch (e) {
    if (e instanceof PlumbError && (e.code === "too-few" || e.code === "too-many")) {
      return Object.freeze({ test: name, skipped: e.message });
    }
    throw e;
  }
}

/** "a, b and c". */
function _list(names: readonly string[]): string {
  return names.length < 2 ? names.join("") : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
}

/**
 * Screen one column from its answers: every test of the battery, the primary
 * result, the QQ data, the histogram, the reading.
 *
 * Which test runs on what: the moment tests (D'Agostino–Pearson,
 * Jarque–Bera) from n and the moment summary of every value; the others on
 * every value when they are held in memory, else on the source's seeded
 * sample, each result then saying so. Shapiro–Wilk, whose p-value
 * approximation is calibrated up to n = 5000 (Royston 1995), runs beyond
 * that on a seeded subsample of 5000 drawn here from the values in memory,
 * and says so in its method and warnings and in the reading.
 *
 * @param answers the column's answers
 * @param origin where the values came from (its rows are used for labels and not kept)
 * @param options QQ options, an envelope in place of the normal one, the step, row labels
 * @example
 * ```ts
 * import { screenFromAnswers } from "./screening.ts";
 * import { selectFromSorted } from "../numeric/select.ts";
 * import { histogramData } from "../stats/histogram_data.ts";
 * import { _sampleShape } from "../stats/moments.ts";
 * const sorted = Float64Array.of(3.7, 3.8, 3.9, 4.0, 4.1, 4.1, 4.2, 4.3, 4.4, 4.6);
 * const a = screenFromAnswers({
 *   n: 10,
 *   shape: _sampleShape(sorted, "x"),
 *   orderStatistics: (ranks) => selectFromSorted(sorted, sorted, ranks),
 *   histogram: () => histogramData(sorted),
 *   values: { sample: sorted, seed: 1, drawnBy: "hand" },
 * }, { label: "fill", column: "fill", missingDropped: 0, textDropped: 0 });
 * if (a.primary.test !== "Shapiro–Wilk" || a.subsample !== null || a.tests.length !== 6) {
 *   throw new Error("screening");
 * }
 * ```
 */
export function screenFromAnswers(
  answers: ScreeningAnswers,
  origin: SampleOrigin,
  options: ScreeningOptions = {},
): Analysis {
  const { n, shape, values: on } = answers;
  // First, as its check of the spread (finite sd) names the summary every later step needs.
  const m = _momentsOf(n, shape);
  const every = "every" in on ? on.every : undefined;
  const sample = "sample" in on
    ? on.sample
    : n > SHAPIRO_WILK_MAX_N
    ? sortFloat64(randomSubsample(on.every.values, SHAPIRO_WILK_MAX_N, on.seed))
    : undefined;
  const [first, ...others] = NORMALITY_TESTS;
  const ordered = NORMALITY_TESTS.filter((t) => !t.fromShape).map((t) => t.name);
  const fromShape = NORMALITY_TESTS.filter((t) => t.fromShape).map((t) => t.name);
  // A sample from the source smaller than n: each result it gives says what ran on what.
  const note = "sample" in on && on.sample.length < n
    ? `${_list(ordered)} use a seeded random subsample of ${on.sample.length} of the ${n} ` +
      `values (drawn by ${on.drawnBy}); the moments, ${fromShape.join(", ")}, the QQ plot and ` +
      `the histogram use all ${n}`
    : undefined;
  const onSample = (run: (x: Float64Array) => TestResult) => (): TestResult => {
    const r = run(sample!);
    return note ? Object.freeze({ ...r, warnings: Object.freeze([note, ...r.warnings]) }) : r;
  };

  let primary: TestResult;
  if (every && n <= SHAPIRO_WILK_MAX_N) primary = first.runPrepared(every);
  else if (every) {
    // Every value is at hand, but Shapiro–Wilk's p-value is calibrated only up to 5000 of them.
    const sub = first.run(sample!);
    primary = Object.freeze({
      ...sub,
      method: `${sub.method}, on a seeded random subsample of ${sample!.length} of the ${n} values`,
      warnings: Object.freeze([
        `Shapiro–Wilk's p-value is calibrated for at most ${SHAPIRO_WILK_MAX_N} values, so W and p ` +
        `come from a seeded random subsample of ${sample!.length}; the other tests use all ${n}`,
        ...sub.warnings,
      ]),
    });
  } else primary = onSample(first.run)();
  const subsample: Subsample | null = sample && sample.length < n
    ? Object.freeze({ size: sample.length, seed: on.seed })
    : null;
  const tests: TestOutcome[] = [
    Object.freeze({ test: first.name, result: primary }),
    ...others.map((t) =>
      _runTest(
        t.name,
        t.fromShape
          ? () => t.fromShape!(n, shape)
          : every
          ? () => t.runPrepared(every)
          : onSample(t.run),
      )
    ),
  ];

  const qqOptions = options.rowLabel
    ? { ...options.qq, rows: undefined }
    : origin.rows
    ? { ...options.qq, rows: origin.rows }
    : { ...options.qq };
  const own = _qqBuild(
    n,
    shape.mean,
    shape.sd,
    qqOptions,
    answers.orderStatistics,
    options.rowLabel,
  );
  const qq = options.envelope ? withEnvelope(own, options.envelope(own.rank)) : own;
  const histogram = answers.histogram();
  const reading = readShape({
    n,
    moments: m,
    primary,
    dagostino: tests.find((t) => t.test === "D'Agostino–Pearson")?.result as
      | DagostinoPearsonResult
      | undefined,
    qq,
    values: every ? every.values : sample!,
    sortedSample: every ? every.sorted : sample!,
    // A sample from a query engine comes without the rows it was drawn from.
    rows: every ? origin.rows : new Int32Array(sample!.length).fill(-1),
    rowLabel: options.rowLabel,
    step: options.step,
    subsample,
    subsampleSorted: subsample ? sample : undefined,
  });
  const notes = origin.notes ?? [];
  return Object.freeze({
    // Rows are not kept, and no notes key when there are none, so that analyses
    // compare equal however made (an origin from a query source carries neither).
    origin: Object.freeze(
      every
        ? { ...origin, rows: undefined, notes: undefined, ...(notes.length ? { notes } : {}) }
        : { ...origin },
    ),
    n,
    moments: m,
    primary,
    subsample,
    tests: Object.freeze(tests),
    qq,
    histogram,
    reading: notes.length
      ? Object.freeze({ ...reading, points: Object.freeze([...notes, ...reading.points]) })
      : reading,
  });
}

/**
 * The QQ data with another envelope at the same ranks (e.g. the simulated
 * envelope of studentised residuals), its exits counted again.
 *
 * @example
 * ```ts
 * import { withEnvelope } from "./screening.ts";
 * import { qqData } from "@plumbline/plumbline";
 * const q = withEnvelope(qqData([1, 2, 3, 4, 9]), { lower: [0, 0, 0, 0, 0], upper: [5, 5, 5, 5, 5], method: "fixed" });
 * if (q.outsideCount !== 1 || q.envelopeMethod !== "fixed") throw new Error("envelope");
 * ```
 */
export function withEnvelope(
  qq: Analysis["qq"],
  env: { readonly lower: readonly number[]; readonly upper: readonly number[]; method: string },
): Analysis["qq"] {
  const outside = qq.value.map((v, k): -1 | 0 | 1 =>
    v < env.lower[k] ? -1 : v > env.upper[k] ? 1 : 0
  );
  return Object.freeze({
    ...qq,
    envelope: "pointwise" as const,
    envelopeMethod: env.method,
    lower: Object.freeze([...env.lower]),
    upper: Object.freeze([...env.upper]),
    outside: Object.freeze(outside),
    outsideCount: outside.filter((o) => o !== 0).length,
  });
}
