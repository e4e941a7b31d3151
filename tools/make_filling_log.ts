/**
 * Writes the invented in-process fill log: `demo/filling_log.csv`.
 *
 * Everything in that file is invented by this seeded script. It describes a
 * week (Monday to Friday) of fill checks at the same fictional bottling
 * plant as `demo/bottling_lab.csv`: every 30 minutes of each of three shifts,
 * one bottle from each of the four filler lines is weighed. Columns:
 *
 * - `checked_at` — the time of the check, `YYYY-MM-DDTHH:MM` (text);
 * - `line` — filler line A–D; `shift` — `early`, `late` or `night`;
 * - `filler_temp_c` — the product temperature at the filler, °C, which
 *   follows the shift (warmer in the late shift) with some noise;
 * - `fill_ml` — net fill volume, mL: a line mean, a shift effect, 0.35 mL
 *   less per °C (warm product foams and is under-filled), and normal noise;
 *   on line C a worn valve makes the fill creep upward through the week
 *   (about 2.4 mL from Monday to Friday) — a drift that shows only when the
 *   checks are taken in time order.
 *
 * The file lists the checks line by line (all of line A, then B, …), so its
 * row order is not the time order; `checked_at` is. Three temperature
 * readings are missing.
 *
 * Run: `deno run --allow-write tools/make_filling_log.ts [out.csv]`
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";

/** The fill log CSV as text (deterministic). */
export function fillingLogCsv(): string {
  const rng = seededRandom(20261204);
  const lines = [
    { id: "A", mean: 500.4, sd: 0.8 },
    { id: "B", mean: 499.9, sd: 0.9 },
    { id: "C", mean: 500.2, sd: 0.8 },
    { id: "D", mean: 500.6, sd: 1.0 },
  ];
  const shifts = [
    { id: "early", start: 6, temp: 18.5, effect: 0 },
    { id: "late", start: 14, temp: 22.0, effect: -0.3 },
    { id: "night", start: 22, temp: 17.0, effect: 0.2 },
  ];
  const checks: { time: number; shift: (typeof shifts)[number] }[] = [];
  for (let day = 0; day < 5; day++) {
    for (const shift of shifts) {
      for (let half = 0; half < 16; half++) {
        checks.push({ time: day * 1440 + shift.start * 60 + half * 30, shift });
      }
    }
  }
  const span = checks[checks.length - 1].time;
  const rows: string[] = ["checked_at,line,shift,filler_temp_c,fill_ml"];
  for (const line of lines) {
    for (const { time, shift } of checks) {
      const temp = shift.temp + 0.8 * rng.normal();
      const drift = line.id === "C" ? (2.4 * time) / span : 0;
      const fill = line.mean + shift.effect - 0.35 * (temp - 19) + drift + line.sd * rng.normal();
      rows.push([_stamp(time), line.id, shift.id, temp.toFixed(1), fill.toFixed(1)].join(","));
    }
  }
  for (const row of [37, 250, 511]) {
    const cells = rows[row].split(",");
    cells[3] = "";
    rows[row] = cells.join(",");
  }
  return rows.join("\n") + "\n";
}

/** Minutes from Monday 2 March 2026, 00:00, as `YYYY-MM-DDTHH:MM`. */
function _stamp(minutes: number): string {
  const d = new Date(Date.UTC(2026, 2, 2) + minutes * 60000);
  return d.toISOString().slice(0, 16);
}

if (import.meta.main) {
  const out = Deno.args[0] ?? new URL("../demo/filling_log.csv", import.meta.url).pathname;
  await Deno.writeTextFile(out, fillingLogCsv());
  console.log(`wrote ${out} (invented data)`);
}
