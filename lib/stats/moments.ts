/**
 * Sample moments: mean, standard deviation, skewness and excess kurtosis,
 * both the plain moment ratios and their bias-adjusted forms with standard
 * errors.
 *
 * @module
 */
import { ldexp, rescaleExponent } from "../numeric/ldexp.ts";
import { checkNotConstant, checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";

/** Mean, spread and shape of a sample. Frozen plain data. */
export interface Moments {
  /** Number of values. */
  readonly n: number;
  /** Arithmetic mean. */
  readonly mean: number;
  /** Standard deviation with divisor n − 1. */
  readonly sd: number;
  /** Moment skewness g1 = m3 / m2^(3/2) (divisor n in every mᵣ). */
  readonly g1: number;
  /** Moment excess kurtosis g2 = m4 / m2² − 3. */
  readonly g2: number;
  /** Adjusted skewness G1 = g1 √(n(n−1)) / (n−2). */
  readonly G1: number;
  /** Adjusted excess kurtosis G2 = ((n+1) g2 + 6)(n−1) / ((n−2)(n−3)). */
  readonly G2: number;
  /** Standard error of G1 under normality (Joanes & Gill's SES). */
  readonly seG1: number;
  /** Standard error of G2 under normality (Joanes & Gill's SEK). */
  readonly seG2: number;
}

/**
 * Internal summary shared by the moment-based tests. The sample is handled
 * as u = x·2^scaleExp (an exact rescaling, 0 unless the magnitudes are
 * extreme); `centreHi + centreLo` is the mean of u carried in two parts and
 * `sdScaled` the sd of u, so that {@linkcode _zScore} stays accurate
 * when the spread is tiny next to the mean and cannot overflow.
 */
export interface _Shape {
  readonly mean: number;
  readonly sd: number;
  readonly g1: number;
  readonly g2: number;
  readonly scaleExp: number;
  readonly centreHi: number;
  readonly centreLo: number;
  readonly sdScaled: number;
}

/**
 * Mean, standard deviation, g1 and g2 of a finite sample with n ≥ 2,
 * throwing `PlumbError("constant")` (naming `what`) when it has zero range.
 *
 * Method: values are first rescaled by an exact power of two when their
 * magnitude is extreme; the mean is a compensated sum (Neumaier 1974,
 * ZAMM 54:39–51); the central sums Σd, Σd², Σd³, Σd⁴ of d = x − mean are
 * compensated sums too, and the residual Σd/n (the rounding left in the
 * mean) is folded back through the binomial expansion of the moments about
 * the exact mean. This keeps g1 and g2 accurate to about 1e−12 even for
 * values like 1e9 + 0.001·noise, where a plain two-pass loses most digits
 * (checked in tests/stats/moments_test.ts).
 */
export function _sampleShape(s: Float64Array, what: string): _Shape {
  const n = s.length;
  let lo = s[0];
  let hi = s[0];
  for (let i = 1; i < n; i++) {
    const v = s[i];
    if (v < lo) lo = v;
    else if (v > hi) hi = v;
  }
  if (lo === hi) checkNotConstant(s, what); // a constant sample is sorted, so this throws
  const k = rescaleExponent(Math.max(Math.abs(lo), Math.abs(hi)));
  const u = k === 0 ? s : s.map((v) => ldexp(v, k));

  // Pass 1: compensated mean.
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < n; i++) {
    const v = u[i];
    const t = sum + v;
    comp += Math.abs(sum) >= Math.abs(v) ? (sum - t) + v : (v - t) + sum;
    sum = t;
  }
  const c0 = (sum + comp) / n;

  // Pass 2: compensated power sums of the deviations.
  let s1 = 0, e1 = 0, s2 = 0, e2 = 0, s3 = 0, e3 = 0, s4 = 0, e4 = 0;
  for (let i = 0; i < n; i++) {
    const d = u[i] - c0;
    const d2 = d * d;
    const d3 = d2 * d;
    const d4 = d2 * d2;
    let t = s1 + d;
    e1 += Math.abs(s1) >= Math.abs(d) ? (s1 - t) + d : (d - t) + s1;
    s1 = t;
    t = s2 + d2;
    e2 += s2 >= d2 ? (s2 - t) + d2 : (d2 - t) + s2;
    s2 = t;
    t = s3 + d3;
    e3 += Math.abs(s3) >= Math.abs(d3) ? (s3 - t) + d3 : (d3 - t) + s3;
    s3 = t;
    t = s4 + d4;
    e4 += s4 >= d4 ? (s4 - t) + d4 : (d4 - t) + s4;
    s4 = t;
  }
  return _shapeFromSums(n, c0, [s1 + e1, s2 + e2, s3 + e3, s4 + e4], k);
}

/**
 * The {@linkcode _Shape} from the sums Σd, Σd², Σd³, Σd⁴ of the deviations
 * d = u − c0 of n values u = x·2ᵏ about a centre c0 near their mean: the
 * residual Σd/n (the rounding left in the centre) is folded back through
 * the binomial expansion of the moments about the exact mean.
 */
