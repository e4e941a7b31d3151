import { equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { shapiroWilk } from "../../lib/stats/shapiro_wilk.ts";
import { shapiroWilkGeometry } from "../../lib/stats/shapiro_wilk_geometry.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/shapiro_wilk_geometry.json, written by
// tools/fixtures/shapiro_wilk_geometry.R: Royston's (1992) coefficients evaluated in R
// from the published formulas, the slope Σaᵢx₍ᵢ₎/√(n − 1), the sd, and W from R's
// stats::shapiro.test (R's version is in the file).
interface Case {
  name: string;
  origin: string;
  n: number;
  slope: number;
  sd: number;
  W: number;
  x: number[];
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/shapiro_wilk_geometry.json", import.meta.url)),
) as { library: { R: string }; cases: Case[] };
const src = `R ${fixture.library.R}`;

// Stated tolerance: 1e-12 relative (both sides are double-precision sums of at most
// 5000 products; a few ulps times n stays far below it).
const TOL = { rel: 1e-12 };

Deno.test(`the slope matches Royston's coefficients evaluated in ${src} to 1e-12`, () => {
  for (const c of fixture.cases) {
    const g = shapiroWilkGeometry(c.x);
    const ctx = `${c.name} (n = ${c.n}, ${c.origin}) vs ${src}`;
    equal(g.n, c.n);
    assertClose(g.slope, c.slope, TOL, `slope, ${ctx}`);
    assertClose(g.sd, c.sd, TOL, `sd, ${ctx}`);
  }
});

Deno.test(`(slope / sd)² is ${src} shapiro.test's W to 1e-12`, () => {
  for (const c of fixture.cases) {
    const g = shapiroWilkGeometry(c.x);
    assertClose(g.W, c.W, TOL, `W, ${c.name} (n = ${c.n}) vs ${src} shapiro.test`);
    assertClose(g.ratio * g.ratio, c.W, TOL, `ratio², ${c.name} vs ${src} shapiro.test`);
    assertClose(g.W, shapiroWilk(c.x).statistic, TOL, `W vs shapiroWilk, ${c.name}`);
  }
});

Deno.test("the intercept is the mean, and the line survives huge offsets and magnitudes", () => {
  const x = [4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1];
  const g = shapiroWilkGeometry(x);
  assertClose(g.intercept, x.reduce((s, v) => s + v, 0) / x.length, { rel: 1e-15 }, "mean");
  // x → a + b·x moves the line and leaves W alone (affine invariance of W)
  // (an exact map: whole numbers, a power-of-two scale and an offset that needs no rounding)
  const whole = [41, 39, 44, 40, 42, 37, 46, 43, 38, 41];
  const w = shapiroWilkGeometry(whole);
  const h = shapiroWilkGeometry(whole.map((v) => 2 ** 30 + v * 2 ** -4));
  assertClose(h.W, w.W, { rel: 1e-12 }, "W under 2³⁰ + 2⁻⁴·x");
  assertClose(h.slope, 2 ** -4 * w.slope, { rel: 1e-12 }, "slope scales with b");
  const big = shapiroWilkGeometry(x.map((v) => (v - 4) * 1e307));
  ok(Number.isFinite(big.slope) && Number.isFinite(big.sd), "finite at ±1e308");
  assertClose(big.W, g.W, { rel: 1e-12 }, "W at extreme magnitudes");
});

Deno.test("an outlier inflates the sd, not the slope through the bulk", () => {
  // 40 values drawn from N(10, 0.2²) and rounded to 0.01 (seededRandom(9)), then one at 12
  const bulk = [
    9.82,
    10,
    10.18,
    10.1,
    10.15,
    10.21,
    9.96,
    9.99,
    9.93,
    9.66,
    10.09,
    10.13,
    9.91,
    10,
    10.19,
    10.34,
    9.79,
    10.15,
    9.72,
    9.78,
    10.32,
    10.09,
    10.16,
    10.13,
    9.83,
    9.94,
    9.97,
    10.04,
    10.01,
    10.21,
    9.96,
    10.01,
    9.76,
    9.96,
    9.89,
    10.26,
    10.06,
    10.14,
    9.98,
    9.99,
  ];
  const clean = shapiroWilkGeometry(bulk);
  const dirty = shapiroWilkGeometry([...bulk, 12]);
  ok(Math.abs(clean.ratio - 1) < 0.02, `clean slope ≈ sd: ratio ${clean.ratio}`);
  ok(dirty.sd > 2 * clean.sd, `sd ${dirty.sd} vs ${clean.sd}`);
  ok(dirty.slope < 1.7 * clean.slope, `slope ${dirty.slope} vs ${clean.slope}`);
  ok(dirty.W < 0.6 && clean.W > 0.98, `W ${dirty.W}, ${clean.W}`);
});

Deno.test("bad input is refused with a code", () => {
  throws(() => shapiroWilkGeometry([1, 2]), (e) => e instanceof PlumbError && e.code === "too-few");
  throws(
    () => shapiroWilkGeometry([1, 1, 1]),
    (e) => e instanceof PlumbError && e.code === "constant",
  );
  throws(
    () => shapiroWilkGeometry([1, NaN, 2]),
    (e) => e instanceof PlumbError && e.code === "non-finite",
  );
});
