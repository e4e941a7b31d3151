/**
 * `analyseBy`: one screening per group, equal to the in-memory analysis of
 * each group's values, with Holm-adjusted p-values across the groups.
 *
 * @module
 */
import assert from "node:assert/strict";
import { holmAdjust, plumb, scan } from "../../mod.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { DuckDBInstance } from "@duckdb/node-api";

Deno.test("scan.analyseBy: each group equals the in-memory analysis of its values", async () => {
  // Three invented filler lines, one with an empty line label.
  const q = "SELECT CASE i % 3 WHEN 0 THEN 'L1' WHEN 1 THEN 'L2' ELSE NULL END AS line, " +
    "500 + (i % 3) + sin(i * 0.7) + cos(i * 0.13) AS fill FROM range(30000) t(i)";
  const by = await scan(q, { progress: false }).analyseBy("fill", "line");
  assert.deepEqual(by.groups.map((g) => g.value), ["L1", "L2", null]);
  // The same values read back through DuckDB (its sin and cos differ from JavaScript's in the last bit).
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  const cols = (await con.runAndReadAll(`SELECT line, fill FROM (${q})`)).getColumns();
  con.closeSync();
  inst.closeSync();
  const labels = ["L1", "L2", null];
  for (const [k, g] of by.groups.entries()) {
    const values = Float64Array.from(
      (cols[1] as number[]).filter((_, i) => cols[0][i] === labels[k]),
    );
    const b = analyse(values, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
    assert.equal(g.analysis.n, 10000);
    assert.equal(g.analysis.origin.group, g.value ?? "(empty)");
    assert.ok(Math.abs(g.analysis.moments.sd / b.moments.sd - 1) < 1e-9);
    assert.deepEqual(g.analysis.qq.value, b.qq.value);
  }
  assert.deepEqual(by.pAdjusted, holmAdjust(by.groups.map((g) => g.analysis.primary.pValue)));
  assert.equal(JSON.parse(JSON.stringify(by)).groups.length, 3);
});

Deno.test("a group cell written as a missing-value token belongs to no group, as in memory", async () => {
  // Invented: two filler lines; the line label is empty on 6 rows and "NA" or " na " on 18 more.
  const q = "SELECT CASE WHEN i % 20 = 0 THEN NULL WHEN i % 10 = 0 THEN 'NA' " +
    "WHEN i % 10 = 5 THEN ' na ' WHEN i % 2 = 1 THEN 'L1' ELSE 'L2' END AS line, " +
    "500 + sin(i * 1.3) + (i % 2) AS fill_ml FROM range(120) t(i)";
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  const cols = (await con.runAndReadAll(q)).getColumns();
  con.closeSync();
  inst.closeSync();
  const t = { line: cols[0].map((v) => v ?? null) as string[], fill_ml: cols[1] as number[] };
  const src = scan(q, { progress: false });
  const a = await plumb(src, "fill_ml").by("line").result();
  const b = plumb(t, "fill_ml").by("line").result();
  // 120 rows: empty where i % 20 = 0 (6), "NA" where i % 10 = 0 otherwise (6), " na " where
  // i % 10 = 5 (12): 24 rows in no group; L1 48 rows (odd i but i % 10 = 5), L2 48.
  assert.deepEqual(a.groups.map((g) => [g.group, g.n]), [["L1", 48], ["L2", 48]]);
  assert.equal(a.noGroup, 24);
  assert.deepEqual(a.groups.map((g) => [g.group, g.n]), b.groups.map((g) => [g.group, g.n]));
  assert.equal(a.noGroup, b.noGroup);
  assert.equal(a.residuals?.n, b.residuals?.n, "the pooled residuals leave the same rows out");
  const low = await src.analyseBy("fill_ml", "line");
  assert.deepEqual(low.groups.map((g) => [g.value, g.analysis.n]), [["L1", 48], ["L2", 48], [
    null,
    24,
  ]]);
});
