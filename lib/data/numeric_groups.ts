/**
 * A numeric column split by the values of a text column: the input for
 * per-group screening.
 *
 * @module
 */
import type { CellNote, NumericColumn, NumericProvenance, Table } from "./table.ts";
import { NOTED_CELLS } from "./table.ts";
import { CELL_MISSING, CELL_NUMBER } from "./_raw_column.ts";
import { _rawColumn } from "./_table_store.ts";
import { _freezeColumn } from "./numeric_column.ts";
import { textColumn } from "./text_column.ts";
import { PlumbError } from "../errors.ts";

/** Options for {@linkcode numericGroups}. */
export interface NumericGroupsOptions {
  /** The column whose values name the groups (required). */
  readonly by: string;
  /**
   * Leave out text cells (counted per group) instead of failing.
   * @default false
   */
  readonly dropText?: boolean;
}

/** One group's numbers. */
export interface NumericGroup {
  /** The group's value in the `by` column, as text. */
  readonly group: string;
  /** The group's used values with their table rows and the group's own counts. */
  readonly column: NumericColumn;
}

/** A numeric column split into groups. */
export interface NumericGroups {
  /** The numeric column's name. */
  readonly name: string;
  /** The grouping column's name. */
  readonly by: string;
  /** The groups in the order their values first appear. */
  readonly groups: readonly NumericGroup[];
  /** Rows left out because their cell in `by` is missing (whatever the numeric cell held). */
  readonly rowsWithoutGroup: number;
}

/**
 * Split a column's numbers by the values of another column. Each group gets
 * its own provenance (rows, numbers, missing and text cells within the
 * group); rows whose group cell is missing are left out and counted.
 *
 * @param table a table from `loadTable`
 * @param name the numeric column
 * @param options the grouping column, and whether to drop text cells
 * @throws {PlumbError} `"unknown-column"` for either name; `"non-numeric"`
 *   when the numeric column holds text cells and `dropText` is not set
 *
 * @example
 * ```ts
 * import { loadTable } from "./load_table.ts";
 * import { numericGroups } from "./numeric_groups.ts";
 * const t = await loadTable({ v: [1, 2, 3, NaN], line: ["A", "B", "A", "B"] });
 * const split = numericGroups(t, "v", { by: "line" });
 * const a = split.groups[0];
 * if (a.group !== "A" || a.column.values.join() !== "1,3") throw new Error("unexpected");
 * if (split.groups[1].column.provenance.missingDropped !== 1) throw new Error("unexpected");
 * ```
 */
export function numericGroups(
  table: Table,
  name: string,
  options: NumericGroupsOptions,
): NumericGroups {
  const by = options?.by;
  if (typeof by !== "string") {
    throw new PlumbError(
      "bad-option",
      'Cannot split without a grouping column: give { by: "column name" }',
    );
  }
  const whole = table.numeric(name, { dropText: options.dropText ?? false });
  const col = _rawColumn(table, name);
  const groups = textColumn(table, by);
  const base = whole.provenance;
  const order: string[] = [];
  const rows = new Map<string, number[]>();
  let rowsWithoutGroup = 0;
  for (let i = 0; i < table.rowCount; i++) {
    if (groups.missing[i] === 1) {
      rowsWithoutGroup++;
      continue;
    }
    const g = groups.values[i];
    let list = rows.get(g);
    if (list === undefined) {
      list = [];
      rows.set(g, list);
      order.push(g);
    }
    list.push(i);
  }
  const result = order.map((g) => {
    const members = rows.get(g) as number[];
    let numbers = 0;
    let missing = 0;
    for (const i of members) {
      if (col.status[i] === CELL_NUMBER) numbers++;
      else if (col.status[i] === CELL_MISSING) missing++;
    }
    const nonNumeric = members.length - numbers - missing;
    const values = new Float64Array(numbers);
    const index = new Int32Array(numbers);
    const notes: CellNote[] = [];
    const texts = nonNumeric > 0 ? col.texts() : [];
    let j = 0;
    for (const i of members) {
      const s = col.status[i];
      if (s === CELL_NUMBER) {
        values[j] = col.values[i];
        index[j++] = i;
      } else if (s !== CELL_MISSING && notes.length < NOTED_CELLS) {
        const known = col.notes.find((n) => n.row === i + 1);
        notes.push(
          known ?? Object.freeze({ row: i + 1, line: col.lineOf(i), text: texts[i].trim() }),
        );
      }
    }
    const provenance: NumericProvenance = Object.freeze({
      ...base,
      rowsRead: members.length,
      numbers,
      missing,
      nonNumeric,
      nonNumericCells: Object.freeze(notes),
      used: numbers,
      missingDropped: missing,
      textDropped: nonNumeric,
    });
    return Object.freeze({
      group: g,
      column: _freezeColumn(whole.name, values, () => index, provenance),
    });
  });
  return Object.freeze({ name: whole.name, by, groups: Object.freeze(result), rowsWithoutGroup });
}
