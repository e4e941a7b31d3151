/**
 * The beta function's logarithm, the regularised incomplete beta function
 * and the beta quantile, accurate to about 1e-12 relative.
 *
 * These are computed here, not taken from jStat: jStat 1.9.6's
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
import { log1pmx, stirlingCorrection } from "./gamma.ts";
import { normalQuantile } from "./normal.ts";

/** Stirling-series threshold: arguments below it are shifted up first. */
const _STIRLING_MIN = 10;
const _HALF_LOG_2PI = 0.9189385332046728; // ½·log(2π)

/**
 * log B(a, b) for a, b > 0, without cancellation between large terms.
 *
 * @param a first shape, > 0
 * @param b second shape, > 0
 * @example
 * ```ts
 * import { logBeta } from "./beta.ts";
 * // B(2, 3) = 1/12
 * if (Math.abs(logBeta(2, 3) + Math.log(12)) > 1e-14) throw new Error("logBeta");
 * ```
 */
export function logBeta(a: number, b: number): number {
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
    stirlingCorrection(a) + stirlingCorrection(b) - stirlingCorrection(s) + shift;
}

/**
 * log of the prefactor xᵃ(1 − x)ᵇ/B(a, b). For a, b ≥ 10 it is written, with
 * s = a + b and d = x·s − a, as a·[log(1 + d/a) − d/a] + b·[log(1 − d/b) + d/b]
 * + ½·log(ab/(2πs)) + δ(s) − δ(a) − δ(b) (δ from Stirling's series; the ±d
 * terms cancel exactly), so that no two terms of size a or b cancel — the
 * form of Temme (1979, SIAM Journal on Mathematical Analysis 10:757–766)
 * and of the saddle-point binomial terms of Loader (2000, "Fast and accurate
 * computation of binomial probabilities").
 */
function _logPrefactor(x: number, a: number, b: number, lx: number, l1x: number, logB: number) {
  const s = a + b;
  const d = x * s - a;
  // Away from the centre (|d| > a/2 or b/2) the direct form is as good, and
  // better near x = 0 or 1, where log x and log(1 − x) carry full precision
  // but 1 ± d/a would be formed with an absolute error of about s·ε.
  if (a < _STIRLING_MIN || b < _STIRLING_MIN || Math.abs(d) > 0.5 * Math.min(a, b)) {
    return a * lx + b * l1x - logB;
  }
  return a * log1pmx(d / a) + b * log1pmx(-d / b) + 0.5 * Math.log((a * b) / (2 * Math.PI * s)) +
    stirlingCorrection(s) - stirlingCorrection(a) - stirlingCorrection(b);
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
 *
 * @param x the point
 * @param a first shape, > 0
 * @param b second shape, > 0
 * @param logB log B(a, b), when the caller has it
 * @returns `[Iₓ(a, b), 1 − Iₓ(a, b)]`
 * @example
 * ```ts
 * import { betaCdfPair } from "./beta.ts";
 * // Beta(1, 1) is uniform
 * const [lower, upper] = betaCdfPair(0.25, 1, 1);
 * if (Math.abs(lower - 0.25) > 1e-15 || Math.abs(upper - 0.75) > 1e-15) throw new Error("cdf");
 * ```
 */
export function betaCdfPair(
  x: number,
  a: number,
  b: number,
  logB = logBeta(a, b),
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
    const lower = Math.exp(_logPrefactor(x, a, b, lx, l1x, logB)) *
      _betaContinuedFraction(x, a, b) / a;
    return [lower, 1 - lower];
  }
  if (x < 0.5 && Number.isInteger(a) && a <= _BINOMIAL_SUM_MAX) {
    const upper = _binomialUpper(a, b, lx, l1x, logB);
    return [1 - upper, upper];
  }
  const upper = Math.exp(_logPrefactor(x, a, b, lx, l1x, logB)) *
    _betaContinuedFraction(1 - x, b, a) / b;
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
 *
 * @param p the probability, 0 < p < 1
 * @param a first shape, > 0
 * @param b second shape, > 0
 * @example
 * ```ts
 * import { betaQuantile } from "./beta.ts";
 * // the median of Beta(2, 2) is ½ by symmetry
 * if (Math.abs(betaQuantile(0.5, 2, 2) - 0.5) > 1e-15) throw new Error("quantile");
 * ```
 */
export function betaQuantile(p: number, a: number, b: number): number {
  if (a === 1) return -Math.expm1(Math.log1p(-p) / b);
  if (b === 1) return Math.exp(Math.log(p) / a);
  const logB = logBeta(a, b);
  const upperSide = p > 0.5;
  const q = 1 - p;
  let lo = 0;
  let hi = 1;
  let x = _betaQuantileStart(p, a, b, logB);
  for (let iter = 0; iter < 200; iter++) {
    const [lower, upper] = betaCdfPair(x, a, b, logB);
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
