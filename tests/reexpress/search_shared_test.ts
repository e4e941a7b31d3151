/**
 * The search ranks on one shared sort and re-tests on demand; every number
 * must be exactly what the public functions give on each re-expressed
 * sample (the same doubles, not merely close).
 */
import { deepEqual, equal, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { randomSubsample, seededRandom } from "../../lib/numeric/random.ts";
import { _departure } from "../../lib/reexpress/_departure.ts";
import { applyReexpression } from "../../lib/reexpress/reexpression.ts";
import { rankReexpressions, searchReexpressions, testRanking } from "../../lib/reexpress/search.ts";
import { NORMALITY_TESTS } from "../../lib/stats/battery.ts";
import { moments } from "../../lib/stats/moments.ts";

function sample(n: number, seed: number, kind: string): number[] {
  const rng = seededRandom(seed);
  return Array.from({ length: n }, (_, i) => {
    const z = rng.normal();
    if (kind === "lognormal") return Math.exp(0.9 * z);
    if (kind === "negative") return -Math.exp(0.5 * z); // one sign: the reciprocal reverses
    if (kind === "zeros") return i % 9 === 0 ? 0 : Math.round(Math.exp(z) * 20) / 4;
    return 3 + z; // both signs: Yeo–Johnson
  });
}

function outcome(run: (y: Float64Array) => unknown, y: Float64Array) {
  try {
    return { result: run(y), note: null };
  } catch (e) {
    if (!(e instanceof PlumbError)) throw e;
    return { result: null, note: e.message };
  }
}

const CASES: [number, string][] = [
  [3, "lognormal"],
  [12, "negative"],
  [40, "zeros"],
  [300, "mixed"],
  [700, "lognormal"],
  [6000, "lognormal"],
];

for (const [n, kind] of CASES) {
  Deno.test(`search at n = ${n} (${kind}): each candidate exactly as the public functions`, () => {
    const x = sample(n, n + 1, kind);
    const s = searchReexpressions(x);
    const r = rankReexpressions(x);
    deepEqual(testRanking(x, r), s, "the search is the ranking re-tested");
    equal(s.candidates.length, r.candidates.length);
    for (const [k, c] of s.candidates.entries()) {
      const { tests, skewness, excessKurtosis, ...ranked } = c;
      deepEqual(ranked, r.candidates[k], "the ranking is the search without its tests");
      const y = applyReexpression(x, c.reexpression);
      equal(c.departure, _departure(y), c.reexpression.label);
      const m = n >= 4 ? moments(y) : null;
      equal(skewness, m?.g1 ?? null);
      equal(excessKurtosis, m?.g2 ?? null);
      NORMALITY_TESTS.forEach((t, j) => {
        // Above 5000 values Shapiro–Wilk runs on the chain's seeded subsample.
        const sub = t.name === "Shapiro–Wilk" && n > 5000;
        const expected = outcome(t.run, sub ? randomSubsample(y, 5000, 1) : y);
        const got = tests[j].result;
        if (sub && got !== null) {
          const { method, ...rest } = got;
          const { method: _m, ...want } = expected.result as typeof got;
          deepEqual(rest, want, t.name);
          equal(method.endsWith(`on a seeded random subsample of 5000 of the ${n} values`), true);
        } else deepEqual({ result: got, note: tests[j].note }, expected, t.name);
      });
    }
  });
}

Deno.test("testRanking refuses a ranking made from other values", () => {
  const x = sample(50, 2, "lognormal");
  throws(
    () => testRanking(x.slice(1), rankReexpressions(x)),
    (e) =>
      e instanceof PlumbError && e.code === "bad-option" &&
      /ranking of 50 values on 49/.test(e.message),
  );
});
