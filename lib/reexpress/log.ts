/**
 * The log transformation, with an explicit shift for data with zeros or
 * negatives, and its inverse.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { finiteCopy } from "../stats/_input.ts";
import { _requirePositive, _shiftOption } from "./_checks.ts";

/** Options for {@linkcode logTransform} and {@linkcode logInverse}. */
export interface LogOptions {
  /**
   * The base: natural (`"e"`) or common (`10`).
   * @default "e"
   */
  readonly base?: "e" | 10;
  /**
   * A constant added before taking logs, `log(x + shift)`. Choose it with
   * {@linkcode logShift} and report it beside any result.
   * @default 0
   */
  readonly shift?: number;
}

function _shiftOf(options: LogOptions, what: string): number {
  const s = _shiftOption(options.shift, what);
  const b = options.base ?? "e";
  if (b !== "e" && b !== 10) {
    throw new PlumbError("bad-option", `Cannot apply ${what} in base ${b}: use "e" or 10`, {
      base: b,
    });
  }
  return s;
}

/**
 * `log(x + shift)` in base e (default) or 10.
 *
 * @param x values with `x + shift > 0`; otherwise `PlumbError("non-positive")`
 *   (the message suggests {@linkcode logShift} or Yeo–Johnson)
 * @param options base and shift
 * @example
 * ```ts
 * import { logTransform } from "@plumbline/plumbline";
 * const y = logTransform([1, 10, 100], { base: 10 });
 * if (y[2] !== 2) throw new Error("unexpected");
 * ```
 */
export function logTransform(x: ArrayLike<number>, options: LogOptions = {}): Float64Array {
  const what = "the log transformation";
  const shift = _shiftOf(options, what);
  const v = finiteCopy(x, what);
  if (shift !== 0) { for (let i = 0; i < v.length; i++) v[i] += shift; }
  _requirePositive(v, shift === 0 ? what : `the log transformation after a shift of ${shift}`);
  const ten = options.base === 10;
  for (let i = 0; i < v.length; i++) v[i] = ten ? Math.log10(v[i]) : Math.log(v[i]);
  return v;
}

/**
 * Inverse of {@linkcode logTransform}: `exp(y) − shift` (or `10^y − shift`).
 *
 * @param y values on the log scale
 * @param options the base and shift used in the forward transform
 * @example
 * ```ts
 * import { logInverse, logTransform } from "@plumbline/plumbline";
 * const back = logInverse(logTransform([0, 3], { shift: 0.5 }), { shift: 0.5 });
 * if (Math.abs(back[0]) > 1e-15 || Math.abs(back[1] - 3) > 1e-15) throw new Error("unexpected");
 * ```
 */
export function logInverse(y: ArrayLike<number>, options: LogOptions = {}): Float64Array {
  const what = "the inverse log transformation";
  const shift = _shiftOf(options, what);
  const v = finiteCopy(y, what);
  const ten = options.base === 10;
  for (let i = 0; i < v.length; i++) v[i] = (ten ? 10 ** v[i] : Math.exp(v[i])) - shift;
  return v;
}

/** A log shift and the rule that chose it: plain, frozen data. */
export interface LogShift {
  /** The constant to add before taking logs (0 when every value is positive). */
  readonly shift: number;
  /** The rule, in words, for a report. */
  readonly rule: string;
}

/**
 * Choose the shift for `log(x + shift)`.
 *
 * Rule (common practice, not a published rule): no shift when every value is
 * positive; otherwise move the smallest value to half the gap between it and
 * the next larger distinct value, `shift = −min + gap/2`. For data with zeros
 * and positives this is half the smallest positive value, the usual choice; it
 * keeps the order and the spacing of the data, puts the smallest value on the
 * scale of the data's own resolution rather than at an arbitrary 1, and is
 * unchanged by a change of units (it scales with x). The log of shifted data
 * depends on the shift; always report it.
 *
 * @param x finite values, not all equal
 * @example
 * ```ts
 * import { logShift } from "@plumbline/plumbline";
 * const s = logShift([0, 0, 0.4, 2, 7]);
 * if (s.shift !== 0.2) throw new Error("unexpected");
 * ```
 */
export function logShift(x: ArrayLike<number>): LogShift {
  const v = finiteCopy(x, "a log shift");
  if (v.length === 0) {
    throw new PlumbError(
      "too-few",
      "Cannot choose a log shift for 0 values: at least 1 is needed",
      {
        n: 0,
        min: 1,
      },
    );
  }
  let min = Infinity;
  for (const t of v) min = Math.min(min, t);
  if (min > 0) return Object.freeze({ shift: 0, rule: "No shift: every value is positive" });
  let gap = Infinity;
  let spread = false;
  for (const t of v) {
    if (t > min) {
      spread = true;
      gap = Math.min(gap, t - min);
    }
  }
  if (!spread) {
    throw new PlumbError(
      "constant",
      `Cannot choose a log shift for ${v.length} identical values (all ${min}): ` +
        `there is no spacing to scale the shift by; check the column`,
      { value: min },
    );
  }
  let shift = -min + gap / 2;
  // When the gap is a few units in the last place of min, −min + gap/2 can round
  // back to −min; step up until the smallest value lands above zero.
  while (Number.isFinite(shift) && !(min + shift > 0)) {
    shift += Math.max(Number.MIN_VALUE, Math.abs(shift) * Number.EPSILON);
  }
  if (!Number.isFinite(shift)) {
    throw new PlumbError(
      "non-finite",
      `Cannot choose a log shift for values from ${min}: the shift would exceed the largest ` +
        `double; rescale the data (e.g. change its units) first`,
      { min },
    );
  }
  const rule = min === 0
    ? `Shift ${shift}: half the smallest positive value (${gap}), because zeros are present`
    : `Shift ${shift}: moves the smallest value (${min}) to half the gap to the next value (${gap})`;
  return Object.freeze({ shift, rule });
}
