/**
 * Sorting `Float64Array`s fast, since the sort dominates every
 * order-statistic test (Shapiro–Wilk, Anderson–Darling, Lilliefors).
 *
 * Method: least-significant-digit radix sort on the IEEE-754 bit patterns
 * (the usual order-preserving map: flip every bit of a negative number,
 * only the sign bit of a non-negative one; e.g. Herf 2001, "Radix tricks",
 * and Knuth, TAOCP vol. 3, §5.2.5), six passes of 11, 11 and 10 bits over
 * each 32-bit half (below {@linkcode HIGH_WORD_FIRST_BELOW} values only the
 * three over the high half, then each run of equal high halves, usually one
 * or two values, by the built-in sort), with all six histograms counted in
 * one pass and passes
 * whose digit is the same for every key skipped. Stable, O(n), no
 * comparisons. Below {@linkcode RADIX_MIN_N} values the engine's built-in
 * sort is used (its constant factor wins there).
 *
 * Special values: −0 sorts immediately before +0; NaNs (any payload) are
 * put last, as `Float64Array.prototype.sort` does; ±∞ sort at the ends.
 *
 * @module
 */

/** Below this length the built-in typed-array sort is used. */
export const RADIX_MIN_N = 512;

const _DIGITS: readonly [number, number, number][] = [
  // [word (0 = low, 1 = high), shift, mask]
  [0, 0, 0x7ff],
  [0, 11, 0x7ff],
  [0, 22, 0x3ff],
  [1, 0, 0x7ff],
  [1, 11, 0x7ff],
  [1, 22, 0x3ff],
];

/**
 * Below this length the radix passes cover only the high 32 bits of each
 * key, and runs of equal high words are finished by the built-in sort.
 */
export const HIGH_WORD_FIRST_BELOW = 1 << 14;

/**
 * Sort a `Float64Array` ascending, in place, and return it.
 *
 * @param x the array to sort (modified)
 * @returns `x`, sorted
 *
 * @example
 * ```ts
 * import { sortFloat64 } from "./sort.ts";
 * const x = sortFloat64(new Float64Array([3, -0, NaN, -Infinity, 0, -2.5]));
 * if (x.join() !== "-Infinity,-2.5,0,0,3,NaN") throw new Error(x.join());
 * ```
 */
export function sortFloat64(x: Float64Array): Float64Array {
  const n = x.length;
  if (n < RADIX_MIN_N) return x.sort();
  // Sorts share one scratch buffer (the sort is synchronous and not re-entered).
  return _radixSort(x, n < HIGH_WORD_FIRST_BELOW ? _SMALL_SCRATCH : _scratch(n));
}

const _SMALL_SCRATCH = new Uint32Array(2 * HIGH_WORD_FIRST_BELOW);

/** Up to this length the scratch of a large sort is kept for the next one (8 MB at most). */
export const KEEP_SCRATCH_MAX_N = 1 << 20;
let _kept = new Uint32Array(0);

/**
 * Scratch for a sort of n values: up to {@linkcode KEEP_SCRATCH_MAX_N}
 * values one buffer kept between sorts (grown when needed), since writing
 * to freshly allocated memory can cost more than the sort itself (each new
 * page is faulted in: about 30 ms for 8 MB on the machine the benchmarks ran
 * on, against about 20 ms for the sort of 1e6 values); above it a new buffer
 * each time, so that no more than 8 MB is held after a sort.
 */
function _scratch(n: number): Uint32Array {
  if (n > KEEP_SCRATCH_MAX_N) return new Uint32Array(2 * n);
  if (_kept.length < 2 * n) _kept = new Uint32Array(2 * Math.max(n, 1 << 17));
  return _kept;
}
/** The six digit histograms, cleared before each sort. */
const _COUNTS = new Uint32Array(6 * 2048);

/** From this length {@linkcode sortedCopy} sorts two halves and merges them. */
export const SPLIT_MIN_N = 1 << 20;

/**
 * A sorted copy of `x`, in the order of {@linkcode sortFloat64}, using less
 * scratch memory than `sortFloat64(x.slice())`: from
 * {@linkcode SPLIT_MIN_N} values on, the two halves of the copy are radix
 * sorted one after the other with one scratch buffer of half the length,
 * and then merged (the first half moved into that buffer and merged with
 * the second half from the front, which never overwrites an unread value).
 * Peak scratch memory is 4·n bytes instead of 8·n.
 *
 * @param x the values (not modified)
 * @returns a new ascending `Float64Array`
 *
 * @example
 * ```ts
 * import { sortedCopy } from "./sort.ts";
 * const x = new Float64Array([2, -1, 0, -0, 5]);
 * const s = sortedCopy(x);
 * if (s.join() !== "-1,0,0,2,5" || !Object.is(s[1], -0) || x[0] !== 2) throw new Error(s.join());
 * ```
 */
