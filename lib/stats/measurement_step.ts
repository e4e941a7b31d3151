/**
 * The measurement step of a sample: the spacing of the grid its values sit
 * on (0.01 for glucose recorded to two decimals, 1 for whole numbers, 0.5
 * for halves), found from the values themselves.
 *
 * Method: the distinct values are taken from the sorted sample, merging
 * neighbours closer than 1e-9 of the largest magnitude (floating-point
 * noise such as 0.30000000000000004, or residuals of rounded data, is not a
 * resolution). Every gap between distinct values of data recorded with step
 * h is a whole multiple of h, so the smallest gap d is m·h for a whole m.
 * The step is d/m for the smallest m in 1 … 12 such that every gap lies
 * within 1e-3·(d/m) (plus the floating-point noise) of a whole multiple of
 * it; when none fits, the values are not on a grid and the step is `null`.
 * The step is then re-estimated from the range (range / number of steps),
 * and given as a short decimal when one lies within 1e-9 of it.
 * For a continuous sample the chance that all g gaps fit some d/m by
 * accident is about 12·(2e-3)^(g − 1); below 5 distinct values (g < 4) a
 * step is therefore accepted only when it is one a recording would use
 * (1, 2, 2.5 or 5 times a power of ten). Cost: one pass over the sorted
 * sample per divisor tried.
 *
 * A step found this way is a property of how the data were recorded; values
 * derived from them (residuals, a mean subtracted per group) keep that step
 * even though they no longer sit on one grid, so callers pass the data's
 * step along rather than search the derived values.
 *
 * @module
 */
import { sortedSample } from "./_input.ts";
import { sortFloat64 } from "../numeric/sort.ts";

/** The step of a sample, as frozen plain data. */
export interface MeasurementStep {
  /** The grid spacing, or `null` when the values do not sit on a grid. */
  readonly step: number | null;
  /** Distinct values (after merging floating-point noise). */
  readonly distinct: number;
  /** Number of values. */
  readonly n: number;
}

/** Neighbours closer than this fraction of the largest magnitude are the same value. */
const _NOISE = 1e-9;
/** A gap fits the grid when within this fraction of a step of a whole number of steps. */
const _FIT = 1e-3;
/** The smallest gap is tried as 1 … this many steps. */
const _MAX_DIVISOR = 12;
/** From this many distinct values on, any step that fits is accepted. */
const _FEW = 5;

/**
 * Find the measurement step of a sample.
 *
 * @param x the sample (finite numbers, at least 2, not all equal)
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { measurementStep } from "./measurement_step.ts";
 * const s = measurementStep([4.37, 4.52, 4.38, 5.01, 4.40, 4.52, 4.61]);
 * if (s.step === null || Math.abs(s.step - 0.01) > 1e-12 || s.distinct !== 6) throw new Error("0.01");
 * if (measurementStep([1.2345, 2.71828, 3.14159, 0.5772]).step !== null) throw new Error("no grid");
 * ```
 */
export function measurementStep(x: ArrayLike<number>): MeasurementStep {
  return _measurementStepSorted(sortedSample(x, "the measurement step", 2));
}

/** {@linkcode measurementStep} on a sample already sorted ascending, finite and not constant. */
export function _measurementStepSorted(s: Float64Array): MeasurementStep {
  const n = s.length;
  const big = Math.max(Math.abs(s[0]), Math.abs(s[n - 1]));
  const same = _NOISE * big;
  // Distinct values and the smallest real gap.
  let distinct = 1;
  let last = s[0];
  let smallest = Infinity;
  for (let i = 1; i < n; i++) {
    const d = s[i] - last;
    if (d > same) {
      distinct++;
      if (d < smallest) smallest = d;
      last = s[i];
    }
  }
  if (distinct < 2 || !Number.isFinite(smallest)) return Object.freeze({ step: null, distinct, n });
  for (let m = 1; m <= _MAX_DIVISOR; m++) {
    const h = smallest / m;
    if (h <= same) break;
    if (_fits(s, h, same, _stepTolerance(h, big))) {
      const step = _refine(h, s[n - 1] - s[0]);
      // Below 5 distinct values a few gaps can fit a grid by chance: accept
      // only a step a recording would use (1, 2, 2.5 or 5 times a power of ten).
      if (distinct >= _FEW || _roundStep(step)) return Object.freeze({ step, distinct, n });
      break;
    }
  }
  return Object.freeze({ step: null, distinct, n });
}

/**
 * The step from the whole range (which spans many steps, so rounding in one
 * gap matters less), shown as a short decimal when one lies within 1e-9 of it.
 * (Exported for a step found on a sample and refined over every value's range.)
 */
export function _refine(h: number, range: number): number {
  const precise = range / Math.round(range / h);
  const short = Number(precise.toPrecision(10));
  return Math.abs(short - precise) <= 1e-9 * precise ? short : precise;
}

/** Whether h is 1, 2, 2.5 or 5 times a power of ten (to 1e-9). */
function _roundStep(h: number): boolean {
  const p = 10 ** Math.floor(Math.log10(h));
  const m = h / p;
  return [1, 2, 2.5, 5, 10].some((k) => Math.abs(m - k) <= 1e-9 * k);
}

/**
 * How far a gap (or a value's distance from the grid's origin) may be from a
 * whole multiple of the step h and still fit it: 1e-3 of a step, plus a few
 * ulps of the largest magnitude for rounding noise.
 */
export function _stepTolerance(h: number, big: number): number {
  return _FIT * h + 64 * Number.EPSILON * big;
}

/** Whether every gap between distinct values is within `tol` of a whole multiple of h. */
function _fits(s: Float64Array, h: number, same: number, tol: number): boolean {
  let last = s[0];
  for (let i = 1; i < s.length; i++) {
    const d = s[i] - last;
    if (d <= same) continue;
    if (Math.abs(d - Math.round(d / h) * h) > tol) return false;
    last = s[i];
  }
  return true;
}

/**
 * The measurement step of several samples recorded alike, pooled (e.g. the
 * groups of one variable): within-group residuals inherit it, since each
 * group's mean shifts its values off the common grid and their own apparent
 * step would be noise. `null` when there is no step or fewer than 2 distinct
 * values.
 *
 * @param parts the samples
 *
 * @example
 * ```ts
 * import { pooledMeasurementStep } from "./measurement_step.ts";
 * const step = pooledMeasurementStep([new Float64Array([4.1, 4.3, 4.2]), new Float64Array([5.0, 5.4])]);
 * if (Math.abs(step! - 0.1) > 1e-12) throw new Error(String(step));
 * ```
 */
export function pooledMeasurementStep(parts: readonly Float64Array[]): number | null {
  const all = new Float64Array(parts.reduce((t, p) => t + p.length, 0));
  let k = 0;
  for (const p of parts) all.set(p, (k += p.length) - p.length);
  const finite = all.filter(Number.isFinite);
  sortFloat64(finite);
  if (finite.length < 2 || finite[0] === finite[finite.length - 1]) return null;
  return _measurementStepSorted(finite).step;
}
