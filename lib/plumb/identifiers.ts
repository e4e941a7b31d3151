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
import type { RowRun } from "../results/query_source.ts";

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
export const IDENTIFIER_MIN_ROWS = 5;

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
    if (n < IDENTIFIER_MIN_ROWS) continue;
    let whole = true;
    let consecutive = true;
    let increasing = true;
    for (let i = 0; i < n; i++) {
      const v = cells.values[i];
      if (cells.missing[i] || cells.nonNumeric[i] || !Number.isInteger(v)) {
        whole = false;
        break;
      }
      if (i > 0) {
        const d = v - cells.values[i - 1];
        if (d !== 1) consecutive = false;
        if (!(d > 0)) increasing = false;
      }
    }
    const run: RowRun = {
      name,
      rows: n,
      whole,
      runsFrom: whole && consecutive ? cells.values[0] : null,
      increasing: whole && increasing,
    };
    const header = table.info(name).provenance.originalName;
    const id = identifierOf(run, {
      first: name === first,
      header,
      emptyHeader: emptyHeader.has(name),
    });
    if (id) out.push(id);
  }
  return out;
}

/** Where a column stands in its table, for the row-name rule. */
export interface HeaderFacts {
  /** The column is the table's first. */
  readonly first: boolean;
  /** Its header as the source wrote it. */
  readonly header: string;
  /** Its header was empty (and the column was given a name). */
  readonly emptyHeader: boolean;
}

/**
 * Whether a header is one that exports write for a row-name column (or was
 * empty): the first column with such a header and increasing whole numbers
 * names rows.
 *
 * @param facts the column's place and header
 */
export function rowNameHeader(facts: HeaderFacts): boolean {
  return facts.first &&
    (facts.emptyHeader || _ROW_NAME_HEADERS.has(facts.header.trim().toLowerCase()));
}

/**
 * The rules applied to one column's facts: the identifier and its reason,
 * or null. Shared by the in-memory survey and the survey of a query source,
 * so both leave out the same columns with the same words.
 *
 * @param run how the column runs down the rows
 * @param facts its place and header
 *
 * @example
 * ```ts
 * import { identifierOf } from "./identifiers.ts";
 * const run = { name: "lot", rows: 8, whole: true, runsFrom: 41, increasing: true };
 * const id = identifierOf(run, { first: false, header: "lot", emptyHeader: false });
 * if (!id?.reason.startsWith("its values run 41, 42, … 48")) throw new Error("a run");
 * ```
 */
export function identifierOf(run: RowRun, facts: HeaderFacts): IdentifierColumn | null {
  if (run.rows < IDENTIFIER_MIN_ROWS || !run.whole) return null;
  if (run.runsFrom !== null) {
    const k = run.runsFrom;
    return Object.freeze({
      name: run.name,
      reason: `its values run ${k}, ${k + 1}, … ${
        k + run.rows - 1
      } down the rows, like a row number`,
    });
  }
  if (run.increasing && rowNameHeader(facts)) {
    const header = facts.header.trim();
    return Object.freeze({
      name: run.name,
      reason: `the first column, ${
        header === "" ? "with no header" : `headed "${header}"`
      }, holds whole numbers increasing down the rows, like the row names an export writes`,
    });
  }
  return null;
}

/**
 * Why a column left out as an identifier was left out, and how to screen
 * it: the words every survey shows.
 *
 * @param id the identifier column
 */
export function identifierOmission(id: IdentifierColumn): { column: string; reason: string } {
  return {
    column: id.name,
    reason: `${id.reason}, so it names rows rather than measuring anything; ` +
      `screen it with identifiers: true or by naming it in columns`,
  };
}
