/**
 * Ordinary least squares with numeric covariates and categorical factors:
 * the fit, its rank, the aliased columns, and raw, standardised and
 * externally studentised residuals with their leverages.
 *
 * Method:
 * 1. The design is centred and scaled to unit-norm columns
 *    (`model_design.ts`), with the response as one more column.
 * 2. Householder QR of the tall n × (p + 1) matrix, block by block
 *    (`lib/numeric/tall_qr.ts`; Golub & Van Loan 2013, *Matrix
 *    Computations*, 4th ed., Algorithm 5.2.1), gives R and Qᵀy.
 * 3. The numerical rank comes from Householder QR with column pivoting of
 *    the small R (Golub & Van Loan Algorithm 5.4.1): a column is aliased
 *    when the part of it that the columns already taken do not explain has
 *    norm at most `tolerance` (default 1e-7, the tolerance of R's `lm`) —
 *    that is, when the other columns explain it with R² ≥ 1 − tolerance².
 *    Which columns are named aliased follows the terms' order (LINPACK's
 *    limited pivoting as in R's `lm`), unless that disagrees with the
 *    rank-revealing order, which then decides.
 * 4. With U = A_K·R₂⁻¹ the orthonormal basis of the kept columns, the
 *    leverages are hᵢ = ‖uᵢ‖² and the residuals e = y − U·(Uᵀy), row block
 *    by row block.
 * 5. Standardised residuals eᵢ/(s·√(1 − hᵢ)) with s² = RSS/(n − r);
 *    externally studentised residuals eᵢ/(s₍ᵢ₎·√(1 − hᵢ)) with
 *    (n − r − 1)·s₍ᵢ₎² = RSS − eᵢ²/(1 − hᵢ), the residual variance without
 *    row i (Belsley, Kuh & Welsch 1980, *Regression Diagnostics*, Wiley,
 *    §2.1; Cook & Weisberg 1982, *Residuals and Influence in Regression*,
 *    Chapman & Hall, §2.2.2).
 *
 * Accuracy: within 1e-9 relative of R 4.2.2's `lm`, `rstandard`, `rstudent`
 * and `hatvalues` on published data sets and on designs with an offset of
 * 1e6 and a spread of 1e-3 (tests/fixtures/linear_model.json), where R's own
 * `lm` needs the covariate centred first.
 *
 * Special cases: a row with leverage 1 (within 1e-10; a factor level seen
 * once) has no residual information: its standardised and studentised
 * residuals are set to 0 and the row is listed in `exactRows`. Fewer than 3
 * residual degrees of freedom, or a row without which the rest fit exactly,
 * raise a `PlumbError`. Nothing returns NaN.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { applyQt, type PivotedQr } from "../numeric/small_qr.ts";
import { tallQrFactor } from "../numeric/tall_qr.ts";
import { buildDesign, type ModelDesign, type ModelTerms } from "./model_design.ts";
import { _aliasReport, _coefficients, _selectColumns } from "./_model_rank.ts";
import {
  _basisBlocks,
  _residualPass,
  _studentize,
  _warnings,
  EXACT_LEVERAGE,
} from "./_model_residuals.ts";

export { EXACT_LEVERAGE };
import type { LinearModelFit } from "./linear_model_types.ts";

export type { AliasedColumn, Coefficient, FitTerm, LinearModelFit } from "./linear_model_types.ts";

/** Options for {@linkcode fitLinearModel}. */
export interface LinearModelOptions extends ModelTerms {
  /**
   * Relative norm at which a column counts as explained by the earlier ones.
   * @default 1e-7
   */
  readonly tolerance?: number;
  /**
   * What to do when a covariate or a factor's column is aliased: `"refuse"`
   * (a `"collinear"` PlumbError naming it) or `"drop"` (fit without it and
   * list it). Aliased interaction columns are always dropped and listed.
   * @default "refuse"
   */
  readonly aliased?: "refuse" | "drop";
}

/** The fewest residual degrees of freedom accepted. */
export const MIN_RESIDUAL_DF = 3;

interface _Internal {
  readonly design: ModelDesign;
  readonly f: PivotedQr;
}
const _internal = new WeakMap<LinearModelFit, _Internal>();

/**
 * Fit `y` by ordinary least squares on an intercept plus the given
 * covariates, factors and interactions, on the complete rows.
 *
 * @param y the response (NaN marks a missing value)
 * @param options the terms, the rank tolerance, what to do with aliased columns
 * @throws {PlumbError} see {@linkcode buildDesign}; `"collinear"` for an
 *   aliased covariate or factor column (unless `aliased: "drop"`);
 *   `"too-few"` below {@linkcode MIN_RESIDUAL_DF} residual degrees of freedom
 * @example
 * ```ts
 * import { fitLinearModel } from "./linear_model.ts";
 * const fit = fitLinearModel([10.1, 11.9, 14.2, 15.8, 18.1, 19.7, 22.2, 24.1], {
 *   covariates: { dose: [1, 2, 3, 4, 5, 6, 7, 8] },
 * });
 * const slope = fit.coefficients.find((c) => c.name === "dose")!.estimate;
 * if (Math.abs(slope - 1.98) > 0.05 || fit.dfResidual !== 6) throw new Error("fit");
 * ```
 */
