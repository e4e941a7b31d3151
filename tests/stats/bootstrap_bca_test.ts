// BCa intervals against R's boot package on identical replicates
// (tests/fixtures/stakes_bootstrap.json, written by
// tools/fixtures/stakes_bootstrap.R), live against boot.ci on plumbline's own
// seeded resamples, and the determinism of the seeded bootstrap.
import { deepEqual, equal, notDeepEqual, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { normalCdf, normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { _meanReplicates, bcaInterval, bootstrapMean } from "../../lib/stats/bootstrap_bca.ts";
import { moments } from "../../lib/stats/moments.ts";
import { assertClose } from "../_assert_close.ts";
import { RSCRIPT, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

interface Case {
  name: string;
  x: number[];
  t0: number;
  t: number[];
  bca: { level: number; interval: [number, number] }[];
  accelerationDefault: number;
}
const fx = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/stakes_bootstrap.json", import.meta.url)),
) as { library: { R: string; boot: string }; cases: Case[] };

const accel = (x: number[]) => moments(x).g1 / (6 * Math.sqrt(x.length));

// Tolerance, stated before the checks: 1e-12 relative. Both sides sort the same
// replicates and interpolate between the same two order statistics; they differ
// only in Φ and Φ⁻¹ (plumbline's within 1e-14 of mpmath, R's within a few ulps)
// and in how the acceleration's sums are rounded.
Deno.test("bcaInterval equals R boot.ci(type = 'bca') on boot's own replicates, 1e-12 relative", () => {
  for (const c of fx.cases) {
    for (const { level, interval } of c.bca) {
      const r = bcaInterval(c.t0, c.t, { acceleration: accel(c.x), level });
      const ctx = `${c.name}, level ${level}, vs R ${fx.library.R}, boot ${fx.library.boot}`;
      assertClose(r.interval[0]!, interval[0], { rel: 1e-12 }, `lower, ${ctx}`);
      assertClose(r.interval[1]!, interval[1], { rel: 1e-12 }, `upper, ${ctx}`);
    }
  }
});

Deno.test("the acceleration g₁/(6√n) equals R's default influence values (empinf 'inf') to 1e-6", () => {
  // boot's default for a weighted statistic differentiates numerically with
  // step ε = 0.001/n, so its Lᵢ carry a relative error of about
  // n·|x̄|/(sd·1000)·2⁻⁵² ≤ 1e-8 on these cases (|x̄|/sd ≤ 130, n ≤ 120); a, a
  // ratio of sums of cubes and squares of the Lᵢ, inherits a few times that.
  // 1e-6 relative bounds it with room; the exact check is the test above.
  for (const c of fx.cases) {
    assertClose(
      accel(c.x),
      c.accelerationDefault,
      { rel: 1e-6 },
      `${c.name} vs R ${fx.library.R}, boot ${fx.library.boot}`,
    );
  }
});

Deno.test("bootstrapMean is deterministic: same data and seed, same interval; another seed differs", () => {
  const x = fx.cases[2].x;
  const a = bootstrapMean(x);
  const b = bootstrapMean(Float64Array.from(x));
  deepEqual(a, b);
  notDeepEqual(a.interval, bootstrapMean(x, { seed: 2 }).interval);
  equal(a.resamples, 2000);
  ok(Object.isFrozen(a) && Object.isFrozen(a.interval) && Object.isFrozen(a.notes));
  // it is the BCa step applied to the seeded replicates, nothing else
  const v = Float64Array.from(x);
  const again = bcaInterval(moments(x).mean, _meanReplicates(v, 2000, 1), {
    acceleration: accel(x),
  });
  deepEqual(a.interval, again.interval);
});

Deno.test("bcaInterval: no bias, no acceleration gives the percentile interval; extremes are noted", () => {
  // R = 100 replicates 1 … 100 and t₀ = 50.5: half below, so w = 0; with a = 0
  // the ends are the α-quantiles at rank 101·α, here 5.05 and 95.95, interpolated
  // on the normal scale between neighbours (Davison & Hinkley 1997, eq. 5.8).
  const t = Float64Array.from({ length: 100 }, (_, i) => i + 1);
  const r = bcaInterval(50.5, t, { acceleration: 0, level: 0.9 });
  equal(r.bias, 0);
  deepEqual(r.adjustedLevels, [normalCdf(normalQuantile(0.05)), normalCdf(normalQuantile(0.95))]);
  const between = (k: number, p: number) =>
    k + (normalQuantile(p) - normalQuantile(k / 101)) /
      (normalQuantile((k + 1) / 101) - normalQuantile(k / 101));
  assertClose(r.interval[0]!, between(5, r.adjustedLevels[0]), { rel: 1e-15 }, "lower end");
  assertClose(r.interval[1]!, between(95, r.adjustedLevels[1]), { rel: 1e-15 }, "upper end");
  equal(r.notes.length, 0);
  const skew = bcaInterval(50, t, { acceleration: 0.4, level: 0.99 });
  ok(skew.notes.some((s) => /extreme bootstrap replicate/.test(s)), skew.notes.join());
  const none = bcaInterval(0, t, { acceleration: 0 });
  deepEqual(none.interval, [null, null]);
  ok(/bias correction is infinite/.test(none.notes[0]));
});

Deno.test("bootstrapMean errors: too few, constant, bad resamples, bad seed, bad level", () => {
  const is = (code: string, re: RegExp) => (e: unknown) =>
    e instanceof PlumbError && e.code === code && re.test(e.message);
  throws(() => bootstrapMean([1]), is("too-few", /at least 2/));
  throws(() => bootstrapMean([2, 2, 2]), is("constant", /identical/));
  throws(() => bootstrapMean([1, 2, 3], { resamples: 50 }), is("bad-option", /50 resamples/));
  throws(() => bootstrapMean([1, 2, 3], { seed: 0.5 }), is("bad-option", /seed/));
  throws(() => bootstrapMean([1, 2, 3], { level: 95 }), is("bad-option", /level 95/));
});

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const hasBoot = toolWorks(RSCRIPT, ["-e", "library(boot)"]);
Deno.test({
  name: `differential: BCa on plumbline's seeded resamples equals live boot.ci (seed ${seed})`,
  ignore: skipWithout("Rscript with the boot package (r-cran-boot)", hasBoot),
  fn: async () => {
    const rng = seededRandom(seed);
    const samples = [
      Array.from({ length: 15 }, () => 20 + rng.normal()),
      Array.from({ length: 40 }, () => Math.exp(0.9 * rng.normal())),
      Array.from({ length: 200 }, () => -Math.log(rng.uniform())),
    ];
    const B = 1999;
    const reps = samples.map((x, i) => _meanReplicates(Float64Array.from(x), B, seed + i));
    // R builds a boot object, replaces its replicates with plumbline's, and runs boot.ci.
    const input = samples.map((x, i) =>
      x.map((v) => v.toPrecision(17)).join(",") + "\n" +
      Array.from(reps[i], (v) => v.toPrecision(17)).join(",")
    ).join("\n") + "\n";
    const script =
      'suppressPackageStartupMessages(library(boot)); l <- readLines(file("stdin")); ' +
      "for (k in seq(1, length(l), 2)) { x <- as.numeric(strsplit(l[k], ',')[[1]]); " +
      "t <- as.numeric(strsplit(l[k + 1], ',')[[1]]); " +
      "b <- boot(x, function(d, w) sum(d * w) / sum(w), R = length(t), stype = 'w'); " +
      "b$t <- matrix(t, ncol = 1); b$t0 <- mean(x); " +
      "ci <- boot.ci(b, type = 'bca', L = x - mean(x))$bca; " +
      "cat(sprintf('%.17g %.17g\\n', ci[4], ci[5])) }";
    const out = await runTool(RSCRIPT, ["-e", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => l.split(" ").map(Number));
    samples.forEach((x, i) => {
      const mine = bcaInterval(moments(x).mean, reps[i], { acceleration: accel(x) });
      const ctx = `sample ${i} (n = ${x.length}, seed ${seed}) vs live boot.ci`;
      assertClose(mine.interval[0]!, rows[i][0], { rel: 1e-12 }, `lower, ${ctx}`);
      assertClose(mine.interval[1]!, rows[i][1], { rel: 1e-12 }, `upper, ${ctx}`);
    });
  },
});
