/**
 * A survey of a scanned source reports what the columns it does not screen
 * hold (empty cells, text cells), and leaves out columns with no value at
 * all, as the in-memory survey of the same cells does.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { scan, survey } from "../../mod.ts";

/** Invented lab sheet: a fill volume with gaps, a remark column, a sample date, an unused column. */
const _SHEET = `SELECT CASE WHEN i % 7 = 0 THEN NULL ELSE 500 + sin(i * 0.7) * 2 END AS fill_ml, ` +
  `CASE WHEN i % 5 = 0 THEN NULL WHEN i % 3 = 0 THEN 'foam' ELSE CAST(i % 11 AS VARCHAR) END ` +
  `AS remark, ` +
  `CASE WHEN i % 4 = 0 THEN NULL ELSE DATE '2026-03-01' + CAST(i % 30 AS INTEGER) END AS sampled, ` +
  `CAST(NULL AS DOUBLE) AS spare, ` +
  `CASE WHEN i < 3 THEN i * 1.5 END AS retest_ml FROM range(70) t(i)`;

async function _table(): Promise<Record<string, unknown[]>> {
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    const r = await con.runAndReadAll(_SHEET);
    const names = r.columnNames();
    const cols = r.getColumns();
    return Object.fromEntries(names.map((n, i) => [n, cols[i].map((v) => v ?? null)]));
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

Deno.test("survey over a scan: columns not screened report their empty and text cells", async () => {
  const src = scan(_SHEET, { progress: false });
  const all = await survey(src).result();
  // 70 rows: fill_ml empty at i % 7 = 0 (10 rows); spare is empty throughout; retest_ml has 3 values.
  assert.deepEqual(all.omitted, [{ column: "spare", reason: "every cell is empty" }]);
  assert.ok(!all.rows.some((r) => r.column === "spare"), "an empty column is not a row");
  const fill = all.rows.find((r) => r.column === "fill_ml")!;
  assert.equal(fill.missing, 10);
  assert.equal(fill.analysis?.n, 60);
  const retest = all.rows.find((r) => r.column === "retest_ml")!;
  assert.equal(retest.missing, 67, "a column too short to screen still counts its empty cells");
  assert.match(retest.skipped!, /only 3 values/);

  const named = await survey(src, { columns: ["remark", "sampled", "spare"] }).result();
  const row = (c: string) => named.rows.find((r) => r.column === c)!;
  // remark: empty at i % 5 = 0 (14 rows); "foam" where i % 3 = 0 and i % 5 ≠ 0 (19 rows).
  assert.equal(row("remark").missing, 14);
  assert.equal(row("remark").textDropped, 0, "text cells are not dropped unless asked");
  // 37 numbers and 19 text cells: a column of numbers with a few notes, refused as in memory.
  assert.match(row("remark").skipped!, /19 of 56 cells are text, not numbers \("foam"/);
  assert.equal(row("sampled").missing, 18, "a DATE column counts its empty cells (i % 4 = 0)");
  assert.match(row("sampled").skipped!, /DATE/);
  assert.equal(named.omitted.length, 0, "a column named is reported, not left out");
  assert.equal(row("spare").missing, 70);

  const dropped = await survey(src, { columns: ["remark"], dropText: true }).result();
  assert.equal(dropped.rows[0].missing, 14);
  assert.equal(dropped.rows[0].textDropped, 19);
  assert.equal(dropped.rows[0].analysis?.n, 70 - 14 - 19);

  // The same cells in memory give the same counts and leave the same empty column out.
  const mem = survey(await _table()).result();
  const a = all.rows.find((r) => r.column === "fill_ml")!;
  const b = mem.rows.find((r) => r.column === "fill_ml")!;
  assert.equal(a.missing, b.missing, "fill_ml: missing");
  assert.equal(a.analysis?.n, b.analysis?.n, "fill_ml: n");
  assert.deepEqual(
    mem.omitted.filter((o) => o.column === "spare"),
    all.omitted,
    "the empty column is left out in memory too",
  );
});
