/**
 * The loader's internal form of a column, shared by the CSV and in-memory
 * readers: every cell as a number or a status, plus the first text cells.
 *
 * @module
 */
import { type CellNote, NOTED_CELLS } from "./table.ts";
import { parseNumber } from "./number_parse.ts";
import { limitWordSide, parseCensored } from "./censored_cell.ts";

/** Cell status codes in {@linkcode _RawColumn.status}. */
export const CELL_NUMBER = 0;
/** The cell is empty or a missing-value token. */
export const CELL_MISSING = 1;
/** The cell is text: neither a number nor missing. */
export const CELL_TEXT = 2;
/** The cell is below a limit (`<0.5`): the value stored is the limit. */
export const CELL_LEFT = 3;
/** The cell is above a limit (`>1000`): the value stored is the limit. */
export const CELL_RIGHT = 4;

/** The limits that words such as `ND` (below) or `TNTC` (above) stand for in one column. */
export interface _WordLimits {
  readonly below?: number;
  readonly above?: number;
}

/**
 * How text cells are read: decimal mark, thousands separator, missing
 * tokens, and per column the limits that limit words stand for.
 */
export interface _CellRules {
  readonly decimal: "." | ",";
  readonly decimalCode: number;
  readonly thousands: string | undefined;
  readonly missing: ReadonlySet<string>;
  readonly limits: ReadonlyMap<string, _WordLimits>;
}

/** One column as read, before the table classifies it. */
export interface _RawColumn {
  /** The unique name in the table. */
  name: string;
  /** The name as the source gave it. */
  readonly originalName: string;
  /** One value per row: the number, the limit of a censored cell, NaN otherwise. */
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
 * censored (`<0.5`, `>1000`, or a limit word where the column's limit is
 * given), or text (noted when among the first text cells).
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
  const censored = parseCensored(text, rules);
  if (censored !== null) {
    _storeCensored(col, row, censored.side, censored.limit);
    return;
  }
  const limits = rules.limits.get(col.name);
  if (limits !== undefined) {
    const side = limitWordSide(text);
    const limit = side === -1 ? limits.below : side === 1 ? limits.above : undefined;
    if (side !== null && limit !== undefined) {
      _storeCensored(col, row, side, limit);
      return;
    }
  }
  _storeText(col, row, text, line);
}

/** Store a censored cell: side −1 below `limit`, +1 above it. */
export function _storeCensored(col: _RawColumn, row: number, side: -1 | 1, limit: number): void {
  col.values[row] = limit;
  col.status[row] = side < 0 ? CELL_LEFT : CELL_RIGHT;
}

/** Store a text cell at `row` and note it when among the first ones. */
export function _storeText(col: _RawColumn, row: number, text: string, line: number | null): void {
  col.values[row] = NaN;
  col.status[row] = CELL_TEXT;
  if (col.notes.length < NOTED_CELLS) {
    col.notes.push(Object.freeze({ row: row + 1, line, text }));
  }
}
