/**
 * The types of a loaded table: its columns, their kinds and where every
 * number came from.
 *
 * A {@linkcode Table} is what {@linkcode ./load_table.ts loadTable} returns.
 * It is frozen; asking it for a column hands back a fresh copy that the
 * caller owns.
 *
 * @module
 */

/**
 * What a column holds, decided once when the table is loaded.
 *
 * - `"numeric"`: at least one cell is a number (measured or censored) and
 *   the cells that are text (neither a number, a censored value nor a
 *   missing-value token) are fewer than the cells that are numbers. A numeric column may still hold a few text cells; asking for
 *   its numbers then fails with a `"non-numeric"` error that names them,
 *   unless they are dropped on purpose with `{ dropText: true }`.
 * - `"text"`: at least one text cell and no more numbers than text cells; a
 *   column for grouping (`.by(column)`), not for screening.
 * - `"empty"`: every cell is missing.
 */
export type ColumnKind = "numeric" | "text" | "empty";

/** One cell that was noted while loading: where it is and what it held. */
export interface CellNote {
  /** 1-based data row (the first row after the header is row 1). */
  readonly row: number;
  /**
   * 1-based line of the CSV text where the row starts (the header is line 1
   * when it is the first line), or `null` for in-memory sources.
   */
  readonly line: number | null;
  /** The cell as it was read (trimmed of surrounding spaces). */
  readonly text: string;
}

/**
 * The limits of a column's censored cells: one entry per side and limit,
 * with the number of cells at it.
 */
export interface CensoredLimit {
  /** `"below"`: left-censored (`<0.5`); `"above"`: right-censored (`>1000`). */
  readonly side: "below" | "above";
  /** The limit. */
  readonly limit: number;
  /** How many cells of the column are censored at this limit on this side. */
  readonly count: number;
}

/** How many distinct limits a column's provenance lists. */
export const LISTED_LIMITS = 10;

/**
 * How many cells of a column fell in each class — numbers, censored (below
 * or above a limit), missing, text — and the first text cells.
 */
export interface ColumnProvenance {
  /** The file name (without folders), `"text"` for CSV text, `"memory"` for in-memory data. */
  readonly source: string;
  /** The column's name in the table. */
  readonly column: string;
  /** The name in the source header, when it was changed to make names unique and non-empty. */
  readonly originalName: string;
  /** Data rows read from the source (every row, whatever its cells held). */
  readonly rowsRead: number;
  /** Cells that parsed as finite numbers (measured values, not censored ones). */
  readonly numbers: number;
  /** Cells below a limit (`<0.5`, `≤0.5`, or a limit word with the column's limit given). */
  readonly censoredLeft: number;
  /** Cells above a limit (`>1000`, `≥1000`). */
  readonly censoredRight: number;
  /**
   * The distinct limits of the censored cells with their counts, below
   * before above, each side by increasing limit (at most
   * {@linkcode LISTED_LIMITS}; the counts above are complete).
   */
  readonly censoredLimits: readonly CensoredLimit[];
  /** Cells that were empty or held a missing-value token. */
  readonly missing: number;
  /** Cells that were neither a number, censored, nor missing. */
  readonly nonNumeric: number;
  /** The first text cells (at most {@linkcode NOTED_CELLS}), in row order. */
  readonly nonNumericCells: readonly CellNote[];
}

/** How many text cells each column keeps notes on. */
export const NOTED_CELLS = 10;

/** A column's name, kind and provenance, as listed in {@linkcode Table.columns}. */
export interface ColumnInfo {
  /** The column's (unique, non-empty) name. */
  readonly name: string;
  /** What the column holds; see {@linkcode ColumnKind} for the rule. */
  readonly kind: ColumnKind;
  /** Counts of numbers, missing and text cells, and the first text cells. */
  readonly provenance: ColumnProvenance;
  /**
   * A remark for the reader when the column's kind may not be what was meant,
   * else `null`: a text column whose noted cells would all read as numbers
   * with the other decimal mark (a `;` file written with `.` decimals).
   */
  readonly hint: string | null;
}

/** A header name that was changed when the table was loaded, and why. */
export interface HeaderRename {
  /** 0-based position of the column. */
  readonly index: number;
  /** The name in the source. */
  readonly from: string;
  /** The name in the table. */
  readonly to: string;
  /** Why: the name was empty, or an earlier column already had it. */
  readonly reason: "empty" | "duplicate";
}

/** Where a numeric column's values came from and what was left out. */
export interface NumericProvenance extends ColumnProvenance {
  /** Values handed back: numbers and censored cells. */
  readonly used: number;
  /** Missing cells left out (always all of them; listed so every output can show the count). */
  readonly missingDropped: number;
  /** Text cells left out because `dropText` was set (0 otherwise). */
  readonly textDropped: number;
}

/**
 * The numbers of one column, ready for analysis: missing cells (and, when
 * asked for, text cells) removed and counted; censored cells kept, each with
 * its side in `censor` and its limit in `values`.
 */
