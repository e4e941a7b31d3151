/**
 * The full screening of one column through the SQL engine: counts, moments,
 * K² and Jarque–Bera from the cells; the order-statistic tests on the seeded
 * sample; the QQ plot from exact order statistics; the histogram; the
 * Box–Cox λ with its interval; the reading. The passes here answer the
 * aggregates; the tests, QQ data, reading and `Analysis` are put together by
 * `screenFromAnswers` (`lib/plumb/screening.ts`), the same code as in
 * memory. Private to `lib/scan`.
 *
 * @module
 */
import type { Analysis } from "../results/analysis.ts";
import { screenFromAnswers } from "../plumb/screening.ts";
import { _fitLambda } from "../reexpress/_fit.ts";
import { _boxCoxProfile } from "../reexpress/_profile.ts";
import type { LambdaFit } from "../reexpress/lambda_fit.ts";
import { _histogramFinish } from "../stats/histogram_layout.ts";
import type { _Shape } from "../stats/moments.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { thinRanks } from "../numeric/thin_ranks.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { cellShape, cellShapeSlack } from "./cells.ts";
import { cellBoxCoxProfile, seriesHolds } from "./log_profile.ts";
import { type ColumnQuery, summarise } from "./select.ts";
import { offGridSql, sampleSql } from "./sql.ts";
import { _measurementStepSorted, _refine, _stepTolerance } from "../stats/measurement_step.ts";
import { PILE_UP_SHARE } from "../stats/histogram_bins.ts";
import { formatCompact, formatCount } from "../results/format.ts";
import {
  _quartileRanks,
  _readExact,
  _readFromCells,
  EXACT_MAX_VALUES,
  type ScanPrecision,
} from "./order_read.ts";
import type { Pass } from "./engine.ts";

/** The sample the order-statistic tests used. */
export interface ScanSample {
  /** Values drawn. */
  readonly size: number;
  /** The seed; the same seed gives the same sample. */
  readonly seed: number;
  /** How it was drawn, in words. */
  readonly method: string;
}

/** One column screened through the SQL engine: the in-memory analysis's fields, and more. */
export interface ScanAnalysis extends Analysis {
  /** The sample behind Shapiro–Wilk, Shapiro–Francia, Anderson–Darling and Lilliefors. */
  readonly sample: ScanSample;
  /** Box–Cox λ with its interval (positive data), or why it was not fitted. */
  readonly boxCox: LambdaFit | { readonly skipped: string };
  /** Finite numbers analysed, rows, and what was left out. */
  readonly counts: {
    readonly rows: number;
    readonly missing: number;
    readonly text: number;
    readonly nonFinite: number;
  };
  /**
   * Whether the QQ values, histogram counts, skewness and kurtosis are
   * exact, or read from the cells of the one pass, and then how far off
   * they can be.
   */
  readonly precision: ScanPrecision;
  /** Every query run, in order: what it computes, its SQL text and its seconds. */
  readonly passes: readonly Pass[];
  /** Seconds the Box–Cox fit took in JavaScript (NaN when not fitted). */
  readonly fitSeconds: number;
}

/** Options of one screening. */
export interface ScreenOptions {
  readonly sampleSize: number;
  readonly seed: number;
  readonly qq: QqOptions;
  readonly boxCox: boolean;
  /**
   * Exact QQ values, bin counts, skewness and kurtosis (one more pass, and
   * two more sums in the cell pass), or read from the cells with stated
   * errors; by default exact up to
   * {@linkcode EXACT_MAX_VALUES} values.
   */
  readonly exact?: boolean;
}

/** What the count pass found. */
export interface ColumnCounts {
  readonly rows: number;
  readonly missing: number;
  readonly text: number;
  readonly nonFinite: number;
  readonly n: number;
  readonly lo: number;
  readonly hi: number;
}

/** What the reading says when the screening comes from the cells alone. */
function _cellsNote(
  p: ScanPrecision,
  n: number,
  m: { sd: number; seG1: number; seG2: number },
): string {
  const off = p.maxValueError;
  const sd = m.sd;
  // Bounds far below the standard errors change nothing a reader weighs; otherwise say so.
  const small = p.maxSkewnessError < 0.01 * m.seG1 && p.maxKurtosisError < 0.01 * m.seG2;
  const g = (x: number) => (x < 1e-15 ? "1e−15" : formatCompact(x, 1));
  return `The QQ values, bin counts, skewness and kurtosis come from ${formatCount(p.cells)} ` +
    `cells counted in one pass over the ${formatCount(n)} values, not from a sort: each QQ value ` +
    `within ${formatCompact(off, 2)} (${formatCompact(off / sd, 2)} sd) of the exact order ` +
    `statistic, each bin count within ${formatCount(p.maxCountError)}, the skewness within ` +
    `${g(p.maxSkewnessError)} and the kurtosis within ${g(p.maxKurtosisError)}` +
    (small
      ? ", far inside their sampling error"
      : "; weigh these bounds against the standard errors") +
    ` (the exact screening: scan(…, { exact: true }))`;
}

/**
 * The measurement step every value sits on, or `null`: found on the seeded
 * sample as in memory (`stats/measurement_step.ts`), refined over the whole
 * range, then checked over every value by one counting pass (run only when
 * the sample shows a step, so continuous data pay nothing).
 */
