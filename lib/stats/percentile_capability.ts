/**
 * Percentile-based capability indices, which replace x̄ ± 3s by the sample's
 * own 0.135% and 99.865% points and x̄ by its median, so that they assume no
 * distribution (Clements 1989, "Process capability calculations for
 * non-normal distributions", Quality Progress 22(9):95–100, who fitted
 * Pearson curves for the percentiles; the quantile form as in ISO
 * 22514-2:2017 — both from memory):
 *
 *   Cp(q) = (U − L)/(X₀.₉₉₈₆₅ − X₀.₀₀₁₃₅),
 *   Cpk(q) = min((U − X₀.₅)/(X₀.₉₉₈₆₅ − X₀.₅), (X₀.₅ − L)/(X₀.₅ − X₀.₀₀₁₃₅)).
 *
 * Here the percentiles are the sample quantiles at rank p(n + 1)
 * ({@linkcode rankQuantile}). The 0.135% point sits inside the sample only
 * from n = 740 on (0.00135·(n + 1) ≥ 1); with fewer values it would be the
 * sample minimum, which understates the tail, so the indices are not given
 * and the result says why.
 *
 * @module
 */
import { _limitsOption } from "./capability.ts";
import { _rankQuantileSorted } from "./rank_quantile.ts";

/** The tail probability matching ±3 standard deviations of a normal. */
export const CAPABILITY_TAIL = 0.00135;
/** The smallest n for which the 0.135% point lies inside the sample: ⌈1/0.00135⌉ − 1. */
export const PERCENTILE_CAPABILITY_MIN_N = Math.ceil(1 / CAPABILITY_TAIL) - 1;

/** Percentile-based indices: plain, frozen data. */
export interface PercentileCapability {
  /** Number of values. */
  readonly n: number;
  /** The sample's 0.135%, 50% and 99.865% points, or `null` when n is too small. */
  readonly points: readonly [number, number, number] | null;
  /** Cp(q), `null` unless both limits are given and n is large enough. */
  readonly cp: number | null;
  /** Cpk(q), `null` when n is too small. */
  readonly cpk: number | null;
  /** Why an index is missing, or `null`. */
  readonly note: string | null;
}

/**
 * Percentile-based Cp and Cpk of an ascending sample.
 *
 * @param sorted the sample in ascending order
 * @param options the limits (at least one)
 * @example
 * ```ts
 * import { percentileCapability } from "./percentile_capability.ts";
 * const few = percentileCapability(Float64Array.of(1, 2, 3), { upper: 5 });
 * if (few.cpk !== null || few.note === null) throw new Error("needs 740 values");
 * const many = Float64Array.from({ length: 999 }, (_, i) => i + 1);
 * const q = percentileCapability(many, { lower: 0, upper: 1000 });
 * if (!(q.cp! > 1 && q.cpk! > 1)) throw new Error("indices");
 * ```
 */
export function percentileCapability(
  sorted: Float64Array,
  options: { readonly lower?: number; readonly upper?: number },
): PercentileCapability {
  const { lower, upper } = _limitsOption(options.lower, options.upper, "percentile capability");
  const n = sorted.length;
  if (n < PERCENTILE_CAPABILITY_MIN_N) {
    return Object.freeze({
      n,
      points: null,
      cp: null,
      cpk: null,
      note: `Percentile-based indices need at least ${PERCENTILE_CAPABILITY_MIN_N} values ` +
        `for the 0.135% and 99.865% points to lie inside the sample; there are ${n}`,
    });
  }
  const lo = _rankQuantileSorted(sorted, CAPABILITY_TAIL);
  const med = _rankQuantileSorted(sorted, 0.5);
  const hi = _rankQuantileSorted(sorted, 1 - CAPABILITY_TAIL);
  const sides: number[] = [];
  if (upper !== null) sides.push((upper - med) / (hi - med));
  if (lower !== null) sides.push((med - lower) / (med - lo));
  const cp = lower !== null && upper !== null ? (upper - lower) / (hi - lo) : null;
  const cpk = sides.reduce((a, b) => Math.min(a, b), Infinity);
  const degenerate = !Number.isFinite(cpk) || (cp !== null && !Number.isFinite(cp));
  return Object.freeze({
    n,
    points: Object.freeze([lo, med, hi] as const),
    cp: cp !== null && Number.isFinite(cp) ? cp : null,
    cpk: Number.isFinite(cpk) ? cpk : null,
    note: degenerate
      ? "The sample's median coincides with its 0.135% or 99.865% point (many tied values), " +
        "so a percentile-based index is not defined"
      : null,
  });
}
