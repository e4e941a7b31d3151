/**
 * Whether rounding is coarse enough, against the spread and at this sample
 * size, to make Shapiro–Wilk reject a normal sample by itself.
 *
 * Ties matter through the measurement step h against the standard
 * deviation s, not through the share of distinct values: glucose to 0.01
 * mmol/L with s = 0.48 has many repeated values at n = 600 yet is recorded
 * finely enough; the same data rounded to 0.5 are not. Grouping distorts
 * order-statistic tests more as n grows (Royston 1989, "Correcting the
 * Shapiro–Wilk W for ties", Journal of Statistical Computation and
 * Simulation 31:237–249, treats the same effect; from memory), so the
 * acceptable h/s shrinks with n.
 *
 * The limit is plumbline's own seeded simulation (`tools/sim/rounding_limit.ts`,
 * 2,000 samples per cell): normal samples rounded to h = (c/√n)·σ (with a
 * random grid offset), Shapiro–Wilk at the 5% level. The rejection rate
 * crosses 10% (twice the nominal rate) at c ≈ 1.3 for n = 8–10, rising to
 * c ≈ 2.4 at n = 5,000; in h/σ terms the crossing is 0.34–0.45 for n = 4 to
 * 20. The limit used is h/s ≤ min(0.35, 1.4/√n), at or within noise of the
 * crossing at every n from 4 on, with n capped at 5,000 because
 * Shapiro–Wilk never sees more values than that. At n = 3 a single tie
 * gives W its minimum 3/4 and p = 0 (the crossing is h/σ ≈ 0.12), so the
 * limit there is 0.05. The table is in README.
 *
 * @module
 */
import { _measurementStepSorted } from "./measurement_step.ts";

/** The coarseness verdict of a step, as frozen plain data. */
export interface RoundingJudgement {
  /** The measurement step, or `null` when the values are not on a grid. */
  readonly step: number | null;
  /** step / sd (0 without a step). */
  readonly ratio: number;
  /** The largest ratio that rounding alone tolerates at this n. */
  readonly limit: number;
  /** Whether the step is large against the spread at this n. */
  readonly coarse: boolean;
}

/** Rounding limit constant c in c/√n (tools/sim/rounding_limit.ts). */
export const ROUNDING_LIMIT_C = 1.4;
/** The limit's cap, which binds below 16 values (tools/sim/rounding_limit.ts, n = 4 … 10). */
export const ROUNDING_LIMIT_SMALL_N = 0.35;
/** The limit at n = 3, where one tie alone gives W its minimum 3/4 and p = 0. */
export const ROUNDING_LIMIT_THREE = 0.05;

/**
 * The largest step/sd ratio (see {@linkcode roundingLimit}) for a test that
 * sees all n values: Anderson–Darling, Lilliefors and Shapiro–Francia have
 * no 5,000 cap, and the same c/√n is used at their own n (extrapolated from
 * the Shapiro–Wilk calibration, not simulated for each test).
 */
export function roundingLimitAt(n: number): number {
  if (n <= 3) return ROUNDING_LIMIT_THREE;
  return Math.min(ROUNDING_LIMIT_SMALL_N, ROUNDING_LIMIT_C / Math.sqrt(n));
}

/**
 * The largest step/sd ratio at which rounding alone keeps Shapiro–Wilk's
 * false-alarm rate at or below 10%, for a sample of n.
 *
 * @param n the sample size (Shapiro–Wilk sees at most 5,000 of them)
 *
 * @example
 * ```ts
 * import { roundingLimit } from "./rounding.ts";
 * if (Math.abs(roundingLimit(400) - 0.07) > 1e-15 || roundingLimit(1e6) !== roundingLimit(5000)) throw new Error("limit");
 * ```
 */
export function roundingLimit(n: number): number {
  if (n <= 3) return ROUNDING_LIMIT_THREE;
  return Math.min(ROUNDING_LIMIT_SMALL_N, ROUNDING_LIMIT_C / Math.sqrt(Math.min(n, 5000)));
}

/**
 * A test's warning about rounding, or `undefined` when the step (found from
 * the sorted sample) is fine against its spread at this n. Replaces a rule
 * by the share of distinct values, which warned about finely recorded data
 * with many repeats and missed coarse data with few.
 *
 * @param sorted the sample, ascending, finite, not constant
 * @param capped whether the test sees at most 5,000 values (Shapiro–Wilk's limit)
 *
 * @example
 * ```ts
 * import { roundingWarning } from "./rounding.ts";
 * const halves = Float64Array.from([1, 1.5, 1.5, 2, 2, 2, 2.5, 2.5, 3, 3.5, 2, 1.5]).sort();
 * if (!roundingWarning(halves, true)?.startsWith("Recorded in steps of 0.5")) throw new Error("coarse");
 * ```
 */
export function roundingWarning(sorted: Float64Array, capped: boolean): string | undefined {
  const n = sorted.length;
  // A step coarse against the spread piles many values on each level: from 25 values on,
  // h/s > 1.4/√n leaves fewer than 4.3√n levels within ±3 sd, so even with 5% of the values
  // beyond ±3 sd at least 9% of them repeat the one before. With fewer than 5% repeats there
  // is nothing to warn about, found in one cheap pass.
  if (n >= 25) {
    let repeats = 0;
    let previous = sorted[0];
    for (let i = 1; i < n; i++) {
      const v = sorted[i];
      if (v === previous) repeats++;
      previous = v;
    }
    if (repeats < 0.05 * n) return undefined;
  }
  const { step } = _measurementStepSorted(sorted);
  if (step === null) return undefined;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += sorted[i];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (sorted[i] - mean) ** 2;
  const sd = Math.sqrt(ss / (n - 1));
  const limit = capped ? roundingLimit(n) : roundingLimitAt(n);
  const ratio = step / sd;
  if (!(ratio > limit)) return undefined;
  const fmt = (v: number) => String(Number(v.toPrecision(2)));
  return `Recorded in steps of ${Number(step.toPrecision(6))}, coarse against the spread ` +
    `(step/sd = ${fmt(ratio)}; the limit at n = ${n} is ${fmt(limit)}): rounding alone can make ` +
    `this test reject normal data; judge the QQ plot, whose steps show the rounding`;
}

/**
 * Judge a measurement step against the spread.
 *
 * @param step the step (from `measurementStep`), or `null`
 * @param sd the sample standard deviation
 * @param n the sample size
 *
 * @example
 * ```ts
 * import { judgeRounding } from "./rounding.ts";
 * // glucose recorded to 0.01 mmol/L, sd 0.48, n = 600: fine
 * if (judgeRounding(0.01, 0.48, 600).coarse) throw new Error("0.01 is fine");
 * // the same rounded to 0.5: coarse
 * if (!judgeRounding(0.5, 0.48, 600).coarse) throw new Error("0.5 is coarse");
 * ```
 */
export function judgeRounding(step: number | null, sd: number, n: number): RoundingJudgement {
  const limit = roundingLimit(n);
  const ratio = step === null || !(sd > 0) ? 0 : step / sd;
  return Object.freeze({ step, ratio, limit, coarse: ratio > limit });
}
