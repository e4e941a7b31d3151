/**
 * Plotting positions for samples with values below (or above) one or more
 * limits, so that measured and censored values can share one probability
 * scale.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import type { CensoredSample } from "./censored_sample.ts";
import { BLOM_OFFSET, type PlottingOptions } from "./plotting_positions.ts";

/** One censoring limit and the probability estimated below it. */
export interface LimitPosition {
  /** The limit. */
  readonly limit: number;
  /** −1 for a "<limit" (left) limit, 1 for a ">limit" (right) limit. */
  readonly side: -1 | 1;
  /** How many values are censored at this limit on this side. */
  readonly count: number;
  /** The estimated probability that a value lies below the limit, F(limit). */
  readonly below: number;
}

/** Plotting positions of a censored sample: plain, frozen data. */
export interface CensoredPositions {
  /** The position of every value, in (0, 1), aligned with the sample's values. */
  readonly positions: Float64Array;
  /** The offset a used within each interval. */
  readonly offset: number;
  /** Every distinct limit, left ones first, each side ascending. */
  readonly limits: readonly LimitPosition[];
  /** The same data with `positions` as a plain array. */
  toJSON(): unknown;
}

/**
 * Plotting positions for multiply censored data (Hirsch, R. M. & Stedinger,
 * J. R. (1987), "Plotting positions for historical floods and their
 * precision", Water Resources Research 23(4):715–727), in the form for
 * several detection limits given by Helsel, D. R. & Cohn, T. A. (1988),
 * "Estimation of descriptive statistics for multiply censored water quality
 * data", Water Resources Research 24(12):1997–2004 (both formulas as
 * recalled from the papers, from memory).
 *
 * Left limits L₁ < … < L_m. For each j, A_j counts the measured values in
 * [L_j, L_{j+1}) (L_{m+1} = +∞) and B_j the values known to lie below L_j
 * (measured values below L_j and values censored at L₁ … L_j). The
 * probability of exceeding L_j is built from the top:
 *
 *   pe_j = pe_{j+1} + A_j/(A_j + B_j)·(1 − pe_{j+1}),   pe_{m+1} = 0,
 *
 * and F(L_j) = 1 − pe_j. The r-th smallest of the A_j measured values in
 * [L_j, L_{j+1}) gets F(L_j) + (F(L_{j+1}) − F(L_j))·(r − a)/(A_j + 1 − 2a)
 * (values below L₁ use F = 0 at the lower end), and the r-th of the C_j
 * values censored at L_j gets F(L_j)·(r − a)/(C_j + 1 − 2a). With a = 0
 * these are the published (Weibull-type) positions; the default a = 3/8
 * makes a sample with nothing censored get exactly Blom's positions
 * (i − 3/8)/(n + 1/4), as the uncensored QQ plot does.
 *
 * Right censoring is handled by mirroring (x → −x turns ">limit" into
 * "<−limit"; positions p → 1 − p). When both sides occur, every left limit
 * must be at or below every right limit (a detection floor and an upper
 * reporting limit): the left pass counts right-censored values among those
 * above the top left limit, the mirrored pass counts left-censored values
 * among those below the lowest right limit, and the measured values between
 * the two use F at both ends. Measured values equal to a limit count as
 * above a left limit and below a right limit.
 *
 * Errors: `PlumbError("overlapping-limits")` when a left limit exceeds a right
 * limit; `"bad-option"` for an offset outside [0, 1).
 *
 * @param sample a checked sample from `censoredSample`
 * @param options the offset a within each interval
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * import { censoredPositions } from "./censored_positions.ts";
 * const s = censoredSample([1, 0.5, 1.5, 2.5, 1.2, 1], [-1, 0, 0, 0, 0, -1]);
 * const p = censoredPositions(s, { offset: 0 });
 * // F(1) = 1 − pe₁ with pe₁ = 3/(3 + 3): the two "<1" values sit at 1/6 and 2/6
 * if (Math.abs(p.positions[0] - 1 / 6) > 1e-15) throw new Error("positions");
 * ```
 */
export function censoredPositions(
  sample: CensoredSample,
  options: PlottingOptions = {},
): CensoredPositions {
  const a = _checkOffset(options.offset ?? BLOM_OFFSET);
  const { values, censor, leftLimits: lows, rightLimits: highs } = sample;
  const n = values.length;
  _checkOverlap(sample);
  const g = _positionsSorted(sample, a);
  const positions = new Float64Array(n);
  // Measured values: the position of their rank in the sorted list; equal values
  // take successive ranks (which of them gets which does not matter).
  const ties = new Map<number, number>();
  const leftSeen = new Int32Array(lows.length);
  const rightSeen = new Int32Array(highs.length);
  for (let i = 0; i < n; i++) {
    const x = values[i];
    if (censor[i] === 0) {
      let k = _countBelow(g.obs, x);
      if (k + 1 < g.obs.length && g.obs[k + 1] === x) {
        const seen = ties.get(x) ?? 0;
        ties.set(x, seen + 1);
        k += seen;
      }
      positions[i] = g.pObs[k];
    } else if (censor[i] < 0) {
      const j = _limitIndex(lows, x);
      positions[i] = g.fLow[j] * (++leftSeen[j] - a) / (g.leftCounts[j] + 1 - 2 * a);
    } else {
      const j = _limitIndex(highs, x);
      positions[i] = 1 - (1 - g.fHigh[j]) * (++rightSeen[j] - a) / (g.rightCounts[j] + 1 - 2 * a);
    }
  }
  const limits: LimitPosition[] = [
    ...lows.map((limit, j) =>
      Object.freeze({ limit, side: -1 as const, count: g.leftCounts[j], below: g.fLow[j] })
    ),
    ...highs.map((limit, j) =>
      Object.freeze({ limit, side: 1 as const, count: g.rightCounts[j], below: g.fHigh[j] })
    ),
  ];
  const frozen = Object.freeze(limits);
  return Object.freeze({
    positions,
    offset: a,
    limits: frozen,
    toJSON: () => ({ positions: Array.from(positions), offset: a, limits: frozen }),
  });
}

