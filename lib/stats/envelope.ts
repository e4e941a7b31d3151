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
 * The beta quantile is computed here, not taken from jStat: jStat 1.9.6's
 * `ibetainv` differs from R's `qbeta` by up to 2e-9 relative at n = 1e6
 * (measured on the cases of tests/fixtures/envelope.json when this module
 * was written), short of the 1e-12 this module reaches. Method:
 * - the regularised incomplete beta function Iₓ(a, b) by its continued
 *   fraction (Abramowitz & Stegun 1964, Handbook of Mathematical Functions,
 *   26.5.8), evaluated with the modified Lentz algorithm (Lentz 1976,
 *   Applied Optics 15:668–671; Thompson & Barnett 1986, Journal of
 *   Computational Physics 64:490–509), on the side x < (a + 1)/(a + b + 2)
 *   and by the symmetry Iₓ(a, b) = 1 − I₁₋ₓ(b, a) on the other;
 * - the prefactor xᵃ(1 − x)ᵇ/B(a, b) in logarithms, with log B(a, b) from
 *   Stirling's series (Abramowitz & Stegun 6.1.41, seven terms, used for
 *   arguments ≥ 10 after shifting smaller ones up by the recurrence
 *   B(a, b) = B(a + 1, b)·(a + b)/a), written so that no two large terms
 *   cancel;
 * - the quantile by Newton's method on Iₓ(a, b) − p, safeguarded by
 *   bisection inside a bracket that every step narrows, started from the
 *   approximation of Abramowitz & Stegun 26.5.22; rank 1 and rank n have
 *   closed forms (Beta(1, n) and Beta(n, 1)).
 *
 * Accuracy: within 1e-12 relative of R 4.2.2's `qbeta` for every case in
 * tests/fixtures/envelope.json (n = 1 … 1e6).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalQuantile } from "../numeric/normal.ts";

/** Stirling-series threshold: arguments below it are shifted up first. */
const _STIRLING_MIN = 10;
const _HALF_LOG_2PI = 0.9189385332046728; // ½·log(2π)

/**
 * Stirling's correction δ(x) = log Γ(x) − [(x − ½)log x − x + ½log 2π],
 * for x ≥ 10 (Abramowitz & Stegun 6.1.41; coefficients B₂ₖ/(2k(2k − 1))
 * from the Bernoulli numbers).
 */
function _stirlingDelta(x: number): number {
  const r = 1 / x;
  const r2 = r * r;
  return r *
    (1 / 12 -
      r2 *
        (1 / 360 -
          r2 *
            (1 / 1260 -
              r2 * (1 / 1680 - r2 * (1 / 1188 - r2 * (691 / 360360 - r2 * (1 / 156)))))));
}

/** log B(a, b) for a, b > 0, without cancellation between large terms. */
export function _logBeta(a: number, b: number): number {
  let shift = 0;
  // B(a, b) = B(a + 1, b)·(a + b)/a: move both arguments up to the
  // Stirling range, accumulating the logarithm of the factors.
  while (a < _STIRLING_MIN) {
    shift += Math.log((a + b) / a);
    a += 1;
  }
  while (b < _STIRLING_MIN) {
    shift += Math.log((a + b) / b);
    b += 1;
  }
  const s = a + b;
  // (a − ½)log(a/s) + (b − ½)log(b/s) − ½log s + ½log 2π + δ(a) + δ(b) − δ(s);
  // the smaller share goes through log1p so the larger term keeps its digits.
  const la = a <= b ? Math.log(a / s) : Math.log1p(-b / s);
  const lb = a <= b ? Math.log1p(-a / s) : Math.log(b / s);
  return (a - 0.5) * la + (b - 0.5) * lb - 0.5 * Math.log(s) + _HALF_LOG_2PI +
    _stirlingDelta(a) + _stirlingDelta(b) - _stirlingDelta(s) + shift;
}

/** Continued fraction of A&S 26.5.8 by modified Lentz; converges for x < (a+1)/(a+b+2). */
function _betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  const maxTerms = 20000 + 20 * Math.ceil(Math.sqrt(Math.min(a, b)));
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let f = d;
  for (let m = 1; m <= maxTerms; m++) {
    const m2 = 2 * m;
    // even step d_{2m}
    let num = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    f *= d * c;
    // odd step d_{2m+1}
    num = -((a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) return f;
  }
  throw new PlumbError(
    "no-convergence",
    `Cannot evaluate the incomplete beta function at x = ${x}, a = ${a}, b = ${b}: ` +
      `the continued fraction did not converge; report this case`,
  );
}

