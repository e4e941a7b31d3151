/**
 * Cells: the one-scan summary a scan keeps of a column. The finite values
 * are split into contiguous cells of a power-of-two width; for each cell the
 * engine returns its count and the sums
 * S_j = Σ eʲ (j = 1…4) of the offsets e = v − c from the cell's centre c.
 *
 * Central sums from cells are exact algebra, not an approximation: with
 * d = c − x̄, Σ(v − x̄)ʲ = Σ_cells Σ_i C(j, i)·dʲ⁻ⁱ·S_i. The offsets are at
 * most half a cell wide, so each engine sum is of small, similar terms
 * and loses nothing that shows; each offset carries one rounding, of
 * v − lo (the grid's origin), at most half a unit in the last place of the
 * value's distance from the origin (a per-cell form of the shifted-data
 * algorithm, Chan, Golub & LeVeque 1983, The American Statistician
 * 37:242–247); the cells are combined here with compensated (Neumaier
 * 1974, ZAMM 54:39–51) sums, and the rounding left in the mean is folded
 * back exactly as `moments.ts` does. This is why DuckDB's own
 * `skewness`/`kurtosis`, built from raw power sums, are never used: on
 * x + 1e6 they lose every digit.
 *
 * @module
 */
import { type _Shape, _shapeFromSums } from "../stats/moments.ts";

/** One cell: its count, value range, centre and centred power sums. */
export interface Cell {
  /** Values in the cell. */
  readonly n: number;
  /** No value of the cell lies below this (from the grid, or the exact smallest value). */
  readonly lo: number;
  /** No value of the cell lies above this (from the grid, or the exact largest value). */
  readonly hi: number;
  /** The cell's one value, when every value in it is the same (found on demand). */
  readonly value?: number;
  /** The cell's centre c (exact). */
  readonly centre: number;
  /** Σe, Σe², Σe³, Σe⁴ of e = v − c (Σe³ and Σe⁴ estimated when `slack` is given). */
  readonly s: readonly [number, number, number, number];
  /**
   * When the pass left out Σe³ and Σe⁴: how far the estimates in `s` can
   * be from the true sums (see {@linkcode higherSums}).
   */
  readonly slack?: readonly [number, number];
  /** The grid the cell belongs to (its index in the scan's list of grids). */
  readonly grid: number;
  /** The cell's key in its grid, ⌊(v − lo)/w⌋. */
  readonly key: number;
}

/** A compensated accumulator (Neumaier 1974). */
export class _Sum {
  #s = 0;
  #c = 0;
  /** Add v. */
  add(v: number): void {
    const t = this.#s + v;
    this.#c += Math.abs(this.#s) >= Math.abs(v) ? (this.#s - t) + v : (v - t) + this.#s;
    this.#s = t;
  }
  /** The sum. */
  value(): number {
    return this.#s + this.#c;
  }
}

/**
 * Σe³ and Σe⁴ of a cell from its count m and Σe, Σe² alone, in units of
 * the cell's width (so −½ ≤ e < ½), with bounds on their error. Every
 * offset has |e| ≤ ½, so |Σe³| ≤ Σe²/2 and Σe⁴ ≤ Σe²/4, and Σe⁴ ≥ (Σe²)²/m
 * (Cauchy–Schwarz). The estimates are those of a density that is linear
 * across the cell, exact for values spread evenly over it (Σe³ = 0.15·Σe,
 * Σe⁴ = 1.8·(Σe²)²/m, from the moments of a linear density on [−½, ½]:
 * E e = b/12, E e³ = b/80, E e² = 1/12, E e⁴ = 1/80), held within the
 * bounds; the errors stated are the distances to the far ends of the
 * bounds, whatever the values in the cell are.
 */
export function higherSums(
  m: number,
  s1: number,
  s2: number,
): { s3: number; s4: number; slack3: number; slack4: number } {
  const s3 = Math.min(s2 / 2, Math.max(-s2 / 2, 0.15 * s1));
  const floor4 = (s2 * s2) / m;
  const s4 = Math.min(s2 / 4, Math.max(floor4, 1.8 * floor4));
  return { s3, s4, slack3: s2 / 2 + Math.abs(s3), slack4: Math.max(s2 / 4 - s4, s4 - floor4) };
}

