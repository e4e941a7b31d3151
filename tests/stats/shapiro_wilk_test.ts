import { equal, match, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { shapiroWilk, shapiroWilkPValue } from "../../lib/stats/shapiro_wilk.ts";
import { shapiroWilkCoefficients } from "../../lib/stats/shapiro_wilk_coefficients.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/shapiro_wilk.json, written by tools/fixtures/shapiro_wilk.R
// from R's stats::shapiro.test (double-precision AS R94); R's version is in the file.
interface Case {
  name: string;
  origin: string;
  shifted: boolean;
  n: number;
  W: number;
  p: number;
  x: number[];
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/shapiro_wilk.json", import.meta.url)),
) as { library: { R: string }; cases: Case[] };
const src = `R ${fixture.library.R} shapiro.test`;

// Tolerance from the contract: |ΔW| ≤ 1e-9 relative; |Δp| ≤ 1e-9 relative or 1e-14 absolute.
const TOL_W = { rel: 1e-9 };
const TOL_P = { rel: 1e-9, abs: 1e-14 };

Deno.test(`W and p match ${src} on ${fixture.cases.length} samples`, () => {
  for (const c of fixture.cases) {
    const r = shapiroWilk(c.x);
    const ctx = `${c.name} (n = ${c.n}, ${c.origin}) vs ${src}`;
    equal(r.n, c.n);
    assertClose(r.statistic, c.W, TOL_W, `W, ${ctx}`);
    assertClose(r.pValue, c.p, TOL_P, `p, ${ctx}`);
  }
});

Deno.test("the fixture covers both of Royston's regimes, the exact n = 3, and n = 5000", () => {
  const ns = new Set(fixture.cases.map((c) => c.n));
  for (const n of [3, 4, 5, 11, 12, 20, 100, 1000, 5000]) ok(ns.has(n), `n = ${n} missing`);
});

// Shapiro & Wilk (1965), Biometrika 52:591–611, worked example: weights in pounds
// of 11 men, W = 0.79, significant at the 1% level (from memory). Their W uses the
// exact tabled coefficients; Royston's approximation agrees to two decimals.
Deno.test("Shapiro & Wilk (1965) worked example, from memory: W = 0.79, p < 0.01", () => {
  const r = shapiroWilk([148, 154, 158, 160, 161, 162, 166, 170, 182, 195, 236]);
  equal(Math.round(r.statistic * 100) / 100, 0.79);
  ok(r.pValue < 0.01);
});

Deno.test("n = 3: the exact p-value, and p = 0 (not negative) at the minimum W = 3/4", () => {
  const r = shapiroWilk([0, 0, 1]);
  equal(r.statistic, 0.75);
  equal(r.pValue, 0);
  // Evenly spaced values give W = 1 and p = 1.
  const even = shapiroWilk([1, 2, 3]);
  equal(even.statistic, 1);
  equal(even.pValue, 1);
  // p(W) for n = 3 is (6/π)(asin √W − π/3): at W = 0.9, 0.5569… (closed form).
  assertClose(
    shapiroWilkPValue(0.9, 3),
    (6 / Math.PI) * (Math.asin(Math.sqrt(0.9)) - Math.PI / 3),
    { rel: 1e-15 },
    "n = 3 closed form",
  );
});

Deno.test("coefficients: antisymmetric half, sum of squares 1, decreasing, cached", () => {
  for (const n of [4, 5, 6, 11, 12, 50, 999, 5000]) {
    const a = shapiroWilkCoefficients(n);
    equal(a.length, Math.floor(n / 2));
    let ss = 0;
    for (let k = 0; k < a.length; k++) {
      ss += 2 * a[k] * a[k];
      if (k > 0) ok(a[k] < a[k - 1], `n=${n}: a not decreasing at ${k}`);
      ok(a[k] > 0);
    }
    assertClose(ss, 1, { rel: 1e-14 }, `Σa² for n = ${n}`);
    ok(shapiroWilkCoefficients(n) === a, "second call returns the cached array");
  }
});

Deno.test("errors: too few, too many, non-finite, constant", () => {
  const check = (x: ArrayLike<number>, code: string, text: RegExp) =>
    throws(() => shapiroWilk(x), (e: unknown) => {
      ok(e instanceof PlumbError, "PlumbError");
      equal(e.code, code);
      match(e.message, text);
      return true;
    });
  check([1, 2], "too-few", /^Cannot run the Shapiro–Wilk test on 2 values: at least 3 are needed$/);
  check([], "too-few", /on 0 values/);
  check(new Float64Array(5001).map((_, i) => i), "too-many", /5001 values.*at most 5000/);
  check([1, NaN, 3, Infinity, 5], "non-finite", /2 of 5 \(at positions 1, 3\)/);
  check([1, 2, "3" as unknown as number], "non-finite", /1 of 3 \(at position 2\)/);
  check([4, 4, 4, 4], "constant", /4 identical values \(all 4\)/);
});

Deno.test("the sorted copy kept between calls: each call sees only its own values, input untouched", () => {
  // The first fixture sample, alone, after a call on 5000 values, as doubles and as a
  // list, and after a refused call (a NaN in the middle): the same W and p every time.
  const c = fixture.cases[0];
  const alone = shapiroWilk(c.x);
  const rng = seededRandom(31);
  const big = new Float64Array(5000).map(() => rng.normal());
  const before = big.slice();
  shapiroWilk(big);
  equal(big.join(), before.join(), "the caller's array is not sorted in place");
  const typed = shapiroWilk(Float64Array.from(c.x));
  throws(() => shapiroWilk([...c.x.slice(0, 2), NaN, ...c.x.slice(2)]), PlumbError);
  const again = shapiroWilk(c.x);
  for (const r of [typed, again]) {
    equal(r.statistic, alone.statistic);
    equal(r.pValue, alone.pValue);
  }
});

Deno.test("a step coarse against the spread gives a warning; a fine one, even with repeats, does not", () => {
  // whole numbers with sd 1.0 at n = 12: step/sd = 0.98 > 0.35 (limit from tools/sim/rounding_limit.ts)
  const r = shapiroWilk([1, 1, 1, 2, 2, 2, 2, 3, 3, 3, 4, 4]);
  ok(
    r.warnings.some((w) => /^Recorded in steps of 1, coarse against the spread/.test(w)),
    r.warnings.join("|"),
  );
  // 0.01 steps with sd about 0.5: many repeats at n = 600, but no warning
  const rng = seededRandom(9);
  const fine = Array.from(
    { length: 600 },
    () => Math.round((5.5 + 0.48 * rng.normal()) * 100) / 100,
  );
  ok(new Set(fine).size < 0.7 * 600);
  equal(shapiroWilk(fine).warnings.length, 0);
});

Deno.test("extreme magnitudes: W is unchanged from 1e-300 to 1e300 scale and 1e15 offsets", () => {
  // Multiples of 1/8, so that every map below is exact in floating point; the
  // statistic centres and scales by the range, so W and p come out bit for bit
  // the same (any difference at all would be a loss of accuracy).
  const base = [0.25, 1.75, 2.25, 2.875, 3.125, 4.5, 4.75, 6, 7.5, 9.875, 12, 15.5];
  const ref = shapiroWilk(base);
  for (const [a, b] of [[0, 2 ** -990], [0, 2 ** 990], [1e15, 1], [-1e15, 1], [0, -1], [3, -0.5]]) {
    const r = shapiroWilk(base.map((v) => a + b * v));
    equal(r.statistic, ref.statistic, `W under x → ${a} + ${b}·x`);
    equal(r.pValue, ref.pValue, `p under x → ${a} + ${b}·x`);
  }
});

// Property tests (fast-check, fixed seed): ranges, location/scale and permutation invariance.
const sample = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), {
  minLength: 3,
  maxLength: 300,
}).filter((x) => new Set(x).size > 1);