/** Whole-number parameters up to this size may use the finite binomial sum. */
const _BINOMIAL_SUM_MAX = 200;

/**
 * 1 − Iₓ(a, b) for a whole number a, as the finite binomial sum
 * P(Bin(a + b − 1, x) ≤ a − 1) = Σₖ₌₀^{a−1} C(a + b − 1, k) xᵏ(1 − x)^{a+b−1−k}
 * (Abramowitz & Stegun 26.5.24 with 26.1.20), summed from the largest index
 * down. Every term is positive, so the sum keeps full relative accuracy
 * where the continued fraction in 1 − x would cancel (x small, b large).
 * `lx` = log x and `l1x` = log(1 − x).
 */
function _binomialUpper(a: number, b: number, lx: number, l1x: number, logB: number): number {
  // log of the k = a − 1 term: C(a + b − 1, a − 1) = 1 / (b·B(a, b))
  const logLast = -Math.log(b) - logB + (a - 1) * lx + b * l1x;
  const odds = Math.exp(l1x - lx); // (1 − x)/x
  const n = a + b - 1;
  let term = 1;
  let sum = 1;
  for (let k = a - 1; k >= 1; k--) {
    term *= (k / (n - k + 1)) * odds;
    sum += term;
    if (term < 1e-17 * sum) break;
  }
  return Math.exp(logLast) * sum;
}

/**
 * The regularised incomplete beta function Iₓ(a, b) = P(Beta(a, b) ≤ x),
 * and its complement, as `[lower, upper]`, each computed on its own side
 * without a subtraction from 1 where that side is small. The prefactor
 * xᵃ(1 − x)ᵇ/B(a, b) takes log(1 − x) as log1p(−x), never as the log of a
 * rounded 1 − x. Where the continued fraction would be evaluated at a
 * point near 1 with one small whole-number parameter (where its terms
 * cancel), the finite binomial sum is used instead.
 */
export function _betaCdfPair(
  x: number,
  a: number,
  b: number,
  logB = _logBeta(a, b),
): [number, number] {
  if (x <= 0) return [0, 1];
  if (x >= 1) return [1, 0];
  const lx = Math.log(x);
  const l1x = Math.log1p(-x);
  if (x < (a + 1) / (a + b + 2)) {
    if (x > 0.5 && Number.isInteger(b) && b <= _BINOMIAL_SUM_MAX) {
      const lower = _binomialUpper(b, a, l1x, lx, logB);
      return [lower, 1 - lower];
    }
    const lower = Math.exp(a * lx + b * l1x - logB) * _betaContinuedFraction(x, a, b) / a;
    return [lower, 1 - lower];
  }
  if (x < 0.5 && Number.isInteger(a) && a <= _BINOMIAL_SUM_MAX) {
    const upper = _binomialUpper(a, b, lx, l1x, logB);
    return [1 - upper, upper];
  }
  const upper = Math.exp(a * lx + b * l1x - logB) * _betaContinuedFraction(1 - x, b, a) / b;
  return [1 - upper, upper];
}

/** Starting value for the beta quantile: A&S 26.5.22 (a, b > 1), else the small-x form. */
function _betaQuantileStart(p: number, a: number, b: number, logB: number): number {
  if (a > 1 && b > 1) {
    // A&S 26.5.22: x ≈ a / (a + b·e^{2w}), where y is the normal point with
    // upper tail p (26.5.22 gives the x whose upper tail is p, so y is taken
    // for the upper tail 1 − p: y = Φ⁻¹(p)).
    const y = normalQuantile(p);
    const lam = (y * y - 3) / 6;
    const h = 2 / (1 / (2 * a - 1) + 1 / (2 * b - 1));
    const w = (y * Math.sqrt(h + lam)) / h -
      (1 / (2 * b - 1) - 1 / (2 * a - 1)) * (lam + 5 / 6 - 2 / (3 * h));
    const x = a / (a + b * Math.exp(2 * w));
    if (x > 0 && x < 1 && Number.isFinite(x)) return x;
  }
  // Iₓ(a, b) ≈ xᵃ / (a·B(a, b)) for small x
  const x = Math.exp((Math.log(p) + Math.log(a) + logB) / a);
  return Math.min(Math.max(x, 1e-300), 0.5);
}

