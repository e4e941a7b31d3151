/**
 * Data for a normal QQ plot of a censored sample: measured values and
 * censored values (drawn at their limits) on one probability scale, with the
 * line of the censored maximum-likelihood fit.
 *
 * @module
 */
import { normalQuantile } from "../numeric/normal.ts";
import type { Selected } from "../numeric/select.ts";
import type { CensoredFit } from "./censored_fit.ts";
import {
  _checkOffset,
  _checkOverlap,
  _countBelow,
  type _GroupedPositions,
  _limitIndex,
  _positionsSorted,
} from "./censored_positions.ts";
import type { CensoredSample, CensorSide } from "./censored_sample.ts";
import { BLOM_OFFSET } from "./plotting_positions.ts";
import { _qqBuild, type QqData, type QqOptions } from "./qq_data.ts";

/** QQ data of a censored sample: {@linkcode QqData} with each point's side. */
export interface CensoredQqData extends QqData {
  /** The side of each kept point: 0 measured, −1 "<limit", 1 ">limit" (drawn at the limit). */
  readonly censor: readonly CensorSide[];
  /** How many kept points are censored. */
  readonly censoredShown: number;
  /** Where the reference line comes from, in words. */
  readonly line: string;
}

/**
 * Build the QQ data of a censored sample.
 *
 * Positions: Hirsch–Stedinger plotting positions for multiply censored data
 * (`censoredPositions`, offset 3/8 unless `options.offset` says otherwise),
 * so that with nothing censored the plot is the ordinary one with Blom's
 * positions. Points are ordered by position; a censored value is drawn at
 * its limit with the normal score of its own position (spread below a "<"
 * limit, above a ">" limit).
 *
 * Line: `fit.mean + fit.sd · z`, the censored maximum-likelihood fit
 * (`censoredNormalFit`), not the mean and sd of the limits and values.
 *
 * Envelope: the band of a complete sample of n at the same ranks (exact
 * Beta order-statistic limits, see `envelope.ts`) around that line, an
 * approximation for the measured points; censored points are never counted
 * as outside it, since their true values are only bounded by the limit.
 *
 * Thinning as for `qqData`: at most `maxPoints` points, the ends in full.
 *
 * @param sample a checked sample from `censoredSample`
 * @param fit the censored ML fit of that sample
 * @param options envelope, offset, thinning and row labels, as for `qqData`
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * import { censoredNormalFit } from "./censored_fit.ts";
 * import { censoredQqData } from "./censored_qq.ts";
 * const s = censoredSample([0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3], [-1, 0, -1, 0, 0, 0, 0, 0]);
 * const q = censoredQqData(s, censoredNormalFit(s));
 * if (q.censoredShown !== 2 || q.censor[0] !== -1 || q.value[0] !== 0.05) throw new Error("qq");
 * ```
 */
export function censoredQqData(
  sample: CensoredSample,
  fit: CensoredFit,
  options: QqOptions = {},
): CensoredQqData {
  const a = _checkOffset(options.offset ?? BLOM_OFFSET);
  _checkOverlap(sample);
  return _censoredQqFrom(sample, _positionsSorted(sample, a), fit, options);
}

/** A kept point: its position, value, side and 0-based index in the data. */
interface _Item {
  p: number;
  value: number;
  side: CensorSide;
  /** Index into the sorted measured values, or the 1-based count within its limit. */
  at: number;
  /** Which limit (index into that side's limits); −1 for a measured value. */
  limit: number;
  index: number;
}

/**
 * {@linkcode censoredQqData} from the grouped positions the caller already
 * holds (computed with `options.offset`, the limits checked for overlap);
 * `rowLabel`, when given, labels a 0-based position in place of `options.rows`.
 * The points in position order come from merging the sorted measured values
 * with each limit's censored values (a heap over the streams), so no
 * per-value position is computed; rows are found in one pass over the data.
 */
export function _censoredQqFrom(
  sample: CensoredSample,
  g: _GroupedPositions,
  fit: CensoredFit,
  options: QqOptions = {},
  rowLabel?: (position: number) => number,
): CensoredQqData {
  const { n } = sample;
  const a = options.offset ?? BLOM_OFFSET;
  let items: _Item[] = [];
  const select = (ranks: readonly number[]): Selected => {
    items = _itemsAtRanks(sample, g, a, ranks);
    return {
      value: Float64Array.from(items, (t) => t.value),
      row: Int32Array.from(items, (t) => t.index),
    };
  };
  const base = _qqBuild(
    n,
    fit.mean,
    fit.sd,
    options,
    select,
    rowLabel,
    () => items.map((t) => normalQuantile(t.p)),
  );
  const sides = items.map((t) => t.side);
  const outside = base.outside.map((o, k) => (sides[k] === 0 ? o : 0));
  return Object.freeze({
    ...base,
    positions: `Hirsch–Stedinger plotting positions for censored data (offset ${base.offset}); ` +
      `censored values drawn at their limits`,
    envelopeMethod: `${base.envelopeMethod}, as for a complete sample of ${n} at the same ranks ` +
      `(an approximation with censoring; censored points are not counted as outside)`,
    outside: Object.freeze(outside),
    outsideCount: outside.reduce((k: number, o) => k + (o === 0 ? 0 : 1), 0),
    censor: Object.freeze(sides),
    censoredShown: sides.filter((x) => x !== 0).length,
    line: "the maximum-likelihood normal fit under censoring (intercept its mean, slope its sd)",
  });
}

