/**
 * Assemble a frozen {@linkcode Table} from raw columns: classify each column,
 * count its cells and wire up the accessors.
 *
 * @module
 */
import {
  type CensoredLimit,
  type ColumnInfo,
  type ColumnKind,
  type HeaderRename,
  LISTED_LIMITS,
  type NumericColumnOptions,
  type Table,
} from "./table.ts";
import { _rawColumn, _remember } from "./_table_store.ts";
import {
  type _RawColumn,
  CELL_LEFT,
  CELL_MISSING,
  CELL_NUMBER,
  CELL_RIGHT,
} from "./_raw_column.ts";
import { numericCells, numericColumn } from "./numeric_column.ts";
import { textColumn } from "./text_column.ts";
import { parseNumber } from "./number_parse.ts";
import { DISPLAY } from "../results/display.ts";
import { tableSummaryBundle } from "./table_display.ts";

/** What a reader knows about the source besides its columns. */
export interface _TableMeta {
  readonly source: string;
  readonly rowCount: number;
  readonly renamed: readonly HeaderRename[];
  readonly delimiter: string | null;
  readonly decimal: "." | ",";
}

/**
 * The kind rule (see `ColumnKind`): numeric when there is at least one number
 * and fewer text cells than numbers; empty when every cell is missing; text
 * otherwise. Censored cells count as numbers here.
 */
export function _kind(numbers: number, text: number): ColumnKind {
  if (numbers === 0 && text === 0) return "empty";
  return numbers > 0 && text < numbers ? "numeric" : "text";
}

/** Build the table; the raw columns must already carry unique names. */
export function _buildTable(columns: readonly _RawColumn[], meta: _TableMeta): Table {
  const byName = new Map<string, _RawColumn>();
  const infos: ColumnInfo[] = [];
  for (const col of columns) {
    byName.set(col.name, col);
    let numbers = 0;
    let missing = 0;
    let left = 0;
    let right = 0;
    const status = col.status;
    for (let i = 0; i < status.length; i++) {
      const s = status[i];
      if (s === CELL_NUMBER) numbers++;
      else if (s === CELL_MISSING) missing++;
      else if (s === CELL_LEFT) left++;
      else if (s === CELL_RIGHT) right++;
    }
    const nonNumeric = status.length - numbers - missing - left - right;
    const kind = _kind(numbers + left + right, nonNumeric);
    infos.push(Object.freeze({
      name: col.name,
      kind,
      hint: kind === "text" ? _decimalHint(col, meta.decimal, nonNumeric) : null,
      provenance: Object.freeze({
        source: meta.source,
        column: col.name,
        originalName: col.originalName,
        rowsRead: meta.rowCount,
        numbers,
        censoredLeft: left,
        censoredRight: right,
        censoredLimits: left + right === 0 ? _NO_LIMITS : _limits(col),
        missing,
        nonNumeric,
        nonNumericCells: Object.freeze(col.notes.slice()),
      }),
    }));
  }
  const infoByName = new Map(infos.map((c) => [c.name, c]));
  const summary = Object.freeze({
    source: meta.source,
    rowCount: meta.rowCount,
    columns: Object.freeze(infos),
    renamed: meta.renamed,
    delimiter: meta.delimiter,
    decimal: meta.decimal,
  });
  const table: Table = Object.freeze({
    ...summary,
    has: (name: string) => byName.has(name),
    info: (name: string) => infoByName.get(_rawColumn(table, name).name) as ColumnInfo,
    numericNames: () => infos.filter((c) => c.kind === "numeric").map((c) => c.name),
    textNames: () => infos.filter((c) => c.kind === "text").map((c) => c.name),
    numeric: (name: string, options?: NumericColumnOptions) => numericColumn(table, name, options),
    numericCells: (name: string) => numericCells(table, name),
    text: (name: string) => textColumn(table, name),
    // Every column of a table reads the same rows, so the first knows their lines.
    lineOf: (row: number) => (columns.length === 0 ? null : columns[0].lineOf(row)),
    toJSON: () => summary,
    // Shown by notebook front ends: the columns with their counts and first text cells.
    [DISPLAY]: () => tableSummaryBundle(summary),
  });
  _remember(table, { byName, order: columns.map((c) => c.name) });
  return table;
}

const _NO_LIMITS: readonly CensoredLimit[] = Object.freeze([]);

/** The distinct limits of a column's censored cells, with their counts. */
function _limits(col: _RawColumn): readonly CensoredLimit[] {
  const counts = [new Map<number, number>(), new Map<number, number>()];
  const status = col.status;
  const values = col.values;
  for (let i = 0; i < status.length; i++) {
    const s = status[i];
    if (s === CELL_LEFT || s === CELL_RIGHT) {
      const m = counts[s === CELL_LEFT ? 0 : 1];
      m.set(values[i], (m.get(values[i]) ?? 0) + 1);
    }
  }
  const out: CensoredLimit[] = [];
  counts.forEach((m, k) => {
    const side = k === 0 ? "below" : "above";
    for (const limit of [...m.keys()].sort((a, b) => a - b)) {
      out.push(Object.freeze({ side, limit, count: m.get(limit) as number }));
    }
  });
  return Object.freeze(out.slice(0, LISTED_LIMITS));
}

/** The remark for a text column that the other decimal mark would read as numbers. */
function _decimalHint(col: _RawColumn, decimal: "." | ",", nonNumeric: number): string | null {
  const other = decimal === "." ? "," : ".";
  const notes = col.notes;
  if (notes.length === 0) return null;
  for (const n of notes) if (Number.isNaN(parseNumber(n.text, { decimal: other }))) return null;
  return `Read as text with decimal: ${JSON.stringify(decimal)}, but ${
    notes.length === nonNumeric ? "all" : `the first ${notes.length}`
  } of its ${nonNumeric} text cells read as numbers with decimal: ${
    JSON.stringify(other)
  }; pass that option if the column holds measurements`;
}
