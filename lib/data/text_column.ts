/**
 * A column's cells as labels, aligned with rows: the input for grouping.
 *
 * @module
 */
import type { MergedLabel, Table, TextColumn } from "./table.ts";
import { CELL_MISSING } from "./_raw_column.ts";
import { _rawColumn } from "./_table_store.ts";

/**
 * Every cell of a column as a label, one per row, with a missing mask. Works
 * on any column (a numeric column gives the cells' text as read, so `07`
 * stays `07`); missing cells are `""` and flagged in `missing`. Labels that
 * differ only in spaces are one label (surrounding spaces of any kind
 * removed, inner runs of spaces — no-break, thin, ideographic, tabs — made
 * one plain space; a line break inside a label is kept), and `merged` lists
 * each label met in several
 * spellings, so that a display can say so.
 *
 * @param table a table from `loadTable`
 * @param name the column's name
 * @throws {PlumbError} `"unknown-column"` when there is no such column
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * import { textColumn } from "./text_column.ts";
 * const table = await loadTable([{ line: "A", v: 1 }, { line: null, v: 2 }]);
 * const groups = textColumn(table, "line");
 * if (groups.values.join() !== "A," || groups.missing.join() !== "0,1") {
 *   throw new Error("unexpected");
 * }
 * const spaced = textColumn(await loadTable({ line: [" A", "A", "A\u00a0"] }), "line");
 * if (spaced.values.join() !== "A,A,A" || spaced.merged[0].spellings.length !== 3) {
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
  // label → its spellings, for the labels whose spelling differs from the label
  const spellings = new Map<string, Set<string>>();
  const seen = new Map<string, string>();
  for (let i = 0; i < n; i++) {
    if (col.status[i] === CELL_MISSING) {
      missing[i] = 1;
      values[i] = "";
      continue;
    }
    const raw = texts[i];
    const label = _label(raw);
    values[i] = label;
    const first = seen.get(label);
    if (first === undefined) seen.set(label, raw);
    else if (first !== raw) {
      let set = spellings.get(label);
      if (set === undefined) spellings.set(label, set = new Set([first]));
      set.add(raw);
    }
  }
  const merged: MergedLabel[] = [...spellings].map(([label, set]) =>
    Object.freeze({ label, spellings: Object.freeze([...set]) })
  );
  return Object.freeze({
    name: col.name,
    values: Object.freeze(values),
    missing,
    merged: Object.freeze(merged),
  });
}

// Runs of horizontal spaces of every kind (line breaks inside a label are kept),
// including those String.prototype.trim leaves (U+200B, U+180E).
const _SPACES = /[ \t\f\v\u00a0\u1680\u2000-\u200b\u202f\u205f\u3000\ufeff\u180e]+/g;

/** A cell's label: surrounding spaces removed, inner runs of spaces made one space. */
function _label(text: string): string {
  // The common case, a label of plain letters and digits, needs no work.
  if (!/[^\x21-\x7e]/.test(text)) return text;
  return text.replace(_SPACES, " ").replace(/^[\s\u200b\u180e]+|[\s\u200b\u180e]+$/g, "");
}
