// Seeded simulations (kept small so the suite stays fast; the full tables come
// from tools/simulate_stakes.ts and are in README.md). Every band is the
// nominal or exact coverage ± 4.5 binomial standard errors of the simulation,
// so a correct method fails it with probability below 1e-5.
import { ok } from "node:assert/strict";
import { quantileRanks } from "../../lib/stats/quantile_interval.ts";
import { lognormalRange, normalCoverage } from "../../tools/simulate_stakes.ts";

const band = (p: number, reps: number) => 4.5 * Math.sqrt((p * (1 - p)) / reps);
const within = (got: number, p: number, reps: number, what: string) =>
  ok(Math.abs(got - p) <= band(p, reps), `${what}: ${got} vs ${p} ± ${band(p, reps).toFixed(4)}`);

Deno.test("normal data, n = 30: each interval covers at its nominal (or exact) rate", () => {
  const reps = 800;
  const c = normalCoverage(30, reps, 31);
  within(c.t, 0.95, reps, "t interval (exact for normal data)");
  within(c.cp, 0.95, reps, "Cp χ² interval (exact for normal data)");
  within(c.cpk, 0.95, reps, "Cpk, Bissell (1990) approximation");
  within(
    c.rankLower,
    quantileRanks(30, 0.025).coverage,
    reps,
    "rank 2.5% limit, exact binomial coverage",
  );
  ok(c.outside >= 0.95 - band(0.95, reps), `Clopper–Pearson ≥ 0.95: ${c.outside}`);
  // BCa is second-order accurate but undercovers a little at small n (Efron &
  // Tibshirani 1993, An Introduction to the Bootstrap, §14.3 — from memory),
  // so only the lower side is bounded, from 0.93.
  ok(c.bca >= 0.93 - band(0.93, c.bootstrapReps), `BCa: ${c.bca} over ${c.bootstrapReps}`);
  ok(Math.abs(c.rangeContent - 0.95) < 0.015, `mean content of x̄ ± 1.96s: ${c.rangeContent}`);
});

Deno.test("lognormal data (σ = 1, n = 120): the normal-theory range misplaces both tails", () => {
  const l = lognormalRange(120, 1, 800, 32);
  ok(l.normalNegative > 0.99, `normal lower limit below 0 in ${l.normalNegative} of samples`);
  ok(l.normalBelow < 0.001, `share below the normal lower limit: ${l.normalBelow} (nominal 0.025)`);
  ok(l.normalAbove > 0.04, `share above the normal upper limit: ${l.normalAbove} (nominal 0.025)`);
  // the log-scale range has the normal range's own small-sample content,
  // about 0.027 per tail at n = 120; its per-sample sd is about 0.01
  for (const [v, side] of [[l.logBelow, "below"], [l.logAbove, "above"]] as const) {
    ok(v > 0.024 && v < 0.031, `share ${side} the log-scale range: ${v}`);
  }
});