export function _shapeFromSums(
  n: number,
  c0: number,
  sums: readonly [number, number, number, number],
  k: number,
): _Shape {
  const delta = sums[0] / n;
  const a2 = sums[1] / n;
  const a3 = sums[2] / n;
  const a4 = sums[3] / n;
  const dd = delta * delta;
  const m2 = a2 - dd;
  const m3 = a3 - 3 * delta * a2 + 2 * dd * delta;
  const m4 = a4 - 4 * delta * a3 + 6 * dd * a2 - 3 * dd * dd;
  const sdScaled = Math.sqrt(m2 * n / (n - 1));
  return {
    mean: ldexp(c0 + delta, -k),
    sd: ldexp(sdScaled, -k),
    g1: m3 / (m2 * Math.sqrt(m2)),
    g2: m4 / (m2 * m2) - 3,
    scaleExp: k,
    centreHi: c0,
    centreLo: delta,
    sdScaled,
  };
}

/**
 * Mean and standard deviation (divisor n − 1) of a finite sample of n ≥ 2:
 * those of {@linkcode _sampleShape}, and an sd of exactly 0 for a constant
 * sample (which `_sampleShape` refuses). The one place outside the moments
 * summary where a mean and sd are taken.
 */
export function _meanSd(x: Float64Array): { readonly mean: number; readonly sd: number } {
  let lo = x[0];
  let hi = x[0];
  for (let i = 1; i < x.length; i++) {
    if (x[i] < lo) lo = x[i];
    else if (x[i] > hi) hi = x[i];
  }
  if (lo === hi) return { mean: lo, sd: 0 };
  const { mean, sd } = _sampleShape(x, "a mean and standard deviation");
  return { mean, sd };
}

/** The z-score (v − mean)/sd of one value of the sample described by `shape`. */
export function _zScore(v: number, shape: _Shape): number {
  const k = shape.scaleExp;
  const u = k === 0 ? v : ldexp(v, k);
  return (u - shape.centreHi - shape.centreLo) / shape.sdScaled;
}

/**
 * Mean, standard deviation (divisor n − 1), moment skewness and excess
 * kurtosis, and their bias-adjusted forms with standard errors.
 *
 * Definitions follow Joanes & Gill (1998, "Comparing measures of sample
 * skewness and kurtosis", The Statistician 47:183–189): g1 = m3/m2^(3/2)
 * and g2 = m4/m2² − 3 with mᵣ = Σ(x − x̄)ʳ/n; G1 = g1·√(n(n−1))/(n−2) and
 * G2 = ((n+1)·g2 + 6)·(n−1)/((n−2)(n−3)); under normality
 * SES = √(6n(n−1)/((n−2)(n+1)(n+3))) and SEK = 2·SES·√((n²−1)/((n−3)(n+5))).
 * G1 equals scipy's `skew(bias=False)` and G2 its `kurtosis(bias=False)`.
 *
 * Accuracy: within about 1e−12 (relative) of 60-digit mpmath values on the
 * reference samples, including 1e9 + small noise (see `_sampleShape` for
 * the method). Any finite magnitudes are accepted.
 *
 * One rule for the size: n ≥ 4 is required, because G2 and SEK divide by
 * n − 3; with that every field is a finite number.
 *
 * @param x the sample: finite numbers, at least 4, not all equal
 * @throws {PlumbError} `"too-few"` below 4 values, `"non-finite"` for NaN,
 *   ±Infinity or a non-number, `"constant"` when every value is the same
 *
 * @example
 * ```ts
 * import { moments } from "@plumbline/plumbline";
 * const m = moments([2, 4, 4, 4, 5, 5, 7, 9]);
 * if (m.mean !== 5) throw new Error("mean");
 * if (Math.abs(m.sd - Math.sqrt(32 / 7)) > 1e-15) throw new Error("sd");
 * if (!(m.g1 > 0)) throw new Error("right skewed");
 * ```
 */
export function moments(x: ArrayLike<number>): Moments {
  const what = "the skewness and kurtosis summary";
  checkSize(x.length, 4, Number.POSITIVE_INFINITY, what);
  const s = finiteCopy(x, what);
  const n = s.length;
  return _momentsOf(n, _sampleShape(s, what));
}

/**
 * The {@linkcode Moments} of a sample of `n` values from its
 * {@linkcode _sampleShape} (n ≥ 4), for callers that already hold the
 * shape; throws `PlumbError("non-finite")` when the sd overflows.
 */
export function _momentsOf(n: number, shape: _Shape): Moments {
  const what = "the skewness and kurtosis summary";
  const { mean, sd, g1, g2 } = shape;
  checkSpreadFinite(sd, what);
  const seG1 = Math.sqrt((6 * n * (n - 1)) / ((n - 2) * (n + 1) * (n + 3)));
  return Object.freeze({
    n,
    mean,
    sd,
    g1,
    g2,
    G1: (g1 * Math.sqrt(n * (n - 1))) / (n - 2),
    G2: (((n + 1) * g2 + 6) * (n - 1)) / ((n - 2) * (n - 3)),
    seG1,
    seG2: 2 * seG1 * Math.sqrt((n * n - 1) / ((n - 3) * (n + 5))),
  });
}
