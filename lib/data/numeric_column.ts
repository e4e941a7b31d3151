/**
 * A column's numbers for analysis, with every left-out cell counted.
 *
 * @module
 */
import type {
  CellNote,
  NumericCells,
  NumericColumn,
  NumericColumnOptions,
  NumericProvenance,
  Table,
} from "./table.ts";
import { _cached, CELL_MISSING, CELL_NUMBER, CELL_TEXT } from "./_raw_column.ts";
import { _rawColumn } from "./_table_store.ts";
import { PlumbError } from "../errors.ts";
import { parseNumber } from "./number_parse.ts";

/**
 * The used numbers of a column: missing cells are always left out and
 * counted; text cells make it fail unless `dropText` is set, in which case
 * they are left out and counted too.
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @param options whether to drop text cells
 * @returns the values in row order, their row indices and the provenance
 * @throws {PlumbError} `"unknown-column"` when there is no such column;
 *   `"non-numeric"` when the column holds text cells and `dropText` is not
 *   set (the message names the first rows, their lines and their text)
 *
 * @example
 * ```ts
 * import { loadTable } from "./load_table.ts";
 * import { numericColumn } from "./numeric_column.ts";
 * const table = await loadTable("x\n1\nNA\n2.5\nn.d.\n");
 * const col = numericColumn(table, "x", { dropText: true });
 * if (col.values.join() !== "1,2.5" || col.provenance.textDropped !== 1) {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function numericColumn(
  table: Table,
  name: string,
  options: NumericColumnOptions = {},
): NumericColumn {
  const dropText = options.dropText ?? false;
  const col = _rawColumn(table, name);
  const info = table.info(col.name);
  const p = info.provenance;
  if (p.nonNumeric > 0 && !dropText) {
    throw new PlumbError(
      "non-numeric",
      _nonNumericMessage(table, col.name, p.nonNumeric, p.numbers, p.nonNumericCells),
      {
        column: col.name,
        count: p.nonNumeric,
        cells: p.nonNumericCells,
      },
    );
  }
  const n = p.numbers;
  const status = col.status;
  const complete = n === status.length;
  let values: Float64Array;
  if (complete) {
    values = col.copyValues?.() ?? col.values.slice();
  } else {
    const all = col.values;
    values = new Float64Array(n);
    let j = 0;
    for (let i = 0; i < status.length; i++) if (status[i] === CELL_NUMBER) values[j++] = all[i];
  }
  // Row indices are built on first read: most callers never need them.
  const rowIndex = _cached(() => {
    const index = new Int32Array(n);
    if (complete) {
      for (let i = 0; i < n; i++) index[i] = i;
    } else {
      let j = 0;
      for (let i = 0; i < status.length; i++) if (status[i] === CELL_NUMBER) index[j++] = i;
    }
    return index;
  });
  const provenance: NumericProvenance = Object.freeze({
    ...p,
    used: n,
    missingDropped: p.missing,
    textDropped: dropText ? p.nonNumeric : 0,
  });
  return _freezeColumn(col.name, values, rowIndex, provenance);
}

/** Assemble a frozen NumericColumn whose row indices are built on first read. */
export function _freezeColumn(
  name: string,
  values: Float64Array,
  rowIndex: () => Int32Array,
  provenance: NumericProvenance,
): NumericColumn {
  const column = {
    name,
    values,
    provenance,
    toJSON: () => ({
      name,
      values: Array.from(values),
      rowIndex: Array.from(rowIndex()),
      provenance,
    }),
  } as unknown as NumericColumn;
  Object.defineProperty(column, "rowIndex", { get: rowIndex, enumerable: true });
  return Object.freeze(column);
}

/**
 * Every cell of a column as a number, aligned with the table's rows, with
 * masks for missing and text cells. Never fails on text.
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @throws {PlumbError} `"unknown-column"` when there is no such column
 *
 * @example
 * ```ts
 * import { loadTable } from "./load_table.ts";
 * import { numericCells } from "./numeric_column.ts";
 * const cells = numericCells(await loadTable([1, NaN, 3]), "value");
 * if (cells.missing.join() !== "0,1,0" || cells.values[2] !== 3) throw new Error("unexpected");
 * ```
 */
export function numericCells(table: Table, name: string): NumericCells {
  const col = _rawColumn(table, name);
  const n = col.status.length;
  const missing = new Uint8Array(n);
  const nonNumeric = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const s = col.status[i];
    if (s === CELL_MISSING) missing[i] = 1;
    else if (s === CELL_TEXT) nonNumeric[i] = 1;
  }
  const values = col.copyValues?.() ?? col.values.slice();
  return Object.freeze({ name: col.name, values, missing, nonNumeric });
}

function _nonNumericMessage(
  table: Table,
  name: string,
  count: number,
  numbers: number,
  cells: readonly CellNote[],
): string {
  const shown = cells.slice(0, 5).map((c) =>
    `row ${c.row}${c.line === null ? "" : ` (line ${c.line})`} ${JSON.stringify(c.text)}`
  );
  const more = count > shown.length ? ` and ${count - shown.length} more` : "";
  const hints: string[] = [];
  if (cells.some((c) => /^[+-]?(inf|infinity)$/i.test(c.text.trim()))) {
    hints.push("infinite values are not accepted");
  }
  const other = table.decimal === "." ? "," : ".";
  if (
    cells.some((c) =>
      parseNumber(c.text, { decimal: other }) === parseNumber(c.text, { decimal: other })
    )
  ) {
    hints.push(`some cells would read as numbers with decimal: ${JSON.stringify(other)}`);
  }
  const hint = hints.length > 0 ? ` (${hints.join("; ")})` : "";
  const what = numbers > count
    ? `${count} text ${count === 1 ? "cell" : "cells"} among ${numbers} numbers`
    : `${count} text ${
      count === 1 ? "cell" : "cells"
    } and ${numbers} numbers, so it is a text column`;
  return `Column ${JSON.stringify(name)} of ${table.source} is not numeric: ${what}: ${
    shown.join(", ")
  }${more}${hint}; correct the source, add the tokens to the missing list, or pass { dropText: true } to leave them out`;
}
