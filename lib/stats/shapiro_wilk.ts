/**
 * The Shapiro–Wilk test of normality, W and its p-value by Royston's method.
 *
 * @module
 */
import { normalSf } from "../numeric/normal.ts";
import { shapiroWilkCoefficients } from "./shapiro_wilk_coefficients.ts";
import { checkNotConstant, checkSize, finiteCopy } from "./_input.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { roundingWarning } from "./rounding.ts";
import { freezeResult, type TestResult } from "./result.ts";

const _NAME = "the Shapiro–Wilk test";
/** Smallest and largest n covered by Royston's approximation. */
export const SHAPIRO_WILK_MIN_N = 3;
/** Largest n covered by Royston's approximation. */
export const SHAPIRO_WILK_MAX_N = 5000;

/**
 * Shapiro–Wilk W and its p-value (Shapiro & Wilk 1965, Biometrika
 * 52:591–611), with coefficients and p-value by Royston's approximation
 * (Royston 1992, Statistics and Computing 2:117–119; Royston 1995, Applied
 * Statistics 44:547–551, Algorithm AS R94).
 *
 * W = (Σ a_i x₍ᵢ₎)² / Σ (x_i − x̄)² is computed in double precision on the
 * sorted sample shifted by its minimum and scaled by a power of two near its
 * range, in one pass; 1 − W is formed as a difference of squares of the two
 * square roots so that W very near 1 keeps its digits. The sorted copy is
 * made in a buffer kept between calls, so a call allocates nothing of size n.
 *
 * p-value, by range of n:
 * - n = 3: exact, p = (6/π)(asin √W − asin √(3/4)) (W ≥ 3/4 always);
 * - 4 ≤ n ≤ 11: with γ = −2.273 + 0.459n, w = −log(γ − log(1 − W)) is
 *   treated as normal with mean 0.5440 − 0.39978n + 0.025054n² − 0.0006714n³
 *   and log sd 1.3822 − 0.77857n + 0.062767n² − 0.0020322n³;
 * - 12 ≤ n ≤ 5000: with ν = log n, log(1 − W) is treated as normal with mean
 *   −1.5861 − 0.31082ν − 0.083751ν² + 0.0038915ν³ and log sd
 *   −0.4803 − 0.082676ν + 0.0030302ν²;
 *   p is the upper normal tail of the standardised value, computed directly
 *   so that small p-values keep full relative accuracy.
 *
 * Agreement with R's double-precision `shapiro.test` (R 4.2.2): |ΔW| and
 * |Δp| at most 1e-9 relative (tests/stats/shapiro_wilk_test.ts); the
 * p-value itself is Royston's approximation, good to about two significant
 * figures in the tail of interest.
 *
 * Errors: `PlumbError` with code `"too-few"` (n < 3), `"too-many"`
 * (n > 5000), `"non-finite"` (NaN, ±∞ or non-numbers), `"constant"` (all
 * values equal). Warnings: a measurement step coarse against the spread
 * (`rounding.ts`).
 *
 * @param x the sample, any order
 * @returns a frozen {@linkcode TestResult} with `statisticName: "W"`
 *
 * @example
 * ```ts
 * import { shapiroWilk } from "@plumbline/plumbline";
 * const r = shapiroWilk([2.1, 2.9, 3.2, 3.3, 3.8, 4.1, 4.4, 5.0, 5.6, 7.9]);
 * if (!(r.statistic > 0.8 && r.statistic <= 1 && r.pValue > 0.05)) throw new Error("unexpected");
 * ```
 */
export function shapiroWilk(x: ArrayLike<number>): TestResult {
  const n = x.length;
  checkSize(n, SHAPIRO_WILK_MIN_N, SHAPIRO_WILK_MAX_N, _NAME);
  // The sorted copy lives only for this call (nothing in the result refers
  // to it), so it goes into a buffer kept for the next call: a test on
  // 1,000 values would otherwise spend more on allocating and collecting a
  // fresh array than on computing W.
  const s = _SORTED.subarray(0, n);
  if (x instanceof Float64Array) {
    s.set(x);
  } else {
    for (let i = 0; i < n; i++) {
      const v = x[i] as unknown;
      // A non-number (or NaN, ±∞) goes to the finiteness check below.
      s[i] = typeof v === "number" ? v : NaN;
    }
  }
  sortFloat64(s);
  // −∞ sorts first, +∞ and NaN last: the ends tell whether every value is finite.
  if (!(Number.isFinite(s[0]) && Number.isFinite(s[n - 1]))) finiteCopy(x, _NAME);
  checkNotConstant(s, _NAME);
  return _shapiroWilkSorted(s);
}

