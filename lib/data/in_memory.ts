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
 * tokens, `decimal` "." unless given); ±Infinity, booleans, dates and other
 * objects are text. Row numbers in provenance are 1-based positions; there
 * are no line numbers.
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
  _storeText,
  _storeTextCell,
  CELL_MISSING,
} from "./_raw_column.ts";
import { _buildTable } from "./_build_table.ts";
import { _isTable } from "./_table_store.ts";
import { frameColumns } from "./frame_like.ts";
import { uniqueNames } from "./header.ts";
import { _cellRules, type CellOptions } from "./read_options.ts";

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
 * ```
 */
export function tableFromMemory(data: unknown, options: MemoryOptions = {}): Table {
  if (_isTable(data)) return data;
  const rules = _cellRules(options, ".");
  const name = options.name ?? "value";
  if (typeof name !== "string" || name.trim() === "") {
    throw new PlumbError(
      "bad-option",
      `Cannot name a column ${JSON.stringify(name)}: give a non-empty name`,
    );
  }
  const pairs = _columnsOf(data, name);
  const { names, renamed } = uniqueNames(pairs.map((p) => p[0]));
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
  const columns = pairs.map(([original, cells], j) =>
    _memoryColumn(names[j], original, cells, rules)
  );
  return _buildTable(columns, {
    source: "memory",
    rowCount: length,
    renamed,
    delimiter: null,
    decimal: rules.decimal,
  });
}

type _Pair = [string, ArrayLike<unknown>];

function _isCells(x: unknown): x is ArrayLike<unknown> {
  return Array.isArray(x) || (ArrayBuffer.isView(x) && !(x instanceof DataView));
}

function _isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x) && !ArrayBuffer.isView(x) &&
    !(x instanceof Date);
}

function _columnsOf(data: unknown, name: string): _Pair[] {
  if (Array.isArray(data)) {
    const first = data.find((x) => x !== null && x !== undefined);
    if (Array.isArray(first)) {
      throw new PlumbError(
        "bad-option",
        "Cannot read an array of arrays: give rows as objects ([{ x: 1 }, …]) or columns as an object of arrays ({ x: [1, …] })",
      );
    }
    if (_isRecord(first)) return _rowsToColumns(data);
    return [[name, data]];
  }
  if (_isCells(data)) return [[name, data]];
  if (data instanceof Map) {
    return [...data.entries()].map(([k, v]) => [String(k), _checkCells(String(k), v)]);
  }
  if (typeof data === "object" && data !== null) {
    const frame = frameColumns(data);
    if (frame !== null) return frame.names.map((n) => [n, frame.read(n)]);
    return Object.keys(data).map((k) => [k, _checkCells(k, (data as Record<string, unknown>)[k])]);
  }
  throw new PlumbError(
    "bad-option",
    `Cannot make a table from ${
      data === null ? "null" : typeof data
    }: give a file path, CSV text, an array of numbers, an array of row objects or an object of columns`,
  );
}

function _checkCells(key: string, v: unknown): ArrayLike<unknown> {
  if (_isCells(v)) return v;
  throw new PlumbError(
    "bad-option",
    `Cannot read column ${
      JSON.stringify(key)
    }: its value is not an array; give an object whose every value is an array (one cell per row)`,
  );
}

function _rowsToColumns(rows: readonly unknown[]): _Pair[] {
  const index = new Map<string, number>();
  const columns: unknown[][] = [];
  const names: string[] = [];
  rows.forEach((row, r) => {
    if (row === null || row === undefined) return;
    if (!_isRecord(row)) {
      throw new PlumbError(
        "bad-option",
        `Cannot read row ${
          r + 1
        }: it is not an object like the rows before it; give every row as an object`,
      );
    }
    for (const key of Object.keys(row)) {
      let j = index.get(key);
      if (j === undefined) {
        j = columns.length;
        index.set(key, j);
        names.push(key);
        columns.push(new Array(rows.length).fill(undefined));
      }
      columns[j][r] = row[key];
    }
  });
  return names.map((n, j) => [n, columns[j]]);
}

function _memoryColumn(
  name: string,
  originalName: string,
  cells: ArrayLike<unknown>,
  rules: _CellRules,
): _RawColumn {
  const kept: ArrayLike<unknown> = ArrayBuffer.isView(cells)
    ? (cells as unknown as Float64Array).slice()
    : Array.from(cells);
  const n = kept.length;
  const col: _RawColumn = {
    ..._newColumn(name, n, () => [], () => null),
    originalName,
    texts: _cached(() => {
      const out: string[] = new Array(n);
      for (let i = 0; i < n; i++) out[i] = col.status[i] === CELL_MISSING ? "" : _show(kept[i]);
      return out;
    }),
  };
  for (let i = 0; i < n; i++) {
    const v = kept[i];
    if (typeof v === "number") {
      if (Number.isFinite(v)) col.values[i] = v;
      else if (v !== v) _missing(col, i);
      else _storeText(col, i, String(v), null);
    } else if (v === null || v === undefined) {
      _missing(col, i);
    } else if (typeof v === "string") {
      _storeTextCell(col, i, v.trim(), null, rules);
    } else if (typeof v === "bigint") {
      const x = Number(v);
      if (Number.isFinite(x)) col.values[i] = x;
      else _storeText(col, i, String(v), null);
    } else {
      _storeText(col, i, _show(v), null);
    }
  }
  return col;
}

function _missing(col: _RawColumn, i: number): void {
  col.values[i] = NaN;
  col.status[i] = CELL_MISSING;
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
