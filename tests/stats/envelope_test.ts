import assert from "node:assert/strict";
import fc from "fast-check";
import { assertClose } from "../_assert_close.ts";
import { PlumbError } from "../../lib/errors.ts";
import { betaCdfPair } from "../../lib/numeric/beta.ts";
import {
  normalEnvelope,
  simultaneousTail,
  uniformOrderQuantile,
} from "../../lib/stats/envelope.ts";

interface Case {
  n: number;
  p: number;
  ranks: number[];
  qbeta: number[];
  z: number[];
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/envelope.json", import.meta.url)),
) as { library: string; source: string; cases: Case[] };

// Tolerances, stated before the checks: quantiles of Beta(i, n − i + 1)
// within 1e-12 relative of R's qbeta; normal-scale limits within 1e-12
// relative or 1e-13 absolute (limits near z = 0 have no relative scale).
const Q_TOL = { rel: 1e-12 };
const Z_TOL = { rel: 1e-12, abs: 1e-13 };

Deno.test("order-statistic quantiles match R's qbeta for n = 1 … 1e6", () => {
  for (const c of fixture.cases) {
    c.ranks.forEach((i, k) => {
      assertClose(
        uniformOrderQuantile(i, c.n, c.p),
        c.qbeta[k],
        Q_TOL,
        `qbeta(${c.p}, ${i}, ${c.n - i + 1}) from ${fixture.library}`,
      );
    });
  }
});

Deno.test("envelope limits match R's qnorm(qbeta(...)) for n = 1 … 1e6", () => {
  for (const c of fixture.cases) {
    const tail = c.p < 0.5 ? c.p : 1 - c.p;
    const env = normalEnvelope(c.n, { level: 1 - 2 * tail, ranks: c.ranks });
    const got = c.p < 0.5 ? env.lower : env.upper;
    c.ranks.forEach((i, k) => {
      assertClose(
        got[k],
        c.z[k],
        Z_TOL,
        `qnorm(qbeta(${c.p}, ${i}, ${c.n - i + 1})) from ${fixture.library}`,
      );
    });
  }
});

Deno.test("the envelope is antisymmetric, ordered and widens with the level", () => {
  const n = 37;
  const e95 = normalEnvelope(n);
  const e99 = normalEnvelope(n, { level: 0.99 });
  for (let i = 1; i <= n; i++) {
    assert.equal(e95.lower[i - 1], -e95.upper[n - i], `rank ${i}`);
    assert.ok(e95.lower[i - 1] < e95.upper[i - 1]);
    assert.ok(e99.lower[i - 1] < e95.lower[i - 1] && e99.upper[i - 1] > e95.upper[i - 1]);
    if (i > 1) assert.ok(e95.lower[i - 1] > e95.lower[i - 2], `lower rises at rank ${i}`);
  }
  assert.equal(e95.ranks.length, n);
  assert.ok(Object.isFrozen(e95) && Object.isFrozen(e95.lower));
});

Deno.test("a single value's envelope is the normal's central interval", () => {
  // Φ⁻¹(0.025) = −1.959963984540054 (mpmath, 50 digits; also tests/fixtures/normal.json)
  const e = normalEnvelope(1);
  assertClose(e.lower[0], -1.959963984540054, { rel: 1e-15 }, "n = 1 lower");
  assertClose(e.upper[0], 1.959963984540054, { rel: 1e-15 }, "n = 1 upper");
});

Deno.test("property: the incomplete beta at the computed quantile gives back p", () => {
  // Where the quantile x is above ½ its own rounding (1 ulp of x, large
  // relative to 1 − x) limits any back-substitution, so there the mirrored
  // statistic is checked instead: U(i) = 1 − U(n + 1 − i) in distribution.
  fc.assert(
    fc.property(
      fc.integer({ min: 2, max: 200000 }),
      fc.double({ min: 0, max: 1, noNaN: true }),
      fc.double({ min: 1e-6, max: 1 - 1e-6, noNaN: true }),
      (n, u, p) => {
        const i = 1 + Math.min(n - 1, Math.floor(u * n));
        const x = uniformOrderQuantile(i, n, p);
        if (x > 0.5) {
          const mirror = uniformOrderQuantile(n + 1 - i, n, 1 - p);
          assertClose(x + mirror, 1, { abs: 1e-15 }, `U(${i}) + U(${n + 1 - i}) mirrored at ${p}`);
          return;
        }
        const [lower, upper] = betaCdfPair(x, i, n - i + 1);
        // back-substitution tolerance: 1e-10 relative on the smaller tail
        // (the quantile is accurate to 1e-12; the density scales that back)
        if (p <= 0.5) assertClose(lower, p, { rel: 1e-10 }, `I(x; ${i}, ${n - i + 1}) = ${p}`);
        else assertClose(upper, 1 - p, { rel: 1e-10 }, `1 − I(x; ${i}, ${n - i + 1}) = ${1 - p}`);
      },
    ),
    { seed: 20261201, numRuns: 300 },
  );
});

Deno.test("the simultaneous band covers whole samples at about its level", () => {
  // Check by an independent simulation (different generator and seed):
  // the fraction of fresh normal samples whose every order statistic lies in
  // the band should be 0.95 within 3 standard errors (√(0.95·0.05/2000) ≈ 0.0049).
  const n = 40;
  const env = normalEnvelope(n, { kind: "simultaneous", draws: 1000 });
  assert.ok(env.pointwiseTail < 0.05, "the joint band is wider than the pointwise one");
  let s = 987654321;
  const rand = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const trials = 2000;
  let inside = 0;
  const z = new Float64Array(n);
  for (let t = 0; t < trials; t++) {
    for (let i = 0; i < n; i++) {
      // Box–Muller (Box & Muller 1958)
      z[i] = Math.sqrt(-2 * Math.log(rand())) * Math.cos(2 * Math.PI * rand());
    }
    z.sort();
    let ok = true;
    for (let i = 0; i < n && ok; i++) ok = z[i] >= env.lower[i] && z[i] <= env.upper[i];
    if (ok) inside++;
  }
  const rate = inside / trials;
  assert.ok(Math.abs(rate - 0.95) < 3 * 0.0049, `coverage ${rate}`);
});

Deno.test("the simultaneous tail is seeded: same seed same value, cached", () => {
  const a = simultaneousTail(25, { draws: 300, seed: 7 });
  const b = simultaneousTail(25, { draws: 300, seed: 7 });
  const c = simultaneousTail(25, { draws: 300, seed: 8 });
  assert.equal(a, b);
  assert.notEqual(a, c);
});

Deno.test("bad envelope options throw PlumbError with a code and a clear message", () => {
  assert.throws(() => normalEnvelope(10, { level: 1 }), (e) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "bad-option");
    assert.equal(
      e.message,
      "Cannot build an envelope with level 1: use a coverage strictly between 0 and 1, such as 0.95",
    );
    return true;
  });
  assert.throws(() => normalEnvelope(10, { ranks: [0] }), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(e.message, "Cannot use rank 0 in a sample of 10: ranks run from 1 to 10");
    return true;
  });
  assert.throws(
    () => normalEnvelope(2.5),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
  assert.throws(
    () => uniformOrderQuantile(1, 3, 1),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
  assert.throws(() => simultaneousTail(6000), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "too-many");
    assert.match(
      e.message,
      /^Cannot simulate a simultaneous band for 6000 values: .*use the pointwise envelope/,
    );
    return true;
  });
  assert.throws(
    // deno-lint-ignore no-explicit-any
    () => normalEnvelope(10, { kind: "joint" as any }),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
});
