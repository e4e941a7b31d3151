import { equal, match, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { censoredShapiroFrancia } from "../../lib/stats/censored_normality.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { shapiroFrancia } from "../../lib/stats/shapiro_francia.ts";
import { assertClose } from "../_assert_close.ts";
import { assertFiniteFrozen, assertPlumbError } from "../_shared.ts";

/** A normal sample of n censored below `limits` (each value's limit drawn among them). */
function censoredNormal(rng: ReturnType<typeof seededRandom>, n: number, limits: number[]) {
  const x: number[] = [];
  const c: number[] = [];
  for (let i = 0; i < n; i++) {
    const v = rng.normal();
    const l = limits[rng.integer(limits.length)];
    x.push(v < l ? l : v);
    c.push(v < l ? -1 : 0);
  }
  return { x, c };
}

Deno.test("nothing censored: W′ is the Shapiro–Francia statistic (Blom scores)", () => {
  const rng = seededRandom(1);
  for (const n of [5, 12, 60, 400]) {
    const x = Array.from({ length: n }, () => 10 + 2 * rng.normal());
    const r = censoredShapiroFrancia(censoredSample(x, x.map(() => 0)));
    assertClose(r.statistic, shapiroFrancia(x).statistic, { rel: 1e-13 }, `W′ at n = ${n}`);
    equal(r.censoredFraction, 0);
  }
});

Deno.test("invariant under a + b·x, and under x → −x with the sides flipped", () => {
  const rng = seededRandom(2);
  for (let t = 0; t < 50; t++) {
    const { x, c } = censoredNormal(rng, 20 + rng.integer(80), [-0.8, -0.3, 0]);
    const r = censoredShapiroFrancia(censoredSample(x, c));
    const a = 50 * rng.normal();
    const b = 0.1 + 10 * rng.uniform();
    const s = censoredShapiroFrancia(censoredSample(x.map((v) => a + b * v), c));
    const m = censoredShapiroFrancia(censoredSample(x.map((v) => -v), c.map((k) => -k)));
    assertClose(s.statistic, r.statistic, { rel: 1e-12 }, `affine ${t}`);
    assertClose(s.pValue, r.pValue, { rel: 1e-9, abs: 1e-15 }, `affine p ${t}`);
    assertClose(m.statistic, r.statistic, { rel: 1e-12 }, `mirror ${t}`);
    assertFiniteFrozen(r);
    ok(r.statistic > 0 && r.statistic <= 1 && r.pValue >= 0 && r.pValue <= 1);
  }
});

// A fast in-suite check of the calibration (the full size table comes from
// tools/sim/censored_size.ts): 1,000 seeded normal samples, n = 50,
// 30% censored at one limit. The rate of p < 0.05 must lie within 3.5%–6.5%;
// at 1,000 samples its simulation error is ±1.4 points (95%), so a rate
// outside that band points at a calibration fault.
Deno.test("seeded size check: n = 50, 30% censored, one limit, 1,000 samples", () => {
  const rng = seededRandom(20261205);
  let hits = 0;
  for (let t = 0; t < 1000; t++) {
    const { x, c } = censoredNormal(rng, 50, [-0.5244005127080407]); // Φ⁻¹(0.3)
    if (censoredShapiroFrancia(censoredSample(x, c)).pValue < 0.05) hits++;
  }
  ok(hits >= 35 && hits <= 65, `${hits / 10}% of p < 0.05`);
});

Deno.test("power: lognormal samples, n = 100, 20% censored, mostly rejected", () => {
  const rng = seededRandom(3);
  let hits = 0;
  for (let t = 0; t < 100; t++) {
    const x: number[] = [];
    const c: number[] = [];
    for (let i = 0; i < 100; i++) {
      const v = Math.exp(0.6 * rng.normal());
      x.push(v < 0.6 ? 0.6 : v);
      c.push(v < 0.6 ? -1 : 0);
    }
    if (censoredShapiroFrancia(censoredSample(x, c)).pValue < 0.05) hits++;
  }
  ok(hits >= 80, `${hits}% rejected`);
});

Deno.test("method, validity, cautions above half censored, several limits named", () => {
  const rng = seededRandom(4);
  const { x, c } = censoredNormal(rng, 40, [0.1, 0.3]);
  const r = censoredShapiroFrancia(censoredSample(x, c));
  match(r.method, /Hirsch–Stedinger positions \(\d+ censored at <0.1, <0.3\)/);
  match(r.method, /several limits/);
  match(r.validity, /calibrated for 5–5000 values with up to 80% censored/);
  ok(r.warnings.some((w) => /censored: the test sees only the upper part/.test(w)));
});

Deno.test("refusals: n < 5, n > 5000, more than 80% censored, overlapping limits", () => {
  assertPlumbError(
    () => censoredShapiroFrancia(censoredSample([1, 2, 3, 0.5], [0, 0, 0, -1])),
    "too-few",
    /on 4 values: at least 5/,
  );
  const big = Array.from({ length: 5001 }, (_, i) => i);
  assertPlumbError(
    () => censoredShapiroFrancia(censoredSample(big, big.map(() => 0))),
    "too-many",
    /at most 5000/,
  );
  const x = [...Array(17).fill(0.1), 0.5, 0.7, 0.9];
  const c = [...Array(17).fill(-1), 0, 0, 0];
  assertPlumbError(
    () => censoredShapiroFrancia(censoredSample(x, c)),
    "too-few",
    /17 of 20 values \(85%\) are censored/,
  );
  assertPlumbError(
    () =>
      censoredShapiroFrancia(censoredSample([3, 1, 2, 2.5, 4, 0.5, 1.5], [-1, 1, 0, 0, 0, 0, 0])),
    "overlapping-limits",
    /order of those values is unknown/,
  );
});
