/**
 * Calibrate the null distribution of the censored-sample Shapiro–Francia
 * statistic by seeded simulation, and write its quantile table to
 * lib/stats/_censored_null_table.ts.
 *
 Two tables, because the null distribution differs between one limit and
 * several (with the same censored fraction, limits spread apart leave
 * measured values lower in the distribution, and W′ then behaves more like
 * a complete sample's):
 * - one limit: 10% of the samples have no censoring, the others one limit
 *   at the population quantile d;
 * - several limits: two to four limits at population quantiles
 *   δ·(1 + s·(2i/(m − 1) − 1)), i = 0 … m − 1, each value's limit drawn
 *   among them, the spread s uniform on (0.2, min(1, 0.95/δ − 1)) so that no
 *   limit lies above the 95% quantile.
 * A value below its limit is censored there (left censoring; right censoring
 * is its mirror image and gives the same statistic). For each sample the
 * script keeps the number censored k and y = ln(1 − W′). Each table holds the
 * 50%, 90%, 95% and 99% quantiles of y at censored fractions 0, 0.05, …, 0.8.
 * One limit (d uniform on (0, 0.9)), by the number censored:
 * - fraction 0: the samples with k = 0;
 * - n ≤ 40: the quantiles at each k, interpolated linearly in k/n to the
 *   grid fraction (fractions beyond the largest k/n with at least 3 measured
 *   values repeat the last available column; the test never reaches them at
 *   that n);
 * - n > 40: the samples with |k/n − fraction| ≤ 0.025 pooled.
 * Several limits, by the expected fraction: at each grid fraction δ, samples
 * simulated with that δ, whatever their own k (with several limits, samples
 * grouped by k mix configurations whose nulls differ; the size check of
 * tools/sim/censored_size.ts measures the result at fixed limits).
 * Fraction 0 is the complete-sample column of the one-limit table.
 *
 * Run (about 30 minutes on a shared machine):
 *   deno run --allow-write tools/sim/censored_null.ts
 *
 * @module
 */
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { _positionsSorted } from "../../lib/stats/censored_positions.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { _oneMinusWPrime } from "../../lib/stats/_censored_statistic.ts";
import { BLOM_OFFSET } from "../../lib/stats/plotting_positions.ts";

export const GRID_N = [
  5,
  6,
  7,
  8,
  9,
  10,
  12,
  15,
  20,
  25,
  30,
  40,
  50,
  70,
  100,
  150,
  200,
  300,
  500,
  1000,
  2000,
  5000,
];
export const GRID_DELTA = Array.from({ length: 17 }, (_, i) => i / 20);
const PROBS = [0.5, 0.9, 0.95, 0.99];

/** `--quick`: 1% of the samples, for trying the script out (the table is then too noisy to keep). */
const SCALE = Deno.args.includes("--quick") ? 0.01 : 1;

/** Samples simulated at each n, per table: fewer at large n, where each costs more. */
function samplesFor(n: number): number {
  if (n <= 200) return 100_000 * SCALE;
  if (n <= 1000) return 50_000 * SCALE;
  return 20_000 * SCALE;
}

/** Limits (population quantiles) for one simulated sample; `delta` fixes d for several limits. */
function limitsFor(
  multiple: boolean,
  rng: ReturnType<typeof seededRandom>,
  delta: number,
): number[] {
  if (!multiple) return rng.uniform() < 0.1 ? [-Infinity] : [normalQuantile(0.9 * rng.uniform())];
  const m = 2 + rng.integer(3);
  const s = 0.2 + (Math.min(1, 0.95 / delta - 1) - 0.2) * rng.uniform();
  return Array.from(
    { length: m },
    (_, i) => normalQuantile(delta * (1 + s * ((2 * i) / (m - 1) - 1))),
  );
}

/** One simulated left-censored normal sample: its censored count and ln(1 − W′). */
export function simulate(
  n: number,
  limits: readonly number[],
  rng: ReturnType<typeof seededRandom>,
  x: Float64Array,
  c: Int8Array,
): { k: number; y: number } | undefined {
  let k = 0;
  for (let i = 0; i < n; i++) {
    const v = rng.normal();
    const l = limits.length === 1 ? limits[0] : limits[rng.integer(limits.length)];
    if (v < l) {
      x[i] = l;
      c[i] = -1;
      k++;
    } else {
      x[i] = v;
      c[i] = 0;
    }
  }
  if (n - k < 3) return undefined;
  const g = _positionsSorted(censoredSample(x, c), BLOM_OFFSET);
  return { k, y: Math.log(_oneMinusWPrime(g)) };
}

function quantiles(ys: number[]): number[] {
  const s = Float64Array.from(ys).sort();
  return PROBS.map((p) => {
    const h = (s.length - 1) * p;
    const lo = Math.floor(h);
    return s[lo] + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)] ?? s[lo]) - s[lo]);
  });
}

