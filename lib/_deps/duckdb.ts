/**
 * DuckDB's Node API (embedded SQL engine; the native library ships inside
 * the npm package), pinned: the one place `lib/` imports it from (see
 * README.md here). It is loaded on first use, not when `mod.ts` is
 * imported: the native library needs `--allow-ffi`, which a program that
 * never scans should not have to grant.
 *
 * @module
 */
export type { DuckDBConnection, DuckDBInstance } from "npm:@duckdb/node-api@1.5.6-r.1";

/** The package, loaded once, on the first scan. */
export function loadDuckDB(): Promise<typeof import("npm:@duckdb/node-api@1.5.6-r.1")> {
  // The full specifier, as every file here uses, so that mod.ts works from any folder.
  // deno-lint-ignore no-import-prefix
  return import("npm:@duckdb/node-api@1.5.6-r.1");
}
