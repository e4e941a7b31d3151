/**
 * The order statistics and histogram counts of a screening, read two ways
 * once the cell pass is done. Private to `lib/scan`.
 *
 * - Exact: one more pass gathers the values of the few cells that hold a
 *   wanted rank or straddle a bin edge, and reads them off sorted blocks
 *   (`select.ts`). At 1e8 values this pass costs about half as much as the
 *   cell pass itself.
 * - From the cells: no further pass. A rank's value is placed inside its
 *   cell as if the cell's values were spread evenly over it, and a bin edge
 *   that cuts a cell takes the cell's share on each side in proportion.
 *   Each QQ value is then within its cell's width of the exact order
 *   statistic, and each bin count within the count of the cells its edges
 *   cut; both bounds are computed and stated. Cells that hold one value only
 *   (found while splitting crowded cells) and the smallest and largest
 *   values stay exact.
 *
 * Both also find the largest share of the values at one value, for the
 * histogram's pile-up rule (`stats/histogram_bins.ts`).
 *
 * @module
 */
import { _quantile7 } from "../stats/histogram_data.ts";
import { type _HistogramLayout, _histogramLayout } from "../stats/histogram_layout.ts";
import type { _Shape } from "../stats/moments.ts";
import { type Cell, locateRanks } from "./cells.ts";
import { seriesHolds } from "./log_profile.ts";
import { type CellSummary, type ColumnQuery, gather } from "./select.ts";
import { histogramSql } from "./sql.ts";

/** Above this many values, a screening reads from the cells alone by default. */
export const EXACT_MAX_VALUES = 10_000_000;

/** How exact a scanned screening's QQ values, bin counts, skewness and kurtosis are. */
export interface ScanPrecision {
  /** Every QQ value, bin count and moment is exact (computed from every value). */
  readonly exact: boolean;
  /** The largest possible distance between a QQ value and the exact order statistic (0 when exact). */
  readonly maxValueError: number;
  /** The largest possible difference between a bin count and the exact count (0 when exact). */
  readonly maxCountError: number;
  /** The largest possible difference between the skewness g1 and the exact one (0 when exact). */
  readonly maxSkewnessError: number;
  /** The largest possible difference between the excess kurtosis g2 and the exact one (0 when exact). */
  readonly maxKurtosisError: number;
  /** Cells the values were counted in, over all grids. */
  readonly cells: number;
}

/** How exact the QQ values and bin counts are (the moments' part is the screening's). */
export type _OrderPrecision = Pick<
  ScanPrecision,
  "exact" | "maxValueError" | "maxCountError" | "cells"
>;

/** What a reader hands back to the screening. */
export interface _OrderRead {
  /** The value at each wanted rank. */
  readonly valueAt: ReadonlyMap<number, number>;
  /** The histogram's bins. */
  readonly layout: _HistogramLayout;
  /** The count in each bin. */
  readonly binCounts: readonly number[];
  /** The raw values of the cells the log series cannot sum (when the logs are wanted). */
  readonly raw: Float64Array;
  /** How exact the values and counts are. */
  readonly read: _OrderPrecision;
}

/** What both readers take. */
export interface _ReadInput {
  readonly q: ColumnQuery;
  readonly summary: CellSummary;
  /** Wanted 1-based ranks, ascending (the QQ ranks and the quartiles' neighbours). */
  readonly ranks: readonly number[];
  readonly n: number;
  readonly lo: number;
  readonly hi: number;
  readonly shape: _Shape;
  /** Whether the Box–Cox log series is wanted (positive values, λ asked for). */
  readonly logs: boolean;
  /** The measurement step every value sits on (`null`: none), for bins at half-steps. */
  readonly step: number | null;
}

/** The type-7 interquartile range (Hyndman & Fan 1996) from the values at the wanted ranks. */
function _iqr(n: number, valueAt: ReadonlyMap<number, number>): number {
  const at = (r: number) => valueAt.get(r)!;
  return _quantile7(at, n, 0.75) - _quantile7(at, n, 0.25);
}

/** The most values any cell holding one value only has. */
function _singleValued(cells: readonly Cell[]): number {
  let most = 0;
  for (const c of cells) if (c.value !== undefined && c.n > most) most = c.n;
  return most;
}

/** The bins for the final quartiles and pile-up share. */
function _layout(x: _ReadInput, iqr: () => number, tie: () => number): _HistogramLayout {
  return _histogramLayout(x.n, x.lo, x.hi, x.shape.sd, {}, iqr, x.step, tie);
}