/**
 * How far g1 and g2 from {@linkcode cellShape} can be from those of the
 * values, when some cells' Σe³ and Σe⁴ were estimated: the bounds on the
 * sums carried through the central sums (Σ(v − x̄)³ takes each cell's Σe³
 * once; Σ(v − x̄)⁴ takes 4·|c − x̄|·Σe³ and Σe⁴), then divided as g1 and g2
 * are. Both 0 when every cell's sums were computed.
 */
export function cellShapeSlack(
  cells: readonly Cell[],
  shape: _Shape,
): { readonly g1: number; readonly g2: number } {
  let n = 0;
  let d3 = 0;
  let d4 = 0;
  for (const c of cells) {
    n += c.n;
    if (c.slack === undefined) continue;
    // Deviations are taken about the centre c0 the sums were combined at.
    const d = Math.abs(c.centre - shape.centreHi);
    d3 += c.slack[0];
    d4 += 4 * d * c.slack[0] + c.slack[1];
  }
  // Folding the residual δ back takes 4·δ·Σ(v − c0)³ from the fourth sum.
  d4 += 4 * Math.abs(shape.centreLo) * d3;
  if (d3 === 0 && d4 === 0) return { g1: 0, g2: 0 };
  const m2 = (shape.sd * shape.sd * (n - 1)) / n;
  // Rounded up a little, so that rounding in these few operations cannot understate them.
  const up = 1 + 1e-12;
  return { g1: (up * d3) / n / (m2 * Math.sqrt(m2)), g2: (up * d4) / n / (m2 * m2) };
}

/**
 * The mean, sd, g1 and g2 of the values summarised by `cells` (n ≥ 2, not
 * constant), in the form the moment-based tests take.
 */
export function cellShape(cells: readonly Cell[]): _Shape {
  let n = 0;
  const total = new _Sum();
  for (const c of cells) {
    n += c.n;
    total.add(c.n * c.centre);
    total.add(c.s[0]);
  }
  const c0 = total.value() / n;
  const m = [new _Sum(), new _Sum(), new _Sum(), new _Sum()];
  for (const c of cells) {
    const d = c.centre - c0;
    const [s1, s2, s3, s4] = c.s;
    const k = c.n;
    const d2 = d * d;
    m[0].add(k * d + s1);
    m[1].add(k * d2 + 2 * d * s1 + s2);
    m[2].add(k * d2 * d + 3 * d2 * s1 + 3 * d * s2 + s3);
    m[3].add(k * d2 * d2 + 4 * d2 * d * s1 + 6 * d2 * s2 + 4 * d * s3 + s4);
  }
  return _shapeFromSums(n, c0, [m[0].value(), m[1].value(), m[2].value(), m[3].value()], 0);
}

/** Where a rank falls: the cell's index and the rank within the cell (1-based). */
export interface RankPlace {
  readonly cell: number;
  readonly within: number;
}

/** Locate 1-based ranks (ascending) in the cells (in value order). */
export function locateRanks(cells: readonly Cell[], ranks: readonly number[]): RankPlace[] {
  const out: RankPlace[] = [];
  let below = 0;
  let i = 0;
  for (const r of ranks) {
    while (below + cells[i].n < r) below += cells[i++].n;
    out.push({ cell: i, within: r - below });
  }
  return out;
}

/**
 * A power-of-two cell width giving about `target` cells over [a, b], and
 * the grid's origin (a multiple of the width at or below a), so that every
 * centre lo + (k + ½)·w is exact (the width is at least 2⁻⁵⁰ of the largest
 * magnitude).
 */
export function gridFor(a: number, b: number, target: number): { lo: number; w: number } {
  const span = b - a;
  // Centres stay exact while |centre|/w < 2^52; keep a margin of 2^50.
  const big = Math.max(Math.abs(a), Math.abs(b));
  const floorExp = big > 0 ? Math.ceil(Math.log2(big)) - 50 : -1074;
  const w = 2 ** Math.max(floorExp, Math.floor(Math.log2(span / target)));
  return { lo: Math.floor(a / w) * w, w };
}

/** A cell found to hold the one value `a`: its estimated higher sums become exact. */
export function oneValueCell(c: Cell, a: number): Cell {
  if (c.slack === undefined) return Object.freeze({ ...c, lo: a, hi: a, value: a });
  const e = a - c.centre;
  const s = Object.freeze([c.s[0], c.s[1], c.n * e * e * e, c.n * e * e * e * e] as const);
  return Object.freeze({
    n: c.n,
    lo: a,
    hi: a,
    value: a,
    centre: c.centre,
    s,
    grid: c.grid,
    key: c.key,
  });
}
