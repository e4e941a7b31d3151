/**
 * Tests for lib/stats/dagostino_pearson.ts.
 *
 * Reference: scipy 1.10 `skewtest`, `kurtosistest`, `normaltest`
 * (tests/fixtures/other_tests.json, written by tools/fixtures/other_tests.py).
 * Tolerance: relative 1e−9 (absolute 1e−12 for scores near zero); p-values in
 * the subnormal range (below 1e−300, a handful of significant bits) absolute 1e−305.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { dagostinoPearson } from "../../lib/stats/dagostino_pearson.ts";
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError, spreadSample } from "../_shared.ts";

interface Case {
  name: string;
  x: number[];
  dagostino: Record<string, number>;
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/other_tests.json", import.meta.url)),
) as { library: Record<string, string>; cases: Case[] };
const TOL = { rel: 1e-9, abs: 1e-12 };
const P_TOL = { rel: 1e-9, abs: 1e-305 };

Deno.test("K², its scores and p-values match scipy skewtest / kurtosistest / normaltest", () => {
  for (const c of fixture.cases) {
    const r = dagostinoPearson(c.x);
    const e = c.dagostino;
    const ctx = `${c.name} (scipy ${fixture.library.scipy})`;
    assertClose(r.skewnessZ, e.skewnessZ, TOL, `${ctx}: skewness Z`);
    assertClose(r.skewnessP, e.skewnessP, P_TOL, `${ctx}: skewness p`);
    assertClose(r.statistic, e.K2, TOL, `${ctx}: K²`);
    assertClose(r.pValue, e.p, P_TOL, `${ctx}: p`);
    assertClose(r.kurtosisP, e.kurtosisP, P_TOL, `${ctx}: kurtosis p`);
    const outside = r.warnings.some((w) => w.includes("Anscombe–Glynn"));
    if (!outside) {
      assertClose(r.kurtosisZ, e.kurtosisZ, TOL, `${ctx}: kurtosis Z`);
    } else {
      // Very light tails, past the approximation's range: scipy keeps the real cube root's
      // positive sign, plumbline the negative sign of the limit; the magnitude is the same.
      assert.ok(e.kurtosisZ > 0 && r.kurtosisZ < 0, `${ctx}: sign convention`);
      assertClose(r.kurtosisZ, -e.kurtosisZ, TOL, `${ctx}: |kurtosis Z|`);
    }
  }
});

Deno.test("K² flags the light-tailed cases outside the Anscombe–Glynn range", () => {
  for (const name of ["two clusters, n=1000", "R faithful$eruptions"]) {
    const c = fixture.cases.find((c) => c.name === name)!;
    const r = dagostinoPearson(c.x);
    assert.ok(r.warnings.some((w) => w.startsWith("The tails are far lighter than normal")), name);
    assert.ok(r.kurtosisZ < -20, `${name}: strongly light-tailed score`);
  }
});

Deno.test("K² warns below 20 values and not from 20 on", () => {
  const x = [2.1, 3.4, 1.9, 5.6, 4.4, 3.8, 2.9, 4.1, 3.3, 3.0, 6.2, 2.5];
  assert.equal(dagostinoPearson(x).warnings.length, 1);
  assert.match(dagostinoPearson(x).warnings[0], /^With 12 values the kurtosis score/);
  const y = Array.from({ length: 20 }, (_, i) => Math.sin(i * 1.7) + i / 40);
  assert.equal(dagostinoPearson(y).warnings.length, 0);
});

Deno.test("K² at n = 1e6: a mild skew gives a tiny p that is still a positive number", () => {
  const n = 1_000_000;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const q = normalQuantile((i + 0.5) / n);
    x[i] = q + 0.012 * q * q; // skewness about 0.07
  }
  const r = dagostinoPearson(x);
  assert.ok(r.skewnessZ > 20, `skewness Z ${r.skewnessZ}`);
  assert.ok(r.pValue > 1e-300 && r.pValue < 1e-100, `p ${r.pValue}`);
});

Deno.test("K² at extreme magnitudes: same K² for x, x·1e300, x·1e-300", () => {
  const x = [3.1, 2.7, 4.4, 3.9, 2.2, 5.6, 3.3, 3.0, 4.1, 2.9, 3.6];
  const base = dagostinoPearson(x).statistic;
  for (const f of [1e300, 1e-300, -1e300]) {
    assertClose(dagostinoPearson(x.map((v) => v * f)).statistic, base, { rel: 1e-13 }, `×${f}`);
  }
});

Deno.test("K² rejects too few, non-finite and constant input with PlumbError", () => {
  const check = (x: number[], code: string, message: RegExp) =>
    assertPlumbError(() => dagostinoPearson(x), code, message);
  check(
    [1, 2, 3, 4, 5, 6, 7],
    "too-few",
    /^Cannot run the D'Agostino–Pearson K² test on 7 values: at least 8 are needed$/,
  );
  check(
    [1, 2, 3, 4, 5, 6, 7, -Infinity],
    "non-finite",
    /^Cannot run the D'Agostino–Pearson K² test on values that are not finite numbers: 1 of 8 \(at position 7\)/,
  );
  check(
    [3, 3, 3, 3, 3, 3, 3, 3],
    "constant",
    /^Cannot run the D'Agostino–Pearson K² test on 8 identical values \(all 3\)/,
  );
});

const sample = spreadSample;

Deno.test("K²: invariant under x → a + b·x (either sign of b) and reordering; fields finite", () => {
  fc.assert(
    fc.property(
      sample,
      fc.double({ min: -100, max: 100, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }),
      fc.boolean(),
      (x, a, b, flip) => {
        const r = dagostinoPearson(x);
        const t = dagostinoPearson(x.map((v) => a + (flip ? -b : b) * v));
        const rev = dagostinoPearson([...x].reverse());
        const tol = { rel: 1e-7, abs: 1e-9 };
        assertClose(t.statistic, r.statistic, tol, "K² under a + b·x");
        assertClose(t.skewnessZ, flip ? -r.skewnessZ : r.skewnessZ, tol, "Zs under a + b·x");
        assertClose(t.kurtosisZ, r.kurtosisZ, tol, "Zk under a + b·x");
        assertClose(rev.statistic, r.statistic, { rel: 1e-10, abs: 1e-12 }, "K² reordered");
        assert.ok(r.pValue >= 0 && r.pValue <= 1 && r.skewnessP <= 1 && r.kurtosisP <= 1);
        for (const [k, v] of Object.entries(r)) {
          if (typeof v === "number") assert.ok(Number.isFinite(v), `${k} finite`);
        }
        assert.ok(Object.isFrozen(r) && Object.isFrozen(r.warnings));
      },
    ),
    { seed: 20261203, numRuns: 300 },
  );
});
