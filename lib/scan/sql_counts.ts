/**
 * The counting statements of a scan (pass 0): rows, present cells, numbers,
 * the range, and the cells that are censored (`<0.5`, `>100`) or other
 * text, with the few shown in messages. The dialect and the shared pieces
 * are in `sql.ts`.
 *
 * @module
 */
import { censoredPatternSource, type CensorSide } from "../data/censored_cell.ts";
import { type Dialect, quoteIdent, quoteText } from "./sql.ts";

/**
 * The side of a censored cell of the cell expression `cell` (see
 * {@linkcode cellExpr}): −1 below a limit (`<0.5`), +1 above one
 * (`>100`), NULL for every other cell. The patterns come from
 * `lib/data/censored_cell.ts` (`censoredPatternSource`), so a scan counts
 * the cells the in-memory reader keeps as censored; a limit must also read
 * as a finite number (`<1e999` is text there too). The patterns run only on
 * cells that do not read as numbers (`v` NULL, `cell` not NULL).
 */
export function censoredSideExpr(dialect: Dialect, cell: string, v: string): string {
  const side = (s: CensorSide) => {
    const p = quoteText(censoredPatternSource(s));
    const limit = dialect.tryDouble(dialect.capture(cell, p, 1));
    return `WHEN ${dialect.fullMatch(cell, p)} THEN ` +
      `(CASE WHEN ${dialect.finite(limit)} THEN ${s} END)`;
  };
  return `(CASE WHEN ${v} IS NULL AND ${cell} IS NOT NULL THEN ` +
    `(CASE ${side(-1)} ${side(1)} END) END)`;
}

/**
 * The limit of a censored cell of `cell` whose side (see
 * {@linkcode censoredSideExpr}) is the expression `side`.
 */
export function censoredLimitExpr(dialect: Dialect, cell: string, side: string): string {
  const limit = (s: CensorSide) =>
    dialect.tryDouble(dialect.capture(cell, quoteText(censoredPatternSource(s)), 1));
  return `(CASE ${side} WHEN -1 THEN ${limit(-1)} WHEN 1 THEN ${limit(1)} END)`;
}

/**
 * Pass 0: rows, present cells (of the cell expression `cell`, see
 * {@linkcode cellExpr}), numbers, non-finite numbers, the finite range,
 * and (`textual`) the censored cells below and above a limit (see
 * {@linkcode censoredSideExpr}; 0 for a column of numbers). For a text
 * column, `present − numeric − below − above` cells hold other text.
 */
export function countsSql(
  dialect: Dialect,
  relation: string,
  cell: string,
  v: string,
  textual = true,
): string {
  const f = dialect.finite("v");
  const side = textual ? censoredSideExpr(dialect, "c", "v") : "NULL";
  return `SELECT CAST(count(*) AS DOUBLE) AS total, CAST(count(c) AS DOUBLE) AS present, ` +
    `CAST(count(v) AS DOUBLE) AS numeric, ` +
    `CAST(count(*) FILTER (WHERE v IS NOT NULL AND NOT ${f}) AS DOUBLE) AS nonfinite, ` +
    `min(v) FILTER (WHERE ${f}) AS lo, max(v) FILTER (WHERE ${f}) AS hi, ` +
    `CAST(count(*) FILTER (WHERE side = -1) AS DOUBLE) AS below, ` +
    `CAST(count(*) FILTER (WHERE side = 1) AS DOUBLE) AS above ` +
    `FROM (SELECT c, v, ${side} AS side FROM ` +
    `(SELECT ${cell} AS c, ${v} AS v FROM ${relation}) AS s0) AS s`;
}

/**
 * The most frequent limits of the censored cells of `cell` (see
 * {@linkcode censoredSideExpr}), for the message that refuses them. Rows:
 * (side, limit, cells), most cells first, at most `limit` rows.
 */
export function censoredLimitsSql(
  dialect: Dialect,
  relation: string,
  cell: string,
  v: string,
  limit: number,
): string {
  return `SELECT CAST(side AS DOUBLE) AS side, ${censoredLimitExpr(dialect, "c", "side")} ` +
    `AS lim, CAST(count(*) AS DOUBLE) AS cells FROM (SELECT c, ` +
    `${censoredSideExpr(dialect, "c", "v")} AS side FROM ` +
    `(SELECT ${cell} AS c, ${v} AS v FROM ${relation}) AS s0) AS s ` +
    `WHERE side IS NOT NULL GROUP BY side, lim ORDER BY cells DESC, side, lim LIMIT ${limit}`;
}

/**
 * Pass 0 without filters: rows, present cells, numbers and the range. On a
 * Parquet file DuckDB answers it from the file's statistics without reading
 * the data; when the range is finite there is no NaN or ±Infinity (NaN
 * sorts above +Infinity in DuckDB), and {@linkcode countsSql} is not needed.
 */
export function quickCountsSql(relation: string, column: string, v: string): string {
  return `SELECT CAST(count(*) AS DOUBLE) AS total, CAST(count(c) AS DOUBLE) AS present, ` +
    `CAST(count(v) AS DOUBLE) AS numeric, 0.0 AS nonfinite, min(v) AS lo, max(v) AS hi, ` +
    `0.0 AS below, 0.0 AS above ` +
    `FROM (SELECT ${quoteIdent(column)} AS c, ${v} AS v FROM ${relation}) AS s`;
}

/**
 * A few cells of a text column (its cell expression `cell`, see
 * {@linkcode cellExpr}) that are neither numbers nor censored values, for
 * the error message.
 */
export function textCellsSql(
  dialect: Dialect,
  relation: string,
  cell: string,
  v: string,
  limit: number,
): string {
  const c = cell;
  return `SELECT CAST(${c} AS VARCHAR) FROM ${relation} ` +
    `WHERE ${c} IS NOT NULL AND ${v} IS NULL AND ${censoredSideExpr(dialect, c, v)} IS NULL ` +
    `LIMIT ${limit}`;
}
