/**
 * Invariance properties of every test and fit, on integer data with exact
 * maps x → 2^k·(c + x) (and x → −x, and reordering), so that floating point
 * introduces no error in the data themselves: whatever differs afterwards is
 * rounding inside the method.
 *
 * Tolerances, stated before running:
 * - reordering, for methods that sort first (Shapiro–Wilk, Shapiro–Francia,
 *   Anderson–Darling, Lilliefors): bit-for-bit identical results;
 * - everything else: statistics and moments within 1e-9 relative, p-values
 *   within 1e-7 relative or 1e-12 absolute. Data are integers in ±10⁴ and
 *   c in ±10⁴, so the condition number |c + x|/sd of the centring is at most
 *   about 4·10⁴ and the rounding it amplifies stays near 1e-11;
 * - Box–Cox λ̂ under x → 2^k·x, and Yeo–Johnson λ̂ under reordering: within
 *   1e-6 absolute (reports show λ to 3 or 4 significant figures). Yeo–Johnson
 *   is not scale invariant, so only reordering is checked for it.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import {
  andersonDarling,
  boxCoxFit,
  dagostinoPearson,
  jarqueBera,
  lilliefors,
  moments,
  plumb,
  searchReexpressions,
  shapiroFrancia,
  shapiroWilk,
  yeoJohnsonFit,
} from "../../mod.ts";
import type { TestResult } from "../../lib/stats/result.ts";
import { assertClose } from "../_assert_close.ts";
import { CaseCounter, runs } from "./_fuzz.ts";

const STAT = { rel: 1e-9 } as const;
const P = { rel: 1e-7, abs: 1e-12 } as const;
const LAMBDA = { abs: 1e-6 } as const;

/** Integer samples in ±10⁴ of sizes 8…60 with at least three distinct values. */
const ints = fc.array(fc.integer({ min: -1e4, max: 1e4 }), { minLength: 8, maxLength: 60 })
  .filter((x) => new Set(x).size >= 3);
/** An exact affine map: c, k and a sign. */
const affine = fc.record({
  c: fc.integer({ min: -1e4, max: 1e4 }),
  k: fc.integer({ min: -40, max: 40 }),
  negate: fc.boolean(),
});
/** A permutation, as sort keys. */
const shuffled = <T>(x: readonly T[], keys: readonly number[]): T[] =>
  x.map((v, i) => [keys[i % keys.length] + i * 1e-9, v] as const).sort((a, b) => a[0] - b[0])
    .map((p) => p[1]);
const keysArb = fc.array(fc.double({ min: 0, max: 1, noNaN: true }), {
  minLength: 1,
  maxLength: 60,
});

const TESTS: readonly [string, (x: number[]) => TestResult, boolean][] = [
  ["shapiroWilk", shapiroWilk, true],
  ["shapiroFrancia", shapiroFrancia, true],
  ["andersonDarling", andersonDarling, true],
  ["lilliefors", lilliefors, true],
  ["dagostinoPearson", dagostinoPearson, false],
  ["jarqueBera", jarqueBera, false],
];

function _same(a: TestResult, b: TestResult, what: string): void {
  assert.equal(b.n, a.n, `${what}: n`);
  assertClose(b.statistic, a.statistic, STAT, `${what}: statistic`);
  assertClose(b.pValue, a.pValue, P, `${what}: p`);
}

for (const [name, run, sorts] of TESTS) {
  Deno.test(`invariance: ${name} under reordering and x → 2^k·(c + x), x → −x`, () => {
    const cases = new CaseCounter(`invariance ${name}`);
    fc.assert(
      fc.property(ints, affine, keysArb, (x, { c, k, negate }, keys) => {
        cases.add();
        const what = `${name} c=${c} k=${k} negate=${negate}`;
        const r = run(x);
        const perm = run(shuffled(x, keys));
        if (sorts) assert.deepEqual(perm, r, `${what}: reordering changes the result`);
        else _same(r, perm, `${what} (reordered)`);
        const b = (negate ? -1 : 1) * 2 ** k;
        _same(r, run(x.map((v) => b * (c + v))), what);
      }),
      { seed: 20261220, numRuns: runs(800) },
    );
    cases.report();
  });
}

