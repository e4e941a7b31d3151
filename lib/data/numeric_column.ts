/**
 * A column's numbers for analysis, with every left-out cell counted.
 *
 * @module
 */
import type {
  ColumnProvenance,
  NumericCells,
  NumericColumn,
  NumericColumnOptions,
  NumericProvenance,
  Table,
} from "./table.ts";
import {
  _cached,
  CELL_LEFT,
  CELL_MISSING,
  CELL_NUMBER,
  CELL_RIGHT,
  CELL_TEXT,
} from "./_raw_column.ts";
import { _isTable, _rawColumn } from "./_table_store.ts";
import { PlumbError } from "../errors.ts";
import { parseNumber } from "./number_parse.ts";
import { limitWordSide } from "./censored_cell.ts";

/**
 * The used numbers of a column: missing cells are always left out and
 * counted; text cells make it fail unless `dropText` is set, in which case
 * they are left out and counted too. Censored cells are kept: their limit
 * in `values` and their side in `censor` (present only when some value is
 * censored).
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @param options whether to drop text cells
 * @returns the values in row order, their censoring sides, their row
 *   indices and the provenance
 * @throws {PlumbError} `"unknown-column"` when there is no such column;
 *   `"non-numeric"` when the column holds text cells and `dropText` is not
 *   set (the message names the first rows, their lines and their text)
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * import { numericColumn } from "./numeric_column.ts";
 * const table = await loadTable("x\n1\nNA\n2.5\nn.d.\n<0.5\n");
 * const col = numericColumn(table, "x", { dropText: true });
 * if (col.values.join() !== "1,2.5,0.5" || col.provenance.textDropped !== 1) {
 *   throw new Error("unexpected");
 * }
 * if (col.censor?.join() !== "0,0,-1" || col.provenance.censoredLeft !== 1) {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function numericColumn(
  table: Table,
  name: string,
  options: NumericColumnOptions = {},
): NumericColumn {
  return _numericColumnOf(table, name, options, false);
}

/**
 * {@linkcode numericColumn} for plumbline's own read-only use: when every
 * cell is used and the table holds the numbers in one array, `values` is
 * that array itself, not a copy (a 1e7-row column saves 80 MB). The caller
 * must never write to it. Tables not built by plumbline go through their
 * own `numeric()`.
 */
export function _numericColumnShared(
  table: Table,
  name: string,
  options: NumericColumnOptions = {},
): NumericColumn {
  const t: unknown = table;
  return _isTable(t) ? _numericColumnOf(t, name, options, true) : table.numeric(name, options);
}

function _numericColumnOf(
  table: Table,
  name: string,
  options: NumericColumnOptions,
  share: boolean,
): NumericColumn {
  const dropText = options.dropText ?? false;
  const col = _rawColumn(table, name);
  const info = table.info(col.name);
  const p = info.provenance;
  if (p.nonNumeric > 0 && !dropText) {
    throw new PlumbError(
      "non-numeric",
      _nonNumericMessage(table, col.name, p),
      {
        column: col.name,
        count: p.nonNumeric,
        cells: p.nonNumericCells,
      },
    );
  }
  const censored = p.censoredLeft + p.censoredRight;
  const n = p.numbers + censored;
  const status = col.status;
  const complete = n === status.length;
  const used = (s: number) => s === CELL_NUMBER || s === CELL_LEFT || s === CELL_RIGHT;
  let values: Float64Array;
  let censor: Int8Array | undefined;
  if (complete) {
    values = col.copyValues?.() ?? (share ? col.values : col.values.slice());
  } else {
    const all = col.values;
    values = new Float64Array(n);
    let j = 0;
    for (let i = 0; i < status.length; i++) if (used(status[i])) values[j++] = all[i];
  }
  if (censored > 0) {
    censor = new Int8Array(n);
    let j = 0;
    for (let i = 0; i < status.length; i++) {
      const s = status[i];
      if (s === CELL_NUMBER) j++;
      else if (s === CELL_LEFT) censor[j++] = -1;
      else if (s === CELL_RIGHT) censor[j++] = 1;
    }
  }
  // Row indices are built on first read: most callers never need them.
  const rowIndex = _cached(() => {
    const index = new Int32Array(n);
    if (complete) {
      for (let i = 0; i < n; i++) index[i] = i;
    } else {
      let j = 0;
      for (let i = 0; i < status.length; i++) if (used(status[i])) index[j++] = i;
    }
    return index;
  });
  const provenance: NumericProvenance = Object.freeze({
    ...p,
    used: n,
    missingDropped: p.missing,
    textDropped: dropText ? p.nonNumeric : 0,
  });
  return _freezeColumn(col.name, values, rowIndex, provenance, censor);
}

/**
 * Assemble a frozen NumericColumn whose row indices are built on first
 * read; `censor` is left out when undefined.
 */
