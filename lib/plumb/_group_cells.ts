/**
 * The cells that `.by()` groups when they are given values at their table
 * rows (a model's residuals), and the natural order of group and cell labels.
 *
 * @module
 */

/** The separator of the parts of a cell's label, e.g. `"A × early"`. */
export const CELL_SEPARATOR = " × ";

/**
 * The separator of a cell's parts inside its key: a label part may itself
 * contain " × ", so keys join the parts with a character no label carries.
 */
export const CELL_KEY_SEPARATOR = "\u0000";

/** A cell's label from its key. */
export function cellLabel(key: string): string {
  return key.split(CELL_KEY_SEPARATOR).join(CELL_SEPARATOR);
}

/** Natural order for group labels: numbers by value, then text. */
export function compareLabels(a: string, b: string): number {
  const x = Number(a), y = Number(b);
  if (a.trim() !== "" && b.trim() !== "" && Number.isFinite(x) && Number.isFinite(y)) return x - y;
  return a < b ? -1 : a > b ? 1 : 0;
}

type _Cells = {
  values: Float64Array;
  missing: Uint8Array;
  nonNumeric: Uint8Array;
  censor?: Int8Array;
};

/** Given values at their table rows; every other row counts as missing. */
export function givenCells(
  given: { values: Float64Array; rows: Int32Array; missing: number; text: number },
  rowCount: number,
): { cells: _Cells; used: { missing: number; text: number } } {
  const values = new Float64Array(rowCount).fill(NaN);
  const missing = new Uint8Array(rowCount).fill(1);
  given.rows.forEach((r, k) => {
    values[r] = given.values[k];
    missing[r] = 0;
  });
  return {
    cells: { values, missing, nonNumeric: new Uint8Array(rowCount) },
    used: { missing: given.missing, text: given.text },
  };
}

/** Natural order of cell keys, part by part. */
export function compareCells(a: string, b: string, parts: number): number {
  if (parts === 1) return compareLabels(a, b);
  const x = a.split(CELL_KEY_SEPARATOR), y = b.split(CELL_KEY_SEPARATOR);
  for (let k = 0; k < parts; k++) {
    const c = compareLabels(x[k] ?? "", y[k] ?? "");
    if (c !== 0) return c;
  }
  return 0;
}
