import { equal, ok } from "node:assert/strict";
import jStat from "jstat";
import { seededRandom } from "../../lib/numeric/random.ts";
import { backTransformMean } from "../../lib/reexpress/back_transform.ts";
import { reexpression } from "../../lib/reexpress/reexpression.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import { yeoJohnsonFit } from "../../lib/reexpress/yeo_johnson_fit.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/reexpress.json", import.meta.url)),
) as {
  library: Record<string, string>;
  tQuantiles: { p: number; df: number; q: number }[];
};
const spSrc = `scipy.stats.t.ppf, scipy ${fixture.library.scipy}`;

Deno.test(`jStat's studentt.inv agrees with ${spSrc} to 1e-7 relative`, () => {
  // Tolerance stated before measuring: 1e-7 relative is far below the sampling error of
  // any interval built from it. (Measured worst case: 2.9e-8, at df = 99999, p = 0.975.)
  for (const { p, df, q } of fixture.tQuantiles) {
    assertClose(
      jStat.studentt.inv(p, df),
      q,
      { rel: 1e-7 },
      `t quantile p=${p} df=${df}, ${spSrc}`,
    );
  }
});

const rng = seededRandom(99);
const x = Array.from({ length: 30 }, () => Math.exp(1 + 0.7 * rng.normal()));

Deno.test("log: geometric mean and a ratio interval", () => {
  const b = backTransformMean(x, reexpression("log"));
  const logs = x.map(Math.log);
  const m = logs.reduce((a, v) => a + v, 0) / x.length;
  assertClose(b.estimate, Math.exp(m), { rel: 1e-14 }, "exp(mean ln x)");
  equal(b.estimateName, "geometric mean");
  ok(b.intervalName.includes("ratio interval"));
  // Ratio interval: GM ×/÷ factor, symmetric on the log scale.
  assertClose(b.interval[1]! / b.estimate, b.ratio!, { rel: 1e-14 }, "upper = GM × factor");
  assertClose(b.estimate / b.interval[0]!, b.ratio!, { rel: 1e-14 }, "lower = GM ÷ factor");
  // The factor is exp(t·s/√n), t from scipy (fixture, df = 29): jStat's 1e-8 difference
  // moves it by less than 1e-8 relative.
  const t29 = fixture.tQuantiles.find((r) => r.df === 29 && r.p === 0.975)!.q;
  assertClose(b.ratio!, Math.exp((t29 * b.transformedSd) / Math.sqrt(30)), { rel: 1e-8 }, "factor");
  ok(b.cautions.some((c) => c.includes("not the arithmetic mean")));
  // Base 10 gives the same geometric mean and factor.
  const b10 = backTransformMean(x, reexpression("log", { base: 10 }));
  assertClose(b10.estimate, b.estimate, { rel: 1e-13 }, "base-10 geometric mean");
  assertClose(b10.ratio!, b.ratio!, { rel: 1e-13 }, "base-10 factor");
});

Deno.test("as measured: the arithmetic mean and its t interval", () => {
  const b = backTransformMean(x, reexpression("identity"));
  const m = x.reduce((a, v) => a + v, 0) / x.length;
  assertClose(b.estimate, m, { rel: 1e-14 }, "mean");
  equal(b.estimateName, "arithmetic mean");
  assertClose((b.interval[0]! + b.interval[1]!) / 2, m, { rel: 1e-14 }, "symmetric");
  equal(b.cautions.length, 0);
});

Deno.test("reciprocal: harmonic mean, interval ends swapped into order", () => {
  const b = backTransformMean(x, reexpression("reciprocal"));
  const h = x.length / x.reduce((a, v) => a + 1 / v, 0);
  assertClose(b.estimate, h, { rel: 1e-14 }, "harmonic mean");
  equal(b.estimateName, "harmonic mean");
  ok(b.interval[0]! < b.estimate && b.estimate < b.interval[1]!);
});

Deno.test("power re-expressions: a median estimate, close to the sample median", () => {
  const big = Array.from({ length: 20000 }, () => Math.exp(2 + 0.9 * rng.normal()));
  const sorted = [...big].sort((a, b) => a - b);
  const median = (sorted[9999] + sorted[10000]) / 2;
  const mean = big.reduce((a, v) => a + v, 0) / big.length;
  const fitted = [
    reexpression("box-cox", { lambda: boxCoxFit(big).lambda }),
    reexpression("yeo-johnson", { lambda: yeoJohnsonFit(big).lambda }),
  ];
  for (const r of fitted) {
    const b = backTransformMean(big, r);
    equal(b.estimateName, "median (estimated)");
    // Log-normal data, fitted λ (so the re-expressed values are near symmetric): the
    // back-transformed mean lands near the median (e² ≈ 7.39), far from the arithmetic
    // mean (≈ 11.1); 5% covers sampling error.
    ok(Math.abs(b.estimate / median - 1) < 0.05, `${r.label}: ${b.estimate} vs median ${median}`);
    ok(Math.abs(b.estimate / mean - 1) > 0.2);
    ok(b.cautions.some((c) => c.includes("medians to medians")));
  }
});

Deno.test("an interval end outside the re-expression's range is null, with a caution", () => {
  // Box–Cox λ = 2 maps x > 0 onto y > −1/2; the lower t limit here falls below −1/2.
  const b = backTransformMean([0.01, 0.02, 0.03, 3], reexpression("box-cox", { lambda: 2 }));
  equal(b.interval[0], null);
  ok(typeof b.interval[1] === "number");
  ok(b.cautions.some((c) => c.includes("lower end") && c.includes("open")));
  ok(Object.isFrozen(b) && Object.isFrozen(b.interval) && Object.isFrozen(b.cautions));
});

Deno.test("shifted log: named for what it is, with a caution about the shift", () => {
  const b = backTransformMean([0, 0, 1, 3, 8, 2, 5], reexpression("log", { shift: 0.5 }));
  equal(b.estimateName, "geometric mean of (x + 0.5), minus 0.5");
  equal(b.ratio, null);
  ok(b.cautions[0].includes("depends on the shift"));
});

Deno.test("bad input: level, size and domain, each with a message that says what to do", () => {
  assertPlumbError(
    () => backTransformMean([1, 2, 3], reexpression("log"), { level: 95 }),
    "bad-option",
    /^Cannot compute a back-transformed mean at level 95: the level must lie strictly between 0 and 1, e\.g\. 0\.95$/,
  );
  assertPlumbError(
    () => backTransformMean([1], reexpression("log")),
    "too-few",
    /^Cannot run a back-transformed mean on 1 value: at least 2 are needed$/,
  );
  assertPlumbError(
    () => backTransformMean([1, 0], reexpression("log")),
    "non-positive",
    /^Cannot apply the log transformation to values ≤ 0: 1 of 2 .*add a shift first/,
  );
});
