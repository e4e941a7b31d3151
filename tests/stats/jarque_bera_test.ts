/**
 * Tests for lib/stats/jarque_bera.ts.
 *
 * Reference: scipy 1.10 `jarque_bera` (tests/fixtures/other_tests.json,
 * written by tools/fixtures/other_tests.py). Tolerance: relative 1e−9;
 * p-values below 1e−300 (subnormal, few significant bits) absolute 1e−305.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { jarqueBera } from "../../lib/stats/jarque_bera.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError, scaleArb, shiftArb, spreadSample } from "../_shared.ts";

interface Case {
  name: string;
  x: number[];
  jarqueBera: { JB: number; p: number };
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/other_tests.json", import.meta.url)),
) as { library: Record<string, string>; cases: Case[] };

Deno.test("Jarque–Bera statistic and p match scipy jarque_bera", () => {
  for (const c of fixture.cases) {
    const r = jarqueBera(c.x);
    const ctx = `${c.name} (scipy ${fixture.library.scipy})`;
    assertClose(r.statistic, c.jarqueBera.JB, { rel: 1e-9 }, `${ctx}: JB`);
    assertClose(r.pValue, c.jarqueBera.p, { rel: 1e-9, abs: 1e-305 }, `${ctx}: p`);
    assert.equal(r.n, c.x.length);
  }
});

Deno.test("Jarque–Bera warns about the asymptotic p below 2000 values only", () => {
  const small = fixture.cases.find((c) => c.name === "normal n=1000")!;
  const large = fixture.cases.find((c) => c.name === "normal n=5000")!;
  assert.deepEqual(jarqueBera(small.x).warnings, [
    "With 1000 values the χ²(2) p-value of Jarque–Bera is only a rough guide (the " +
    "approximation needs thousands of values); rely on Shapiro–Wilk or K² instead",
  ]);
  assert.deepEqual(jarqueBera(large.x).warnings, []);
});

Deno.test("Jarque–Bera rejects too few, non-finite and constant input with PlumbError", () => {
  const check = (x: unknown[], code: string, message: RegExp) =>
    assertPlumbError(() => jarqueBera(x as number[]), code, message);
  check(
    [1, 2, 3],
    "too-few",
    /^Cannot run the Jarque–Bera test on 3 values: at least 8 are needed$/,
  );
  check(
    [1, 2, 3, 4, "5", 6, 7, 8],
    "non-finite",
    /^Cannot run the Jarque–Bera test on values that are not finite numbers: 1 of 8 \(at position 4\)/,
  );
  check(
    [0, 0, 0, 0, 0, 0, 0, 0, 0],
    "constant",
    /^Cannot run the Jarque–Bera test on 9 identical values \(all 0\)/,
  );
});

const sample = spreadSample;

Deno.test("Jarque–Bera: invariant under x → a + b·x (either sign) and reordering; p in [0, 1]", () => {
  fc.assert(
    fc.property(
      sample,
      shiftArb,
      scaleArb,
      (x, a, b) => {
        const r = jarqueBera(x);
        const t = jarqueBera(x.map((v) => a + b * v));
        const rev = jarqueBera([...x].reverse());
        assertClose(t.statistic, r.statistic, { rel: 1e-7, abs: 1e-9 }, "JB under a + b·x");
        assertClose(rev.statistic, r.statistic, { rel: 1e-10, abs: 1e-12 }, "JB reordered");
        assert.ok(r.pValue >= 0 && r.pValue <= 1);
        assert.ok(Number.isFinite(r.statistic) && Number.isFinite(r.pValue));
        assert.ok(Object.isFrozen(r));
      },
    ),
    { seed: 20261204, numRuns: 300 },
  );
});
