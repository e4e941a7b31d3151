/**
 * A re-expression step applied to a column's values, with errors that
 * speak of the table: the transformations name 0-based positions in the
 * array they were given, which the chain turns into the data rows (1-based)
 * and source lines the user can find; and a power whose results overflow
 * (Box–Cox x²⁰⁰ of 800) is reported as λ being too far from 0 for these
 * values, never as bad data.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { Step } from "./steps.ts";

/** Where the values came from: the column, each value's data row, each row's source line. */
export interface _ValuesAt {
  readonly column: string;
  /** The 1-based data row of the value at a 0-based position. */
  readonly rowLabel: (position: number) => number;
  /** The source line of a 0-based data row (`Table.lineOf`). */
  readonly lineOf: (row: number) => number | null;
}

/** How many rows a message lists at most. */
const _SHOWN = 5;

/**
 * "row 3 (line 4)", "rows 3 (line 4), 7 (line 8), …": the data rows (and
 * source lines) of 0-based positions in the values.
 */
export function _rowsText(positions: readonly number[], at: _ValuesAt, total: number): string {
  const shown = positions.slice(0, _SHOWN).map((p) => {
    const row = at.rowLabel(p);
    const line = at.lineOf(row - 1);
    return `${row}${line === null ? "" : ` (line ${line})`}`;
  });
  const more = total > shown.length ? `, … (${total - shown.length} more)` : "";
  return `row${total === 1 ? "" : "s"} ${shown.join(", ")}${more}`;
}

/**
 * Apply a step to a column's values.
 *
 * @param step the step
 * @param values the values it applies to
 * @param at their column, rows and lines
 * @returns the re-expressed values
 * @throws {PlumbError} the transformation's own error, its positions turned
 *   into rows and lines of `at.column`; `"bad-option"` when finite values
 *   give results beyond the largest double
 */
export function _applyStep(step: Step, values: Float64Array, at: _ValuesAt): Float64Array {
  let y: Float64Array;
  try {
    y = step.apply(values);
  } catch (e) {
    const positions = (e as PlumbError).detail?.positions;
    if (!(e instanceof PlumbError) || !Array.isArray(positions)) throw e;
    const count = typeof e.detail?.count === "number" ? e.detail.count : positions.length;
    const where = `in ${_rowsText(positions as number[], at, count)} of ${
      JSON.stringify(at.column)
    }`;
    const message = /at positions? [\d, …]+/.test(e.message)
      ? e.message.replace(/at positions? [\d, …]+/, where)
      : `${e.message} (${where})`;
    throw new PlumbError(e.code, message, {
      ...e.detail,
      rows: (positions as number[]).map(at.rowLabel),
    });
  }
  const bad: number[] = [];
  for (let i = 0; i < y.length; i++) if (!Number.isFinite(y[i])) bad.push(i);
  if (bad.length > 0) {
    let worst = values[bad[0]];
    for (const i of bad) if (Math.abs(values[i]) > Math.abs(worst)) worst = values[i];
    throw new PlumbError(
      "bad-option",
      `Cannot re-express ${JSON.stringify(at.column)} as ${step.formula}: the result is beyond ` +
        `the largest number a double holds (±1.8e308) for ${bad.length} of ${y.length} values ` +
        `(most extreme ${worst}, ${_rowsText(bad, at, bad.length)}); ` +
        (step.reexpression.lambda === undefined
          ? "the values are fine but too near 0 for it: rescale them first (other units)"
          : "the values are fine but the power is too strong for their size: choose a λ " +
            "nearer 0 (the fitted λ of .candidates() is a good start) or rescale the values " +
            "first (other units)"),
      { count: bad.length, rows: bad.slice(0, _SHOWN).map(at.rowLabel) },
    );
  }
  return y;
}
