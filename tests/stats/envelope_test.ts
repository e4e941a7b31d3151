import assert from "node:assert/strict";
import { assertClose } from "../_assert_close.ts";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { normalEnvelope, simultaneousTail } from "../../lib/stats/envelope.ts";

interface Case {
  n: number;
  p: number;
  ranks: number[];
  qbeta: number[];
  z: number[];
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/envelope.json", import.meta.url)),
) as { library: { R: string }; source: string; cases: Case[] };

// Tolerance, stated before the checks: normal-scale limits within 1e-12
// relative or 1e-13 absolute (limits near z = 0 have no relative scale).
const Z_TOL = { rel: 1e-12, abs: 1e-13 };

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
        `qnorm(qbeta(${c.p}, ${i}, ${c.n - i + 1})) from R ${fixture.library.R}`,
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
  // Φ⁻¹(0.025) = −1.959963984540054236 (mpmath 1.2.1, 60 digits; also tests/fixtures/normal.json)
  const e = normalEnvelope(1);
  assertClose(e.lower[0], -1.959963984540054, { rel: 1e-15 }, "n = 1 lower");
  assertClose(e.upper[0], 1.959963984540054, { rel: 1e-15 }, "n = 1 upper");
});

/** The fraction of `trials` fresh normal samples of n whose every order statistic lies in the band. */
function _jointCoverage(
  env: { readonly lower: readonly number[]; readonly upper: readonly number[] },
  trials: number,
  seed: number,
): number {
  const n = env.lower.length;
  const rng = seededRandom(seed);
  const z = new Float64Array(n);
  let inside = 0;
  for (let t = 0; t < trials; t++) {
    for (let i = 0; i < n; i++) z[i] = rng.normal();
    z.sort();
    let ok = true;
    for (let i = 0; i < n && ok; i++) ok = z[i] >= env.lower[i] && z[i] <= env.upper[i];
    if (ok) inside++;
  }
  return inside / trials;
}

Deno.test("the simultaneous band covers whole samples at its level", () => {
  // Two simulations, each with its own seeded error: the band's level is set
  // from `draws` simulated samples (coverage error √(0.95·0.05/draws)), and it
  // is checked on `trials` fresh normal samples from another seed (error
  // √(0.95·0.05/trials)). The check allows 3 standard errors of the two
  // together: with 20,000 of each, √2 · 0.00154 · 3 ≈ 0.0065.
  const n = 40;
  const env = normalEnvelope(n, { kind: "simultaneous", draws: 20000 });
  assert.ok(env.pointwiseTail < 0.05, "the joint band is wider than the pointwise one");
  const rate = _jointCoverage(env, 20000, 987654321);
  assert.ok(Math.abs(rate - 0.95) < 0.0065, `coverage ${rate}`);
});

Deno.test("the default band (1000 draws) covers within its simulation error", () => {
  // Band error √(0.95·0.05/1000) = 0.0069, check error with 20,000 trials
  // 0.0015: three standard errors of the two together are 0.021.
  const env = normalEnvelope(40, { kind: "simultaneous" });
  const rate = _jointCoverage(env, 20000, 987654321);
  assert.ok(Math.abs(rate - 0.95) < 0.021, `coverage ${rate}`);
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
