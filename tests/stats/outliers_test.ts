import { deepEqual, equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { defaultMaxOutliers, esdCritical, generalizedEsd } from "../../lib/stats/outliers.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/outliers.json (tools/fixtures/outliers.R): Rosner's λᵢ
// evaluated with R's qt (R's version is in the file).
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/outliers.json", import.meta.url)),
) as { library: { R: string }; esd: { n: number; alpha: number; lambda: number[] }[] };
const src = `Rosner's λ with R ${fixture.library.R} qt`;

Deno.test(`esdCritical matches ${src} to 1e-11 relative, n = 3 … 1e6`, () => {
  for (const c of fixture.esd) {
    c.lambda.forEach((l, k) =>
      assertClose(
        esdCritical(k + 1, c.n, c.alpha),
        l,
        { rel: 1e-11 },
        `i = ${k + 1}, n = ${c.n}, α = ${c.alpha} vs ${src}`,
      )
    );
  }
});

// NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.5.17.3, generalized ESD
// example (Rosner's 1983 data, 54 values, r = 10, α = 0.05): the handbook prints Rᵢ and
// λᵢ to three decimals, truncated, and finds 3 outliers. Data and table from memory.
const ROSNER = [
  -0.25,
  0.68,
  0.94,
  1.15,
  1.2,
  1.26,
  1.26,
  1.34,
  1.38,
  1.43,
  1.49,
  1.49,
  1.55,
  1.56,
  1.58,
  1.65,
  1.69,
  1.7,
  1.76,
  1.77,
  1.81,
  1.91,
  1.94,
  1.96,
  1.99,
  2.06,
  2.09,
  2.1,
  2.14,
  2.15,
  2.23,
  2.24,
  2.26,
  2.35,
  2.37,
  2.4,
  2.47,
  2.54,
  2.62,
  2.64,
  2.9,
  2.92,
  2.92,
  2.93,
  3.21,
  3.26,
  3.3,
  3.59,
  3.68,
  4.3,
  4.64,
  5.34,
  5.42,
  6.01,
];
const NIST_R = [3.118, 2.942, 3.179, 2.81, 2.815, 2.848, 2.279, 2.31, 2.101, 2.067];
const NIST_LAMBDA = [3.158, 3.151, 3.143, 3.136, 3.128, 3.12, 3.111, 3.103, 3.094, 3.085];

Deno.test("the NIST e-Handbook example: 3 outliers, Rᵢ and λᵢ as printed (truncated to 3 decimals)", () => {
  equal(ROSNER.length, 54);
  const r = generalizedEsd(ROSNER, { maxOutliers: 10 });
  const cut = (v: number) => Math.floor(v * 1000 + 1e-9) / 1000;
  deepEqual(r.statistics.map(cut), NIST_R);
  deepEqual(r.critical.map(cut), NIST_LAMBDA);
  equal(r.count, 3);
  deepEqual(r.values, [6.01, 5.42, 5.34]);
  deepEqual(r.sides, ["high", "high", "high"]);
});

Deno.test("masking: two close far values are both found, though the first step alone misses them", () => {
  // 20 evenly spread normal scores Φ⁻¹((i − ½)/20), rounded to 0.01, and two values near 4.8
  const bulk = [
    -1.96,
    -1.44,
    -1.15,
    -0.93,
    -0.76,
    -0.6,
    -0.45,
    -0.32,
    -0.19,
    -0.06,
    0.06,
    0.19,
    0.32,
    0.45,
    0.6,
    0.76,
    0.93,
    1.15,
    1.44,
    1.96,
  ];
  const r = generalizedEsd([...bulk, 4.8, 4.9], { maxOutliers: 3 });
  equal(r.count, 2);
  deepEqual(r.values, [4.9, 4.8]);
  ok(r.statistics[0] < r.critical[0], "the first step alone (Grubbs) does not reject");
});

Deno.test("a low outlier is reported as low; below 15 values only one is sought (Grubbs)", () => {
  const r = generalizedEsd([5.1, 5.0, 4.9, 5.2, 5.0, 4.8, 5.1, 5.0, 1.0, 5.05]);
  equal(r.maxOutliers, 1);
  equal(r.count, 1);
  deepEqual(r.sides, ["low"]);
  ok(r.method.includes("Grubbs"));
  equal(defaultMaxOutliers(14), 1);
  equal(defaultMaxOutliers(15), 1);
  equal(defaultMaxOutliers(54), 5);
  equal(defaultMaxOutliers(1e6), 10);
});

Deno.test("size: about α of normal samples get any outlier (seeded simulation, 2,000 per n)", () => {
  // Rosner (1983) designed λᵢ so that the whole procedure has level α = 5%; the binomial
  // standard error at 2,000 samples is 0.5 percentage points, so 2.5%–7.5% is ±5 SE.
  const rng = seededRandom(20261202);
  for (const n of [10, 25, 100, 1000]) {
    let hits = 0;
    for (let rep = 0; rep < 2000; rep++) {
      const x = new Float64Array(n);
      for (let i = 0; i < n; i++) x[i] = rng.normal();
      if (generalizedEsd(x).count > 0) hits++;
    }
    const rate = hits / 2000;
    ok(rate >= 0.025 && rate <= 0.075, `n = ${n}: ${rate}`);
  }
});

Deno.test("extreme magnitudes neither overflow nor lose the outlier", () => {
  const x = [1, 2, 3, 2, 1, 2, 3, 2, 1, 2, 3, 2, 1, 2, 3, 2, 40].map((v) => v * 1e306);
  const r = generalizedEsd(x);
  equal(r.count, 1);
  equal(r.values[0], 4e307);
  ok(r.statistics.every(Number.isFinite));
});

Deno.test("bad input and options are refused with a code", () => {
  const is = (code: string) => (e: unknown) => e instanceof PlumbError && e.code === code;
  throws(() => generalizedEsd([1, 2]), is("too-few"));
  throws(() => generalizedEsd([2, 2, 2, 2]), is("constant"));
  throws(() => generalizedEsd([1, 2, Infinity]), is("non-finite"));
  throws(() => generalizedEsd([1, 2, 3, 4], { maxOutliers: 3 }), is("bad-option"));
  throws(() => generalizedEsd([1, 2, 3, 4], { maxOutliers: 1.5 }), is("bad-option"));
  throws(() => generalizedEsd([1, 2, 3, 4], { alpha: 1 }), is("bad-option"));
});
