/**
 * A column's cells as text, aligned with rows: the input for grouping.
 *
 * @module
 */
import type { Table, TextColumn } from "./table.ts";
import { CELL_MISSING } from "./_raw_column.ts";
import { _rawColumn } from "./_table_store.ts";

/**
 * Every cell of a column as text, one per row, with a missing mask. Works on
 * any column (a numeric column gives the cells' text as read, so `07` stays
 * `07`); missing cells are `""` and flagged in `missing`.
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @throws {PlumbError} `"unknown-column"` when there is no such column
 *
 * @example
 * ```ts
 * import { loadTable } from "./load_table.ts";
 * import { textColumn } from "./text_column.ts";
 * const table = await loadTable([{ line: "A", v: 1 }, { line: null, v: 2 }]);
 * const groups = textColumn(table, "line");
 * if (groups.values.join() !== "A," || groups.missing.join() !== "0,1") {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function textColumn(table: Table, name: string): TextColumn {
  const col = _rawColumn(table, name);
  const n = col.status.length;
  const missing = new Uint8Array(n);
  const texts = col.texts();
  const values: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    if (col.status[i] === CELL_MISSING) {
      missing[i] = 1;
      values[i] = "";
    } else {
      values[i] = texts[i];
    }
  }
  return Object.freeze({ name: col.name, values: Object.freeze(values), missing });
}
