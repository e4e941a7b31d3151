// Rank-based quantiles and their distribution-free intervals, and the
// Clopper–Pearson interval, against R 4.2.2 (tests/fixtures/
// stakes_distributions.json, written by tools/fixtures/stakes_distributions.R:
// quantile(type = 6), pbinom, binom.test), plus exact coverage properties.
import { deepEqual, equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { binomialCdf } from "../../lib/numeric/binomial.ts";
import { clopperPearson } from "../../lib/stats/proportion_interval.ts";
import { quantileInterval, quantileRanks } from "../../lib/stats/quantile_interval.ts";
import { rankQuantile } from "../../lib/stats/rank_quantile.ts";
import { assertClose } from "../_assert_close.ts";

interface Fixture {
  library: { R: string };
  clopperPearson: { k: number; n: number; level: number; interval: number[] }[];
  quantile6: { x: number[]; p: number[]; q: number[] }[];
}
const fx = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/stakes_distributions.json", import.meta.url)),
) as Fixture;

Deno.test("rankQuantile equals R quantile(type = 6) to 1e-15 relative, n = 1 … 2000", () => {
  // The interpolation is one multiply-add; R forms it the same way, so the
  // tolerance is a few ulps (1e-15 relative), not a modelling error.
  for (const c of fx.quantile6) {
    c.p.forEach((p, i) => {
      assertClose(
        rankQuantile(c.x, p),
        c.q[i],
        { rel: 1e-15 },
        `n ${c.x.length}, p ${p} vs R ${fx.library.R}`,
      );
    });
  }
});

Deno.test("clopperPearson matches R binom.test to 1e-12 relative", () => {
  for (const c of fx.clopperPearson) {
    const [lo, hi] = clopperPearson(c.k, c.n, { level: c.level });
    const ctx = `${c.k} of ${c.n} at ${c.level} vs R ${fx.library.R} binom.test`;
    assertClose(lo, c.interval[0], { rel: 1e-12, abs: 0 }, `lower, ${ctx}`);
    assertClose(hi, c.interval[1], { rel: 1e-12 }, `upper, ${ctx}`);
  }
});

Deno.test("quantileRanks: coverage ≥ level and equal to the binomial sum (R pbinom), n = 1 … 5000", () => {
  for (const n of [1, 5, 20, 39, 59, 60, 119, 120, 121, 153, 240, 500, 1000, 5000]) {
    for (const p of [0.025, 0.05, 0.5, 0.95, 0.975]) {
      const r = quantileRanks(n, p);
      const [a, b] = r.ranks;
      const cov = binomialCdf(b - 1, n, p) - binomialCdf(a - 1, n, p);
      equal(r.coverage, cov);
      ok(r.coverage >= 0.9, `n ${n} p ${p}: coverage ${r.coverage}`);
      // equal tails: each tail below (1 − level)/2 = 0.05
      ok(binomialCdf(a - 1, n, p) <= 0.05 && 1 - binomialCdf(b - 1, n, p) <= 0.05 + 1e-15);
      ok(a >= 0 && b <= n + 1 && a < b);
    }
  }
  // CLSI EP28-A3c's table for n = 120 (from memory): ranks 1–7 and 114–120.
  deepEqual(quantileRanks(120, 0.025).ranks, [1, 7]);
  deepEqual(quantileRanks(120, 0.975).ranks, [114, 120]);
});

Deno.test("quantileInterval: ends are the order statistics at the ranks, open ends are null", () => {
  const x = Array.from({ length: 30 }, (_, i) => 30 - i); // 30 … 1, unsorted
  const lo = quantileInterval(x, 0.025);
  equal(lo.ranks[0], 0); // too few values for a bounded lower end
  equal(lo.interval[0], null);
  equal(lo.interval[1], lo.ranks[1]); // value i at rank i
  const mid = quantileInterval(x, 0.5);
  deepEqual(mid.interval, [mid.ranks[0], mid.ranks[1]]);
  ok(Object.isFrozen(mid) && Object.isFrozen(mid.interval));
});

Deno.test("Clopper–Pearson coverage is at least the level for every true p (exact enumeration)", () => {
  for (const n of [5, 17, 60]) {
    const ints = Array.from({ length: n + 1 }, (_, k) => clopperPearson(k, n));
    for (let j = 1; j < 200; j++) {
      const p = j / 200;
      let cov = 0;
      for (let k = 0; k <= n; k++) {
        if (ints[k][0] <= p && p <= ints[k][1]) {
          cov += binomialCdf(k, n, p) - binomialCdf(k - 1, n, p);
        }
      }
      ok(cov >= 0.95 - 1e-12, `n ${n}, p ${p}: coverage ${cov}`);
    }
  }
});

Deno.test("errors: bad p, bad level, bad counts, too few values", () => {
  const is = (code: string, re: RegExp) => (e: unknown) =>
    e instanceof PlumbError && e.code === code && re.test(e.message);
  throws(
    () => rankQuantile([1, 2], 1.5),
    is("bad-option", /^Cannot compute a sample quantile at p = 1\.5: /),
  );
  throws(() => rankQuantile([], 0.5), is("too-few", /at least 1/));
  throws(() => rankQuantile([1, NaN], 0.5), is("non-finite", /not finite/));
  throws(() => quantileRanks(10, 0), is("bad-option", /strictly between 0 and 1/));
  throws(() => quantileRanks(10, 0.5, { level: 1 }), is("bad-option", /level 1/));
  throws(() => clopperPearson(3, 2), is("bad-option", /3 out of 2/));
  throws(() => clopperPearson(0.5, 2), is("bad-option", /whole numbers/));
});