export function _freezeColumn(
  name: string,
  values: Float64Array,
  rowIndex: () => Int32Array,
  provenance: NumericProvenance,
  censor?: Int8Array,
): NumericColumn {
  const column = {
    name,
    values,
    ...(censor === undefined ? {} : { censor }),
    provenance,
    toJSON: () => ({
      name,
      values: Array.from(values),
      ...(censor === undefined ? {} : { censor: Array.from(censor) }),
      rowIndex: Array.from(rowIndex()),
      provenance,
    }),
  } as unknown as NumericColumn;
  Object.defineProperty(column, "rowIndex", { get: rowIndex, enumerable: true });
  return Object.freeze(column);
}

/**
 * Every cell of a column as a number, aligned with the table's rows, with
 * masks for missing and text cells, and (when some cell is censored) each
 * row's censoring side. Never fails on text.
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @throws {PlumbError} `"unknown-column"` when there is no such column
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * import { numericCells } from "./numeric_column.ts";
 * const cells = numericCells(await loadTable([1, NaN, 3]), "value");
 * if (cells.missing.join() !== "0,1,0" || cells.values[2] !== 3) throw new Error("unexpected");
 * ```
 */
export function numericCells(table: Table, name: string): NumericCells {
  return _numericCellsOf(table, name, false);
}

/**
 * {@linkcode numericCells} for plumbline's own read-only use: `values` is
 * the table's own array when it holds one (never to be written to). Tables
 * not built by plumbline go through their own `numericCells()`.
 */
export function _numericCellsShared(table: Table, name: string): NumericCells {
  const t: unknown = table;
  return _isTable(t) ? _numericCellsOf(t, name, true) : table.numericCells(name);
}

function _numericCellsOf(table: Table, name: string, share: boolean): NumericCells {
  const col = _rawColumn(table, name);
  const n = col.status.length;
  const missing = new Uint8Array(n);
  const nonNumeric = new Uint8Array(n);
  let censor: Int8Array | undefined;
  for (let i = 0; i < n; i++) {
    const s = col.status[i];
    if (s === CELL_MISSING) missing[i] = 1;
    else if (s === CELL_TEXT) nonNumeric[i] = 1;
    else if (s === CELL_LEFT || s === CELL_RIGHT) {
      censor ??= new Int8Array(n);
      censor[i] = s === CELL_LEFT ? -1 : 1;
    }
  }
  const values = col.copyValues?.() ?? (share ? col.values : col.values.slice());
  return Object.freeze({
    name: col.name,
    values,
    ...(censor === undefined ? {} : { censor }),
    missing,
    nonNumeric,
  });
}

function _nonNumericMessage(table: Table, name: string, p: ColumnProvenance): string {
  const count = p.nonNumeric;
  const cells = p.nonNumericCells;
  const shown = cells.slice(0, 5).map((c) =>
    `row ${c.row}${c.line === null ? "" : ` (line ${c.line})`} ${JSON.stringify(c.text)}`
  );
  const more = count > shown.length ? ` and ${count - shown.length} more` : "";
  const hints: string[] = [];
  if (cells.some((c) => /^[+-]?(inf|infinity)$/i.test(c.text.trim()))) {
    hints.push("infinite values are not accepted");
  }
  const other = table.decimal === "." ? "," : ".";
  // Integers kept as text because no double holds them (BigInt cells).
  const big = (t: string) => /^-?\d{16,}$/.test(t) && !Number.isSafeInteger(Number(t));
  if (
    cells.some((c) =>
      !big(c.text) &&
      parseNumber(c.text, { decimal: other }) === parseNumber(c.text, { decimal: other })
    )
  ) {
    hints.push(`some cells would read as numbers with decimal: ${JSON.stringify(other)}`);
  }
  if (cells.some((c) => big(c.text))) {
    hints.push(
      "integers beyond ±2^53 (9007199254740992) cannot be held exactly as numbers; convert them with Number() first if rounding them is acceptable",
    );
  }
  const word = cells.find((c) => limitWordSide(c.text) !== null);
  if (word !== undefined) {
    const side = limitWordSide(word.text) === -1 ? "below" : "above";
    const [limit, example] = side === "below" ? ["0.5", "0.5"] : ["{ above: 1000 }", "1000"];
    hints.push(
      `${JSON.stringify(word.text)} says the value is ${side} a limit without giving it: ` +
        `to read such cells as censored, give the column's limit when loading, ` +
        `loadTable(source, { detectionLimits: { ${
          JSON.stringify(name)
        }: ${limit} } }) with your limit in place of ${example}`,
    );
  }
  const hint = hints.length > 0 ? ` (${hints.join("; ")})` : "";
  const censored = p.censoredLeft + p.censoredRight;
  const numbers = `${p.numbers} ${p.numbers === 1 ? "number" : "numbers"}${
    censored === 0 ? "" : ` and ${censored} censored ${censored === 1 ? "value" : "values"}`
  }`;
  const cellWord = count === 1 ? "cell" : "cells";
  const what = p.numbers + censored > count
    ? `${count} text ${cellWord} among ${numbers}`
    : `${count} text ${cellWord} and ${numbers}, so it is a text column`;
  return `Column ${JSON.stringify(name)} of ${table.source} is not numeric: ${what}: ${
    shown.join(", ")
  }${more}${hint}; correct the source, add the tokens to the missing list, or pass { dropText: true } to leave them out`;
}
