/**
 * Which ranks of a large sorted sample to keep when only a bounded number of
 * points can be shown: both tails in full, the middle at evenly spaced ranks
 * (so at evenly spaced sample quantiles). Used by the QQ data, which computes
 * limits only at the kept ranks, and by small chart panels, which thin further.
 *
 * @module
 */

/**
 * The 1-based ranks kept from a sample of `n`: every rank when `n ≤ maxPoints`;
 * otherwise the `min(tailPoints, ⌊maxPoints/4⌋)` smallest and largest ranks
 * in full and the rest of the budget evenly spaced between them (rounded,
 * duplicates dropped), ascending.
 *
 * @param n the sample size
 * @param maxPoints at most this many ranks are returned
 * @param tailPoints ranks kept in full at each end (capped at a quarter of `maxPoints`)
 * @example
 * ```ts
 * import { thinRanks } from "./thin_ranks.ts";
 * const r = thinRanks(1000, 20, 3);
 * if (r.length !== 20 || r[0] !== 1 || r[2] !== 3 || r[19] !== 1000) throw new Error(r.join());
 * ```
 */
export function thinRanks(n: number, maxPoints: number, tailPoints: number): number[] {
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
