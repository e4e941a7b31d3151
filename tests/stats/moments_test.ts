/**
 * Tests for lib/stats/moments.ts.
 *
 * References (tests/fixtures/other_tests.json, written by
 * tools/fixtures/other_tests.py; versions inside the file):
 * - `moments_exact`: mpmath 1.2.1 at 60 digits on the exact binary data.
 *   Tolerance: relative 1e−12, or absolute 1e−14 for the unit-free shape
 *   values near zero (g1 of symmetric data carries an absolute rounding
 *   error of a few ulps of its terms, not of its value).
 * - `numpy_scipy_moments`: numpy 1.24 / scipy 1.10 (`skew`, `kurtosis`, with
 *   and without bias). Tolerance: relative 1e−9, absolute 1e−12.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { moments } from "../../lib/stats/moments.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertClose } from "../_assert_close.ts";

interface Case {
  name: string;
  x: number[];
  moments_exact: Record<string, number>;
  numpy_scipy_moments: Record<string, number>;
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/other_tests.json", import.meta.url)),
) as { library: Record<string, string>; cases: Case[] };

const FIELDS = ["mean", "sd", "g1", "g2", "G1", "G2", "seG1", "seG2"] as const;
const UNITLESS = new Set(["g1", "g2", "G1", "G2"]);

Deno.test("moments match 60-digit mpmath values on every fixture sample", () => {
  for (const c of fixture.cases) {
    const m = moments(c.x);
    assert.equal(m.n, c.x.length);
    for (const k of FIELDS) {
      const tol = UNITLESS.has(k) ? { rel: 1e-12, abs: 1e-14 } : { rel: 1e-12 };
      assertClose(
        m[k],
        c.moments_exact[k],
        tol,
        `${c.name}: ${k} vs mpmath ${fixture.library.mpmath}`,
      );
    }
  }
});

Deno.test("moments match numpy/scipy (skew, kurtosis with bias=True and bias=False)", () => {
  for (const c of fixture.cases) {
    const m = moments(c.x);
    for (const k of ["mean", "sd", "g1", "g2", "G1", "G2"] as const) {
      assertClose(
        m[k],
        c.numpy_scipy_moments[k],
        { rel: 1e-9, abs: 1e-12 },
        `${c.name}: ${k} vs scipy ${fixture.library.scipy}`,
      );
    }
  }
});

Deno.test("moments stay accurate for 1e9 + tiny noise, where a plain two-pass loses digits", () => {
  const c = fixture.cases.find((c) => c.name === "near-constant around 1e9, n=1000")!;
  // The naive formula, for contrast: centre with a plain mean, sum the cubes.
  const n = c.x.length;
  const naiveMean = c.x.reduce((a, b) => a + b, 0) / n;
  let m2 = 0, m3 = 0;
  for (const v of c.x) {
    m2 += (v - naiveMean) ** 2 / n;
    m3 += (v - naiveMean) ** 3 / n;
  }
  const naiveG1 = m3 / m2 ** 1.5;
  const exact = c.moments_exact.g1;
  assert.ok(Math.abs(naiveG1 - exact) > 1e-9 * Math.abs(exact), "the naive value should be off");
  assertClose(moments(c.x).g1, exact, { rel: 1e-12 }, "g1 at 1e9 offset vs mpmath");
});

Deno.test("moments at extreme magnitudes: same shape for x, x·1e-300 and x·1e300", () => {
  const x = [1, 2, 2, 3, 3, 3, 4, 4, 5, 9, 12];
  const base = moments(x);
  for (const f of [1e-300, 1e300, 2 ** -1000, 2 ** 1000]) {
    const m = moments(x.map((v) => v * f));
    for (const k of ["g1", "g2", "G1", "G2"] as const) {
      assertClose(m[k], base[k], { rel: 1e-13 }, `${k} at scale ${f}`);
    }
    assertClose(m.sd, base.sd * f, { rel: 1e-13 }, `sd at scale ${f}`);
    assertClose(m.mean, base.mean * f, { rel: 1e-13 }, `mean at scale ${f}`);
  }
  // Subnormal data: x·2^-1070 are exact multiples of the smallest double, and the shape is
  // computed on exactly rescaled copies, so it is unaffected (the sd itself is subnormal and
  // carries only a few significant bits, so it is not compared).
  const tiny = moments(x.map((v) => v * 2 ** -1070));
  for (const k of ["g1", "g2", "G1", "G2"] as const) {
    assertClose(tiny[k], base[k], { rel: 1e-13 }, `${k} for subnormal data`);
  }
});

Deno.test("moments reject too few, non-finite and constant input with PlumbError", () => {
  assert.throws(() => moments([1, 2, 3]), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "too-few");
    assert.equal(
      e.message,
      "Cannot run the skewness and kurtosis summary on 3 values: at least 4 are needed",
    );
    return true;
  });
  assert.throws(() => moments([1, 2, NaN, 4, Infinity]), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-finite");
    assert.match(
      e.message,
      /^Cannot run the skewness and kurtosis summary on values that are not finite numbers: 2 of 5 \(at positions 2, 4\)/,
    );
    return true;
  });
  assert.throws(() => moments([7, 7, 7, 7, 7]), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "constant");
    assert.match(
      e.message,
      /^Cannot run the skewness and kurtosis summary on 5 identical values \(all 7\)/,
    );
    return true;
  });
});

const sample = fc.array(fc.double({ min: -100, max: 100, noNaN: true }), {
  minLength: 4,
  maxLength: 40,
}).filter((x) => Math.max(...x) - Math.min(...x) > 1e-3 * Math.max(1, ...x.map(Math.abs)));

Deno.test("moments: location and scale invariance of the shape, sign flip of skewness", () => {
  fc.assert(
    fc.property(
      sample,
      fc.double({ min: -100, max: 100, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }),
      fc.boolean(),
      (x, a, b, flip) => {
        const s = flip ? -b : b;
        const m = moments(x);
        const t = moments(x.map((v) => a + s * v));
        const tol = { rel: 1e-7, abs: 1e-9 };
        assertClose(t.g1, flip ? -m.g1 : m.g1, tol, "g1");
        assertClose(t.g2, m.g2, tol, "g2");
        assertClose(t.G2, m.G2, tol, "G2");
        assertClose(t.sd, b * m.sd, { rel: 1e-7 }, "sd");
      },
    ),
    { seed: 20261201, numRuns: 300 },
  );
});

Deno.test("moments: permutation invariance and every field finite", () => {
  fc.assert(
    fc.property(sample, fc.array(fc.double({ min: 0, max: 1, noNaN: true })), (x, keys) => {
      const order = x.map((_, i) => i).sort((i, j) => (keys[i] ?? 0) - (keys[j] ?? 0) || i - j);
      const m = moments(x);
      const p = moments(order.map((i) => x[i]));
      for (const k of FIELDS) {
        assert.ok(Number.isFinite(m[k]), `${k} finite`);
        assertClose(p[k], m[k], { rel: 1e-10, abs: 1e-12 }, `${k} after reordering`);
      }
      assert.ok(Object.isFrozen(m));
    }),
    { seed: 20261202, numRuns: 300 },
  );
});
