/**
 * Censored cells (`<0.5`, `>100`) in a scanned text column: the engine
 * reads them with the in-memory grammar (`lib/data/censored_cell.ts`),
 * counts them apart from other text, and refuses to screen the column
 * (even with `dropText`), naming the in-memory censored analysis; a survey
 * lists the column as not screened. The counts are compared with what
 * `loadTable` reports for the same CSV and Parquet files.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { loadTable, plumb, PlumbError, scan, survey } from "../../mod.ts";
import { parseCensored } from "../../lib/data/censored_cell.ts";
import { cellExpr, DUCKDB, quoteText, valueExpr } from "../../lib/scan/sql.ts";
import { censoredLimitExpr, censoredSideExpr } from "../../lib/scan/sql_counts.ts";

/** Cells at the edges of the grammar; in-memory `parseCensored` says which are censored. */
const AWKWARD = [
  "<0.5",
  "< 0.5",
  "<=2",
  "≤2",
  "＜3",
  ">100",
  "<",
  "<abc",
  "0.5<",
  "- <1",
  "<1e-3",
  "<-2",
  " >= 7 ",
  "≥1.",
  "<.5",
  "<<5",
  "<=<5",
  "<1e999",
  "<0.5 mg/L",
  "\u00a0<2\u00a0",
  "\u3000≦ 4",
  "≧4",
  "＞5",
  "<+3",
  "<1,5",
  "<\t2",
  "< 2 5",
  "<LOD",
  "<=",
  "2.5",
  "jam",
  "NA",
];