export function fitLinearModel(
  y: ArrayLike<number>,
  options: LinearModelOptions = {},
): LinearModelFit {
  const tolerance = options.tolerance ?? 1e-7;
  if (!(tolerance >= 0 && tolerance < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use rank tolerance ${tolerance}: use a number from 0 up to (not including) 1, such as 1e-7`,
    );
  }
  const mode = options.aliased ?? "refuse";
  if (mode !== "refuse" && mode !== "drop") {
    throw new PlumbError(
      "bad-option",
      `Unknown aliased option "${String(mode)}": use "refuse" or "drop"`,
    );
  }
  const design = buildDesign(y, options);
  const n = design.rows.length, p = design.columns.length;
  if (n < MIN_RESIDUAL_DF + 1) _tooFew(design, n, 1);
  const full = tallQrFactor(design.fillBlock, [n, p + 1]);
  const r = new Float64Array(p * p), t = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    for (let i = 0; i <= j; i++) r[j * p + i] = full[j * (p + 1) + i];
    t[j] = full[p * (p + 1) + j];
  }
  const f = _selectColumns(r, p, tolerance);
  const rank = f.rank;
  const aliased = _aliasReport(f, design);
  if (mode === "refuse") {
    const main = aliased.find((a) => a.kind !== "interaction");
    if (main) {
      throw new PlumbError(
        "collinear",
        `Cannot fit ${design.response}: ${main.name} is explained by the other terms ` +
          `(${main.relation}); leave ${main.term} out, or one of the terms it depends on`,
        { column: main.name, term: main.term, with: main.with },
      );
    }
  }
  if (n - rank < MIN_RESIDUAL_DF) _tooFew(design, n, rank);
  applyQt(f, t);
  const c = t.subarray(0, rank);
  const { e, h } = _residualPass(design, f, c);
  const out = _studentize(e, h, rank, design);
  const fit = Object.freeze({
    response: design.response,
    rowsRead: design.rowsRead,
    n,
    incomplete: design.incomplete,
    missing: design.missing,
    rank,
    dfResidual: n - rank,
    sigma: out.sigma,
    rSquared: Math.max(0, 1 - out.rssScaled),
    terms: Object.freeze(design.terms.map((term) =>
      Object.freeze({
        name: term.name,
        kind: term.kind,
        parts: term.parts,
        levels: term.levels,
        columns: Object.freeze(term.columns.map((j) => design.columns[j].name)),
        estimated: term.columns.filter((j) => !aliased.some((a) => a.index === j)).length,
      })
    )),
    coefficients: _coefficients(f, c, design, out.rssScaled / (n - rank)),
    aliased: Object.freeze(aliased.map(({ index: _i, kind: _k, ...a }) => Object.freeze(a))),
    emptyCells: design.emptyCells,
    exactRows: out.exactRows,
    rows: design.rows,
    residuals: out.residuals,
    leverages: h,
    standardized: out.standardized,
    studentized: out.studentized,
    tolerance,
    method: `ordinary least squares by Householder QR on centred, unit-norm columns ` +
      `(Golub & Van Loan 2013, Algorithms 5.2.1 and 5.4.1), rank tolerance ${tolerance}; ` +
      `externally studentised residuals (Belsley, Kuh & Welsch 1980)`,
    warnings: Object.freeze(_warnings(design, aliased, out.exactRows)),
    toJSON(): unknown {
      const { toJSON: _, ...rest } = this as LinearModelFit;
      return {
        ...rest,
        rows: Array.from(design.rows),
        residuals: Array.from(out.residuals),
        leverages: Array.from(h),
        standardized: Array.from(out.standardized),
        studentized: Array.from(out.studentized),
      };
    },
  }) as LinearModelFit;
  _internal.set(fit, { design, f });
  return fit;
}

function _tooFew(design: ModelDesign, n: number, rank: number): never {
  throw new PlumbError(
    "too-few",
    `Cannot fit ${design.response} on ${design.columns.length - 1} design column` +
      `${design.columns.length === 2 ? "" : "s"}: ${n} complete row${n === 1 ? "" : "s"} and ` +
      `${rank} estimated parameter${rank === 1 ? "" : "s"} leave ${Math.max(0, n - rank)} ` +
      `residual degrees of freedom, and at least ${MIN_RESIDUAL_DF} are needed; ` +
      `use fewer terms or more rows`,
    { n, rank, min: MIN_RESIDUAL_DF },
  );
}

/**
 * The orthonormal basis U (n × rank, column-major) of the fitted columns of
 * a fit from {@linkcode fitLinearModel}: the residuals of any vector z on
 * the same design are z − U·(Uᵀz). For simulations and the moments of
 * serial correlation of residuals.
 *
 * @param fit a fit from {@linkcode fitLinearModel}
 * @example
 * ```ts
 * import { fitLinearModel, residualBasis } from "./linear_model.ts";
 * const fit = fitLinearModel([1, 3, 2, 5, 4, 6], { covariates: { x: [1, 2, 3, 4, 5, 6] } });
 * const u = residualBasis(fit); // 6 × 2: the intercept and x, orthonormalised
 * let h0 = 0;
 * for (let k = 0; k < 2; k++) h0 += u[k * 6] ** 2;
 * if (Math.abs(h0 - fit.leverages[0]) > 1e-14) throw new Error("basis");
 * ```
 */
export function residualBasis(fit: LinearModelFit): Float64Array {
  const inside = _internal.get(fit);
  if (!inside) {
    throw new PlumbError(
      "bad-option",
      `Cannot find the basis of this fit: pass a fit from fitLinearModel`,
    );
  }
  const n = fit.n, r = fit.rank;
  const out = new Float64Array(n * r);
  _basisBlocks(inside.design, inside.f, (start, len, u) => {
    for (let k = 0; k < r; k++) out.set(u.subarray(k * len, (k + 1) * len), k * n + start);
  });
  return out;
}
