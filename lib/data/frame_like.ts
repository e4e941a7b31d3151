/**
 * Column-oriented tables from JavaScript data-frame libraries, recognised by
 * their shape alone (no import of any such library).
 *
 * An object is frame-like when it can list its column names — a
 * `columnNames()` or `getColumnNames()` method, a `columns` array (or method
 * returning one) of strings, or a `schema.fields` array of `{ name }` — and
 * hand back a column by name — an `array(name)`, `getColumn(name)`,
 * `column(name)`, `getChild(name)`, `getSeries(name)` or `get(name)` method,
 * tried in that order. The column itself may be an array, a typed array, or
 * an object with `toArray()`, a `values` array, an iterator, or `length`
 * with `get(i)`.
 *
 * Nulls are honoured: a column that reports a `nullCount` (Apache Arrow
 * vectors) is read through its iterator, which yields `null` where the
 * validity mask says so (its `toArray()` gives the masked slots' stale
 * values, often 0), and so is one whose `toArray()` length differs from its
 * `length`. Arrow date and timestamp columns become `Date` cells (text),
 * never their epoch milliseconds. A single series (a polars `Series`, an
 * Arrow vector: `toArray()` and a `length`) is one column, named by its
 * `name` when it has one.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** A frame-like object's column names and a way to read each column. */
export interface FrameColumns {
  /** Column names in the frame's order. */
  readonly names: readonly string[];
  /** Read one column as an array-like of cells. */
  readonly read: (name: string) => ArrayLike<unknown>;
}

const _GETTERS = ["array", "getColumn", "column", "getChild", "getSeries", "get"] as const;

type _Bag = Record<string, unknown>;

/**
 * Recognise a frame-like object; `null` when the object does not have the
 * shape.
 *
 * @param value any object
 * @returns its names and a column reader, or null
 *
 * @example
 * ```ts
 * import { frameColumns } from "./frame_like.ts";
 * const fake = { columnNames: () => ["x"], array: (_name: string) => [1, 2] };
 * const frame = frameColumns(fake);
 * if (frame === null || frame.read("x").length !== 2) throw new Error("unexpected");
 * ```
 */
export function frameColumns(value: object): FrameColumns | null {
  const bag = value as _Bag;
  const names = _names(bag);
  if (names === null) return null;
  const getterName = _GETTERS.find((g) => typeof bag[g] === "function");
  if (getterName === undefined) return null;
  const getter = bag[getterName] as (name: string) => unknown;
  return {
    names,
    read: (name: string) => {
      const column = getter.call(value, name);
      const cells = _cells(column);
      if (cells === null) {
        throw new PlumbError(
          "bad-option",
          `Cannot read column ${
            JSON.stringify(name)
          } of the data frame: ${getterName}() gave neither an array nor an object with toArray(), values, an iterator or get(i); convert the frame to an object of arrays first`,
        );
      }
      return cells;
    },
  };
}

function _names(bag: _Bag): string[] | null {
  const strings = (x: unknown): string[] | null =>
    Array.isArray(x) && x.every((n) => typeof n === "string") ? x.slice() : null;
  for (const m of ["columnNames", "getColumnNames"]) {
    if (typeof bag[m] === "function") {
      const got = strings((bag[m] as () => unknown).call(bag));
      if (got !== null) return got;
    }
  }
  const columns = bag["columns"];
  if (typeof columns === "function") {
    const got = strings((columns as () => unknown).call(bag));
    if (got !== null) return got;
  } else {
    const got = strings(columns);
    if (got !== null) return got;
  }
  const schema = bag["schema"] as _Bag | undefined;
  if (typeof schema === "object" && schema !== null && Array.isArray(schema["fields"])) {
    const got = strings((schema["fields"] as { name?: unknown }[]).map((f) => f?.name));
    if (got !== null) return got;
  }
  return null;
}

/**
 * The cells of a single series — an object with `toArray()` and a `length`
 * (a polars `Series`, an Arrow vector) — or null for anything else.
 *
 * @param value any object
 *
 * @example
 * ```ts
 * import { seriesCells } from "./frame_like.ts";
 * const series = { name: "torque", length: 2, toArray: () => [1.2, null] };
 * if (seriesCells(series)?.length !== 2 || seriesCells({ x: [1] }) !== null) {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function seriesCells(value: object): ArrayLike<unknown> | null {
  const bag = value as _Bag;
  if (typeof bag["toArray"] !== "function") return null;
  if (typeof bag["length"] !== "number" && typeof bag["len"] !== "function") return null;
  return _cells(value);
}

/** A column object as an array-like of cells, or null when it has no known shape. */
function _cells(column: unknown): ArrayLike<unknown> | null {
  if (Array.isArray(column)) return column;
  if (ArrayBuffer.isView(column) && !(column instanceof DataView)) {
    return column as unknown as ArrayLike<unknown>;
  }
  if (typeof column !== "object" || column === null) return null;
  const bag = column as _Bag;
  const iterable =
    typeof (column as { [Symbol.iterator]?: unknown })[Symbol.iterator] === "function";
  if (typeof bag["toArray"] === "function") {
    // Arrow: toArray() ignores the validity mask and gives dates as epoch
    // milliseconds; the iterator honours the mask.
    const nulls = typeof bag["nullCount"] === "number" && bag["nullCount"] > 0;
    const temporal = /^(Date|Timestamp)/.test(String(bag["type"] ?? ""));
    if (iterable && (nulls || temporal)) {
      return _dates(Array.from(column as Iterable<unknown>), temporal);
    }
    const cells = _cells((bag["toArray"] as () => unknown).call(column));
    if (
      cells !== null && iterable && typeof bag["length"] === "number" &&
      cells.length !== bag["length"]
    ) {
      return Array.from(column as Iterable<unknown>);
    }
    return cells;
  }
  const values = bag["values"];
  if (Array.isArray(values) || (ArrayBuffer.isView(values) && !(values instanceof DataView))) {
    return values as ArrayLike<unknown>;
  }
  if (iterable) return Array.from(column as Iterable<unknown>);
  if (typeof bag["length"] === "number" && typeof bag["get"] === "function") {
    const get = bag["get"] as (i: number) => unknown;
    return Array.from({ length: bag["length"] as number }, (_, i) => get.call(column, i));
  }
  return null;
}

/** Epoch milliseconds of a date or timestamp column as `Date` cells. */
function _dates(cells: unknown[], temporal: boolean): unknown[] {
  if (!temporal) return cells;
  return cells.map((c) =>
    typeof c === "number" ? new Date(c) : typeof c === "bigint" ? new Date(Number(c)) : c
  );
}