async function _rows(sql: string): Promise<unknown[][]> {
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    return (await con.runAndReadAll(sql)).getRows() as unknown[][];
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

Deno.test("censored cells: the SQL patterns and the in-memory parser agree on awkward cells", async () => {
  const c = cellExpr("x", true);
  const v = valueExpr(DUCKDB, "x", true, 1);
  const side = censoredSideExpr(DUCKDB, c, v);
  const values = AWKWARD.map((x, i) => `(${i}, ${quoteText(x)})`).join(", ");
  const rows = await _rows(
    `SELECT i, CAST(side AS DOUBLE), ${censoredLimitExpr(DUCKDB, "x", "side")} FROM ` +
      `(SELECT i, x, ${side} AS side FROM (VALUES ${values}) AS t(i, x)) AS s ORDER BY i`,
  );
  assert.equal(rows.length, AWKWARD.length);
  let censored = 0;
  for (const [i, s, limit] of rows) {
    const cell = AWKWARD[Number(i)];
    const expected = parseCensored(cell);
    if (expected !== null) censored++;
    assert.deepEqual(
      s === null ? null : { side: Number(s), limit: Number(limit) },
      expected === null ? null : { side: expected.side, limit: expected.limit },
      `cell ${JSON.stringify(cell)}`,
    );
  }
  // Both outcomes occur in the list, so a pattern that matched everything or nothing would fail.
  assert.equal(censored, 17);
});

/** An invented zinc column with detection limits, some text and missing cells, and a fill column. */
function _sheet(): { csv: string; zinc: string[] } {
  const zinc: string[] = [];
  const lines = ["id_code,zinc,fill"];
  for (let i = 1; i <= 300; i++) {
    const z = i % 10 === 0
      ? "<0.5"
      : i % 25 === 1
      ? "< 1"
      : i === 7
      ? ">100"
      : i === 13
      ? "≤0.2"
      : i === 8
      ? "jam"
      : i === 9
      ? "NA"
      : (0.5 + ((i * 37) % 101) / 20).toFixed(2);
    zinc.push(z);
    lines.push(`k${i},${z},${(500 + Math.sin(i) * 3).toFixed(3)}`);
  }
  return { csv: lines.join("\n") + "\n", zinc };
}

async function _files(): Promise<{ dir: string; csv: string; parquet: string; zinc: string[] }> {
  const dir = await Deno.makeTempDir({ prefix: "plumbline_censored_" });
  const { csv, zinc } = _sheet();
  await Deno.writeTextFile(`${dir}/zinc.csv`, csv);
  await _rows(
    `COPY (SELECT * FROM read_csv('${dir}/zinc.csv')) TO '${dir}/zinc.parquet' (FORMAT parquet)`,
  );
  return { dir, csv: `${dir}/zinc.csv`, parquet: `${dir}/zinc.parquet`, zinc };
}

Deno.test("censored cells: a scan refuses the column with the in-memory counts and limits", async () => {
  const f = await _files();
  try {
    for (const path of [f.csv, f.parquet]) {
      const p = (await loadTable(path)).info("zinc").provenance;
      // 30 cells "<0.5", 12 "< 1" (i = 1, 26, …, 276), "≤0.2" once, ">100" once.
      assert.deepEqual([p.censoredLeft, p.censoredRight, p.nonNumeric], [43, 1, 1], path);
      for (const dropText of [false, true]) {
        const refused = (e: unknown) => {
          assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
          assert.equal(e.code, "censored");
          const d = e.detail as {
            below: number;
            above: number;
            limits: { side: -1 | 1; limit: number; cells: number }[];
          };
          assert.equal(d.below, p.censoredLeft, `${path}: cells below a limit`);
          assert.equal(d.above, p.censoredRight, `${path}: cells above a limit`);
          const inMemory = p.censoredLimits.map((l) => ({
            side: l.side === "below" ? -1 : 1,
            limit: l.limit,
            cells: l.count,
          }));
          assert.deepEqual(
            [...d.limits].sort((a, b) => a.side - b.side || a.limit - b.limit),
            inMemory,
            `${path}: limits`,
          );
          assert.match(
            e.message,
            /: 44 of 299 cells are censored \(43 below a limit, 1 above one; limits with their cells: <0\.5 \(30\), <1 \(12\), /,
          );
          assert.match(e.message, /plumb\(table, column\) runs the censored analysis/);
          assert.equal(/dropText: true \} leaves out stray text/.test(e.message), dropText);
          return true;
        };
        await assert.rejects(scan(path, { progress: false, dropText }).analyse("zinc"), refused);
        await assert.rejects(
          plumb(scan(path, { progress: false }), "zinc", { dropText }).analysis(),
          refused,
        );
      }
      // The column of numbers beside it is screened as before.
      assert.equal((await scan(path, { progress: false }).analyse("fill")).n, 300);
    }
  } finally {
    await Deno.remove(f.dir, { recursive: true });
  }
});

Deno.test("censored cells: a survey of a scan lists the column as not screened, with its counts", async () => {
  const f = await _files();
  try {
    for (const path of [f.csv, f.parquet]) {
      const scanned = await survey(scan(path, { progress: false })).result();
      const row = scanned.rows.find((r) => r.column === "zinc");
      assert.ok(row !== undefined, `${path}: zinc is a row of the survey`);
      assert.equal(row.analysis, undefined);
      assert.equal(row.missing, 1);
      assert.equal(
        row.skipped,
        "44 censored cells (43 below a limit, 1 above one): the screening through SQL cannot " +
          "take them yet, and leaving them out would bias it; load the column into memory, where " +
          "plumb(table, column) runs the censored analysis",
      );
      assert.equal(scanned.rows.find((r) => r.column === "fill")?.analysis?.n, 300);
      // In memory the same column is screened (its one text cell left out), by the censored
      // analysis the message names.
      const memory = await survey(await loadTable(path), { dropText: true }).result();
      assert.equal(memory.rows.find((r) => r.column === "zinc")?.analysis?.n, 298);
    }
  } finally {
    await Deno.remove(f.dir, { recursive: true });
  }
});

Deno.test("censored cells: .by() over a scan refuses the groups that hold them, and pools no residuals", async () => {
  // Line L0 has "<0.5" in every tenth row (i even, i % 10 = 0); line L1 has measured values only.
  const q = "SELECT 'L' || (i % 2) AS line, CASE WHEN i % 10 = 0 THEN '<0.5' " +
    "ELSE CAST(1 + (i % 37) / 10.0 AS VARCHAR) END AS zinc FROM range(1, 401) r(i)";
  const r = await plumb(scan(q, { progress: false }), "zinc").by("line").result();
  const row = (g: string) => r.groups.find((x) => x.group === g)!;
  assert.match(row("L0").skipped!, /^40 censored cells \(40 below a limit\): /);
  assert.equal(row("L0").analysis, undefined);
  assert.equal(row("L1").analysis?.n, 200);
  // L0's measured values alone would bias the pooled residuals (its smallest values left out).
  assert.equal(r.residuals, undefined);
});

Deno.test("censored cells: a limit word in a scanned column is text, and the message says how to give its limit", async () => {
  const q = "SELECT CASE WHEN i % 10 = 0 THEN 'ND' WHEN i % 10 = 5 THEN 'TNTC' " +
    "ELSE CAST(i / 10.0 AS VARCHAR) END AS zinc FROM range(1, 101) r(i)";
  await assert.rejects(scan(q, { progress: false }).analyse("zinc"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    assert.match(
      e.message,
      /: 20 of 100 cells are text, not numbers \("TNTC", "ND", .*; "TNTC" says the value is above a limit without giving it, .*loadTable\(path, \{ detectionLimits: \{ "zinc": \{ above: 300 \} \} \}\) with your limit in place of 300, and plumb\(table, column\) runs the censored analysis\); clean them/,
    );
    return true;
  });
  // Without limit words, no such advice.
  const plain = "SELECT CASE WHEN i % 10 = 0 THEN 'jam' ELSE CAST(i AS VARCHAR) END AS zinc " +
    "FROM range(1, 101) r(i)";
  await assert.rejects(
    scan(plain, { progress: false }).analyse("zinc"),
    (e: unknown) => e instanceof PlumbError && !/detectionLimits/.test(e.message),
  );
});
