/**
 * Data for a normal QQ plot: the ordered sample against normal scores, the
 * reference line of the fitted normal, and an envelope, thinned to a bounded
 * number of points for display.
 *
 * - Normal scores Φ⁻¹(pᵢ) at Blom's plotting positions by default
 *   (see `plotting_positions.ts`).
 * - The reference line is `value = mean + sd · z`, with the sample mean and
 *   the sample standard deviation (divisor n − 1): its intercept estimates
 *   the mean and its slope the standard deviation.
 * - The envelope is `mean + sd · [lower, upper]` with the limits of
 *   `envelope.ts` (exact Beta(i, n − i + 1) distribution of uniform order
 *   statistics), pointwise by default.
 * - Thinning, for large n: every rank within `tailPoints` of either end is
 *   kept; between them the ranks kept are evenly spaced in rank, that is at
 *   evenly spaced sample quantiles. Limits are computed only at kept ranks.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { checkOptions, optionNames } from "../results/options.ts";
import { type Selected, selectRanks } from "../numeric/select.ts";
import { thinRanks } from "../numeric/thin_ranks.ts";
import { checkNotConstant, checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";
import { normalEnvelope } from "./envelope.ts";
import { _sampleShape } from "./moments.ts";
import { BLOM_OFFSET, normalScores } from "./plotting_positions.ts";

/** Options for {@linkcode qqData}. */
export interface QqOptions {
  /**
   * Envelope coverage.
   * @default 0.95
   */
  readonly level?: number;
  /**
   * `"pointwise"` or `"simultaneous"` (Aldor-Noiman et al. 2013; n ≤ 5000).
   * @default "pointwise"
   */
  readonly envelope?: "pointwise" | "simultaneous";
  /**
   * Plotting-position offset a in (i − a)/(n + 1 − 2a).
   * @default 0.375 (Blom)
   */
  readonly offset?: number;
  /**
   * At most this many points are kept (800 keeps a chart's whole bundle,
   * spec plus SVG, near 220 KB).
   * @default 800
   */
  readonly maxPoints?: number;
  /**
   * Ranks kept in full at each end when thinning (capped at maxPoints/4).
   * @default 200
   */
  readonly tailPoints?: number;
  /**
   * Row labels for the values (e.g. source row numbers after missing cells
   * were dropped), same length as the data.
   * @default the 0-based position in the data
   */
  readonly rows?: ArrayLike<number>;
}

/** Every option name of {@linkcode QqOptions}, for the check of an options object. */
export const QQ_OPTION_NAMES: readonly string[] = optionNames<QqOptions>({
  level: true,
  envelope: true,
  offset: true,
  maxPoints: true,
  tailPoints: true,
  rows: true,
});

/** The QQ plot of one sample, as frozen plain data; arrays are aligned by point. */
export interface QqData {
  /** Number of values in the sample. */
  readonly n: number;
  /** Number of points kept. */
  readonly shown: number;
  /** Sample mean (the reference line's intercept). */
  readonly mean: number;
  /** Sample standard deviation, divisor n − 1 (the line's slope). */
  readonly sd: number;
  /** The plotting-position offset used. */
  readonly offset: number;
  /** The plotting positions, in words. */
  readonly positions: string;
  /** Envelope coverage. */
  readonly level: number;
  /** `"pointwise"` or `"simultaneous"`. */
  readonly envelope: "pointwise" | "simultaneous";
  /** The envelope's method, in words. */
  readonly envelopeMethod: string;
  /** How the points were chosen, in words. */
  readonly thinning: string;
  /** Rank of each kept point, 1-based. */
  readonly rank: readonly number[];
  /** Row label of each kept point. */
  readonly row: readonly number[];
  /** Ordered value, data units. */
  readonly value: readonly number[];
  /** Normal score Φ⁻¹(pᵢ). */
  readonly z: readonly number[];
  /** Envelope lower limit, data units. */
  readonly lower: readonly number[];
  /** Envelope upper limit, data units. */
  readonly upper: readonly number[];
  /** −1 below the envelope, 1 above, 0 inside. */
  readonly outside: readonly (-1 | 0 | 1)[];
  /** How many kept points lie outside the envelope. */
  readonly outsideCount: number;
}

