/**
 * The exact (Clopper–Pearson) confidence interval for a binomial proportion.
 *
 * Source: Clopper, C. J. & Pearson, E. S. (1934), "The use of confidence or
 * fiducial limits illustrated in the case of the binomial", Biometrika
 * 26:404–413. With k successes in n trials and α = 1 − level, the ends are
 * the α/2 quantile of Beta(k, n − k + 1) and the 1 − α/2 quantile of
 * Beta(k + 1, n − k); the lower end is 0 when k = 0 and the upper end 1
 * when k = n (as R's `binom.test` computes them). Coverage is at least the
 * level for every true proportion. Accuracy: that of
 * {@linkcode betaQuantile}, within 1e-12 relative of R 4.2.2's `binom.test`
 * (tests/fixtures/stakes_distributions.json).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { betaQuantile } from "../numeric/beta.ts";
import { _levelOption } from "./quantile_interval.ts";

/** Options for {@linkcode clopperPearson}. */
export interface ProportionIntervalOptions {
  /**
   * The confidence level.
   * @default 0.95
   */
  readonly level?: number;
}

/**
 * The Clopper–Pearson interval for k successes out of n.
 *
 * @param k successes, a whole number in [0, n]
 * @param n trials, a whole number ≥ 1
 * @param options the level
 * @returns `[lower, upper]`
 * @example
 * ```ts
 * import { clopperPearson } from "./proportion_interval.ts";
 * // none out of 100: the upper end is 1 − 0.025^(1/100) ≈ 0.0362
 * const [lo, hi] = clopperPearson(0, 100);
 * if (lo !== 0 || Math.abs(hi - (1 - 0.025 ** 0.01)) > 1e-15) throw new Error("interval");
 * ```
 */
export function clopperPearson(
  k: number,
  n: number,
  options: ProportionIntervalOptions = {},
): readonly [number, number] {
  const level = _levelOption(options.level ?? 0.95, "a proportion interval", "0.95");
  if (!Number.isInteger(n) || n < 1 || !Number.isInteger(k) || k < 0 || k > n) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute a proportion interval for ${k} out of ${n}: ` +
        `use whole numbers with 0 ≤ successes ≤ trials and at least one trial`,
      { k, n },
    );
  }
  const alpha = (1 - level) / 2;
  const lower = k === 0 ? 0 : betaQuantile(alpha, k, n - k + 1);
  const upper = k === n ? 1 : betaQuantile(1 - alpha, k + 1, n - k);
  return Object.freeze([lower, upper] as const);
}
