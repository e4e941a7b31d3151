// Differential tests: fresh seeded samples each run, compared live with R's
// stats::shapiro.test (double-precision AS R94) and with scipy.stats.shapiro
// (single-precision port of the same algorithm). Skipped, with a message, when
// the tool is missing; .ci/run installs both and sets PLUMBLINE_REQUIRE_REFERENCE=1.
import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { shapiroWilk } from "../../lib/stats/shapiro_wilk.ts";
import { assertClose } from "../_assert_close.ts";
import { PYTHON, RSCRIPT, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const rng = seededRandom(seed);
const shapes = [
  (n: number) => Array.from({ length: n }, () => 50 + 3 * rng.normal()),
  (n: number) => Array.from({ length: n }, () => -Math.log(rng.uniform())),
  (n: number) => Array.from({ length: n }, () => Math.exp(rng.normal())),
  (n: number) =>
    Array.from({ length: n }, () => rng.normal() / Math.sqrt(-2 * Math.log(rng.uniform()))),
  (n: number) => Array.from({ length: n }, () => Math.round(10 * rng.normal()) / 10),
];
const samples: number[][] = [];
for (const n of [3, 4, 5, 7, 11, 12, 13, 25, 60, 150, 700, 2500, 5000]) {
  for (const shape of shapes) samples.push(shape(n));
}
const input = samples.map((x) => x.map((v) => v.toPrecision(17)).join(",")).join("\n") + "\n";

const hasR = toolWorks(RSCRIPT, ["-e", "invisible(shapiro.test)"]);
Deno.test({
  name: `differential: W and p match live R shapiro.test (seed ${seed}), |ΔW| ≤ 1e-9 rel`,
  ignore: skipWithout("Rscript (r-base-core)", hasR),
  fn: async () => {
    const script =
      'con <- file("stdin"); for (l in readLines(con)) { x <- as.numeric(strsplit(l, ",")[[1]]); ' +
      'r <- shapiro.test(x); cat(sprintf("%.17g %.17g\\n", r$statistic, r$p.value)) }';
    const out = await runTool(RSCRIPT, ["-e", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => l.split(" ").map(Number));
    ok(rows.length === samples.length);
    samples.forEach((x, i) => {
      const r = shapiroWilk(x);
      const ctx = `sample ${i} (n = ${x.length}, seed ${seed}) vs live R`;
      assertClose(r.statistic, rows[i][0], { rel: 1e-9 }, `W, ${ctx}`);
      assertClose(r.pValue, rows[i][1], { rel: 1e-9, abs: 1e-14 }, `p, ${ctx}`);
    });
  },
});

const hasScipy = toolWorks(PYTHON, ["-c", "import scipy.stats"]);
Deno.test({
  name: `differential: scipy.stats.shapiro agrees only to single precision (seed ${seed})`,
  ignore: skipWithout("python3 with scipy (python3-scipy)", hasScipy),
  fn: async () => {
    const script = "import sys, scipy.stats as s\nfor l in sys.stdin:\n" +
      "    r = s.shapiro([float(v) for v in l.split(',')])\n" +
      "    print(repr(float(r[0])), repr(float(r[1])))\n";
    const out = await runTool(PYTHON, ["-c", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => l.split(" ").map(Number));
    // scipy computes W in single precision (its swilk port uses 32-bit reals), so
    // the tolerance is the reference's own worst-case rounding bound for sums of
    // n terms, γ_k = k·u/(1 − k·u) with u = 2⁻²⁴ (Higham 2002, Accuracy and
    // Stability of Numerical Algorithms, §3.1), with k = n + 16: n for the sums,
    // 16 for the fixed chain of single-precision steps (the degree-5 polynomials
    // for aₙ and aₙ₋₁, the square roots, the rounding of W itself to float32).
    // That is 2.4e-6 at n = 25 and 3e-4 at n = 5000.
    // The double-precision check is the R test above.
    let maxW = 0;
    samples.forEach((x, i) => {
      const r = shapiroWilk(x);
      if (x.length === 3) return; // scipy's n = 3 p can be negative; checked in the unit test
      maxW = Math.max(maxW, Math.abs(r.statistic - rows[i][0]));
      assertClose(
        r.statistic,
        rows[i][0],
        { abs: (x.length + 16) * 2 ** -24 / (1 - (x.length + 16) * 2 ** -24) },
        `W, sample ${i} (n = ${x.length}) vs scipy`,
      );
    });
    console.log(`max |ΔW| vs scipy (single precision): ${maxW.toExponential(2)}`);
  },
});