/**
 * The p-quantile of Beta(a, b), by safeguarded Newton iteration on the
 * smaller tail: Iₓ(a, b) − p when p ≤ ½, (1 − p) − [1 − Iₓ(a, b)] otherwise,
 * so that neither the target nor the tail loses digits to a subtraction
 * from 1. a = 1 and b = 1 use the closed forms.
 */
function _betaQuantile(p: number, a: number, b: number): number {
  if (a === 1) return -Math.expm1(Math.log1p(-p) / b);
  if (b === 1) return Math.exp(Math.log(p) / a);
  const logB = _logBeta(a, b);
  const upperSide = p > 0.5;
  const q = 1 - p;
  let lo = 0;
  let hi = 1;
  let x = _betaQuantileStart(p, a, b, logB);
  for (let iter = 0; iter < 200; iter++) {
    const [lower, upper] = _betaCdfPair(x, a, b, logB);
    const g = upperSide ? q - upper : lower - p;
    if (g === 0) return x;
    if (g < 0) lo = x;
    else hi = x;
    const logDensity = (a - 1) * Math.log(x) + (b - 1) * Math.log1p(-x) - logB;
    let next = x - g / Math.exp(logDensity);
    // outside the bracket: bisect (geometrically while no lower bound is known)
    if (!(next > lo && next < hi)) next = lo > 0 ? 0.5 * (lo + hi) : 0.25 * hi;
    // Newton converges quadratically: once a step is below 1e-13 of the
    // nearer of x and 1 − x the error left is far smaller, and smaller steps
    // only chase rounding noise in Iₓ; a bracket of a few ulps also ends it.
    if (Math.abs(next - x) <= 1e-13 * Math.min(x, 1 - x) || hi - lo <= 4e-16 * hi) return next;
    x = next;
  }
  return x;
}

/**
 * The p-quantile of the i-th smallest of n independent uniform values,
 * that is of Beta(i, n − i + 1).
 *
 * Accuracy: within 1e-12 relative of R's `qbeta` on the cases in
 * tests/fixtures/envelope.json. Ranks 1 and n use the closed forms
 * `1 − (1 − p)^(1/n)` and `p^(1/n)`.
 *
 * @param i the rank, 1 ≤ i ≤ n
 * @param n the sample size
 * @param p the probability, 0 < p < 1
 * @returns the quantile in (0, 1)
 * @example
 * ```ts
 * import { uniformOrderQuantile } from "./envelope.ts";
 * // the median of the middle of 3 uniforms is ½ by symmetry
 * if (Math.abs(uniformOrderQuantile(2, 3, 0.5) - 0.5) > 1e-15) throw new Error("median");
 * ```
 */
export function uniformOrderQuantile(i: number, n: number, p: number): number {
  _checkRank(i, n);
  if (!(p > 0 && p < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute an order-statistic quantile at probability ${p}: use a value strictly between 0 and 1`,
    );
  }
  return _betaQuantile(p, i, n - i + 1);
}

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
  if (2 * i <= n + 1) return normalQuantile(_betaQuantile(tail, i, n - i + 1));
  return -normalQuantile(_betaQuantile(1 - tail, n - i + 1, i));
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

/** A small seeded generator: SplitMix32-style mixing of a Weyl sequence. */
function _uniformStream(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    z = (z ^ (z >>> 16)) >>> 0;
    // 32 random bits plus half a step: never 0, never 1
    return (z + 0.5) / 4294967296;
  };
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
 * uniforms are built from exponential spacings (Rényi 1953). Cached per
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
  const rand = _uniformStream(seed);
  const logB = new Float64Array(n);
  for (let i = 1; i <= n; i++) logB[i - 1] = _logBeta(i, n - i + 1);
  const minima = new Float64Array(draws);
  const u = new Float64Array(n);
  for (let d = 0; d < draws; d++) {
    // ordered uniforms: partial sums of n + 1 exponentials, normalised
    let sum = 0;
    for (let i = 0; i < n; i++) {
      sum -= Math.log(rand());
      u[i] = sum;
    }
    sum -= Math.log(rand());
    let m = 1;
    for (let i = 0; i < n; i++) {
      const [lo, up] = _betaCdfPair(u[i] / sum, i + 1, n - i, logB[i]);
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
