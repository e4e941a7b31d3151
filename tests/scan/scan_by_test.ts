/**
 * `analyseBy`: one screening per group, equal to the in-memory analysis of
 * each group's values, with Holm-adjusted p-values across the groups.
 *
 * @module
 */
import assert from "node:assert/strict";
import { holmAdjust, scan } from "../../mod.ts";
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
