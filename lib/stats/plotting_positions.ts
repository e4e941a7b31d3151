/**
 * Plotting positions: the probability attached to the i-th smallest of n
 * values when it is placed on a probability scale, `pᵢ = (i − a)/(n + 1 − 2a)`
 * for an offset a in [0, 1).
 *
 * The default a = 3/8 is Blom's (Blom 1958, "Statistical Estimates and
 * Transformed Beta-Variables", Wiley, §6.10): Φ⁻¹(pᵢ) is then close to the
 * expected value of the i-th standard normal order statistic. a = ½ gives
 * Hazen's positions (Hazen 1914, Transactions of the American Society of
 * Civil Engineers 77:1539–1669) and a = 0 Weibull's i/(n + 1) (Weibull 1939,
 * Ingeniörsvetenskapsakademiens Handlingar 151), the means of the uniform
 * order statistics.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalQuantile } from "../numeric/normal.ts";

/** Options for {@linkcode plottingPosition} and {@linkcode normalScores}. */
export interface PlottingOptions {
  /**
   * The offset a in `(i − a)/(n + 1 − 2a)`, 0 ≤ a < 1.
   * @default 0.375 (Blom)
   */
  readonly offset?: number;
}

/** Blom's offset, the default. */
export const BLOM_OFFSET = 0.375;

function _offset(options: PlottingOptions): number {
  const a = options.offset ?? BLOM_OFFSET;
  if (!(a >= 0 && a < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use plotting-position offset ${a}: use a number in [0, 1), such as 0.375 (Blom)`,
    );
  }
  return a;
}

/**
 * The plotting position of rank i among n values.
 *
 * @param i the rank, 1 ≤ i ≤ n
 * @param n the sample size
 * @param options the offset
 * @returns `(i − a)/(n + 1 − 2a)`, in (0, 1)
 * @example
 * ```ts
 * import { plottingPosition } from "./plotting_positions.ts";
 * // Blom: (1 − 3/8)/(4 + 1/4) for the smallest of 4
 * if (plottingPosition(1, 4) !== 0.625 / 4.25) throw new Error("blom");
 * ```
 */
export function plottingPosition(i: number, n: number, options: PlottingOptions = {}): number {
  const a = _offset(options);
  if (!Number.isInteger(n) || n < 1 || !Number.isInteger(i) || i < 1 || i > n) {
    throw new PlumbError(
      "bad-option",
      `Cannot place rank ${i} among ${n} values: use whole numbers with 1 ≤ rank ≤ n`,
    );
  }
  return (i - a) / (n + 1 - 2 * a);
}

/**
 * Normal scores Φ⁻¹(pᵢ) for the given ranks (default: all of 1 … n). The
 * upper half is computed as −Φ⁻¹(p_{n+1−i}), so the scores are exactly
 * antisymmetric and keep their digits near p = 1.
 *
 * @param n the sample size
 * @param options the offset, and the ranks wanted
 * @example
 * ```ts
 * import { normalScores } from "./plotting_positions.ts";
 * const z = normalScores(5);
 * if (z[2] !== 0 || z[0] !== -z[4]) throw new Error("symmetry");
 * ```
 */
export function normalScores(
  n: number,
  options: PlottingOptions & {
    /**
     * 1-based ranks to compute.
     * @default every rank 1 … n
     */
    readonly ranks?: ArrayLike<number>;
  } = {},
): Float64Array {
  const ranks = options.ranks;
  const m = ranks === undefined ? n : ranks.length;
  const out = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    const i = ranks === undefined ? k + 1 : ranks[k];
    if (2 * i === n + 1) {
      plottingPosition(i, n, options);
      out[k] = 0;
    } else if (2 * i < n + 1) out[k] = normalQuantile(plottingPosition(i, n, options));
    else out[k] = -normalQuantile(plottingPosition(n + 1 - i, n, options));
  }
  return out;
}

/** How many sample sizes {@linkcode blomScoresUpper} keeps (oldest evicted first). */
const _BLOM_CACHE_LIMIT = 64;
const _blomCache = new Map<number, Float64Array>();

/**
 * The upper half of Blom's normal scores for a sample of n, largest first:
 * element k is −Φ⁻¹(p₍ₖ₊₁₎) = Φ⁻¹(p₍ₙ₋ₖ₎), p at Blom's offset (k = 0 … ⌊n/2⌋ − 1),
 * the approximate expected value of the (k + 1)-th largest standard normal
 * order statistic (Blom 1958). The lower half is its negative. Computed once
 * per n and cached: the Shapiro–Wilk coefficients and the Shapiro–Francia
 * statistic both start from these scores. The array is shared: do not modify it.
 *
 * @param n the sample size, ≥ 2
 * @example
 * ```ts
 * import { blomScoresUpper, normalScores } from "./plotting_positions.ts";
 * const m = blomScoresUpper(5);
 * if (m.length !== 2 || m[0] !== normalScores(5)[4]) throw new Error("Blom");
 * ```
 */
export function blomScoresUpper(n: number): Float64Array {
  const hit = _blomCache.get(n);
  if (hit !== undefined) return hit;
  const half = Math.floor(n / 2);
  const m = new Float64Array(half);
  const denominator = n + 1 - 2 * BLOM_OFFSET;
  for (let k = 0; k < half; k++) m[k] = -normalQuantile((k + 1 - BLOM_OFFSET) / denominator);
  if (_blomCache.size >= _BLOM_CACHE_LIMIT) {
    const oldest = _blomCache.keys().next().value;
    if (oldest !== undefined) _blomCache.delete(oldest);
  }
  _blomCache.set(n, m);
  return m;
}
