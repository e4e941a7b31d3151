/**
 * Side-by-side timing: plumbline's `loadTable` against pandas `read_csv`
 * (Debian's python3-pandas, called through /usr/bin/python3) on the same
 * seeded 1,000,000-row × 10-column numeric CSV, in the same run.
 *
 * Run: `deno run -A bench/load_table_side_by_side.ts [rows] [full]`. With
 * `full` every double is written with up to 17 significant digits instead
 * of four decimals, which sends the cells down the 16–19 digit exact path.
 * Prints the first call apart (it includes compiling the reader), then
 * medians of 5 runs for both, their ratio, and whether both read the same
 * numbers (column sums compared to 1e-9 relative).
 *
 * @module
 */
import { loadTable } from "../lib/data/load_table.ts";
import { numericCsv } from "./_numeric_csv.ts";

const rows = Number(Deno.args[0] ?? 1_000_000);
const full = Deno.args[1] === "full";
const cols = 10;
const repeats = 5;
const dir = await Deno.makeTempDir({ prefix: "plumbline_bench_" });
const file = `${dir}/numeric.csv`;
try {
  await Deno.writeTextFile(file, numericCsv(rows, cols, 20260101, full));
  const size = (await Deno.stat(file)).size;

  // The first call includes compiling the reader; it is reported apart.
  let t0 = performance.now();
  await loadTable(file);
  const cold = performance.now() - t0;
  const oursLoadOnly: number[] = [];
  const ours: number[] = [];
  let sums: number[] = [];
  for (let i = 0; i < repeats; i++) {
    t0 = performance.now();
    await loadTable(file);
    oursLoadOnly.push(performance.now() - t0);
    t0 = performance.now();
    const table = await loadTable(file);
    const columns = table.numericNames().map((n) => table.numeric(n).values);
    ours.push(performance.now() - t0);
    sums = columns.map((v) => v.reduce((a, b) => a + b, 0));
  }
  const oursCsvParse: number[] = [];
  if (rows <= 200_000) {
    for (let i = 0; i < repeats; i++) {
      t0 = performance.now();
      await loadTable(file, { reader: "csv-parse" });
      oursCsvParse.push(performance.now() - t0);
    }
  }

  const py = `
import sys, time, json, pandas
path = sys.argv[1]
times = []
for _ in range(${repeats}):
    t0 = time.perf_counter()
    df = pandas.read_csv(path)
    times.append((time.perf_counter() - t0) * 1000)
print(json.dumps({"times": times, "sums": [float(df[c].sum()) for c in df.columns],
                  "pandas": pandas.__version__}))
`;
  const out = await new Deno.Command("/usr/bin/python3", { args: ["-c", py, file] }).output();
  if (!out.success) throw new Error(new TextDecoder().decode(out.stderr));
  const ref = JSON.parse(new TextDecoder().decode(out.stdout));

  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  const agree = sums.every((s, k) => Math.abs(s - ref.sums[k]) <= 1e-9 * Math.abs(ref.sums[k]));
  console.log(
    `file: ${rows} rows × ${cols} columns, ${full ? "full precision" : "4 decimals"}, ${
      (size / 1e6).toFixed(1)
    } MB`,
  );
  console.log(`loadTable, first call (includes compiling): ${cold.toFixed(0)} ms`);
  console.log(
    `loadTable (auto reader) + numeric columns: median ${median(ours).toFixed(0)} ms  [${
      ours.map((t) => t.toFixed(0)).join(", ")
    }]`,
  );
  console.log(
    `loadTable alone: median ${median(oursLoadOnly).toFixed(0)} ms  [${
      oursLoadOnly.map((t) => t.toFixed(0)).join(", ")
    }]`,
  );
  if (oursCsvParse.length > 0) {
    console.log(`loadTable (csv-parse reader): median ${median(oursCsvParse).toFixed(0)} ms`);
  }
  console.log(
    `pandas ${ref.pandas} read_csv: median ${median(ref.times).toFixed(0)} ms  [${
      ref.times.map((t: number) => t.toFixed(0)).join(", ")
    }]`,
  );
  console.log(
    `ratio (loadTable + numeric columns) / read_csv: ${
      (median(ours) / median(ref.times)).toFixed(2)
    }`,
  );
  console.log(
    `ratio loadTable alone / read_csv: ${(median(oursLoadOnly) / median(ref.times)).toFixed(2)}`,
  );
  console.log(`column sums agree to 1e-9: ${agree}`);
} finally {
  await Deno.remove(dir, { recursive: true });
}
