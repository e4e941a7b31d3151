/**
 * Seeded simulation of the intervals in the stakes view: how often each
 * covers its true value for normal data, and what the normal-theory range
 * does to lognormal data. Writes Markdown tables (for README.md) to stdout.
 *
 * Run: `deno run tools/simulate_stakes.ts [--reps N]` (default 4000; the
 * bootstrap rows use a quarter of that, each with 1000 resamples).
 *
 * @module
 */
import { normalCdf, normalQuantile } from "../lib/numeric/normal.ts";
import { type RandomStream, seededRandom } from "../lib/numeric/random.ts";
import { sortFloat64 } from "../lib/numeric/sort.ts";
import { bootstrapMean } from "../lib/stats/bootstrap_bca.ts";
import { capabilityIndices } from "../lib/stats/capability.ts";
import { tInterval } from "../lib/stats/mean_interval.ts";
import { clopperPearson } from "../lib/stats/proportion_interval.ts";
import { _quantileIntervalSorted, quantileRanks } from "../lib/stats/quantile_interval.ts";

/** Coverage counts of the intervals on normal data (μ = 0, σ = 1). */
export interface NormalCoverage {
  readonly n: number;
  readonly reps: number;
  /** t interval for the mean, 95%. */
  readonly t: number;
  /** 90% order-statistic interval of the 2.5% quantile (bounded or open). */
  readonly rankLower: number;
  /** Clopper–Pearson 95% interval of the fraction outside ±2 (true 4.55%). */
  readonly outside: number;
  /** Bissell 95% interval of Cpk, limits −3.6 and 3 (true Cpk 1). */
  readonly cpk: number;
  /** χ² 95% interval of Cp, same limits (true Cp 1.1). */
  readonly cp: number;
  /** Mean true content of x̄ ± 1.96s (nominal 0.95). */
  readonly rangeContent: number;
  /** BCa 95% interval for the mean (bootstrapReps samples). */
  readonly bca: number;
  readonly bootstrapReps: number;
}

function _normals(rng: RandomStream, n: number): Float64Array {
  return Float64Array.from({ length: n }, () => rng.normal());
}

/**
 * Coverage of every interval for normal samples of size n.
 *
 * @param n sample size
 * @param reps samples (the bootstrap uses reps/4, each with 1000 resamples)
 * @param seed seed
 */
export function normalCoverage(n: number, reps: number, seed: number): NormalCoverage {
  const rng = seededRandom(seed);
  const z = normalQuantile(0.975);
  const q025 = normalQuantile(0.025);
  const trueOutside = 2 * normalCdf(-2);
  const ranks = quantileRanks(n, 0.025);
  let t = 0, rankLower = 0, outside = 0, cpk = 0, cp = 0, content = 0, bca = 0;
  const bootstrapReps = Math.max(1, Math.floor(reps / 4));
  for (let r = 0; r < reps; r++) {
    const x = _normals(rng, n);
    const ti = tInterval(x);
    if (ti.interval[0] <= 0 && 0 <= ti.interval[1]) t++;
    const s = sortFloat64(x.slice());
    const [a, b] = _quantileIntervalSorted(s, ranks).interval;
    if ((a === null || a <= q025) && (b === null || q025 <= b)) rankLower++;
    let k = 0;
    for (const v of x) if (v < -2 || v > 2) k++;
    const [lo, hi] = clopperPearson(k, n);
    if (lo <= trueOutside && trueOutside <= hi) outside++;
    const c = capabilityIndices({ n, mean: ti.mean, sd: ti.sd }, { lower: -3.6, upper: 3 });
    if (c.cpkCi[0] <= 1 && 1 <= c.cpkCi[1]) cpk++;
    if (c.cpCi![0] <= 1.1 && 1.1 <= c.cpCi![1]) cp++;
    content += normalCdf(ti.mean + z * ti.sd) - normalCdf(ti.mean - z * ti.sd);
    if (r < bootstrapReps) {
      const bi = bootstrapMean(x, { resamples: 1000, seed: r + 1 }).interval;
      if (bi[0] !== null && bi[1] !== null && bi[0] <= 0 && 0 <= bi[1]) bca++;
    }
  }
  return {
    n,
    reps,
    t: t / reps,
    rankLower: rankLower / reps,
    outside: outside / reps,
    cpk: cpk / reps,
    cp: cp / reps,
    rangeContent: content / reps,
    bca: bca / bootstrapReps,
    bootstrapReps,
  };
}

/** What the central range does to lognormal data (log x ~ N(0, σ²)). */
export interface LognormalRange {
  readonly n: number;
  readonly sigma: number;
  readonly reps: number;
  /** Mean population share below the normal-theory lower limit (nominal 0.025). */
  readonly normalBelow: number;
  /** Mean population share above the normal-theory upper limit (nominal 0.025). */
  readonly normalAbove: number;
  /** Share of samples whose normal-theory lower limit is below 0. */
  readonly normalNegative: number;
  /** Mean share below / above the log-scale range mapped back. */
  readonly logBelow: number;
  readonly logAbove: number;
  /** Coverage of the 95% t interval for the true mean exp(σ²/2). */
  readonly t: number;
  /** Coverage of the 95% BCa interval for the true mean (bootstrapReps samples). */
  readonly bca: number;
  readonly bootstrapReps: number;
}

