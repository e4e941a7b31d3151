/**
 * Writes the invented demo data: `demo/bottling_lab.csv`.
 *
 * Everything in that file is invented by this seeded script; it describes a
 * fictional bottling plant's quality lab with four filler lines (A–D) and
 * two shifts. Columns:
 *
 * - `sample_id` — a running label;
 * - `line`, `shift` — the filler line and the shift (text, for grouping);
 * - `fill_ml` — net fill volume in mL: normal within each line, with
 *   slightly different line means (so the pooled column is a mixture);
 * - `cap_torque_nm` — cap removal torque in N·m: mildly right-skewed (a
 *   gamma-like shape), reported to 0.01;
 * - `oxygen_ppb` — dissolved oxygen in µg/L: right-skewed (log-normal),
 *   with a few readings below the detection limit recorded as 0;
 * - `minutes_between_stops` — minutes between line stoppages:
 *   exponential-like, reported to 0.1.
 *
 * A handful of cells are missing (empty or `NA`) and a few are mistyped
 * (`12..4`, `ERR`, `~5`), so that the ingest messages have something to show.
 *
 * Run: `deno run --allow-write tools/make_demo_data.ts [out.csv]`
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";

/** The demo CSV as text (deterministic). */
export function demoCsv(): string {
  const rng = seededRandom(20261201);
  const lines = [
    { id: "A", fill: 500.6, sd: 1.1 },
    { id: "B", fill: 500.1, sd: 1.3 },
    { id: "C", fill: 501.0, sd: 0.9 },
    { id: "D", fill: 500.4, sd: 1.6 },
  ];
  const perLine = 60;
  const rows: string[] = [
    "sample_id,line,shift,fill_ml,cap_torque_nm,oxygen_ppb,minutes_between_stops",
  ];
  let k = 0;
  for (const line of lines) {
    for (let i = 0; i < perLine; i++) {
      k++;
      const shift = i % 2 === 0 ? "early" : "late";
      const fill = (line.fill + line.sd * rng.normal()).toFixed(1);
      // Gamma(shape 9) scaled to mean 1.9 N·m, as a sum of exponentials (mild right skew).
      let g = 0;
      for (let j = 0; j < 9; j++) g -= Math.log(rng.uniform());
      const torque = (0.55 + 1.35 * g / 9).toFixed(2);
      // Log-normal oxygen; readings under 4 ppb are below detection and recorded as 0.
      const o2 = Math.exp(Math.log(14) + 0.75 * rng.normal());
      const oxygen = o2 < 4 ? "0" : o2.toFixed(1);
      const gap = (-38 * Math.log(rng.uniform())).toFixed(1);
      rows.push(
        [`S${String(k).padStart(3, "0")}`, line.id, shift, fill, torque, oxygen, gap].join(","),
      );
    }
  }
  // Missing and mistyped cells at fixed rows (1-based data rows), for the ingest messages.
  const edits: [number, number, string][] = [
    [17, 3, ""],
    [58, 3, "NA"],
    [121, 4, ""],
    [140, 5, "NA"],
    [203, 6, ""],
    [44, 3, "12..4"],
    [99, 4, "ERR"],
    [166, 5, "~5"],
  ];
  for (const [row, col, text] of edits) {
    const cells = rows[row].split(",");
    cells[col] = text;
    rows[row] = cells.join(",");
  }
  return rows.join("\n") + "\n";
}

if (import.meta.main) {
  const out = Deno.args[0] ?? new URL("../demo/bottling_lab.csv", import.meta.url).pathname;
  await Deno.writeTextFile(out, demoCsv());
  console.log(`wrote ${out} (invented data)`);
}