/**
 * Throw `PlumbError("overlapping-limits")` when a left limit lies above a
 * right limit: the plotting positions (and what rests on them) need the two
 * kinds of censoring apart.
 */
export function _checkOverlap(sample: CensoredSample): void {
  const lows = sample.leftLimits;
  const highs = sample.rightLimits;
  if (lows.length > 0 && highs.length > 0 && lows[lows.length - 1] > highs[0]) {
    throw new PlumbError(
      "overlapping-limits",
      `Cannot place censored values on a probability scale: a "<${
        lows[lows.length - 1]
      }" limit lies above a ">${highs[0]}" limit, so the order of those values is unknown; ` +
        `check the limits, or analyse the two kinds of censoring separately`,
      { left: lows[lows.length - 1], right: highs[0] },
    );
  }
}

/** Positions in grouped form: the sorted measured values, and each limit's F and count. */
export interface _GroupedPositions {
  /** The measured values, ascending. */
  readonly obs: Float64Array;
  /** The position of each sorted measured value. */
  readonly pObs: Float64Array;
  /** F(L_j) for each left limit, and the count censored there. */
  readonly fLow: readonly number[];
  readonly leftCounts: readonly number[];
  /** F(R_k) for each right limit, and the count censored there. */
  readonly fHigh: readonly number[];
  readonly rightCounts: readonly number[];
}

/** The plotting-position offset, checked: a number in [0, 1). */
export function _checkOffset(a: number): number {
  if (!(typeof a === "number" && a >= 0 && a < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use plotting-position offset ${a}: use a number in [0, 1), such as 0.375 (Blom)`,
      { offset: a },
    );
  }
  return a;
}

/**
 * The positions of the measured values in sorted order, and F at every
 * limit (the censored values' positions follow from F and their counts).
 * The sample's limits must not overlap (see {@linkcode _checkOverlap}).
 */
export function _positionsSorted(sample: CensoredSample, a: number): _GroupedPositions {
  const { values, censor, leftLimits: lows, rightLimits: highs } = sample;
  const obs = new Float64Array(sample.observed);
  for (let i = 0, k = 0; i < values.length; i++) if (censor[i] === 0) obs[k++] = values[i];
  sortFloat64(obs);
  const { leftCounts, rightCounts } = sample;
  // F below each left limit; for the right limits, the mirrored pass gives
  // P(−X < −R) = P(X > R), from which F(R) = 1 − P(X > R).
  const fLow = _below(obs, lows, leftCounts, sample.right);
  const neg = new Float64Array(obs.length);
  for (let k = 0; k < obs.length; k++) neg[k] = -obs[obs.length - 1 - k];
  const mirrored = _below(
    neg,
    highs.map((h) => -h).reverse(),
    rightCounts.slice().reverse(),
    sample.left,
  );
  const fHigh = mirrored.reverse().map((f) => 1 - f);
  // Interval edges on the probability scale: −∞, the left limits (closed
  // below), the right limits (closed above), +∞.
  const edgeF = [0, ...fLow, ...fHigh, 1];
  const pObs = new Float64Array(obs.length);
  let k = 0;
  for (let b = 0; b + 1 < edgeF.length; b++) {
    // Measured values in interval b: [edge_b, edge_{b+1}) on the left side,
    // (edge_b, edge_{b+1}] on the right side, [L_m, R_1] in the middle.
    let end: number;
    if (b < lows.length) end = _countBelow(obs, lows[b]);
    else if (b - lows.length < highs.length) end = _countAtOrBelow(obs, highs[b - lows.length]);
    else end = obs.length;
    const count = end - k;
    const lo = edgeF[b];
    const hi = edgeF[b + 1];
    for (let r = 1; k < end; r++, k++) pObs[k] = lo + (hi - lo) * (r - a) / (count + 1 - 2 * a);
  }
  return { obs, pObs, fLow, leftCounts, fHigh, rightCounts };
}

/** The position of `x` in the ascending list `limits` (binary search; x is present). */
export function _limitIndex(limits: readonly number[], x: number): number {
  let lo = 0;
  let hi = limits.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (limits[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** How many of the sorted values are at or below x. */
function _countAtOrBelow(sorted: Float64Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** How many of the sorted values are below x (strictly). */
export function _countBelow(sorted: Float64Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * F(L_j) = 1 − pe_j for ascending left limits, by the recursion from the top.
 * `above` counts values known to exceed every limit (the other side's censored values).
 */
function _below(
  obs: Float64Array,
  limits: readonly number[],
  counts: readonly number[],
  above: number,
): number[] {
  const m = limits.length;
  const f = new Array<number>(m);
  let pe = 0;
  let censoredBelow = 0;
  for (const c of counts) censoredBelow += c;
  for (let j = m - 1; j >= 0; j--) {
    const under = _countBelow(obs, limits[j]);
    const aj = (j + 1 < m ? _countBelow(obs, limits[j + 1]) : obs.length) - under +
      (j === m - 1 ? above : 0);
    const bj = under + censoredBelow;
    pe += (aj / (aj + bj)) * (1 - pe);
    f[j] = 1 - pe;
    censoredBelow -= counts[j];
  }
  return f;
}
