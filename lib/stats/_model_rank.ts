/**
 * Rank, aliasing and coefficients of a least-squares fit, all worked on the
 * small triangular factor R of the centred, unit-norm design. Private to
 * `lib/stats/linear_model.ts`.
 *
 * @module
 */
import { type PivotedQr, pivotedQr, solveUpper } from "../numeric/small_qr.ts";
import type { ModelDesign } from "./model_design.ts";
import type { Coefficient } from "./linear_model_types.ts";

/**
 * The factorisation of R's columns that the fit uses: the terms' order with
 * dependent columns moved to the end (limited pivoting), when its rank
 * agrees with the rank-revealing order of Golub & Van Loan Algorithm 5.4.1;
 * otherwise the columns that the rank-revealing order keeps, in the terms'
 * order.
 */
export function _selectColumns(r: Float64Array, p: number, tolerance: number): PivotedQr {
  const given = pivotedQr(r, [p, p], { tolerance, pivoting: "given" });
  const largest = pivotedQr(r, [p, p], { tolerance, pivoting: "largest" });
  if (given.rank === largest.rank) return given;
  const keep = Array.from(largest.pivot.subarray(0, largest.rank)).sort((a, b) => a - b);
  const kept = new Set(keep);
  const order = [...keep, ...Array.from({ length: p }, (_, j) => j).filter((j) => !kept.has(j))];
  const m = new Float64Array(p * p);
  order.forEach((j, q) => m.set(r.subarray(j * p, (j + 1) * p), q * p));
  const f = pivotedQr(m, [p, p], { tolerance: 0, pivoting: "given", maxRank: largest.rank });
  return Object.freeze({ ...f, pivot: f.pivot.map((q) => order[q]) });
}

/** An aliased column with what it depends on (internal form). */
export interface _Aliased {
  readonly index: number;
  readonly kind: string;
  readonly name: string;
  readonly term: string;
  readonly with: readonly string[];
  readonly relation: string;
}

/** Coefficients smaller than this (on unit-norm columns) are taken as 0 in a dependence. */
const _NEGLIGIBLE = 1e-8;

/**
 * For each aliased column j: the kept columns it depends on, from
 * R₁₁·z = (Qᵀaⱼ)[0 … rank), written in the data's units.
 */
export function _aliasReport(f: PivotedQr, design: ModelDesign): _Aliased[] {
  const p = f.rows, r = f.rank, cols = design.columns;
  const kindOf = new Map<number, string>();
  for (const t of design.terms) for (const j of t.columns) kindOf.set(j, t.kind);
  const out: _Aliased[] = [];
  for (let q = r; q < p; q++) {
    const j = f.pivot[q];
    const z = solveUpper(f, f.qr.subarray(q * p, q * p + r));
    const sj = cols[j].scale;
    let constant = cols[j].centre;
    const parts: string[] = [];
    const withNames: string[] = [];
    for (let k = 0; k < r; k++) {
      if (!(Math.abs(z[k]) > _NEGLIGIBLE)) continue;
      const col = cols[f.pivot[k]];
      const w = (sj * z[k]) / col.scale;
      if (f.pivot[k] === 0) {
        constant += w; // the intercept's raw column is 1
        continue;
      }
      constant -= w * col.centre;
      withNames.push(col.name);
      parts.push(`${w < 0 ? "−" : "+"} ${_num(Math.abs(w))}·${col.name}`);
    }
    const relation = withNames.length === 0
      ? `${cols[j].name} is constant on the complete rows`
      : `${cols[j].name} = ${_num(constant)} ${parts.join(" ")}`;
    out.push({
      index: j,
      kind: kindOf.get(j) ?? "",
      name: cols[j].name,
      term: cols[j].term,
      with: Object.freeze(withNames),
      relation,
    });
  }
  return out;
}

function _num(v: number): string {
  const s = String(Number(v.toPrecision(4)));
  return s.startsWith("-") ? `−${s.slice(1)}` : s;
}

/**
 * The coefficients in the data's units with their standard errors:
 * b = R₂⁻¹c on the scaled columns; column j's coefficient is s_y·bⱼ/sⱼ and
 * the intercept is ȳ + Σ gⱼbⱼ with g₀ = s_y/√n, gⱼ = −s_y·mⱼ/sⱼ;
 * Var(b) = s²·R₂⁻¹R₂⁻ᵀ (s² on the scaled response).
 */
export function _coefficients(
  f: PivotedQr,
  c: Float64Array,
  design: ModelDesign,
  s2: number,
): readonly Coefficient[] {
  const r = f.rank, cols = design.columns;
  const ys = design.responseScale, s = Math.sqrt(s2);
  const b = solveUpper(f, c);
  // inverse of R₂, column by column: rinv[k·r + i] is row i, column k
  const rinv = new Float64Array(r * r);
  const unit = new Float64Array(r);
  for (let k = 0; k < r; k++) {
    unit.fill(0);
    unit[k] = 1;
    rinv.set(solveUpper(f, unit), k * r);
  }
  const g = new Float64Array(r);
  let intercept = design.responseCentre;
  const out: (Coefficient & { index: number })[] = [];
  for (let k = 0; k < r; k++) {
    const j = f.pivot[k], col = cols[j];
    g[k] = j === 0 ? ys / col.scale : (-ys * col.centre) / col.scale;
    intercept += g[k] * b[k];
    if (j === 0) continue;
    let row = 0;
    for (let q = 0; q < r; q++) row += rinv[q * r + k] ** 2;
    out.push({
      index: j,
      name: col.name,
      term: col.term,
      estimate: (ys * b[k]) / col.scale,
      se: (ys * s * Math.sqrt(row)) / col.scale,
    });
  }
  let v = 0;
  for (let q = 0; q < r; q++) {
    let w = 0;
    for (let k = 0; k < r; k++) w += rinv[q * r + k] * g[k];
    v += w * w;
  }
  out.push({
    index: 0,
    name: "(intercept)",
    term: "(intercept)",
    estimate: intercept,
    se: s * Math.sqrt(v),
  });
  out.sort((x, y) => x.index - y.index);
  return Object.freeze(out.map(({ index: _, ...rest }) => Object.freeze(rest)));
}
