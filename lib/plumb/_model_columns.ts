/**
 * A model's columns gathered from a table at a chain's rows: a covariate's
 * numbers (text or censored cells are an error naming the rows) and a
 * factor's labels.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";

/** A covariate's numbers at the chain's rows; text cells are an error naming rows. */
export function modelCovariate(table: Table, name: string, rows: Int32Array): Float64Array {
  if (table.info(name).kind !== "numeric") {
    const t = table.text(name);
    const first = t.values.find((_, i) => !t.missing[i]);
    throw new PlumbError(
      "non-numeric",
      `Cannot use ${name} as a covariate: it holds text${
        first === undefined ? "" : ` such as ${JSON.stringify(first)}`
      }; list it under factors to compare its levels, or name a numeric column`,
      { column: name },
    );
  }
  const cells = table.numericCells(name);
  const out = new Float64Array(rows.length);
  const bad: number[] = [], censored: number[] = [];
  rows.forEach((i, k) => {
    if (cells.nonNumeric[i]) bad.push(i + 1);
    else if (cells.censor !== undefined && cells.censor[i] !== 0) censored.push(i + 1);
    out[k] = cells.missing[i] || cells.nonNumeric[i] ? NaN : cells.values[i];
  });
  const rowList = (r: number[]) => `${r.slice(0, 5).join(", ")}${r.length > 5 ? ", …" : ""}`;
  if (bad.length) {
    throw new PlumbError(
      "non-numeric",
      `Cannot use ${name} as a covariate: ${bad.length} cell${
        bad.length === 1 ? " holds" : "s hold"
      } text (row${bad.length === 1 ? "" : "s"} ${rowList(bad)}); correct ${
        bad.length === 1 ? "it" : "them"
      } or blank ${bad.length === 1 ? "it" : "them"} (rows with a blank are left out and counted)`,
      { column: name, rows: bad.slice(0, 5) },
    );
  }
  if (censored.length) {
    throw new PlumbError(
      "censored",
      `Cannot use ${name} as a covariate: ${censored.length} of its cells ${
        censored.length === 1 ? "is" : "are"
      } censored (row${censored.length === 1 ? "" : "s"} ${rowList(censored)}), and a limit is ` +
        `not a measured value; name a covariate without censored cells`,
      { column: name, rows: censored.slice(0, 5) },
    );
  }
  return out;
}

/** A factor's labels at the chain's rows (`null` where missing). */
export function modelFactor(table: Table, name: string, rows: Int32Array): (string | null)[] {
  const t = table.text(name);
  return Array.from(rows, (i) => (t.missing[i] ? null : t.values[i]));
}
