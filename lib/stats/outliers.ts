/**
 * Outliers by the generalized extreme studentized deviate (ESD) procedure
 * (Rosner 1983, "Percentage points for a generalized ESD many-outlier
 * procedure", Technometrics 25:165–172).
 *
 * With an upper bound r on the number of outliers, for i = 1 … r the value
 * farthest from the mean of the values still in the sample is removed,
 * after recording Rᵢ = max |x − x̄| / s over those n − i + 1 values. Its
 * critical value is
 *   λᵢ = (n − i)·t / √((n − i − 1 + t²)(n − i + 1)),
 * with t the upper α/(2(n − i + 1)) point of Student's t on n − i − 1
 * degrees of freedom. The number of outliers is the largest i with Rᵢ > λᵢ
 * (so a masked outlier is still found). Rosner reports the λ approximation
 * as very accurate for n ≥ 25 and reasonable for n ≥ 15; below 15 values
 * plumbline uses r = 1, where the procedure is Grubbs's two-sided test
 * (Grubbs 1969, Technometrics 11:1–21) with its Bonferroni critical value,
 * valid at any n ≥ 3.
 *
 * Default bound: r = min(10, ⌊n/10⌋) for n ≥ 15 (common practice: the
 * procedure needs r fixed in advance, and more than a tenth of the sample is
 * a shape, not a few bad records).
 *
 * Computation: on the sorted sample the removed value is always the current
 * minimum or maximum, so each step reads two ends; the window's mean and sd
 * come from running sums of the values centred at the median and scaled by
 * the range (no overflow at any magnitude), recomputed from the window
 * whenever a removal takes more than 1% of the sum of squares, so no digits
 * are lost to cancellation. Accuracy: λᵢ to about 1e-12 relative (the t
 * quantile), Rᵢ to rounding.
 *
 * Checked against the worked example in the NIST/SEMATECH e-Handbook of
 * Statistical Methods, section 1.3.5.17.3 (Rosner's 54 values; from memory),
 * and λᵢ against the same formula with R 4.2.2's `qt`
 * (tests/fixtures/outliers.json).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { studentTUpper } from "../numeric/student_t.ts";
import { sortedSample } from "./_input.ts";

/** Options for {@linkcode generalizedEsd}. */
export interface OutlierOptions {
  /**
   * The most outliers looked for, r.
   * @default min(10, ⌊n/10⌋) for n ≥ 15, else 1
   */
  readonly maxOutliers?: number;
  /**
   * The significance level of the whole procedure.
   * @default 0.05
   */
  readonly alpha?: number;
}

/** The outcome of the generalized ESD procedure, as frozen plain data. */
export interface OutlierResult {
  /** Number of values. */
  readonly n: number;
  /** The significance level used. */
  readonly alpha: number;
  /** The bound r used. */
  readonly maxOutliers: number;
  /** How many values are declared outliers. */
  readonly count: number;
  /** The declared outliers, in the order they were removed. */
  readonly values: readonly number[];
  /** For each declared outlier, whether it is below or above the rest. */
  readonly sides: readonly ("low" | "high")[];
  /** Rᵢ for every step run (fewer than r when the rest has no spread). */
  readonly statistics: readonly number[];
  /** λᵢ for every step run. */
  readonly critical: readonly number[];
  /** The method and its source, in words. */
  readonly method: string;
}

/** The default bound r for n values. */
export function defaultMaxOutliers(n: number): number {
  return n < 15 ? 1 : Math.max(1, Math.min(10, Math.floor(n / 10)));
}

/**
 * Rosner's critical value λᵢ for step i of n values at level α.
 *
 * @param i the step, 1 ≤ i ≤ n − 2
 * @param n the sample size
 * @param alpha the level
 *
 * @example
 * ```ts
 * import { esdCritical } from "./outliers.ts";
 * // Rosner's example, n = 54, α = 0.05: λ₁ printed as 3.158, three decimals truncated
 * // (NIST/SEMATECH e-Handbook 1.3.5.17.3, from memory)
 * if (Math.floor(esdCritical(1, 54, 0.05) * 1000) !== 3158) throw new Error("λ1");
 * ```
 */
