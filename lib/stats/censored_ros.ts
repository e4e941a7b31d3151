/**
 * Regression on order statistics (ROS): mean and standard deviation of a
 * censored sample from a straight line through its measured values on a
 * normal probability plot.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { ldexp, rescaleExponent } from "../numeric/ldexp.ts";
import { normalQuantile } from "../numeric/normal.ts";
import {
  _checkOverlap,
  type _GroupedPositions,
  _limitIndex,
  _positionsSorted,
} from "./censored_positions.ts";
import type { CensoredSample } from "./censored_sample.ts";
import { BLOM_OFFSET, type PlottingOptions } from "./plotting_positions.ts";

/** The ROS estimates: plain, frozen data (`toJSON()` gives the imputed values as an array). */
export interface CensoredRos {
  /** Mean of the measured values and the values imputed for the censored ones. */
  readonly mean: number;
  /** Standard deviation (divisor n − 1) of the same n values. */
  readonly sd: number;
  /** Intercept of the line of measured values on normal scores (itself an estimate of the mean). */
  readonly intercept: number;
  /** Slope of that line (itself an estimate of the standard deviation). */
  readonly slope: number;
  /** Measured values as they are, censored ones replaced by their imputed values, in sample order. */
  readonly values: Float64Array;
  /** The method, in words. */
  readonly method: string;
  /** The same data with `values` as a plain array. */
  toJSON(): unknown;
}

/**
 * Least-squares line of the sorted measured values on their normal scores.
 * The values are scaled exactly by a power of two (so that nothing overflows
 * and subnormals keep their bits); intercept and slope are scaled back.
 */
export function _rosLine(g: _GroupedPositions): { intercept: number; slope: number } {
  const x = g.obs;
  const k = x.length;
  const e = _exponent(x);
  const z = new Float64Array(k);
  let zBar = 0;
  let uBar = 0;
  for (let i = 0; i < k; i++) {
    z[i] = normalQuantile(g.pObs[i]);
    zBar += z[i];
    uBar += ldexp(x[i], e);
  }
  zBar /= k;
  uBar /= k;
  let szz = 0;
  let szu = 0;
  for (let i = 0; i < k; i++) {
    const dz = z[i] - zBar;
    szz += dz * dz;
    szu += dz * (ldexp(x[i], e) - uBar);
  }
  const slope = szu / szz;
  return { intercept: ldexp(uBar - slope * zBar, -e), slope: ldexp(slope, -e) };
}

/**
 * Estimate the mean and standard deviation of a censored sample by
 * regression on order statistics, in the form Helsel calls robust ROS
 * (Helsel, D. R. (2012), *Statistics for Censored Environmental Data Using
 * Minitab and R*, 2nd ed., Wiley, chapter 6, "Computing summary statistics
 * and totals", the ROS section; chapter title from memory; the method
 * itself is Helsel & Cohn (1988), Water Resources Research 24(12):1997–2004):
 *
 * 1. plotting positions for every value by Hirsch & Stedinger (1987)
 *    (`censoredPositions`), with the given offset;
 * 2. a least-squares line of the measured values on their normal scores
 *    Φ⁻¹(p);
 * 3. each censored value is replaced by the line's value at its own
 *    position (spread below its limit, or above it for ">limit");
 * 4. the mean and sd (divisor n − 1) of the measured and imputed values
 *    together.
 *
 * Helsel fits the line to logarithms and back-transforms the imputed
 * values; here the line is fitted on the scale given, so ROS of a
 * log-transformed sample is his method. Imputed values are a device for the
 * summary statistics, not estimates of the individual censored values.
 *
 * Errors: as `censoredPositions` (`"overlapping-limits"`, `"bad-option"`).
 *
 * @param sample a checked sample from `censoredSample`
 * @param options the plotting-position offset
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * import { censoredRos } from "./censored_ros.ts";
 * const s = censoredSample([0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3], [-1, 0, -1, 0, 0, 0, 0, 0]);
 * const r = censoredRos(s);
 * if (!(r.values[0] < 0.05 && r.mean > 0.05 && r.sd > 0)) throw new Error("ros");
 * ```
 */
export function censoredRos(sample: CensoredSample, options: PlottingOptions = {}): CensoredRos {
  _checkOverlap(sample);
  const a = options.offset ?? BLOM_OFFSET;
  return _rosFrom(sample, _positionsSorted(sample, a), a);
}

/**
 * {@linkcode censoredRos} from the grouped positions the caller already
 * holds (computed with offset `a`; the limits checked for overlap).
 */
export function _rosFrom(sample: CensoredSample, g: _GroupedPositions, a: number): CensoredRos {
  const { intercept, slope } = _rosLine(g);
  if (!Number.isFinite(intercept) || !Number.isFinite(slope)) _overflow();
  const { values, censor, leftLimits, rightLimits } = sample;
  const out = new Float64Array(values.length);
  const leftSeen = new Int32Array(leftLimits.length);
  const rightSeen = new Int32Array(rightLimits.length);
  for (let i = 0; i < values.length; i++) {
    if (censor[i] === 0) {
      out[i] = values[i];
      continue;
    }
    let p: number;
    if (censor[i] < 0) {
      const j = _limitIndex(leftLimits, values[i]);
      p = g.fLow[j] * (++leftSeen[j] - a) / (g.leftCounts[j] + 1 - 2 * a);
    } else {
      const j = _limitIndex(rightLimits, values[i]);
      p = 1 - (1 - g.fHigh[j]) * (++rightSeen[j] - a) / (g.rightCounts[j] + 1 - 2 * a);
    }
    out[i] = intercept + slope * normalQuantile(p);
    if (!Number.isFinite(out[i])) _overflow();
  }
  const { mean, sd } = _meanSd(out);
  const method = "regression on order statistics (Helsel & Cohn 1988), " +
    `Hirsch–Stedinger positions with offset ${a}`;
  const plain = { mean, sd, intercept, slope, method };
  return Object.freeze({
    ...plain,
    values: out,
    toJSON: () => ({ ...plain, values: Array.from(out) }),
  });
}

/** Mean and sd (divisor n − 1), scaled exactly by a power of two so that no sum overflows. */
function _meanSd(v: Float64Array): { mean: number; sd: number } {
  const e = _exponent(v);
  let m = 0;
  for (const t of v) m += ldexp(t, e);
  m /= v.length;
  let ss = 0;
  for (const t of v) ss += (ldexp(t, e) - m) ** 2;
  const mean = ldexp(m, -e);
  const sd = ldexp(Math.sqrt(ss / (v.length - 1)), -e);
  if (!Number.isFinite(mean) || !Number.isFinite(sd)) _overflow();
  return { mean, sd };
}

function _overflow(): never {
  throw new PlumbError(
    "non-finite",
    "Cannot compute the ROS estimates: the imputed values or their spread exceed the largest " +
      "double (about 1.8e308); rescale the data (e.g. change its units) first",
  );
}

/** The power of two that brings the largest |value| near 1 (0 when no rescaling is needed). */
function _exponent(x: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) m = Math.max(m, Math.abs(x[i]));
  return m > 0 ? rescaleExponent(m) : 0;
}
