/**
 * The shapes of in-memory data that `loadTable`, `plumb` and `survey` accept,
 * as types. What each shape means (how cells are read, which shape wins when
 * several fit) is described in `in_memory.ts`.
 *
 * @module
 */

/**
 * One column's cells, one per row: numbers; strings, read like CSV cells
 * (numbers, missing tokens, `"<0.5"` and `">1000"` as censored); `null`,
 * `undefined` and `NaN` as missing; anything else counts as text.
 */
export type Cells = ArrayLike<unknown>;

/**
 * A column of values with censoring marks: `censor[i]` is −1 when `values[i]`
 * is a limit the true value lies below, +1 when it lies above, 0 when
 * `values[i]` was measured.
 */
export interface CensoredCells {
  /** The measured values, and the limits of the censored cells. */
  readonly values: Cells;
  /** −1, 0 or +1 per value. */
  readonly censor: ArrayLike<-1 | 0 | 1 | number>;
}

/** Rows as objects, one key per column (`[{ fill: 500.1, line: "A" }, …]`). */
export type RowObjects = readonly Readonly<Record<string, unknown>>[];

/** Columns as an object of arrays (`{ fill: [500.1, …], line: ["A", …] }`). */
export type ColumnObject = Readonly<Record<string, Cells | CensoredCells>>;

/** Columns as a `Map` from name to cells. */
export type ColumnMap = ReadonlyMap<string, Cells | CensoredCells>;

/**
 * A data frame of another library, recognised by its shape alone (no import
 * of any such library): it lists its column names and hands back a column by
 * name. Arquero tables, Apache Arrow tables and nodejs-polars data frames have
 * this shape.
 */
export type FrameLike = FrameNames & FrameColumnReader;

/** How a data frame lists its column names (one of these shapes). */
export type FrameNames =
  | { columnNames(): readonly string[] }
  | { getColumnNames(): readonly string[] }
  | { readonly columns: readonly string[] | (() => readonly string[]) }
  | { readonly schema: { readonly fields: readonly { readonly name: string }[] } };

/** How a data frame hands back a column by name (one of these methods). */
export type FrameColumnReader =
  | { array(name: string): unknown }
  | { getColumn(name: string): unknown }
  | { column(name: string): unknown }
  | { getChild(name: string): unknown }
  | { getSeries(name: string): unknown }
  | { get(name: string): unknown };

/**
 * A single series of another library (a polars `Series`, an Apache Arrow
 * vector): one column, named by its `name` when it has one.
 */
export interface SeriesLike {
  /** The number of cells. */
  readonly length: number;
  /** The cells (nulls are read through the series' own iterator where it has one). */
  toArray(): unknown;
  /** The series' name, used as the column's name. */
  readonly name?: string;
}

/**
 * Every in-memory shape: one column of cells, rows, columns, a map of
 * columns, a data frame, a single series.
 */
export type MemorySource = Cells | RowObjects | ColumnObject | ColumnMap | FrameLike | SeriesLike;
