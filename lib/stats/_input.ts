/**
 * Input checks shared by every statistic: finite numbers only, enough of
 * them, not all equal. Private to `lib/stats` and `lib/reexpress`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";

/** How many offending positions an error message lists at most. */
const _SHOWN_POSITIONS = 5;

/**
 * Copy `x` into a new `Float64Array`, throwing `PlumbError("non-finite")`
 * when any entry is NaN, ±Infinity or not a number. The message names how
 * many entries were bad and the first positions (0-based).
 *
 * @param x the sample
 * @param what the name of the method, for the message
 */
export function finiteCopy(x: ArrayLike<number>, what: string): Float64Array {
  if (x instanceof Float64Array) {
    // Already doubles: a block copy, then one cheap scan for NaN and ±Infinity.
    checkFinite(x, what);
    return x.slice();
  }
  const n = x.length;
  const out = new Float64Array(n);
  let bad = 0;
  for (let i = 0; i < n; i++) {
    const v = x[i] as unknown;
    if (typeof v !== "number" || !Number.isFinite(v)) {
      bad++;
      continue;
    }
    out[i] = v;
  }
  if (bad > 0) _throwNonFinite(x, what);
  return out;
}

/**
 * Throw `PlumbError("non-finite")`, with the same message as
 * {@linkcode finiteCopy}, when any entry of `x` is NaN or ±Infinity; no copy
 * is made.
 *
 * @param x the sample
 * @param what the name of the method, for the message
 */
export function checkFinite(x: Float64Array, what: string): void {
  for (let i = 0; i < x.length; i++) {
    // v − v is 0 for a finite v and NaN for NaN and ±Infinity.
    if (x[i] - x[i] !== 0) _throwNonFinite(x, what);
  }
}

function _throwNonFinite(x: ArrayLike<number>, what: string): never {
  const n = x.length;
  let bad = 0;
  const first: number[] = [];
  for (let i = 0; i < n; i++) {
    const v = x[i] as unknown;
    if (typeof v !== "number" || !Number.isFinite(v)) {
      bad++;
      if (first.length < _SHOWN_POSITIONS) first.push(i);
    }
  }
  const more = bad > first.length ? ", …" : "";
  throw new PlumbError(
    "non-finite",
    `Cannot run ${what} on values that are not finite numbers: ${bad} of ${n} ` +
      `(at position${bad === 1 ? "" : "s"} ${first.join(", ")}${more}); ` +
      `remove or replace them first (plumb() and loadTable() drop and count missing cells)`,
    { count: bad, positions: first },
  );
}

/**
 * Throw `PlumbError("too-few")` or `PlumbError("too-many")` when `n` is
 * outside `[min, max]`.
 */
export function checkSize(n: number, min: number, max: number, what: string): void {
  if (n < min) {
    throw new PlumbError(
      "too-few",
      `Cannot run ${what} on ${n} value${n === 1 ? "" : "s"}: at least ${min} are needed`,
      { n, min },
    );
  }
  if (n > max) {
    throw new PlumbError(
      "too-many",
      `Cannot run ${what} on ${n} values: the method is calibrated for at most ${max}; ` +
        `use a test without that limit (Anderson–Darling, D'Agostino–Pearson) or a random subsample`,
      { n, max },
    );
  }
}

/**
 * Throw `PlumbError("constant")` when the sorted sample has zero range.
 *
 * @param sorted the sample in ascending order (or only its two ends)
 * @param n the sample's size, when `sorted` holds only its ends
 */
export function checkNotConstant(sorted: Float64Array, what: string, n = sorted.length): void {
  if (sorted.length > 0 && sorted[0] === sorted[sorted.length - 1]) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what} on ${n} identical values (all ${sorted[0]}): ` +
        `a sample with no spread has no shape to test; check the column or its units`,
      { value: sorted[0], n },
    );
  }
}

/**
 * Validate and sort a sample in one step: finite values, size within range,
 * not constant. Returns a new ascending `Float64Array`.
 */
export function sortedSample(
  x: ArrayLike<number>,
  what: string,
  min: number,
  max = Number.POSITIVE_INFINITY,
): Float64Array {
  checkSize(x.length, min, max, what);
  let s: Float64Array;
  if (x instanceof Float64Array) {
    // Sort a block copy, then look at its ends only: −∞ sorts first, +∞ and NaN last.
    s = sortFloat64(x.slice());
    const n = s.length;
    if (n > 0 && !(Number.isFinite(s[0]) && Number.isFinite(s[n - 1]))) _throwNonFinite(x, what);
  } else {
    s = sortFloat64(finiteCopy(x, what));
  }
  checkNotConstant(s, what);
  return s;
}

/**
 * Throw `PlumbError("non-finite")` when a sample's standard deviation,
 * though computed without overflow, exceeds the largest double (values
 * near −1.8e308 and +1.8e308 together): it cannot be reported in the data's
 * units.
 */
export function checkSpreadFinite(sd: number, what: string): void {
  if (!Number.isFinite(sd)) {
    throw new PlumbError(
      "non-finite",
      `Cannot compute ${what}: the standard deviation exceeds the largest double (about 1.8e308); ` +
        `rescale the data (e.g. change its units) first`,
    );
  }
}
