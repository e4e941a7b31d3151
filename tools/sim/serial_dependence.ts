/**
 * How often the serial-dependence check flags independent data (false
 * alarms) and dependent data (power), by seeded simulation: 2,000 samples
 * per cell, α = 0.05. Prints a Markdown table for the README.
 * Run: `deno run tools/sim/serial_dependence.ts [samples]`.
 *
 * @module
 */
import { seededRandom } from "../../lib/numeric/random.ts";
import { serialDependence } from "../../lib/stats/serial_dependence.ts";

const samples = Number(Deno.args[0] ?? 2000);
const rng = seededRandom(20261203);
const sizes = [20, 50, 200, 1000];

type Gen = (n: number) => number[];
const ar = (phi: number): Gen => (n) => {
  let prev = 0;
  for (let k = 0; k < 100; k++) prev = phi * prev + rng.normal(); // start in the stationary state
  return Array.from({ length: n }, () => (prev = phi * prev + rng.normal()));
};
const rows: [string, Gen][] = [
  ["independent normal", (n) => Array.from({ length: n }, () => rng.normal())],
  ["independent exponential", (n) => Array.from({ length: n }, () => -Math.log(rng.uniform()))],
  [
    "independent, rounded to 0.5 sd",
    (n) => Array.from({ length: n }, () => Math.round(2 * rng.normal()) / 2),
  ],
  ["AR(1), φ = 0.2", ar(0.2)],
  ["AR(1), φ = 0.7", ar(0.7)],
  ["AR(1), φ = −0.5", ar(-0.5)],
  [
    "linear drift of 2 sd over the run",
    (n) => Array.from({ length: n }, (_, t) => (2 * t) / n + rng.normal()),
  ],
];

const out = [
  `| series (${samples} samples each, α = 0.05) | ${sizes.map((n) => `n = ${n}`).join(" | ")} |`,
  `| --- | ${sizes.map(() => "---:").join(" | ")} |`,
];
for (const [name, gen] of rows) {
  const cells = sizes.map((n) => {
    let hits = 0;
    for (let s = 0; s < samples; s++) if (serialDependence(gen(n)).shows) hits++;
    return `${((100 * hits) / samples).toFixed(1)}%`;
  });
  out.push(`| ${name} | ${cells.join(" | ")} |`);
}
console.log(out.join("\n"));
