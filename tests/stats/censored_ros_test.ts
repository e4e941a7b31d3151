import { equal, ok } from "node:assert/strict";
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredRos } from "../../lib/stats/censored_ros.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

// The worked example of tests/stats/censored_positions_test.ts, by hand
// (a = 0): measured 0.5 1.2 1.5 2.5 3 4 at positions 0.21, 0.42 + 0.28·{1, 2}/3,
// 0.7 + 0.3·{1, 2, 3}/4; "<1" at 0.42·{1, 2}/3, "<2" at 0.7·{1, 2}/3.
// Helsel & Cohn (1988): least-squares line of the measured values on
// z = Φ⁻¹(p), censored values imputed on the line at their own positions,
// then the mean and sd (n − 1) of all ten.
Deno.test("ROS on the worked example follows the published steps (a = 0)", () => {
  const values = [1, 1, 0.5, 1.5, 2, 2.5, 3, 2, 4, 1.2];
  const censor = [-1, -1, 0, 0, -1, 0, 0, -1, 0, 0];
  const r = censoredRos(censoredSample(values, censor), { offset: 0 });
  const px = [
    [0.21, 0.5],
    [0.42 + 0.28 / 3, 1.2],
    [0.42 + 0.56 / 3, 1.5],
    [0.775, 2.5],
    [0.85, 3],
    [0.925, 4],
  ];
  const z = px.map(([p]) => normalQuantile(p));
  const x = px.map(([, v]) => v);
  const zb = z.reduce((a, b) => a + b) / 6;
  const xb = x.reduce((a, b) => a + b) / 6;
  const slope = z.reduce((s, zi, i) => s + (zi - zb) * (x[i] - xb), 0) /
    z.reduce((s, zi) => s + (zi - zb) ** 2, 0);
  const intercept = xb - slope * zb;
  assertClose(r.slope, slope, { rel: 1e-14 }, "slope");
  assertClose(r.intercept, intercept, { rel: 1e-14 }, "intercept");
  const imputedP = [0.14, 0.28, 0.7 / 3, 1.4 / 3];
  const all = [...x, ...imputedP.map((p) => intercept + slope * normalQuantile(p))];
  const m = all.reduce((a, b) => a + b) / 10;
  const sd = Math.sqrt(all.reduce((s, v) => s + (v - m) ** 2, 0) / 9);
  assertClose(r.mean, m, { rel: 1e-14 }, "mean");
  assertClose(r.sd, sd, { rel: 1e-14 }, "sd");
  assertClose(r.values[0], intercept + slope * normalQuantile(0.14), { rel: 1e-14 }, "first <1");
  equal(r.values[2], 0.5);
});

Deno.test("nothing censored: the sample mean and sd", () => {
  const x = [4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1];
  const r = censoredRos(censoredSample(x, x.map(() => 0)));
  const m = x.reduce((a, b) => a + b) / x.length;
  assertClose(r.mean, m, { rel: 1e-14 }, "mean");
  const sd = Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1));
  assertClose(r.sd, sd, { rel: 1e-14 }, "sd");
});

Deno.test("large normal samples: ROS and ML both near the truth (30% censored, 3 limits)", () => {
  // Simulation check of consistency, not a reference value: with n = 20,000 the
  // sampling error of either estimator is below 0.01σ.
  const rng = seededRandom(3);
  const x: number[] = [];
  const c: number[] = [];
  const limits = [8.4, 9, 9.6]; // N(10, 2): Φ⁻¹ at 0.21, 0.31, 0.42 → 31% on average
  for (let i = 0; i < 20000; i++) {
    const v = 10 + 2 * rng.normal();
    const l = limits[i % 3];
    x.push(v < l ? l : v);
    c.push(v < l ? -1 : 0);
  }
  const s = censoredSample(x, c);
  const r = censoredRos(s);
  const f = censoredNormalFit(s);
  ok(Math.abs(r.mean - 10) < 0.05 && Math.abs(r.sd - 2) < 0.05, `ROS ${r.mean} ${r.sd}`);
  ok(Math.abs(f.mean - 10) < 0.05 && Math.abs(f.sd - 2) < 0.05, `ML ${f.mean} ${f.sd}`);
});

Deno.test("right-censored values are imputed above their limit's position; JSON is plain", () => {
  const s = censoredSample([1, 2, 3, 4, 5, 5, 2.5, 3.5], [0, 0, 0, 0, 1, 1, 0, 0]);
  const r = censoredRos(s);
  ok(r.values[4] > 4 && r.values[5] > 4);
  const j = JSON.parse(JSON.stringify(r));
  ok(Array.isArray(j.values) && j.values.length === 8 && typeof j.mean === "number");
  assertPlumbError(
    () => censoredRos(censoredSample([3, 1, 2, 2.5, 4, 0.5], [-1, 1, 0, 0, 0, 0])),
    "overlapping-limits",
    /order of those values is unknown/,
  );
});
