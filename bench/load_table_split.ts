/**
 * Where the time of a large CSV load goes: `loadTable(file)` alone, then
 * each `table.numeric(name)` copy, on the seeded 1,000,000-row × 10-column
 * file of four-decimal numbers. A copy that lands on memory the process has
 * not used before costs several times one that reuses freed memory (every
 * fresh page is handed out by the system on first write), so both kinds of
 * run show up among the repeats.
 *
 * Run: `deno run -A bench/load_table_split.ts [rows] [repeats]`
 *
 * @module
 */
import { loadTable } from "../lib/data/load_table.ts";
import { numericCsv } from "./_numeric_csv.ts";

const rows = Number(Deno.args[0] ?? 1_000_000);
const repeats = Number(Deno.args[1] ?? 6);
const dir = await Deno.makeTempDir({ prefix: "plumbline_bench_" });
const file = `${dir}/numeric.csv`;
try {
  await Deno.writeTextFile(file, numericCsv(rows, 10, 20260101, false));
  await loadTable(file); // compile the reader first
  for (let r = 0; r < repeats; r++) {
    let t0 = performance.now();
    const table = await loadTable(file);
    const load = performance.now() - t0;
    const each: number[] = [];
    for (const name of table.numericNames()) {
      t0 = performance.now();
      table.numeric(name);
      each.push(performance.now() - t0);
    }
    const copies = each.reduce((a, b) => a + b, 0);
    console.log(
      `loadTable ${load.toFixed(0)} ms, numeric() copies ${copies.toFixed(0)} ms [${
        each.map((t) => t.toFixed(0)).join(" ")
      }]`,
    );
  }
} finally {
  await Deno.remove(dir, { recursive: true });
}
