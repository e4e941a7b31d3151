/**
 * Where the full screening through `scan` spends its time against DuckDB's
 * own `SELECT avg(x), stddev_samp(x)`: each pass, and the variants tried to
 * make it cheaper, timed side by side in one process over the same Parquet
 * file (CPU seconds of this process, and wall seconds; note the load).
 *
 *   deno run -A bench/scan_pass_variants.ts <file.parquet made by bench/scan_side_by_side.ts>
 *
 * @module
 */
import { DuckDBInstance } from "@duckdb/node-api";
import { gridFor } from "../lib/scan/cells.ts";
import { cellsSql, DUCKDB } from "../lib/scan/sql.ts";

const path = Deno.args[0];
if (!path) throw new Error("give the Parquet file written by bench/scan_side_by_side.ts");
const inst = await DuckDBInstance.create(":memory:", { threads: "2", memory_limit: "500MB" });
const con = await inst.connect();
await con.run("SET perfect_ht_threshold = 18");
const R = `read_parquet('${path.replaceAll("'", "''")}')`;
const cpu = () => {
  const f = Deno.readTextFileSync("/proc/self/stat").split(") ")[1].split(" ");
  return (Number(f[11]) + Number(f[12])) / 100;
};
const [range] = (await con.runAndReadAll(`SELECT min(x), max(x) FROM ${R}`)).getRows();
const [lo0, hi0] = range as number[];
// The grid the screening uses: about 32,768 cells of a power-of-two width.
const { lo, w } = gridFor(lo0, hi0, 32768);
const shipped = cellsSql(
  { dialect: DUCKDB, relation: R, v: `CAST("x" AS DOUBLE)`, keep: "all" },
  { a: lo0, b: hi0, lo, w },
  true,
);
const key = `floor((x - ${lo}) / ${w})`;
const sums = (k: string) =>
  `SELECT k, count(*), sum(e), sum(e2), sum(e2 * e), sum(e2 * e2) FROM (SELECT k, e, e * e AS e2 ` +
  `FROM (SELECT k, x - (${lo} + (k + 0.5) * ${w}) AS e FROM (SELECT x, ${k} AS k FROM ${R}))) ` +
  `GROUP BY k`;
const cells = [100, 2000, 5000, 7000, 8000, 8100, 8200, 8300, 8400, 8500, 9500, 13500];
const variants: [string, string][] = [
  ["DuckDB avg(x), stddev_samp(x)", `SELECT avg(x), stddev_samp(x) FROM ${R}`],
  ["plain sum(x) (reading alone)", `SELECT sum(x) FROM ${R}`],
  [
    "ungrouped count + 4 shifted sums",
    `SELECT count(*), sum(e), sum(e*e), sum(e*e*e), sum(e*e*e*e) FROM (SELECT x - ${
      lo0 + (hi0 - lo0) / 2
    } AS e FROM ${R})`,
  ],
  ["cell pass as shipped (in cell widths, lib/scan/sql.ts)", shipped],
  ["cell pass, key and offset apart (before)", sums(key)],
  ["cell pass, INTEGER key", sums(`CAST(${key} AS INTEGER)`)],
  [
    "cell pass, perfect hash (USMALLINT)",
    sums(`CAST(least(greatest(${key}, 0), 65535) AS USMALLINT)`),
  ],
  [
    "grouped count + Σe, Σe² (no Σe³, Σe⁴)",
    `SELECT k, count(*), sum(e), sum(e * e) FROM (SELECT k, x - (${lo} + (k + 0.5) * ${w}) AS e ` +
    `FROM (SELECT x, ${key} AS k FROM ${R})) GROUP BY k`,
  ],
  [
    "grouped count only",
    `SELECT k, count(*) FROM (SELECT CAST(${key} AS INTEGER) AS k FROM ${R}) GROUP BY k`,
  ],
  [
    "gather, IN list",
    `SELECT x FROM (SELECT x, ${key} AS k FROM ${R}) WHERE k IN (${cells.join(", ")})`,
  ],
  [
    "gather, semi-join",
    `SELECT x FROM (SELECT x, ${key} AS k FROM ${R}) WHERE k IN (SELECT unnest([${
      cells.join(", ")
    }]::DOUBLE[]))`,
  ],
  [
    "seeded reservoir sample of 5000",
    `SELECT x FROM ${R} USING SAMPLE reservoir(5000 ROWS) REPEATABLE (1)`,
  ],
];
console.log(`| query | CPU (s) | wall (s) | CPU / avg+stddev | load (1 min) |`);
console.log(`|---|---|---|---|---|`);
let base = NaN;
for (let round = 0; round < 2; round++) {
  for (const [name, sql] of variants) {
    const t = performance.now();
    const c = cpu();
    await con.runAndReadAll(sql);
    const used = cpu() - c;
    if (name.startsWith("DuckDB")) base = used;
    console.log(
      `| ${name} | ${used.toFixed(2)} | ${((performance.now() - t) / 1000).toFixed(2)} | ${
        (used / base).toFixed(1)
      } | ${Deno.loadavg()[0].toFixed(1)} |`,
    );
  }
}
con.closeSync();
inst.closeSync();
