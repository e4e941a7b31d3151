/**
 * The bias-corrected and accelerated (BCa) bootstrap interval, and the
 * seeded bootstrap of the mean that uses it.
 *
 * Source: Efron, B. (1987), "Better bootstrap confidence intervals",
 * Journal of the American Statistical Association 82:171–185. With R
 * bootstrap replicates t*, the estimate t₀ and α = (1 ∓ level)/2:
 *
 * - bias correction w = Φ⁻¹(#{t* < t₀}/R);
 * - acceleration a = Σ Lᵢ³ / (6·(Σ Lᵢ²)^{3/2}), from the empirical influence
 *   values Lᵢ of the statistic; for the mean these are exactly xᵢ − x̄ (the
 *   jackknife and the infinitesimal jackknife agree), so a = g₁/(6√n) with
 *   g₁ the moment skewness;
 * - adjusted levels α̃ = Φ(w + (w + z_α)/(1 − a(w + z_α)));
 * - each end is the α̃-quantile of the replicates at rank (R + 1)·α̃,
 *   interpolated between neighbouring order statistics on the normal scale
 *   (Davison & Hinkley 1997, *Bootstrap Methods and their Application*,
 *   Cambridge, eq. 5.8), the extreme replicate when the rank falls outside
 *   [1, R].
 *
 * These choices are those of R's boot package (`boot.ci(type = "bca")`,
 * functions `bca.ci` and `norm.inter` in boot 1.3-28.1, read for this
 * purpose): strict "<" in the bias correction, the same interpolation. One
 * difference: for a statistic given in index form, boot estimates the Lᵢ by
 * regression on the resampling frequencies (`empinf(type = "reg")`), a noisy
 * estimate of the same values; with the weighted form (`stype = "w"`) it
 * uses the infinitesimal jackknife, which for the mean is xᵢ − x̄ as here.
 * Checked against `boot.ci` on identical replicates
 * (tests/stats/bootstrap_bca_test.ts).
 *
 * The resampling is seeded ({@linkcode seededRandom}): the same data, seed
 * and number of resamples give the same interval on every machine.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalCdf, normalQuantile } from "../numeric/normal.ts";
import { seededRandom } from "../numeric/random.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";
import { _sampleShape } from "./moments.ts";
import { _levelOption } from "./quantile_interval.ts";

/** A BCa interval with the quantities behind it: plain, frozen data. */
export interface BcaInterval {
  /** The confidence level. */
  readonly level: number;
  /** Number of replicates used. */
  readonly resamples: number;
  /** Bias correction w = Φ⁻¹(#{t* < t₀}/R). */
  readonly bias: number;
  /** Acceleration a. */
  readonly acceleration: number;
  /** The adjusted levels α̃ for the two ends. */
  readonly adjustedLevels: readonly [number, number];
  /** The interval, `null` ends when the bias correction is infinite. */
  readonly interval: readonly [number | null, number | null];
  /** Cautions (extreme replicates used as ends, no bias correction possible). */
  readonly notes: readonly string[];
}

/**
 * The BCa interval from bootstrap replicates and influence values.
 *
 * @param estimate the statistic on the data, t₀
 * @param replicates the bootstrap replicates t* (not modified; non-finite ones are dropped)
 * @param options `{ acceleration, level }`: the acceleration a (see the module
 *   header for how it follows from the influence values) and the level (default 0.95)
 * @example
 * ```ts
 * import { bcaInterval } from "./bootstrap_bca.ts";
 * // half the replicates below the estimate (no bias) and no acceleration:
 * // the percentile interval, here between the 49th/50th and 1950th/1951st of 1999
 * const t = Float64Array.from({ length: 1999 }, (_, i) => i + 1);
 * const r = bcaInterval(1000, t, { acceleration: 0 });
 * if (!(r.interval[0]! > 49 && r.interval[0]! < 51 && r.interval[1]! > 1949)) {
 *   throw new Error(String(r.interval));
 * }
 * ```
 */
