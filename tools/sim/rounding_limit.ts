/**
 * How coarse may rounding be before it alone makes Shapiro–Wilk reject a
 * normal sample? Seeded simulation behind `lib/stats/rounding.ts`.
 *
 * For each n and each c, 2,000 standard normal samples are rounded to a
 * grid of step h = r·σ with r = c/√n (with a uniform random grid offset, so
 * that no grid position is favoured) and tested at the 5% level. The table
 * gives the rejection rate in percent, and the c at which the rate crosses
 * 10% (twice the nominal 5%), by linear interpolation between columns. The
 * limit used in `lib/stats/rounding.ts` is h/σ ≤ min(0.35, 1.4/√n): the
 * c = 1.4 column stays at or below about 10% from n = 10 on, and the cap
 * 0.35 covers the smaller samples (last column).
 *
 * Run: `deno run tools/sim/rounding_limit.ts` (about 5 minutes); the table
 * is the one in README ("Rounding against the spread").
 *
 * @module
 */
import { seededRandom } from "../../lib/numeric/random.ts";
import { sortFloat64 } from "../../lib/numeric/sort.ts";
import { _shapiroWilkSorted } from "../../lib/stats/shapiro_wilk.ts";
import { roundingLimit } from "../../lib/stats/rounding.ts";

const REPS = 2000;
const CS = [0.05, 0.1, 0.25, 0.5, 1, 1.2, 1.4, 1.6, 1.8, 2, 2.2, 2.4, 2.7, 3];
const SIZES = [3, 4, 5, 6, 8, 10, 20, 50, 100, 200, 500, 1000, 2000, 5000];

const rng = seededRandom(20261203);
const lines: string[] = [
  `| n | ${CS.map((c) => `c = ${c}`).join(" | ")} | c at 10% | limit h/σ used |`,
  `| ---: | ${CS.map(() => "---:").join(" | ")} | ---: | ---: |`,
];
for (const n of SIZES) {
  const rates: number[] = [];
  for (const c of CS) {
    const r = c / Math.sqrt(n);
    let rejected = 0;
    for (let k = 0; k < REPS; k++) {
      const offset = rng.uniform();
      const x = new Float64Array(n);
      for (let i = 0; i < n; i++) x[i] = (Math.round(rng.normal() / r + offset) - offset) * r;
      const s = sortFloat64(x);
      // A sample rounded to one value has no shape: count it as a rejection (the worst case).
      if (s[0] === s[n - 1] || _shapiroWilkSorted(s).pValue < 0.05) rejected++;
    }
    rates.push((100 * rejected) / REPS);
  }
  let crossing = rates[0] > 10 ? "below 0.05" : "above 3";
  for (let j = 1; j < CS.length; j++) {
    if (rates[j - 1] <= 10 && rates[j] > 10) {
      const t = (10 - rates[j - 1]) / (rates[j] - rates[j - 1]);
      crossing = (CS[j - 1] + t * (CS[j] - CS[j - 1])).toFixed(2);
      break;
    }
  }
  lines.push(
    `| ${n} | ${rates.map((v) => v.toFixed(1)).join(" | ")} | ${crossing} | ${
      roundingLimit(n).toFixed(3)
    } |`,
  );
  console.error(`n = ${n} done`);
}
console.log(
  `Shapiro–Wilk rejection rate (%) at the 5% level for normal samples rounded to ` +
    `h = (c/√n)·σ (${REPS} samples per cell, seed 20261203)\n`,
);
console.log(lines.join("\n"));
