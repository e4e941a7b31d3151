/**
 * What counting censored cells (`<0.5`, `>100`) costs the counting pass of a
 * scanned text column: the pass as it was before (rows, present cells,
 * numbers, range) and as it is now (the same, and the cells below and above
 * a limit, `lib/scan/sql_counts.ts`), timed in turn in one process over the
 * same Parquet file, and the survey's one pass over the columns likewise.
 * CPU seconds of this process and wall seconds; the load is printed.
 *
 *   deno run -A bench/scan_censored_count.ts [rows] [rounds]
 *
 * The file is written to a temporary folder and removed: a VARCHAR column
 * of numbers as text with 5% `<0.5`, 0.5% `>100`, 1% `NA` and 0.1% other
 * text.
 *
 * @module
 */
import { DuckDBInstance } from "@duckdb/node-api";
import { cellExpr, DUCKDB, valueExpr } from "../lib/scan/sql.ts";
import { countsSql } from "../lib/scan/sql_counts.ts";
import { presenceSql } from "../lib/scan/sql_survey.ts";

const rows = Number(Deno.args[0] ?? 1e7);
const rounds = Number(Deno.args[1] ?? 3);
const dir = await Deno.makeTempDir({ prefix: "plumbline_censored_bench_" });
const path = `${dir}/lab.parquet`;
const inst = await DuckDBInstance.create(":memory:", { threads: "2", memory_limit: "500MB" });
const con = await inst.connect();
const cpu = () => {
  const f = Deno.readTextFileSync("/proc/self/stat").split(") ")[1].split(" ");
  return (Number(f[11]) + Number(f[12])) / 100;
};
try {
  await con.run(
    `COPY (SELECT CASE WHEN i % 20 = 0 THEN '<0.5' WHEN i % 200 = 1 THEN '>100' ` +
      `WHEN i % 100 = 2 THEN 'NA' WHEN i % 1000 = 3 THEN 'broken vial' ` +
      `ELSE CAST(round(1 + (hash(i) % 100000) / 1000.0, 3) AS VARCHAR) END AS t ` +
      `FROM range(${rows}) r(i)) TO '${path}' (FORMAT parquet)`,
  );
  const R = `read_parquet('${path}')`;
  const cell = cellExpr("t", true);
  const v = valueExpr(DUCKDB, "t", true, 1);
  const f = DUCKDB.finite("v");
  // The counting pass before censored cells were counted (as it was in lib/scan/sql.ts).
  const countsBefore = `SELECT CAST(count(*) AS DOUBLE) AS total, ` +
    `CAST(count(c) AS DOUBLE) AS present, CAST(count(v) AS DOUBLE) AS numeric, ` +
    `CAST(count(*) FILTER (WHERE v IS NOT NULL AND NOT ${f}) AS DOUBLE) AS nonfinite, ` +
    `min(v) FILTER (WHERE ${f}) AS lo, max(v) FILTER (WHERE ${f}) AS hi ` +
    `FROM (SELECT ${cell} AS c, ${v} AS v FROM ${R}) AS s`;
  // The survey's pass before: present cells and numbers of a text column.
  const presenceBefore = `SELECT CAST(count(*) AS DOUBLE) AS total, ` +
    `CAST(count(${cell}) AS DOUBLE) AS p0, CAST(count(${v}) AS DOUBLE) AS q0, ` +
    `NULL AS lo0, NULL AS hi0 FROM ${R}`;
  const presenceNow = presenceSql(DUCKDB, R, [{ name: "t", textual: true, numeric: false }]);
  const variants: [string, string][] = [
    ["counting pass, before", countsBefore],
    ["counting pass, with censored cells", countsSql(DUCKDB, R, cell, v, true)],
    ["survey pass, before", presenceBefore],
    ["survey pass, with censored cells", presenceNow],
  ];
  const load = Deno.loadavg();
  console.log(`${rows} rows, ${rounds} rounds; load before: ${load.map((x) => x.toFixed(2))}`);
  const times = variants.map(() => [] as { cpu: number; wall: number }[]);
  const answers: string[] = [];
  for (let round = 0; round < rounds; round++) {
    for (const [i, [, sql]] of variants.entries()) {
      const c0 = cpu();
      const t0 = performance.now();
      const r = await con.runAndReadAll(sql);
      times[i].push({ cpu: cpu() - c0, wall: (performance.now() - t0) / 1000 });
      if (round === 0) answers.push(JSON.stringify(r.getRows()[0]));
    }
  }
  console.log("| pass | CPU (s), each round | wall (s), each round | answer (first round) |");
  console.log("| --- | --- | --- | --- |");
  variants.forEach(([name], i) => {
    const cpuText = times[i].map((t) => t.cpu.toFixed(2)).join(", ");
    const wallText = times[i].map((t) => t.wall.toFixed(2)).join(", ");
    console.log(`| ${name} | ${cpuText} | ${wallText} | ${answers[i]} |`);
  });
  console.log(`load after: ${Deno.loadavg().map((x) => x.toFixed(2))}`);
} finally {
  con.closeSync();
  inst.closeSync();
  await Deno.remove(dir, { recursive: true });
}
