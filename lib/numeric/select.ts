/**
 * Order statistics at chosen ranks, each with the position in the data it
 * came from, without sorting a large sample: the one selection routine of
 * plumbline (QQ points, histogram quartiles).
 *
 * @module
 */

/** Order statistics at chosen ranks and, for each, the position in the data it came from. */
export interface Selected {
  /** The value at each rank. */
  readonly value: Float64Array;
  /** Its 0-based position in the data (ties in data order, as a stable sort places them). */
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
function _selectBySort(x: Float64Array, ranks: readonly number[]): Selected {
  return selectFromSorted(x, x.slice().sort(), ranks);
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
 *
 * @param x the data (finite numbers; not modified)
 * @param ranks 1-based ranks, ascending, each in 1 … x.length
 * @returns the value at each rank and the position it came from
 * @example
 * ```ts
 * import { selectRanks } from "./select.ts";
 * const s = selectRanks(new Float64Array([5, 1, 4, 1, 3]), [1, 2, 5]);
 * if (s.value.join() !== "1,1,5" || s.row.join() !== "1,3,0") throw new Error(s.row.join());
 * ```
 */
export function selectRanks(x: Float64Array, ranks: readonly number[]): Selected {
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

/**
 * {@linkcode selectRanks} for a caller that already holds the sorted values:
 * the values at the ranks are read from `sorted`, and their positions found
 * in `x` (the same values in data order).
 *
 * @param x the data in their own order
 * @param sorted the same values ascending (in the order of `Float64Array.prototype.sort`)
 * @param ranks 1-based ranks, ascending
 * @example
 * ```ts
 * import { selectFromSorted } from "./select.ts";
 * const x = new Float64Array([5, 1, 4]);
 * const s = selectFromSorted(x, x.slice().sort(), [3]);
 * if (s.value[0] !== 5 || s.row[0] !== 0) throw new Error("select");
 * ```
 */
export function selectFromSorted(
  x: Float64Array,
  sorted: Float64Array,
  ranks: readonly number[],
): Selected {
  const m = ranks.length;
  const value = new Float64Array(m);
  const first = new Int32Array(m);
  for (let k = 0; k < m; k++) {
    value[k] = sorted[ranks[k] - 1];
    first[k] = _lowerBound(sorted, value[k], 0, ranks[k] - 1);
  }
  return { value, row: _assignRows(x, value, first, ranks, () => true) };
}
