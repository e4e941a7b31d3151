/**
 * The statements a survey runs over many columns of the source at once,
 * before any is screened: counting their cells (with their ranges) and
 * reading how they run down the rows. The dialect and the shared pieces
 * are in `sql.ts`.
 *
 * @module
 */
import { cellExpr, type Dialect, valueExpr } from "./sql.ts";
import { censoredSideExpr } from "./sql_counts.ts";

/**
 * One pass over several columns: rows, and for each column its present
 * cells and (`textual`) those that read as finite numbers and those that
 * are censored below and above a limit (see `censoredSideExpr`), so that
 * columns not screened still report what they hold; for a column of
 * numbers (`numeric`), its smallest and largest value too (from a Parquet
 * file's statistics when the engine can). Columns: `total`, then `p<i>`,
 * `q<i>`, `lo<i>`, `hi<i>`, `l<i>`, `r<i>`.
 */
export function presenceSql(
  dialect: Dialect,
  relation: string,
  columns: readonly {
    readonly name: string;
    readonly textual: boolean;
    readonly numeric: boolean;
  }[],
): string {
  const parts = columns.map((c, i) => {
    const q = cellExpr(c.name, c.textual);
    const v = valueExpr(dialect, c.name, true, 1);
    const numeric = c.textual ? `count(${v})` : `count(${q})`;
    const side = censoredSideExpr(dialect, q, v);
    const censored = !c.textual
      ? `0.0 AS l${i}, 0.0 AS r${i}`
      : `CAST(count(*) FILTER (WHERE ${side} = -1) AS DOUBLE) AS l${i}, ` +
        `CAST(count(*) FILTER (WHERE ${side} = 1) AS DOUBLE) AS r${i}`;
    const range = !c.numeric
      ? `NULL AS lo${i}, NULL AS hi${i}`
      : `CAST(min(${q}) AS DOUBLE) AS lo${i}, CAST(max(${q}) AS DOUBLE) AS hi${i}`;
    return `CAST(count(${q}) AS DOUBLE) AS p${i}, CAST(${numeric} AS DOUBLE) AS q${i}, ` +
      `${range}, ${censored}`;
  });
  return `SELECT CAST(count(*) AS DOUBLE) AS total${
    parts.map((x) => `, ${x}`).join("")
  } FROM ${relation}`;
}

/**
 * How columns run down the rows, in one windowed pass (row order: see the
 * module doc of `sql.ts`): for each value expression `v`, the smallest and largest of
 * v − (row number), equal and whole when the values run k, k + 1, … (then
 * k − 1 is that value); the rows where v is not a finite whole number; and,
 * when `increasing` is asked, the smallest step from the row above.
 * Columns: `total`, then `a<i>`, `b<i>`, `f<i>`, `d<i>` (NULL when not asked).
 */
export function rowRunsSql(
  dialect: Dialect,
  relation: string,
  columns: readonly { readonly v: string; readonly increasing: boolean }[],
): string {
  const inner = columns.map((c, i) => `${c.v} AS v${i}`).join(", ");
  const windowed = columns.map((c, i) =>
    `v${i}${c.increasing ? `, ${dialect.previous(`v${i}`)} AS u${i}` : ""}`
  ).join(", ");
  const parts = columns.map((c, i) =>
    `min(v${i} - r) AS a${i}, max(v${i} - r) AS b${i}, ` +
    `CAST(count(*) FILTER (WHERE v${i} IS NULL OR NOT ${dialect.finite(`v${i}`)} ` +
    `OR v${i} <> floor(v${i})) AS DOUBLE) AS f${i}, ` +
    (c.increasing ? `min(v${i} - u${i}) AS d${i}` : `NULL AS d${i}`)
  );
  return `SELECT CAST(count(*) AS DOUBLE) AS total, ${parts.join(", ")} FROM ` +
    `(SELECT ${dialect.rowNumber} AS r, ${windowed} FROM ` +
    `(SELECT ${inner} FROM ${relation}) AS s0) AS s1`;
}
