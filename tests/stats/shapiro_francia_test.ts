import { equal, match, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../../lib/errors.ts";
import { shapiroFrancia } from "../../lib/stats/shapiro_francia.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/shapiro_francia.json, written by
// tools/fixtures/shapiro_francia.py: W′ with mpmath (40 digits) and with
// numpy.corrcoef, p by Royston's (1993) formula in mpmath (versions in the file).
// This checks the arithmetic; the published constants are transcribed from memory.
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/shapiro_francia.json", import.meta.url)),
) as {
  library: Record<string, string>;
  cases: { name: string; n: number; W: number; W_numpy: number; p: number; x: number[] }[];
};
const src = `mpmath ${fixture.library.mpmath} / numpy ${fixture.library.numpy}`;

Deno.test(`W′ and p match ${src} on ${fixture.cases.length} samples to 1e-9 relative`, () => {
  for (const c of fixture.cases) {
    const r = shapiroFrancia(c.x);
    const ctx = `${c.name} (n = ${c.n}) vs ${src}`;
    equal(r.n, c.n);
    assertClose(r.statistic, c.W, { rel: 1e-9 }, `W′, ${ctx}`);
    assertClose(r.statistic, c.W_numpy, { rel: 1e-9 }, `W′ vs numpy, ${ctx}`);
    assertClose(r.pValue, c.p, { rel: 1e-9, abs: 1e-14 }, `p, ${ctx}`);
  }
});

Deno.test("Shapiro–Francia errors: too few, too many, non-finite, constant", () => {
  const check = (x: ArrayLike<number>, code: string, text: RegExp) =>
    throws(() => shapiroFrancia(x), (e: unknown) => {
      ok(e instanceof PlumbError);
      equal(e.code, code);
      match(e.message, text);
      return true;
    });
  check([1, 2, 3, 4], "too-few", /^Cannot run the Shapiro–Francia test on 4 values: at least 5/);
  check(new Float64Array(5001).map((_, i) => i), "too-many", /at most 5000/);
  check([1, 2, NaN, 4, 5], "non-finite", /1 of 5/);
  check([2, 2, 2, 2, 2, 2], "constant", /6 identical values/);
});

Deno.test("property: Shapiro–Francia W′ in (0, 1], p in [0, 1], invariant to exact affine maps", () => {
  const ints = fc.array(fc.integer({ min: -1e6, max: 1e6 }), { minLength: 5, maxLength: 200 })
    .filter((x) => new Set(x).size > 1);
  fc.assert(
    fc.property(
      ints,
      fc.integer({ min: -1e6, max: 1e6 }),
      fc.integer({ min: -30, max: 30 }),
      (x, c, k) => {
        const r = shapiroFrancia(x);
        const s = shapiroFrancia(x.map((v) => -(2 ** k) * (c + v)).reverse());
        return r.statistic > 0 && r.statistic <= 1 && r.pValue >= 0 && r.pValue <= 1 &&
          Math.abs(s.statistic - r.statistic) <= 1e-12 * r.statistic;
      },
    ),
    { seed: 20261203, numRuns: 300 },
  );
});
