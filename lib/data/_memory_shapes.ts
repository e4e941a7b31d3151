/**
 * The shapes of in-memory data that make a table: which object is which
 * kind of source, and its columns as (name, cells) pairs.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { frameColumns, seriesCells } from "./frame_like.ts";

/** A column's name, cells and, for a `{ values, censor }` column, its sides. */
export type _Pair = [string, ArrayLike<unknown>, ArrayLike<unknown>?];

function _isCells(x: unknown): x is ArrayLike<unknown> {
  return Array.isArray(x) || (ArrayBuffer.isView(x) && !(x instanceof DataView));
}

export function _isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x) && !ArrayBuffer.isView(x) &&
    !(x instanceof Date);
}

/** `{ below: x }` or `{ above: x }`: one censored cell. */
export function _isCensoredCell(x: unknown): x is { below: number } | { above: number } {
  if (!_isRecord(x)) return false;
  const keys = Object.keys(x);
  return keys.length === 1 && (keys[0] === "below" || keys[0] === "above") &&
    typeof x[keys[0]] === "number" && Number.isFinite(x[keys[0]]);
}

/**
 * The columns of in-memory data, or a `"bad-option"` error for a value that
 * is not a table (a Set, an iterator, raw bytes, a promise, an empty
 * object, …) saying what to give instead.
 */
export function _columnsOf(data: unknown, name: string): _Pair[] {
  if (Array.isArray(data)) {
    const first = data.find((x) => x !== null && x !== undefined);
    if (Array.isArray(first)) {
      throw new PlumbError(
        "bad-option",
        "Cannot read an array of arrays: give rows as objects ([{ x: 1 }, …]) or columns as an object of arrays ({ x: [1, …] })",
      );
    }
    // Rows of objects, unless the objects are censored cells among numbers.
    const cells = _isCensoredCell(first) &&
      data.some((x) => typeof x === "number" || typeof x === "string");
    if (_isRecord(first) && !cells) return _rowsToColumns(data);
    return [[name, data]];
  }
  if (_isCells(data)) return [[name, data]];
  const refused = _refusal(data);
  if (refused !== null) {
    throw new PlumbError("bad-option", `Cannot make a table from ${refused}`);
  }
  if (data instanceof Map) {
    return [...data.entries()].map(([k, v]) => _checkCells(String(k), v));
  }
  const object = data as object;
  const frame = frameColumns(object);
  if (frame !== null) return frame.names.map((n) => [n, frame.read(n)]);
  const series = seriesCells(object);
  if (series !== null) {
    const own = (object as { name?: unknown }).name;
    return [[typeof own === "string" && own.trim() !== "" ? own : name, series]];
  }
  return Object.keys(object).map((k) => _checkCells(k, (object as Record<string, unknown>)[k]));
}

/** Why a value cannot be a table (what it is, then what to give), or null when it may be one. */
function _refusal(data: unknown): string | null {
  const give =
    "give a file path, CSV text, an array of numbers, an array of row objects or an object of columns";
  if (typeof data !== "object" || data === null) {
    return `${data === null ? "null" : typeof data}: ${give}`;
  }
  if (data instanceof ArrayBuffer || data instanceof DataView || _isShared(data)) {
    return `raw bytes (${data.constructor.name}): for numbers, view them as a typed array (new Float64Array(buffer)); for a file's bytes, decode them or give the file's path`;
  }
  if (data instanceof Set) {
    return "a Set: give its values as an array, Array.from(set)";
  }
  if (data instanceof WeakMap || data instanceof WeakSet) {
    return `a ${data.constructor.name}: its entries cannot be listed; ${give}`;
  }
  if (typeof (data as { then?: unknown }).then === "function") {
    return "a promise: await it first, then pass the result";
  }
  if (data instanceof Date || data instanceof RegExp || data instanceof Error) {
    return `a ${data.constructor.name}: ${give}`;
  }
  if (data instanceof Map) {
    return data.size === 0 ? "an empty Map: it has no columns; give at least one column" : null;
  }
  const iterable = typeof (data as { [Symbol.iterator]?: unknown })[Symbol.iterator] === "function";
  const iterator = typeof (data as { next?: unknown }).next === "function";
  if ((iterable || iterator) && frameColumns(data) === null && seriesCells(data) === null) {
    return "an iterator or generator: collect its values first, Array.from(values)";
  }
  if (Object.keys(data).length === 0 && frameColumns(data) === null && seriesCells(data) === null) {
    return `an object with no columns (${
      _kindOf(data)
    }): give an object whose every value is an array, e.g. { fill_ml: [500.1, 499.8] }`;
  }
  return null;
}

function _isShared(x: object): boolean {
  return typeof SharedArrayBuffer !== "undefined" && x instanceof SharedArrayBuffer;
}

function _kindOf(x: object): string {
  const proto = Object.getPrototypeOf(x);
  if (proto === null || proto === Object.prototype) return "an empty object";
  return `an instance of ${proto.constructor?.name || "a class"}`;
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