/** The points at the given ranks (ascending) of the position order, with their data indices. */
function _itemsAtRanks(
  sample: CensoredSample,
  g: _GroupedPositions,
  a: number,
  ranks: readonly number[],
): _Item[] {
  const { leftLimits: lows, rightLimits: highs } = sample;
  // Streams: 0 the measured values; 1…m the left limits; then the right limits.
  // Each yields its items in ascending position; a right limit's r-th value
  // sits at 1 − (1 − F)(r − a)/(C + 1 − 2a), so it runs from r = C down to 1.
  const m = lows.length + highs.length;
  const size = [g.obs.length, ...g.leftCounts, ...g.rightCounts];
  const next = new Int32Array(m + 1);
  const posOf = (s: number, t: number): number => {
    if (s === 0) return g.pObs[t];
    if (s <= lows.length) {
      const j = s - 1;
      return g.fLow[j] * (t + 1 - a) / (g.leftCounts[j] + 1 - 2 * a);
    }
    const j = s - 1 - lows.length;
    const c = g.rightCounts[j];
    return 1 - (1 - g.fHigh[j]) * (c - t - a) / (c + 1 - 2 * a);
  };
  // A binary heap of stream numbers, keyed by each stream's next position.
  const heap: number[] = [];
  const key = (s: number) => posOf(s, next[s]);
  const push = (s: number) => {
    heap.push(s);
    for (let i = heap.length - 1; i > 0;) {
      const up = (i - 1) >> 1;
      if (key(heap[up]) <= key(heap[i])) break;
      [heap[up], heap[i]] = [heap[i], heap[up]];
      i = up;
    }
  };
  const pop = (): number => {
    const top = heap[0];
    const last = heap.pop()!;
    if (heap.length > 0) {
      heap[0] = last;
      for (let i = 0;;) {
        const l = 2 * i + 1, r = l + 1;
        let s = i;
        if (l < heap.length && key(heap[l]) < key(heap[s])) s = l;
        if (r < heap.length && key(heap[r]) < key(heap[s])) s = r;
        if (s === i) break;
        [heap[s], heap[i]] = [heap[i], heap[s]];
        i = s;
      }
    }
    return top;
  };
  for (let s = 0; s <= m; s++) if (size[s] > 0) push(s);
  const out: _Item[] = [];
  let rank = 0;
  for (const want of ranks) {
    let s = -1, t = -1;
    while (rank < want) {
      s = pop();
      t = next[s]++;
      rank++;
      if (next[s] < size[s]) push(s);
    }
    const p = posOf(s, t);
    if (s === 0) out.push({ p, value: g.obs[t], side: 0, at: t, limit: -1, index: -1 });
    else if (s <= lows.length) {
      out.push({ p, value: lows[s - 1], side: -1, at: t + 1, limit: s - 1, index: -1 });
    } else {
      const j = s - 1 - lows.length;
      out.push({ p, value: highs[j], side: 1, at: g.rightCounts[j] - t, limit: j, index: -1 });
    }
  }
  _findRows(sample, g, out);
  return out;
}

/**
 * Each kept point's index in the data, in one pass: equal measured values
 * and the values censored at one limit are matched in data order, as
 * `censoredPositions` assigns them.
 */
function _findRows(sample: CensoredSample, g: _GroupedPositions, items: _Item[]): void {
  const { values, censor, leftLimits, rightLimits } = sample;
  // A measured value x kept at sorted index `at`: the equal values fill the
  // block of sorted indices starting at lo, so its r-th occurrence in data
  // order (from 0) is the one at lo + r.
  const measured = new Map<number, { lo: number; seen: number; at: Map<number, _Item> }>();
  const limited = new Map<string, Map<number, _Item>>();
  for (const t of items) {
    if (t.side === 0) {
      let e = measured.get(t.value);
      if (!e) {
        measured.set(t.value, e = { lo: _countBelow(g.obs, t.value), seen: 0, at: new Map() });
      }
      e.at.set(t.at, t);
    } else {
      const k = `${t.side}:${t.limit}`;
      if (!limited.has(k)) limited.set(k, new Map());
      limited.get(k)!.set(t.at, t);
    }
  }
  const seenLeft = new Int32Array(leftLimits.length);
  const seenRight = new Int32Array(rightLimits.length);
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    if (censor[i] === 0) {
      const e = measured.get(x);
      if (e === undefined) continue;
      const t = e.at.get(e.lo + e.seen++);
      if (t) t.index = i;
    } else {
      const j = _limitIndex(censor[i] < 0 ? leftLimits : rightLimits, x);
      const seen = censor[i] < 0 ? ++seenLeft[j] : ++seenRight[j];
      const t = limited.get(`${censor[i]}:${j}`)?.get(seen);
      if (t) t.index = i;
    }
  }
}
