/**
 * The survey of a scanned file leaves out and screens the same columns as
 * the survey of the same file loaded into memory: identifier columns (a
 * row number, the row names an export writes first) are left out with the
 * same reason, and a text column that reads mostly as numbers is screened,
 * its text cells counted, by the in-memory rule. Each file is written by
 * DuckDB as Parquet and as CSV, and read both ways.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { loadTable, scan, survey, type SurveyResult } from "../../mod.ts";

const _U = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;
const _Z = `sqrt(-2 * ln(${_U(0)})) * cos(2 * pi() * ${_U(7777777777)})`;

/** Write `select` as `<name>.parquet` and `<name>.csv` in `dir`; returns both paths. */
async function _write(dir: string, name: string, select: string): Promise<string[]> {
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    const paths = [`${dir}/${name}.parquet`, `${dir}/${name}.csv`];
    await con.run(`COPY (${select}) TO '${paths[0]}' (FORMAT parquet)`);
    await con.run(`COPY (${select}) TO '${paths[1]}' (FORMAT csv, HEADER)`);
    return paths;
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

/** What a survey decided per column: screened (n), skipped, or left out, with the counts. */
function _decisions(r: SurveyResult) {
  return {
    rows: Object.fromEntries(
      [...r.rows].sort((a, b) => (a.column < b.column ? -1 : 1)).map((row) => [row.column, {
        missing: row.missing,
        textDropped: row.textDropped,
        n: row.analysis?.n ?? null,
        screened: row.analysis !== undefined,
      }]),
    ),
    omitted: r.omitted,
    textColumns: r.textColumns,
  };
}

/** The scanned survey and the in-memory survey of one file, with the same options. */
async function _both(path: string, options: Parameters<typeof survey>[1] = {}) {
  const scanned = await survey(scan(path, { progress: false }), options).result();
  const memory = survey(await loadTable(path), options).result();
  return { scanned, memory };
}

/**
 * Invented inspection sheet, 300 rows: a gauge reading kept as text with
 * "void" notes and gaps (mostly numbers), an operator remark (mostly text),
 * and a fill volume.
 */
const _SHEET = `SELECT ` +
  `CASE WHEN i % 17 = 0 THEN NULL WHEN i % 8 = 0 THEN 'void' ` +
  `ELSE CAST(round(20 * exp(0.3 * ${_Z}), 3) AS VARCHAR) END AS reading, ` +
  `CASE WHEN i % 3 = 0 THEN CAST(i AS VARCHAR) ELSE 'ok ' || CAST(i % 5 AS VARCHAR) END ` +
  `AS remark, ` +
  `round(500 + 2 * ${_Z}, 2) AS fill_ml FROM range(300) t(i)`;

Deno.test("a scanned text column that reads mostly as numbers is screened as in memory", async () => {
  const dir = await Deno.makeTempDir({ prefix: "plumbline-survey-" });
  try {
    for (const path of await _write(dir, "sheet", _SHEET)) {
      // 300 rows: reading empty where i % 17 = 0 (18 rows), "void" where i % 8 = 0 and
      // i % 17 ≠ 0 (38 − 3 = 35 rows), 247 numbers; remark: 100 numbers, 200 words.
      const { scanned, memory } = await _both(path);
      const reading = scanned.rows.find((r) => r.column === "reading")!;
      assert.equal(reading.missing, 18, `${path}: reading missing`);
      assert.match(reading.skipped!, /35 of 282 cells are text/, `${path}: refused, named`);
      assert.deepEqual(scanned.textColumns, ["remark"], `${path}: remark is a text column`);
      assert.deepEqual(_decisions(scanned), _decisions(memory), `${path}: as in memory`);

      const kept = await _both(path, { dropText: true });
      const r = kept.scanned.rows.find((x) => x.column === "reading")!;
      assert.equal(r.textDropped, 35, `${path}: text cells counted`);
      assert.equal(r.analysis?.n, 300 - 18 - 35, `${path}: n`);
      assert.deepEqual(_decisions(kept.scanned), _decisions(kept.memory), `${path}: dropText`);
      assert.equal(
        r.analysis?.moments.mean,
        kept.memory.rows.find((x) => x.column === "reading")!
          .analysis?.moments.mean,
        `${path}: the same values`,
      );

      // Named: the mostly-text column is not screened, even with dropText, as in memory.
      const named = await _both(path, { columns: ["remark", "reading"], dropText: true });
      const remark = named.scanned.rows.find((x) => x.column === "remark")!;
      assert.equal(remark.skipped, "a text column");
      assert.deepEqual(_decisions(named.scanned), _decisions(named.memory), `${path}: named`);
    }
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
