import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { writeReport } from "../../lib/plumb/report.ts";
import { survey } from "../../lib/plumb/survey.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredShapiroFrancia } from "../../lib/stats/censored_normality.ts";
import { censoredRos } from "../../lib/stats/censored_ros.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import type { CensoredQqData } from "../../lib/stats/censored_qq.ts";
import { assertClose } from "../_assert_close.ts";

const isPlumbError = (code: string, message?: RegExp) => (e: unknown) => {
  assert.ok(e instanceof PlumbError, String(e));
  assert.equal(e.code, code, e.message);
  if (message) assert.match(e.message, message);
  return true;
};

/** Load CSV text as a file would be loaded. */
async function loadCsv(text: string) {
  const path = await Deno.makeTempFile({ suffix: ".csv" });
  try {
    await Deno.writeTextFile(path, text);
    return await loadTable(path);
  } finally {
    await Deno.remove(path);
  }
}

/** A seeded normal sample with the values below `limit` reported as "<limit". */
function censoredCells(n: number, seed: number, mean: number, sd: number, limit: number) {
  const rng = seededRandom(seed);
  const x = Float64Array.from({ length: n }, () => mean + sd * rng.normal());
  const cells = Array.from(x, (v) => (v < limit ? `<${limit}` : v.toFixed(4)));
  const values = Float64Array.from(x, (v) => (v < limit ? limit : +v.toFixed(4)));
  const censor = Int8Array.from(x, (v) => (v < limit ? -1 : 0));
  return { cells, values, censor };
}