Deno.test("property: 0 < W ≤ 1 and 0 ≤ p ≤ 1, no NaN", () => {
  fc.assert(
    fc.property(sample, (x) => {
      const r = shapiroWilk(x);
      return r.statistic > 0 && r.statistic <= 1 && r.pValue >= 0 && r.pValue <= 1 &&
        !Number.isNaN(r.statistic + r.pValue);
    }),
    { seed: 20261201, numRuns: 500 },
  );
});

// Integer data with maps x → 2^k·(c + x): exact in floating point, so W must
// agree to rounding (1e-12 relative); a lossy map would test the input, not W.
Deno.test("property: W is invariant under x → a + b·x (b ≠ 0) and reordering", () => {
  const ints = fc.array(fc.integer({ min: -1e6, max: 1e6 }), { minLength: 3, maxLength: 300 })
    .filter((x) => new Set(x).size > 1);
  fc.assert(
    fc.property(
      ints,
      fc.integer({ min: -1e6, max: 1e6 }),
      fc.integer({ min: -40, max: 40 }),
      fc.boolean(),
      (x, c, k, flip) => {
        const r = shapiroWilk(x);
        const b = (flip ? -1 : 1) * 2 ** k;
        const y = x.map((v) => b * (c + v)).reverse();
        const s = shapiroWilk(y);
        return Math.abs(s.statistic - r.statistic) <= 1e-12 * r.statistic;
      },
    ),
    { seed: 20261202, numRuns: 300 },
  );
});
