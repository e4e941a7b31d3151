/**
 * The shape every normality test returns.
 *
 * @module
 */

/** The result of one normality test: plain, frozen data. */
export interface TestResult {
  /** The test's published name, e.g. `"Shapiro–Wilk"`. */
  readonly test: string;
  /** The symbol of the statistic, e.g. `"W"`, `"A²"`, `"D"`. */
  readonly statisticName: string;
  /** The value of the statistic. */
  readonly statistic: number;
  /** The p-value, in [0, 1]. */
  readonly pValue: number;
  /** The number of values the test used. */
  readonly n: number;
  /** How the p-value was obtained (method and published source). */
  readonly method: string;
  /** Cautions that apply to this result (ties, small n, approximations). */
  readonly warnings: readonly string[];
}

/**
 * Freeze a result and its warnings array. Clamps the p-value into [0, 1]
 * only against rounding (a value outside by more than 1e-12 is a bug and
 * throws).
 */
export function freezeResult<T extends TestResult>(r: T): T {
  const p = r.pValue;
  if (!(p >= -1e-12 && p <= 1 + 1e-12)) {
    throw new RangeError(`${r.test}: p-value ${p} outside [0, 1]`);
  }
  const fixed = { ...r, pValue: Math.min(1, Math.max(0, p)) };
  Object.freeze(fixed.warnings);
  return Object.freeze(fixed);
}
