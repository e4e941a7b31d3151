// deno bench: the censored-sample methods at n = 1e6 with 30% censored at
// three limits, beside the uncensored analysis of the same values. Seeded data.
// README quotes the ratio analyseCensored / analyse (target: at most 3).
import { seededRandom } from "../lib/numeric/random.ts";
import { analyse } from "../lib/plumb/analysis.ts";
import { analyseCensored } from "../lib/plumb/censored_analysis.ts";
import { censoredBoxCoxFit } from "../lib/reexpress/censored_lambda_fit.ts";
import { censoredNormalFit } from "../lib/stats/censored_fit.ts";
import { censoredShapiroFrancia } from "../lib/stats/censored_normality.ts";
import { censoredPositions } from "../lib/stats/censored_positions.ts";
import { censoredRos } from "../lib/stats/censored_ros.ts";
import { censoredSample } from "../lib/stats/censored_sample.ts";

const rng = seededRandom(8);
const n = 1e6;
const raw = new Float64Array(n).map(() => 10 + 2 * rng.normal());
const values = new Float64Array(n);
const censor = new Int8Array(n);
const limits = [8.4, 9, 9.6]; // Φ⁻¹ of 0.21, 0.31, 0.42 on N(10, 2): 31% censored on average
for (let i = 0; i < n; i++) {
  const l = limits[i % 3];
  values[i] = raw[i] < l ? l : raw[i];
  censor[i] = raw[i] < l ? -1 : 0;
}
const sample = censoredSample(values, censor);
const sub = censoredSample(values.subarray(0, 5000), censor.subarray(0, 5000));
const origin = { label: "x", column: "x", missingDropped: 0, textDropped: 0 };

Deno.bench({
  name: "analyse (uncensored), n=1e6",
  group: "1e6",
  baseline: true,
  fn: () => void analyse(raw, origin),
});
Deno.bench({
  name: "analyseCensored (the chain's censored analysis), n=1e6",
  group: "1e6",
  fn: () => void analyseCensored(values, censor, origin),
});
Deno.bench({
  name: "censoredSample, n=1e6",
  group: "1e6",
  fn: () => void censoredSample(values, censor),
});
Deno.bench({
  name: "censoredNormalFit, n=1e6",
  group: "1e6",
  fn: () => void censoredNormalFit(sample),
});
Deno.bench({
  name: "censoredPositions, n=1e6",
  group: "1e6",
  fn: () => void censoredPositions(sample),
});
Deno.bench({ name: "censoredRos, n=1e6", group: "1e6", fn: () => void censoredRos(sample) });
Deno.bench({
  name: "censoredShapiroFrancia, n=5000",
  fn: () => void censoredShapiroFrancia(sub),
});
Deno.bench({
  name: "censoredBoxCoxFit, n=5000",
  fn: () =>
    void censoredBoxCoxFit(censoredSample(sub.values.map((v) => Math.exp(v / 4)), sub.censor)),
});
