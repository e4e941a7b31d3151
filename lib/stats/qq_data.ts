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
import { checkNotConstant, checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";
import { normalEnvelope } from "./envelope.ts";
import { _sampleShape, type _Shape } from "./moments.ts";
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

/** The ranks kept: both tails in full, the middle at evenly spaced ranks. */
export function _keptRanks(n: number, maxPoints: number, tailPoints: number): number[] {
  if (n <= maxPoints) return Array.from({ length: n }, (_, k) => k + 1);
  const tail = Math.min(tailPoints, Math.floor(maxPoints / 4));
  const middle = maxPoints - 2 * tail;
  const out: number[] = [];
  for (let i = 1; i <= tail; i++) out.push(i);
  const first = tail + 1;
  const last = n - tail;
  let prev = tail;
  for (let k = 0; k < middle; k++) {
    const r = middle === 1
      ? Math.round((first + last) / 2)
      : Math.round(first + (k * (last - first)) / (middle - 1));
    if (r > prev) {
      out.push(r);
      prev = r;
    }
  }
  for (let i = last + 1; i <= n; i++) out.push(i);
  return out;
}

/** The values at the kept ranks and, for each, the row (position in the data) it came from. */
interface _Selected {
  readonly value: Float64Array;
  readonly row: Int32Array;
}

/**
 * Assign rows to kept ranks in one pass over the data: for a value v whose
 * first rank (0-based) is f, its c-th occurrence in data order has rank
 * f + c (ties broken by position, as a stable sort would). `pass(j)` says
 * whether x[j] can be a kept value at all (a cheap prefilter).
 */
function _assignRows(
  x: Float64Array,
  value: Float64Array,
  first: Int32Array,
  ranks: readonly number[],
  pass: (j: number) => boolean,
): Int32Array {
  const firstRank = new Map<number, number>();
  const wanted = new Map<number, number>(); // 0-based rank → index into ranks
  for (let k = 0; k < ranks.length; k++) {
    wanted.set(ranks[k] - 1, k);
    firstRank.set(_key(value[k]), first[k]);
  }
  const seen = new Map<number, number>();
  const row = new Int32Array(ranks.length).fill(-1);
  for (let j = 0; j < x.length; j++) {
    if (!pass(j)) continue;
    const v = _key(x[j]);
    const f = firstRank.get(v);
    if (f === undefined) continue;
    const c = seen.get(v) ?? 0;
    seen.set(v, c + 1);
    const k = wanted.get(f + c);
    if (k !== undefined) row[k] = j;
  }
  return row;
}

/** a < b in the order `Float64Array.sort` uses, where −0 comes before +0. */
function _before(a: number, b: number): boolean {
  return a < b || (a === 0 && b === 0 && 1 / a < 0 && 1 / b > 0);
}

/** Map key of a value: −0 and +0 are different values here (NaN stands for −0). */
function _key(v: number): number {
  return v === 0 && 1 / v < 0 ? NaN : v;
}

/** First index in the ascending a[from, to) whose value is not before v. */
function _lowerBound(a: Float64Array, v: number, from: number, to: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (_before(a[mid], v)) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Below this size the whole sample is sorted. */
const _SELECT_MIN = 1 << 16;
/** Buckets of the selection, and sample points per bucket for the splitters. */
const _BUCKETS = 2048;
const _SAMPLE_PER_BUCKET = 16;

/** Order statistics by a full sort: exact, used for small n and as the fallback. */
function _selectBySort(x: Float64Array, ranks: readonly number[]): _Selected {
  const sorted = x.slice().sort();
  const m = ranks.length;
  const value = new Float64Array(m);
  const first = new Int32Array(m);
  for (let k = 0; k < m; k++) {
    value[k] = sorted[ranks[k] - 1];
    first[k] = _lowerBound(sorted, value[k], 0, ranks[k] - 1);
  }
  return { value, row: _assignRows(x, value, first, ranks, () => true) };
}

/**
 * The values at the given ranks (1-based, ascending) without sorting the
 * whole sample: splitters from an evenly strided sample cut the values
 * into about 2048 buckets of similar size; one pass counts the bucket of
 * every value (binary search over the splitters), a second gathers only
 * the buckets that hold a wanted rank, and those alone are sorted. This is
 * selection by sampling in the manner of Floyd & Rivest (1975,
 * Communications of the ACM 18:165–172, Algorithm 489), made deterministic
 * by a strided rather than random sample. Exact whatever the sample: the
 * splitters only decide the buckets' sizes; when the wanted buckets hold
 * more than half the data (many ties, odd orderings) the whole sample is
 * sorted instead.
 */
export function _selectRanks(x: Float64Array, ranks: readonly number[]): _Selected {
  const n = x.length;
  if (n < _SELECT_MIN) return _selectBySort(x, ranks);
  const sampleSize = _BUCKETS * _SAMPLE_PER_BUCKET;
  const stride = Math.floor(n / sampleSize);
  const sample = new Float64Array(sampleSize);
  for (let i = 0; i < sampleSize; i++) sample[i] = x[i * stride];
  sample.sort();
  const split = new Float64Array(_BUCKETS - 1);
  for (let b = 1; b < _BUCKETS; b++) split[b - 1] = sample[b * _SAMPLE_PER_BUCKET];
  // bucket of v: the number of splitters below v (equal values share a
  // bucket). A uniform grid over the splitters' range gives the bucket at
  // each cell's left edge, so finding a bucket is a multiply, a load and a
  // short walk instead of a branchy binary search.
  const bucket = new Uint16Array(n);
  const count = new Int32Array(_BUCKETS);
  const last = _BUCKETS - 1;
  const lo = split[0];
  const span = split[last - 1] - lo;
  const cells = 8 * _BUCKETS;
  const scale = span > 0 ? cells / span : 0;
  const cellStart = new Uint16Array(cells + 1);
  for (let g = 0, k = 0; g <= cells; g++) {
    const edge = lo + g / scale;
    while (k < last && split[k] < edge) k++;
    cellStart[g] = k;
  }
  for (let j = 0; j < n; j++) {
    const v = x[j];
    let c: number;
    if (!(v > lo)) c = 0;
    else {
      const t = (v - lo) * scale;
      c = cellStart[t >= cells ? cells : Math.floor(t)];
      // the cell's left edge may round past v: step back, then forward
      while (c > 0 && !(split[c - 1] < v)) c--;
      while (c < last && split[c] < v) c++;
    }
    bucket[j] = c;
    count[c]++;
  }
  const start = new Int32Array(_BUCKETS + 1);
  for (let b = 0; b < _BUCKETS; b++) start[b + 1] = start[b] + count[b];
  const m = ranks.length;
  const bucketOf = new Int32Array(m);
  const slot = new Int32Array(_BUCKETS).fill(-1);
  let total = 0;
  let b = 0;
  for (let k = 0; k < m; k++) {
    const r = ranks[k] - 1;
    while (start[b + 1] <= r) b++;
    bucketOf[k] = b;
    if (slot[b] < 0) {
      slot[b] = total;
      total += count[b];
    }
  }
  if (total > n / 2) return _selectBySort(x, ranks);
  const buf = new Float64Array(total);
  const fill = slot.slice();
  for (let j = 0; j < n; j++) {
    const s = fill[bucket[j]];
    if (s >= 0) {
      buf[s] = x[j];
      fill[bucket[j]] = s + 1;
    }
  }
  for (let c = 0; c < _BUCKETS; c++) {
    if (slot[c] >= 0) buf.subarray(slot[c], slot[c] + count[c]).sort();
  }
  const value = new Float64Array(m);
  const first = new Int32Array(m);
  for (let k = 0; k < m; k++) {
    const c = bucketOf[k];
    const off = ranks[k] - 1 - start[c];
    value[k] = buf[slot[c] + off];
    first[k] = start[c] + _lowerBound(buf, value[k], slot[c], slot[c] + off) - slot[c];
  }
  const row = _assignRows(x, value, first, ranks, (j) => slot[bucket[j]] >= 0);
  return { value, row };
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
  checkNotConstant(Float64Array.of(min, max), "a QQ plot");
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
 * import { qqData } from "./qq_data.ts";
 * const q = qqData([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6]);
 * if (q.shown !== 7 || q.value[0] !== 3.7 || q.row[0] !== 5) throw new Error("order");
 * if (!(q.lower[3] < q.value[3] && q.value[3] < q.upper[3])) throw new Error("envelope");
 * ```
 */
export function qqData(x: ArrayLike<number>, options: QqOptions = {}): QqData {
  const what = "a QQ plot";
  checkSize(x.length, 3, Infinity, what);
  const data = finiteCopy(x, what);
  const { mean, sd, min, max } = _moments(data);
  checkNotConstant(Float64Array.of(min, max), what);
  return _qqBuild(data.length, mean, sd, options, (ranks) => _selectRanks(data, ranks));
}

/**
 * {@linkcode qqData} for a sample whose sorted copy and
 * {@linkcode _sampleShape} the caller already holds: `values` in their
 * original order (finite, not constant; they give each point its row) and
 * `sorted` the same values ascending. Gives the same result as
 * `qqData(values, options)` without copying or sorting the sample again.
 */
export function _qqDataSorted(
  values: Float64Array,
  sorted: Float64Array,
  shape: _Shape,
  options: QqOptions = {},
): QqData {
  const what = "a QQ plot";
  checkSize(values.length, 3, Infinity, what);
  checkSpreadFinite(shape.sd, what);
  return _qqBuild(
    values.length,
    shape.mean,
    shape.sd,
    options,
    (ranks) => _selectFromSorted(values, sorted, ranks),
  );
}

/** The values at the kept ranks, read from the sorted sample, with their rows in `x`. */
function _selectFromSorted(
  x: Float64Array,
  sorted: Float64Array,
  ranks: readonly number[],
): _Selected {
  const m = ranks.length;
  const value = new Float64Array(m);
  const first = new Int32Array(m);
  for (let k = 0; k < m; k++) {
    value[k] = sorted[ranks[k] - 1];
    first[k] = _lowerBound(sorted, value[k], 0, ranks[k] - 1);
  }
  return { value, row: _assignRows(x, value, first, ranks, () => true) };
}

function _qqBuild(
  n: number,
  mean: number,
  sd: number,
  options: QqOptions,
  select: (ranks: readonly number[]) => _Selected,
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
  const ranks = _keptRanks(n, maxPoints, tailPoints);
  const z = normalScores(n, { offset, ranks });
  const env = normalEnvelope(n, { level, kind, ranks });
  const picked = select(ranks);
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
    row[k] = options.rows === undefined ? j : options.rows[j];
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