function _moments(x: Float64Array): { mean: number; sd: number; min: number; max: number } {
  const n = x.length;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = x[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  checkNotConstant(Float64Array.of(min, max), "a QQ plot", n);
  // The moments' own summary rescales extreme magnitudes, so that the sum
  // and the squares neither overflow (values near ±1e308) nor underflow
  // (subnormal values).
  const { mean, sd } = _sampleShape(x, "a QQ plot");
  checkSpreadFinite(sd, "a QQ plot");
  return { mean, sd, min, max };
}

/** v clamped to the finite doubles: an envelope end beyond ±1.8e308 is shown at that edge. */
function _finite(v: number): number {
  return Math.min(Number.MAX_VALUE, Math.max(-Number.MAX_VALUE, v));
}

function _positiveInt(v: number, name: string, min: number): number {
  if (!Number.isInteger(v) || v < min) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${name} = ${v}: use a whole number of at least ${min}`,
    );
  }
  return v;
}

/**
 * Build the data of a normal QQ plot for a sample.
 *
 * @param x the sample (finite numbers, at least 3, not all equal)
 * @param options envelope level and kind, plotting positions, thinning, row labels
 * @returns frozen plain data; the number of points is at most `maxPoints`
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * const q = qqData([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6]);
 * if (q.shown !== 7 || q.value[0] !== 3.7 || q.row[0] !== 5) throw new Error("order");
 * if (!(q.lower[3] < q.value[3] && q.value[3] < q.upper[3])) throw new Error("envelope");
 * ```
 */
export function qqData(x: ArrayLike<number>, options: QqOptions | null = {}): QqData {
  options = checkOptions(options, QQ_OPTION_NAMES, "qqData");
  const what = "a QQ plot";
  checkSize(x.length, 3, Infinity, what);
  const data = finiteCopy(x, what);
  const { mean, sd, min, max } = _moments(data);
  checkNotConstant(Float64Array.of(min, max), what, data.length);
  return _qqBuild(data.length, mean, sd, options, (ranks) => selectRanks(data, ranks));
}

/**
 * The QQ data at the kept ranks: `select` gives the value (and its 0-based
 * position) at each rank, `rowLabel` (when given) the label of a 0-based
 * position, `scores` the normal score of each rank (Blom's or the offset's
 * positions when absent); the line is `mean + sd · z`.
 */
export function _qqBuild(
  n: number,
  mean: number,
  sd: number,
  options: QqOptions,
  select: (ranks: readonly number[]) => Selected,
  rowLabel?: (position: number) => number,
  scores?: (ranks: readonly number[], picked: Selected) => ArrayLike<number>,
): QqData {
  const maxPoints = _positiveInt(options.maxPoints ?? 800, "maxPoints", 20);
  const tailPoints = _positiveInt(options.tailPoints ?? 200, "tailPoints", 1);
  const offset = options.offset ?? BLOM_OFFSET;
  const level = options.level ?? 0.95;
  const kind = options.envelope ?? "pointwise";
  if (options.rows !== undefined && options.rows.length !== n) {
    throw new PlumbError(
      "bad-option",
      `Cannot label ${n} values with ${options.rows.length} row labels: pass one label per value`,
    );
  }
  const ranks = thinRanks(n, maxPoints, tailPoints);
  const env = normalEnvelope(n, { level, kind, ranks });
  const picked = select(ranks);
  const z = scores ? scores(ranks, picked) : normalScores(n, { offset, ranks });
  const m = ranks.length;
  const value: number[] = new Array(m);
  const lower: number[] = new Array(m);
  const upper: number[] = new Array(m);
  const outside: (-1 | 0 | 1)[] = new Array(m);
  const row: number[] = new Array(m);
  let outsideCount = 0;
  for (let k = 0; k < m; k++) {
    const v = picked.value[k];
    value[k] = v;
    lower[k] = _finite(mean + sd * env.lower[k]);
    upper[k] = _finite(mean + sd * env.upper[k]);
    outside[k] = v < lower[k] ? -1 : v > upper[k] ? 1 : 0;
    if (outside[k] !== 0) outsideCount++;
    const j = picked.row[k];
    row[k] = rowLabel ? rowLabel(j) : options.rows === undefined ? j : options.rows[j];
  }
  const positions = offset === BLOM_OFFSET
    ? `Blom's plotting positions (i − 3/8)/(n + 1/4)`
    : `plotting positions (i − ${offset})/(n + ${1 - 2 * offset})`;
  const thinning = m === n
    ? `all ${n} values shown`
    : `${m} of ${n} values shown: the ${Math.min(tailPoints, Math.floor(maxPoints / 4))} ` +
      `smallest and largest in full, the middle at evenly spaced ranks`;
  return Object.freeze({
    n,
    shown: m,
    mean,
    sd,
    offset,
    positions,
    level,
    envelope: kind,
    envelopeMethod: env.method,
    thinning,
    rank: Object.freeze(ranks),
    row: Object.freeze(row),
    value: Object.freeze(value),
    z: Object.freeze(Array.from(z)),
    lower: Object.freeze(lower),
    upper: Object.freeze(upper),
    outside: Object.freeze(outside),
    outsideCount,
  });
}
