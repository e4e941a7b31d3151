/**
 * `.reexpress()` on a scanned chain: the engine re-expresses every value in
 * SQL and screens the result, equal to the same re-expression in memory;
 * `"best"` takes the Box–Cox λ fitted over every value; calls a scanned
 * chain does not offer, and re-expressions the range rules out, refuse
 * with a `PlumbError` that says what to do.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { plumb, type PlumbError, scan } from "../../mod.ts";
import type { Analysis } from "../../lib/results/analysis.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import { assertClose } from "../_assert_close.ts";

const _U = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;
const _Z = `sqrt(-2 * ln(${_U(0)})) * cos(2 * pi() * ${_U(7777777777)})`;

/** Invented: right-skewed fill volumes on three lines, and a drift that crosses zero. */
const _SELECT = `SELECT 'L' || CAST(i % 3 AS VARCHAR) AS line, ` +
  `500 * exp(0.25 * ${_Z}) + 20 * (i % 3) AS fill_ml, ` +
  `0.3 * ${_Z} + 0.2 * ${_Z} * ${_Z} - 0.1 AS drift_ml FROM range(4000) t(i)`;

async function _table() {
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    const r = await con.runAndReadAll(_SELECT);
    const c = r.getColumns();
    return {
      line: c[0] as string[],
      fill_ml: Float64Array.from(c[1] as number[]),
      drift_ml: Float64Array.from(c[2] as number[]),
    };
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

/** Re-expressed by DuckDB (`a`) and in memory (`b`): the same screening up to the last bits. */
function _same(a: Analysis, b: Analysis, what: string): void {
  assert.equal(a.n, b.n, `${what}: n`);
  assert.equal(a.origin.label, b.origin.label, `${what}: label`);
  assert.equal(a.origin.transform, b.origin.transform, `${what}: transform`);
  for (const k of ["mean", "sd", "g1", "g2"] as const) {
    assertClose(a.moments[k], b.moments[k], { rel: 1e-9, abs: 1e-12 * b.moments.sd }, k);
  }
  a.tests.forEach((t, i) => {
    const e = b.tests[i].result!;
    assertClose(t.result!.statistic, e.statistic, { rel: 1e-9 }, `${what}: ${t.test}`);
  });
  // SQL's ln/power and JavaScript's Math.log/expm1 may differ in the last bit.
  a.qq.value.forEach((v, i) =>
    assertClose(v, b.qq.value[i], { rel: 1e-12, abs: 1e-12 }, `${what}: QQ point ${i}`)
  );
  assert.deepEqual(a.histogram.counts, b.histogram.counts, `${what}: histogram`);
  assert.equal(a.reading.verdict, b.reading.verdict, `${what}: verdict`);
}

Deno.test("reexpress on a scan equals the same re-expression in memory", async () => {
  const src = scan(_SELECT, { progress: false });
  const t = await _table();
  const asked = [
    ["fill_ml", "log"],
    ["fill_ml", "log10"],
    ["fill_ml", "sqrt"],
    ["fill_ml", "reciprocal"],
    ["fill_ml", { boxCox: -0.4 }],
    ["fill_ml", { log: { shift: -200 } }],
    ["drift_ml", { yeoJohnson: 0.6 }],
  ] as const;
  for (const [col, r] of asked) {
    const a = await plumb(src, col).reexpress(r).analysis();
    _same(a, plumb(t, col).reexpress(r).analysis(), `${col} ${JSON.stringify(r)}`);
  }
  // By group: the re-expressed values screened within each line.
  const g = await plumb(src, "fill_ml").reexpress("log").by("line").result();
  const m = plumb(t, "fill_ml").reexpress("log").by("line").result();
  assert.equal(g.label, "ln(fill_ml)");
  g.groups.forEach((row, i) => _same(row.analysis!, m.groups[i].analysis!, `group ${row.group}`));
});

Deno.test("reexpress('best') on a scan uses the Box–Cox λ fitted over every value", async () => {
  // 30,000 values: above the sample size, so the ranking is on the seeded sample.
  // Shelf-life hours whose cube-root-like power (λ ≈ 0.3) is normal.
  const sql = `SELECT power(10 + ${_Z}, 1 / 0.3) AS fill_ml FROM range(30000) t(i)`;
  const src = scan(sql, { progress: false });
  const fit = (await scan(sql, { progress: false }).analyse("fill_ml")).boxCox;
  assert.ok("lambda" in fit);
  const p = plumb(src, "fill_ml").reexpress();
  const a = await p.analysis();
  assert.match(
    (await p.choice())!.reason,
    /sample of 5000\); the engine applies Box–Cox\[λ = [^\]]+\]\(x\), its λ fitted by maximum likelihood over every value$/,
  );
  assert.equal(await plumb(src, "fill_ml").choice(), null);
  // The ranking on the sample picks the Box–Cox family here, with λ from every value.
  const b = await plumb(src, "fill_ml").reexpress({ boxCox: fit.lambda }).analysis();
  assert.equal(a.origin.transform, b.origin.transform);
  assert.equal(a.moments.mean, b.moments.mean);
  assert.match(a.origin.transform!, /^Box–Cox\[λ = /);
  assert.deepEqual(a.subsample, { size: 5000, seed: 1 }, "the sample is stated");
  // Kept as they are (no clear departure): the same screening as the chain plumb() made, with
  // the reason leading the reading, as in memory.
  const flat = scan(`SELECT 10 + ${_Z} AS gap_mm FROM range(3000) t(i)`, { progress: false });
  const kept = plumb(flat, "gap_mm").reexpress();
  const why = (await kept.choice())!;
  assert.equal(why.reexpression, null);
  const k = await kept.analysis();
  const plain = await plumb(flat, "gap_mm").analysis();
  assert.equal(k.reading.points[0], why.reason);
  assert.deepEqual(k.reading.points.slice(1), plain.reading.points);
  assert.deepEqual(k.origin.notes, [why.reason]);
  assert.deepEqual({ ...k, origin: plain.origin, reading: plain.reading }, plain);
});

