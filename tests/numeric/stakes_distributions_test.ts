// The chi-square and binomial functions against R 4.2.2 (tests/fixtures/
// stakes_distributions.json, written by tools/fixtures/stakes_distributions.R),
// plus round trips and special cases.
import { equal, ok } from "node:assert/strict";
import { binomialCdf, binomialQuantile } from "../../lib/numeric/binomial.ts";
import { chiSquareQuantile, gammaCdfPair, logGamma } from "../../lib/numeric/gamma.ts";
import { assertClose } from "../_assert_close.ts";

interface Fixture {
  library: { R: string };
  chisq: { df: number; p: number[]; q: number[]; lowerAtQ: number[]; upperAtQ: number[] }[];
  binomial: { n: number; p: number; k: number[]; cdf: number[]; q: number[]; quantile: number[] }[];
}
const fx = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/stakes_distributions.json", import.meta.url)),
) as Fixture;
const src = `R ${fx.library.R}`;

// Tolerances, stated before the checks: 1e-12 relative for quantiles and
// distribution functions (the beta and gamma routines reach a few 1e-14;
// 1e-12 leaves room for the conditioning of the t and χ² maps), with an
// absolute floor of 1e-300 for probabilities that underflow.
const REL = { rel: 1e-12, abs: 1e-300 };

Deno.test("chiSquareQuantile matches R qchisq to 1e-12 relative, df 1 … 1e7", () => {
  for (const c of fx.chisq) {
    c.p.forEach((p, i) => {
      assertClose(chiSquareQuantile(p, c.df), c.q[i], REL, `qchisq(${p}, ${c.df}) vs ${src}`);
    });
  }
});

Deno.test("gammaCdfPair matches R pchisq (both tails) to 1e-12 relative", () => {
  for (const c of fx.chisq) {
    c.q.forEach((q, i) => {
      const [lo, up] = gammaCdfPair(c.df / 2, q / 2);
      const ctx = `pchisq(${q}, ${c.df}) vs ${src}`;
      assertClose(lo, c.lowerAtQ[i], REL, `lower ${ctx}`);
      assertClose(up, c.upperAtQ[i], REL, `upper ${ctx}`);
    });
  }
});

Deno.test("binomialCdf matches R pbinom to 1e-12 relative; binomialQuantile equals qbinom", () => {
  for (const c of fx.binomial) {
    c.k.forEach((k, i) => {
      assertClose(
        binomialCdf(k, c.n, c.p),
        c.cdf[i],
        REL,
        `pbinom(${k}, ${c.n}, ${c.p}) vs ${src}`,
      );
    });
    c.q.forEach((q, i) => {
      equal(binomialQuantile(q, c.n, c.p), c.quantile[i], `qbinom(${q}, ${c.n}, ${c.p}) vs ${src}`);
    });
  }
});

Deno.test("logGamma: factorials and Γ(½) = √π (exact values)", () => {
  // log Γ has zeros at 1 and 2, where only absolute accuracy means anything:
  // 1e-14 relative or 1e-14 absolute.
  let f = 1;
  for (let k = 1; k <= 30; k++) {
    assertClose(logGamma(k + 1), Math.log(f *= k), { rel: 1e-14, abs: 1e-14 }, `log ${k}!`);
  }
  assertClose(logGamma(0.5), 0.5 * Math.log(Math.PI), { rel: 1e-14 }, "log Γ(½)");
  assertClose(logGamma(1e-300), 690.7755278982137, { rel: 1e-14 }, "log Γ(1e-300) ≈ −log 1e-300");
});

Deno.test("binomialQuantile is the smallest k with cdf ≥ q (exhaustive for small n)", () => {
  for (const n of [1, 2, 7, 30]) {
    for (const p of [0.01, 0.3, 0.5, 0.97]) {
      for (const q of [0.001, 0.05, 0.5, 0.95, 0.999]) {
        const k = binomialQuantile(q, n, p);
        ok(binomialCdf(k, n, p) >= q * (1 - 1e-14), `cdf at k, n ${n} p ${p} q ${q}`);
        ok(k === 0 || binomialCdf(k - 1, n, p) < q, `cdf below k, n ${n} p ${p} q ${q}`);
      }
    }
  }
});

Deno.test("special cases: χ² ends, NaN for bad input, binomial edges", () => {
  equal(chiSquareQuantile(0, 3), 0);
  equal(chiSquareQuantile(1, 3), Infinity);
  ok(Number.isNaN(chiSquareQuantile(-0.1, 3)));
  equal(binomialCdf(-1, 10, 0.5), 0);
  equal(binomialCdf(10, 10, 0.5), 1);
  equal(binomialCdf(3, 10, 0), 1);
  equal(binomialCdf(3, 10, 1), 0);
  equal(binomialQuantile(0.5, 10, 0), 0);
  equal(binomialQuantile(0.5, 10, 1), 10);
  ok(Number.isNaN(binomialQuantile(0.5, 10, 2)));
});
