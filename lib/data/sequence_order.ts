/**
 * The order in which a table's rows were measured, from a column the user
 * names: numbers (a sequence number, an elapsed time) or ISO 8601 date-times
 * (`2026-03-02T06:30`, `2026-03-02 06:30:15`, `2026-03-02`). File order is
 * never taken as time order unless asked for explicitly.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { Table } from "./table.ts";

/** The rows in sequence order and what was left out. Frozen plain data. */
export interface SequenceOrder {
  /** The column that gives the order, or `null` for the file's row order. */
  readonly column: string | null;
  /** `"numbers"`, `"date-times"` or `"file"`. */
  readonly kind: "numbers" | "date-times" | "file";
  /** 0-based table rows in sequence order; rows without an order value are left out. */
  readonly rows: Int32Array;
  /** Rows left out because their order cell is missing. */
  readonly missing: number;
  /** Rows that share their order value with another row (kept in file order among themselves). */
  readonly tied: number;
}

const _ISO =
  /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,9}))?)?)?(Z|[+-]\d{2}:?\d{2})?$/;

/**
 * Parse an ISO 8601 date or date-time to milliseconds since 1970 (UTC; an
 * offset, when given, is applied). Returns NaN for anything else.
 *
 * @example
 * ```ts
 * import { parseIsoTime } from "./sequence_order.ts";
 * if (parseIsoTime("2026-03-02T06:30") - parseIsoTime("2026-03-02") !== 6.5 * 3600e3) throw new Error("iso");
 * ```
 */
export function parseIsoTime(text: string): number {
  const m = _ISO.exec(text.trim());
  if (!m) return NaN;
  const [, y, mo, d, h = "0", mi = "0", s = "0", frac = "", zone] = m;
  const month = Number(mo),
    day = Number(d),
    hour = Number(h),
    minute = Number(mi),
    second = Number(s);
  if (month < 1 || month > 12 || day < 1 || day > 31 || hour > 24 || minute > 59 || second > 60) {
    return NaN;
  }
  let t = Date.UTC(Number(y), month - 1, day, hour, minute, second) +
    Number(`0.${frac || "0"}`) * 1000;
  if (zone && zone !== "Z") {
    const sign = zone[0] === "-" ? -1 : 1, digits = zone.slice(1).replace(":", "");
    t -= sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2))) * 60000;
  }
  return t;
}

/**
 * The table's rows in the order given by `column` (ascending, ties in file
 * order), or in file order when `column` is `null`.
 *
 * @param table a table from `loadTable`
 * @param column the column holding the sequence (numbers or ISO date-times), or `null`
 * @throws {PlumbError} `"unknown-column"`; `"non-numeric"` when a numeric
 *   column holds text, or a text column holds something other than ISO
 *   date-times; `"too-few"` when no row has an order value
 * @example
 * ```ts
 * import { loadTable } from "./load_table.ts";
 * import { sequenceOrder } from "./sequence_order.ts";
 * const t = await loadTable({ at: ["2026-03-02T08:00", "2026-03-02T07:00", ""], v: [1, 2, 3] });
 * const o = sequenceOrder(t, "at");
 * if (o.rows.join() !== "1,0" || o.missing !== 1 || o.kind !== "date-times") throw new Error("order");
 * ```
 */
export function sequenceOrder(table: Table, column: string | null): SequenceOrder {
  if (column === null) {
    const rows = new Int32Array(table.rowCount);
    for (let i = 0; i < rows.length; i++) rows[i] = i;
    return Object.freeze({ column, kind: "file", rows, missing: 0, tied: 0 });
  }
  const info = table.info(column);
  const n = table.rowCount;
  const key = new Float64Array(n);
  let kind: SequenceOrder["kind"];
  if (info.kind === "numeric") {
    kind = "numbers";
    const cells = table.numericCells(column);
    const bad: number[] = [];
    for (let i = 0; i < n; i++) if (cells.nonNumeric[i]) bad.push(i + 1);
    if (bad.length) {
      throw new PlumbError(
        "non-numeric",
        `Cannot order the rows by ${column}: ${bad.length} cell${
          bad.length === 1 ? " holds" : "s hold"
        } ` +
          `text (row${bad.length === 1 ? "" : "s"} ${bad.slice(0, 5).join(", ")}${
            bad.length > 5 ? ", …" : ""
          }); ` +
          `correct ${bad.length === 1 ? "it" : "them"} or use another sequence column`,
        { column, rows: bad.slice(0, 5) },
      );
    }
    key.set(cells.values);
  } else {
    kind = "date-times";
    const text = table.text(column);
    for (let i = 0; i < n; i++) {
      if (text.missing[i]) {
        key[i] = NaN;
        continue;
      }
      key[i] = parseIsoTime(text.values[i]);
      if (Number.isNaN(key[i])) {
        throw new PlumbError(
          "non-numeric",
          `Cannot order the rows by ${column}: row ${i + 1} holds ${
            JSON.stringify(text.values[i])
          }, ` +
            `which is neither a number nor an ISO 8601 date-time such as 2026-03-02T06:30; ` +
            `write the times in that form, or use a numeric sequence column`,
          { column, row: i + 1 },
        );
      }
    }
  }
  const present: number[] = [];
  for (let i = 0; i < n; i++) if (!Number.isNaN(key[i])) present.push(i);
  if (present.length === 0) {
    throw new PlumbError(
      "too-few",
      `Cannot order the rows by ${column}: every cell of it is missing`,
    );
  }
  present.sort((a, b) => key[a] - key[b] || a - b);
  let tied = 0;
  for (let k = 0; k < present.length; k++) {
    const v = key[present[k]];
    if (
      (k > 0 && key[present[k - 1]] === v) || (k + 1 < present.length && key[present[k + 1]] === v)
    ) tied++;
  }
  return Object.freeze({
    column,
    kind,
    rows: Int32Array.from(present),
    missing: n - present.length,
    tied,
  });
}
