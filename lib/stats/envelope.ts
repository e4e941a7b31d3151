/**
 * Confidence envelopes for a normal QQ plot, from the exact distribution of
 * uniform order statistics.
 *
 * If X₍₁₎ ≤ … ≤ X₍ₙ₎ is an ordered sample from a continuous distribution F,
 * then F(X₍ᵢ₎) has the Beta(i, n − i + 1) distribution (David & Nagaraja
 * 2003, "Order Statistics", 3rd ed., Wiley, §2.2). A pointwise envelope for
 * rank i is therefore `Φ⁻¹(B⁻¹(α/2; i, n − i + 1))` to
 * `Φ⁻¹(B⁻¹(1 − α/2; i, n − i + 1))` on the standard normal scale, which a
 * QQ plot maps to data units through the fitted normal (mean + sd · z).
 *
 * The simultaneous band is the tail-sensitive band of Aldor-Noiman, Brown,
 * Buja, Rolke and Stine (2013, "The power to see: a new graphical test of
 * normality", The American Statistician 67:249–260): simulate uniform
 * samples, take for each the smallest two-sided pointwise tail probability
 * over all ranks, and choose the pointwise level whose band holds every rank
 * for a fraction 1 − α of the simulated samples. The simulation is seeded,
 * so the band is the same on every run.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { betaCdfPair, betaQuantile, logBeta } from "../numeric/beta.ts";
import { normalQuantile } from "../numeric/normal.ts";
import { seededRandom } from "../numeric/random.ts";

function _checkRank(i: number, n: number): void {
  if (!Number.isInteger(n) || n < 1) {
    throw new PlumbError(
      "bad-option",
      `Cannot build an envelope for sample size ${n}: use a whole number of at least 1`,
    );
  }
  if (!Number.isInteger(i) || i < 1 || i > n) {
    throw new PlumbError(
      "bad-option",
      `Cannot use rank ${i} in a sample of ${n}: ranks run from 1 to ${n}`,
    );
  }
}

/**
 * The lower limit on the z scale for rank i: Φ⁻¹ of the lower quantile.
 * Above the middle rank the quantile x is near 1, so 1 − x is computed
 * instead, as the (1 − tail)-quantile of the mirrored statistic
 * U(n + 1 − i) ~ Beta(n − i + 1, i), and z = −Φ⁻¹(1 − x).
 */
function _zLower(i: number, n: number, tail: number): number {
  if (2 * i <= n + 1) return normalQuantile(betaQuantile(tail, i, n - i + 1));
  return -normalQuantile(betaQuantile(1 - tail, n - i + 1, i));
}

/** Per (n, tail) cache of lower z limits by rank; a few sizes at most. */
const _cache = new Map<string, Map<number, number>>();
const _CACHE_SIZES = 8;

function _cachedZLower(i: number, n: number, tail: number): number {
  const key = `${n}|${tail}`;
  let m = _cache.get(key);
  if (m === undefined) {
    if (_cache.size >= _CACHE_SIZES) _cache.delete(_cache.keys().next().value as string);
    m = new Map();
    _cache.set(key, m);
  }
  let z = m.get(i);
  if (z === undefined) {
    z = _zLower(i, n, tail);
    m.set(i, z);
  }
  return z;
}

/** Options for {@linkcode normalEnvelope}. */
export interface EnvelopeOptions {
  /**
   * Coverage of the envelope, in (0, 1).
   * @default 0.95
   */
  readonly level?: number;
  /**
   * The ranks (1-based, ascending or not) at which to compute the limits;
   * a QQ plot that shows a thinned sample asks only for the ranks it shows.
   * @default every rank 1 … n
   */
  readonly ranks?: ArrayLike<number>;
  /**
   * `"pointwise"`: each rank is covered with probability `level`.
   * `"simultaneous"`: all ranks are covered together with probability
   * `level` (tail-sensitive band, Aldor-Noiman et al. 2013), by a seeded
   * simulation of `draws` samples; costs about n·draws incomplete-beta
   * evaluations, so it is limited to n ≤ 5000.
   * @default "pointwise"
   */
  readonly kind?: "pointwise" | "simultaneous";
  /**
   * Simulated samples for the simultaneous band.
   * @default 1000
   */
  readonly draws?: number;
  /**
   * Seed of the simulation for the simultaneous band.
   * @default 20130801
   */
  readonly seed?: number;
}

/** Limits of a QQ envelope on the standard normal scale. */
export interface Envelope {
  /** Sample size. */
  readonly n: number;
  /** Requested coverage. */
  readonly level: number;
  /** `"pointwise"` or `"simultaneous"`. */
  readonly kind: "pointwise" | "simultaneous";
  /** The pointwise two-sided tail probability actually used at each rank. */
  readonly pointwiseTail: number;
  /** The ranks, 1-based, in the order asked for. */
  readonly ranks: readonly number[];
  /** Lower limits, standard normal scale. */
  readonly lower: readonly number[];
  /** Upper limits, standard normal scale. */
  readonly upper: readonly number[];
  /** The published method, in words. */
  readonly method: string;
}

/** The largest n for the simulated simultaneous band. */
export const SIMULTANEOUS_MAX_N = 5000;

/**
 * The envelope of a normal QQ plot on the standard normal scale: for each
 * rank i of n, limits that the i-th smallest standardised value falls
 * between with probability `level` (pointwise), or all ranks together
 * (simultaneous). Multiply by the sd and add the mean for data units.
 *
 * @param n the sample size
 * @param options level, ranks, kind, simulation size and seed
 * @example
 * ```ts
 * import { normalEnvelope } from "./envelope.ts";
 * const e = normalEnvelope(20, { ranks: [1, 10, 20] });
 * if (!(e.lower[0] < e.upper[0] && e.lower[2] > -2)) throw new Error("limits");
 * ```
 */
