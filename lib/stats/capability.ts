/**
 * Capability indices Cp and Cpk under a normal model, with their published
 * confidence intervals.
 *
 * - Cp = (U − L)/(6s) and Cpk = min(U − x̄, x̄ − L)/(3s) (Kane 1986, "Process
 *   capability indices", Journal of Quality Technology 18:41–52); with one
 *   limit only, Cpk is the one-sided index (U − x̄)/(3s) or (x̄ − L)/(3s) and
 *   Cp is not defined.
 * - Cp's interval is exact under normality: (n − 1)s²/σ² is χ² with n − 1
 *   degrees of freedom, so Cp·√(χ²_{α/2}/(n − 1)) … Cp·√(χ²_{1−α/2}/(n − 1))
 *   (Kane 1986; Chou, Owen & Borrego 1990, Journal of Quality Technology
 *   22:223–229).
 * - Cpk's interval is Bissell's normal approximation,
 *   Ĉpk ± z_{1−α/2}·√(1/(9n) + Ĉpk²/(2(n − 1))) (Bissell 1990, "How reliable
 *   is your capability index?", Applied Statistics 39:331–340).
 *
 * These are sd-based indices: they describe the process only as far as the
 * normal model fits, which is the point of showing them beside the
 * re-expressed and percentile-based ones.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { chiSquareQuantile } from "../numeric/gamma.ts";
import { normalQuantile } from "../numeric/normal.ts";
import { _levelOption } from "./quantile_interval.ts";

/** Specification limits and the confidence level of the intervals. */
export interface CapabilityOptions {
  /**
   * Lower specification limit.
   * @default undefined (none)
   */
  readonly lower?: number;
  /**
   * Upper specification limit.
   * @default undefined (none)
   */
  readonly upper?: number;
  /**
   * Confidence level of the intervals.
   * @default 0.95
   */
  readonly level?: number;
}

/** Cp and Cpk with their intervals: plain, frozen data. */
export interface Capability {
  /** Number of values. */
  readonly n: number;
  /** Mean used. */
  readonly mean: number;
  /** Standard deviation used (divisor n − 1). */
  readonly sd: number;
  /** The limits, `null` where absent. */
  readonly lower: number | null;
  /** The upper limit, `null` where absent. */
  readonly upper: number | null;
  /** Confidence level of the intervals. */
  readonly level: number;
  /** Cp, `null` unless both limits are given. */
  readonly cp: number | null;
  /** Cp's χ² interval, `null` unless both limits are given. */
  readonly cpCi: readonly [number, number] | null;
  /** (x̄ − L)/(3s), `null` without a lower limit. */
  readonly cpl: number | null;
  /** (U − x̄)/(3s), `null` without an upper limit. */
  readonly cpu: number | null;
  /** The smaller of the available one-sided indices. */
  readonly cpk: number;
  /** Bissell's (1990) interval for Cpk. */
  readonly cpkCi: readonly [number, number];
}

/** Check specification limits: at least one, finite, lower below upper. */
export function _limitsOption(
  lower: unknown,
  upper: unknown,
  what: string,
): { lower: number | null; upper: number | null } {
  for (const [v, name] of [[lower, "lower"], [upper, "upper"]] as const) {
    if (v !== undefined && (typeof v !== "number" || !Number.isFinite(v))) {
      throw new PlumbError(
        "bad-option",
        `Cannot compute ${what} with ${name} limit ${
          String(v)
        }: give a finite number or leave it out`,
        { [name]: v },
      );
    }
  }
  if (lower === undefined && upper === undefined) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} without specification limits: pass { lower }, { upper } or both`,
    );
  }
  if (typeof lower === "number" && typeof upper === "number" && !(lower < upper)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} with lower limit ${lower} not below upper limit ${upper}: ` +
        `swap them or check their units`,
      { lower, upper },
    );
  }
  return {
    lower: (lower as number | undefined) ?? null,
    upper: (upper as number | undefined) ?? null,
  };
}

/**
 * Cp and Cpk, with intervals, from a sample's size, mean and standard
 * deviation.
 *
 * @param summary `{ n, mean, sd }` (sd with divisor n − 1), n ≥ 2, sd > 0
 * @param options the limits (at least one) and the level
 * @example
 * ```ts
 * import { capabilityIndices } from "./capability.ts";
 * const c = capabilityIndices({ n: 50, mean: 10, sd: 1 }, { lower: 6, upper: 15 });
 * // Cp = 9/6 = 1.5; Cpk = min(5, 4)/3
 * if (c.cp !== 1.5 || Math.abs(c.cpk - 4 / 3) > 1e-15) throw new Error("indices");
 * if (!(c.cpkCi[0] < c.cpk && c.cpk < c.cpkCi[1])) throw new Error("interval");
 * ```
 */
export function capabilityIndices(
  summary: { readonly n: number; readonly mean: number; readonly sd: number },
  options: CapabilityOptions,
): Capability {
  const what = "capability indices";
  const { n, mean, sd } = summary;
  const { lower, upper } = _limitsOption(options.lower, options.upper, what);
  const level = _levelOption(options.level ?? 0.95, what, "0.95");
  if (!(Number.isInteger(n) && n >= 2)) {
    throw new PlumbError(
      "too-few",
      `Cannot compute ${what} on ${n} values: at least 2 are needed`,
      {
        n,
        min: 2,
      },
    );
  }
  if (!(sd > 0 && Number.isFinite(sd) && Number.isFinite(mean))) {
    throw new PlumbError(
      "constant",
      `Cannot compute ${what} with standard deviation ${sd}: the values have no spread; ` +
        `check the column or its units`,
      { sd },
    );
  }
  const alpha = 1 - level;
  const z = normalQuantile(1 - alpha / 2);
  const df = n - 1;
  const cpl = lower === null ? null : (mean - lower) / (3 * sd);
  const cpu = upper === null ? null : (upper - mean) / (3 * sd);
  const cpk = cpl === null ? cpu! : cpu === null ? cpl : Math.min(cpl, cpu);
  const half = z * Math.sqrt(1 / (9 * n) + (cpk * cpk) / (2 * df));
  let cp: number | null = null;
  let cpCi: readonly [number, number] | null = null;
  if (lower !== null && upper !== null) {
    cp = (upper - lower) / (6 * sd);
    cpCi = Object.freeze(
      [
        cp * Math.sqrt(chiSquareQuantile(alpha / 2, df) / df),
        cp * Math.sqrt(chiSquareQuantile(1 - alpha / 2, df) / df),
      ] as const,
    );
  }
  return Object.freeze({
    n,
    mean,
    sd,
    lower,
    upper,
    level,
    cp,
    cpCi,
    cpl,
    cpu,
    cpk,
    cpkCi: Object.freeze([cpk - half, cpk + half] as const),
  });
}
