/**
 * A separate cluster: a group of values at one end of the sample, cut off
 * from the rest by a gap far wider than a normal sample leaves, while the
 * rest on its own looks normal (for instance haemolysed samples in a
 * potassium series). Read as skew, such a group leads to the wrong remedy;
 * named, it sends the user back to the records.
 *
 * Method, a gap test in the manner of Wainer & Schacht's gapping (1978,
 * "Gapping", Psychometrika 43:203–212), with the gaps weighted by the
 * expected spacing of normal order statistics:
 * 1. normalised spacings gᵢ = (x₍ᵢ₊₁₎ − x₍ᵢ₎)/(mᵢ₊₁ − mᵢ)/σ̂, with mᵢ Blom's
 *    normal scores and σ̂ = IQR/1.349 (robust to the cluster itself). For a
 *    normal sample they are roughly independent standard exponentials
 *    (Pyke 1965, "Spacings", JRSS B 27:395–449), so the largest of them
 *    grows like ln n;
 * 2. only gaps with at least k = max(3, ⌈n/100⌉) values on the smaller side
 *    and at most a quarter of the values there are candidates (a single far
 *    value is an outlier, see `outliers.ts`; a half is a mixture, not a
 *    cluster);
 * 3. the largest candidate is significant when it exceeds 5.2 + ln n. The
 *    constant comes from plumbline's own seeded simulation
 *    (`tools/sim/cluster_gap.ts`, 2,000 normal samples per n): the 99th
 *    percentile of the largest candidate is 8.2 at n = 20, 8.6 at 100, 10.0
 *    at 500, 10.8 at 1,000 and 11.5 at 5,000, at or below the threshold;
 * 4. the rest (the larger side) must itself look normal: Shapiro–Wilk
 *    p ≥ 0.02 and no skew towards the group beyond 2 standard errors (3
 *    when the gap is at least twice the threshold: a plainly normal rest
 *    leans 2 standard errors towards the group in 2.3% of samples, and an
 *    overwhelming gap should not then be read as skew), or, above 5,000
 *    values, |G1| < 0.25 and |G2| < 0.5. Without this check the long tail of
 *    a skewed sample would be called a cluster. When the
 *    measurement step is coarse, |G2| within 2.576 standard errors stands in
 *    for Shapiro–Wilk, and every gap is measured less one step.
 * Above 4,000 values the gaps are taken between 4,000 order statistics at
 * evenly spaced ranks (ends included), which smooths the null spacings and
 * only makes the test more conservative.
 *
 * Rates from the same script (a 3% cluster at +5 sd with sd 0.5): found in
 * 53% of samples at n = 100, 89% at 200 and 97% from 500 to 5,000 (91–95%
 * for a wider cluster at +6 sd with sd 1; the 3-standard-error bound for
 * overwhelming gaps added 1–2 points from n = 200 on); a false cluster in
 * at most 0.5% of normal samples at any n, and in at most 7.5% of skewed or
 * heavy-tailed ones (lognormal σ = 0.5, exponential, t with 2 or 5 df) below
 * 200 values and at most 0.7% from 500 on; lognormal σ = 1 gets one in 10.7%
 * of samples of 20 (5.7% at 50, 0.1% at 100), with either skew bound.
 *
 * @module
 */
import { normalScores } from "./plotting_positions.ts";
import { sortedSample } from "./_input.ts";
import { _momentsOf, _sampleShape } from "./moments.ts";
import { _shapiroWilkSorted, SHAPIRO_WILK_MAX_N } from "./shapiro_wilk.ts";

/** A cluster found (or not), as frozen plain data. */
export interface ClusterResult {
  /** Number of values. */
  readonly n: number;
  /** Whether a separate cluster was found. */
  readonly found: boolean;
  /** The end the cluster sits at, when found. */
  readonly side?: "low" | "high";
  /** Values in the cluster, when found. */
  readonly count?: number;
  /** The gap's ends: the nearest value of the rest and of the cluster. */
  readonly gap?: readonly [number, number];
  /** The largest normalised gap among the candidates (0 when there are none). */
  readonly statistic: number;
  /** The threshold it is compared with, 5.2 + ln n. */
  readonly critical: number;
  /** The method and its source, in words. */
  readonly method: string;
}

/** Options for {@linkcode separateCluster}. */
export interface ClusterOptions {
  /**
   * The measurement step: a gap of one step is no gap, so each gap is
   * measured less one step.
   * @default null (no step)
   */
  readonly step?: number | null;
  /**
   * Whether the step is coarse against the spread (see `rounding.ts`): then
   * the rest is judged by its skewness and kurtosis alone, since rounding
   * alone makes Shapiro–Wilk reject.
   * @default false
   */
  readonly coarse?: boolean;
}

/** Above this size the gaps are taken between evenly spaced order statistics. */
const _MAX_POINTS = 4000;

/** The significance threshold for the largest normalised gap among n values. */
export function clusterGapCritical(n: number): number {
  return 5.2 + Math.log(n);
}