export function esdCritical(i: number, n: number, alpha: number): number {
  const m = n - i + 1; // values in the sample at step i
  const t = studentTUpper(alpha / (2 * m), m - 2);
  return ((m - 1) * t) / Math.sqrt((m - 2 + t * t) * m);
}

/**
 * Find outliers with the generalized ESD procedure.
 *
 * @param x the sample (finite numbers, at least 3, not all equal)
 * @param options the bound r and the level α
 * @throws {PlumbError} `"too-few"`, `"non-finite"`, `"constant"`, or `"bad-option"` for r or α
 *   out of range
 *
 * @example
 * ```ts
 * import { generalizedEsd } from "./outliers.ts";
 * const x = [9.8, 10.1, 10.0, 9.9, 10.2, 10.0, 9.7, 10.3, 10.1, 9.9, 10.0, 10.2, 9.8, 10.1, 10.0, 14.0];
 * const r = generalizedEsd(x);
 * if (r.count !== 1 || r.values[0] !== 14 || r.sides[0] !== "high") throw new Error("one high outlier");
 * ```
 */
export function generalizedEsd(x: ArrayLike<number>, options: OutlierOptions = {}): OutlierResult {
  const s = sortedSample(x, "the generalized ESD outlier procedure", 3);
  return _generalizedEsdSorted(s, options);
}

/** {@linkcode generalizedEsd} on a sample already sorted ascending, finite and not constant. */
export function _generalizedEsdSorted(
  s: Float64Array,
  options: OutlierOptions = {},
): OutlierResult {
  const n = s.length;
  const alpha = options.alpha ?? 0.05;
  if (!(alpha > 0 && alpha < 1)) {
    throw new PlumbError("bad-option", `Cannot use alpha = ${alpha}: use a level between 0 and 1`);
  }
  const r = options.maxOutliers ?? defaultMaxOutliers(n);
  if (!Number.isInteger(r) || r < 1 || r > n - 2) {
    throw new PlumbError(
      "bad-option",
      `Cannot look for ${r} outliers among ${n} values: use a whole number from 1 to ${n - 2}`,
    );
  }
  // Centre at the median, scale by half the range (halved first, so it cannot overflow).
  const centre = s[n >> 1];
  const half = centre / 2;
  const scale = s[n - 1] / 2 - s[0] / 2;
  const u = (v: number) => (v / 2 - half) / scale;
  let lo = 0;
  let hi = n - 1;
  let sum = 0;
  let sumSq = 0;
  const refill = () => {
    let a = 0;
    let b = 0;
    for (let k = lo; k <= hi; k++) {
      const d = (s[k] / 2 - half) / scale;
      a += d;
      b += d * d;
    }
    sum = a;
    sumSq = b;
  };
  refill();
  const statistics: number[] = [];
  const critical: number[] = [];
  const removed: number[] = [];
  const sides: ("low" | "high")[] = [];
  for (let i = 1; i <= r; i++) {
    const m = hi - lo + 1;
    const mean = sum / m;
    const variance = (sumSq - (sum * sum) / m) / (m - 1);
    if (!(variance > 0) || s[lo] === s[hi]) break;
    const sd = Math.sqrt(variance);
    const dLo = mean - u(s[lo]);
    const dHi = u(s[hi]) - mean;
    const high = dHi >= dLo;
    statistics.push((high ? dHi : dLo) / sd);
    critical.push(esdCritical(i, n, alpha));
    const v = high ? s[hi] : s[lo];
    removed.push(v);
    sides.push(high ? "high" : "low");
    const d = u(v);
    if (high) hi--;
    else lo++;
    if (d * d > 0.01 * sumSq) refill();
    else {
      sum -= d;
      sumSq -= d * d;
    }
  }
  let count = 0;
  for (let i = 0; i < statistics.length; i++) if (statistics[i] > critical[i]) count = i + 1;
  return Object.freeze({
    n,
    alpha,
    maxOutliers: r,
    count,
    values: Object.freeze(removed.slice(0, count)),
    sides: Object.freeze(sides.slice(0, count)),
    statistics: Object.freeze(statistics),
    critical: Object.freeze(critical),
    method: r === 1
      ? `Grubbs's two-sided test at level ${alpha} (Grubbs 1969; Rosner 1983 with r = 1)`
      : `generalized ESD procedure, up to ${r} outliers at level ${alpha} (Rosner 1983)`,
  });
}
