import { deepEqual, equal, match, ok } from "node:assert/strict";
import { analyse } from "../../lib/plumb/analysis.ts";
import { SHAPES } from "./_shapes.ts";

const read = (x: Float64Array, label = "x") =>
  analyse(x, { label, column: label, missingDropped: 0, textDropped: 0 });

Deno.test("reading: right-skewed sample says right skew and a clear departure", () => {
  const a = read(SHAPES.rightSkewed);
  equal(a.reading.facts.skew, "right");
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

Deno.test("reading: heavy-tailed (Laplace) sample says heavy tails, no skew", () => {
  const a = read(SHAPES.heavyTailed);
  equal(a.reading.facts.tails, "heavy");
  equal(a.reading.facts.skew, "none");
  ok(a.reading.points.some((p) => p.startsWith("Tails clearly heavier than normal")));
});

Deno.test("reading: light-tailed (uniform) sample says light tails", () => {
  const a = read(SHAPES.lightTailed);
  equal(a.reading.facts.tails, "light");
  ok(a.reading.points.some((p) => p.startsWith("Tails clearly lighter than normal")));
});

Deno.test("reading: rounded sample reports distinct values and the resolution", () => {
  const a = read(SHAPES.rounded);
  ok(a.reading.facts.tied);
  equal(a.reading.facts.resolution, 0.5);
  ok(
    a.reading.points.some((p) =>
      /^Only \d+ distinct values among 100, apparent resolution 0\.500/.test(p)
    ),
  );
});

Deno.test("reading: two separated clusters give the two-peaks hint", () => {
  const a = read(SHAPES.bimodal);
  ok(a.reading.facts.bimodality > 5 / 9);
  ok(a.reading.points.some((p) => p.startsWith("A hint of two peaks")));
});

Deno.test("reading: normal n = 15 is no clear departure, with the low-power note", () => {
  const a = read(SHAPES.normal15);
  equal(a.reading.verdict, "no-clear-departure");
  match(a.reading.sizeNote, /^With only 15 values the tests have little power/);
});

Deno.test("reading: normal n = 50,000 is no clear departure, judged by effect sizes, subsample explained", () => {
  const a = read(SHAPES.normal50000);
  equal(a.reading.verdict, "no-clear-departure");
  match(a.reading.sizeNote, /even trivial departures give small p-values/);
  match(a.reading.sizeNote, /seeded random subsample of 5000/);
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

Deno.test("reading: a pile-up at the minimum is called a floor", () => {
  const x = Float64Array.from(
    { length: 60 },
    (_, i) => (i < 6 ? 0 : Math.exp(0.5 * Math.sin(i) + i / 30)),
  );
  const a = read(x);
  ok(a.reading.points.some((p) => p.startsWith("6 values sit exactly at the minimum, 0: a floor")));
});

Deno.test("reading: residual-like noise below 1e-9 of the range is not read as resolution", () => {
  const x = Float64Array.from(SHAPES.normal15, (v, i) => v + (i % 2) * 1e-13);
  const a = read(x);
  ok(a.reading.facts.resolution > 1e-6, String(a.reading.facts.resolution));
});
