import fc from "fast-check";
import { assertClose } from "../_assert_close.ts";
import { betaCdfPair, betaQuantile } from "../../lib/numeric/beta.ts";

interface Case {
  n: number;
  p: number;
  ranks: number[];
  qbeta: number[];
}
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/envelope.json", import.meta.url)),
) as { library: { R: string }; source: string; cases: Case[] };

// Tolerance, stated before the checks: quantiles of Beta(i, n − i + 1) within
// 1e-12 relative of R's qbeta.
const Q_TOL = { rel: 1e-12 };

Deno.test("order-statistic quantiles match R's qbeta for n = 1 … 1e6", () => {
  for (const c of fixture.cases) {
    c.ranks.forEach((i, k) => {
      assertClose(
        betaQuantile(c.p, i, c.n - i + 1),
        c.qbeta[k],
        Q_TOL,
        `qbeta(${c.p}, ${i}, ${c.n - i + 1}) from R ${fixture.library.R}`,
      );
    });
  }
});

Deno.test("property: the incomplete beta at the computed quantile gives back p", () => {
  // Where the quantile x is above ½ its own rounding (1 ulp of x, large
  // relative to 1 − x) limits any back-substitution, so there the mirrored
  // statistic is checked instead: U(i) = 1 − U(n + 1 − i) in distribution.
  fc.assert(
    fc.property(
      fc.integer({ min: 2, max: 200000 }),
      fc.double({ min: 0, max: 1, noNaN: true }),
      fc.double({ min: 1e-6, max: 1 - 1e-6, noNaN: true }),
      (n, u, p) => {
        const i = 1 + Math.min(n - 1, Math.floor(u * n));
        const x = betaQuantile(p, i, n - i + 1);
        if (x > 0.5) {
          const mirror = betaQuantile(1 - p, n + 1 - i, i);
          assertClose(x + mirror, 1, { abs: 1e-15 }, `U(${i}) + U(${n + 1 - i}) mirrored at ${p}`);
          return;
        }
        const [lower, upper] = betaCdfPair(x, i, n - i + 1);
        // back-substitution tolerance: 1e-10 relative on the smaller tail
        // (the quantile is accurate to 1e-12; the density scales that back)
        if (p <= 0.5) assertClose(lower, p, { rel: 1e-10 }, `I(x; ${i}, ${n - i + 1}) = ${p}`);
        else assertClose(upper, 1 - p, { rel: 1e-10 }, `1 − I(x; ${i}, ${n - i + 1}) = ${1 - p}`);
      },
    ),
    { seed: 20261201, numRuns: 300 },
  );
});
