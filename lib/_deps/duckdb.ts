/**
 * DuckDB's Node API (embedded SQL engine; the native library ships inside
 * the npm package), pinned: the one place `lib/` imports it from (see
 * README.md here).
 *
 * @module
 */
export { DuckDBConnection, DuckDBInstance } from "npm:@duckdb/node-api@1.5.6-r.1";
