/**
 * The types of a linear model's design (`model_design.ts`).
 *
 * @module
 */
import type { Named } from "./_design_columns.ts";

export type { Named } from "./_design_columns.ts";

/** The values of a factor: labels, with `null`, `undefined`, `""` or NaN for missing. */
export type FactorValues = ArrayLike<string | number | null | undefined>;

/** The terms of a linear model. */
export interface ModelTerms {
  /**
   * Numeric covariates by name (NaN marks a missing value).
   * @default {}
   */
  readonly covariates?: Named<ArrayLike<number>>;
  /**
   * Categorical factors by name.
   * @default {}
   */
  readonly factors?: Named<FactorValues>;
  /**
   * Interactions, each a list of two or more term names, e.g.
   * `[["line", "shift"]]`.
   * @default []
   */
  readonly interactions?: readonly (readonly string[])[];
  /**
   * The response's name, for messages and labels.
   * @default "y"
   */
  readonly response?: string;
}

/** One column of the design. */
export interface DesignColumn {
  /** E.g. `"(intercept)"`, `"temp_c"`, `"line=B"`, `"line=B × shift=night"`. */
  readonly name: string;
  /** The term it belongs to. */
  readonly term: string;
  /** The mean subtracted from the raw column (0 for the intercept). */
  readonly centre: number;
  /** The norm the centred column was divided by (√n for the intercept). */
  readonly scale: number;
}

/** One term of the model. */
export interface DesignTerm {
  /** The term's name: a column name, or the parts joined by `" × "`. */
  readonly name: string;
  /** What kind of term. */
  readonly kind: "intercept" | "factor" | "covariate" | "interaction";
  /** Its parts (one for a main effect). */
  readonly parts: readonly string[];
  /** A factor's levels in order, the first being the reference; empty otherwise. */
  readonly levels: readonly string[];
  /** Indices of its columns in {@linkcode ModelDesign.columns}. */
  readonly columns: readonly number[];
}

/** Rows left out because one column had no value there. */
export interface MissingCount {
  /** The column. */
  readonly column: string;
  /** Rows where it is missing (a row may miss several columns). */
  readonly rows: number;
}

/** A design matrix ready for the fit. */
export interface ModelDesign {
  /** The response's name. */
  readonly response: string;
  /** Rows given. */
  readonly rowsRead: number;
  /** The complete rows, as 0-based positions in the input. */
  readonly rows: Int32Array;
  /** Rows left out (incomplete). */
  readonly incomplete: number;
  /** Missing values by column (only columns with some). */
  readonly missing: readonly MissingCount[];
  /** The terms, intercept first. */
  readonly terms: readonly DesignTerm[];
  /** The columns, intercept first. */
  readonly columns: readonly DesignColumn[];
  /** Interaction columns left out because no row has that combination. */
  readonly emptyCells: readonly string[];
  /** The response's centre and scale. */
  readonly responseCentre: number;
  readonly responseScale: number;
  /**
   * Write rows `start … start + len − 1` (positions among the complete rows)
   * of the centred, unit-norm design into `out`, column-major len × (p + 1):
   * the p design columns, then the response. Nothing n × p is ever stored.
   */
  fillBlock(start: number, len: number, out: Float64Array): void;
}