/**
 * Look for a separate cluster at either end of a sample.
 *
 * @param x the sample (finite numbers, at least 3, not all equal)
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { separateCluster } from "./clusters.ts";
 * import { seededRandom } from "@plumbline/plumbline";
 * const rng = seededRandom(4);
 * const x = Array.from({ length: 500 }, (_, i) => (i < 15 ? 9 + rng.normal() * 0.3 : 5 + rng.normal() * 0.6));
 * const c = separateCluster(x);
 * if (!c.found || c.side !== "high" || c.count !== 15) throw new Error("cluster of 15 above");
 * ```
 */
export function separateCluster(x: ArrayLike<number>, options: ClusterOptions = {}): ClusterResult {
  return _separateClusterSorted(sortedSample(x, "the cluster search", 3), options);
}

/** {@linkcode separateCluster} on a sample already sorted ascending, finite and not constant. */
export function _separateClusterSorted(
  s: Float64Array,
  options: ClusterOptions = {},
): ClusterResult {
  const n = s.length;
  const critical = clusterGapCritical(n);
  const method = "largest normalised gap (gapping, Wainer & Schacht 1978) with at least " +
    `${_minSide(n)} values beyond it, significant above 5.2 + ln n, the rest checked for normality`;
  const none = (statistic: number) =>
    Object.freeze({ n, found: false, statistic, critical, method }) as ClusterResult;
  const k = _minSide(n);
  if (n < 2 * k + 1 || k > 0.25 * n) return none(0);
  const ranks = n <= _MAX_POINTS
    ? Array.from({ length: n }, (_, i) => i + 1)
    : Array.from({ length: _MAX_POINTS }, (_, j) =>
      Math.round(1 + (j * (n - 1)) / (_MAX_POINTS - 1)));
  const m = normalScores(n, { ranks });
  const sigma = (_q7(s, 0.75) - _q7(s, 0.25)) / 1.349;
  if (!(sigma > 0)) return none(0);
  const step = options.step ?? 0;
  let best = 0;
  let at = -1; // rank (1-based) of the value just below the best gap
  for (let j = 0; j + 1 < ranks.length; j++) {
    const below = ranks[j];
    const smaller = Math.min(below, n - below);
    if (smaller < k || smaller > 0.25 * n) continue;
    const gap = Math.max(0, s[ranks[j + 1] - 1] - s[below - 1] - step);
    const g = gap / (m[j + 1] - m[j]) / sigma;
    if (g > best) {
      best = g;
      at = below;
    }
  }
  if (!(best > critical)) return none(best);
  const high = at > n / 2;
  // Values s[0 … cut − 1] lie below the gap. Between thinned ranks, the cut
  // is the widest raw gap among the values in between.
  let cut = at;
  if (n > _MAX_POINTS) {
    const next = ranks[ranks.indexOf(at) + 1];
    let widest = -1;
    for (let r = at; r < next; r++) {
      if (s[r] - s[r - 1] > widest) {
        widest = s[r] - s[r - 1];
        cut = r;
      }
    }
  }
  const rest = high ? s.subarray(0, cut) : s.subarray(cut);
  // An overwhelming gap (twice the threshold) tolerates a rest skewed by up
  // to 3 standard errors towards it instead of 2.
  const skewLimit = best >= 2 * critical ? 3 : 2;
  if (!_restLooksNormal(rest, high, options.coarse ?? false, skewLimit)) return none(best);
  return Object.freeze({
    n,
    found: true,
    side: high ? "high" : "low",
    count: high ? n - cut : cut,
    gap: Object.freeze([s[cut - 1], s[cut]] as const),
    statistic: best,
    critical,
    method,
  });
}

function _minSide(n: number): number {
  return Math.max(3, Math.ceil(n / 100));
}

/** Type-7 quantile of a sorted sample. */
function _q7(s: Float64Array, p: number): number {
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return lo + 1 < s.length ? s[lo] + (h - lo) * (s[lo + 1] - s[lo]) : s[lo];
}

/**
 * Whether the rest of a sample (sorted, with a group or outliers removed) is
 * on its own consistent with a normal distribution, by step 4 of the method
 * in this module's header; `towardHigh` says on which side the removed
 * values were, so that a skew towards them beyond `skewLimit` standard
 * errors counts against the rest.
 */
export function _restLooksNormal(
  rest: Float64Array,
  towardHigh: boolean,
  coarse: boolean,
  skewLimit = 2,
): boolean {
  if (rest.length < 4 || rest[0] === rest[rest.length - 1]) return false;
  const m = _momentsOf(rest.length, _sampleShape(rest, "the rest of the sample"));
  if (rest.length > SHAPIRO_WILK_MAX_N) return Math.abs(m.G1) < 0.25 && Math.abs(m.G2) < 0.5;
  const toward = towardHigh ? m.G1 : -m.G1;
  if (toward >= skewLimit * m.seG1) return false;
  if (coarse) return Math.abs(m.G2) < 2.576 * m.seG2;
  return _shapiroWilkSorted(rest).pValue >= 0.02;
}
