/**
 * Maximum-likelihood mean and standard deviation of a normal sample with
 * values censored below or above one or more limits.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { ldexp, rescaleExponent } from "../numeric/ldexp.ts";
import { _checkOverlap, _positionsSorted } from "./censored_positions.ts";
import { _rosLine } from "./censored_ros.ts";
import type { CensoredSample } from "./censored_sample.ts";
import { type _Newton, _newton, type _Reduced } from "./_censored_newton.ts";
import { BLOM_OFFSET } from "./plotting_positions.ts";

/** The maximum-likelihood fit: plain, frozen data. */
export interface CensoredFit {
  /** The ML estimate of the mean μ. */
  readonly mean: number;
  /** The ML estimate of the standard deviation σ. */
  readonly sd: number;
  /** Standard error of the mean, from the observed information. */
  readonly seMean: number;
  /** Standard error of σ (delta method: σ·se(ln σ)). */
  readonly seSd: number;
  /** Standard error of ln σ. */
  readonly seLogSd: number;
  /** Correlation of μ̂ and ln σ̂ (with the two standard errors, their full covariance). */
  readonly correlation: number;
  /** The maximised log-likelihood (densities for measured values, probabilities for censored ones). */
  readonly logLikelihood: number;
  /** All values, censored ones included. */
  readonly n: number;
  /** Measured values. */
  readonly observed: number;
  /** Left-censored values. */
  readonly left: number;
  /** Right-censored values. */
  readonly right: number;
  /** Newton iterations taken. */
  readonly iterations: number;
  /** Whether the step size fell below 1e-12 (relative) within the iteration budget. */
  readonly converged: boolean;
  /** The method, in words. */
  readonly method: string;
  /** Cautions: no convergence, heavy censoring. */
  readonly warnings: readonly string[];
}

/** Options for {@linkcode censoredNormalFit}. */
export interface CensoredFitOptions {
  /**
   * Largest number of Newton iterations.
   * @default 100
   */
  readonly maxIterations?: number;
}

/**
 * Fit a normal distribution to a censored sample by maximum likelihood:
 * measured values contribute their density, a value below a limit c the
 * probability Φ((c − μ)/σ), a value above c the probability
 * 1 − Φ((c − μ)/σ) (Cohen, A. C. (1991), *Truncated and Censored Samples*,
 * Marcel Dekker, chapter 2; for several limits, Helsel (2012), *Statistics
 * for Censored Environmental Data*, 2nd ed., chapter 6).
 *
 * Method: Newton's method on (μ, ln σ) with analytic first and second
 * derivatives (the censored terms through the normal hazard h = φ/Q, with
 * h′ = h(h − z)), on data scaled exactly by a power of two and then
 * standardised by their midrange and half-range, so that no value overflows
 * and subnormal data keep their bits. Start: the regression-on-order-statistics line
 * (Hirsch–Stedinger positions; the measured values' mean and sd when left
 * and right limits overlap). Safeguards: where the Hessian is not negative
 * definite it is shifted by a multiple of the identity until it is
 * (Levenberg), steps are capped at 2σ in μ and at 2 in ln σ, and each step
 * is halved until the log-likelihood rises (Armijo). Censored values at the
 * same limit are evaluated once, so each iteration costs one pass over the
 * distinct limits, and the measured values enter through their count, mean
 * and sum of squares. Converged when a full Newton step moves μ by less than
 * 1e-12·σ and ln σ by less than 1e-12. Standard errors come from the
 * inverse of the observed information at the maximum.
 *
 * Accuracy: against R's `survival::survreg(…, dist = "gaussian")` (R 4.2.2,
 * survival 3.5.3, run with rel.tolerance 1e-13) μ̂, σ̂ and the
 * log-likelihood agree to 1e-9 relative or better on the fixed and live
 * random cases of tests/stats/censored_fit_test.ts and
 * tests/stats/differential_censored_test.ts (the requirement is 1e-6).
 *
 * With nothing censored the result is the sample mean and the ML standard
 * deviation (divisor n). The maximum exists when at least two measured
 * values differ, which `censoredSample` ensures.
 *
 * Errors: `PlumbError("no-convergence")` when the maximum cannot be
 * located (the result would not be finite); `"non-finite"` when σ̂ exceeds
 * the largest double.
 *
 * @param sample a checked sample from `censoredSample`
 * @param options the iteration budget
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * import { censoredNormalFit } from "./censored_fit.ts";
 * const s = censoredSample([0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3], [-1, 0, -1, 0, 0, 0, 0, 0]);
 * const fit = censoredNormalFit(s);
 * if (!(fit.converged && fit.mean < 0.16 && fit.sd > 0)) throw new Error("fit");
 * ```
 */