/** The one-limit table's columns at one n (by the number censored). */
function calibrateOne(n: number): number[][] {
  const rng = seededRandom(1000 + n);
  const byK: number[][] = Array.from({ length: n + 1 }, () => []);
  const x = new Float64Array(n);
  const c = new Int8Array(n);
  const total = samplesFor(n);
  for (let t = 0; t < total; t++) {
    const r = simulate(n, limitsFor(false, rng, 0), rng, x, c);
    if (r) byK[r.k].push(r.y);
  }
  const columns: number[][] = [];
  for (const delta of GRID_DELTA) {
    if (delta === 0) {
      columns.push(quantiles(byK[0]));
      continue;
    }
    if (n <= 40) {
      const kMax = n - 3;
      const at = Math.min(delta * n, kMax);
      const k1 = Math.floor(at + 1e-9);
      const k2 = Math.min(k1 + 1, kMax);
      const w = at - k1 < 1e-9 ? 0 : at - k1;
      const q1 = quantiles(byK[k1]);
      const q2 = w === 0 ? q1 : quantiles(byK[k2]);
      columns.push(q1.map((v, i) => (1 - w) * v + w * q2[i]));
      continue;
    }
    const pooled: number[] = [];
    for (let k = 0; k <= n; k++) {
      if (Math.abs(k / n - delta) <= 0.025 + 1e-12) { for (const y of byK[k]) pooled.push(y); }
    }
    columns.push(quantiles(pooled));
  }
  return columns;
}

/** The several-limit table's columns at one n (by the expected fraction). */
function calibrateSeveral(n: number, complete: number[]): number[][] {
  const rng = seededRandom(2000 + n);
  const x = new Float64Array(n);
  const c = new Int8Array(n);
  const perCell = Math.ceil(samplesFor(n) / 10);
  let last = complete;
  return GRID_DELTA.map((delta) => {
    if (delta === 0) return complete;
    const ys: number[] = [];
    for (let t = 0, tries = 0; t < perCell && tries < 20 * perCell; tries++) {
      const r = simulate(n, limitsFor(true, rng, delta), rng, x, c);
      if (r) {
        ys.push(r.y);
        t++;
      }
    }
    // Too few testable samples at this n and fraction: repeat the last column
    // (the test never reaches it at this n).
    if (ys.length >= perCell / 2) last = quantiles(ys);
    return last;
  });
}

function calibrate(n: number): { one: number[][]; several: number[][] } {
  const one = calibrateOne(n);
  const several = calibrateSeveral(n, one[0]);
  const q95 = (t: number[][]) => [0, 6, 10, 16].map((j) => t[j][2].toFixed(3)).join(", ");
  console.log(
    `n = ${n}: q95 at fractions 0, 0.3, 0.5, 0.8: one limit ${q95(one)}; several ${q95(several)}`,
  );
  return { one, several };
}

function rows(t: number[][][]): string {
  const fmt = (v: number) => v.toFixed(4);
  return t.map((cols, i) =>
    `  // n = ${GRID_N[i]}\n  [\n${
      cols.map((q) => `    [${q.map(fmt).join(", ")}],`).join("\n")
    }\n  ],`
  ).join("\n");
}

if (import.meta.main) {
  const all = GRID_N.map(calibrate);
  const single = rows(all.map((t) => t.one));
  const multiple = rows(all.map((t) => t.several));
  const text = `// Generated by tools/sim/censored_null.ts: do not edit by hand, rerun the script.
// deno-fmt-ignore-file
/**
 * Null quantiles of ln(1 − W′) for the censored-sample Shapiro–Francia test
 * (lib/stats/censored_normality.ts), written by
 * tools/sim/censored_null.ts: seeded simulation (seed 1000 + n for
 * one limit, 2000 + n for several); one limit: ${samplesFor(5)} samples per n
 * up to 200, ${samplesFor(300)} up to 1000 and ${samplesFor(2000)} above;
 * several limits: a tenth of that per fraction (see the script for the
 * censoring configurations). Do not edit by hand: rerun
 * the script.
 *
 * @module
 */

/** The total sample sizes of the grid. */
export const _NULL_N: readonly number[] = [${GRID_N.join(", ")}];

/** The censored fractions of the grid. */
export const _NULL_DELTA: readonly number[] = [${GRID_DELTA.join(", ")}];

/**
 * One limit: [n][fraction] → the 50%, 90%, 95% and 99% quantiles of
 * ln(1 − W′) under normality.
 */
export const _NULL_ONE_LIMIT: readonly (readonly (readonly number[])[])[] = [
${single}
];

/** Two to four limits: as {@linkcode _NULL_ONE_LIMIT}. */
export const _NULL_SEVERAL_LIMITS: readonly (readonly (readonly number[])[])[] = [
${multiple}
];
`;
  const path = new URL("../../lib/stats/_censored_null_table.ts", import.meta.url);
  await Deno.writeTextFile(path, text);
  console.log(`wrote ${path.pathname}`);
}