/** The sorted copy of {@linkcode shapiroWilk} (synchronous, never re-entered). */
const _SORTED = new Float64Array(SHAPIRO_WILK_MAX_N);

/**
 * {@linkcode shapiroWilk} on a sample already sorted ascending, finite and
 * not constant (the size is checked here), for callers that sort once and
 * run several tests; `ties` is the sample's rounding warning (`roundingWarning(s, true)`), when
 * the caller has scanned for ties already.
 */
export function _shapiroWilkSorted(
  s: Float64Array,
  ties: string | undefined = roundingWarning(s, true),
): TestResult {
  const n = s.length;
  checkSize(n, SHAPIRO_WILK_MIN_N, SHAPIRO_WILK_MAX_N, _NAME);
  const w = shapiroWilkW(s);
  const p = shapiroWilkPValue(w, n);
  const warnings: string[] = [];
  if (ties) warnings.push(ties);
  if (n < 20) {
    warnings.push(
      `With only ${n} values the test has little power: a large p is weak evidence of normality`,
    );
  }
  return freezeResult({
    test: "Shapiro–Wilk",
    statisticName: "W",
    statistic: w,
    pValue: p,
    n,
    method: n === 3
      ? "exact distribution of W for n = 3"
      : "Royston (1992, 1995) approximation, Algorithm AS R94",
    warnings,
  });
}

/**
 * W for a sample already sorted ascending, finite and not constant, with
 * 3 ≤ n. Exposed for callers that sort once and run several tests.
 *
 * @param sorted the sample in ascending order
 *
 * @example
 * ```ts
 * import { shapiroWilkW } from "./shapiro_wilk.ts";
 * const w = shapiroWilkW(new Float64Array([1, 2, 4]));
 * if (Math.abs(w - 0.9642857142857143) > 1e-15) throw new Error(String(w));
 * ```
 */
export function shapiroWilkW(sorted: Float64Array): number {
  const n = sorted.length;
  const a = shapiroWilkCoefficients(n);
  // Shift by the smallest value and scale by about the range, so that huge
  // offsets and extreme magnitudes neither cancel nor overflow. When the
  // range overflows (values near ±1.8e308 of both signs), halve before
  // subtracting (v·0.5 is exactly v/2) so that no difference overflows. The
  // scale is the power of two 2⁻ᵉ nearest below 1/range, applied in two
  // multiplications by powers of two (2⁻ᵉ itself is not a normal double when
  // |e| > 1022): no division per value, and W is the same to the last bit
  // for the sample times any power of two up to 2^±1000.
  const last = sorted[n - 1];
  const f = Number.isFinite(last - sorted[0]) ? 1 : 0.5;
  const lo = sorted[0] * f;
  const e = _exponent(last * f - lo);
  const pa = _pow2(Math.max(-1000, Math.min(1000, -e)));
  const pb = _pow2(-e - Math.max(-1000, Math.min(1000, -e)));
  const scaled = (v: number) => (v * f - lo) * pa * pb;
  if (n === 3) {
    // Exact form: with the values mapped to 0, m, 1, W = (3/4)/(1 − m + m²).
    const m = scaled(sorted[1]) / scaled(sorted[2]);
    return Math.max(0.75, Math.min(1, 0.75 / (1 - m + m * m)));
  }
  // One pass over the values in pairs from the two ends: the pair's
  // difference is what b = Σ a_k (t₍ₙ₋ₖ₎ − t₍ₖ₊₁₎) needs, and the sums of
  // deviations and squared deviations from the middle value c run in two
  // independent chains each (twice the pace of one chain). The sum of squares
  // about the mean is then Σ(t − c)² − (Σ(t − c))²/n, the shifted-data form
  // (Chan, Golub & LeVeque 1983, The American Statistician 37:242–247): c is
  // within one standard deviation of the mean, so at most about one bit is
  // lost to cancellation.
  const half = a.length;
  const c = scaled(sorted[half]);
  let sumLo = 0;
  let sumHi = 0;
  let sqLo = 0;
  let sqHi = 0;
  let b = 0;
  for (let k = 0; k < half; k++) {
    const l = (sorted[k] * f - lo) * pa * pb;
    const h = (sorted[n - 1 - k] * f - lo) * pa * pb;
    b += a[k] * (h - l);
    const dl = l - c;
    const dh = h - c;
    sumLo += dl;
    sumHi += dh;
    sqLo += dl * dl;
    sqHi += dh * dh;
  }
  // With n odd, the middle value is c itself and adds nothing to either sum.
  const sum = sumLo + sumHi;
  const ssq = sqLo + sqHi - sum * sum / n;
  // 1 − W = (S − b)(S + b)/S² with S = √ssq, which stays accurate near W = 1.
  const root = Math.sqrt(ssq);
  const oneMinusW = ((root - b) * (root + b)) / ssq;
  const w = 1 - oneMinusW;
  return Math.min(1, Math.max(0, w));
}

