/**
 * `plumb`, `survey` and `.by()` over a scanned Parquet file give what the
 * same calls give over the same values in memory. Below the sample size
 * (5,000) the seeded sample is every value, so every test statistic must
 * agree too; above it, the result must say which sample the
 * order-statistic tests used.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { plumb, type PlumbError, scan, survey } from "../../mod.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import type { Analysis } from "../../lib/results/analysis.ts";
import { assertClose } from "../_assert_close.ts";

const _U = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;
const _Z = `sqrt(-2 * ln(${_U(0)})) * cos(2 * pi() * ${_U(7777777777)})`;

/** Invented filler-line data: a line label (some empty), a skewed fill volume, a near-normal temperature. */
const _SELECT = `SELECT CASE i % 4 WHEN 0 THEN 'L1' WHEN 1 THEN 'L2' WHEN 2 THEN 'L3' ELSE ` +
  `(CASE WHEN i % 40 = 3 THEN NULL ELSE 'L1' END) END AS line, ` +
  `500 * exp(0.02 * ${_Z}) + (i % 4) AS fill_ml, ` +
  `21 + 0.4 * sqrt(-2 * ln(${_U(31)})) * cos(2 * pi() * ${_U(97)}) AS temp_c`;

async function _write(dir: string, n: number) {
  const path = `${dir}/fills.parquet`;
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    await con.run(`COPY (${_SELECT} FROM range(${n}) t(i)) TO '${path}' (FORMAT parquet)`);
    const cols = (await con.runAndReadAll(`SELECT * FROM read_parquet('${path}')`)).getColumns();
    return {
      path,
      table: {
        line: cols[0] as (string | null)[],
        fill_ml: Float64Array.from(cols[1] as number[]),
        temp_c: Float64Array.from(cols[2] as number[]),
      },
    };
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

/**
 * `a` (through the scan) against `b` (in memory). `valuesTol`: when the
 * values themselves are computed by each side (residuals from a group mean:
 * DuckDB's avg and plumbline's mean differ in the last bits), the QQ points
 * are compared within that absolute tolerance instead of exactly.
 */
function _same(a: Analysis, b: Analysis, what: string, valuesTol = 0): void {
  for (const k of Object.keys(b)) assert.ok(k in a, `${what}: field ${k} missing`);
  assert.equal(a.n, b.n, `${what}: n`);
  for (const k of ["mean", "sd", "g1", "g2"] as const) {
    assertClose(
      a.moments[k],
      b.moments[k],
      { rel: 1e-9, abs: 1e-12 * b.moments.sd },
      `${what} ${k}`,
    );
  }
  assert.deepEqual(a.tests.map((t) => t.test), b.tests.map((t) => t.test), `${what}: tests`);
  a.tests.forEach((t, i) => {
    const e = b.tests[i].result;
    if (e === undefined) return assert.equal(t.result, undefined, `${what}: ${t.test} skipped`);
    assertClose(t.result!.statistic, e.statistic, { rel: 1e-9 }, `${what}: ${t.test}`);
    assertClose(t.result!.pValue, e.pValue, { rel: 1e-6, abs: 1e-12 }, `${what}: ${t.test} p`);
  });
  if (valuesTol === 0) assert.deepEqual(a.qq.value, b.qq.value, `${what}: QQ points`);
  else {
    assert.deepEqual(a.qq.rank, b.qq.rank, `${what}: QQ ranks`);
    a.qq.value.forEach((v, i) =>
      assertClose(v, b.qq.value[i], { abs: valuesTol }, `${what}: QQ point ${i}`)
    );
  }
  assert.deepEqual(a.histogram.counts, b.histogram.counts, `${what}: histogram`);
  assert.equal(a.reading.verdict, b.reading.verdict, `${what}: verdict`);
  assert.equal(a.subsample, null, `${what}: every value in the sample`);
}

Deno.test("plumb, .by() and survey over a scan equal the same calls in memory", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const { path, table } = await _write(dir, 4000);
    const src = scan(path, { progress: false });

    const a = await plumb(src, "fill_ml").analysis();
    _same(a, plumb(table, "fill_ml").analysis(), "fill_ml");

    const g = await plumb(src, "fill_ml").by("line").result();
    const m = plumb(table, "fill_ml").by("line").result();
    assert.deepEqual(g.groups.map((r) => [r.group, r.n]), m.groups.map((r) => [r.group, r.n]));
    assert.equal(g.noGroup, m.noGroup);
    assert.ok(g.noGroup > 0, "the empty line labels are left out and counted");
    g.groups.forEach((r, i) => {
      _same(r.analysis!, m.groups[i].analysis!, `group ${r.group}`);
      assertClose(r.adjustedP!, m.groups[i].adjustedP!, { rel: 1e-6 }, `group ${r.group} adj. p`);
    });
    _same(g.residuals!, m.residuals!, "residuals within line", 1e-12 * m.residuals!.moments.sd);

    const s = await survey(src).result();
    const t = survey(table).result();
    assert.deepEqual(s.rows.map((r) => r.column), t.rows.map((r) => r.column));
    assert.deepEqual(s.textColumns, t.textColumns);
    s.rows.forEach((r, i) => {
      _same(r.analysis!, t.rows[i].analysis!, `survey ${r.column}`);
      assert.equal(r.suggestion, t.rows[i].suggestion, `survey ${r.column}: suggestion`);
    });
    assert.match(await survey(src).toMarkdown(), /\| fill\\_ml \| 4,000 \|/);
    const card = await plumb(src, "fill_ml")[DISPLAY]();
    assert.match(card["text/plain"], /fill_ml/);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("plumb over a scan above the sample size states the sample the order-statistic tests used", async () => {
  const src = scan(`${_SELECT} FROM range(20000) t(i)`, { progress: false });
  const p = plumb(src, "temp_c");
  assert.equal(
    (p.toJSON() as { n?: number }).n,
    undefined,
    "nothing computed before it is asked for",
  );
  const a = await p.analysis();
  assert.equal(a.n, 20000);
  assert.deepEqual(a.subsample, { size: 5000, seed: 1 });
  assert.equal(a.primary.n, 5000);
  assert.match(a.primary.warnings.join(" "), /seeded random subsample of 5000 of the 20000/);
  assert.equal((p.toJSON() as Analysis).n, 20000);
  const again = await plumb(
    scan(`${_SELECT} FROM range(20000) t(i)`, { progress: false }),
    "temp_c",
  )
    .analysis();
  assert.equal(again.primary.statistic, a.primary.statistic, "the same seed gives the same sample");
  const c = await p.candidates();
  assert.match(c.toMarkdown(), /seeded sample of 5000/);
});

Deno.test("plumb and survey over a scan: errors name the problem and what to do", async () => {
  const missing = scan("no_such_folder/fills.parquet", { progress: false });
  await assert.rejects(
    plumb(missing, "fill_ml").analysis(),
    (e: PlumbError) => e.code === "not-found",
  );
  await assert.rejects(survey(missing).result(), (e: PlumbError) => e.code === "not-found");
  const src = scan(`${_SELECT} FROM range(100) t(i)`, { progress: false });
  await assert.rejects(
    plumb(src).analysis(),
    (e: PlumbError) => e.code === "bad-option" && /name the one to analyse/.test(e.message),
  );
  const one = plumb(scan("SELECT i * 0.5 AS gap_mm FROM range(40) t(i)", { progress: false }));
  assert.equal((await one.analysis()).origin.column, "gap_mm", "the only numeric column");
  assert.equal(one.label, "gap_mm");
  await assert.rejects(
    plumb(src, "fill").analysis(),
    (e: PlumbError) => e.code === "unknown-column",
  );
  await assert.rejects(
    plumb(src, "fill_ml").by("shift").result(),
    (e: PlumbError) => e.code === "unknown-column",
  );
  await assert.rejects(
    survey(src, { columns: ["fill"] }).result(),
    (e: PlumbError) => e.code === "unknown-column",
  );
  const bad = scan("SELECT 1.5 AS fill_ml FROM range(10) t(i) WHERE i >", { progress: false });
  await assert.rejects(
    plumb(bad, "fill_ml").analysis(),
    (e: PlumbError) => e.code === "query-failed" && /DuckDB says/.test(e.message),
  );
  // A column the methods refuse is a row of the survey, not a failure of it. (The ramp goes
  // in half steps: 0, 1, 2, … would be a row number, left out as in memory.)
  const s = await survey(scan("SELECT 1.0 AS flat, i * 0.5 AS ramp FROM range(50) t(i)", {
    progress: false,
  })).result();
  assert.equal(s.rows.find((r) => r.column === "flat")?.skipped, "every value is the same");
  assert.equal(s.rows.find((r) => r.column === "ramp")?.analysis?.n, 50);
});

Deno.test("plumb over a scan: ties and pile-ups are judged within the seeded sample", async () => {
  const smooth = await plumb(
    scan(`${_SELECT} FROM range(30000) t(i)`, { progress: false }),
    "temp_c",
  )
    .reading();
  assert.equal(
    smooth.facts.tied,
    false,
    "5000 sampled values of a continuous column are not coarse",
  );
  assert.equal(smooth.facts.pileUp, null);
  assert.match(
    smooth.sizeNote,
    /Anderson–Darling and Lilliefors used a seeded random sample of 5,000/,
  );
  // Torque read to 0.1 N·m, and 5% of the readings at the gauge's floor of 1.0.
  const rounded = await plumb(
    scan(
      `SELECT CASE WHEN i % 20 = 0 THEN 1.0 ELSE round(2 + 0.3 * sin(i * 0.37) + 0.2 * cos(i * 1.3), 1) END ` +
        `AS torque FROM range(30000) t(i)`,
      { progress: false },
    ),
    "torque",
  ).reading();
  assert.equal(rounded.facts.tied, true);
  assert.equal(rounded.facts.pileUp?.end, "minimum");
  const pile = rounded.facts.pileUp!.count;
  assert.ok(pile > 150 && pile < 350, `about 5% of the 5000 sampled values: ${pile}`);
  const said = rounded.points.join(" ");
  assert.match(said, new RegExp(`${pile} of 5,000 values sit exactly at the minimum, 1\\.00`));
  assert.match(said, /steps of 0\.1/);
  assert.doesNotMatch(said, /\(row/);
});

Deno.test("the card of a scanned column names no source rows", async () => {
  // Two far values among 4,000 (all in the sample), so that the outliers have rows to name.
  const src = scan(
    `SELECT CASE WHEN i = 7 THEN 40 WHEN i = 11 THEN -20 ELSE ${_Z} END AS gap_mm ` +
      `FROM range(4000) t(i)`,
    { progress: false },
  );
  const p = plumb(src, "gap_mm");
  const r = await p.reading();
  assert.ok(r.facts.outliers.count >= 2, `outliers found: ${r.facts.outliers.count}`);
  assert.ok(r.facts.outliers.values.every((v) => v.row === -1), "no row is claimed");
  const card = await p[DISPLAY]();
  assert.match(card["text/plain"], /farthest 40/);
  assert.doesNotMatch(card["text/plain"], /\(row/);
});

Deno.test("a scan with the default progress works outside a notebook (no Jupyter namespace)", async () => {
  // In `deno run` and `deno test`, reading Deno.jupyter throws; the default progress must not.
  const a = await plumb(scan("SELECT i * 0.25 AS gap_mm FROM range(50) t(i)")).analysis();
  assert.equal(a.n, 50);
});