export function sortedCopy(x: Float64Array): Float64Array {
  const n = x.length;
  const out = x.slice();
  if (n < SPLIT_MIN_N) return sortFloat64(out);
  const half = n >>> 1;
  const scratch = new Uint32Array(2 * (n - half));
  _radixSort(out.subarray(0, half), scratch);
  _radixSort(out.subarray(half), scratch);
  const left = new Float64Array(scratch.buffer, 0, half);
  left.set(out.subarray(0, half));
  let i = 0;
  let j = half;
  let k = 0;
  while (i < half && j < n) {
    const a = left[i];
    const b = out[j];
    // a comes first when a < b, on a tie unless a is +0 and b is −0, and always before a NaN b.
    if (a < b || (a === b ? !(a === 0 && 1 / a > 0 && 1 / b < 0) : b !== b)) {
      out[k++] = a;
      i++;
    } else {
      out[k++] = b;
      j++;
    }
  }
  while (i < half) out[k++] = left[i++];
  return out;
}

/** LSD radix sort of `x` in place, with `scratch` (at least 2·x.length words) as the buffer. */
function _radixSort(x: Float64Array, scratch: Uint32Array): Float64Array {
  const n = x.length;
  if (n < RADIX_MIN_N) return x.sort();
  // Canonicalise NaNs to one positive pattern so they sort after +∞.
  let nan = false;
  for (let i = 0; i < n; i++) {
    if (x[i] !== x[i]) {
      x[i] = NaN;
      nan = true;
    }
  }
  const u = new Uint32Array(x.buffer, x.byteOffset, 2 * n);
  // Small arrays are sorted on the high words only; the few runs of equal
  // high words are then sorted in place by the built-in sort.
  const highOnly = n < HIGH_WORD_FIRST_BELOW;
  const counts = _COUNTS.fill(0, highOnly ? 3 * 2048 : 0);
  for (let i = 0; i < 2 * n; i += 2) {
    let lo = u[i];
    let hi = u[i + 1];
    if (hi & 0x80000000) {
      lo = ~lo >>> 0;
      hi = ~hi >>> 0;
    } else {
      hi = (hi | 0x80000000) >>> 0;
    }
    u[i] = lo;
    u[i + 1] = hi;
    if (!highOnly) {
      counts[lo & 0x7ff]++;
      counts[2048 + ((lo >>> 11) & 0x7ff)]++;
      counts[4096 + (lo >>> 22)]++;
    }
    counts[6144 + (hi & 0x7ff)]++;
    counts[8192 + ((hi >>> 11) & 0x7ff)]++;
    counts[10240 + (hi >>> 22)]++;
  }
  let src: Uint32Array = u;
  let dst: Uint32Array = scratch.length === 2 * n ? scratch : scratch.subarray(0, 2 * n);
  for (let d = highOnly ? 3 : 0; d < 6; d++) {
    const [word, shift, mask] = _DIGITS[d];
    const base = d * 2048;
    // Skip a pass where every key has the same digit.
    const first = word === 0 ? (src[0] >>> shift) & mask : (src[1] >>> shift) & mask;
    if (counts[base + first] === n) continue;
    let sum = 0;
    for (let b = 0; b <= mask; b++) {
      const c = counts[base + b];
      counts[base + b] = sum;
      sum += c;
    }
    for (let i = 0; i < 2 * n; i += 2) {
      const lo = src[i];
      const hi = src[i + 1];
      const digit = ((word === 0 ? lo : hi) >>> shift) & mask;
      const at = 2 * counts[base + digit]++;
      dst[at] = lo;
      dst[at + 1] = hi;
    }
    const t = src;
    src = dst;
    dst = t;
  }
  // Map the keys back to doubles, into x's own buffer.
  for (let i = 0; i < 2 * n; i += 2) {
    let lo = src[i];
    let hi = src[i + 1];
    if (hi & 0x80000000) {
      hi = (hi & 0x7fffffff) >>> 0;
    } else {
      lo = ~lo >>> 0;
      hi = ~hi >>> 0;
    }
    u[i] = lo;
    u[i + 1] = hi;
  }
  if (highOnly) {
    // Values with the same high word have the same sign, so the built-in
    // sort orders them as the full key would.
    let start = 0;
    for (let i = 1; i <= n; i++) {
      if (i < n && u[2 * i + 1] === u[2 * start + 1]) continue;
      if (i - start === 2) {
        if (x[start] > x[start + 1]) {
          const t = x[start];
          x[start] = x[start + 1];
          x[start + 1] = t;
        }
      } else if (i - start > 2) {
        x.subarray(start, i).sort();
      }
      start = i;
    }
  }
  if (nan) {
    // Restore the canonical NaN (bit patterns round-trip exactly).
    for (let i = n - 1; i >= 0 && x[i] !== x[i]; i--) x[i] = NaN;
  }
  return x;
}
