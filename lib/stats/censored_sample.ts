/**
 * A censored sample: measured values beside values known only to lie below
 * or above a limit ("<0.05", ">1000"), checked once so that every censored
 * method can rely on it.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { finiteCopy } from "./_input.ts";

/**
 * How each value was observed: `0` measured, `-1` left-censored (the true
 * value is at most the stored limit), `1` right-censored (at least the limit).
 */
export type CensorSide = -1 | 0 | 1;

/** A checked censored sample. The arrays are private copies: do not change them. */
export interface CensoredSample {
  /** The measured value, or the limit for a censored value; finite. */
  readonly values: Float64Array;
  /** The side of each value, aligned with `values` (see {@linkcode CensorSide}). */
  readonly censor: Int8Array;
  /** All values, censored ones included. */
  readonly n: number;
  /** How many values were measured (not censored). */
  readonly observed: number;
  /** How many values are left-censored ("<limit"). */
  readonly left: number;
  /** How many values are right-censored (">limit"). */
  readonly right: number;
  /** The distinct left-censoring limits, ascending. */
  readonly leftLimits: readonly number[];
  /** How many values are censored at each left limit, aligned with `leftLimits`. */
  readonly leftCounts: readonly number[];
  /** The distinct right-censoring limits, ascending. */
  readonly rightLimits: readonly number[];
  /** How many values are censored at each right limit, aligned with `rightLimits`. */
  readonly rightCounts: readonly number[];
}

/** Options for {@linkcode censoredSample}. */
export interface CensoredSampleOptions {
  /**
   * The method about to run, for error messages.
   * @default "a censored-sample analysis"
   */
  readonly what?: string;
}

/** The fewest measured values any censored method accepts. */
export const CENSORED_MIN_OBSERVED = 3;

/**
 * Check and copy a censored sample.
 *
 * Rules: `values` and `censor` have the same length; every value (and so
 * every limit) is a finite number; every side is −1, 0 or 1; at least three
 * values are measured, and they are not all equal (with fewer, or with no
 * spread among the measured values, a normal fit to censored data has no
 * maximum: the likelihood grows without bound as σ → 0).
 *
 * Errors: `PlumbError` with code `"bad-option"` (lengths differ, a side
 * that is not −1, 0 or 1), `"non-finite"`, `"too-few"` (fewer than three
 * measured values), `"constant"` (the measured values are all equal).
 *
 * @param values measured values, and the limit for each censored value
 * @param censor the side of each value: 0 measured, −1 below its limit, 1 above it
 * @param options the method's name, for messages
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * // chlorine, mg/L: two readings reported as "<0.05"
 * const s = censoredSample([0.05, 0.12, 0.05, 0.09, 0.21, 0.15], [-1, 0, -1, 0, 0, 0]);
 * if (s.left !== 2 || s.observed !== 4 || s.leftLimits[0] !== 0.05) throw new Error("sample");
 * ```
 */
export function censoredSample(
  values: ArrayLike<number>,
  censor: ArrayLike<number>,
  options: CensoredSampleOptions = {},
): CensoredSample {
  const what = options.what ?? "a censored-sample analysis";
  const n = values.length;
  if (censor.length !== n) {
    throw new PlumbError(
      "bad-option",
      `Cannot run ${what}: ${n} values but ${censor.length} censoring sides; ` +
        `give one side (0 measured, −1 below its limit, 1 above it) per value`,
      { values: n, censor: censor.length },
    );
  }
  const v = finiteCopy(values, what);
  const c = new Int8Array(n);
  let left = 0;
  let right = 0;
  for (let i = 0; i < n; i++) {
    const s = censor[i];
    if (s === 0) continue;
    if (s === -1) left++;
    else if (s === 1) right++;
    else {
      throw new PlumbError(
        "bad-option",
        `Cannot run ${what}: censoring side ${s} at position ${i}; ` +
          `use 0 for a measured value, −1 for "<limit", 1 for ">limit"`,
        { position: i, side: s },
      );
    }
    c[i] = s;
  }
  const observed = n - left - right;
  if (observed < CENSORED_MIN_OBSERVED) {
    throw new PlumbError(
      "too-few",
      `Cannot run ${what} on ${observed} measured value${observed === 1 ? "" : "s"} ` +
        `(${left} below and ${right} above a limit, of ${n}): at least ${CENSORED_MIN_OBSERVED} ` +
        `measured values are needed; report the detected fraction instead`,
      { n, observed, left, right, min: CENSORED_MIN_OBSERVED },
    );
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    if (c[i] !== 0) continue;
    if (v[i] < lo) lo = v[i];
    if (v[i] > hi) hi = v[i];
  }
  if (lo === hi) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what}: the ${observed} measured values are all ${lo}, and a normal fit ` +
        `needs some spread among them; check the column or its units`,
      { value: lo },
    );
  }
  const [leftLimits, leftCounts] = _distinct(v, c, -1, left);
  const [rightLimits, rightCounts] = _distinct(v, c, 1, right);
  return Object.freeze({
    values: v,
    censor: c,
    n,
    observed,
    left,
    right,
    leftLimits,
    leftCounts,
    rightLimits,
    rightCounts,
  });
}

/** The distinct limits on one side, ascending, and how many values each holds; frozen. */
function _distinct(
  v: Float64Array,
  c: Int8Array,
  side: number,
  count: number,
): [readonly number[], readonly number[]] {
  const limits = new Float64Array(count);
  let k = 0;
  for (let i = 0; i < v.length; i++) if (c[i] === side) limits[k++] = v[i];
  sortFloat64(limits);
  const distinct: number[] = [];
  const counts: number[] = [];
  for (let i = 0; i < count; i++) {
    if (i === 0 || limits[i] !== limits[i - 1]) {
      distinct.push(limits[i]);
      counts.push(0);
    }
    counts[counts.length - 1]++;
  }
  return [Object.freeze(distinct), Object.freeze(counts)];
}
