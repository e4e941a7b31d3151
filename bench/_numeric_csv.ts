/**
 * A seeded numeric CSV for the ingest benchmarks: `rows` × `cols` invented
 * measurements, comma-delimited, with a header `m1,…`; four decimals, or
 * with `full` the shortest text that round-trips each double (up to 17
 * significant digits).
 *
 * @module
 */

import { seededRandom } from "../lib/numeric/random.ts";

/**
 * Write the CSV text: column k holds values near 10·k with a spread of k,
 * so widths vary from column to column.
 *
 * @param rows data rows
 * @param cols columns
 * @param seed generator seed
 * @param full write every double in full instead of to four decimals
 */
export function numericCsv(rows: number, cols: number, seed: number, full = false): string {
  const rng = seededRandom(seed);
  const next = () => rng.uniform();
  const header = Array.from({ length: cols }, (_, k) => `m${k + 1}`).join(",");
  const lines: string[] = [header];
  const cells: string[] = new Array(cols);
  for (let r = 0; r < rows; r++) {
    for (let k = 0; k < cols; k++) {
      // Sum of three uniforms: a bell-shaped value, enough for timing.
      const z = next() + next() + next() - 1.5;
      const v = 10 * (k + 1) + (k + 1) * z;
      cells[k] = full ? String(v) : v.toFixed(4);
    }
    lines.push(cells.join(","));
  }
  return lines.join("\n") + "\n";
}
