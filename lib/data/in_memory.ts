/**
 * Tables from data already in memory.
 *
 * Accepted shapes, tried in this order:
 *
 * 1. a table from `loadTable` (returned as it is);
 * 2. an array (or typed array) of cells: one column, named by `name`;
 * 3. an array of row objects (`[{ x: 1, y: 2 }, …]`): one column per key,
 *    in the order keys are first seen; a key absent from a row is a missing
 *    cell there;
 * 4. a `Map` of column name → array;
 * 5. a frame-like object (see `frame_like.ts`);
 * 6. a plain object of columns (`{ x: [1, 2], y: [3, 4] }`), all of the same
 *    length.
 *
 * Cells: a finite number is a number; `NaN`, `null` and `undefined` are
 * missing; a string is read like a CSV cell (strict numbers, missing
 * tokens, censored values such as `"<0.5"`, `decimal` "." unless given);
 * `{ below: 0.5 }` and `{ above: 1000 }` are censored cells (below or above
 * that limit); a BigInt is a number when a double holds it exactly and text
 * otherwise (the `"non-numeric"` error then says why); ±Infinity, booleans,
 * dates and other objects are text. Row
 * numbers in provenance are 1-based positions; there are no line numbers.
 *
 * Censored values in bulk: in an object or `Map` of columns, a column may be
 * given as `{ values, censor }` — the values (the limit where censored) and,
 * aligned with them, −1 below the limit, +1 above it, 0 measured: the shape
 * of a `NumericColumn`.
 *
 * @module
 */
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import {
  _cached,
  type _CellRules,
  _newColumn,
  type _RawColumn,
  _storeCensored,
  _storeText,
  _storeTextCell,
  CELL_LEFT,
  CELL_MISSING,
  CELL_RIGHT,
} from "./_raw_column.ts";
import { _buildTable } from "./_build_table.ts";
import { _isTable } from "./_table_store.ts";
import { _columnsOf, _isRecord, type _Pair } from "./_memory_shapes.ts";
import { uniqueNames } from "./header.ts";
import { _cellRules, _checkLimitColumns, type CellOptions } from "./read_options.ts";

/** Options for {@linkcode tableFromMemory}. */
export interface MemoryOptions extends CellOptions {
  /**
   * The column name for a plain array or typed array of cells.
   * @default "value"
   */
  readonly name?: string;
}

/**
 * Build a table from in-memory data.
 *
 * @param data the data, in one of the shapes listed in the module doc
 * @param options the column name for a single array, and how strings are read
 * @returns a frozen table whose source is `"memory"`
 * @throws {PlumbError} `"bad-option"` for an unknown shape; `"malformed"`
 *   for columns of different lengths
 *
 * @example
 * ```ts
 * import { tableFromMemory } from "./in_memory.ts";
 * const t = tableFromMemory({ torque: [1.2, 1.4, null], line: ["A", "B", "A"] });
 * if (t.numericNames().join() !== "torque" || t.info("torque").provenance.missing !== 1) {
 *   throw new Error("unexpected");
 * }
 * // Censored values: per cell, or a column with its sides.
 * const lab = tableFromMemory({
 *   crp: [1.2, { below: 0.5 }, "<0.5", 3.4],
 *   chlorine: { values: [0.05, 0.21, 0.05, 0.3], censor: [-1, 0, -1, 0] },
 * });
 * if (lab.info("crp").provenance.censoredLeft !== 2) throw new Error("unexpected");
 * if (lab.numeric("chlorine").censor?.join() !== "-1,0,-1,0") throw new Error("unexpected");
 * ```
 */
export function tableFromMemory(data: unknown, options: MemoryOptions = {}): Table {
  if (_isTable(data)) return data;
  const name = options.name ?? "value";
  if (typeof name !== "string" || name.trim() === "") {
    throw new PlumbError(
      "bad-option",
      `Cannot name a column ${JSON.stringify(name)}: give a non-empty name`,
    );
  }
  return _tableFromPairs(_columnsOf(data, name), options, { source: "memory" });
}

/** Where columns read by another reader came from, for provenance. */
export interface _PairsSource {
  /** The table's source name. */
  readonly source: string;
  /** The line (or sheet row) of a 0-based row, when the source has lines. */
  readonly lineOf?: (row: number) => number;
}

/**
 * A table from (name, cells) pairs of equal length: the in-memory cell
 * rules, with the reader's source name and line numbers.
 */
