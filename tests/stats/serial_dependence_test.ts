// Serial dependence: r₁ and Ljung–Box against R 4.2.2 (tests/fixtures/serial.json,
// written by tools/fixtures/serial.R); the exact moments of r₁ against their
// closed form and against simulation; the runs distribution against exact
// enumeration; and the combined decision's false-alarm rate and power by
// seeded simulation (2,000 samples per line).
import assert from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { fitLinearModel, residualBasis } from "../../lib/stats/linear_model.ts";
import { lagOneTest } from "../../lib/stats/lag_one.ts";
import { runsProbability, runsTails, runsTest } from "../../lib/stats/runs_test.ts";
import { serialDependence } from "../../lib/stats/serial_dependence.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/serial.json", import.meta.url)),
) as {
  library: { R: string };
  cases: {
    name: string;
    source: string;
    x: number[];
    r1: number;
    ljungBox: number;
    ljungBoxP: number;
  }[];
};

Deno.test(`lag-1 autocorrelation and Ljung–Box match R ${fixture.library.R} acf and Box.test`, () => {
  for (const c of fixture.cases) {
    const r = lagOneTest(c.x);
    const ctx = `${c.name} (${c.source}) vs R ${fixture.library.R}`;
    assertClose(r.r1, c.r1, { rel: 1e-12 }, `r1, ${ctx}`);
    assertClose(r.ljungBox!.statistic, c.ljungBox, { rel: 1e-12 }, `Ljung–Box Q, ${ctx}`);
    // R computes the p-value as 1 − pchisq(Q, 1), which keeps no digits below
    // about 1e-16; plumbline takes the χ²₁ tail as 2·Q(√Q) directly.
    if (c.ljungBoxP > 1e-10) {
      assertClose(r.ljungBox!.pValue, c.ljungBoxP, { rel: 1e-9 }, `Ljung–Box p, ${ctx}`);
    } else {
      assert.ok(r.ljungBox!.pValue <= c.ljungBoxP + 2e-16, `Ljung–Box p, ${ctx}`);
    }
  }
});

Deno.test("r₁ moments for plain values: E = −1/n, Var = (n − 2)²/(n²(n − 1)); the basis form agrees", () => {
  // closed form of the variance: Moran 1948, Biometrika 35:255–260 (from memory)
  for (const n of [4, 5, 10, 37, 1000]) {
    const x = Array.from({ length: n }, (_, t) => Math.sin(t * 1.7) + t / n);
    const r = lagOneTest(x);
    assertClose(r.expected, -1 / n, { rel: 1e-15 }, `E r1, n = ${n}`);
    assertClose(r.sd ** 2, (n - 2) ** 2 / (n * n * (n - 1)), { rel: 1e-12 }, `Var r1, n = ${n}`);
    const basis = { values: new Float64Array(n).fill(1 / Math.sqrt(n)), rank: 1 };
    const mean = x.reduce((a, b) => a + b, 0) / n;
    const viaBasis = lagOneTest(x.map((v) => v - mean), { basis });
    assertClose(viaBasis.expected, r.expected, { rel: 1e-13 }, `basis E, n = ${n}`);
    assertClose(viaBasis.sd, r.sd, { rel: 1e-12 }, `basis sd, n = ${n}`);
    assertClose(viaBasis.r1, r.r1, { rel: 1e-12, abs: 1e-15 }, `basis r1, n = ${n}`);
  }
});

Deno.test("r₁ moments for residuals of a trend and a factor match 20,000 simulated fits", () => {
  const n = 24, sims = 20000, rng = seededRandom(1950);
  const t = Array.from({ length: n }, (_, i) => i);
  const line = t.map((i) => "ABC"[i % 3]);
  const y0 = t.map(() => rng.normal());
  const fit = fitLinearModel(y0, { covariates: { t }, factors: { line } });
  const u = residualBasis(fit);
  const first = lagOneTest(fit.residuals, { basis: { values: u, rank: fit.rank } });
  let s = 0, s2 = 0;
  for (let k = 0; k < sims; k++) {
    const z = t.map(() => rng.normal());
    const e = z.slice();
    for (let j = 0; j < fit.rank; j++) {
      let d = 0;
      for (let i = 0; i < n; i++) d += u[j * n + i] * z[i];
      for (let i = 0; i < n; i++) e[i] -= d * u[j * n + i];
    }
    const r = lagOneTest(e, { basis: { values: u, rank: fit.rank } }).r1;
    s += r;
    s2 += r * r;
  }
  const mean = s / sims, variance = s2 / sims - mean * mean;
  // 4 standard errors of the simulated mean and variance (var of s² ≈ 2σ⁴/N)
  assertClose(mean, first.expected, { abs: 4 * first.sd / Math.sqrt(sims) }, "E r1 of residuals");
  assertClose(
    variance,
    first.sd ** 2,
    { abs: 4 * Math.SQRT2 * first.sd ** 2 / Math.sqrt(sims) },
    "Var r1",
  );
});