const _BITS = new Float64Array(1);
const _WORDS = new Uint32Array(_BITS.buffer);
/** The little-endian word holding a double's sign and exponent. */
const _HIGH = new Uint8Array(new Float64Array([1]).buffer)[7] === 0x3f ? 1 : 0;

/** ⌊log₂ v⌋ for a positive finite v, from its bits (subnormals through Math.log2). */
function _exponent(v: number): number {
  _BITS[0] = v;
  const biased = (_WORDS[_HIGH] >>> 20) & 0x7ff;
  return biased === 0 ? Math.floor(Math.log2(v)) : biased - 1023;
}

/** 2ᵏ exactly, for an integer −1022 ≤ k ≤ 1023. */
function _pow2(k: number): number {
  _WORDS[_HIGH] = (k + 1023) << 20;
  _WORDS[1 - _HIGH] = 0;
  return _BITS[0];
}

function _poly(c: readonly number[], x: number): number {
  let r = 0;
  for (let i = c.length - 1; i >= 0; i--) r = r * x + c[i];
  return r;
}

// Royston (1992) coefficients for the distribution of W (as in AS R94).
const _G = [-2.273, 0.459];
const _C3 = [0.544, -0.39978, 0.025054, -6.714e-4];
const _C4 = [1.3822, -0.77857, 0.062767, -0.0020322];
const _C5 = [-1.5861, -0.31082, -0.083751, 0.0038915];
const _C6 = [-0.4803, -0.082676, 0.0030302];

/**
 * The Shapiro–Wilk p-value for a given W and n (3 ≤ n ≤ 5000), by the
 * method described in {@linkcode shapiroWilk}.
 *
 * @param w the statistic
 * @param n the sample size
 *
 * @example
 * ```ts
 * import { shapiroWilkPValue } from "./shapiro_wilk.ts";
 * // n = 3 is exact: W = 3/4 is the smallest possible value, p = 0
 * if (shapiroWilkPValue(0.75, 3) !== 0) throw new Error("p");
 * ```
 */
export function shapiroWilkPValue(w: number, n: number): number {
  if (n === 3) {
    const p = (6 / Math.PI) * (Math.asin(Math.sqrt(w)) - Math.PI / 3);
    return Math.min(1, Math.max(0, p));
  }
  if (w >= 1) return 1;
  const y = Math.log1p(-w);
  let z: number;
  if (n <= 11) {
    const gamma = _poly(_G, n);
    if (y >= gamma) return 0; // beyond the approximation's support: W is far below its null range
    const m = _poly(_C3, n);
    const s = Math.exp(_poly(_C4, n));
    z = (-Math.log(gamma - y) - m) / s;
  } else {
    const ln = Math.log(n);
    const m = _poly(_C5, ln);
    const s = Math.exp(_poly(_C6, ln));
    z = (y - m) / s;
  }
  return normalSf(z);
}
