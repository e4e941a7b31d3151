/**
 * The residual pass of a least-squares fit: the orthonormal basis of the
 * kept columns row block by row block, leverages, residuals, and their
 * standardised and studentised forms. Private to `lib/stats/linear_model.ts`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { PivotedQr } from "../numeric/small_qr.ts";
import { defaultBlockRows } from "../numeric/tall_qr.ts";
import type { ModelDesign } from "./model_design.ts";

/** Leverages within this distance of 1 count as 1 (an exact fit of the row). */
export const EXACT_LEVERAGE = 1e-10;

/**
 * Rows of U = A_K·R₂⁻¹, block by block, handed to `visit(start, len, u)`
 * with `u` column-major len × r.
 */
export function _basisBlocks(
  design: ModelDesign,
  f: PivotedQr,
  visit: (start: number, len: number, u: Float64Array, block: Float64Array) => void,
): void {
  const n = design.rows.length, p = f.rows, r = f.rank;
  const size = defaultBlockRows(p + 1);
  const block = new Float64Array(Math.min(n, size) * (p + 1));
  const u = new Float64Array(Math.min(n, size) * r);
  for (let start = 0; start < n; start += size) {
    const len = Math.min(size, n - start);
    design.fillBlock(start, len, block);
    for (let k = 0; k < r; k++) {
      const uk = k * len;
      u.set(block.subarray(f.pivot[k] * len, f.pivot[k] * len + len), uk);
      for (let j = 0; j < k; j++) {
        const rjk = f.qr[k * p + j], uj = j * len;
        if (rjk !== 0) { for (let i = 0; i < len; i++) u[uk + i] -= rjk * u[uj + i]; }
      }
      const rkk = f.qr[k * p + k];
      for (let i = 0; i < len; i++) u[uk + i] /= rkk;
    }
    visit(start, len, u, block);
  }
}

/** Scaled residuals e = y − U·c and leverages h, in one pass over the rows. */
export function _residualPass(
  design: ModelDesign,
  f: PivotedQr,
  c: Float64Array,
): { e: Float64Array; h: Float64Array } {
  const n = design.rows.length, p = f.rows, r = f.rank;
  const e = new Float64Array(n);
  const h = new Float64Array(n);
  _basisBlocks(design, f, (start, len, u, block) => {
    e.set(block.subarray(p * len, (p + 1) * len), start);
    for (let k = 0; k < r; k++) {
      const ck = c[k], uk = k * len;
      for (let i = 0; i < len; i++) {
        const v = u[uk + i];
        h[start + i] += v * v;
        e[start + i] -= ck * v;
      }
    }
  });
  return { e, h };
}

/** Standardised and studentised residuals, σ and the rows with leverage 1. */
export function _studentize(e: Float64Array, h: Float64Array, rank: number, design: ModelDesign) {
  const n = e.length, df = n - rank;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += e[i] * e[i];
  const s = Math.sqrt(rss / df);
  const standardized = new Float64Array(n), studentized = new Float64Array(n);
  const exactRows: number[] = [];
  for (let i = 0; i < n; i++) {
    if (h[i] > 1) h[i] = 1;
    const omh = 1 - h[i];
    if (omh <= EXACT_LEVERAGE) {
      exactRows.push(i);
      continue;
    }
    const q = e[i] / Math.sqrt(omh);
    standardized[i] = q / s;
    const deleted = rss - q * q;
    if (!(deleted > rss * 1e-13)) {
      throw new PlumbError(
        "constant",
        `Cannot studentise the residuals of ${design.response}: without row ${
          design.rows[i] + 1
        } ` +
          `the model fits the other rows exactly; check that row and the model`,
        { row: design.rows[i] + 1 },
      );
    }
    studentized[i] = q / Math.sqrt(deleted / (df - 1));
  }
  const ys = design.responseScale;
  const residuals = e; // scaled back in place: e is the fit's own array
  for (let i = 0; i < n; i++) residuals[i] *= ys;
  return {
    residuals,
    standardized,
    studentized,
    exactRows: Object.freeze(exactRows),
    rssScaled: rss,
    sigma: s * ys,
  };
}

/** The fit's cautions: empty cells, aliased columns, rows fitted exactly. */
export function _warnings(
  design: ModelDesign,
  aliased: readonly { name: string; relation: string }[],
  exactRows: readonly number[],
): string[] {
  const w: string[] = [];
  if (design.emptyCells.length) {
    w.push(
      `No rows for ${design.emptyCells.length} combination${
        design.emptyCells.length === 1 ? "" : "s"
      } ` +
        `of levels (${design.emptyCells.slice(0, 5).join("; ")}${
          design.emptyCells.length > 5 ? "; …" : ""
        }): those interaction columns are left out`,
    );
  }
  for (const a of aliased) w.push(`${a.name} is left out of the fit: ${a.relation}`);
  if (exactRows.length) {
    w.push(
      `${exactRows.length} row${exactRows.length === 1 ? " is" : "s are"} fitted exactly ` +
        `(leverage 1, e.g. the only row of a level): no residual information there, ` +
        `so their standardised and studentised residuals are reported as 0`,
    );
  }
  return w;
}
