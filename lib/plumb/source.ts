/**
 * Turning whatever a user hands to `plumb` or `survey` into a table and one
 * numeric column's values, with their provenance.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { _isTable } from "../data/_table_store.ts";
import { frameColumns } from "../data/frame_like.ts";
import { tableFromMemory } from "../data/in_memory.ts";
import type { MemorySource } from "../data/memory_source.ts";
import type { Table } from "../data/table.ts";

/**
 * What `plumb` and `survey` accept: a table from `loadTable`, or in-memory
 * data (an array of numbers, rows, columns, a data frame).
 */
export type PlumbSource = Table | MemorySource;

/**
 * Whether a source is a single column of cells (an array or typed array of
 * values, not of row objects), whose variable `plumb` names by its second
 * argument.
 *
 * @param source what was handed to `plumb`
 * @example
 * ```ts
 * import { singleColumn } from "./source.ts";
 * if (!singleColumn([1, 2, 3]) || singleColumn([{ x: 1 }]) || singleColumn({ x: [1] })) {
 *   throw new Error("shape");
 * }
 * ```
 */
export function singleColumn(source: PlumbSource): boolean {
  if (ArrayBuffer.isView(source)) return true;
  // A series of a data-frame library (toArray(), and no column names).
  const series = source as { toArray?: unknown };
  if (typeof series.toArray === "function" && frameColumns(source as object) === null) return true;
  if (!Array.isArray(source)) return false;
  const first = source.find((x) => x !== null && x !== undefined);
  return typeof first !== "object" || first instanceof Date || Array.isArray(first);
}

/**
 * Resolve a source to a table (in-memory data are loaded synchronously).
 *
 * @example
 * ```ts
 * import { toTable } from "./source.ts";
 * if (toTable([1, 2, 3], "fill").numericNames()[0] !== "fill") throw new Error("name");
 * ```
 */
export function toTable(source: PlumbSource, name = "value"): Table {
  if (_isTable(source)) return source as Table;
  if (typeof source === "string") {
    throw new PlumbError(
      "bad-option",
      "Cannot read a file or CSV text synchronously: load it first with `const t = await loadTable(path)` and pass the table",
    );
  }
  return tableFromMemory(source, { name });
}

/**
 * Pick the column to analyse: the one named, or the only numeric one.
 *
 * @example
 * ```ts
 * import { pickColumn, toTable } from "./source.ts";
 * if (pickColumn(toTable({ line: ["a", "b"], v: [1, 2] }), undefined) !== "v") throw new Error("pick");
 * ```
 */
export function pickColumn(table: Table, column: string | undefined): string {
  if (column !== undefined) {
    if (!table.has(column)) {
      const names = table.columns.map((c) => JSON.stringify(c.name)).join(", ");
      throw new PlumbError(
        "unknown-column",
        `No column named ${JSON.stringify(column)}: the table has ${names}`,
      );
    }
    return column;
  }
  const numeric = table.numericNames();
  if (numeric.length === 1) return numeric[0];
  throw new PlumbError(
    "bad-option",
    numeric.length === 0
      ? "The table has no numeric column to analyse"
      : `The table has ${numeric.length} numeric columns (${
        numeric.join(", ")
      }): name the one to analyse, e.g. plumb(table, "${numeric[0]}")`,
  );
}
