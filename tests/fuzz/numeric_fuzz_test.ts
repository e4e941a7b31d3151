/**
 * Numeric fuzz: every test, the moments, the λ fits, the re-expression search
 * and the chain, on random finite samples with extreme values (subnormals,
 * ±1e308, 1e308 beside 1e-308, values a few bits apart) at every size
 * boundary. Each call returns finite, in-range fields or throws a
 * `PlumbError` with a code; nothing else.
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
  survey,
  yeoJohnsonFit,
} from "../../mod.ts";
import type { TestResult } from "../../lib/stats/result.ts";
import type { LambdaFit } from "../../lib/reexpress/lambda_fit.ts";
import {
  assertAllFinite,
  CaseCounter,
  extremeSample,
  outcome,
  runs,
  SAMPLE_KINDS,
  type SampleKind,
} from "./_fuzz.ts";

/** The sample sizes at which some method's rules change. */
const SIZES = [2, 3, 4, 5, 7, 8, 11, 12, 5000, 5001] as const;

interface _Test {
  readonly name: string;
  readonly run: (x: number[]) => TestResult;
  readonly min: number;
  readonly max: number;
  /** The statistic's range, beyond finiteness. */
  readonly statistic: (s: number) => boolean;
}

const TESTS: readonly _Test[] = [
  { name: "shapiroWilk", run: shapiroWilk, min: 3, max: 5000, statistic: (w) => w > 0 && w <= 1 },
  {
    name: "shapiroFrancia",
    run: shapiroFrancia,
    min: 5,
    max: 5000,
    statistic: (w) => w > 0 && w <= 1,
  },
  {
    name: "andersonDarling",
    run: andersonDarling,
    min: 8,
    max: Infinity,
    statistic: (a) => a >= 0,
  },
  { name: "lilliefors", run: lilliefors, min: 5, max: Infinity, statistic: (d) => d > 0 && d <= 1 },
  {
    name: "dagostinoPearson",
    run: dagostinoPearson,
    min: 8,
    max: Infinity,
    statistic: (k) => k >= 0,
  },
  { name: "jarqueBera", run: jarqueBera, min: 8, max: Infinity, statistic: (j) => j >= 0 },
];

/** A sample: a kind, a size from SIZES, a seed; sometimes made constant or given a bad value. */
const sampleArb = fc.record({
  kind: fc.constantFrom(...SAMPLE_KINDS),
  n: fc.oneof(
    { weight: 12, arbitrary: fc.constantFrom(...SIZES.filter((n) => n < 100)) },
    { weight: 1, arbitrary: fc.constantFrom(5000, 5001) },
  ),
  seed: fc.integer({ min: 0, max: 2 ** 31 - 1 }),
  spoil: fc.constantFrom("none", "none", "none", "none", "constant", "nan", "infinity"),
}).map(({ kind, n, seed, spoil }) => {
  const x = extremeSample(kind as SampleKind, n, seed);
  if (spoil === "constant") x.fill(x[0]);
  if (spoil === "nan") x[seed % n] = NaN;
  if (spoil === "infinity") x[seed % n] = seed % 2 ? Infinity : -Infinity;
  return { kind, n, seed, spoil, x };
});

/** fast-check's own doubles (biased towards ±0, ±MAX_VALUE, MIN_VALUE and neighbours). */
const rawArb = fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), {
  minLength: 2,
  maxLength: 13,
}).map((x) => ({ kind: "fast-check doubles", n: x.length, seed: 0, spoil: "none", x }));

const anySample = fc.oneof({ weight: 3, arbitrary: sampleArb }, { weight: 1, arbitrary: rawArb });

function _expectedCode(x: number[], min: number, max: number): string | null {
  if (x.length < min) return "too-few";
  if (x.length > max) return "too-many";
  if (x.some((v) => !Number.isFinite(v))) return "non-finite";
  if (x.every((v) => v === x[0])) return "constant";
  return null;
}