Deno.test("invariance: moments are equivariant under x → 2^k·(c + x) and invariant to order", () => {
  const cases = new CaseCounter("invariance moments");
  fc.assert(
    fc.property(ints, affine, keysArb, (x, { c, k, negate }, keys) => {
      cases.add();
      const what = `moments c=${c} k=${k} negate=${negate}`;
      const m = moments(x);
      const p = moments(shuffled(x, keys));
      for (const f of ["mean", "sd", "g1", "g2", "G1", "G2"] as const) {
        assertClose(p[f], m[f], { rel: 1e-9, abs: 1e-9 * m.sd }, `${what}: ${f} reordered`);
      }
      const b = (negate ? -1 : 1) * 2 ** k;
      const y = moments(x.map((v) => b * (c + v)));
      assertClose(y.mean, b * (c + m.mean), { rel: 1e-9, abs: 1e-9 * y.sd }, `${what}: mean`);
      assertClose(y.sd, Math.abs(b) * m.sd, STAT, `${what}: sd`);
      // Skewness is a ratio of central moments: the centring error scales with |c|/sd.
      const shape = { rel: 1e-9, abs: 1e-9 * (1 + Math.abs(c + m.mean) / m.sd) };
      assertClose(y.g1, (negate ? -1 : 1) * m.g1, shape, `${what}: g1`);
      assertClose(y.g2, m.g2, shape, `${what}: g2`);
      assert.equal(y.seG1, m.seG1, `${what}: seG1 depends on n only`);
    }),
    { seed: 20261221, numRuns: runs(1000) },
  );
  cases.report();
});

Deno.test("invariance: Box–Cox λ̂ and its interval under x → 2^k·x and reordering", () => {
  const cases = new CaseCounter("invariance boxCoxFit");
  let worst = 0;
  const positive = fc.array(fc.integer({ min: 1, max: 1e4 }), { minLength: 5, maxLength: 60 })
    .filter((x) => new Set(x).size >= 3);
  fc.assert(
    fc.property(positive, fc.integer({ min: -40, max: 40 }), keysArb, (x, k, keys) => {
      cases.add();
      const what = `boxCoxFit k=${k}`;
      const f = boxCoxFit(x);
      const g = boxCoxFit(x.map((v) => 2 ** k * v));
      const h = boxCoxFit(shuffled(x, keys));
      for (const [other, how] of [[g, "scaled"], [h, "reordered"]] as const) {
        assertClose(other.lambda, f.lambda, LAMBDA, `${what}: λ̂ ${how}`);
        worst = Math.max(worst, Math.abs(other.lambda - f.lambda));
        for (const i of [0, 1] as const) {
          const a = f.ci[i];
          const b = other.ci[i];
          assert.equal(b === null, a === null, `${what}: ci[${i}] open ${how}`);
          if (a !== null && b !== null) assertClose(b, a, LAMBDA, `${what}: ci[${i}] ${how}`);
        }
      }
    }),
    { seed: 20261222, numRuns: runs(400) },
  );
  console.log(`largest |Δλ̂| seen (Box–Cox): ${worst.toExponential(2)}`);
  cases.report();
});

Deno.test("invariance: Yeo–Johnson λ̂ under reordering (it is not scale invariant)", () => {
  const cases = new CaseCounter("invariance yeoJohnsonFit");
  const small = fc.array(fc.integer({ min: -50, max: 50 }), { minLength: 5, maxLength: 60 })
    .filter((x) => new Set(x).size >= 3);
  fc.assert(
    fc.property(small, keysArb, (x, keys) => {
      cases.add();
      const f = yeoJohnsonFit(x);
      const g = yeoJohnsonFit(shuffled(x, keys));
      assertClose(g.lambda, f.lambda, LAMBDA, "yeoJohnsonFit λ̂ reordered");
      for (const i of [0, 1] as const) {
        const a = f.ci[i];
        const b = g.ci[i];
        assert.equal(b === null, a === null, `yeoJohnsonFit ci[${i}] open`);
        if (a !== null && b !== null) assertClose(b, a, LAMBDA, `yeoJohnsonFit ci[${i}]`);
      }
    }),
    { seed: 20261223, numRuns: runs(400) },
  );
  cases.report();
});

Deno.test("invariance: the chain's Shapiro–Wilk and the search's choice under exact maps", () => {
  const cases = new CaseCounter("invariance plumb+search");
  fc.assert(
    fc.property(ints, affine, keysArb, (x, { c, k, negate }, keys) => {
      cases.add();
      const what = `plumb c=${c} k=${k} negate=${negate}`;
      const a = plumb(x).analysis();
      const b = (negate ? -1 : 1) * 2 ** k;
      const t = plumb(shuffled(x.map((v) => b * (c + v)), keys)).analysis();
      assert.equal(t.n, a.n);
      assertClose(t.primary.statistic, a.primary.statistic, STAT, `${what}: W`);
      assertClose(t.primary.pValue, a.primary.pValue, P, `${what}: p`);
      // The search ranks by 1 − W′, which sorting makes independent of order.
      const s = searchReexpressions(x);
      const u = searchReexpressions(shuffled(x, keys));
      assert.deepEqual(
        u.candidates.map((q) => q.reexpression.kind),
        s.candidates.map((q) => q.reexpression.kind),
        `${what}: search order reordered`,
      );
      const id = (r: typeof s) => r.candidates.find((q) => q.reexpression.kind === "identity")!;
      assertClose(id(u).departure, id(s).departure, STAT, `${what}: identity departure`);
    }),
    { seed: 20261224, numRuns: runs(300) },
  );
  cases.report();
});
