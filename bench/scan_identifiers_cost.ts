/**
 * What the scanned survey's identifier check costs: the statements it runs,
 * timed side by side in one process with a plain `count(*)` over the same
 * file (CPU seconds of this process and wall seconds; the load is printed).
 * The counting pass is timed with and without the ranges it now reads, and
 * the windowed row-order pass over one and over two candidate columns (a
 * plain read of one column beside them, since a Parquet `count(*)` comes
 * from the file's statistics).
 *
 *   deno run -A bench/scan_identifiers_cost.ts --rows 10000000 --dir <scratch folder>
 *
 * Writes `survey_cost_<rows>.parquet` and `.csv` there once (a run number, a
 * tray number holding 1…n out of order, a measurement, a line label); never
 * inside the repository.
 *
 * Three runs, 10^7 rows, 2 threads, load average 2.6–4.4 on 2 cores (CPU
 * seconds). Parquet: count(*) 0.01 (file statistics), plain read of one
 * column 0.03–0.04, counting pass with ranges 0.00–0.01 (statistics, as
 * without them), plus one text column 1.19–1.25 (every cell read as a
 * number, missing-value tokens first), row-order pass 0.31–0.70 for one
 * column, 0.61–1.40 for two. CSV: count(*) 0.69–1.55, plain read
 * 0.76–1.02, counting pass 1.01–1.16 without ranges and 1.13–1.30 with
 * them, 2.59–2.62 with the text column, row-order pass 1.01–2.06 for one
 * column, 1.45–3.39 for two. The row-order pass runs only when a complete
 * column spans exactly n − 1 (or is a row-name first column). DuckDB's
 * Parquet-only `file_row_number` would halve it on one file (0.29–0.33
 * against 0.63–0.69 in one run) but restarts in each file of a glob; not
 * used.
 *
 * @module
 */
import { DuckDBInstance } from "@duckdb/node-api";
import { parseArgs } from "node:util";
import { DUCKDB, quoteText, valueExpr } from "../lib/scan/sql.ts";
import { presenceSql, rowRunsSql } from "../lib/scan/sql_survey.ts";

const { values: args } = parseArgs({
  args: Deno.args,
  options: { rows: { type: "string", default: "10000000" }, dir: { type: "string" } },
});
const rows = Number(args.rows);
if (!args.dir || !(rows > 0)) throw new Error("give --dir <scratch folder> and --rows <n>");
const inst = await DuckDBInstance.create(":memory:", { threads: "2", memory_limit: "500MB" });
const con = await inst.connect();
const cpu = () => {
  const f = Deno.readTextFileSync("/proc/self/stat").split(") ")[1].split(" ");
  return (Number(f[11]) + Number(f[12])) / 100;
};
const load = () => Deno.readTextFileSync("/proc/loadavg").split(" ")[0];
const base = `${args.dir}/survey_cost_${rows}`;
const exists = (p: string) => Deno.stat(p).then(() => true, () => false);
// 7919 is prime and does not divide 10^k, so (i · 7919) mod n + 1 runs over 1…n out of order.
const select = `SELECT i + 1 AS run_no, (i * 7919) % ${rows} + 1 AS tray, ` +
  `500 + ((hash(i) % 1000003) / 1000003.0 - 0.5) AS fill_ml, 'L' || (i % 4 + 1) AS line ` +
  `FROM range(${rows}) t(i)`;
for (const [ext, format] of [["parquet", "parquet"], ["csv", "csv, HEADER"]]) {
  if (!(await exists(`${base}.${ext}`))) {
    await con.run(`COPY (${select}) TO ${quoteText(`${base}.${ext}`)} (FORMAT ${format})`);
  }
}

const cols = ["run_no", "tray", "fill_ml"];
const counts = (ranges: boolean, rel: string) =>
  presenceSql(DUCKDB, rel, cols.map((name) => ({ name, textual: false, numeric: ranges })));
const runs = (names: string[], rel: string, increasing = false) =>
  rowRunsSql(
    DUCKDB,
    rel,
    names.map((n) => ({ v: valueExpr(DUCKDB, n, false, 1), increasing })),
  );
console.log(`${rows} rows; load ${load()} before`);
console.log(`| file | statement | CPU (s) | wall (s) | CPU / plain read |`);
console.log(`|---|---|---|---|---|`);
for (const ext of ["parquet", "csv"]) {
  const rel = ext === "parquet"
    ? `read_parquet(${quoteText(`${base}.parquet`)})`
    : `read_csv(${quoteText(`${base}.csv`)})`;
  const statements: [string, string][] = [
    ["plain count(*)", `SELECT count(*) FROM ${rel}`],
    ["plain read: sum(fill_ml)", `SELECT sum(fill_ml) FROM ${rel}`],
    ["counting pass, no ranges", counts(false, rel)],
    ["counting pass with ranges (shipped)", counts(true, rel)],
    [
      "counting pass with ranges and the text column line",
      presenceSql(DUCKDB, rel, [
        ...cols.map((name) => ({ name, textual: false, numeric: true })),
        { name: "line", textual: true, numeric: false },
      ]),
    ],
    ["row-order pass, 1 column (run_no)", runs(["run_no"], rel)],
    ["row-order pass, 1 column, with the step (lag)", runs(["run_no"], rel, true)],
    ["row-order pass, 2 columns (run_no, tray)", runs(["run_no", "tray"], rel)],
  ];
  for (let round = 0; round < 2; round++) {
    let plain = NaN;
    for (const [name, sql] of statements) {
      const t = performance.now();
      const c = cpu();
      await con.runAndReadAll(sql);
      const used = cpu() - c;
      if (name.startsWith("plain read")) plain = used;
      const wall = (performance.now() - t) / 1000;
      console.log(
        `| ${ext} (round ${round + 1}) | ${name} | ${used.toFixed(2)} | ${wall.toFixed(2)} | ${
          Number.isNaN(plain) ? "" : (used / plain).toFixed(1)
        } |`,
      );
    }
  }
}
console.log(`load ${load()} after`);
con.closeSync();
inst.closeSync();