export function normalEnvelope(n: number, options: EnvelopeOptions = {}): Envelope {
  const level = options.level ?? 0.95;
  const kind = options.kind ?? "pointwise";
  if (!(level > 0 && level < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot build an envelope with level ${level}: use a coverage strictly between 0 and 1, such as 0.95`,
    );
  }
  _checkRank(1, n);
  const ranks = options.ranks === undefined
    ? Array.from({ length: n }, (_, k) => k + 1)
    : Array.from(options.ranks);
  for (const i of ranks) _checkRank(i, n);
  let tail: number;
  let method: string;
  if (kind === "simultaneous") {
    tail = simultaneousTail(n, {
      level,
      draws: options.draws ?? 1000,
      seed: options.seed ?? 20130801,
    });
    method = `simultaneous ${level * 100}% tail-sensitive band (Aldor-Noiman et al. 2013, ` +
      `The American Statistician 67:249–260), ${options.draws ?? 1000} seeded simulated samples`;
  } else if (kind === "pointwise") {
    tail = 1 - level;
    method = `pointwise ${level * 100}% limits from Beta(i, n − i + 1), the exact distribution ` +
      `of uniform order statistics`;
  } else {
    throw new PlumbError(
      "bad-option",
      `Cannot build an envelope of kind ${JSON.stringify(kind)}: use "pointwise" or "simultaneous"`,
    );
  }
  const half = tail / 2;
  const lower = ranks.map((i) => _cachedZLower(i, n, half));
  const upper = ranks.map((i) => -_cachedZLower(n + 1 - i, n, half));
  return Object.freeze({
    n,
    level,
    kind,
    pointwiseTail: tail,
    ranks: Object.freeze(ranks),
    lower: Object.freeze(lower),
    upper: Object.freeze(upper),
    method,
  });
}

const _tailCache = new Map<string, number>();

/** Options for {@linkcode simultaneousTail}. */
export interface SimultaneousOptions {
  /**
   * Joint coverage.
   * @default 0.95
   */
  readonly level?: number;
  /**
   * Number of simulated uniform samples.
   * @default 1000
   */
  readonly draws?: number;
  /**
   * Seed of the simulation.
   * @default 20130801
   */
  readonly seed?: number;
}

/**
 * The pointwise two-sided tail probability whose envelope covers all n
 * ranks jointly with probability `level`, by the simulation of
 * Aldor-Noiman et al. (2013, The American Statistician 67:249–260): for each
 * simulated ordered uniform sample u₍₁₎ … u₍ₙ₎ record
 * `min over i of 2·min(Fᵢ(u₍ᵢ₎), 1 − Fᵢ(u₍ᵢ₎))` with Fᵢ the Beta(i, n − i + 1)
 * CDF, then take the (1 − level) quantile of those minima. The ordered
 * uniforms are built from exponential spacings (Rényi 1953), drawn from
 * plumbline's seeded generator (`numeric/random.ts`). Cached per
 * (n, level, draws, seed).
 *
 * @param n sample size, 1 … 5000
 * @param options level, draws, seed
 * @example
 * ```ts
 * import { simultaneousTail } from "./envelope.ts";
 * const t = simultaneousTail(30, { draws: 200 });
 * if (!(t > 0 && t < 0.05)) throw new Error("a joint band needs a smaller pointwise tail");
 * ```
 */
export function simultaneousTail(n: number, options: SimultaneousOptions = {}): number {
  const level = options.level ?? 0.95;
  const draws = options.draws ?? 1000;
  const seed = options.seed ?? 20130801;
  _checkRank(1, n);
  if (n > SIMULTANEOUS_MAX_N) {
    throw new PlumbError(
      "too-many",
      `Cannot simulate a simultaneous band for ${n} values: the simulation is limited to ` +
        `${SIMULTANEOUS_MAX_N}; use the pointwise envelope (kind: "pointwise")`,
      { n, max: SIMULTANEOUS_MAX_N },
    );
  }
  if (!Number.isInteger(draws) || draws < 20) {
    throw new PlumbError(
      "bad-option",
      `Cannot simulate a band from ${draws} samples: use a whole number of at least 20`,
    );
  }
  const key = `${n}|${level}|${draws}|${seed}`;
  const hit = _tailCache.get(key);
  if (hit !== undefined) return hit;
  const rng = seededRandom(seed);
  const logB = new Float64Array(n);
  for (let i = 1; i <= n; i++) logB[i - 1] = logBeta(i, n - i + 1);
  const minima = new Float64Array(draws);
  const u = new Float64Array(n);
  for (let d = 0; d < draws; d++) {
    // ordered uniforms: partial sums of n + 1 exponentials, normalised
    let sum = 0;
    for (let i = 0; i < n; i++) {
      sum -= Math.log(rng.uniform());
      u[i] = sum;
    }
    sum -= Math.log(rng.uniform());
    let m = 1;
    for (let i = 0; i < n; i++) {
      const [lo, up] = betaCdfPair(u[i] / sum, i + 1, n - i, logB[i]);
      const t = 2 * Math.min(lo, up);
      if (t < m) m = t;
    }
    minima[d] = m;
  }
  minima.sort();
  // the largest tail t with at least level·draws samples inside: the
  // samples whose minimum is ≥ minima[k], k = floor((1 − level)·draws), number
  // draws − k ≥ level·draws
  const k = Math.min(draws - 1, Math.floor((1 - level) * draws));
  const tail = minima[k];
  _tailCache.set(key, tail);
  return tail;
}