/** The spread of values near ±1.8e308 can exceed the largest double: a stated refusal. */
function _spreadOverflow(r: { code: string; message: string }): boolean {
  return r.code === "non-finite" && /standard deviation exceeds the largest double/.test(r.message);
}

function _label(s: { kind: string; n: number; seed: number; spoil: string }): string {
  return `${s.kind} n=${s.n} seed=${s.seed} spoil=${s.spoil}`;
}

for (const t of TESTS) {
  Deno.test(`fuzz: ${t.name} gives finite, in-range results or a PlumbError`, () => {
    const cases = new CaseCounter(`numeric ${t.name}`);
    fc.assert(
      fc.property(anySample, (s) => {
        cases.add();
        const what = `${t.name} on ${_label(s)}`;
        const r = outcome(
          () => t.run(s.x),
          ["too-few", "too-many", "non-finite", "constant"],
          what,
        );
        const expected = _expectedCode(s.x, t.min, t.max);
        if (!r.ok) {
          assert.equal(r.code, expected, `${what}: error code`);
          return;
        }
        assert.equal(expected, null, `${what}: should have thrown ${expected}`);
        assertAllFinite(r.value, what);
        assert.equal(r.value.n, s.x.length, `${what}: n`);
        assert.ok(t.statistic(r.value.statistic), `${what}: statistic ${r.value.statistic}`);
        assert.ok(r.value.pValue >= 0 && r.value.pValue <= 1, `${what}: p ${r.value.pValue}`);
        assert.ok(Object.isFrozen(r.value), `${what}: frozen`);
      }),
      { seed: 20261210, numRuns: runs(1500) },
    );
    cases.report();
  });
}

Deno.test("fuzz: moments are finite or a PlumbError", () => {
  const cases = new CaseCounter("numeric moments");
  fc.assert(
    fc.property(anySample, (s) => {
      cases.add();
      const what = `moments on ${_label(s)}`;
      const r = outcome(() => moments(s.x), ["too-few", "non-finite", "constant"], what);
      const expected = _expectedCode(s.x, 4, Infinity);
      if (!r.ok && expected === null && _spreadOverflow(r)) return;
      if (!r.ok) return assert.equal(r.code, expected, `${what}: error code`);
      assert.equal(expected, null, `${what}: should have thrown ${expected}`);
      assertAllFinite(r.value, what);
      assert.equal(r.value.n, s.x.length);
      // sd ≥ 0, not > 0: the sd of [5e-324, 5e-324, 5e-324, 0] is 2^-1075, below the
      // smallest subnormal, and rounds to 0.
      assert.ok(r.value.sd >= 0, `${what}: sd ${r.value.sd}`);
      assert.ok(r.value.g2 >= -2, `${what}: g2 ${r.value.g2} below the bound −2`);
    }),
    { seed: 20261211, numRuns: runs(1500) },
  );
  cases.report();
});

function _checkFit(f: LambdaFit, what: string, n: number): void {
  assert.ok(Number.isFinite(f.lambda), `${what}: λ ${f.lambda}`);
  assert.ok(f.lambda >= f.range[0] && f.lambda <= f.range[1], `${what}: λ inside the range`);
  for (const end of f.ci) {
    assert.ok(end === null || Number.isFinite(end), `${what}: ci end ${end}`);
  }
  if (f.ci[0] !== null) assert.ok(f.ci[0] <= f.lambda, `${what}: ci[0] ≤ λ`);
  if (f.ci[1] !== null) assert.ok(f.ci[1] >= f.lambda, `${what}: ci[1] ≥ λ`);
  assert.equal(f.n, n, `${what}: n`);
  assertAllFinite(f, what);
}

