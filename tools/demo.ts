/**
 * `deno task demo`: a short worked analysis of invented data.
 *
 * The data are invented: a seeded simulation of net fill volume (mL) on one
 * filler line of a fictional bottling plant, and of minutes between
 * stoppages on the same line. Nothing here is a real measurement.
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { shapiroFrancia } from "../lib/stats/shapiro_francia.ts";
import { shapiroWilk } from "../lib/stats/shapiro_wilk.ts";

const rng = seededRandom(2026);
const fill = Array.from({ length: 60 }, () => 500.4 + 1.2 * rng.normal());
const gaps = Array.from({ length: 60 }, () => -35 * Math.log(rng.uniform()));

function line(name: string, x: number[]): string {
  const w = shapiroWilk(x);
  const f = shapiroFrancia(x);
  const p = (v: number) => (v < 0.001 ? "< 0.001" : `= ${v.toFixed(3)}`);
  return `${name.padEnd(28)} n = ${w.n}  W = ${w.statistic.toFixed(4)}, p ${p(w.pValue)}` +
    `   W′ = ${f.statistic.toFixed(4)}, p ${p(f.pValue)}`;
}

console.log("plumbline demo — invented data from a fictional bottling plant (filler line A)\n");
console.log(line("net fill volume (mL)", fill));
console.log(line("minutes between stoppages", gaps));
console.log(
  "\nA small p says the shape departs from normal; a large p alone does not show normality.\n" +
    "A normality check is one input to a decision taken under your own procedures and the\n" +
    "applicable standards, not the decision itself.",
);