Deno.test("a censored column is screened: counts by side, ML mean and sd, the censored test's p", async () => {
  const { cells, values, censor } = censoredCells(80, 11, 0.2, 0.08, 0.15);
  const csv = "chlorine_mg_l\n" + cells.join("\n") + "\n";
  const t = await loadCsv(csv);
  const a = plumb(t, "chlorine_mg_l").analysis();
  const sample = censoredSample(values, censor);
  const fit = censoredNormalFit(sample);
  const left = censor.filter((s) => s === -1).length;
  assert.ok(left > 10 && left < 40, `${left} censored`);
  assert.equal(a.n, 80, "n counts censored values");
  assert.ok(a.censoring);
  assert.equal(a.censoring.left, left);
  assert.equal(a.censoring.right, 0);
  assert.equal(a.censoring.observed, 80 - left);
  assertClose(a.censoring.mean, fit.mean, { rel: 1e-10 }, "ML estimate");
  assertClose(a.censoring.sd, fit.sd, { rel: 1e-10 }, "ML estimate");
  assert.deepEqual(a.censoring.limits, [{ limit: 0.15, side: "below", count: left }]);
  assert.equal(a.primary.pValue, censoredShapiroFrancia(sample).pValue);
  assert.equal(a.primary.statisticName, "W′");
  const ros = censoredRos(sample);
  assert.equal(a.censoring.ros.mean, ros.mean);
  // The tests for measured values are listed, not run, with the reason.
  const skipped = a.tests.filter((o) => o.skipped);
  assert.equal(skipped.length, a.tests.length - 1);
  assert.match(skipped[0].skipped!, new RegExp(`${left} of the 80 values are censored`));
  assert.equal(a.histogram.n, 80 - left, "the histogram shows the measured values");
  assert.match(a.reading.points[0], new RegExp(`^${left} of the 80 values censored`));
  assert.ok(Object.isFrozen(a.censoring) && Object.isFrozen(a.censoring.limits));
  assert.ok(!a.reading.points.some((t) => /W = \(slope\/sd\)|Shapiro–Wilk/.test(t)), "no W point");
  assert.match(a.reading.headline, /\(W′ = /);
  assert.doesNotThrow(() => JSON.stringify(a));
});

Deno.test("decimal-comma files: '<0,05' cells are censored at 0.05", async () => {
  const csv = "sample;oxygen\n1;0,41\n2;<0,05\n3;0,22\n4;0,35\n5;< 0,05\n6;0,18\n7;0,29\n8;0,51\n";
  const t = await loadCsv(csv);
  const a = plumb(t, "oxygen").analysis();
  assert.equal(a.n, 8);
  assert.equal(a.censoring?.left, 2);
  assert.deepEqual(a.censoring?.limits, [{ limit: 0.05, side: "below", count: 2 }]);
});

Deno.test("right-censored values ('>1000') and both sides together", async () => {
  const t = await loadTable({
    count: [120, 340, ">1000", 560, 410, 780, ">1000", 230, 650, 900, "<100", 300],
  });
  const a = plumb(t, "count").analysis();
  assert.equal(a.n, 12);
  assert.equal(a.censoring?.left, 1);
  assert.equal(a.censoring?.right, 2);
  assert.deepEqual(a.censoring?.limits.map((l) => [l.side, l.limit, l.count]), [
    ["below", 100, 1],
    ["above", 1000, 2],
  ]);
  const fit = censoredNormalFit(
    censoredSample(plumb(t, "count").values(), plumb(t, "count").censor()!),
  );
  assertClose(a.censoring!.mean, fit.mean, { rel: 1e-10 }, "ML estimate");
});

Deno.test(".reexpress('log') keeps the censoring: limits transformed with the values", async () => {
  const t = await loadTable({
    crp: {
      values: [1.2, 0.5, 3.4, 2.2, 1.9, 2.8, 0.5, 1.1, 6.3, 0.9],
      censor: [0, -1, 0, 0, 0, 0, -1, 0, 0, 0],
    },
  });
  const p = plumb(t, "crp");
  const q = p.reexpress("log");
  const a = q.analysis();
  assert.equal(q.label, "ln(crp)");
  assert.equal(a.n, 10);
  assert.equal(a.censoring?.left, 2);
  assert.deepEqual(a.censoring?.limits, [{ limit: Math.log(0.5), side: "below", count: 2 }]);
  assert.deepEqual(Array.from(q.censor()!), Array.from(p.censor()!));
  const fit = censoredNormalFit(censoredSample(p.values().map(Math.log), p.censor()!));
  assertClose(a.censoring!.mean, fit.mean, { rel: 1e-10 }, "ML estimate");
  assertClose(a.censoring!.sd, fit.sd, { rel: 1e-10 }, "ML estimate");
  // 1/x reverses the order: "<0.5" becomes ">2".
  const r = p.reexpress("reciprocal").analysis();
  assert.deepEqual(r.censoring?.limits, [{ limit: 2, side: "above", count: 2 }]);
  assert.equal(r.censoring?.right, 2);
});

Deno.test("the QQ data of a censored chain: censored points at their limits, the line from the ML fit", async () => {
  const { values, censor } = censoredCells(60, 5, 10, 2, 8.5);
  const t = await loadTable({ fill: { values: Array.from(values), censor: Array.from(censor) } });
  const a = plumb(t, "fill").analysis();
  const qq = a.qq as CensoredQqData;
  const k = censor.filter((s) => s !== 0).length;
  assert.equal(qq.censoredShown, k);
  assert.equal(qq.mean, a.censoring!.mean);
  assert.equal(qq.sd, a.censoring!.sd);
  for (let i = 0; i < qq.shown; i++) {
    if (qq.censor[i] !== 0) {
      assert.equal(qq.value[i], 8.5);
      assert.equal(qq.outside[i], 0, "censored points are never outside the band");
    }
    if (i > 0) assert.ok(qq.z[i] > qq.z[i - 1], "points in position order");
  }
  // The censored values sit at the lowest positions, below every measured value.
  assert.deepEqual(qq.censor.slice(0, k), Array(k).fill(-1));
  const custom = plumb(t, "fill").qq({ level: 0.9 });
  assert.ok(custom);
});

Deno.test("the sentence says how many values were censored and which method was used", async () => {
  const { values, censor } = censoredCells(50, 3, 0.3, 0.1, 0.25);
  const t = await loadTable({
    do_mg_l: { values: Array.from(values), censor: Array.from(censor) },
  });
  const text = plumb(t, "do_mg_l").sentence().text;
  const k = censor.filter((s) => s !== 0).length;
  assert.match(
    text,
    new RegExp(`${k} of the 50 values censored, reported below a limit \\(<0\\.25 ×${k}\\)`),
  );
  assert.match(text, /by maximum likelihood under censoring/);
  assert.match(text, /Shapiro–Francia \(censored\) W′ = /);
  assert.doesNotMatch(text, /Shapiro–Wilk/);
});

Deno.test(".by() screens each group with its own censoring; survey screens censored columns", async () => {
  const a = censoredCells(40, 21, 0.3, 0.1, 0.22);
  const b = censoredCells(40, 22, 0.5, 0.1, 0.22);
  const t = await loadTable({
    chlorine: [...a.cells, ...b.cells, "<0.22", "<0.22", "<0.22", "<0.22", "0.3"],
    line: [...Array(40).fill("A"), ...Array(40).fill("B"), ...Array(5).fill("C")],
    fill: Array.from({ length: 85 }, (_, i) => 500 + ((i * 37) % 11) / 10),
  });
  const g = plumb(t, "chlorine").by("line").result();
  const [ga, gb, gc] = g.groups;
  assert.equal(ga.analysis?.censoring?.left, a.censor.filter((s) => s !== 0).length);
  assert.equal(gb.analysis?.censoring?.left ?? 0, b.censor.filter((s) => s !== 0).length);
  assert.equal(gc.analysis, undefined);
  assert.match(gc.skipped!, /1 measured value/);
  assert.ok(g.residuals?.censoring, "the pooled residuals keep the sides");
  const notes = plumb(t, "chlorine").by("line").table().notes ?? [];
  assert.ok(
    notes.includes(
      "Rows with censored values (A): n counts them; mean and sd by maximum likelihood under " +
        "censoring; W′ and p from the Shapiro–Francia test for censored samples.",
    ),
    notes.join("\n"),
  );
  assert.throws(
    () => plumb(t, "chlorine").by("line").stakes().toJSON(),
    isPlumbError("censored", /Cannot compute the stakes for chlorine by line/),
  );
  const s = survey(t).result();
  const row = s.rows.find((r) => r.column === "chlorine")!;
  assert.equal(
    row.analysis?.censoring?.left,
    4 + a.censor.filter((x) => x !== 0).length +
      b.censor.filter((x) => x !== 0).length,
  );
  assert.equal(row.analysis?.n, 85);
  assert.ok(s.rows.find((r) => r.column === "fill")!.analysis);
});

Deno.test("censored samples the methods cannot handle are refused clearly", async () => {
  const few = await loadTable({ x: ["<1", "<1", "<1", 2, 3, "<1"] });
  assert.throws(() => plumb(few, "x").analysis(), isPlumbError("too-few", /2 measured values/));
  const most = await loadTable({ x: [...Array(18).fill("<1"), 1.5, 2, 2.5, 3] });
  assert.throws(
    () => plumb(most, "x").analysis(),
    isPlumbError("too-few", /82% are censored|\(82%\)/),
  );
  const ok = await loadTable({ x: [1.2, "<0.5", 3.4, 2.2, 1.9, 2.8, "<0.5", 1.1, 4.4, 2.5] });
  assert.throws(() => plumb(ok, "x").candidates().toJSON(), isPlumbError("censored", /name one/));
  assert.throws(() => plumb(ok, "x").reexpress().label, isPlumbError("censored"));
  assert.throws(() => plumb(ok, "x").stakes().toJSON(), isPlumbError("censored", /stakes/));
});

Deno.test("above 5000 values the censored test runs on a seeded subsample that keeps the sides", async () => {
  const { values, censor } = censoredCells(8000, 9, 5, 1, 4.2);
  const t = await loadTable({ v: { values: Array.from(values), censor: Array.from(censor) } });
  const a = plumb(t, "v").analysis();
  assert.equal(a.n, 8000);
  assert.equal(a.primary.n, 5000);
  assert.deepEqual(a.subsample, { size: 5000, seed: 1 });
  assert.match(a.primary.warnings[0], /seeded random subsample of 5000/);
  const fit = censoredNormalFit(censoredSample(values, censor));
  assertClose(a.censoring!.mean, fit.mean, { rel: 1e-10 }, "estimates use every value");
  assert.ok(a.primary.pValue > 0.001, `p = ${a.primary.pValue} for a normal sample`);
});

// Reference values: tests/fixtures/censored_fit.json, written by
// tools/fixtures/censored_fit.R with R's survival::survreg (gaussian, rel.tolerance
// 1e-13; versions recorded in the file). Requirement: 1e-6 relative.
Deno.test("the chain's ML mean and sd match R survival::survreg to 1e-6 relative", async () => {
  const fixture = JSON.parse(
    await Deno.readTextFile(new URL("../fixtures/censored_fit.json", import.meta.url)),
  ) as {
    library: { R: string; survival: string };
    cases: { name: string; x: number[]; censor: number[]; mean: number; sd: number }[];
  };
  const src = `R ${fixture.library.R} survival ${fixture.library.survival} survreg`;
  let checked = 0;
  for (const c of fixture.cases) {
    if (c.x.length < 5 || c.censor.every((s) => s === 0)) continue;
    const t = await loadTable({ x: { values: c.x, censor: c.censor } });
    let a;
    try {
      a = plumb(t, "x").analysis();
    } catch (e) {
      // Samples outside the censored test's range (over 80% censored) are refused as a whole.
      if (e instanceof PlumbError && e.code === "too-few") continue;
      throw e;
    }
    assertClose(a.censoring!.mean, c.mean, { rel: 1e-6 }, `mean, ${c.name} vs ${src}`);
    assertClose(a.censoring!.sd, c.sd, { rel: 1e-6 }, `sd, ${c.name} vs ${src}`);
    checked++;
  }
  assert.ok(checked >= 5, `${checked} fixture cases checked through the chain`);
});

Deno.test("the report screens a censored column and says why the ranked panel is not shown", async () => {
  const rng = seededRandom(41);
  const x = Array.from({ length: 80 }, () => Math.exp(1 + 0.8 * rng.normal()));
  const t = await loadTable({ oxygen_ppb: x.map((v) => (v < 1.5 ? "<1.5" : v.toFixed(2))) });
  const r = await writeReport(t);
  assert.match(
    r.html,
    /values are censored, so the ranked panel \(tests for measured values\) is not shown/,
  );
  assert.ok(r.sentences.some((s) => /values censored, reported below a limit/.test(s)));
});
