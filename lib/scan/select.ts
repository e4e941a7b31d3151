/**
 * The passes of a scan over one column's finite values: cells, refined
 * where a cell is too coarse, then one gather of the exact order statistics
 * at chosen ranks (and of the raw values of cells the log series cannot
 * sum). Private to `lib/scan`.
 *
 * Exact order statistics without a full sort: the cell pass counts every
 * cell, so the cell holding rank r, and r's rank inside it, are known; the
 * gather pass keeps only the values of those cells and sorts them. A cell
 * holding more than `PICK_MAX` values (a spike, or a far outlier that
 * stretched the grid) is first split by another cell pass over its own
 * range; a cell whose smallest and largest values are equal needs no
 * gather at all. This is selection by bucketing (Floyd & Rivest 1975,
 * Communications of the ACM 18:165–172), done with GROUP BY and a window.
 *
 * @module
 */
import type { _Engine } from "./engine.ts";
import { type Cell, gridFor, higherSums, locateRanks, oneValueCell } from "./cells.ts";
import { seriesHolds } from "./log_profile.ts";
import { type CellGrid, cellsSql, gatherSql, probeSql, type Values } from "./sql.ts";
import { sortFloat64 } from "../numeric/sort.ts";

/** Cells per cell pass, about. */
export const CELLS = 32768;
/** Largest cell gathered whole for its order statistics. */
const PICK_MAX = 1_000_000;
/** Largest number of values fetched raw for the log series. */
const RAW_MAX = 500_000;
/** At most this many refining passes. */
const REFINE_PASSES = 6;

/** What a scan of one column reads from, and the engine that reads it. */
export interface ColumnQuery extends Values {
  readonly engine: _Engine;
  /** The source and column, in words, for messages. */
  readonly subject: string;
  /** Limits on cell sizes (tests lower them to reach every path on small data). */
  readonly limits?: { readonly pickMax: number; readonly rawMax: number };
}

/** The cells of a column after refinement, and the grids they come from. */
export interface CellSummary {
  readonly cells: readonly Cell[];
  readonly grids: readonly CellGrid[];
  /** Cell passes run. */
  readonly passes: number;
}

async function _cellPass(
  q: ColumnQuery,
  grids: CellGrid[],
  a: number,
  b: number,
  step: string,
  sums: 2 | 4,
): Promise<Cell[]> {
  const { lo, w } = gridFor(a, b, CELLS);
  const grid: CellGrid = { a, b, lo, w };
  const g = grids.length;
  grids.push(grid);
  const rows = await q.engine.rows(cellsSql(q, grid, g === 0, sums), step, q.subject);
  return rows.map((r) => {
    const key = r[0] as number;
    // Bounds from the grid: floor((v − lo)/w) = key puts v in [lo + key·w, lo + (key + 1)·w)
    // up to the rounding of v − lo, which the margin covers.
    const left = lo + key * w;
    const right = left + w;
    const margin = 4 * Number.EPSILON * Math.max(Math.abs(left), Math.abs(right), Math.abs(lo));
    // The engine sums offsets in cell widths; w is a power of two, so scaling back is exact.
    const w2 = w * w;
    const [s1, s2] = [r[2] as number, r[3] as number];
    // Without Σe³ and Σe⁴ from the engine, their estimates and bounds (in cell widths).
    const est = sums === 2 ? higherSums(r[1] as number, s1, s2) : undefined;
    return Object.freeze({
      n: r[1] as number,
      lo: Math.max(a, left - margin),
      hi: Math.min(b, right + margin),
      centre: lo + (key + 0.5) * w,
      s: Object.freeze(
        [
          s1 * w,
          s2 * w2,
          (est ? est.s3 : r[4] as number) * w2 * w,
          (est ? est.s4 : r[5] as number) * w2 * w2,
        ] as [number, number, number, number],
      ),
      ...(est
        ? { slack: Object.freeze([est.slack3 * w2 * w, est.slack4 * w2 * w2] as const) }
        : {}),
      grid: g,
      key,
    });
  });
}

/** The smallest and largest value of some cells, by one filtered query. */
async function _probe(
  q: ColumnQuery,
  grids: readonly CellGrid[],
  cells: readonly Cell[],
  which: readonly number[],
): Promise<Map<number, [number, number]>> {
  const ids = which.map((i) => ({ grid: cells[i].grid, key: cells[i].key }));
  const rows = await q.engine.rows(
    probeSql(q, grids, ids),
    "finding crowded cells' ranges",
    q.subject,
  );
  const out = new Map<number, [number, number]>();
  for (const [id, lo, hi] of rows as [number, number, number][]) out.set(which[id], [lo, hi]);
  return out;
}

/**
 * Summarise the values in [lo, hi] by cells, then split cells until every
 * wanted rank sits in a cell of at most `PICK_MAX` values, (when `logs`)
 * the cells the log series cannot sum hold at most `RAW_MAX` values, and
 * no cell of more than one value holds `crowded` values or more (so that a
 * value piled up that often is found without a gather). `sums`: 2 when the
 * cell passes leave out Σe³ and Σe⁴ (estimated within bounds, `cells.ts`).
 */
