// Differential test: fresh seeded censored samples each run, fitted live by
// R's survival::survreg (dist = "gaussian", rel.tolerance 1e-13 so that the
// comparison measures plumbline) and by censoredNormalFit. Skipped, with a
// message, when R or the survival package is missing; .ci/run installs both
// and sets PLUMBLINE_REQUIRE_REFERENCE=1.
import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertClose } from "../_assert_close.ts";
import { RSCRIPT, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const rng = seededRandom(seed);

/** A normal or skewed sample censored at 1–3 limits on the left, right or both sides. */
function sample(n: number, shape: number): { x: number[]; c: number[] } {
  const draw = () => {
    const z = rng.normal();
    return shape === 0 ? 20 + 4 * z : shape === 1 ? Math.exp(0.6 * z) : 5 - Math.log(rng.uniform());
  };
  const raw = Array.from({ length: n }, draw);
  const sorted = raw.slice().sort((a, b) => a - b);
  const q = (p: number) => sorted[Math.floor(p * (n - 1))];
  const frac = 0.05 + 0.6 * rng.uniform();
  const nLimits = 1 + rng.integer(3);
  const lows = Array.from({ length: nLimits }, () => q(frac * (0.5 + rng.uniform())));
  const side = rng.integer(3); // 0 left, 1 right, 2 both
  const high = q(1 - 0.1 * rng.uniform());
  const x: number[] = [];
  const c: number[] = [];
  raw.forEach((v, i) => {
    const lo = lows[rng.integer(nLimits)];
    if (side !== 1 && v < lo && i >= 3) {
      x.push(lo);
      c.push(-1);
    } else if (side !== 0 && v > high && i >= 3) {
      x.push(high);
      c.push(1);
    } else {
      x.push(v);
      c.push(0);
    }
  });
  return { x, c };
}

const cases: { x: number[]; c: number[] }[] = [];
for (const n of [6, 10, 20, 35, 50, 100, 300, 1000]) {
  for (const shape of [0, 1, 2]) {
    const s = sample(n, shape);
    try {
      censoredSample(s.x, s.c);
      cases.push(s);
    } catch {
      // too few measured values in this draw: not a case for survreg either
    }
  }
}
const input =
  cases.map(({ x, c }) => x.map((v) => v.toPrecision(17)).join(",") + ";" + c.join(",")).join(
    "\n",
  ) + "\n";

const hasSurvival = toolWorks(RSCRIPT, ["-e", "suppressPackageStartupMessages(library(survival))"]);
Deno.test({
  name: `differential: censored ML fit matches live R survival::survreg (seed ${seed}), ≤ 1e-6 rel`,
  ignore: skipWithout("Rscript with the survival package (r-cran-survival)", hasSurvival),
  fn: async () => {
    const script = "suppressPackageStartupMessages(library(survival))\n" +
      'con <- file("stdin"); for (l in readLines(con)) { p <- strsplit(l, ";")[[1]]\n' +
      'x <- as.numeric(strsplit(p[1], ",")[[1]]); s <- as.numeric(strsplit(p[2], ",")[[1]])\n' +
      "lo <- ifelse(s == -1, NA, x); hi <- ifelse(s == 1, NA, x)\n" +
      'f <- survreg(Surv(lo, hi, type = "interval2") ~ 1, dist = "gaussian",\n' +
      "  control = survreg.control(rel.tolerance = 1e-13, iter.max = 500))\n" +
      'cat(sprintf("%.17g %.17g %.17g\\n", coef(f)[1], f$scale, f$loglik[length(f$loglik)])) }';
    const out = await runTool(RSCRIPT, ["-e", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => l.split(" ").map(Number));
    ok(rows.length === cases.length && cases.length > 15);
    let worst = 0;
    cases.forEach(({ x, c }, i) => {
      const f = censoredNormalFit(censoredSample(x, c));
      const ctx = `case ${i} (n = ${x.length}, ${f.left} left, ${f.right} right, seed ${seed}) ` +
        `vs live survreg`;
      assertClose(f.mean, rows[i][0], { rel: 1e-6 }, `mean, ${ctx}`);
      assertClose(f.sd, rows[i][1], { rel: 1e-6 }, `sd, ${ctx}`);
      assertClose(f.logLikelihood, rows[i][2], { rel: 1e-6 }, `log-likelihood, ${ctx}`);
      for (const k of [0, 1, 2]) {
        worst = Math.max(worst, Math.abs([f.mean, f.sd, f.logLikelihood][k] / rows[i][k] - 1));
      }
    });
    console.log(
      `${cases.length} live cases, largest relative difference ${worst.toExponential(2)}`,
    );
  },
});
