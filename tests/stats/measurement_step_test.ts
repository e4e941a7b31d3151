import { equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { measurementStep } from "../../lib/stats/measurement_step.ts";
import { judgeRounding, roundingLimit } from "../../lib/stats/rounding.ts";
import { assertClose } from "../_assert_close.ts";

const rng = seededRandom(20261204);
const normals = (n: number, mean: number, sd: number) =>
  Array.from({ length: n }, () => mean + sd * rng.normal());
const roundTo = (x: number[], h: number) => x.map((v) => Math.round(v / h) * h);

Deno.test("the step of decimal data is found, floating noise ignored", () => {
  // glucose to 0.01 mmol/L (Math.round(v/h)*h leaves values like 5.630000000000001)
  const g = measurementStep(roundTo(normals(600, 5.5, 0.48), 0.01));
  equal(g.step, 0.01);
  ok(g.distinct < 600, "ties are present");
  equal(measurementStep(roundTo(normals(300, 20, 3), 0.1)).step, 0.1);
  equal(measurementStep(roundTo(normals(300, 20, 3), 1)).step, 1);
  equal(measurementStep(roundTo(normals(300, 20, 3), 0.25)).step, 0.25);
  equal(measurementStep(roundTo(normals(300, 0, 1), 0.125)).step, 0.125);
  // sums of decimals: 0.1 + 0.2 is 0.30000000000000004, still on the 0.1 grid
  equal(measurementStep([0.1 + 0.2, 0.1, 0.7, 0.1 + 0.7, 1.1, 0.5, 0.9]).step, 0.1);
});

Deno.test("precise data near 1000 keep their step of 1e-4", () => {
  const x = roundTo(normals(200, 1000, 0.1), 1e-4);
  assertClose(measurementStep(x).step!, 1e-4, { rel: 1e-9 }, "step near 1000");
});

Deno.test("offset grids and gaps of several steps are found", () => {
  // values 0.05, 0.15, … (step 0.1, offset 0.05), none adjacent in places
  equal(measurementStep([0.05, 0.35, 0.65, 1.15, 0.25, 0.85, 2.05]).step, 0.1);
  // smallest gap 3 steps of 0.5, other gaps 2 and 5 steps
  equal(measurementStep([10, 11.5, 12.5, 15, 16, 18.5]).step, 0.5);
});

Deno.test("continuous data have no step", () => {
  for (const n of [5, 20, 1000]) equal(measurementStep(normals(n, 3, 2)).step, null, `n = ${n}`);
  // four values: a grid only when its step is a plausible recording step
  equal(measurementStep([1.2345, 2.71828, 3.14159, 0.5772]).step, null);
  equal(measurementStep([2, 4, 10]).step, 2);
  equal(measurementStep([0.2, 0.7, 1.2]).step, 0.5);
  equal(measurementStep([1, 4, 10.3]).step, null);
});

Deno.test("residuals of rounded data are not on one grid: callers pass the data's step", () => {
  const x = roundTo(normals(600, 5.5, 0.48), 0.01);
  const m1 = x.slice(0, 300).reduce((s, v) => s + v, 0) / 300;
  const m2 = x.slice(300).reduce((s, v) => s + v, 0) / 300;
  const resid = x.map((v, i) => v - (i < 300 ? m1 : m2));
  // two offsets: the smallest gap is the tiny offset difference, not a resolution
  equal(measurementStep(resid).step, null);
});

Deno.test("rounding judged by step against spread (limit from tools/sim/rounding_limit.ts)", () => {
  // glucose to 0.01 with sd 0.48 at n = 600 and its within-group residuals: no warning
  ok(!judgeRounding(0.01, 0.48, 600).coarse);
  // the same to 0.1 at n = 600 (h/s = 0.21 > 1.4/√600 = 0.057): warning
  ok(judgeRounding(0.1, 0.48, 600).coarse);
  // whole numbers with sd 0.68 at n = 120: warning; sd 10: none
  ok(judgeRounding(1, 0.68, 120).coarse);
  ok(!judgeRounding(1, 10, 120).coarse);
  // no step, no warning; the limit is capped at 0.35 for small n and uses n ≤ 5000
  ok(!judgeRounding(null, 1, 100).coarse);
  equal(roundingLimit(4), 0.35);
  equal(roundingLimit(1e7), roundingLimit(5000));
  assertClose(roundingLimit(100), 0.14, { rel: 1e-15 }, "1.4/√100");
});

Deno.test("bad input is refused with a code", () => {
  throws(() => measurementStep([1]), (e) => e instanceof PlumbError && e.code === "too-few");
  throws(() => measurementStep([3, 3]), (e) => e instanceof PlumbError && e.code === "constant");
  throws(
    () => measurementStep([1, NaN]),
    (e) => e instanceof PlumbError && e.code === "non-finite",
  );
});
