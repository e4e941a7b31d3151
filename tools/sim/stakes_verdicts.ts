/**
 * Verdict rates of the stakes view on seeded samples: how often each
 * figure's verdict says "matters" for normal data (a false alarm) and for
 * lognormal data (σ = 0.8, G1 ≈ 3.7), at several n.
 *
 * Each cell draws `--reps` samples (seeded, reproducible) and runs
 * `stakes(x, { lower, upper, reexpression: "none" })` with limits at the
 * population's 0.5% and 99.5% points (so about 1% lies outside), with 1,000
 * bootstrap resamples.
 *
 * Run: `deno run tools/sim/stakes_verdicts.ts [--reps 400]`. Prints the
 * Markdown table in README ("What the departure changes: `.stakes()`").
 *
 * @module
 */
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { stakes } from "../../lib/stakes/stakes.ts";

const args = Deno.args;
const at = args.indexOf("--reps");
const REPS = at >= 0 ? Number(args[at + 1]) : 400;
const SIZES = [8, 30, 120, 500];
const SIGMA = 0.8;
const z = normalQuantile(0.995);

type Figure = "range" | "outside" | "capability" | "mean";
const FIGURES: Figure[] = ["range", "outside", "capability", "mean"];

function rates(shape: "normal" | "lognormal", n: number, seed: number): Record<Figure, number> {
  const rng = seededRandom(seed);
  const count: Record<Figure, number> = { range: 0, outside: 0, capability: 0, mean: 0 };
  const [lower, upper] = shape === "normal" ? [-z, z] : [Math.exp(-z * SIGMA), Math.exp(z * SIGMA)];
  for (let r = 0; r < REPS; r++) {
    const x = Array.from(
      { length: n },
      () => (shape === "normal" ? rng.normal() : Math.exp(SIGMA * rng.normal())),
    );
    const s = stakes(x, { lower, upper, reexpression: "none", resamples: 1000, seed: r + 1 });
    for (const f of FIGURES) if (s.judgement[f]?.verdict === "matters") count[f]++;
  }
  for (const f of FIGURES) count[f] /= REPS;
  return count;
}

const pct = (v: number) => `${(v * 100).toFixed(1)}%`;
console.log(
  `Share of ${REPS} seeded samples whose verdict is "matters" (limits at the 0.5% and 99.5% points):\n`,
);
console.log("| data | n | central range | share outside | Cpk | mean |");
console.log("| --- | ---: | ---: | ---: | ---: | ---: |");
for (const shape of ["normal", "lognormal"] as const) {
  for (const n of SIZES) {
    const r = rates(shape, n, 1000 * n + (shape === "normal" ? 1 : 2));
    console.log(
      `| ${shape === "normal" ? "normal" : `lognormal, σ = ${SIGMA}`} | ${n} | ` +
        FIGURES.map((f) => pct(r[f])).join(" | ") + " |",
    );
  }
}
