/**
 * The result types of {@linkcode ./linear_model.ts fitLinearModel}.
 *
 * @module
 */
import type { MissingCount } from "./model_design.ts";

/** One estimated coefficient, in the data's units. */
export interface Coefficient {
  /** The design column, e.g. `"(intercept)"`, `"temp_c"`, `"line=B"`. */
  readonly name: string;
  /** The term it belongs to. */
  readonly term: string;
  /** The estimate. */
  readonly estimate: number;
  /** Its standard error, s·√((XᵀX)⁻¹)ⱼⱼ. */
  readonly se: number;
}

/** A design column left out because earlier columns explain it. */
export interface AliasedColumn {
  /** The column. */
  readonly name: string;
  /** Its term. */
  readonly term: string;
  /** The kept columns it depends on. */
  readonly with: readonly string[];
  /** The dependence in words, e.g. `"temp_c = 18 + 2.5·line=B"`. */
  readonly relation: string;
}

/** One term of a fitted model. */
export interface FitTerm {
  /** The term's name. */
  readonly name: string;
  /** `"intercept"`, `"factor"`, `"covariate"` or `"interaction"`. */
  readonly kind: "intercept" | "factor" | "covariate" | "interaction";
  /** Its parts (one for a main effect). */
  readonly parts: readonly string[];
  /** A factor's levels, the first being the reference; empty otherwise. */
  readonly levels: readonly string[];
  /** Its design columns. */
  readonly columns: readonly string[];
  /** How many of them were estimated (not aliased). */
  readonly estimated: number;
}

/**
 * A least-squares fit with its residual diagnostics. Frozen; the typed
 * arrays are the caller's to keep and are aligned with `rows`.
 */
export interface LinearModelFit {
  /** The response's name. */
  readonly response: string;
  /** Rows given. */
  readonly rowsRead: number;
  /** Complete rows used. */
  readonly n: number;
  /** Rows left out because some model column had no value. */
  readonly incomplete: number;
  /** Missing values by column. */
  readonly missing: readonly MissingCount[];
  /** Parameters estimated (intercept included). */
  readonly rank: number;
  /** Residual degrees of freedom n − rank. */
  readonly dfResidual: number;
  /** Residual standard error √(RSS/(n − rank)). */
  readonly sigma: number;
  /** Share of the variation about the mean explained by the fit. */
  readonly rSquared: number;
  /** The terms, intercept first. */
  readonly terms: readonly FitTerm[];
  /** The estimated coefficients, in design order. */
  readonly coefficients: readonly Coefficient[];
  /** Design columns left out as aliased. */
  readonly aliased: readonly AliasedColumn[];
  /** Interaction columns left out because no row has that combination of levels. */
  readonly emptyCells: readonly string[];
  /** Positions (into `rows`) of rows with leverage 1: their scaled residuals are 0. */
  readonly exactRows: readonly number[];
  /** The complete rows, as 0-based positions in the input. */
  readonly rows: Int32Array;
  /** Raw residuals y − ŷ. */
  readonly residuals: Float64Array;
  /** Leverages hᵢ, the diagonal of the hat matrix. */
  readonly leverages: Float64Array;
  /** Standardised (internally studentised) residuals eᵢ/(s·√(1 − hᵢ)). */
  readonly standardized: Float64Array;
  /** Externally studentised residuals eᵢ/(s₍ᵢ₎·√(1 − hᵢ)). */
  readonly studentized: Float64Array;
  /** The rank tolerance used. */
  readonly tolerance: number;
  /** The method, in words, with its sources. */
  readonly method: string;
  /** Cautions: empty cells, aliased columns, rows fitted exactly. */
  readonly warnings: readonly string[];
  /** Plain data, the arrays as number arrays. */
  toJSON(): unknown;
}
