/**
 * A seeded numeric CSV for the ingest benchmarks: `rows` × `cols` invented
 * measurements, comma-delimited, with a header `m1,…`; four decimals, or
 * with `full` the shortest text that round-trips each double (up to 17
 * significant digits).
 *
 * @module
 */

/** Mulberry32, a small seeded 32-bit generator (Tommy Ettinger, public domain, from memory). */
function _mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

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
  const next = _mulberry32(seed);
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
