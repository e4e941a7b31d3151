/**
 * Shapiro–Wilk's W as geometry on the QQ plot: the ratio of two estimates
 * of the standard deviation.
 *
 * Shapiro & Wilk (1965, Biometrika 52:591–611) built W from the
 * generalised-least-squares fit of the ordered sample on the expected normal
 * order statistics m: the slope of that fit, σ̂ = m′V⁻¹x / m′V⁻¹m, is the
 * best linear unbiased estimate of σ from the order statistics, and
 * b = Σ aᵢx₍ᵢ₎ with a = m′V⁻¹/‖m′V⁻¹‖ is that slope up to a constant
 * (b = σ̂·m′V⁻¹m/‖m′V⁻¹‖). The intercept of the same fit is the sample mean
 * (Lloyd 1952, Biometrika 39:88–95: for a symmetric parent m′V⁻¹1 = 0).
 * W = b²/Σ(xᵢ − x̄)².
 *
 * plumbline states the slope on the scale of the sample sd:
 *   slope = b/√(n − 1),  so that  W = (slope / sd)²  exactly,
 * with sd the usual standard deviation (divisor n − 1). The slope is an
 * estimate of σ that rests on the order statistics through the bulk, the sd
 * one that squares every deviation; an outlier or a long tail inflates the
 * sd far more than the slope, and W falls by the square of their ratio.
 * Under normality the two agree on average up to the small bias that also
 * keeps E[W] below 1.
 *
 * The coefficients aᵢ are Royston's approximation (Royston 1992, Statistics
 * and Computing 2:117–119; Algorithm AS R94, Royston 1995), the ones
 * `shapiroWilk` uses, from `shapiroWilkCoefficients` (any n ≥ 3; the
 * p-value's calibration, not the coefficients, stops at 5000). The sums run
 * on the sample centred at its minimum and divided by its range, so that
 * neither large offsets nor extreme magnitudes cost digits. Checked against
 * R 4.2.2: the slope against the same published algorithm evaluated in R,
 * and (slope/sd)² against `shapiro.test`'s W, both to 1e-12
 * (tests/fixtures/shapiro_wilk_geometry.json).
 *
 * @module
 */
import { sortedSample } from "./_input.ts";
import { shapiroWilkCoefficients } from "./shapiro_wilk_coefficients.ts";

/** The two σ estimates behind W, as frozen plain data. */
export interface ShapiroWilkGeometry {
  /** Number of values. */
  readonly n: number;
  /** Σ aᵢx₍ᵢ₎ / √(n − 1): the QQ plot's order-statistic slope, an estimate of σ. */
  readonly slope: number;
  /** The sample mean: the intercept of the same line (at normal score 0). */
  readonly intercept: number;
  /** The sample standard deviation (divisor n − 1). */
  readonly sd: number;
  /** slope / sd. */
  readonly ratio: number;
  /** (slope / sd)², which is Shapiro–Wilk's W. */
  readonly W: number;
}

/**
 * The order-statistic slope of a sample's QQ plot and the W it implies.
 *
 * @param x the sample (finite numbers, at least 3, not all equal)
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { shapiroWilkGeometry } from "./shapiro_wilk_geometry.ts";
 * import { shapiroWilk } from "@plumbline/plumbline";
 * const x = [4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 9.5];
 * const g = shapiroWilkGeometry(x);
 * // the outlier inflates the sd far more than the slope through the bulk
 * if (!(g.slope < 0.8 * g.sd)) throw new Error("slope vs sd");
 * if (Math.abs(g.W - shapiroWilk(x).statistic) > 1e-13) throw new Error("W = (slope/sd)²");
 * ```
 */
export function shapiroWilkGeometry(x: ArrayLike<number>): ShapiroWilkGeometry {
  return _shapiroWilkGeometrySorted(sortedSample(x, "the Shapiro–Wilk slope", 3));
}

/** {@linkcode shapiroWilkGeometry} on a sample already sorted ascending, finite and not constant. */
export function _shapiroWilkGeometrySorted(s: Float64Array): ShapiroWilkGeometry {
  const n = s.length;
  const a = shapiroWilkCoefficients(n);
  const lo = s[0];
  // Halve before subtracting when the range itself would overflow.
  const halve = !Number.isFinite(s[n - 1] - lo);
  const range = halve ? s[n - 1] / 2 - lo / 2 : s[n - 1] - lo;
  const u = (v: number) => (halve ? v / 2 - lo / 2 : v - lo) / range;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += u(s[i]);
  mean /= n;
  let ss = 0;
  let drift = 0;
  for (let i = 0; i < n; i++) {
    const d = u(s[i]) - mean;
    ss += d * d;
    drift += d;
  }
  ss -= (drift * drift) / n; // corrected two-pass (Chan, Golub & LeVeque 1983)
  mean += drift / n;
  let b = 0;
  for (let k = 0; k < a.length; k++) b += a[k] * (u(s[n - 1 - k]) - u(s[k]));
  // Back to the data's units; when the range was halved, double the scaled
  // value first (it is at most about 1) so that nothing overflows on the way.
  const units = (v: number) => (halve ? 2 * v : v) * range;
  const root = Math.sqrt(n - 1);
  const sdScaled = Math.sqrt(ss) / root;
  const slopeScaled = b / root;
  const ratio = slopeScaled / sdScaled;
  return Object.freeze({
    n,
    slope: units(slopeScaled),
    intercept: halve ? lo + mean * range + mean * range : lo + mean * range,
    sd: units(sdScaled),
    ratio,
    W: Math.min(1, (b * b) / ss),
  });
}
