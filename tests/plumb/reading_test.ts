import { deepEqual, equal, match, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { SHAPES } from "./_shapes.ts";

const read = (x: ArrayLike<number>, label = "x", options = {}) =>
  analyse(
    Float64Array.from(x),
    { label, column: label, missingDropped: 0, textDropped: 0 },
    options,
  );
const rng = seededRandom(20261206);
const normals = (n: number, mean: number, sd: number, step = 0) =>
  Array.from({ length: n }, () => {
    const v = mean + sd * rng.normal();
    return step > 0 ? Math.round(v / step) * step : v;
  });

Deno.test("reading: right-skewed sample says right skew and a clear departure", () => {
  const a = read(SHAPES.rightSkewed);
  equal(a.reading.facts.skew, "right");
  equal(a.reading.facts.cause, "skew");
  ok(a.reading.facts.reexpressionHelps);
  equal(a.reading.verdict, "clear-departure");
  match(a.reading.headline, /^Strong right skew \(W = 0\.\d{4}, n = 100\)$/);
  ok(a.reading.points[0].startsWith("Strong right skew: G1 = "));
});

Deno.test("reading: left-skewed sample says left skew", () => {
  const a = read(SHAPES.leftSkewed);
  equal(a.reading.facts.skew, "left");
  equal(a.reading.verdict, "clear-departure");
  ok(a.reading.points.some((p) => p.includes("a longer tail towards low values")));
});

Deno.test("reading: heavy-tailed (Laplace) sample says heavy tails, no skew, no re-expression", () => {
  const a = read(SHAPES.heavyTailed);
  equal(a.reading.facts.tails, "heavy");
  equal(a.reading.facts.skew, "none");
  equal(a.reading.facts.cause, "tails");
  equal(a.reading.facts.reexpressionHelps, false);
  ok(a.reading.points.some((p) => p.startsWith("Tails clearly heavier than normal")));
  // a sum of symmetric terms is 0, not 4.35e-15
  ok(
    a.reading.points.some((p) =>
      p.startsWith("No skew beyond what chance gives at n = 200: G1 = 0 ")
    ),
  );
});

Deno.test("reading: light-tailed (uniform) sample says light tails", () => {
  const a = read(SHAPES.lightTailed);
  equal(a.reading.facts.tails, "light");
  ok(a.reading.points.some((p) => p.startsWith("Tails clearly lighter than normal")));
});

Deno.test("reading: two separated groups give the two-peaks hint as the cause", () => {
  const a = read(SHAPES.bimodal);
  ok(a.reading.facts.bimodality > 5 / 9);
  equal(a.reading.facts.cause, "two-peaks");
  ok(a.reading.points.some((p) => p.startsWith("A hint of two peaks")));
});

Deno.test("reading: normal n = 15 is no clear departure, with the low-power note", () => {
  const a = read(SHAPES.normal15);
  equal(a.reading.verdict, "no-clear-departure");
  match(a.reading.sizeNote, /^With only 15 values the tests have little power/);
});

Deno.test("reading: 1, 2, …, 6 is no clear departure (p = 0.96, everything inside the band)", () => {
  // issue: the old rule said "mild departure" here
  const a = read([1, 2, 3, 4, 5, 6]);
  equal(a.reading.verdict, "no-clear-departure");
  ok(a.primary.pValue > 0.9);
});

Deno.test("reading: normal n = 50,000 is judged by effect sizes; the subsample is stated with both counts", () => {
  const a = read(SHAPES.normal50000);
  equal(a.reading.verdict, "no-clear-departure");
  ok(a.reading.facts.grounds.effectsDecide);
  match(a.reading.sizeNote, /effect sizes decide/);
  match(a.reading.sizeNote, /seeded random subsample of 5,000 of the 50,000 values \(seed 1/);
  ok(a.reading.points.some((p) => p.includes("both on the 5,000 values of the subsample")));
  equal(a.n, 50000);
  equal(a.primary.n, 5000, "W and p come from the subsample, and say so in their n");
  deepEqual(a.subsample, { size: 5000, seed: 1 });
  ok(
    a.primary.warnings[0].startsWith(
      "Shapiro–Wilk's p-value is calibrated for at most 5000 values",
    ),
  );
  // Shapiro–Francia (calibrated to 5000) says why it did not run; the others use all values.
  match(a.tests[1].skipped ?? "", /at most 5000/);
  for (const t of a.tests.slice(2)) equal(t.result?.n, 50000, t.test);
});

Deno.test("reading: rounding judged by the step against the spread", () => {
  // glucose to 0.01 mmol/L, sd 0.48, n = 600: many repeats, but the step is fine
  const fine = read(normals(600, 5.5, 0.48, 0.01));
  equal(fine.reading.facts.step, 0.01);
  equal(fine.reading.facts.tied, false);
  ok(fine.reading.facts.distinct < 0.7 * 600);
  ok(
    fine.reading.points.some((p) =>
      /^Recorded in steps of 0\.01: .* the repeats do not distort the tests$/.test(p)
    ),
  );
  ok(!fine.reading.points.some((p) => /can make the tests reject|rounding alone/.test(p)));
  // to 0.5 with sd 1 at n = 100: coarse; Shapiro–Wilk's p is set aside
  const coarse = read(SHAPES.rounded);
  equal(coarse.reading.facts.step, 0.5);
  ok(coarse.reading.facts.tied);
  ok(coarse.reading.points[0].startsWith("Recorded in steps of 0.5, coarse against the spread"));
  equal(coarse.reading.verdict, "no-clear-departure");
});

Deno.test("reading: residuals inherit their data's step (the within-group residuals case)", () => {
  const x = normals(600, 5.5, 0.48, 0.01);
  const m1 = x.slice(0, 300).reduce((s, v) => s + v, 0) / 300;
  const m2 = x.slice(300).reduce((s, v) => s + v, 0) / 300;
  const resid = x.map((v, i) => v - (i < 300 ? m1 : m2));
  const a = read(resid, "residuals", { step: 0.01 });
  equal(a.reading.facts.step, 0.01);
  ok(!a.reading.points.some((p) => p.includes("0.000")), "no 'resolution 0.000211'");
});

Deno.test("reading: a 3% cluster above the rest is named as such, not as skew, and no re-expression is offered", () => {
  // 489 potassium-like values and 17 haemolysed-like ones (invented)
  const x = [...normals(489, 4.2, 0.35, 0.01), ...normals(17, 6.4, 0.3, 0.01)];
  const a = read(x, "potassium");
  equal(a.reading.facts.cause, "cluster");
  equal(a.reading.facts.cluster?.count, 17);
  equal(a.reading.facts.reexpressionHelps, false);
  equal(a.reading.verdict, "clear-departure");
  match(a.reading.headline, /^A separate cluster of 17 values \(3\.4%\) above the rest/);
  ok(a.reading.points[0].startsWith("A separate cluster: 17 values (3.4%) lie above the rest"));
  ok(a.reading.points.some((p) => p.includes("come from the cluster described above")));
  ok(!a.reading.points.some((p) => /^Strong right skew/.test(p)));
});

Deno.test("reading: one wild value in a normal sample is an outlier, with its row", () => {
  const x = [...normals(40, 10, 0.2), 12.5];
  const a = read(x);
  equal(a.reading.facts.cause, "outliers");
  deepEqual(a.reading.facts.outliers.values.map((v) => [v.value, v.row, v.side]), [[
    12.5,
    41,
    "high",
  ]]);
  ok(
    a.reading.points[0].startsWith(
      "1 outlier by the generalized ESD procedure at the 1% level (Rosner 1983): 12.5 (row 41)",
    ),
  );
});

Deno.test("reading: a pile-up at the minimum is called a floor and is the cause", () => {
  const x = Float64Array.from(
    { length: 60 },
    (_, i) => (i < 6 ? 0 : Math.exp(0.5 * Math.sin(i) + i / 30)),
  );
  const a = read(x);
  equal(a.reading.facts.pileUp?.count, 6);
  ok(
    a.reading.points.some((p) =>
      p.startsWith("6 of 60 values sit exactly at the minimum, 0: a floor")
    ),
  );
});

Deno.test("reading: both σ estimates are stated, and W is their squared ratio", () => {
  const a = read(SHAPES.rightSkewed);
  const s = a.reading.facts.sigma;
  ok(Math.abs(s.ratio * s.ratio - a.primary.statistic) < 1e-12);
  ok(
    a.reading.points.some((p) =>
      p.startsWith("Two estimates of σ: 1.075 from the QQ plot's order-statistic slope")
    ),
  );
});

Deno.test("reading: residual-like noise below 1e-9 of the range is not read as resolution", () => {
  const x = Float64Array.from(SHAPES.normal15, (v, i) => v + (i % 2) * 1e-13);
  const a = read(x);
  ok(a.reading.facts.resolution > 1e-6, String(a.reading.facts.resolution));
});
