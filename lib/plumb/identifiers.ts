/**
 * Identifier columns: numbers that name rows rather than measure anything.
 * Spreadsheet and statistics exports often write the row number as a first
 * column with an empty header (or one like `Unnamed: 0`, `...1`, `X`), and
 * many tables carry a 1, 2, 3, … sequence as an index. Screened as data,
 * such a column looks like a uniform distribution and crowds the survey.
 *
 * Rules (common practice): a column is an identifier when
 * - its values, in row order and with no cell missing, are consecutive whole
 *   numbers k, k + 1, …, k + n − 1 (at least 5 rows); or
 * - it is the table's first column, its header was empty or is one that
 *   exports write for row names (`Unnamed: 0`, `...1`, `X`, `V1`, `#`,
 *   `row`, `rownames`, `index`, `id`), and its values are whole numbers
 *   increasing strictly down the rows.
 *
 * @module
 */
import type { Table } from "../data/table.ts";

/** A column left out as an identifier, and why. */
export interface IdentifierColumn {
  /** The column's name in the table. */
  readonly name: string;
  /** Why it looks like an identifier, in words. */
  readonly reason: string;
}

/** Header names that exports write for a row-name column (compared in lower case, trimmed). */
const _ROW_NAME_HEADERS = new Set([
  "",
  "unnamed: 0",
  "...1",
  "x",
  "v1",
  "#",
  "row",
  "rownames",
  "row.names",
  "index",
  "id",
]);

/** Fewest rows for a sequence to count as an index. */
const _MIN_ROWS = 5;

/**
 * The identifier columns among the named numeric columns of a table.
 *
 * @param table the table
 * @param names the numeric columns to look at
 *
 * @example
 * ```ts
 * import { identifierColumns } from "./identifiers.ts";
 * import { toTable } from "./source.ts";
 * const t = toTable({ id: [1, 2, 3, 4, 5, 6], fill: [5.1, 4.9, 5.3, 5.0, 5.2, 4.8] });
 * const ids = identifierColumns(t, ["id", "fill"]);
 * if (ids.length !== 1 || ids[0].name !== "id") throw new Error("id is a row index");
 * ```
 */
export function identifierColumns(table: Table, names: readonly string[]): IdentifierColumn[] {
  const out: IdentifierColumn[] = [];
  const first = table.columns[0]?.name;
  const emptyHeader = new Set(
    table.renamed.filter((r) => r.reason === "empty").map((r) => r.to),
  );
  for (const name of names) {
    const cells = table.numericCells(name);
    const n = cells.values.length;
    if (n < _MIN_ROWS) continue;
    let complete = true;
    let consecutive = true;
    let increasing = true;
    for (let i = 0; i < n; i++) {
      if (cells.missing[i] || cells.nonNumeric[i]) {
        complete = false;
        break;
      }
      const v = cells.values[i];
      if (!Number.isInteger(v)) {
        increasing = consecutive = false;
        break;
      }
      if (i > 0) {
        const d = v - cells.values[i - 1];
        if (d !== 1) consecutive = false;
        if (!(d > 0)) increasing = false;
      }
    }
    if (!complete) continue;
    if (consecutive) {
      out.push(Object.freeze({
        name,
        reason: `its values run ${cells.values[0]}, ${cells.values[1]}, … ${
          cells.values[n - 1]
        } down the rows, like a row number`,
      }));
      continue;
    }
    const original = table.info(name).provenance.originalName.trim().toLowerCase();
    const rowNameHeader = emptyHeader.has(name) || _ROW_NAME_HEADERS.has(original);
    if (increasing && name === first && rowNameHeader) {
      const header = table.info(name).provenance.originalName.trim();
      out.push(Object.freeze({
        name,
        reason: `the first column, ${
          header === "" ? "with no header" : `headed "${header}"`
        }, holds whole numbers increasing down the rows, like the row names an export writes`,
      }));
    }
  }
  return out;
}