async function _stepOf(
  q: ColumnQuery,
  sorted: Float64Array,
  n: number,
  lo: number,
  hi: number,
): Promise<number | null> {
  if (sorted.length < 2 || sorted[0] === sorted[sorted.length - 1]) return null;
  let values = sorted;
  // A few values off the sample's grid may sit on a finer one (a reading to 0.01 among
  // readings to 0.1): they join the sample and the step is sought again, twice at most.
  for (let round = 0; round < 3; round++) {
    const h0 = _measurementStepSorted(values).step;
    if (h0 === null) return null;
    const h = _refine(h0, hi - lo);
    if (sorted.length === n) return h;
    const tol = _stepTolerance(h, Math.max(Math.abs(lo), Math.abs(hi)));
    const more = await q.engine.doubles(
      offGridSql(q, lo, h, tol, _OFF_GRID_MAX + 1),
      "checking the measurement step",
      q.subject,
    );
    if (more.length === 0) return h;
    if (more.length > _OFF_GRID_MAX || round === 2) return null;
    const joined = new Float64Array(values.length + more.length);
    joined.set(values);
    joined.set(more, values.length);
    values = sortFloat64(joined);
  }
  return null;
}

/** At most this many values off a step found on the sample are read to seek a finer one. */
const _OFF_GRID_MAX = 10_000;

/** A screening and the sorted seeded sample its order-statistic tests used. */
export interface Screened {
  readonly analysis: ScanAnalysis;
  readonly sample: Float64Array;
  /** The smallest and largest finite value. */
  readonly range: readonly [number, number];
}

/** Screen the column described by `q` whose counts are known. */
export async function screenColumn(
  q: ColumnQuery,
  counts: ColumnCounts,
  label: { column: string; label: string; group?: string; transform?: string },
  options: ScreenOptions,
): Promise<Screened> {
  const { n, lo, hi } = counts;
  let fitSeconds = NaN;
  const sample = await q.engine.doubles(
    sampleSql(q, options.sampleSize, options.seed),
    "drawing the seeded sample",
    q.subject,
  );
  const sorted = sortFloat64(sample);
  const maxPoints = options.qq.maxPoints ?? 800;
  const tailPoints = options.qq.tailPoints ?? 200;
  const kept = thinRanks(n, maxPoints, tailPoints);
  // Ranks for the type-7 quartiles (Hyndman & Fan 1996), for the histogram's IQR.
  const quart = _quartileRanks(n);
  const ranks = [...new Set([...kept, ...quart])].sort((a, b) => a - b);
  const logs = options.boxCox && lo > 0;
  const exact = options.exact ?? n <= EXACT_MAX_VALUES;
  // Without a gather, a value piled up often enough to change the histogram's
  // rule must be found by splitting its cell.
  const crowded = exact ? Infinity : Math.ceil(PILE_UP_SHARE * n);
  // Without the exact pass, the cells leave out Σe³ and Σe⁴ too (estimated within bounds).
  const summary = await summarise(q, lo, hi, ranks, logs, crowded, exact ? 4 : 2);
  const shape: _Shape = cellShape(summary.cells);
  const slack = cellShapeSlack(summary.cells, shape);
  const step = await _stepOf(q, sorted, n, lo, hi);
  const input = { q, summary, ranks, n, lo, hi, shape, logs, step };
  const { valueAt, layout, binCounts, raw, read } = exact
    ? await _readExact(input)
    : await _readFromCells(input);

  const histogram = _histogramFinish(layout, binCounts, n, shape.mean, shape.sd);

  let boxCox: LambdaFit | { skipped: string };
  if (!options.boxCox) boxCox = { skipped: "Box–Cox was not asked for" };
  else if (!(lo > 0)) {
    boxCox = {
      skipped: `Box–Cox needs positive values; the smallest is ${lo} ` +
        `(shift the data or use Yeo–Johnson)`,
    };
  } else {
    const t0 = q.engine.elapsed();
    const profile = cellBoxCoxProfile(summary.cells.filter(seriesHolds), raw);
    boxCox = _fitLambda(profile, _boxCoxProfile(sorted), {}, "a Box–Cox fit");
    fitSeconds = +(q.engine.elapsed() - t0).toFixed(3);
  }
  const precision: ScanPrecision = Object.freeze({
    ...read,
    maxSkewnessError: slack.g1,
    maxKurtosisError: slack.g2,
  });
  const screened = screenFromAnswers(
    {
      n,
      shape,
      orderStatistics: (rs) => ({
        value: Float64Array.from(rs, (r) => valueAt.get(r)!),
        row: new Int32Array(rs.length).fill(-1),
      }),
      histogram: () => histogram,
      values: { sample: sorted, seed: options.seed, drawnBy: "the SQL engine" },
    },
    {
      label: label.label,
      column: label.column,
      ...(label.group === undefined ? {} : { group: label.group }),
      ...(label.transform === undefined ? {} : { transform: label.transform }),
      missingDropped: counts.missing,
      textDropped: counts.text,
    },
    { qq: options.qq, step },
  );
  // Said last among the reading's points: how the figures were read, not what they show.
  const said = read.exact ? undefined : _cellsNote(precision, n, screened.moments);
  const analysis: ScanAnalysis = Object.freeze({
    ...screened,
    ...(said === undefined ? {} : {
      reading: Object.freeze({
        ...screened.reading,
        points: Object.freeze([...screened.reading.points, said]),
      }),
    }),
    sample: Object.freeze({
      size: sample.length,
      seed: options.seed,
      method: `seeded reservoir sample of ${sample.length} of ${n} values (${q.dialect.name})`,
    }),
    boxCox: Object.freeze(boxCox),
    counts: Object.freeze({
      rows: counts.rows,
      missing: counts.missing,
      text: counts.text,
      nonFinite: counts.nonFinite,
    }),
    precision,
    passes: Object.freeze(q.engine.log()),
    fitSeconds,
  });
  return { analysis, sample: sorted, range: [lo, hi] };
}
