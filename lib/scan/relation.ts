/**
 * What `scan(pathOrSql)` reads from: the FROM-clause text for a Parquet or
 * CSV path (globs allowed) or an SQL query. Private to `lib/scan`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { quoteText } from "./sql.ts";

/** Whether the text given to `scan` is a query rather than a path. */
export function _relationIsQuery(s: string): boolean {
  return /^(select|with|from|values)\b/i.test(s) || s.startsWith("(");
}

/** The FROM-clause text for a path or a query. */
export function _relation(pathOrSql: string): string {
  const s = pathOrSql.trim();
  if (_relationIsQuery(s)) return `(${s}) AS src`;
  if (/\.parquet$/i.test(s)) return `read_parquet(${quoteText(s)})`;
  if (/\.(csv|tsv|txt)(\.gz)?$/i.test(s)) return `read_csv(${quoteText(s)})`;
  throw new PlumbError(
    "bad-option",
    `Cannot tell what to scan in ${JSON.stringify(s)}: give a path ending in .parquet, .csv, ` +
      `.tsv or .txt (globs such as "data/*.parquet" allowed), or an SQL query starting with SELECT`,
  );
}
