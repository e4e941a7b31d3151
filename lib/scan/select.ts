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
import { type Cell, gridFor, locateRanks } from "./cells.ts";
import { seriesHolds } from "./log_profile.ts";
import { type CellGrid, cellsSql, type Dialect, gatherSql, type ValueRange } from "./sql.ts";

/** Cells per cell pass, about. */
export const CELLS = 32768;
/** Largest cell gathered whole for its order statistics. */
const PICK_MAX = 1_000_000;
/** Largest number of values fetched raw for the log series. */
const RAW_MAX = 500_000;
/** At most this many refining passes. */
const REFINE_PASSES = 6;

/** What a scan of one column reads from. */
export interface ColumnQuery {
  readonly engine: _Engine;
  readonly dialect: Dialect;
  readonly relation: string;
  /** The value expression (see `sql.ts`). */
  readonly v: string;
  /** The source and column, in words, for messages. */
  readonly subject: string;
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
): Promise<Cell[]> {
  const { lo, w } = gridFor(a, b, CELLS);
  const grid: CellGrid = { a, b, lo, w };
  const g = grids.length;
  grids.push(grid);
  const rows = await q.engine.rows(cellsSql(q.dialect, q.relation, q.v, grid), step, q.subject);
  return rows.map((r) => {
    const key = r[0] as number;
    return Object.freeze({
      n: r[1] as number,
      lo: r[2] as number,
      hi: r[3] as number,
      centre: lo + (key + 0.5) * w,
      s: Object.freeze([r[4], r[5], r[6], r[7]] as [number, number, number, number]),
      grid: g,
      key,
    });
  });
}

/**
 * Summarise the values in [lo, hi] by cells, then split cells until every
 * wanted rank sits in a cell of at most `PICK_MAX` values and (when `logs`)
 * the cells the log series cannot sum hold at most `RAW_MAX` values.
 */
export async function summarise(
  q: ColumnQuery,
  lo: number,
  hi: number,
  ranks: readonly number[],
  logs: boolean,
): Promise<CellSummary> {
  const grids: CellGrid[] = [];
  let cells = await _cellPass(q, grids, lo, hi, "summing the values by cells");
  let passes = 1;
  for (let round = 0; round < REFINE_PASSES; round++) {
    const runs: [number, number][] = [];
    for (const p of locateRanks(cells, ranks)) {
      const c = cells[p.cell];
      if (c.n > PICK_MAX && c.lo < c.hi && !runs.some(([i]) => i === p.cell)) {
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
      if (count > RAW_MAX) runs.push([first, last]);
    }
    if (runs.length === 0) break;
    runs.sort((x, y) => x[0] - y[0]);
    const merged: [number, number][] = [];
    for (const r of runs) {
      const top = merged[merged.length - 1];
      if (top && r[0] <= top[1] + 1) top[1] = Math.max(top[1], r[1]);
      else merged.push([r[0], r[1]]);
    }
    const next: Cell[] = [];
    let at = 0;
    for (const [i, j] of merged) {
      next.push(...cells.slice(at, i));
      next.push(...await _cellPass(q, grids, cells[i].lo, cells[j].hi, "splitting crowded cells"));
      passes++;
      at = j + 1;
    }
    next.push(...cells.slice(at));
    cells = next;
  }
  return Object.freeze({ cells: Object.freeze(cells), grids: Object.freeze(grids), passes });
}

/** The values at the wanted ranks, and the raw values of the cells the log series cannot sum. */
export interface Gathered {
  /** Value at each wanted rank, in the order asked. */
  readonly values: Float64Array;
  /** The raw values of the unresolved cells (ascending). */
  readonly raw: Float64Array;
  /** Whether a gather pass ran (false when every wanted cell was a single value). */
  readonly ran: boolean;
}

/** Gather the order statistics at `ranks` (ascending, 1-based) and, when `logs`, the raw values. */
export async function gather(
  q: ColumnQuery,
  summary: CellSummary,
  ranks: readonly number[],
  logs: boolean,
): Promise<Gathered> {
  const { cells, grids } = summary;
  const places = locateRanks(cells, ranks);
  const chosen = new Set<number>();
  const values = new Float64Array(ranks.length);
  places.forEach((p, k) => {
    const c = cells[p.cell];
    if (c.lo === c.hi) values[k] = c.lo;
    else chosen.add(p.cell);
  });
  const raw: ValueRange[] = [];
  if (logs) {
    cells.forEach((c, i) => {
      if (!seriesHolds(c)) {
        chosen.add(i);
        const top = raw[raw.length - 1];
        if (top && i > 0 && !seriesHolds(cells[i - 1])) {
          raw[raw.length - 1] = { lo: top.lo, hi: c.hi };
        } else raw.push({ lo: c.lo, hi: c.hi });
      }
    });
  }
  if (chosen.size === 0) return Object.freeze({ values, raw: new Float64Array(0), ran: false });
  // Rank within the selection = rank − values in unchosen cells below.
  const order = [...chosen].sort((x, y) => x - y);
  const offset = new Map<number, number>();
  let skipped = 0;
  let prev = 0;
  for (const i of order) {
    for (let j = prev; j < i; j++) skipped += cells[j].n;
    offset.set(i, skipped);
    prev = i + 1;
  }
  const wanted: number[] = [];
  const slot = new Map<number, number[]>();
  places.forEach((p, k) => {
    const c = cells[p.cell];
    if (c.lo === c.hi) return;
    const r = ranks[k] - offset.get(p.cell)!;
    if (!slot.has(r)) {
      slot.set(r, []);
      wanted.push(r);
    }
    slot.get(r)!.push(k);
  });
  const byGrid = new Map<number, number[]>();
  for (const i of order) {
    const c = cells[i];
    if (!byGrid.has(c.grid)) byGrid.set(c.grid, []);
    byGrid.get(c.grid)!.push(c.key);
  }
  const choices = [...byGrid].map(([g, keys]) => ({ grid: grids[g], keys }));
  const sql = gatherSql(q.dialect, q.relation, q.v, choices, wanted, raw);
  const rows = await q.engine.rows(sql, "gathering order statistics", q.subject);
  const rawOut: number[] = [];
  const inRaw = (v: number) => raw.some((r) => v >= r.lo && v <= r.hi);
  for (const [r, v] of rows as [number, number][]) {
    const ks = slot.get(r);
    if (ks) { for (const k of ks) values[k] = v; }
    if (logs && inRaw(v)) rawOut.push(v);
  }
  return Object.freeze({ values, raw: Float64Array.from(rawOut), ran: true });
}