for (
  const [name, fit, positive] of [["boxCoxFit", boxCoxFit, true], [
    "yeoJohnsonFit",
    yeoJohnsonFit,
    false,
  ]] as const
) {
  Deno.test(`fuzz: ${name} gives a finite λ and interval ends or a PlumbError`, () => {
    const cases = new CaseCounter(`numeric ${name}`);
    // Box–Cox needs positive data: half the samples are made positive by |x|.
    const arb = fc.tuple(anySample, fc.boolean()).map(([s, abs]) =>
      positive && abs ? { ...s, x: s.x.map(Math.abs), kind: `|${s.kind}|` } : s
    );
    fc.assert(
      fc.property(arb, (s) => {
        cases.add();
        const what = `${name} on ${_label(s)}`;
        const codes = ["too-few", "non-finite", "constant", "non-positive", "no-convergence"];
        const r = outcome(() => fit(s.x), codes, what);
        let expected = _expectedCode(s.x, 3, Infinity);
        if (expected === "constant" && positive && s.x.some((v) => !(v > 0))) {
          expected = "non-positive"; // positivity is checked before the spread
        }
        if (!r.ok) {
          if (r.code === "non-positive") {
            assert.ok(positive && s.x.some((v) => !(v > 0)), `${what}: non-positive`);
          } else if (r.code !== "no-convergence") assert.equal(r.code, expected, what);
          return;
        }
        assert.equal(expected, null, `${what}: should have thrown ${expected}`);
        _checkFit(r.value, what, s.x.length);
      }),
      { seed: 20261212, numRuns: runs(1000) },
    );
    cases.report();
  });
}

Deno.test("fuzz: searchReexpressions ranks finite candidates or throws a PlumbError", () => {
  const cases = new CaseCounter("numeric searchReexpressions");
  fc.assert(
    fc.property(anySample, (s) => {
      cases.add();
      const what = `searchReexpressions on ${_label(s)}`;
      const codes = ["too-few", "non-finite", "constant", "no-convergence"];
      const r = outcome(() => searchReexpressions(s.x), codes, what);
      if (!r.ok) {
        if (r.code !== "no-convergence") {
          assert.equal(r.code, _expectedCode(s.x, 3, Infinity), what);
        }
        return;
      }
      assert.equal(r.value.n, s.x.length);
      assert.equal(r.value.chosen, r.value.candidates[0]);
      assertAllFinite(r.value, what);
      for (const c of r.value.candidates) {
        for (const t of c.tests) {
          if (t.result === null) continue;
          assert.ok(t.result.pValue >= 0 && t.result.pValue <= 1, `${what}: ${t.test} p`);
        }
      }
      if (r.value.boxCox) _checkFit(r.value.boxCox, `${what} (Box–Cox)`, s.x.length);
      if (r.value.yeoJohnson) _checkFit(r.value.yeoJohnson, `${what} (Yeo–Johnson)`, s.x.length);
    }),
    { seed: 20261213, numRuns: runs(600) },
  );
  cases.report();
});

Deno.test("fuzz: plumb(x).analysis() and survey are finite or throw a PlumbError", () => {
  const cases = new CaseCounter("numeric plumb+survey");
  // Non-finite cells are missing or text in a table, so the chain gets finite samples only.
  const finite = anySample.filter((s) => s.x.every(Number.isFinite));
  fc.assert(
    fc.property(finite, (s) => {
      cases.add();
      const what = `plumb on ${_label(s)}`;
      const codes = ["too-few", "constant", "no-convergence", "non-finite"];
      const r = outcome(() => plumb(s.x).analysis(), codes, what);
      if (!r.ok && r.code === "non-finite") assert.ok(_spreadOverflow(r), `${what}: ${r.message}`);
      if (r.ok) {
        assert.equal(r.value.n, s.x.length, `${what}: n`);
        assert.ok(r.value.primary.statistic > 0 && r.value.primary.statistic <= 1, `${what}: W`);
        assertAllFinite(r.value, what);
      } else if (r.code === "too-few") assert.ok(s.x.length < 4, `${what}: too-few`);
      const sv = outcome(() => survey({ a: s.x, b: s.x.map((v) => -v) }).result(), [], what);
      if (sv.ok) {
        assert.equal(sv.value.rows.length, 2);
        assertAllFinite(sv.value, `survey on ${_label(s)}`);
      }
    }),
    { seed: 20261214, numRuns: runs(400) },
  );
  cases.report();
});
