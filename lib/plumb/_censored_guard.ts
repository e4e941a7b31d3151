/**
 * The stop for columns with censored values (`<0.5`, `>1000`) on the paths
 * that analyse measured values only: a censored cell's stored number is its
 * limit, and analysing limits as if they were measurements would bias every
 * result without a word.
 *
 * @module
 */
import type { NumericColumn } from "../data/table.ts";
import { PlumbError } from "../errors.ts";

/**
 * Throw a `"censored"` PlumbError when the column holds censored values.
 *
 * @param column the column about to be analysed
 * @param label what is being analysed, for the message
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * import { refuseCensored } from "./_censored_guard.ts";
 * const table = await loadTable({ crp: [1.2, "<0.5", 3.4, 2.2] });
 * let code = "";
 * try {
 *   refuseCensored(table.numeric("crp"), "crp");
 * } catch (e) {
 *   code = (e as { code: string }).code;
 * }
 * if (code !== "censored") throw new Error("expected a refusal");
 * ```
 */
export function refuseCensored(column: NumericColumn, label: string): void {
  const censor = column.censor;
  if (censor === undefined) return;
  const p = column.provenance;
  const first = censor.findIndex((s) => s !== 0);
  const row = column.rowIndex[first] + 1;
  const count = p.censoredLeft + p.censoredRight;
  const sides = [
    p.censoredLeft > 0 ? `${p.censoredLeft} below a limit` : "",
    p.censoredRight > 0 ? `${p.censoredRight} above a limit` : "",
  ].filter((x) => x !== "").join(", ");
  throw new PlumbError(
    "censored",
    `Cannot screen ${label}: ${count} of its ${p.used} values ${
      count === 1 ? "is" : "are"
    } censored (${sides}; the first at row ${row}: ${censor[first] < 0 ? "<" : ">"}${
      column.values[first]
    }), and analysing the limits as measured values would bias every result; this analysis needs measured values, so screen a column without censored cells`,
    { column: column.name, censoredLeft: p.censoredLeft, censoredRight: p.censoredRight, row },
  );
}