export async function summarise(
  q: ColumnQuery,
  lo: number,
  hi: number,
  ranks: readonly number[],
  logs: boolean,
  crowded = Infinity,
  sums: 2 | 4 = 4,
): Promise<CellSummary> {
  const grids: CellGrid[] = [];
  let cells = await _cellPass(q, grids, lo, hi, "summing the values by cells", sums);
  let passes = 1;
  for (let round = 0; round < REFINE_PASSES; round++) {
    const runs: [number, number][] = [];
    cells.forEach((c, i) => {
      if (c.n >= crowded && c.value === undefined) runs.push([i, i]);
    });
    for (const p of locateRanks(cells, ranks)) {
      const c = cells[p.cell];
      if (
        c.n > (q.limits?.pickMax ?? PICK_MAX) && c.value === undefined &&
        !runs.some(([i]) => i === p.cell)
      ) {
        runs.push([p.cell, p.cell]);
      }
    }
    if (logs) {
      let first = -1;
      let last = -1;
      let count = 0;
      cells.forEach((c, i) => {
        if (!seriesHolds(c)) {
          if (first < 0) first = i;
          last = i;
          count += c.n;
        }
      });
      if (count > (q.limits?.rawMax ?? RAW_MAX)) runs.push([first, last]);
    }
    if (runs.length === 0) break;
    runs.sort((x, y) => x[0] - y[0]);
    const merged: [number, number][] = [];
    for (const r of runs) {
      const top = merged[merged.length - 1];
      if (top && r[0] <= top[1] + 1) top[1] = Math.max(top[1], r[1]);
      else merged.push([r[0], r[1]]);
    }
    // The exact ranges of the runs' end cells, so that a finer grid holds their values only.
    const ends = await _probe(q, grids, cells, [...new Set(merged.flat())]);
    passes++;
    const next: Cell[] = [];
    let at = 0;
    for (const [i, j] of merged) {
      for (let k = at; k < i; k++) next.push(cells[k]);
      const a = ends.get(i)![0];
      const b = ends.get(j)![1];
      if (i === j && a === b) next.push(oneValueCell(cells[i], a));
      else {
        for (const c of await _cellPass(q, grids, a, b, "splitting crowded cells", sums)) {
          next.push(c);
        }
        passes++;
      }
      at = j + 1;
    }
    for (let k = at; k < cells.length; k++) next.push(cells[k]);
    cells = next;
  }
  return Object.freeze({ cells: Object.freeze(cells), grids: Object.freeze(grids), passes });
}

/** The values at the wanted ranks, the raw values the log series needs, and edge counts. */
export interface Gathered {
  /** Value at each wanted rank, in the order asked. */
  readonly values: Float64Array;
  /** The raw values of the cells the log series cannot sum (any order). */
  readonly raw: Float64Array;
  /** For each edge asked for, how many values lie below it. */
  readonly below: Float64Array;
  /** The most values at one value among the values gathered (0 when none were). */
  readonly longestTie: number;
}

/**
 * Gather the order statistics at `ranks` (ascending, 1-based), the raw
 * values of the cells the log series cannot sum (when `logs`), and the
 * number of values below each of `edges` (ascending), in one pass.
 */
export async function gather(
  q: ColumnQuery,
  summary: CellSummary,
  ranks: readonly number[],
  logs: boolean,
  edges: readonly number[],
): Promise<Gathered> {
  const { cells, grids } = summary;
  const places = locateRanks(cells, ranks);
  const chosen = new Set<number>();
  const values = new Float64Array(ranks.length);
  places.forEach((p, k) => {
    const c = cells[p.cell];
    if (c.value !== undefined) values[k] = c.value;
    else chosen.add(p.cell);
  });
  const rawCells = logs ? cells.flatMap((c, i) => seriesHolds(c) ? [] : [i]) : [];
  for (const i of rawCells) chosen.add(i);
  // Edges: cells wholly below count in full; a cell that straddles an edge is read.
  const below = new Float64Array(edges.length);
  const straddle: { cell: number; edge: number; id: number }[] = [];
  let i = 0;
  let cum = 0;
  edges.forEach((e, id) => {
    while (i < cells.length && cells[i].hi < e) cum += cells[i++].n;
    below[id] = cum;
    if (i < cells.length && cells[i].lo < e) {
      straddle.push({ cell: i, edge: e, id });
      chosen.add(i);
    }
  });
  if (chosen.size === 0) {
    return Object.freeze({ values, raw: new Float64Array(0), below, longestTie: 0 });
  }
  // The chosen cells' values, sorted, fall into one block per cell (cells are
  // contiguous ranges), in the order of the cells.
  const order = [...chosen].sort((x, y) => x - y);
  const start = new Map<number, number>();
  let total = 0;
  for (const c of order) {
    start.set(c, total);
    total += cells[c].n;
  }
  const ids = order.map((c) => ({ grid: cells[c].grid, key: cells[c].key }));
  const sel = sortFloat64(
    await q.engine.doubles(
      gatherSql(q, grids, ids),
      "gathering order statistics",
      q.subject,
      total,
    ),
  );
  places.forEach((p, k) => {
    const c = p.cell;
    if (cells[c].value === undefined) values[k] = sel[start.get(c)! + p.within - 1];
  });
  const raw = new Float64Array(rawCells.reduce((t, c) => t + cells[c].n, 0));
  let at = 0;
  for (const c of rawCells) {
    raw.set(sel.subarray(start.get(c)!, start.get(c)! + cells[c].n), at);
    at += cells[c].n;
  }
  for (const s of straddle) {
    const from = start.get(s.cell)!;
    let lo = from;
    let hi = from + cells[s.cell].n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (sel[mid] < s.edge) lo = mid + 1;
      else hi = mid;
    }
    below[s.id] += lo - from;
  }
  // A value maps to one cell, and each chosen cell is gathered whole, so a run here is exact.
  let longestTie = sel.length > 0 ? 1 : 0;
  for (let j = 1, run = 1; j < sel.length; j++) {
    run = sel[j] === sel[j - 1] ? run + 1 : 1;
    if (run > longestTie) longestTie = run;
  }
  return Object.freeze({ values, raw, below, longestTie });
}
