/**
 * A distribution-free confidence interval for a population quantile, with
 * order statistics as its ends.
 *
 * If B counts the values at or below the population p-quantile ξₚ, then
 * B ~ Binomial(n, p) for any continuous distribution, and the interval
 * [x₍ᵣ₎, x₍ₛ₎) contains ξₚ with probability P(r ≤ B ≤ s − 1) exactly
 * (Hahn & Meeker 1991, *Statistical Intervals: A Guide for Practitioners*,
 * Wiley, §5.2 — from memory; David & Nagaraja 2003, *Order Statistics*,
 * 3rd ed., §7.1). The ranks are chosen with equal tails: r is the
 * (1 − level)/2 quantile of B and s is one more than its (1 + level)/2
 * quantile, so each tail holds at most (1 − level)/2 and the coverage is at
 * least the level. This is how laboratory reference-interval practice sets
 * the 90% confidence interval of each non-parametric limit (CLSI EP28-A3c,
 * 2010: for n = 120 and p = 0.025 the ranks are 1 and 7, from memory of its
 * table).
 *
 * A rank of 0 or n + 1 means the interval is open on that side: the sample
 * is too small for a bounded end at that level.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { binomialCdf, binomialQuantile } from "../numeric/binomial.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { checkSize, finiteCopy } from "./_input.ts";

/** Options for {@linkcode quantileInterval}. */
export interface QuantileIntervalOptions {
  /**
   * The confidence level.
   * @default 0.9
   */
  readonly level?: number;
}

/** The ranks of a distribution-free quantile interval: plain, frozen data. */
export interface QuantileRanks {
  /** The sample size. */
  readonly n: number;
  /** The quantile's probability. */
  readonly p: number;
  /** The nominal level. */
  readonly level: number;
  /** The 1-based ranks [r, s]; 0 and n + 1 mean open on that side. */
  readonly ranks: readonly [number, number];
  /** The exact coverage P(r ≤ B ≤ s − 1), B ~ Binomial(n, p); at least `level`. */
  readonly coverage: number;
}

/** A distribution-free quantile interval with its ends: plain, frozen data. */
export interface QuantileInterval extends QuantileRanks {
  /** The ends x₍ᵣ₎ and x₍ₛ₎; `null` where the interval is open. */
  readonly interval: readonly [number | null, number | null];
}

/** Check a level option strictly inside (0, 1). */
export function _levelOption(level: unknown, what: string, example: string): number {
  if (typeof level !== "number" || !(level > 0 && level < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} at level ${level}: the level must lie strictly between 0 and 1, ` +
        `e.g. ${example}`,
      { level },
    );
  }
  return level;
}

/**
 * The equal-tailed order-statistic ranks for the p-quantile of a sample of n,
 * and their exact coverage.
 *
 * @param n sample size, ≥ 1
 * @param p the quantile's probability, strictly between 0 and 1
 * @param options the level
 * @example
 * ```ts
 * import { quantileRanks } from "./quantile_interval.ts";
 * const r = quantileRanks(120, 0.025);
 * if (r.ranks[0] !== 1 || r.ranks[1] !== 7 || r.coverage < 0.9) throw new Error("ranks");
 * ```
 */
export function quantileRanks(
  n: number,
  p: number,
  options: QuantileIntervalOptions = {},
): QuantileRanks {
  const what = "a quantile interval";
  const level = _levelOption(options.level ?? 0.9, what, "0.9");
  if (typeof p !== "number" || !(p > 0 && p < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} for p = ${p}: p must lie strictly between 0 and 1, e.g. 0.025`,
      { p },
    );
  }
  checkSize(n, 1, Number.POSITIVE_INFINITY, what);
  const tail = (1 - level) / 2;
  const r = binomialQuantile(tail, n, p);
  const s = binomialQuantile(1 - tail, n, p) + 1;
  const coverage = binomialCdf(s - 1, n, p) - binomialCdf(r - 1, n, p);
  return Object.freeze({ n, p, level, ranks: Object.freeze([r, s] as const), coverage });
}

/** The interval's ends from an ascending sample, given its ranks. */
export function _quantileIntervalSorted(sorted: Float64Array, r: QuantileRanks): QuantileInterval {
  const n = sorted.length;
  const [a, b] = r.ranks;
  const interval = Object.freeze(
    [
      a >= 1 ? sorted[a - 1] : null,
      b <= n ? sorted[b - 1] : null,
    ] as const,
  );
  return Object.freeze({ ...r, interval });
}

/**
 * A distribution-free confidence interval for the population p-quantile.
 *
 * @param x finite values, at least one
 * @param p the quantile's probability, strictly between 0 and 1
 * @param options the level
 * @example
 * ```ts
 * import { quantileInterval } from "./quantile_interval.ts";
 * const x = Array.from({ length: 200 }, (_, i) => i + 1);
 * const q = quantileInterval(x, 0.5);
 * if (!(q.interval[0]! < 100.5 && q.interval[1]! > 100.5 && q.coverage >= 0.9)) {
 *   throw new Error("median interval");
 * }
 * ```
 */
export function quantileInterval(
  x: ArrayLike<number>,
  p: number,
  options: QuantileIntervalOptions = {},
): QuantileInterval {
  const ranks = quantileRanks(x.length, p, options);
  return _quantileIntervalSorted(sortFloat64(finiteCopy(x, "a quantile interval")), ranks);
}
