/**
 * Tests for lib/stats/anderson_darling.ts.
 *
 * References (tests/fixtures/other_tests.json, written by
 * tools/fixtures/other_tests.py; versions inside the file):
 * - A²: scipy 1.10 `anderson` (which uses log Φ and log of the upper tail,
 *   accurate for outliers). Tolerance: relative 1e−9.
 * - p: statsmodels 0.13 `normal_ad`, which applies the same D'Agostino &
 *   Stephens (1986) formulas to A²* but (a) sets p = 0 above A²* = 13, its own
 *   cut-off (4.95e−31), and (b) computes A² from log(Φ) and log1p(−Φ), which
 *   loses accuracy for values far out (and overflows to ∞ for the farthest).
 *   Tolerance: relative 1e−9 plus the p change its A² discrepancy explains,
 *   |d ln p / dA²*| · |ΔA²*|, where |d ln p / dA²*| < 6 on every piece up to 13
 *   (largest, 5.94, just below 0.6).
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { andersonDarling } from "../../lib/stats/anderson_darling.ts";
import { assertClose } from "../_assert_close.ts";
import {
  assertFiniteFrozen,
  assertPlumbError,
  scaleArb,
  shiftArb,
  spreadSample,
} from "../_shared.ts";

interface Case {
  name: string;
  x: number[];
  andersonDarling: {
    A2_scipy: number;
    A2_statsmodels: number | null;
    modified: number;
    p_statsmodels: number;
  };
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/other_tests.json", import.meta.url)),
) as { library: Record<string, string>; cases: Case[] };
const libs = `scipy ${fixture.library.scipy}, statsmodels ${fixture.library.statsmodels}`;

Deno.test("A² and A²* match scipy anderson", () => {
  for (const c of fixture.cases) {
    const r = andersonDarling(c.x);
    const e = c.andersonDarling;
    assertClose(r.statistic, e.A2_scipy, { rel: 1e-9 }, `${c.name}: A² (${libs})`);
    assertClose(r.modified, e.modified, { rel: 1e-9 }, `${c.name}: A²*`);
  }
});

Deno.test("Anderson–Darling p matches statsmodels normal_ad where its A²* ≤ 13", () => {
  let compared = 0;
  for (const c of fixture.cases) {
    const r = andersonDarling(c.x);
    const e = c.andersonDarling;
    if (e.A2_statsmodels === null || e.modified > 13) continue;
    const dA = Math.abs(e.A2_statsmodels - e.A2_scipy) * r.modified / r.statistic;
    const rel = 1e-9 + 6 * dA;
    assertClose(r.pValue, e.p_statsmodels, { rel }, `${c.name}: p (${libs})`);
    assert.equal(r.pBound, "none");
    compared++;
  }
  assert.ok(compared >= 20, `compared ${compared} cases`);
});

Deno.test("Anderson–Darling p above A²* = 13: below statsmodels' cut-off, bounded past 153.5", () => {
  const cutoff = Math.exp(1.2937 - 5.709 * 13 + 0.0186 * 169); // 4.95e-31, statsmodels' comment
  let seen = 0;
  for (const c of fixture.cases) {
    const r = andersonDarling(c.x);
    if (r.modified <= 13) continue;
    seen++;
    assert.equal(c.andersonDarling.p_statsmodels, 0, c.name);
    assert.ok(r.pValue > 0 && r.pValue < cutoff, `${c.name}: p ${r.pValue}`);
    if (r.modified > 5.709 / (2 * 0.0186)) {
      assert.equal(r.pBound, "at-most", c.name);
      assert.ok(r.warnings.some((w) => w.includes("far beyond the range")), c.name);
    } else {
      assert.equal(r.pBound, "none", c.name);
    }
  }
  assert.ok(seen >= 4, `cases above 13: ${seen}`);
});

Deno.test("Anderson–Darling p falls as A²* grows, across all pieces of the formula", () => {
  // The four published pieces were fitted separately and meet only approximately;
  // allow 0.002 where consecutive cases straddle a boundary.
  const rs = fixture.cases.map((c) => andersonDarling(c.x)).sort((a, b) => a.modified - b.modified);
  for (let i = 1; i < rs.length; i++) {
    assert.ok(
      rs[i].pValue <= rs[i - 1].pValue + 0.002,
      `A²* ${rs[i - 1].modified} → ${rs[i].modified}: p ${rs[i - 1].pValue} → ${rs[i].pValue}`,
    );
  }
  const pieces = new Set(
    rs.map((r) => r.modified < 0.2 ? 0 : r.modified < 0.34 ? 1 : r.modified < 0.6 ? 2 : 3),
  );
  assert.ok(pieces.size >= 3, `pieces covered: ${[...pieces]}`);
});

Deno.test("Anderson–Darling: a far outlier (z ≈ 44.7) gives a finite A² equal to scipy's", () => {
  const c = fixture.cases.find((c) => c.name === "extreme outlier, n=2000")!;
  assert.equal(c.andersonDarling.A2_statsmodels, null); // statsmodels overflowed to ∞ here
  const r = andersonDarling(c.x);
  assertClose(r.statistic, c.andersonDarling.A2_scipy, { rel: 1e-9 }, "A² with far outlier");
});

Deno.test("Anderson–Darling at extreme magnitudes: same A² for x, x·1e300, x·1e-300", () => {
  const x = [3.1, 2.7, 4.4, 3.9, 2.2, 5.6, 3.3, 3.0, 4.1, 2.9, 3.6];
  const base = andersonDarling(x).statistic;
  for (const f of [1e300, 1e-300, -1e300]) {
    assertClose(andersonDarling(x.map((v) => v * f)).statistic, base, { rel: 1e-13 }, `×${f}`);
  }
});

Deno.test("Anderson–Darling warns about coarse rounding only", () => {
  const tied = andersonDarling(fixture.cases.find((c) => c.name === "integers 1..6, n=60")!.x);
  assert.ok(
    tied.warnings.some((w) => w.startsWith("Recorded in steps of 1, coarse against the spread")),
  );
  const smooth = andersonDarling(fixture.cases.find((c) => c.name === "normal n=100")!.x);
  assert.deepEqual(smooth.warnings, []);
});

Deno.test("Anderson–Darling rejects too few, non-finite and constant input with PlumbError", () => {
  const check = (x: number[], code: string, message: RegExp) =>
    assertPlumbError(() => andersonDarling(x), code, message);
  check(
    [1, 2, 3, 4, 5, 6, 7],
    "too-few",
    /^Cannot run the Anderson–Darling test on 7 values: at least 8 are needed$/,
  );
  check(
    [1, 2, NaN, 4, 5, 6, 7, 8],
    "non-finite",
    /^Cannot run the Anderson–Darling test on values that are not finite numbers: 1 of 8 \(at position 2\)/,
  );
  check(
    [5, 5, 5, 5, 5, 5, 5, 5],
    "constant",
    /^Cannot run the Anderson–Darling test on 8 identical values \(all 5\)/,
  );
});

const sample = spreadSample;

Deno.test("Anderson–Darling: invariant under x → a + b·x (either sign) and reordering", () => {
  fc.assert(
    fc.property(
      sample,
      shiftArb,
      scaleArb,
      (x, a, b) => {
        const r = andersonDarling(x);
        const t = andersonDarling(x.map((v) => a + b * v));
        const rev = andersonDarling([...x].reverse());
        assertClose(t.statistic, r.statistic, { rel: 1e-7, abs: 1e-9 }, "A² under a + b·x");
        assert.equal(rev.statistic, r.statistic); // the sample is sorted first: exactly equal
        assert.ok(r.pValue >= 0 && r.pValue <= 1);
        assertFiniteFrozen(r);
      },
    ),
    { seed: 20261205, numRuns: 300 },
  );
});
