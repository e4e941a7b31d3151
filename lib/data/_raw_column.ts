/**
 * The loader's internal form of a column, shared by the CSV and in-memory
 * readers: every cell as a number or a status, plus the first text cells.
 *
 * @module
 */
import { type CellNote, NOTED_CELLS } from "./table.ts";
import { parseNumber } from "./number_parse.ts";

/** Cell status codes in {@linkcode _RawColumn.status}. */
export const CELL_NUMBER = 0;
/** The cell is empty or a missing-value token. */
export const CELL_MISSING = 1;
/** The cell is text: neither a number nor missing. */
export const CELL_TEXT = 2;

/** How text cells are read: decimal mark, thousands separator, missing tokens. */
export interface _CellRules {
  readonly decimal: "." | ",";
  readonly decimalCode: number;
  readonly thousands: string | undefined;
  readonly missing: ReadonlySet<string>;
}

/** One column as read, before the table classifies it. */
export interface _RawColumn {
  /** The unique name in the table. */
  name: string;
  /** The name as the source gave it. */
  readonly originalName: string;
  /** One value per row; NaN unless the status is CELL_NUMBER. */
  readonly values: Float64Array;
  /** One status code per row. */
  readonly status: Uint8Array;
  /** The first text cells, in row order. */
  readonly notes: CellNote[];
  /** Every cell as text (missing → ""), computed on first call and cached. */
  readonly texts: () => readonly string[];
  /** The CSV line where a 0-based row starts, or null for in-memory data. */
  readonly lineOf: (row: number) => number | null;
  /** A fresh copy of `values`, for a column that can make one without them. */
  readonly copyValues?: () => Float64Array;
}

/** Make the empty arrays of a column of `rows` cells. */
export function _newColumn(
  name: string,
  rows: number,
  texts: () => readonly string[],
  lineOf: (row: number) => number | null,
): _RawColumn {
  return {
    name,
    originalName: name,
    values: new Float64Array(rows),
    status: new Uint8Array(rows),
    notes: [],
    texts: _cached(texts),
    lineOf,
  };
}

/** Wrap a function so that it runs once and its result is reused. */
export function _cached<T>(f: () => T): () => T {
  let done = false;
  let value: T;
  return () => {
    if (!done) {
      value = f();
      done = true;
    }
    return value;
  };
}

/**
 * Classify one cell given as text and store it at `row`: a number, missing,
 * or text (noted when among the first text cells).
 *
 * @param text the cell, already trimmed
 * @param line the CSV line of the row, or null for in-memory data
 */
export function _storeTextCell(
  col: _RawColumn,
  row: number,
  text: string,
  line: number | null,
  rules: _CellRules,
): void {
  if (rules.missing.has(text.toLowerCase())) {
    col.values[row] = NaN;
    col.status[row] = CELL_MISSING;
    return;
  }
  const v = parseNumber(text, { decimal: rules.decimal, thousands: rules.thousands });
  if (v === v) {
    col.values[row] = v;
    col.status[row] = CELL_NUMBER;
    return;
  }
  _storeText(col, row, text, line);
}

/** Store a text cell at `row` and note it when among the first ones. */
export function _storeText(col: _RawColumn, row: number, text: string, line: number | null): void {
  col.values[row] = NaN;
  col.status[row] = CELL_TEXT;
  if (col.notes.length < NOTED_CELLS) {
    col.notes.push(Object.freeze({ row: row + 1, line, text }));
  }
}
