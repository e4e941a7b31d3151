// The simulated envelope of studentised residuals (Atkinson 1981): seeded and
// deterministic, Atkinson's own extremes-of-19 rule, pointwise coverage close
// to the stated level by seeded simulation of new responses on the same
// design, and agreement with the order-statistic fallback at large n.
import assert from "node:assert/strict";
import { betaQuantile } from "../../lib/numeric/beta.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { studentTUpper } from "../../lib/numeric/student_t.ts";
import { fitLinearModel } from "../../lib/stats/linear_model.ts";
import { residualEnvelope, SIMULATED_ENVELOPE_MAX_N } from "../../lib/stats/residual_envelope.ts";
import { assertPlumbError } from "../_shared.ts";

const rng = seededRandom(1981);

function design(n: number) {
  // a covariate with one far point (high leverage) and a three-level factor
  const x = Array.from({ length: n }, (_, i) => (i === 0 ? 12 : rng.normal()));
  const g = x.map((_, i) => "uvw"[i % 3]);
  const y = x.map((v) => 1 + v + rng.normal());
  return { x, g, y };
}

Deno.test("envelope: same seed, same limits; another seed, other limits", () => {
  const { x, g, y } = design(25);
  const fit = fitLinearModel(y, { covariates: { x }, factors: { g } });
  const a = residualEnvelope(fit),
    b = residualEnvelope(fit),
    c = residualEnvelope(fit, { seed: 7 });
  assert.deepEqual(a, b);
  assert.notDeepEqual(a.lower, c.lower);
  assert.equal(a.kind, "simulated");
  assert.equal(a.ranks.length, 25);
  for (let i = 0; i < 25; i++) {
    assert.ok(a.lower[i] < a.upper[i]);
    if (i > 0) {
      assert.ok(a.lower[i] >= a.lower[i - 1] && a.upper[i] >= a.upper[i - 1], "monotone in rank");
    }
  }
  assert.match(
    a.method,
    /199 seeded normal responses .* the 5th smallest and largest at each rank$/,
  );
});

Deno.test("envelope: 19 draws at level 0.9 are Atkinson's extremes", () => {
  const { x, g, y } = design(15);
  const fit = fitLinearModel(y, { covariates: { x }, factors: { g } });
  const e = residualEnvelope(fit, { draws: 19, level: 0.9 });
  assert.match(e.method, /19 seeded normal responses .* the 1st smallest and largest/);
  // the same 19 simulated fits, second smallest and largest: inside the extremes
  const inner = residualEnvelope(fit, { draws: 19, level: 0.8 });
  assert.match(inner.method, /the 2nd smallest/);
  e.lower.forEach((lo, i) =>
    assert.ok(lo <= inner.lower[i] && e.upper[i] >= inner.upper[i], `rank ${i + 1}`)
  );
  assert.ok(e.lower.some((lo, i) => lo < inner.lower[i]));
});

Deno.test("envelope: pointwise coverage of new responses on the same design is near the level", () => {
  const n = 30;
  const { x, g, y } = design(n);
  const fit = fitLinearModel(y, { covariates: { x }, factors: { g } });
  const env = residualEnvelope(fit);
  let inside = 0, total = 0;
  for (let s = 0; s < 400; s++) {
    const yy = x.map((v) => 5 - 2 * v + 3 * rng.normal());
    const t = [...fitLinearModel(yy, { covariates: { x }, factors: { g } }).studentized].sort((
      a,
      b,
    ) => a - b);
    t.forEach((v, i) => {
      total++;
      if (v >= env.lower[i] && v <= env.upper[i]) inside++;
    });
  }
  // 199 draws estimate the 2.5% and 97.5% points; coverage 0.95 ± 0.02 (common practice)
  const coverage = inside / total;
  assert.ok(coverage > 0.93 && coverage < 0.97, `pointwise coverage ${coverage}`);
});

Deno.test("envelope: beyond the simulation limit, the order-statistic envelope of t", () => {
  const n = SIMULATED_ENVELOPE_MAX_N + 1;
  const x = Array.from({ length: n }, () => rng.normal());
  const fit = fitLinearModel(x.map((v) => v + rng.normal()), { covariates: { x } });
  const ranks = [1, 2, 100, 2500, 2501, 4900, n - 1, n];
  const big = residualEnvelope(fit, { ranks });
  assert.equal(big.kind, "order-statistic");
  assert.match(big.method, /Student t values with 4998 degrees of freedom/);
  // symmetric: rank k's lower limit mirrors rank n + 1 − k's upper one
  assert.ok(Math.abs(big.lower[0] + big.upper[7]) < 1e-9);
  // and close to the simulation at a size just below the limit (the fallback's premise)
  const m = 3000,
    sub = fitLinearModel(fit.residuals.slice(0, m), { covariates: { x: x.slice(0, m) } });
  const sim = residualEnvelope(sub, { ranks: [30, 1500, 2970], draws: 399 });
  [30, 1500, 2970].forEach((r, i) => {
    const tq = (u: number) => (u < 0.5 ? -studentTUpper(u, m - 3) : studentTUpper(1 - u, m - 3));
    const lo = tq(betaQuantile(0.025, r, m - r + 1));
    const up = tq(betaQuantile(0.975, r, m - r + 1));
    assert.ok(Math.abs(sim.lower[i] - lo) < 0.1 && Math.abs(sim.upper[i] - up) < 0.1, `rank ${r}`);
  });
});

Deno.test("envelope: bad level, too few draws, ranks out of range", () => {
  const { x, g, y } = design(12);
  const fit = fitLinearModel(y, { covariates: { x }, factors: { g } });
  assertPlumbError(
    () => residualEnvelope(fit, { level: 1 }),
    "bad-option",
    /^Cannot build an envelope with level 1/,
  );
  assertPlumbError(
    () => residualEnvelope(fit, { draws: 20 }),
    "bad-option",
    /^Cannot simulate a 95% envelope from 20 fits: use a whole number of at least 39, such as 199$/,
  );
  assertPlumbError(
    () => residualEnvelope(fit, { ranks: [0] }),
    "bad-option",
    /^Cannot use rank 0 among 12 residuals/,
  );
});