Deno.test("runs: the distribution equals exact enumeration of every arrangement", () => {
  for (const [n1, n2] of [[1, 1], [3, 4], [5, 5], [6, 2], [7, 7], [2, 9]]) {
    const count = new Map<number, number>();
    let total = 0;
    const total_n = n1 + n2;
    for (let mask = 0; mask < 1 << total_n; mask++) {
      let ones = 0;
      for (let b = 0; b < total_n; b++) ones += (mask >> b) & 1;
      if (ones !== n1) continue;
      let runs = 1;
      for (let b = 1; b < total_n; b++) if (((mask >> b) & 1) !== ((mask >> (b - 1)) & 1)) runs++;
      count.set(runs, (count.get(runs) ?? 0) + 1);
      total++;
    }
    for (let r = 1; r <= total_n + 1; r++) {
      const exact = (count.get(r) ?? 0) / total;
      assertClose(
        runsProbability(r, n1, n2),
        exact,
        { abs: 1e-14 },
        `P(R = ${r}), n1 = ${n1}, n2 = ${n2}`,
      );
    }
    const [lo, up] = runsTails(3, n1, n2);
    const below = [...count].filter(([r]) => r <= 3).reduce((a, [, c]) => a + c, 0) / total;
    assertClose(lo, below, { abs: 1e-14 }, `P(R ≤ 3), ${n1}, ${n2}`);
    assertClose(
      up,
      1 - below + (count.get(3) ?? 0) / total,
      { abs: 1e-14 },
      `P(R ≥ 3), ${n1}, ${n2}`,
    );
  }
});

Deno.test("runs by hand: 2 7 3 9 8 1 4 6 5 12 — median 5.5, signs −+−++−−+−+, 8 runs", () => {
  const r = runsTest([2, 7, 3, 9, 8, 1, 4, 6, 5, 12]);
  assert.deepEqual([r.median, r.above, r.below, r.runs], [5.5, 5, 5, 8]);
  assertClose(r.expected, 6, { rel: 1e-15 }, "1 + 2·5·5/10");
  // n1 = n2 = 5, C(10, 5) = 252: P(R = 8) = 2·C(4,3)²/252 = 32/252, P(R = 9) =
  // 2·C(4,4)·C(4,3)/252 = 8/252, P(R = 10) = 2/252; P(R ≥ 8) = 42/252 = 1/6, p = 1/3
  assertClose(r.pValue, 1 / 3, { rel: 1e-13 }, "two-sided p");
  const tied = runsTest([1, 5, 9, 2, 8, 4, 7]);
  assert.match(tied.warnings.join(), /1 value equals the median and is left out/);
  assertPlumbError(
    () => runsTest([3, 3, 3]),
    "constant",
    /^Cannot run the runs test on 3 identical values/,
  );
  assertPlumbError(
    () => lagOneTest([1, 2, 3]),
    "too-few",
    /^Cannot run the lag-1 autocorrelation test on 3 values/,
  );
  assertPlumbError(
    () => serialDependence([1, 2, 3, 4], { alpha: 2 }),
    "bad-option",
    /^Cannot use alpha = 2/,
  );
});

Deno.test("runs: the normal branch beyond 10,000 values agrees with the exact tails nearby", () => {
  const rng = seededRandom(40);
  const x = Array.from({ length: 10003 }, () => rng.normal()); // odd: one value is the median
  const big = runsTest(x);
  assert.equal(big.method, "normal");
  const exact = runsTest(x.slice(0, 10000));
  assert.equal(exact.method, "exact");
  assert.ok(Math.abs(big.pValue - exact.pValue) < 0.05, `${big.pValue} vs ${exact.pValue}`);
});

Deno.test("decision by simulation: independent data flagged ≤ 10%, AR(1) φ = 0.7 at n = 200 ≥ 90%", () => {
  const rng = seededRandom(1940);
  const S = 2000;
  const rate = (n: number, draw: () => number) => {
    let hits = 0;
    for (let s = 0; s < S; s++) if (serialDependence(Array.from({ length: n }, draw)).shows) hits++;
    return hits / S;
  };
  for (const n of [20, 50, 200, 1000]) {
    const normal = rate(n, () => rng.normal());
    assert.ok(normal <= 0.1, `independent normal, n = ${n}: flagged ${normal}`);
  }
  const skewed = rate(200, () => -Math.log(rng.uniform()));
  const rounded = rate(200, () => Math.round(2 * rng.normal()) / 2);
  assert.ok(skewed <= 0.1 && rounded <= 0.1, `exponential ${skewed}, rounded ${rounded}`);
  let prev = 0;
  const ar = rate(200, () => (prev = 0.7 * prev + rng.normal()));
  assert.ok(ar >= 0.9, `AR(1), φ = 0.7, n = 200: flagged ${ar}`);
});
