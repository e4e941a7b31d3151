/**
 * Seeded samples and one spec of every chart kind, shared by the render
 * tests. All data are invented.
 *
 * @module
 */
import type { TopLevelSpec } from "vega-lite";
import { normalSample } from "../_shared.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { comparisonSpec } from "../../lib/render/comparison_spec.ts";
import { groupSpec } from "../../lib/render/group_spec.ts";
import { histogramSpec } from "../../lib/render/histogram_spec.ts";
import { lambdaExplorerSpec } from "../../lib/render/lambda_explorer_spec.ts";
import { detrendedSpec, qqSpec } from "../../lib/render/qq_spec.ts";

/** Seeded standard normals. */
export const normals = normalSample;

/** A right-skewed positive sample: exp(μ + σ·Z). */
export function skewed(n: number, seed: number): Float64Array {
  return normals(n, seed).map((z) => Math.exp(1 + 0.5 * z));
}

function boxCox(x: Float64Array, l: number): Float64Array {
  return x.map((v) => (l === 0 ? Math.log(v) : (v ** l - 1) / l));
}

/** Chart kinds, in the order the tests report them. */
export const KINDS = ["qq", "detrended", "histogram", "comparison", "groups", "lambda"] as const;

/**
 * One spec of each kind for a sample of size n. W and p passed to the
 * panels are display inputs only (these tests check rendering, not tests).
 */
export function specsFor(
  n: number,
  name: string,
  seed = 1,
): Record<(typeof KINDS)[number], TopLevelSpec> {
  const x = skewed(n, seed);
  const q = qqData(x);
  const lambdas = Array.from({ length: 21 }, (_, k) => -1 + k * 0.1);
  const profile = lambdas.map((l) => {
    const y = boxCox(x, l);
    let m = 0;
    for (const v of y) m += v;
    m /= y.length;
    let ss = 0;
    for (const v of y) ss += (v - m) ** 2;
    let logSum = 0;
    for (const v of x) logSum += Math.log(v);
    return (-y.length / 2) * Math.log(ss / y.length) + (l - 1) * logSum;
  });
  const small = n > 20000 ? x.subarray(0, 20000) : x;
  return {
    qq: qqSpec(q, { name }),
    detrended: detrendedSpec(q, { name }),
    histogram: histogramSpec(histogramData(x), { name }),
    comparison: comparisonSpec([
      { label: name, qq: q, W: 0.91, p: 0.0001 },
      { label: `√(${name})`, qq: qqData(x.map(Math.sqrt)), W: 0.97, p: 0.02 },
      { label: `log(${name})`, qq: qqData(x.map(Math.log)), W: 0.998, p: 0.6, note: "best" },
    ], { name }),
    groups: groupSpec([
      { group: `${name} A`, qq: qqData(small.subarray(0, small.length / 2)) },
      { group: `${name} B`, qq: qqData(small.subarray(small.length / 2)) },
    ], { name, by: name }),
    lambda: lambdaExplorerSpec({
      lambdas,
      logLik: profile,
      lambdaHat: 0.02,
      ci: [-0.1, Infinity],
      perLambda: lambdas.map((l, k) => ({
        W: 0.9 + k / 300,
        p: k / 40,
        qq: qqData(boxCox(n > 20000 ? small : x, Math.round(l * 10) / 10), { maxPoints: 200 }),
      })),
    }, { name }),
  };
}
