/**
 * The runs test about the median (Wald & Wolfowitz 1940, Annals of
 * Mathematical Statistics 11:147–162): in sequence order, mark each value
 * above or below the median, drop the values equal to it, and count the
 * runs R (maximal stretches on one side). Too few runs mean neighbours are
 * alike (drift, positive dependence); too many mean they alternate.
 *
 * Distribution: given n₁ values above and n₂ below, every arrangement is
 * equally likely under independence (for continuous data), and
 *   P(R = 2k) = 2·C(n₁−1, k−1)·C(n₂−1, k−1) / C(n₁+n₂, n₁),
 *   P(R = 2k+1) = [C(n₁−1, k)·C(n₂−1, k−1) + C(n₁−1, k−1)·C(n₂−1, k)] / C(n₁+n₂, n₁)
 * (Wald & Wolfowitz 1940; Mood 1940, Annals of Mathematical Statistics
 * 11:367–392). The p-value is exact up to n₁ + n₂ = {@linkcode RUNS_EXACT_MAX}
 * (two-sided: twice the smaller tail, at most 1 — common practice), and
 * beyond it from the normal approximation with mean 1 + 2n₁n₂/N, variance
 * 2n₁n₂(2n₁n₂ − N)/(N²(N − 1)) and a continuity correction of ½.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { logBeta } from "../numeric/beta.ts";
import { normalSf } from "../numeric/normal.ts";
import { finiteCopy } from "./_input.ts";
import { sortFloat64 } from "../numeric/sort.ts";

/** Up to this many values off the median the p-value is exact. */
export const RUNS_EXACT_MAX = 10000;

/** The runs test's result. Frozen plain data. */
export interface RunsResult {
  /** Values given. */
  readonly n: number;
  /** The median the values were compared with. */
  readonly median: number;
  /** Values above it (values equal to it are left out). */
  readonly above: number;
  /** Values below it. */
  readonly below: number;
  /** Runs counted. */
  readonly runs: number;
  /** Runs expected under independence, 1 + 2n₁n₂/(n₁ + n₂). */
  readonly expected: number;
  /** Two-sided p-value. */
  readonly pValue: number;
  /** `"exact"` or `"normal"`. */
  readonly method: "exact" | "normal";
  /** Cautions (values at the median, all on one side). */
  readonly warnings: readonly string[];
}

/**
 * The runs test about the median of `x`, taken in the order given.
 *
 * @param x the values (or residuals) in sequence order
 * @example
 * ```ts
 * import { runsTest } from "./runs_test.ts";
 * // a slow drift: low values first, high values last — two runs
 * const r = runsTest([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
 * if (r.runs !== 2 || !(r.pValue < 0.01)) throw new Error("runs");
 * ```
 */
export function runsTest(x: ArrayLike<number>): RunsResult {
  const what = "the runs test";
  const v = finiteCopy(x, what);
  const n = v.length;
  if (n < 2) {
    throw new PlumbError(
      "too-few",
      `Cannot run ${what} on ${n} value${n === 1 ? "" : "s"}: at least 2 are needed`,
    );
  }
  const s = sortFloat64(v.slice());
  if (s[0] === s[n - 1]) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what} on ${n} identical values: every value is at the median`,
    );
  }
  const median = n % 2 ? s[(n - 1) / 2] : s[n / 2 - 1] / 2 + s[n / 2] / 2;
  let above = 0, below = 0, runs = 0, last = 0;
  for (let t = 0; t < n; t++) {
    const side = v[t] > median ? 1 : v[t] < median ? -1 : 0;
    if (side === 0) continue;
    if (side > 0) above++;
    else below++;
    if (side !== last) runs++;
    last = side;
  }
  const warnings: string[] = [];
  const tied = n - above - below;
  if (tied > 0) {
    warnings.push(
      `${tied} value${tied === 1 ? " equals" : "s equal"} the median and ${
        tied === 1 ? "is" : "are"
      } left out`,
    );
  }
  const total = above + below;
  const expected = total === 0 ? 0 : 1 + (2 * above * below) / total;
  let pValue = 1;
  let method: RunsResult["method"] = "exact";
  if (above === 0 || below === 0) {
    warnings.push(`every value off the median is on one side: the runs say nothing about order`);
  } else if (total <= RUNS_EXACT_MAX) {
    const [lower, upper] = runsTails(runs, above, below);
    pValue = Math.min(1, 2 * Math.min(lower, upper));
  } else {
    method = "normal";
    const m = 2 * above * below;
    const variance = (m * (m - total)) / (total * total * (total - 1));
    const z = (Math.abs(runs - expected) - 0.5) / Math.sqrt(variance);
    pValue = Math.min(1, 2 * normalSf(Math.max(z, 0)));
  }
  return Object.freeze({
    n,
    median,
    above,
    below,
    runs,
    expected,
    pValue,
    method,
    warnings: Object.freeze(warnings),
  });
}

/** log C(a, b) for 0 ≤ b ≤ a. */
function _logChoose(a: number, b: number): number {
  if (b < 0 || b > a) return -Infinity;
  if (b === 0 || b === a) return 0;
  return -Math.log(a + 1) - logBeta(b + 1, a - b + 1);
}

/**
 * P(R = r) for n₁ values above and n₂ below the median, under independence
 * (Wald & Wolfowitz 1940).
 *
 * @example
 * ```ts
 * import { runsProbability } from "./runs_test.ts";
 * // two above and two below: arrangements ++-- and --++ give 2 runs, 2 of 6
 * if (Math.abs(runsProbability(2, 2, 2) - 1 / 3) > 1e-15) throw new Error("pmf");
 * ```
 */
export function runsProbability(r: number, n1: number, n2: number): number {
  const total = _logChoose(n1 + n2, n1);
  if (r < 2) return r === 1 && (n1 === 0 || n2 === 0) ? 1 : 0;
  const k = Math.floor(r / 2);
  if (r % 2 === 0) {
    return 2 * Math.exp(_logChoose(n1 - 1, k - 1) + _logChoose(n2 - 1, k - 1) - total);
  }
  return Math.exp(_logChoose(n1 - 1, k) + _logChoose(n2 - 1, k - 1) - total) +
    Math.exp(_logChoose(n1 - 1, k - 1) + _logChoose(n2 - 1, k) - total);
}

/**
 * `[P(R ≤ r), P(R ≥ r)]`, each summed on its own side so that small tails
 * keep their digits.
 */
export function runsTails(r: number, n1: number, n2: number): [number, number] {
  const most = 2 * Math.min(n1, n2) + (n1 === n2 ? 0 : 1);
  let lower = 0, upper = 0;
  for (let k = 2; k <= r; k++) lower += runsProbability(k, n1, n2);
  for (let k = r; k <= most; k++) upper += runsProbability(k, n1, n2);
  return [Math.min(1, lower), Math.min(1, upper)];
}
