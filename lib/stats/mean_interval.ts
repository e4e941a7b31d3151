/**
 * The t interval for a population mean: x̄ ± t_{1−α/2, n−1}·s/√n (Student
 * 1908, "The probable error of a mean", Biometrika 6:1–25), exact for
 * normal data and approximately right for others as n grows. The t quantile
 * is {@linkcode studentTUpper} (within 1e-11 relative of R's `qt`).
 *
 * @module
 */
import { studentTUpper } from "../numeric/student_t.ts";
import { checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";
import { _sampleShape } from "./moments.ts";
import { _levelOption } from "./quantile_interval.ts";

/** Options for {@linkcode tInterval}. */
export interface MeanIntervalOptions {
  /**
   * Confidence level.
   * @default 0.95
   */
  readonly level?: number;
}

/** A t interval for the mean: plain, frozen data. */
export interface TInterval {
  /** Number of values. */
  readonly n: number;
  /** The sample mean. */
  readonly mean: number;
  /** The standard deviation, divisor n − 1. */
  readonly sd: number;
  /** The confidence level. */
  readonly level: number;
  /** t_{1−α/2} with n − 1 degrees of freedom. */
  readonly tQuantile: number;
  /** `[x̄ − t·s/√n, x̄ + t·s/√n]`. */
  readonly interval: readonly [number, number];
}

/**
 * The t interval for the mean.
 *
 * @param x finite values, at least 2, not all equal
 * @param options the level
 * @example
 * ```ts
 * import { tInterval } from "./mean_interval.ts";
 * const r = tInterval([9.8, 10.1, 10.4, 9.9, 10.3]);
 * if (Math.abs(r.mean - 10.1) > 1e-12 || !(r.interval[0] < 10.1 && r.interval[1] > 10.1)) {
 *   throw new Error("t interval");
 * }
 * ```
 */
export function tInterval(x: ArrayLike<number>, options: MeanIntervalOptions = {}): TInterval {
  const what = "a t interval for the mean";
  const level = _levelOption(options.level ?? 0.95, what, "0.95");
  checkSize(x.length, 2, Number.POSITIVE_INFINITY, what);
  const v = finiteCopy(x, what);
  const n = v.length;
  const { mean, sd } = _sampleShape(v, what);
  checkSpreadFinite(sd, what);
  const tq = studentTUpper((1 - level) / 2, n - 1);
  const half = (tq * sd) / Math.sqrt(n);
  return Object.freeze({
    n,
    mean,
    sd,
    level,
    tQuantile: tq,
    interval: Object.freeze([mean - half, mean + half] as const),
  });
}
