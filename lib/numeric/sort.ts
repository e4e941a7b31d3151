/**
 * Sorting `Float64Array`s fast, since the sort dominates every
 * order-statistic test (Shapiro–Wilk, Anderson–Darling, Lilliefors).
 *
 * Method: least-significant-digit radix sort on the IEEE-754 bit patterns
 * (the usual order-preserving map: flip every bit of a negative number,
 * only the sign bit of a non-negative one; e.g. Herf 2001, "Radix tricks",
 * and Knuth, TAOCP vol. 3, §5.2.5), six passes of 11, 11 and 10 bits over
 * each 32-bit half, with all six histograms counted in one pass and passes
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
  // Canonicalise NaNs to one positive pattern so they sort after +∞.
  let nan = false;
  for (let i = 0; i < n; i++) {
    if (x[i] !== x[i]) {
      x[i] = NaN;
      nan = true;
    }
  }
  const u = new Uint32Array(x.buffer, x.byteOffset, 2 * n);
  const counts = new Uint32Array(6 * 2048);
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
    counts[lo & 0x7ff]++;
    counts[2048 + ((lo >>> 11) & 0x7ff)]++;
    counts[4096 + (lo >>> 22)]++;
    counts[6144 + (hi & 0x7ff)]++;
    counts[8192 + ((hi >>> 11) & 0x7ff)]++;
    counts[10240 + (hi >>> 22)]++;
  }
  let src: Uint32Array = u;
  let dst: Uint32Array = new Uint32Array(2 * n);
  for (let d = 0; d < 6; d++) {
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
  if (nan) {
    // Restore the canonical NaN (bit patterns round-trip exactly).
    for (let i = n - 1; i >= 0 && x[i] !== x[i]; i--) x[i] = NaN;
  }
  return x;
}
