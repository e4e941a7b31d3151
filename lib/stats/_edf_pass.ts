/**
 * The one pass over the fitted normal's distribution function that the two
 * EDF tests share: Anderson–Darling's weighted log sum and Lilliefors's
 * largest gap come from the same Φ value per point. Private to `lib/stats`.
 *
 * @module
 */
import { normalSf } from "../numeric/normal.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { checkSize, finiteCopy } from "./_input.ts";
import { _sampleShape, type _Shape, _zScore } from "./moments.ts";

/** What the EDF tests need from their shared pass. */
export interface _EdfPass {
  /** Number of values. */
  readonly n: number;
  /** Σ [(2i−1)·ln Φ(zᵢ) + (2n−2i+1)·ln Q(zᵢ)] over the sorted sample (compensated). */
  readonly adSum: number;
  /** maxᵢ max(i/n − Φ(zᵢ), Φ(zᵢ) − (i−1)/n): the Kolmogorov–Smirnov distance. */
  readonly ksDistance: number;
}

/** Above this |z| the upper tail comes from its asymptotic series rather than Cody's form. */
const _SERIES_FROM = 30;
const _HALF_LOG_2PI = 0.9189385332046728; // ½·ln(2π)

/**
 * ln Q(a) for a ≥ 30, Q the normal upper tail: the asymptotic (Laplace)
 * expansion Q(a) = φ(a)/a · (1 − a⁻² + 3a⁻⁴ − 15a⁻⁶ + 105a⁻⁸ − 945a⁻¹⁰ + 10395a⁻¹²),
 * whose first omitted term is below 3e−16 relative there (Abramowitz &
 * Stegun 1964, 26.2.12; equation number from memory).
 */
function _logUpperTailSeries(a: number): number {
  const w = 1 / (a * a);
  const s = w * (-1 + w * (3 + w * (-15 + w * (105 + w * (-945 + w * 10395)))));
  return -0.5 * a * a - Math.log(a) - _HALF_LOG_2PI + Math.log1p(s);
}

/**
 * Validate a sample for an EDF test and prepare it in one copy: size at
 * least `min`, finite, not constant. The moment summary is taken on the
 * values in their own order (as the screening of a sample takes it), then
 * the copy is sorted in place.
 */
export function _edfSample(
  x: ArrayLike<number>,
  what: string,
  min: number,
): { sorted: Float64Array; shape: _Shape } {
  checkSize(x.length, min, Number.POSITIVE_INFINITY, what);
  const copy = finiteCopy(x, what);
  const shape = _sampleShape(copy, what); // throws "constant"
  return { sorted: sortFloat64(copy), shape };
}

/**
 * The shared pass over a sorted, finite, non-constant sample with its
 * moment summary. Each point's standardised value zᵢ = (x₍ᵢ₎ − x̄)/s gives
 * one upper-tail value Q(|zᵢ|) (Cody's form; past |z| = 30 its asymptotic
 * series, so far outliers keep a finite, accurate logarithm), from which
 * come both ln Φ(zᵢ), ln Q(zᵢ) for Anderson–Darling (Anderson & Darling
 * 1954; Stephens 1974) and Φ(zᵢ) for the Lilliefors distance (Lilliefors
 * 1967), which covers both sides of every step of the empirical
 * distribution function, ties included.
 */
export function _edfPass(s: Float64Array, shape: _Shape): _EdfPass {
  const n = s.length;
  let sum = 0;
  let comp = 0;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const zi = _zScore(s[i], shape);
    const a = Math.abs(zi);
    let q: number; // Q(|z|)
    let logTail: number; // ln Q(|z|)
    let logBody: number; // ln(1 − Q(|z|))
    if (a < _SERIES_FROM) {
      q = normalSf(a);
      logTail = Math.log(q);
      logBody = Math.log1p(-q);
    } else {
      logTail = _logUpperTailSeries(a);
      q = Math.exp(logTail);
      logBody = -q;
    }
    const positive = zi >= 0;
    const term = (2 * i + 1) * (positive ? logBody : logTail) +
      (2 * n - 2 * i - 1) * (positive ? logTail : logBody);
    const t = sum + term;
    comp += Math.abs(sum) >= Math.abs(term) ? (sum - t) + term : (term - t) + sum;
    sum = t;
    const f = positive ? 1 - q : q;
    const above = (i + 1) / n - f;
    const below = f - i / n;
    if (above > d) d = above;
    if (below > d) d = below;
  }
  return Object.freeze({ n, adSum: sum + comp, ksDistance: d });
}
