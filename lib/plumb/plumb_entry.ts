/**
 * `plumb(source, column)`, the entry point: a query source from `scan()`
 * starts a chain its engine computes ({@linkcode PlumbQuery}); in-memory data
 * (a table, an array, rows, columns, a data frame) are made a table, the
 * column picked and the options checked, and start a {@linkcode Plumb}.
 *
 * @module
 */
import { isQuerySource, QUERY_SOURCE, type QuerySource } from "../results/query_source.ts";
import * as checked from "./_chain_options.ts";
import type { PlumbOptions } from "./_chain_options.ts";
import { Plumb } from "./plumb.ts";
import { PlumbQuery } from "./query_chain.ts";
import * as order from "./serial_check.ts";
import { pickColumn, type PlumbSource, singleColumn, toTable } from "./source.ts";

/**
 * Start a chain over one numeric variable. Nothing is read or computed until the chain is first
 * shown or read. A query source (`scan(pathOrSql)`) gives a {@linkcode PlumbQuery}: the same
 * analysis computed by its engine, read with `await`.
 *
 * @param source a table from `loadTable`, an array of numbers, in-memory
 *   data (rows, columns, a data frame), or a query source from `scan`
 * @param column the column to analyse (optional when there is only one); for
 *   a plain array of numbers, the variable's name
 * @param options text-cell handling, envelope options
 *
 * @example
 * ```ts
 * import { plumb } from "@plumbline/plumbline";
 * const p = plumb([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1], "fill_ml");
 * if (p.analysis().n !== 10 || p.label !== "fill_ml") throw new Error("chain");
 * ```
 */
export function plumb(source: QuerySource, column?: string, options?: PlumbOptions): PlumbQuery;
/** The chain over in-memory data (a table, an array, rows, columns, a data frame). */
export function plumb(source: PlumbSource, column?: string, options?: PlumbOptions | null): Plumb;
export function plumb(
  source: PlumbSource | QuerySource,
  column?: string,
  options: PlumbOptions | null = {},
): Plumb | PlumbQuery {
  options = checked.plumbArguments(column, options);
  if (isQuerySource(source)) return new PlumbQuery(source[QUERY_SOURCE], column, options);
  const single = singleColumn(source);
  const name = single && column !== undefined ? column : options.name ?? "value";
  const table = toTable(source, name);
  const col = pickColumn(table, single ? undefined : column);
  return new Plumb({ table, column: col, options, order: order.checkOrder(table, options) });
}
