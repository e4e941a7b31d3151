/**
 * What a chain analyses: its values, read from the table without a copy
 * when every cell is used, and their rows, looked up only where needed.
 *
 * @module
 */
import { _numericColumnShared } from "../data/numeric_column.ts";
import type { NumericColumn, Table } from "../data/table.ts";
import { residualsLoaded, type ResidualValues } from "./residual_link.ts";

/** The values a chain analyses, with their rows and what was left out. */
export interface Loaded {
  /** Read-only: may be the table's own array (never written to). */
  readonly values: Float64Array;
  /** The 0-based table rows of the values, built on first call. */
  readonly rows: () => Int32Array;
  /** The 1-based data row of the value at a 0-based position, looked up only when drawn. */
  readonly rowLabel: (position: number) => number;
  /** Missing cells left out. */
  readonly missing: number;
  /** Text cells left out on request. */
  readonly text: number;
  /** Each value's side when any is censored (0 measured, −1 below, 1 above its limit). */
  readonly censor?: Int8Array;
}

/**
 * The 1-based data row of the value at a 0-based position, read only for
 * the QQ points drawn: with every row used it is the position + 1, and the
 * column's row index (4 bytes a value) is never built.
 */
export function rowLabelOf(col: NumericColumn, rowCount: number): (position: number) => number {
  return col.values.length === rowCount ? (j) => j + 1 : (j) => col.rowIndex[j] + 1;
}

/**
 * A column's values for a chain, censored values as their limits with their
 * sides; throws `"non-numeric"` (unless text is dropped) as `table.numeric`
 * does.
 */
export function loadColumn(table: Table, column: string, dropText: boolean): Loaded {
  const col = _numericColumnShared(table, column, { dropText });
  return {
    values: col.values,
    rows: () => col.rowIndex, // built on first read, by the column
    rowLabel: rowLabelOf(col, table.rowCount),
    missing: col.provenance.missingDropped,
    text: col.provenance.textDropped,
    censor: col.censor,
  };
}

/** A residual chain's values: the residuals and their rows (see `residualsLoaded`). */
export function loadResiduals(from: Loaded, fitted: ResidualValues): Loaded {
  const r = residualsLoaded({ missing: from.missing, text: from.text }, fitted);
  return { ...r, rows: () => r.rows, rowLabel: (j) => r.rows[j] + 1 };
}

/** Every value's 1-based row label, for a QQ plot drawn with options of its own. */
export function allRowLabels(loaded: Loaded): Int32Array {
  return new Int32Array(loaded.values.length).map((_, j) => loaded.rowLabel(j));
}