Deno.test("reexpress('best') on a scan keeps a separate cluster as it is and says why first", async () => {
  // Invented potassium readings: 5,430 around 4.2 and 170 around 6.8 (a second analyser batch).
  const sql = `SELECT CASE WHEN i % 33 = 0 THEN 6.8 + 0.3 * ${_Z} ELSE 4.2 + 0.35 * ${_Z} END ` +
    `AS potassium FROM range(5600) t(i)`;
  const kept = plumb(scan(sql, { progress: false }), "potassium").reexpress();
  const why = (await kept.choice())!;
  assert.equal(why.reexpression, null);
  assert.match(
    why.reason,
    /^No re-expression applied: the departure comes from a separate cluster/,
  );
  assert.equal((await kept.analysis()).reading.points[0], why.reason);
  // The card a notebook shows says so.
  assert.match((await kept[DISPLAY]())["text/plain"], /separate cluster/);
});

Deno.test("a scanned chain refuses what it cannot do, saying what to do instead", async () => {
  const src = scan(_SELECT, { progress: false });
  const p = plumb(src, "fill_ml");
  const refused = (f: () => unknown, pattern: RegExp) =>
    assert.throws(f, (e: PlumbError) => e.code === "unavailable" && pattern.test(e.message));
  refused(() => p.lambda(), /analyse\(column\)\)\.boxCox/);
  refused(() => p.stakes(), /into memory/);
  refused(() => p.residuals(), /SQL query/);
  refused(() => p.values(), /stay in the engine/);
  refused(() => p.reexpress("log").reexpress("sqrt"), /re-express once/);
  await assert.rejects(
    plumb(src, "drift_ml").reexpress({ boxCox: 0.5 }).analysis(),
    (e: PlumbError) => e.code === "non-positive" && /yeoJohnson/.test(e.message),
  );
  await assert.rejects(
    plumb(src, "drift_ml").reexpress("reciprocal").analysis(),
    (e: PlumbError) => e.code === "zero" && /one side of zero/.test(e.message),
  );
  await assert.rejects(
    plumb(src, "drift_ml").reexpress({ log: { shift: 0 } }).analysis(),
    (e: PlumbError) => e.code === "non-positive",
  );
  assert.throws(
    () => p.reexpress("logg" as never),
    (e: PlumbError) => e.code === "bad-option" && /did you mean "log"/.test(e.message),
  );
});

/** Invented: a gauge reading kept as text, with a few "void" notes and empty cells, on two lines. */
const _TEXTUAL = `SELECT 'L' || CAST(i % 2 AS VARCHAR) AS line, ` +
  `CASE WHEN i % 13 = 0 THEN NULL WHEN i % 9 = 0 THEN 'void' ` +
  `ELSE CAST(20 * exp(0.3 * ${_Z}) AS VARCHAR) END AS reading FROM range(600) t(i)`;

Deno.test("reexpress on a scanned text column counts its text cells as text, not missing", async () => {
  const src = scan(_TEXTUAL, { progress: false });
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  const cols = (await con.runAndReadAll(_TEXTUAL)).getColumns();
  con.closeSync();
  inst.closeSync();
  const t = { line: cols[0] as string[], reading: cols[1].map((v) => v ?? null) as string[] };
  // 600 rows: empty where i % 13 = 0 (47 rows), "void" where i % 9 = 0 and i % 13 ≠ 0 (67 − 6 = 61 rows).
  const a = await plumb(src, "reading", { dropText: true }).reexpress("log").analysis();
  const b = plumb(t, "reading", { dropText: true }).reexpress("log").analysis();
  assert.equal(a.origin.missingDropped, 47);
  assert.equal(a.origin.textDropped, 61, "the text cells stay text after the re-expression");
  assert.equal(a.n, 600 - 47 - 61);
  assert.equal(b.origin.textDropped, 61, "in memory too");
  _same(a, b, "ln(reading)");
  // Without dropText both refuse the column, naming its text cells.
  await assert.rejects(
    plumb(src, "reading").reexpress("log").analysis(),
    (e: PlumbError) => e.code === "non-numeric" && /61 of 553 cells are text/.test(e.message),
  );
  assert.throws(
    () => plumb(t, "reading").reexpress("log").analysis(),
    (e: PlumbError) => e.code === "non-numeric",
  );
  // By group: each line counts its own text cells.
  const g = await plumb(src, "reading", { dropText: true }).reexpress("log").by("line").result();
  const m = plumb(t, "reading", { dropText: true }).reexpress("log").by("line").result();
  assert.equal(g.textDropped, 61);
  assert.equal(g.textDropped, m.textDropped);
  assert.equal(g.missingDropped, m.missingDropped);
  g.groups.forEach((row, i) => assert.equal(row.n, m.groups[i].n, `group ${row.group}: n`));
});