export function censoredNormalFit(
  sample: CensoredSample,
  options: CensoredFitOptions = {},
): CensoredFit {
  const maxIterations = options.maxIterations ?? 100;
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot fit with maxIterations ${maxIterations}: use a whole number of at least 1, e.g. 100`,
      { maxIterations },
    );
  }
  return _censoredFit(sample, maxIterations, true);
}

/**
 * {@linkcode censoredNormalFit} without option checks. With `rosStart`
 * false, Newton starts from the measured values' mean and sd, which saves
 * the sort the ROS start needs (the λ profile fits many transformed copies
 * of one sample).
 */
export function _censoredFit(
  sample: CensoredSample,
  maxIterations: number,
  rosStart: boolean,
): CensoredFit {
  const { values, censor } = sample;
  // Standardise exactly by a power of two (|v| < 1, so nothing overflows and
  // subnormals keep their bits), then by the midrange c and half-range s of
  // the scaled values: u = (v − c)/s, x = 2^−e·(c + s·u).
  const e = _exponent(values);
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of values) {
    const v = ldexp(x, e);
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const c = (lo + hi) / 2;
  const s = (hi - lo) / 2;
  const u = (x: number) => (ldexp(x, e) - c) / s;
  let k = 0;
  let mean = 0;
  for (let i = 0; i < values.length; i++) {
    if (censor[i] === 0) {
      k++;
      mean += (u(values[i]) - mean) / k;
    }
  }
  let m2 = 0;
  for (let i = 0; i < values.length; i++) {
    if (censor[i] === 0) m2 += (u(values[i]) - mean) ** 2;
  }
  const r: _Reduced = {
    k,
    mean,
    m2,
    lows: Float64Array.from(sample.leftLimits, u),
    lowCounts: Float64Array.from(sample.leftCounts),
    highs: Float64Array.from(sample.rightLimits, u),
    highCounts: Float64Array.from(sample.rightCounts),
  };
  // Start from the ROS line when positions exist, else from the measured values.
  let mu = mean;
  let tau = 0.5 * Math.log(m2 / k);
  if (rosStart && sample.observed < sample.n) {
    try {
      _checkOverlap(sample);
      const line = _rosLine(_positionsSorted(sample, BLOM_OFFSET));
      const m0 = u(line.intercept);
      const s0 = ldexp(line.slope, e) / s;
      if (Number.isFinite(m0) && s0 > 0 && Number.isFinite(Math.log(s0))) {
        mu = m0;
        tau = Math.log(s0);
      }
    } catch (e) {
      if (!(e instanceof PlumbError && e.code === "overlapping-limits")) throw e;
    }
  }
  const fit = _newton(r, mu, tau, maxIterations);
  return _result(sample, fit, c, s, e);
}

function _result(
  sample: CensoredSample,
  f: _Newton,
  c: number,
  s: number,
  e: number,
): CensoredFit {
  const ev = f.e;
  const det = ev.hmm * ev.htt - ev.hmt * ev.hmt;
  if (!(Number.isFinite(ev.l) && ev.hmm < 0 && det > 0)) {
    throw new PlumbError(
      "no-convergence",
      `Cannot fit a normal distribution to the censored sample: the likelihood has no ` +
        `well-defined maximum (${sample.observed} measured of ${sample.n}); ` +
        `check the limits and the measured values`,
      { observed: sample.observed, n: sample.n },
    );
  }
  // Covariance on the standardised scale: (−H)⁻¹.
  const vm = -ev.htt / det;
  const vt = -ev.hmm / det;
  const cmt = ev.hmt / det;
  const mean = ldexp(c + s * f.mu, -e);
  const sd = ldexp(s * Math.exp(f.tau), -e);
  if (!(sd > 0)) {
    throw new PlumbError(
      "non-finite",
      `Cannot fit a normal distribution to the censored sample: the standard deviation is ` +
        `below the smallest positive double (about 5e-324); rescale the data (e.g. change its ` +
        `units) first`,
    );
  }
  if (!Number.isFinite(sd) || !Number.isFinite(mean)) {
    throw new PlumbError(
      "non-finite",
      `Cannot fit a normal distribution to the censored sample: the estimates exceed the ` +
        `largest double (about 1.8e308); rescale the data (e.g. change its units) first`,
    );
  }
  const seLogSd = Math.sqrt(vt);
  const warnings: string[] = [];
  if (!f.converged) {
    warnings.push(
      `Newton's method did not meet its tolerance within ${f.iterations} iterations; ` +
        `the estimates are the best found and may be imprecise`,
    );
  }
  return Object.freeze({
    mean,
    sd,
    seMean: ldexp(s * Math.sqrt(vm), -e),
    seSd: sd * seLogSd,
    seLogSd,
    correlation: cmt / Math.sqrt(vm * vt),
    logLikelihood: ev.l - sample.observed * (Math.log(s) - e * Math.LN2),
    n: sample.n,
    observed: sample.observed,
    left: sample.left,
    right: sample.right,
    iterations: f.iterations,
    converged: f.converged,
    method: "maximum likelihood (Newton's method on the mean and log standard deviation)",
    warnings: Object.freeze(warnings),
  });
}

/** The power of two that brings the largest |value| near 1 (0 when no rescaling is needed). */
function _exponent(x: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) m = Math.max(m, Math.abs(x[i]));
  return m > 0 ? rescaleExponent(m) : 0;
}
