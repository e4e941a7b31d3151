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
 * "void" notes and gaps, empty or written as missing-value tokens ("NA",
 * " - ") (mostly numbers), an operator remark (mostly text),
 * and a fill volume.
 */
const _SHEET = `SELECT ` +
  `CASE WHEN i % 17 = 0 THEN NULL WHEN i % 23 = 0 THEN 'NA' WHEN i % 29 = 0 THEN ' - ' ` +
  `WHEN i % 8 = 0 THEN 'void' WHEN i % 37 = 0 THEN 'inf' ` +
  `ELSE CAST(round(20 * exp(0.3 * ${_Z}), 3) AS VARCHAR) END AS reading, ` +
  `CASE WHEN i % 3 = 0 THEN CAST(i AS VARCHAR) ELSE 'ok ' || CAST(i % 5 AS VARCHAR) END ` +
  `AS remark, ` +
  `round(500 + 2 * ${_Z}, 2) AS fill_ml FROM range(300) t(i)`;

Deno.test("a scanned text column that reads mostly as numbers is screened as in memory", async () => {
  const dir = await Deno.makeTempDir({ prefix: "plumbline-survey-" });
  try {
    for (const path of await _write(dir, "sheet", _SHEET)) {
      // 300 rows of reading: 18 empty (i % 17 = 0), then 13 "NA" (i % 23 = 0) and 10 " - "
      // (i % 29 = 0), missing as in memory; 33 "void" (i % 8 = 0) and 7 "inf" (i % 37 = 0),
      // text as in memory; 219 numbers.
      // remark: 100 numbers, 200 words.
      const { scanned, memory } = await _both(path);
      const reading = scanned.rows.find((r) => r.column === "reading")!;
      assert.equal(reading.missing, 18 + 13 + 10, `${path}: reading missing`);
      assert.match(reading.skipped!, /40 of 259 cells are text/, `${path}: refused, named`);
      assert.deepEqual(scanned.textColumns, ["remark"], `${path}: remark is a text column`);
      assert.deepEqual(_decisions(scanned), _decisions(memory), `${path}: as in memory`);

      const kept = await _both(path, { dropText: true });
      const r = kept.scanned.rows.find((x) => x.column === "reading")!;
      assert.equal(r.textDropped, 40, `${path}: text cells counted`);
      assert.equal(r.analysis?.n, 219, `${path}: n`);
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

/**
 * Invented tray log, 300 rows: a row-name column first (increasing whole
 * numbers with gaps), a run number 1…300, a batch number 1001…1300 stored
 * as doubles, a tray number that holds 1…300 in another order, a bottle
 * count with one gap, and a fill volume.
 */
const _TRAYS = `SELECT i * 2 + (i % 3 = 0)::INTEGER AS "index", i + 1 AS run_no, ` +
  `CAST(i + 1001 AS DOUBLE) AS batch, (i * 7) % 300 + 1 AS tray, ` +
  `CASE WHEN i = 150 THEN NULL ELSE i + 1 END AS bottles, ` +
  `round(500 + 2 * ${_Z}, 2) AS fill_ml FROM range(300) t(i)`;

Deno.test("a scanned survey leaves out identifier columns as the in-memory survey does", async () => {
  const dir = await Deno.makeTempDir({ prefix: "plumbline-survey-" });
  try {
    for (const path of await _write(dir, "trays", _TRAYS)) {
      const { scanned, memory } = await _both(path);
      assert.deepEqual(
        scanned.omitted.map((o) => o.column),
        ["index", "run_no", "batch"],
        `${path}: left out`,
      );
      assert.equal(
        scanned.omitted[1].reason,
        "its values run 1, 2, … 300 down the rows, like a row number, so it names rows rather " +
          "than measuring anything; screen it with identifiers: true or by naming it in columns",
      );
      assert.match(scanned.omitted[0].reason, /^the first column, headed "index", holds whole/);
      // tray holds 1…300 out of order, bottles has a gap: both are screened.
      assert.ok(scanned.rows.find((r) => r.column === "tray")?.analysis, `${path}: tray`);
      assert.ok(scanned.rows.find((r) => r.column === "bottles")?.analysis, `${path}: bottles`);
      assert.deepEqual(_decisions(scanned), _decisions(memory), `${path}: as in memory`);

      const all = await _both(path, { identifiers: true });
      assert.equal(all.scanned.omitted.length, 0, `${path}: identifiers: true`);
      assert.deepEqual(_decisions(all.scanned), _decisions(all.memory), `${path}: opt-in`);
      const named = await _both(path, { columns: ["run_no", "fill_ml"] });
      assert.equal(named.scanned.rows.filter((r) => r.analysis).length, 2, `${path}: named`);
      assert.deepEqual(_decisions(named.scanned), _decisions(named.memory), `${path}: named`);
    }
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("a scanned CSV's unnamed first column of row names is left out as in memory", async () => {
  const dir = await Deno.makeTempDir({ prefix: "plumbline-survey-" });
  try {
    // The row names an export writes: an empty header, 1, 3, 4, 7, … (rows filtered before).
    const lines = [",fill_ml,line"];
    for (let i = 0; i < 40; i++) {
      lines.push(`${i * 2 + (i % 2)},${500 + ((i * 37) % 11) / 10},L${i % 2}`);
    }
    const path = `${dir}/export.csv`;
    await Deno.writeTextFile(path, lines.join("\n") + "\n");
    const { scanned, memory } = await _both(path);
    assert.equal(scanned.omitted.length, 1);
    assert.equal(memory.omitted.length, 1);
    // DuckDB names the column column0, the in-memory reader column_1: the same reason.
    assert.equal(scanned.omitted[0].reason, memory.omitted[0].reason);
    assert.match(
      scanned.omitted[0].reason,
      /^the first column, with no header, holds whole numbers/,
    );
    assert.deepEqual(_decisions(scanned).rows, _decisions(memory).rows);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("the row order of a Parquet file read in parallel row groups is the file's", async () => {
  const dir = await Deno.makeTempDir({ prefix: "plumbline-survey-" });
  try {
    // 100,000 rows in row groups of 2,048, read by several threads: the run is still a run,
    // and a run with two neighbours swapped (rows 70,000 and 70,001) is not.
    const path = `${dir}/long.parquet`;
    const inst = await DuckDBInstance.create(":memory:");
    const con = await inst.connect();
    await con.run(
      `COPY (SELECT i + 1 AS seq, CASE WHEN i = 70000 THEN 70002 WHEN i = 70001 THEN 70001 ` +
        `ELSE i + 1 END AS swapped, 500 + ${_Z} AS fill_ml FROM range(100000) t(i)) ` +
        `TO '${path}' (FORMAT parquet, ROW_GROUP_SIZE 2048)`,
    );
    con.closeSync();
    inst.closeSync();
    const s = await survey(scan(path, { progress: false, threads: 2 })).result();
    assert.deepEqual(s.omitted.map((o) => o.column), ["seq"]);
    assert.ok(s.rows.find((r) => r.column === "swapped")?.analysis, "swapped is screened");
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