export interface NumericColumn {
  /** The column's name. */
  readonly name: string;
  /**
   * The used values, in row order: the measured value, or the limit of a
   * censored cell. A fresh copy owned by the caller.
   */
  readonly values: Float64Array;
  /**
   * Present only when some value is censored: aligned with `values`, 0 for a
   * measured value, −1 left-censored (the true value is at most
   * `values[i]`), +1 right-censored (at least `values[i]`).
   */
  readonly censor?: Int8Array;
  /**
   * The 0-based table row of each value (`values[i]` came from row
   * `rowIndex[i]`), for tooltips and for lining up with a text column.
   * Built on first read, then reused (the same array each time).
   */
  readonly rowIndex: Int32Array;
  /** Counts of what was read, used and left out. */
  readonly provenance: NumericProvenance;
  /** Plain data for JSON: the arrays as number arrays. */
  toJSON(): {
    name: string;
    values: number[];
    censor?: number[];
    rowIndex: number[];
    provenance: NumericProvenance;
  };
}

/**
 * Every cell of a column as numbers, aligned with the table's rows: a cell
 * that is neither a number nor censored is `NaN` in `values` and flagged in
 * one of the masks.
 */
export interface NumericCells {
  /** The column's name. */
  readonly name: string;
  /** One value per row: the number, a censored cell's limit, `NaN` where missing or text. */
  readonly values: Float64Array;
  /**
   * Present only when some cell is censored: one entry per row, 0 unless the
   * cell is censored, −1 below its limit, +1 above it.
   */
  readonly censor?: Int8Array;
  /** 1 where the cell is missing, 0 elsewhere. */
  readonly missing: Uint8Array;
  /** 1 where the cell is text (not a number, not missing), 0 elsewhere. */
  readonly nonNumeric: Uint8Array;
}

/** A group label that was written in several ways differing only in spaces. */
export interface MergedLabel {
  /** The label used: surrounding spaces removed, inner runs of spaces made one space. */
  readonly label: string;
  /** Every spelling met, in order of first appearance (the label itself included when met). */
  readonly spellings: readonly string[];
}

/**
 * A column's cells as labels, aligned with the table's rows (for grouping).
 * Labels that differ only in spaces — surrounding ones, no-break spaces,
 * doubled spaces — are one label: `" A"`, `"A "` and `"A\u00a0"` all read
 * `"A"`, and `merged` says which spellings were merged.
 */
export interface TextColumn {
  /** The column's name. */
  readonly name: string;
  /** One label per row; `""` where the cell is missing. Frozen. */
  readonly values: readonly string[];
  /** 1 where the cell is missing, 0 elsewhere. */
  readonly missing: Uint8Array;
  /** The labels written in more than one way, with their spellings (empty when none). */
  readonly merged: readonly MergedLabel[];
}

/** Options for {@linkcode Table.numeric}. */
export interface NumericColumnOptions {
  /**
   * Leave out text cells (counted in `provenance.textDropped`) instead of
   * failing with a `"non-numeric"` error.
   * @default false
   */
  readonly dropText?: boolean;
}

/** The plain-data description of a table, as given by {@linkcode Table.toJSON}. */
export interface TableSummary {
  /** The file name (without folders), `"text"` or `"memory"`. */
  readonly source: string;
  /** Number of data rows. */
  readonly rowCount: number;
  /** Every column in source order, with its kind and provenance. */
  readonly columns: readonly ColumnInfo[];
  /** Header names changed to make them unique and non-empty (empty when none were). */
  readonly renamed: readonly HeaderRename[];
  /** The delimiter used (`null` for in-memory sources). */
  readonly delimiter: string | null;
  /** The decimal mark used for text cells. */
  readonly decimal: "." | ",";
}

/** A loaded table: frozen, with typed columns and per-column provenance. */
export interface Table extends TableSummary {
  /** Whether the table has a column of this name. */
  has(name: string): boolean;
  /** The column's name, kind and provenance; throws `"unknown-column"` when absent. */
  info(name: string): ColumnInfo;
  /** Names of the columns whose kind is `"numeric"`, in source order. */
  numericNames(): string[];
  /** Names of the columns whose kind is `"text"`, in source order. */
  textNames(): string[];
  /** The used numbers of a column; see {@linkcode ./numeric_column.ts numericColumn}. */
  numeric(name: string, options?: NumericColumnOptions): NumericColumn;
  /** Every cell of a column as numbers with masks, aligned with rows. */
  numericCells(name: string): NumericCells;
  /** Every cell of a column as text with a missing mask, aligned with rows. */
  text(name: string): TextColumn;
  /**
   * The 1-based line of the source (CSV line, worksheet row) where a 0-based
   * data row starts, or `null` for sources without lines (in-memory data).
   */
  lineOf(row: number): number | null;
  /** The table's description (source, rows, columns with provenance) as plain data. */
  toJSON(): TableSummary;
}
