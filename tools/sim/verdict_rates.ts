/**
 * Verdict rates of the reading on seeded samples: how often a normal
 * sample gets anything but "no clear departure" (at every n from 3 to
 * 10⁶), and how often departures of known shape are found.
 *
 * Each cell draws 2,000 samples (seeded, reproducible) and reads each one
 * exactly as a chain does: sorted once, moments, Shapiro–Wilk (on a seeded
 * random subsample of 5,000 above 5,000 values), then the reading's
 * evidence and verdict (`lib/plumb/reading_evidence.ts`, rules in
 * `lib/plumb/reading_rules.ts`).
 *
 * Shapes: normal; lognormal with σ = 0.5 (G1 ≈ 1.75); exponential; uniform;
 * Student's t with 5 degrees of freedom; a 3% scale-contaminated normal
 * (each value from N(0, 3²) with probability 0.03, Tukey 1960); a 3% shifted
 * cluster (each value from N(5, 0.5²) with probability 0.03).
 *
 * Run: `deno run tools/sim/verdict_rates.ts [--reps 2000] [--max-n 1000000]`
 * (about 30 minutes on one core at the defaults; the n = 10⁶ cell takes most
 * of it). Prints the two Markdown tables in README ("The verdict and how often it is right").
 *
 * @module
 */
import { seededRandom } from "../../lib/numeric/random.ts";
import { sortFloat64 } from "../../lib/numeric/sort.ts";
import { randomSubsample } from "../../lib/numeric/random.ts";
import { gatherEvidence } from "../../lib/plumb/reading_evidence.ts";
import type { Verdict } from "../../lib/results/reading.ts";
import { _momentsOf, _sampleShape } from "../../lib/stats/moments.ts";
import { _shapiroWilkSorted } from "../../lib/stats/shapiro_wilk.ts";

type Stream = ReturnType<typeof seededRandom>;

const args = Deno.args;
const opt = (name: string, fallback: number) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const REPS = opt("--reps", 2000);
const MAX_N = opt("--max-n", 1e6);

function chiSquare(r: Stream, df: number): number {
  let c = 0;
  for (let i = 0; i < df; i++) {
    const z = r.normal();
    c += z * z;
  }
  return c;
}

const SHAPES: readonly [string, (r: Stream) => number][] = [
  ["normal", (r) => r.normal()],
  ["lognormal, σ = 0.5", (r) => Math.exp(0.5 * r.normal())],
  ["exponential", (r) => -Math.log(r.uniform())],
  ["uniform", (r) => r.uniform()],
  ["t, 5 df", (r) => r.normal() / Math.sqrt(chiSquare(r, 5) / 5)],
  ["3% contaminated (sd × 3)", (r) => (r.uniform() < 0.03 ? 3 * r.normal() : r.normal())],
  ["3% shifted cluster (+5 sd)", (r) => (r.uniform() < 0.03 ? 5 + 0.5 * r.normal() : r.normal())],
];

/** The verdict for one sample, read as a chain reads it. */
function verdictOf(x: Float64Array): Verdict {
  const n = x.length;
  const sorted = sortFloat64(x.slice());
  if (sorted[0] === sorted[n - 1]) return "no-clear-departure";
  const sw = _shapiroWilkSorted(n > 5000 ? sortFloat64(randomSubsample(x, 5000, 1)) : sorted);
  if (n < 4) {
    const mean = (sorted[0] + sorted[1] + sorted[2]) / 3;
    const sd = Math.sqrt(sorted.reduce((s, v) => s + (v - mean) ** 2, 0) / 2);
    return gatherEvidence(sorted, { primary: sw, sd }).grounds.verdict;
  }
  const moments = _momentsOf(n, _sampleShape(sorted, "x"));
  return gatherEvidence(sorted, { moments, primary: sw }).grounds.verdict;
}

function rates(shape: (r: Stream) => number, n: number, seed: number): [number, number, number] {
  const rng = seededRandom(seed);
  const count = { "no-clear-departure": 0, "mild-departure": 0, "clear-departure": 0 };
  const x = new Float64Array(n);
  for (let rep = 0; rep < REPS; rep++) {
    for (let i = 0; i < n; i++) x[i] = shape(rng);
    count[verdictOf(x)]++;
  }
  const pct = (k: number) => (100 * k) / REPS;
  return [
    pct(count["no-clear-departure"]),
    pct(count["mild-departure"]),
    pct(count["clear-departure"]),
  ];
}

const TABLE_N = [10, 20, 50, 200, 1000, 5000];
const lines = [
  `| shape | ${TABLE_N.map((n) => `n = ${n}`).join(" | ")} |`,
  `| --- | ${TABLE_N.map(() => "---:").join(" | ")} |`,
];
SHAPES.forEach(([name, shape], k) => {
  const cells = TABLE_N.map((n) => {
    const [none, mild, clear] = rates(shape, n, 1000 * (k + 1) + n);
    return `${none.toFixed(1)} / ${mild.toFixed(1)} / ${clear.toFixed(1)}`;
  });
  lines.push(`| ${name} | ${cells.join(" | ")} |`);
  console.error(`${name} done`);
});
console.log(
  `Verdict rates in percent, no clear departure / mild / clear (${REPS} seeded samples per cell)\n`,
);
console.log(lines.join("\n"));

const NULL_N = [3, 4, 5, 6, 8, 10, 15, 20, 30, 50, 100, 200, 500, 1000, 2000, 5000, 2e4, 1e5, 1e6]
  .filter((n) => n <= MAX_N);
const nulls = NULL_N.map((n) => {
  const [none] = rates(SHAPES[0][1], n, 7 + n);
  console.error(`normal n = ${n} done`);
  return (100 - none).toFixed(1);
});
console.log(
  `\nNormal samples given anything but "no clear departure", percent (${REPS} per n; target ≤ 10)\n`,
);
console.log(`| n | ${NULL_N.join(" | ")} |`);
console.log(`| --- | ${NULL_N.map(() => "---:").join(" | ")} |`);
console.log(`| % | ${nulls.join(" | ")} |`);