export function _tableFromPairs(
  pairs: readonly _Pair[],
  options: CellOptions,
  from: _PairsSource,
): Table {
  const rules = _cellRules(options, ".");
  const { names, renamed } = uniqueNames(pairs.map((p) => p[0]));
  _checkLimitColumns(rules, names);
  const length = pairs.length === 0 ? 0 : pairs[0][1].length;
  pairs.forEach(([n, cells]) => {
    if (cells.length !== length) {
      throw new PlumbError(
        "malformed",
        `Columns of different lengths: ${JSON.stringify(pairs[0][0])} has ${length} values and ${
          JSON.stringify(n)
        } has ${cells.length}; give every column one value per row`,
        { column: n },
      );
    }
  });
  const lineOf = from.lineOf ?? null;
  const columns = pairs.map(([original, cells, censor], j) =>
    _memoryColumn(names[j], original, cells, rules, censor, lineOf)
  );
  return _buildTable(columns, {
    source: from.source,
    rowCount: length,
    renamed,
    delimiter: null,
    decimal: rules.decimal,
  });
}

function _memoryColumn(
  name: string,
  originalName: string,
  cells: ArrayLike<unknown>,
  rules: _CellRules,
  censor: ArrayLike<unknown> | undefined,
  lineOf: ((row: number) => number) | null,
): _RawColumn {
  const kept: ArrayLike<unknown> = ArrayBuffer.isView(cells)
    ? (cells as unknown as Float64Array).slice()
    : Array.from(cells);
  const n = kept.length;
  const col: _RawColumn = {
    ..._newColumn(name, n, () => [], (row) => lineOf?.(row) ?? null),
    originalName,
    texts: _cached(() => {
      const out: string[] = new Array(n);
      for (let i = 0; i < n; i++) {
        const s = col.status[i];
        const v = kept[i];
        if (s === CELL_MISSING) out[i] = "";
        else if ((s === CELL_LEFT || s === CELL_RIGHT) && typeof v !== "string") {
          out[i] = `${s === CELL_LEFT ? "<" : ">"}${col.values[i]}`;
        } else out[i] = _show(v);
      }
      return out;
    }),
  };
  for (let i = 0; i < n; i++) {
    const v = kept[i];
    const side = censor?.[i];
    if (side === -1 || side === 1) {
      _storeCensored(col, i, side, v as number);
    } else if (typeof v === "number") {
      if (Number.isFinite(v)) col.values[i] = v;
      else if (v !== v) _missing(col, i);
      else _storeText(col, i, String(v), lineOf?.(i) ?? null);
    } else if (v === null || v === undefined) {
      _missing(col, i);
    } else if (typeof v === "string") {
      _storeTextCell(col, i, v.trim(), lineOf?.(i) ?? null, rules);
    } else if (typeof v === "bigint") {
      // A BigInt that no double holds exactly (beyond ±2^53, unless a power of
      // two fits) is kept as text, never rounded without a word.
      const x = Number(v);
      if (Number.isFinite(x) && BigInt(x) === v) col.values[i] = x;
      else _storeText(col, i, String(v), lineOf?.(i) ?? null);
    } else if (!_storeCensoredCell(col, i, v)) {
      _storeText(col, i, _show(v), lineOf?.(i) ?? null);
    }
  }
  return col;
}

/** Store `{ below: x }` or `{ above: x }` (finite x) as censored; false for any other value. */
function _storeCensoredCell(col: _RawColumn, i: number, v: unknown): boolean {
  if (!_isRecord(v)) return false;
  const keys = Object.keys(v);
  if (keys.length !== 1 || (keys[0] !== "below" && keys[0] !== "above")) return false;
  const limit = v[keys[0]];
  if (typeof limit !== "number" || !Number.isFinite(limit)) return false;
  _storeCensored(col, i, keys[0] === "below" ? -1 : 1, limit);
  return true;
}

function _missing(col: _RawColumn, i: number): void {
  col.values[i] = NaN;
  col.status[i] = CELL_MISSING;
}

/**
 * A date read from a file as text: the day alone (`2026-01-05`) when it has
 * no time of day in UTC, else the full ISO instant.
 */
export function _dateText(d: Date): string {
  if (Number.isNaN(d.getTime())) return "Invalid Date";
  const iso = d.toISOString();
  return iso.endsWith("T00:00:00.000Z") ? iso.slice(0, 10) : iso;
}

/** A cell as text, safe for objects without a `toString`. */
function _show(v: unknown): string {
  if (typeof v === "string") return v;
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? "Invalid Date" : v.toISOString();
  try {
    return String(v);
  } catch {
    return Object.prototype.toString.call(v);
  }
}
