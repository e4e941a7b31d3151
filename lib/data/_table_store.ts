/**
 * The link from a frozen {@linkcode Table} to its column data, kept out of
 * sight so that the table itself stays a small frozen object.
 *
 * @module
 */
import type { Table } from "./table.ts";
import type { _RawColumn } from "./_raw_column.ts";
import { PlumbError } from "../errors.ts";

/** What the store holds for each table. */
export interface _TableData {
  readonly byName: ReadonlyMap<string, _RawColumn>;
  readonly order: readonly string[];
}

const _store = new WeakMap<Table, _TableData>();

/** Remember a table's column data. */
export function _remember(table: Table, data: _TableData): void {
  _store.set(table, data);
}

/** Whether a value is a table built by plumbline. */
export function _isTable(value: unknown): value is Table {
  return typeof value === "object" && value !== null && _store.has(value as Table);
}

/** A table's column by name; throws `"unknown-column"` when absent. */
export function _rawColumn(table: Table, name: string): _RawColumn {
  const data = _store.get(table);
  if (data === undefined) {
    throw new PlumbError(
      "bad-option",
      "Cannot read columns of this object: it is not a table from loadTable; load it with loadTable first",
    );
  }
  const col = data.byName.get(name);
  if (col === undefined) {
    const shown = data.order.slice(0, 20).map((n) => JSON.stringify(n)).join(", ");
    const list = data.order.length > 20 ? `${shown} and ${data.order.length - 20} more` : shown;
    throw new PlumbError(
      "unknown-column",
      `Unknown column ${JSON.stringify(String(name))}: the table has ${
        list === "" ? "no columns" : list
      }; check the spelling`,
      { column: name, columns: data.order },
    );
  }
  return col;
}