export function bcaInterval(
  estimate: number,
  replicates: ArrayLike<number>,
  options: { readonly acceleration: number; readonly level?: number },
): BcaInterval {
  const level = _levelOption(options.level ?? 0.95, "a BCa interval", "0.95");
  const a = options.acceleration;
  const kept: number[] = [];
  let below = 0;
  for (let i = 0; i < replicates.length; i++) {
    const t = replicates[i];
    if (!Number.isFinite(t)) continue;
    kept.push(t);
    if (t < estimate) below++;
  }
  const R = kept.length;
  checkSize(R, 2, Number.POSITIVE_INFINITY, "a BCa interval from bootstrap replicates");
  const w = normalQuantile(below / R);
  const notes: string[] = [];
  if (!Number.isFinite(w) || !Number.isFinite(a)) {
    notes.push(
      `No BCa interval: ${below === 0 ? "no" : "every"} bootstrap replicate lies below the ` +
        "estimate, so the bias correction is infinite (the data are too few or too tied)",
    );
    return _freeze(level, R, w, a, [NaN, NaN], [null, null], notes);
  }
  const t = sortFloat64(Float64Array.from(kept));
  const adj: [number, number] = [0, 0];
  const ends: [number, number] = [0, 0];
  [(1 - level) / 2, (1 + level) / 2].forEach((alpha, j) => {
    const z = normalQuantile(alpha);
    adj[j] = normalCdf(w + (w + z) / (1 - a * (w + z)));
    ends[j] = _normalInterpolated(t, adj[j]);
  });
  const rk = adj.map((p) => (R + 1) * p);
  if (!rk.every((r) => r > 1 && r < R)) {
    notes.push(
      "An end of the BCa interval is an extreme bootstrap replicate (the adjusted level " +
        "falls outside the replicates): use more resamples",
    );
  }
  return _freeze(level, R, w, a, adj, ends, notes);
}

/** The α-quantile of sorted replicates at rank (R + 1)α, interpolated on the normal scale. */
function _normalInterpolated(t: Float64Array, alpha: number): number {
  const R = t.length;
  const rk = (R + 1) * alpha;
  const k = Math.trunc(rk);
  if (k === 0) return t[0];
  if (k >= R) return t[R - 1];
  if (k === rk) return t[k - 1];
  const z = normalQuantile(alpha);
  const zk = normalQuantile(k / (R + 1));
  const zk1 = normalQuantile((k + 1) / (R + 1));
  return t[k - 1] + ((z - zk) / (zk1 - zk)) * (t[k] - t[k - 1]);
}

function _freeze(
  level: number,
  resamples: number,
  bias: number,
  acceleration: number,
  adjustedLevels: readonly [number, number],
  interval: readonly [number | null, number | null],
  notes: string[],
): BcaInterval {
  return Object.freeze({
    level,
    resamples,
    bias,
    acceleration,
    adjustedLevels: Object.freeze([...adjustedLevels] as [number, number]),
    interval: Object.freeze([...interval] as [number | null, number | null]),
    notes: Object.freeze(notes),
  });
}

/** Options for {@linkcode bootstrapMean}. */
export interface BootstrapOptions {
  /**
   * Confidence level.
   * @default 0.95
   */
  readonly level?: number;
  /**
   * Number of bootstrap resamples.
   * @default 2000
   */
  readonly resamples?: number;
  /**
   * Seed of the resampling.
   * @default 1
   */
  readonly seed?: number;
}

/**
 * The means of `resamples` bootstrap resamples of `x` (each n draws with
 * replacement), from a seeded stream.
 *
 * @param x the data
 * @param resamples how many resamples
 * @param seed the seed
 */
export function _meanReplicates(x: Float64Array, resamples: number, seed: number): Float64Array {
  const n = x.length;
  const rng = seededRandom(seed);
  const out = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += x[rng.integer(n)];
    out[b] = sum / n;
  }
  return out;
}

/**
 * A seeded BCa bootstrap interval for the mean.
 *
 * @param x finite values, at least 2, not all equal
 * @param options level, number of resamples and seed
 * @example
 * ```ts
 * import { bootstrapMean } from "./bootstrap_bca.ts";
 * const x = [3.1, 2.7, 4.4, 3.9, 5.2, 2.2, 3.3, 6.8, 3.0, 4.1];
 * const a = bootstrapMean(x), b = bootstrapMean(x);
 * if (a.interval[0] !== b.interval[0] || !(a.interval[0]! < 3.87 && a.interval[1]! > 3.87)) {
 *   throw new Error("not deterministic or not around the mean");
 * }
 * ```
 */
export function bootstrapMean(x: ArrayLike<number>, options: BootstrapOptions = {}): BcaInterval {
  const what = "a bootstrap interval for the mean";
  const resamples = options.resamples ?? 2000;
  const seed = options.seed ?? 1;
  if (!Number.isInteger(resamples) || resamples < 100) {
    throw new PlumbError(
      "bad-option",
      `Cannot run ${what} with ${resamples} resamples: use a whole number of at least 100 ` +
        `(2000 or more for stable 95% ends)`,
      { resamples },
    );
  }
  if (!Number.isInteger(seed)) {
    throw new PlumbError("bad-option", `Cannot seed ${what} with ${seed}: use a whole number`, {
      seed,
    });
  }
  checkSize(x.length, 2, Number.POSITIVE_INFINITY, what);
  const v = finiteCopy(x, what);
  const shape = _sampleShape(v, what);
  checkSpreadFinite(shape.sd, what);
  const acceleration = shape.g1 / (6 * Math.sqrt(v.length));
  return bcaInterval(shape.mean, _meanReplicates(v, resamples, seed), {
    acceleration,
    level: options.level,
  });
}