/** Exact order statistics and counts: one gather pass (and a counting pass when the bins move). */
export async function _readExact(x: _ReadInput): Promise<_OrderRead> {
  const { q, summary, ranks, n, lo, hi, shape } = x;
  const cells = summary.cells;
  const quart = _quartileRanks(n);
  // The histogram's bins need the IQR, known exactly only after the gather;
  // but the cells holding the quartile ranks bound it, and at large n the
  // bin cap decides alone, so the bins are usually known now and counted in
  // the same gather pass.
  const places = locateRanks(cells, quart);
  const span = (j: number) => cells[places[j].cell];
  const iqrMin = span(2).lo - span(1).hi;
  const iqrMax = span(3).hi - span(0).lo;
  const layoutAt = (iqr: number) => _histogramLayout(n, lo, hi, shape.sd, {}, () => iqr, x.step);
  const [wide, narrow] = [layoutAt(iqrMax), layoutAt(Math.max(iqrMin, 0))];
  const known = iqrMin > 0 && wide.k === narrow.k && wide.rule === narrow.rule;
  const edges = known ? wide.edges.slice(1, -1) : [];
  const got = await gather(q, summary, ranks, x.logs, edges);
  const valueAt = new Map<number, number>();
  ranks.forEach((r, i) => valueAt.set(r, got.values[i]));
  const tie = Math.max(_singleValued(cells), got.longestTie) / n;
  const layout = _layout(x, () => _iqr(n, valueAt), () => tie);
  let binCounts: number[];
  // The guess holds unless the pile-up rule or the exact IQR moved the bins.
  if (
    known && layout.edges.length === wide.edges.length &&
    layout.edges.every((e, j) => e === wide.edges[j])
  ) {
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
  return {
    valueAt,
    layout,
    binCounts,
    raw: got.raw,
    read: Object.freeze({ exact: true, maxValueError: 0, maxCountError: 0, cells: cells.length }),
  };
}

/** The ranks next to the type-7 quartiles, for the histogram's IQR. */
export function _quartileRanks(n: number): number[] {
  return [0.25, 0.75].flatMap((p) => {
    const h = (n - 1) * p;
    return [Math.floor(h) + 1, Math.min(n, Math.floor(h) + 2)];
  });
}

/**
 * Order statistics and counts from the cells alone (no pass over the
 * values, unless the log series needs the raw values of some cells).
 */
export async function _readFromCells(x: _ReadInput): Promise<_OrderRead> {
  const { q, summary, ranks, n, lo, hi } = x;
  const cells = summary.cells;
  const valueAt = new Map<number, number>();
  let maxValueError = 0;
  locateRanks(cells, ranks).forEach((p, i) => {
    const r = ranks[i];
    const c = cells[p.cell];
    if (r === 1) valueAt.set(r, lo);
    else if (r === n) valueAt.set(r, hi);
    else if (c.value !== undefined) valueAt.set(r, c.value);
    else {
      // Spread evenly: the j-th of m values at the middle of its m-th share of the cell.
      const v = c.lo + ((p.within - 0.5) / c.n) * (c.hi - c.lo);
      valueAt.set(r, Math.min(hi, Math.max(lo, v)));
      maxValueError = Math.max(maxValueError, c.hi - c.lo);
    }
  });
  const layout = _layout(x, () => _iqr(n, valueAt), () => _singleValued(cells) / n);
  // Values below each interior edge: whole cells below it, and a share of the cell it cuts.
  const edges = layout.edges.slice(1, -1);
  const below: number[] = [];
  // How far each edge's count below may be off: the count of the cell it cuts.
  const edgeError: number[] = [];
  let i = 0;
  let cum = 0;
  for (const e of edges) {
    while (i < cells.length && cells[i].hi < e) cum += cells[i++].n;
    let part = 0;
    let off = 0;
    const c = cells[i];
    if (c !== undefined && c.lo < e) {
      if (c.value !== undefined) part = c.value < e ? c.n : 0;
      else {
        part = Math.round((c.n * (e - c.lo)) / (c.hi - c.lo));
        off = Math.max(part, c.n - part);
      }
    }
    below.push(cum + part);
    edgeError.push(off);
  }
  // A bin's count is off by at most what its two edges are.
  const errs = [0, ...edgeError, 0];
  let maxCountError = 0;
  for (let j = 0; j + 1 < errs.length; j++) {
    maxCountError = Math.max(maxCountError, errs[j] + errs[j + 1]);
  }
  const all = [0, ...below, n];
  const binCounts = Array.from({ length: layout.k }, (_, j) => all[j + 1] - all[j]);
  let raw: Float64Array = new Float64Array(0);
  if (x.logs && cells.some((c) => !seriesHolds(c))) {
    raw = (await gather(q, summary, [], true, [])).raw;
  }
  return {
    valueAt,
    layout,
    binCounts,
    raw,
    read: Object.freeze({ exact: false, maxValueError, maxCountError, cells: cells.length }),
  };
}
