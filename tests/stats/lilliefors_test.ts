/**
 * Tests for lib/stats/lilliefors.ts.
 *
 * Reference: statsmodels 0.13 `lilliefors(dist="norm", pvalmethod="approx")`
 * and its raw Dallal–Wilkinson function `pval_lf`
 * (tests/fixtures/other_tests.json, written by tools/fixtures/other_tests.py).
 * statsmodels computes the exact D over both sides of every step, as
 * plumbline does. Tolerances: D relative 1e−9; p relative 1e−9 where the
 * Dallal–Wilkinson value is ≤ 0.1 (subnormal p, below 1e−300, absolute
 * 1e−305). Above 0.1 statsmodels switches to its own simulated table, which
 * plumbline does not use: there plumbline reports only "p ≥ 0.1", and the
 * check is that statsmodels' table agrees to within 0.01 (its stated
 * precision is 2–3 decimals).
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { lilliefors } from "../../lib/stats/lilliefors.ts";
import { assertClose } from "../_assert_close.ts";
import { assertFiniteFrozen, assertPlumbError, scaleArb, shiftArb } from "../_shared.ts";

interface Case {
  name: string;
  x: number[];
  lilliefors: { D: number; p_statsmodels: number; p_dallal_wilkinson: number };
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/other_tests.json", import.meta.url)),
) as { library: Record<string, string>; cases: Case[] };
const sm = `statsmodels ${fixture.library.statsmodels}`;

Deno.test("Lilliefors D matches statsmodels", () => {
  for (const c of fixture.cases) {
    const r = lilliefors(c.x);
    assertClose(r.statistic, c.lilliefors.D, { rel: 1e-9 }, `${c.name}: D (${sm})`);
  }
});

Deno.test("Lilliefors p matches Dallal–Wilkinson (statsmodels) where it is ≤ 0.1", () => {
  let compared = 0;
  for (const c of fixture.cases) {
    const r = lilliefors(c.x);
    const e = c.lilliefors;
    if (e.p_dallal_wilkinson > 0.1) continue;
    assert.equal(r.pBound, "none", c.name);
    assertClose(
      r.pValue,
      e.p_dallal_wilkinson,
      { rel: 1e-9, abs: 1e-305 },
      `${c.name}: p (${sm} pval_lf)`,
    );
    assertClose(
      r.pValue,
      e.p_statsmodels,
      { rel: 1e-9, abs: 1e-305 },
      `${c.name}: p (${sm} lilliefors)`,
    );
    compared++;
  }
  assert.ok(compared >= 12, `compared ${compared}`);
});

Deno.test("Lilliefors reports p ≥ 0.1 as a bound, and statsmodels' table agrees", () => {
  let bounded = 0;
  for (const c of fixture.cases) {
    const r = lilliefors(c.x);
    if (c.lilliefors.p_dallal_wilkinson <= 0.1) continue;
    bounded++;
    assert.equal(r.pBound, "at-least", c.name);
    assert.equal(r.pValue, 0.1, c.name);
    assert.ok(r.warnings.some((w) => w.startsWith("p > 0.1: the Dallal–Wilkinson")), c.name);
    assert.ok(
      c.lilliefors.p_statsmodels >= 0.1 - 0.01,
      `${c.name}: table p ${c.lilliefors.p_statsmodels}`,
    );
  }
  assert.ok(bounded >= 8, `bounded ${bounded}`);
});

Deno.test("Lilliefors D with ties equals the exact sup over the empirical steps", () => {
  // The sup straight from the definition: both one-sided limits of the ECDF at each distinct value.
  const x = [1, 1, 1, 2, 2, 3, 3, 3, 3, 4, 5, 5];
  const r = lilliefors(x);
  const n = x.length;
  const mean = x.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(x.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
  const ecdfAt = (t: number) => x.filter((v) => v <= t).length / n;
  const ecdfBefore = (t: number) => x.filter((v) => v < t).length / n;
  let best = 0;
  for (const v of new Set(x)) {
    const f = 0.5 * (1 + erf((v - mean) / sd / Math.SQRT2));
    best = Math.max(best, Math.abs(ecdfAt(v) - f), Math.abs(ecdfBefore(v) - f));
  }
  assertClose(r.statistic, best, { rel: 1e-12 }, "D with ties");
  assert.ok(r.warnings.some((w) => w.startsWith("Recorded in steps of")), r.warnings.join("|"));
});

/** erf by its Maclaurin series: about 1e-15 for |x| ≤ 1.5, all the check above needs (|x| < 1.2). */
function erf(x: number): number {
  let term = x;
  let sum = x;
  for (let k = 1; k < 80; k++) {
    term *= (-x * x) / k;
    sum += term / (2 * k + 1);
  }
  return (2 / Math.sqrt(Math.PI)) * sum;
}

Deno.test("Lilliefors rejects too few, non-finite and constant input with PlumbError", () => {
  const check = (x: number[], code: string, message: RegExp) =>
    assertPlumbError(() => lilliefors(x), code, message);
  check(
    [1, 2, 3, 4],
    "too-few",
    /^Cannot run the Lilliefors test on 4 values: at least 5 are needed$/,
  );
  check(
    [1, 2, 3, 4, Infinity],
    "non-finite",
    /^Cannot run the Lilliefors test on values that are not finite numbers: 1 of 5 \(at position 4\)/,
  );
  check(
    [2, 2, 2, 2, 2],
    "constant",
    /^Cannot run the Lilliefors test on 5 identical values \(all 2\)/,
  );
});

const sample = fc.array(fc.double({ min: -100, max: 100, noNaN: true }), {
  minLength: 5,
  maxLength: 40,
}).filter((x) => Math.max(...x) - Math.min(...x) > 1e-3 * Math.max(1, ...x.map(Math.abs)));

Deno.test("Lilliefors: invariant under x → a + b·x (either sign) and reordering", () => {
  fc.assert(
    fc.property(
      sample,
      shiftArb,
      scaleArb,
      (x, a, b) => {
        const r = lilliefors(x);
        const t = lilliefors(x.map((v) => a + b * v));
        const rev = lilliefors([...x].reverse());
        assertClose(t.statistic, r.statistic, { rel: 1e-7, abs: 1e-9 }, "D under a + b·x");
        assert.equal(rev.statistic, r.statistic); // sorted first: exactly equal
        assert.ok(r.pValue >= 0 && r.pValue <= 1);
        assert.ok(r.statistic > 0 && r.statistic < 1);
        assertFiniteFrozen(r);
      },
    ),
    { seed: 20261206, numRuns: 300 },
  );
});
