/**
 * The Shapiro–Francia test of normality, W′ and its p-value by Royston's
 * approximation.
 *
 * @module
 */
import { normalSf } from "../numeric/normal.ts";
import { blomScoresUpper } from "./plotting_positions.ts";
import { checkSize, sortedSample } from "./_input.ts";
import { roundingWarning } from "./rounding.ts";
import { freezeResult, type TestResult } from "./result.ts";

const _NAME = "the Shapiro–Francia test";
const _MIN_N = 5;
const _MAX_N = 5000;

/**
 * Royston's (1993) normalising approximation for the Shapiro–Francia
 * statistic: ln(1 − W′) of a normal sample of n is treated as normal with
 * mean −1.2725 + 1.0521(v − u) and sd 1.0308 − 0.26758(v + 2/u), where
 * u = ln n and v = ln u (Royston, P. (1993), "A pocket-calculator algorithm
 * for the Shapiro–Francia test for non-normality: an application to
 * medicine", Statistics in Medicine 12:181–184; constants transcribed from
 * memory of the paper). Royston fits 5 ≤ n ≤ 5000.
 *
 * @param n the sample size
 * @example
 * ```ts
 * import { shapiroFranciaNull } from "./shapiro_francia.ts";
 * const { mean, sd } = shapiroFranciaNull(100);
 * if (!(mean < -4 && sd > 0)) throw new Error("ln(1 − W′) is small and spread for normal data");
 * ```
 */
export function shapiroFranciaNull(n: number): { readonly mean: number; readonly sd: number } {
  const u = Math.log(n);
  const v = Math.log(u);
  return { mean: -1.2725 + 1.0521 * (v - u), sd: 1.0308 - 0.26758 * (v + 2 / u) };
}

/**
 * Shapiro–Francia W′ (Shapiro & Francia 1972, Journal of the American
 * Statistical Association 67:215–216): the squared correlation between the
 * ordered sample and approximate expected normal order statistics, here
 * Blom's scores m_i = Φ⁻¹((i − 3/8)/(n + 1/4)).
 *
 * p-value by Royston's approximation (Royston 1993, see
 * {@linkcode shapiroFranciaNull}): log(1 − W′) is treated as normal, and the
 * p-value is its upper tail. Royston states the approximation for
 * 5 ≤ n ≤ 5000. (The constants were transcribed from memory of the published
 * paper; the reference test checks the arithmetic against an independent
 * implementation, not the constants.)
 *
 * Errors: `PlumbError` with code `"too-few"` (n < 5), `"too-many"`
 * (n > 5000), `"non-finite"`, `"constant"`.
 *
 * @param x the sample, any order
 * @returns a frozen {@linkcode TestResult} with `statisticName: "W′"`
 *
 * @example
 * ```ts
 * import { shapiroFrancia } from "@plumbline/plumbline";
 * const r = shapiroFrancia([2.1, 2.9, 3.2, 3.3, 3.8, 4.1, 4.4, 5.0, 5.6, 7.9]);
 * if (!(r.statistic > 0.8 && r.statistic <= 1 && r.pValue > 0.05)) throw new Error("unexpected");
 * ```
 */
export function shapiroFrancia(x: ArrayLike<number>): TestResult {
  return _shapiroFranciaSorted(sortedSample(x, _NAME, _MIN_N, _MAX_N));
}

/**
 * {@linkcode shapiroFrancia} on a sample already sorted ascending, finite
 * and not constant (the size is checked here); `ties` is the sample's
 * rounding warning (`roundingWarning(s, true)`), when the caller has scanned for ties already.
 */
export function _shapiroFranciaSorted(
  s: Float64Array,
  ties: string | undefined = roundingWarning(s, true),
): TestResult {
  const n = s.length;
  checkSize(n, _MIN_N, _MAX_N, _NAME);
  const m = blomScoresUpper(n);
  let ss = 0;
  for (let k = 0; k < m.length; k++) ss += 2 * m[k] * m[k];
  const lo = s[0];
  // Centre and scale by the range; when the range overflows (values near
  // ±1.8e308 of both signs), halve before subtracting.
  const halve = !Number.isFinite(s[n - 1] - lo);
  const scale = halve ? s[n - 1] / 2 - lo / 2 : s[n - 1] - lo;
  const unit = (v: number) => (halve ? v / 2 - lo / 2 : v - lo) / scale;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += unit(s[i]);
  mean /= n;
  let sxx = 0;
  let corr = 0;
  for (let i = 0; i < n; i++) {
    const d = unit(s[i]) - mean;
    sxx += d * d;
    corr += d;
  }
  sxx -= corr * corr / n;
  let sxm = 0;
  for (let k = 0; k < m.length; k++) {
    sxm += m[k] * (unit(s[n - 1 - k]) - unit(s[k]));
  }
  // 1 − W′ = (R − b)(R + b)/R² with R = √(Σm²·Sxx), b = Σ m x; accurate near 1.
  const root = Math.sqrt(ss * sxx);
  const oneMinus = Math.max(0, ((root - sxm) * (root + sxm)) / (ss * sxx));
  const w = 1 - oneMinus;
  const { mean: mu, sd: sigma } = shapiroFranciaNull(n);
  const p = oneMinus === 0 ? 1 : normalSf((Math.log(oneMinus) - mu) / sigma);
  const warnings: string[] = [];
  if (ties) warnings.push(ties);
  return freezeResult({
    test: "Shapiro–Francia",
    statisticName: "W′",
    statistic: w,
    pValue: p,
    n,
    method: "Royston (1993) approximation, Blom scores",
    warnings,
  });
}
