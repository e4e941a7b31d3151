/**
 * A variable split by a grouping column, or by the cells of several: each
 * group's values in original units with their rows (and censoring sides),
 * and what was left out. Shared by the screening (`group_screen.ts`) and the
 * per-group stakes; also the check of `.by()`'s columns.
 *
 * @module
 */
import type { MergedLabel, Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import { _numericCellsShared, _numericColumnShared } from "../data/numeric_column.ts";
import type { GroupState } from "./group_screen.ts";
import { pickColumn } from "./source.ts";
import { CELL_KEY_SEPARATOR, cellLabel, compareCells, givenCells } from "./_group_cells.ts";

export { CELL_SEPARATOR } from "./_group_cells.ts";

/** The rows of one group: where its numbers are, and the cells left out. */
export interface GroupSample {
  /** The group's value. */
  readonly group: string;
  /** The group's values in original units (before any re-expression), in row order. */
  readonly values: Float64Array;
  /** Their 0-based row indices in the table. */
  readonly rows: Int32Array;
  /** Each value's censoring side (0 measured, −1 below, 1 above its limit), when any is censored. */
  readonly censor?: Int8Array;
  /** The group's missing cells, left out. */
  readonly missingDropped: number;
  /** The group's text cells, left out on request. */
  readonly textDropped: number;
}

/** A variable split by a grouping column, groups in natural order. */
export interface GroupSplit {
  /** One entry per group, in natural order (numbers by value, then text). */
  readonly groups: readonly GroupSample[];
  /** Rows with a value but no group, left out. */
  readonly noGroup: number;
  /** Missing cells of the variable, in all rows. */
  readonly missingDropped: number;
  /** Text cells of the variable left out on request, in all rows. */
  readonly textDropped: number;
  /** Group labels merged because they differ only in spaces. */
  readonly mergedLabels: readonly MergedLabel[];
}

/**
 * Split the variable by the grouping column: the values of each group (in
 * original units), with what was left out. Raises `"non-numeric"` (naming
 * rows) unless text cells are dropped on request; a group with censored
 * values carries their sides in `censor`.
 *
 * @param state the table, the column and its steps, the grouping column and options
 */
export function splitGroups(state: GroupState): GroupSplit {
  const { table, column, groupBy, options } = state;
  const given = state.values?.();
  // The column is read from the table's own arrays where it holds them (read
  // only); the one copy is the groups' values, gathered once into one array.
  const used = given
    ? { provenance: { missingDropped: given.missing, textDropped: given.text } }
    : _numericColumnShared(table, column, { dropText: options.dropText ?? false });
  const cells = given
    ? givenCells(given, table.rowCount).cells
    : _numericCellsShared(table, column);
  const gs = (state.groupColumns ?? [groupBy]).map((c) => table.text(c));
  // Pass 1: each used row's group (or cell) id; per group, its count and the cells left out.
  const ids = new Map<string, number>();
  const count: number[] = [];
  const missing: number[] = [];
  const text: number[] = [];
  const groupOf = new Int32Array(table.rowCount).fill(-1);
  let noGroup = 0;
  for (let i = 0; i < table.rowCount; i++) {
    if (gs.some((g) => g.missing[i])) {
      if (!cells.missing[i] && !cells.nonNumeric[i]) noGroup++;
      continue;
    }
    const key = gs.length === 1
      ? gs[0].values[i]
      : gs.map((g) => g.values[i]).join(CELL_KEY_SEPARATOR);
    let id = ids.get(key);
    if (id === undefined) {
      ids.set(key, id = count.length);
      count.push(0);
      missing.push(0);
      text.push(0);
    }
    if (cells.missing[i]) missing[id]++;
    else if (cells.nonNumeric[i]) text[id]++;
    else {
      groupOf[i] = id;
      count[id]++;
    }
  }
  // Pass 2: each group's values, rows (and sides), contiguous, groups in natural order.
  const keys = [...ids.keys()].sort((a, b) => compareCells(a, b, gs.length));
  const start = new Int32Array(keys.length + 1);
  const next = new Int32Array(keys.length);
  keys.forEach((key, k) => {
    const id = ids.get(key)!;
    next[id] = start[k];
    start[k + 1] = start[k] + count[id];
  });
  const total = start[keys.length];
  const values = new Float64Array(total);
  const rows = new Int32Array(total);
  const sides = cells.censor;
  const censor = sides ? new Int8Array(total) : undefined;
  for (let i = 0; i < table.rowCount; i++) {
    const id = groupOf[i];
    if (id < 0) continue;
    const at = next[id]++;
    values[at] = cells.values[i];
    rows[at] = i;
    if (censor) censor[at] = sides![i];
  }
  const groups = keys.map((key, k) => {
    const id = ids.get(key)!;
    const [a, b] = [start[k], start[k + 1]];
    const c = censor?.subarray(a, b);
    return Object.freeze({
      group: gs.length === 1 ? key : cellLabel(key),
      values: values.subarray(a, b),
      rows: rows.subarray(a, b),
      missingDropped: missing[id],
      textDropped: text[id],
      ...(c && c.some((side) => side !== 0) ? { censor: c } : {}),
    });
  });
  return Object.freeze({
    groups: Object.freeze(groups),
    noGroup,
    missingDropped: used.provenance.missingDropped,
    textDropped: used.provenance.textDropped,
    mergedLabels: gs.flatMap((g) => g.merged),
  });
}

/**
 * Check the grouping columns of `.by()` where it is written: one name, or a
 * non-empty list of names the table has.
 *
 * @param table the chain's table
 * @param columns what `.by()` was given
 * @returns the columns (one or more)
 * @throws {PlumbError} `"unknown-column"`, `"bad-option"`
 * @example
 * ```ts
 * import { groupColumns } from "./group_split.ts";
 * import { toTable } from "./source.ts";
 * const t = toTable({ line: ["A", "B"], shift: ["x", "y"], v: [1, 2] });
 * if (groupColumns(t, ["line", "shift"]).length !== 2) throw new Error("columns");
 * ```
 */
export function groupColumns(
  table: Table,
  columns: string | readonly string[],
): readonly string[] {
  const list = typeof columns === "string" ? [columns] : columns;
  if (!Array.isArray(list) || list.length === 0) {
    throw new PlumbError(
      "bad-option",
      `Cannot group by ${
        JSON.stringify(columns)
      }: name a column, or a list of columns such as ["line", "shift"]`,
    );
  }
  for (const c of list) pickColumn(table, c);
  if (new Set(list).size !== list.length) {
    throw new PlumbError("bad-option", `Cannot group by ${list.join(", ")}: name each column once`);
  }
  return Object.freeze([...list]);
}
