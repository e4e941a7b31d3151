/**
 * `plumb(table, y, { order })`: serial dependence of the chain's values (or
 * residuals) in the order of a named column, or in file order when asked for
 * explicitly. File order is never taken for time order unasked.
 *
 * The tests are those of `serialDependence` (lag-1 autocorrelation with its
 * exact moments, Durbin & Watson 1950; runs about the median, Wald &
 * Wolfowitz 1940; Bonferroni's rule for the decision). Residuals are tested
 * with their fit's basis, so that the correlation that fitting itself
 * induces is allowed for.
 *
 * @module
 */
import { sequenceOrder } from "../data/sequence_order.ts";
import type { Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import type { SerialCheck } from "../results/analysis.ts";
import { formatNumber } from "../results/format.ts";
import { serialDependence } from "../stats/serial_dependence.ts";
import { proseP } from "./sentence.ts";
import { type Chart, chart } from "../render/chart_bundle.ts";
import { sequenceSpec } from "../render/sequence_spec.ts";

/** Every value is plotted up to this many; above it, slices. */
export const SEQUENCE_MAX_POINTS = 1000;
const _SLICES = 500;

/** The order a chain was asked to check: a column, or file order (`null`). */
export type OrderRequest = { readonly column: string | null };

/**
 * Read the order options of `plumb()`: `order` names a column, `fileOrder:
 * true` asks for the file's row order; both at once is an error.
 *
 * @param table the table
 * @param options the order options
 * @returns the order to check, or `undefined` when none was asked for
 * @throws {PlumbError} `"unknown-column"`, `"bad-option"`
 * @example
 * ```ts
 * import { checkOrder } from "./serial_check.ts";
 * import { toTable } from "./source.ts";
 * const t = toTable({ at: [1, 2, 3], v: [4, 5, 6] });
 * if (checkOrder(t, { order: "at" })?.column !== "at" || checkOrder(t, {}) !== undefined) throw new Error("order");
 * ```
 */
export function checkOrder(
  table: Table,
  options: { readonly order?: string; readonly fileOrder?: boolean },
): OrderRequest | undefined {
  const { order, fileOrder } = options;
  if (fileOrder !== undefined && typeof fileOrder !== "boolean") {
    throw new PlumbError(
      "bad-option",
      `Cannot use fileOrder = ${String(fileOrder)}: use true or false`,
    );
  }
  if (order !== undefined && fileOrder) {
    throw new PlumbError(
      "bad-option",
      `Cannot check serial dependence in two orders: give order (a column) or fileOrder: true, not both`,
    );
  }
  if (fileOrder) return Object.freeze({ column: null });
  if (order === undefined) return undefined;
  if (typeof order !== "string") {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${JSON.stringify(order)} as an order: name the column that holds the time or ` +
        `sequence, or give fileOrder: true when the rows are in time order`,
    );
  }
  if (!table.has(order)) {
    throw new PlumbError(
      "unknown-column",
      `No column named ${JSON.stringify(order)} to order the rows by: the table has ${
        table.columns.map((c) => JSON.stringify(c.name)).join(", ")
      }`,
    );
  }
  return Object.freeze({ column: order });
}

/**
 * Refuse to plot values in order when no order was named.
 *
 * @param label the chain's label
 * @throws {PlumbError} always, `"bad-option"`
 */
export function refuseNoOrder(label: string): never {
  throw new PlumbError(
    "bad-option",
    `Cannot show ${label} in order: no order was named, and file order is not assumed to be ` +
      `time order; name the time or sequence column, e.g. plumb(table, y, { order: "checked_at" }), ` +
      `or give { fileOrder: true }`,
  );
}

/**
 * Check a chain's values for serial dependence in the requested order.
 *
 * @param table the chain's table
 * @param order the order (see {@linkcode checkOrder})
 * @param chain the values and their 0-based table rows; `basis` for residuals
 *   (n × rank, column-major, rows aligned with `values`)
 * @example
 * ```ts
 * import { serialCheck } from "./serial_check.ts";
 * import { toTable } from "./source.ts";
 * const at = Array.from({ length: 40 }, (_, i) => 40 - i);
 * const v = at.map((t) => Math.sin(t / 4));
 * const t = toTable({ at, v });
 * const c = serialCheck(t, { column: "at" }, { values: Float64Array.from(v), rows: Int32Array.from(at, (_, i) => i) });
 * if (!c.result.shows || c.points.position.length !== 40) throw new Error("serial");
 * ```
 */
export function serialCheck(
  table: Table,
  order: OrderRequest,
  chain: {
    readonly values: Float64Array;
    readonly rows: Int32Array;
    readonly basis?: { readonly values: Float64Array; readonly rank: number };
  },
): SerialCheck {
  const seq = sequenceOrder(table, order.column);
  const rank = new Int32Array(table.rowCount).fill(-1);
  seq.rows.forEach((r, k) => (rank[r] = k));
  const idx: number[] = [];
  for (let k = 0; k < chain.rows.length; k++) if (rank[chain.rows[k]] >= 0) idx.push(k);
  idx.sort((a, b) => rank[chain.rows[a]] - rank[chain.rows[b]]);
  const x = Float64Array.from(idx, (k) => chain.values[k]);
  let basis = chain.basis;
  if (basis !== undefined) {
    if (idx.length !== chain.values.length) {
      basis = undefined; // rows left out: the fit's basis no longer matches
    } else {
      const n = x.length, b = new Float64Array(n * basis.rank);
      for (let j = 0; j < basis.rank; j++) {
        for (let t = 0; t < n; t++) b[j * n + t] = basis.values[j * n + idx[t]];
      }
      basis = { values: b, rank: basis.rank };
    }
  }
  const result = serialDependence(x, basis ? { basis } : {});
  return Object.freeze({
    order: order.column ?? "file order",
    kind: seq.kind,
    unordered: chain.values.length - idx.length,
    tied: seq.tied,
    result,
    median: result.runs.median,
    points: _points(x),
  });
}

/** Every value, or per slice of positions its mean, lowest and highest. */
function _points(x: Float64Array): SerialCheck["points"] {
  const n = x.length;
  if (n <= SEQUENCE_MAX_POINTS) {
    const all = Array.from(x);
    return Object.freeze({
      position: Array.from({ length: n }, (_, i) => i + 1),
      value: all,
      low: all,
      high: all,
    });
  }
  const position: number[] = [], value: number[] = [], low: number[] = [], high: number[] = [];
  for (let s = 0; s < _SLICES; s++) {
    const a = Math.floor((s * n) / _SLICES), b = Math.floor(((s + 1) * n) / _SLICES);
    let sum = 0, lo = Infinity, hi = -Infinity;
    for (let t = a; t < b; t++) {
      sum += x[t];
      lo = Math.min(lo, x[t]);
      hi = Math.max(hi, x[t]);
    }
    position.push((a + b + 1) / 2);
    value.push(sum / (b - a));
    low.push(lo);
    high.push(hi);
  }
  return Object.freeze({ position, value, low, high });
}

/**
 * The reading's sentence about serial dependence: a warning when it shows,
 * otherwise what was checked (no final period).
 *
 * @param c the check
 * @example
 * ```ts
 * import { serialCheck, serialNote } from "./serial_check.ts";
 * import { toTable } from "./source.ts";
 * const v = Array.from({ length: 30 }, (_, i) => i % 2);
 * const c = serialCheck(toTable({ v }), { column: null }, { values: Float64Array.from(v), rows: Int32Array.from(v, (_, i) => i) });
 * if (!serialNote(c).startsWith("Serial dependence shows in file order")) throw new Error(serialNote(c));
 * ```
 */
export function serialNote(c: SerialCheck): string {
  const r = c.result, l = r.lagOne, runs = r.runs;
  const facts = `lag-1 autocorrelation r₁ = ${formatNumber(l.r1, 3)} (${proseP(l.pValue)}); ` +
    `${runs.runs} runs about the median where ${formatNumber(runs.expected, 3)} are expected ` +
    `(${proseP(runs.pValue)})`;
  const where = c.order === "file order" ? "file order" : `${c.order} order`;
  const ties = c.tied > 0
    ? `; ${c.tied} rows share their ${c.order} value with another and are taken in file order ` +
      `among themselves, which mixes whatever those rows differ in`
    : "";
  const left = c.unordered > 0
    ? `; ${c.unordered} value${
      c.unordered === 1 ? "" : "s"
    } without a ${c.order} value left out of this check`
    : "";
  if (!r.shows) {
    return `No serial dependence shows in ${where}: ${facts}; both tests together at the ` +
      `${r.alpha} level (Bonferroni)${left}${ties}`;
  }
  const inflation = l.r1 > 0.05
    ? `, and the variance of a mean is about ${
      formatNumber(r.varianceFactor, 2)
    } times the independent-data value (AR(1) approximation)`
    : "";
  return `Serial dependence shows in ${where}: ${facts}. Every normality p-value here assumes ` +
    `independent observations, so with dependence like this they are too small or too large ` +
    `by an unknown amount${inflation}; look at the values in order (.sequence()) before ` +
    `using them${left}${ties}`;
}

/**
 * The notes of an analysis: those given, then the serial note when a check
 * was made; `undefined` when there are none.
 *
 * @param given notes from elsewhere (a model's residuals)
 * @param serial the serial check, if one was made
 */
export function notesWith(
  given: readonly string[] | undefined,
  serial: SerialCheck | undefined,
): readonly string[] | undefined {
  const all = [...given ?? [], ...serial ? [serialNote(serial)] : []];
  return all.length ? all : undefined;
}

/**
 * A chain's serial check, when its root names an order: the chain's values
 * at their rows, with the fit's basis for residuals.
 *
 * @param root the chain's table and order
 * @param loaded the chain's values, rows on demand
 * @param basis the fit's basis, for residuals
 */
export function serialOf(
  root: { readonly table: Table; readonly order?: OrderRequest },
  loaded: { readonly values: Float64Array; readonly rows: () => Int32Array },
  basis?: { readonly values: Float64Array; readonly rank: number },
): SerialCheck | undefined {
  if (!root.order) return undefined;
  return serialCheck(root.table, root.order, { values: loaded.values, rows: loaded.rows(), basis });
}

/**
 * The chart of values in order, drawn on first display or read.
 *
 * @param serial the check, read on first need
 * @param name the variable's name
 */
export function sequenceChart(serial: () => SerialCheck, name: string): Chart {
  return chart(() => sequenceSpec(serial(), { name }));
}
