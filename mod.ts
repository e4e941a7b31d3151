/**
 * plumbline: can these measurements be treated as normally distributed, and
 * if not, which re-expression makes them so?
 *
 * @example
 * ```ts
 * import { shapiroWilk } from "./mod.ts";
 * const r = shapiroWilk([148, 154, 158, 160, 161, 162, 166, 170, 182, 195, 236]);
 * if (Math.abs(r.statistic - 0.7888146948353876) > 1e-12) throw new Error("W");
 * ```
 *
 * @module
 */
export { PlumbError, type PlumbErrorCode } from "./lib/errors.ts";
export type { TestResult } from "./lib/stats/result.ts";
export { normalCdf, normalPdf, normalQuantile, normalSf } from "./lib/numeric/normal.ts";
export { type RandomStream, seededRandom } from "./lib/numeric/random.ts";
export { shapiroWilk } from "./lib/stats/shapiro_wilk.ts";
export { shapiroFrancia } from "./lib/stats/shapiro_francia.ts";
export { type Moments, moments } from "./lib/stats/moments.ts";
export { andersonDarling, type AndersonDarlingResult } from "./lib/stats/anderson_darling.ts";
export { lilliefors, type LillieforsResult } from "./lib/stats/lilliefors.ts";
export { dagostinoPearson, type DagostinoPearsonResult } from "./lib/stats/dagostino_pearson.ts";
export { jarqueBera } from "./lib/stats/jarque_bera.ts";
export {
  type Adjustment,
  adjustPValues,
  benjaminiHochbergAdjust,
  holmAdjust,
} from "./lib/stats/multiplicity.ts";
export { sortFloat64 } from "./lib/numeric/sort.ts";