/**
 * The central range's tail shares for lognormal samples.
 *
 * @param n sample size
 * @param sigma sd of log x
 * @param reps samples
 * @param seed seed
 */
export function lognormalRange(
  n: number,
  sigma: number,
  reps: number,
  seed: number,
): LognormalRange {
  const rng = seededRandom(seed);
  const z = normalQuantile(0.975);
  const trueMean = Math.exp((sigma * sigma) / 2);
  // share of the population below a value v > 0: Φ(log v / σ)
  const below = (v: number) => (v <= 0 ? 0 : normalCdf(Math.log(v) / sigma));
  let nb = 0, na = 0, neg = 0, lb = 0, la = 0, t = 0, bca = 0;
  const bootstrapReps = Math.max(1, Math.floor(reps / 4));
  for (let r = 0; r < reps; r++) {
    const y = _normals(rng, n).map((v) => v * sigma);
    const x = y.map(Math.exp);
    const tx = tInterval(x);
    const lo = tx.mean - z * tx.sd;
    const hi = tx.mean + z * tx.sd;
    nb += below(lo);
    na += 1 - below(hi);
    if (lo < 0) neg++;
    const ty = tInterval(y);
    lb += normalCdf((ty.mean - z * ty.sd) / sigma);
    la += 1 - normalCdf((ty.mean + z * ty.sd) / sigma);
    if (tx.interval[0] <= trueMean && trueMean <= tx.interval[1]) t++;
    if (r < bootstrapReps) {
      const bi = bootstrapMean(x, { resamples: 1000, seed: r + 1 }).interval;
      if (bi[0] !== null && bi[1] !== null && bi[0] <= trueMean && trueMean <= bi[1]) bca++;
    }
  }
  return {
    n,
    sigma,
    reps,
    normalBelow: nb / reps,
    normalAbove: na / reps,
    normalNegative: neg / reps,
    logBelow: lb / reps,
    logAbove: la / reps,
    t: t / reps,
    bca: bca / bootstrapReps,
    bootstrapReps,
  };
}

function _f(v: number, digits = 3): string {
  return v.toFixed(digits);
}

if (import.meta.main) {
  const i = Deno.args.indexOf("--reps");
  const reps = i >= 0 ? Number(Deno.args[i + 1]) : 4000;
  const started = performance.now();
  console.log(
    `Normal data, ${reps} samples per row (BCa: ${Math.floor(reps / 4)} samples, 1000 resamples ` +
      "each); nominal levels in the header.\n",
  );
  console.log(
    "| n | t interval (0.95) | BCa (0.95) | rank 2.5% limit (≥ 0.90) | Clopper–Pearson (≥ 0.95) " +
      "| Cpk, Bissell (0.95) | Cp, χ² (0.95) | content of x̄ ± 1.96s (0.95) |",
  );
  console.log("| --: | --: | --: | --: | --: | --: | --: | --: |");
  for (const [k, n] of [20, 50, 120, 500].entries()) {
    const c = normalCoverage(n, reps, 1000 + k);
    console.log(
      `| ${n} | ${_f(c.t)} | ${_f(c.bca)} | ${_f(c.rankLower)} (exact ` +
        `${_f(quantileRanks(n, 0.025).coverage)}) | ${_f(c.outside)} | ${_f(c.cpk)} ` +
        `| ${_f(c.cp)} | ${_f(c.rangeContent)} |`,
    );
  }
  console.log(
    `\nLognormal data (log x ~ N(0, σ²)), ${reps} samples per row: the population share outside ` +
      "each 95% range (nominal 0.025 on each side), and the coverage of the true mean by the t " +
      `and BCa intervals (BCa: ${Math.floor(reps / 4)} samples, 1000 resamples each).\n`,
  );
  console.log(
    "| n | σ | below normal lower | above normal upper | normal lower < 0 | below log-scale lower " +
      "| above log-scale upper | t interval (0.95) | BCa (0.95) |",
  );
  console.log("| --: | --: | --: | --: | --: | --: | --: | --: | --: |");
  for (const [k, [n, s]] of [[30, 0.5], [120, 0.5], [30, 1], [120, 1], [500, 1]].entries()) {
    const l = lognormalRange(n, s, reps, 2000 + k);
    console.log(
      `| ${n} | ${s} | ${_f(l.normalBelow, 4)} | ${_f(l.normalAbove, 4)} | ${
        _f(l.normalNegative)
      } ` +
        `| ${_f(l.logBelow, 4)} | ${_f(l.logAbove, 4)} | ${_f(l.t)} | ${_f(l.bca)} |`,
    );
  }
  console.log(`\n(${((performance.now() - started) / 1000).toFixed(0)} s)`);
}
