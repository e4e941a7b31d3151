// Differential test: fresh seeded series each run (independent, AR(1) with
// several φ, random walks, rounded values), compared live with R's acf (lag 1)
// and Box.test(x, 1, "Ljung-Box"). Skipped with a message when R is missing;
// .ci/run installs it and sets PLUMBLINE_REQUIRE_REFERENCE=1.
import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { lagOneTest } from "../../lib/stats/lag_one.ts";
import { assertClose } from "../_assert_close.ts";
import { RSCRIPT, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const rng = seededRandom(seed);
const series: number[][] = [];
for (const n of [4, 9, 30, 200, 3000]) {
  for (const phi of [0, 0.3, -0.6, 0.95, 1]) {
    let prev = 0;
    series.push(Array.from({ length: n }, () => (prev = phi * prev + rng.normal())));
  }
  series.push(Array.from({ length: n }, () => Math.round(3 * rng.normal()) / 2));
}
const input = series.map((x) => x.map((v) => v.toPrecision(17)).join(",")).join("\n") + "\n";

const hasR = toolWorks(RSCRIPT, ["-e", "invisible(Box.test)"]);
Deno.test({
  name: `differential: r1 and Ljung–Box at lag 1 match live R acf and Box.test (seed ${seed})`,
  ignore: skipWithout("Rscript (r-base-core)", hasR),
  fn: async () => {
    const script =
      'for (l in readLines(file("stdin"))) { x <- as.numeric(strsplit(l, ",")[[1]]); ' +
      'b <- Box.test(x, 1, "Ljung-Box"); ' +
      'cat(sprintf("%.17g %.17g %.17g\\n", acf(x, 1, plot = FALSE)$acf[2], b$statistic, b$p.value)) }';
    const out = await runTool(RSCRIPT, ["-e", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => l.split(" ").map(Number));
    ok(rows.length === series.length);
    series.forEach((x, i) => {
      const r = lagOneTest(x);
      const ctx = `series ${i} (n = ${x.length}, seed ${seed}) vs live R`;
      assertClose(r.r1, rows[i][0], { rel: 1e-12, abs: 1e-15 }, `r1, ${ctx}`);
      assertClose(r.ljungBox!.statistic, rows[i][1], { rel: 1e-12, abs: 1e-15 }, `Q, ${ctx}`);
      // R's p is 1 − pchisq(Q, 1): no digits below about 1e-16
      assertClose(r.ljungBox!.pValue, rows[i][2], { rel: 1e-9, abs: 1e-15 }, `p, ${ctx}`);
    });
  },
});
