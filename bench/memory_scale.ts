/**
 * Peak memory of `plumb(...).analysis()` and `survey(...).result()` at large n.
 *
 * Each case runs in a fresh child process. The child builds the table from a
 * seeded normal sample, collects garbage, records its resident set (VmRSS in
 * /proc/self/status) as the baseline, resets the kernel's high-water mark
 * (writing 5 to /proc/self/clear_refs), runs the case, and reads the peak
 * resident set (VmHWM). Peak above baseline is VmHWM − baseline VmRSS; the
 * raw data are 8·n bytes. Linux only.
 *
 * Cases: `plumb(table, "c0").analysis()`, `survey(table).result()`, and
 * "analyse": `analyse` on a fresh copy of the column with its 1-based row
 * labels built in full (what the chain did before it looked labels up only
 * for the points drawn).
 *
 * Run: deno run -A bench/memory_scale.ts [n] [columns] [normal|lognormal]
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { tableFromMemory } from "../lib/data/in_memory.ts";
import { analyse } from "../lib/plumb/analysis.ts";
import { plumb } from "../lib/plumb/plumb.ts";
import { survey } from "../lib/plumb/survey.ts";

function _status(field: string): number {
  const text = Deno.readTextFileSync("/proc/self/status");
  const m = text.match(new RegExp(`^${field}:\\s+(\\d+) kB`, "m"));
  if (!m) throw new Error(`No ${field} in /proc/self/status`);
  return Number(m[1]) * 1024;
}

function _child(kind: string, n: number, columns: number, shape: string): void {
  const rng = seededRandom(11);
  const data: Record<string, Float64Array> = {};
  for (let c = 0; c < columns; c++) {
    const x = new Float64Array(n);
    if (shape === "lognormal") {
      for (let i = 0; i < n; i++) x[i] = Math.exp(2 + 0.5 * rng.normal());
    } else for (let i = 0; i < n; i++) x[i] = 50 + 3 * rng.normal();
    data[`c${c}`] = x;
  }
  const table = tableFromMemory(data);
  for (const k of Object.keys(data)) delete data[k];
  const gc = (globalThis as { gc?: () => void }).gc;
  gc?.();
  const base = _status("VmRSS");
  Deno.writeTextFileSync("/proc/self/clear_refs", "5");
  const t0 = performance.now();
  let summary: string;
  if (kind === "plumb") {
    const a = plumb(table, "c0").analysis();
    summary = `W=${a.primary.statistic.toFixed(6)} verdict=${a.reading.verdict}`;
  } else if (kind === "analyse") {
    // A copy of the column and every row label built, as the chain did before.
    const col = table.numeric("c0");
    const rows = col.rowIndex.map((r) => r + 1);
    const a = analyse(col.values, {
      label: "c0",
      column: "c0",
      missingDropped: 0,
      textDropped: 0,
      rows,
    });
    summary = `W=${a.primary.statistic.toFixed(6)} verdict=${a.reading.verdict}`;
  } else {
    const r = survey(table).result();
    summary = `${r.rows.length} rows`;
  }
  const seconds = (performance.now() - t0) / 1000;
  const peak = _status("VmHWM");
  console.log(JSON.stringify({
    kind,
    n,
    columns,
    shape,
    seconds,
    baselineMB: base / 1e6,
    peakMB: peak / 1e6,
    aboveMB: (peak - base) / 1e6,
    rawMB: (8 * n) / 1e6,
    ratio: (peak - base) / (8 * n),
    summary,
  }));
}

if (import.meta.main) {
  const [a0, a1, a2] = Deno.args;
  if (a0 === "--child") {
    _child(a1, Number(Deno.args[2]), Number(Deno.args[3]), Deno.args[4]);
  } else {
    const n = Number(a0 ?? 1e7);
    const columns = Number(a1 ?? 1);
    const shape = a2 ?? "normal";
    if (shape !== "normal" && shape !== "lognormal") throw new Error(`Unknown shape ${shape}`);
    for (const kind of ["plumb", "survey", "analyse"]) {
      const out = await new Deno.Command(Deno.execPath(), {
        args: [
          "run",
          "-A",
          "--v8-flags=--expose-gc",
          import.meta.filename!,
          "--child",
          kind,
          String(n),
          String(columns),
          shape,
        ],
        stdout: "piped",
        stderr: "inherit",
      }).output();
      const line = new TextDecoder().decode(out.stdout).trim();
      const r = JSON.parse(line);
      console.log(
        `${kind.padEnd(7)} n=${n} columns=${columns} ${shape}: ${r.seconds.toFixed(2)} s, ` +
          `peak ${r.aboveMB.toFixed(0)} MB above a ${r.baselineMB.toFixed(0)} MB baseline ` +
          `= ${r.ratio.toFixed(2)}× the raw ${r.rawMB.toFixed(0)} MB (${r.summary})`,
      );
    }
  }
}
