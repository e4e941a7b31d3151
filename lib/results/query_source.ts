/**
 * The protocol between the chain (`plumb`, `survey`, `.by()`) and a source
 * whose values stay inside a query engine: the chain asks for screenings,
 * the source answers with the same plain analysis as in memory, computed
 * from aggregates, exact order statistics at chosen ranks and a seeded
 * sample. `scan()` implements it; the chain never imports the engine.
 *
 * @module
 */
import type { QqOptions } from "../stats/qq_data.ts";
import type { Analysis } from "./analysis.ts";
import type { Reexpression } from "../reexpress/reexpression.ts";

/** The key under which a source offers its {@linkcode QueryEngine}. */
export const QUERY_SOURCE: unique symbol = Symbol.for("plumbline.querySource") as never;

/** One column of a query source. */
export interface QueryColumn {
  /** The column's name. */
  readonly name: string;
  /** The engine's type, e.g. `"DOUBLE"`, `"VARCHAR"`. */
  readonly type: string;
  /** How the chain can use it: screened (`"numeric"`), grouped by (`"text"`), or neither. */
  readonly kind: "numeric" | "text" | "other";
}

/** One group of a grouping column, with the variable's counts in it. */
export interface QueryGroup {
  /** The group's value as text, or `null` for rows with an empty group cell. */
  readonly value: string | null;
  /** Finite numbers of the variable in the group. */
  readonly n: number;
  /** Missing cells of the variable in the group. */
  readonly missing: number;
  /** Cells of the variable that are text or not finite. */
  readonly text: number;
  /** The engine's mean of the group's finite numbers (NaN when none). */
  readonly mean: number;
}

/** What one column of a query source holds, counted without screening it. */
export interface QueryCounts {
  /** The column's name. */
  readonly column: string;
  /** Rows of the source. */
  readonly rows: number;
  /** Empty cells. */
  readonly missing: number;
  /**
   * Cells that are not empty and read neither as numbers nor as censored
   * values (0 for a numeric column).
   */
  readonly text: number;
  /**
   * Cells that read as censored values, as in memory (`<0.5` below a limit,
   * `>100` above one; 0 for a numeric column). An engine that cannot tell
   * them from text counts them in `text` and gives 0 here.
   */
  readonly censored?: { readonly below: number; readonly above: number };
  /** The smallest and largest value of a numeric column with one at least (absent for text). */
  readonly range?: readonly [min: number, max: number];
}

/**
 * How a column runs down the rows: the facts the identifier rules look at
 * (`lib/plumb/identifiers.ts`), measured in memory or by a query engine.
 */
export interface RowRun {
  /** The column's name. */
  readonly name: string;
  /** Rows of the table. */
  readonly rows: number;
  /** Every cell holds a finite whole number (none missing, none text). */
  readonly whole: boolean;
  /** The first value, when the values run k, k + 1, … k + rows − 1 down the rows; else null. */
  readonly runsFrom: number | null;
  /** Every value is larger than the one above it (false when not asked). */
  readonly increasing: boolean;
}

/** A re-expression the engine applies to a column before screening it. */
export interface QueryTransform {
  /** The re-expression (plain data, as in memory). */
  readonly reexpression: Reexpression;
  /** How it is written with the column's name, e.g. `"ln(fill_ml)"`. */
  readonly label: string;
}

/** What the chain asks a query source to screen. */
export interface QueryRequest {
  /** The numeric column. */
  readonly column: string;
  /** Title of the result (the column, its group). */
  readonly label: string;
  /** Only the rows where the column `group.by` holds `group.value` (as text). */
  readonly group?: { readonly by: string; readonly value: string };
  /**
   * Instead of the values, their residuals from the given mean of their
   * group of the column `by` (rows of groups not listed are left out). The
   * chain hands the means over, so that the residuals are the same from run
   * to run (an engine's own grouped mean may add its terms in any order).
   */
  readonly residuals?: {
    readonly by: string;
    readonly means: readonly (readonly [group: string, mean: number])[];
  };
  /** Leave out text cells of a text column (counted) instead of failing. */
  readonly dropText?: boolean;
  /** Screen the column re-expressed by the engine instead of as it is. */
  readonly transform?: QueryTransform;
  /** QQ envelope options. */
  readonly qq?: QqOptions;
}

/** A screening by the engine: the analysis, and the seeded sample behind its order-statistic tests. */
export interface QueryScreening {
  /** The same fields as the in-memory analysis; `subsample` states the sample used. */
  readonly analysis: Analysis;
  /** The seeded sample (sorted) that Shapiro–Wilk and the other order-statistic tests used. */
  readonly sample: Float64Array;
  /** The smallest and largest finite value screened (over every value, not the sample). */
  readonly range: readonly [min: number, max: number];
  /** Box–Cox λ by maximum likelihood over every value, when the values are positive. */
  readonly lambda?: number;
}

/** What a query source does for the chain. Every call opens and closes its own connection. */
export interface QueryEngine {
  /** The source in words, for captions (a path or a shortened query). */
  readonly name: string;
  /** The source's columns. */
  columns(): Promise<readonly QueryColumn[]>;
  /**
   * Rows, empty cells and text cells of each of `columns`, and the range of
   * each numeric one, in one pass. A text column's missing-value tokens
   * (`NA`, `-`, … as in memory) count as empty cells.
   */
  counts(columns: readonly string[]): Promise<readonly QueryCounts[]>;
  /**
   * The groups of `by` (sorted, the empty group last) with the counts of
   * `column` (re-expressed when `transform` is given) in each.
   */
  groups(column: string, by: string, transform?: QueryTransform): Promise<readonly QueryGroup[]>;
  /**
   * How each of `columns` runs down the rows, in the order the engine reads
   * the source, in one pass over those columns only; whether each value
   * exceeds the one above is found for the columns in `increasing` only. An
   * engine that reads in no fixed order leaves this out, and the survey then
   * takes no column for a row identifier.
   */
  rowRuns?(columns: readonly string[], increasing: readonly string[]): Promise<readonly RowRun[]>;
  /**
   * Screen each request in turn on one connection; a request the methods
   * cannot screen gives its `PlumbError` in place of the screening.
   */
  screen(requests: readonly QueryRequest[]): Promise<(QueryScreening | Error)[]>;
}

/** A source whose values stay in a query engine, e.g. `scan("lines/*.parquet")`. */
export interface QuerySource {
  /** The engine behind the source. */
  readonly [QUERY_SOURCE]: QueryEngine;
}

/**
 * Whether a value is a {@linkcode QuerySource}.
 *
 * @param source anything handed to `plumb` or `survey`
 * @example
 * ```ts
 * import { isQuerySource } from "./query_source.ts";
 * if (isQuerySource([1, 2, 3]) || isQuerySource(null)) throw new Error("query source");
 * ```
 */
export function isQuerySource(source: unknown): source is QuerySource {
  return typeof source === "object" && source !== null &&
    typeof (source as Partial<QuerySource>)[QUERY_SOURCE] === "object";
}
