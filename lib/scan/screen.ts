/**
 * The full screening of one column through the SQL engine: counts, moments,
 * K² and Jarque–Bera from the cells; the order-statistic tests on the seeded
 * sample; the QQ plot from exact order statistics; the histogram; the
 * Box–Cox λ with its interval; the reading. Private to `lib/scan`.
 *
 * @module
 */
import type { Analysis, Subsample, TestOutcome } from "../results/analysis.ts";
import { _runTest } from "../plumb/analysis.ts";
import { readShape } from "../plumb/reading.ts";
import { _fitLambda } from "../reexpress/_fit.ts";
import { _boxCoxProfile } from "../reexpress/_profile.ts";
import type { LambdaFit } from "../reexpress/lambda_fit.ts";
import { andersonDarling } from "../stats/anderson_darling.ts";
import { _dagostinoPearsonOf, type DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import { _histogramFinish, _histogramLayout } from "../stats/histogram_layout.ts";
import { _jarqueBeraOf } from "../stats/jarque_bera.ts";
import { lilliefors } from "../stats/lilliefors.ts";
import { _momentsOf, type _Shape } from "../stats/moments.ts";
import { _qqBuild, type QqOptions } from "../stats/qq_data.ts";
import { thinRanks } from "../numeric/thin_ranks.ts";
import type { TestResult } from "../stats/result.ts";
import { shapiroFrancia } from "../stats/shapiro_francia.ts";
import { shapiroWilk } from "../stats/shapiro_wilk.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { cellShape, locateRanks } from "./cells.ts";
import { cellBoxCoxProfile, seriesHolds } from "./log_profile.ts";
import { type ColumnQuery, gather, summarise } from "./select.ts";
import { histogramSql, sampleSql } from "./sql.ts";
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

/** The note every sampled result carries. */
function _sampleNote(size: number, n: number): string {
  return size < n
    ? `Shapiro–Wilk, Shapiro–Francia, Anderson–Darling and Lilliefors use a seeded random ` +
      `subsample of ${size} of the ${n} values (drawn by the SQL engine); the moments, ` +
      `D'Agostino–Pearson, Jarque–Bera, the QQ plot and the histogram use all ${n}`
    : `every test uses all ${n} values`;
}

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
  const quart = [0.25, 0.75].flatMap((p) => {
    const h = (n - 1) * p;
    return [Math.floor(h) + 1, Math.min(n, Math.floor(h) + 2)];
  });
  const ranks = [...new Set([...kept, ...quart])].sort((a, b) => a - b);
  const logs = options.boxCox && lo > 0;
  const summary = await summarise(q, lo, hi, ranks, logs);
  const shape: _Shape = cellShape(summary.cells);
  // The histogram's bins need the IQR, known exactly only after the gather;
  // but the cells holding the quartile ranks bound it, and at large n the
  // bin cap decides alone, so the bins are usually known now and counted in
  // the same gather pass.
  const places = locateRanks(summary.cells, quart);
  const span = (j: number) => summary.cells[places[j].cell];
  const iqrMin = span(2).lo - span(1).hi;
  const iqrMax = span(3).hi - span(0).lo;
  const layoutAt = (iqr: number) => _histogramLayout(n, lo, hi, shape.sd, {}, () => iqr);
  const [wide, narrow] = [layoutAt(iqrMax), layoutAt(Math.max(iqrMin, 0))];
  const known = iqrMin > 0 && wide.k === narrow.k && wide.rule === narrow.rule;
  const edges = known ? wide.edges.slice(1, -1) : [];
  const got = await gather(q, summary, ranks, logs, edges);
  const valueAt = new Map<number, number>();
  ranks.forEach((r, i) => valueAt.set(r, got.values[i]));

  const m = _momentsOf(n, shape);
  const note = _sampleNote(sample.length, n);
  const sampled = (f: (x: Float64Array) => TestResult) => (): TestResult => {
    const r = f(sorted);
    return sample.length < n
      ? Object.freeze({ ...r, warnings: Object.freeze([note, ...r.warnings]) })
      : r;
  };
  const primary = sampled(shapiroWilk)();
  const tests: TestOutcome[] = [
    Object.freeze({ test: "Shapiro–Wilk", result: primary }),
    _runTest("Shapiro–Francia", sampled(shapiroFrancia)),
    _runTest("Anderson–Darling", sampled(andersonDarling)),
    _runTest("Lilliefors", sampled(lilliefors)),
    _runTest("D'Agostino–Pearson", () => _dagostinoPearsonOf(n, shape)),
    _runTest("Jarque–Bera", () => _jarqueBeraOf(n, shape)),
  ];
  const qq = _qqBuild(n, shape.mean, shape.sd, options.qq, (rs) => ({
    value: Float64Array.from(rs, (r) => valueAt.get(r)!),
    row: new Int32Array(rs.length).fill(-1),
  }));
  const q7 = (p: number) => {
    const h = (n - 1) * p;
    const a = valueAt.get(Math.floor(h) + 1)!;
    const b = valueAt.get(Math.min(n, Math.floor(h) + 2))!;
    return h === Math.floor(h) ? a : a + (h - Math.floor(h)) * (b - a);
  };
  const layout = _histogramLayout(n, lo, hi, shape.sd, {}, () => q7(0.75) - q7(0.25));
  let binCounts: number[];
  if (known) {
    const below = [0, ...got.below, n];
    binCounts = Array.from({ length: layout.k }, (_, j) => below[j + 1] - below[j]);
  } else {
    const binRows = await q.engine.rows(
      histogramSql(q, lo, layout.width, layout.k),
      "counting the histogram",
      q.subject,
    );
    binCounts = new Array(layout.k).fill(0);
    for (const [b, c] of binRows as [number, number][]) binCounts[b] = c;
  }
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
    const profile = cellBoxCoxProfile(summary.cells.filter(seriesHolds), got.raw);
    boxCox = _fitLambda(profile, _boxCoxProfile(sorted), {}, "a Box–Cox fit");
    fitSeconds = +(q.engine.elapsed() - t0).toFixed(3);
  }
  const k2 = tests[4].result as DagostinoPearsonResult | undefined;
  const subsample: Subsample | null = sample.length < n
    ? Object.freeze({ size: sample.length, seed: options.seed })
    : null;
  const reading = readShape({
    n,
    moments: m,
    primary,
    dagostino: k2,
    qq,
    values: sorted,
    sortedSample: sorted,
    // The engine hands over values without their source rows.
    rows: new Int32Array(sorted.length).fill(-1),
    subsample,
    subsampleSorted: subsample ? sorted : undefined,
  });
  const analysis: ScanAnalysis = Object.freeze({
    origin: Object.freeze({
      label: label.label,
      column: label.column,
      ...(label.group === undefined ? {} : { group: label.group }),
      ...(label.transform === undefined ? {} : { transform: label.transform }),
      missingDropped: counts.missing,
      textDropped: counts.text,
    }),
    n,
    moments: m,
    primary,
    subsample,
    tests: Object.freeze(tests),
    qq,
    histogram,
    reading,
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
    passes: Object.freeze(q.engine.log()),
    fitSeconds,
  });
  return { analysis, sample: sorted, range: [lo, hi] };
}
