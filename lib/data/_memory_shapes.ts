/**
 * The shapes of in-memory data that make a table: which object is which
 * kind of source, and its columns as (name, cells) pairs.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { frameColumns } from "./frame_like.ts";

/** A column's name, cells and, for a `{ values, censor }` column, its sides. */
export type _Pair = [string, ArrayLike<unknown>, ArrayLike<unknown>?];

function _isCells(x: unknown): x is ArrayLike<unknown> {
  return Array.isArray(x) || (ArrayBuffer.isView(x) && !(x instanceof DataView));
}

export function _isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x) && !ArrayBuffer.isView(x) &&
    !(x instanceof Date);
}

export function _columnsOf(data: unknown, name: string): _Pair[] {
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
    return [...data.entries()].map(([k, v]) => _checkCells(String(k), v));
  }
  if (typeof data === "object" && data !== null) {
    const frame = frameColumns(data);
    if (frame !== null) return frame.names.map((n) => [n, frame.read(n)]);
    return Object.keys(data).map((k) => _checkCells(k, (data as Record<string, unknown>)[k]));
  }
  throw new PlumbError(
    "bad-option",
    `Cannot make a table from ${
      data === null ? "null" : typeof data
    }: give a file path, CSV text, an array of numbers, an array of row objects or an object of columns`,
  );
}

function _checkCells(key: string, v: unknown): _Pair {
  if (_isCells(v)) return [key, v];
  if (_isRecord(v) && "censor" in v) return [key, ..._censoredColumn(key, v)];
  throw new PlumbError(
    "bad-option",
    `Cannot read column ${
      JSON.stringify(key)
    }: its value is not an array; give an object whose every value is an array (one cell per row), or { values, censor } for censored values`,
  );
}

/** Check a `{ values, censor }` column: same lengths, sides −1/0/1, finite limits. */
function _censoredColumn(
  key: string,
  v: Record<string, unknown>,
): [ArrayLike<unknown>, ArrayLike<unknown>] {
  const { values, censor } = v;
  const bad = (what: string) =>
    new PlumbError(
      "bad-option",
      `Cannot read column ${
        JSON.stringify(key)
      } as censored values: ${what}; give { values, censor } with one side per value (−1 below the limit in values, +1 above it, 0 measured)`,
      { column: key },
    );
  const extra = Object.keys(v).filter((k) => k !== "values" && k !== "censor");
  if (extra.length > 0) throw bad(`unknown key ${JSON.stringify(extra[0])}`);
  if (!_isCells(values)) throw bad("values is not an array");
  if (!_isCells(censor)) throw bad("censor is not an array");
  if (censor.length !== values.length) {
    throw bad(`values has ${values.length} entries and censor ${censor.length}`);
  }
  for (let i = 0; i < censor.length; i++) {
    const side = censor[i];
    if (side !== 0 && side !== -1 && side !== 1) {
      throw bad(`censor[${i}] (row ${i + 1}) is ${String(side)}`);
    }
    const x = values[i];
    if (side !== 0 && (typeof x !== "number" || !Number.isFinite(x))) {
      throw bad(`row ${i + 1} is censored but its limit ${String(x)} is not a finite number`);
    }
  }
  return [values, censor];
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
