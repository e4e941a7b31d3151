/**
 * `.residuals({ covariates, factors })`: the columns of a linear model taken
 * from the chain's table, fitted to the chain's values (after any
 * re-expression), and the externally studentised residuals that the new
 * chain screens, with the notes its reading and sentence carry.
 *
 * The numbers come from `fitLinearModel` (`lib/stats/linear_model.ts`) and
 * the QQ envelope from `residualEnvelope` (Atkinson 1981, wired in
 * `residual_link.ts`); this file only
 * gathers the table's columns at the chain's rows and checks them.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import { checkOptions } from "../results/options.ts";
import { fitLinearModel, type LinearModelFit } from "../stats/linear_model.ts";
import { pickColumn } from "./source.ts";
import { modelCovariate, modelFactor } from "./_model_columns.ts";

/** What `.residuals()` fits: the model's columns, named from the chain's table. */
export interface ResidualRequest {
  /**
   * Numeric columns entered as covariates (a straight-line term each).
   * @default []
   */
  readonly covariates?: readonly string[];
  /**
   * Columns entered as categorical factors (treatment coding, the first
   * level in natural order as reference).
   * @default []
   */
  readonly factors?: readonly string[];
  /**
   * Interactions, each a list of two or more of the named terms, e.g.
   * `[["line", "shift"]]`.
   * @default []
   */
  readonly interactions?: readonly (readonly string[])[];
  /**
   * What to do with a covariate or factor column that the other terms
   * explain: `"refuse"` (a `"collinear"` error naming it) or `"drop"` (fit
   * without it; the reading says so).
   * @default "refuse"
   */
  readonly aliased?: "refuse" | "drop";
}

/** A request with its lists filled in. */
export type CheckedRequest =
  & Required<Omit<ResidualRequest, "aliased">>
  & Pick<ResidualRequest, "aliased">;

const _KNOWN = ["covariates", "factors", "interactions", "aliased"] as const;

/** The values the residual chain screens, with the fit behind them. */
export interface ResidualValues {
  /** The fit (plain data). */
  readonly fit: LinearModelFit;
  /** Externally studentised residuals of the rows with leverage below 1. */
  readonly values: Float64Array;
  /** Their 0-based table rows. */
  readonly rows: Int32Array;
  /** The model in words, e.g. `"fill_ml ~ line + shift + temp_c"`. */
  readonly formula: string;
  /** Rows of the chain left out because a model column had no value there. */
  readonly incomplete: number;
  /** What the reading and the sentence say about these values. */
  readonly notes: readonly string[];
}

function _names(list: unknown, what: string): string[] {
  if (list === undefined) return [];
  if (!Array.isArray(list) || list.some((c) => typeof c !== "string")) {
    throw new PlumbError(
      "bad-option",
      `Cannot read ${what} of .residuals(): give a list of column names, such as ["line"]`,
    );
  }
  return list as string[];
}

/**
 * Check a `.residuals()` request where it is written: known options, lists
 * of column names the table has, no column named twice. Returns the request
 * with its lists filled in.
 *
 * @param table the chain's table
 * @param request the model's columns
 * @param response the chain's column (it cannot also be a term)
 * @throws {PlumbError} `"bad-option"`, `"unknown-column"`
 * @example
 * ```ts
 * import { checkResidualRequest } from "./residual_model.ts";
 * import { toTable } from "./source.ts";
 * const t = toTable({ fill: [1, 2, 3, 4, 5], temp: [1, 3, 2, 5, 4] });
 * if (checkResidualRequest(t, { covariates: ["temp"] }, "fill").covariates[0] !== "temp") throw new Error("request");
 * ```
 */
export function checkResidualRequest(
  table: Table,
  request: ResidualRequest | undefined,
  response: string,
): CheckedRequest {
  const r = checkOptions(request, _KNOWN, ".residuals()");
  const covariates = _names(r.covariates, "covariates");
  const factors = _names(r.factors, "factors");
  const interactions = r.interactions === undefined ? [] : r.interactions;
  if (!Array.isArray(interactions) || interactions.some((i) => !Array.isArray(i))) {
    throw new PlumbError(
      "bad-option",
      `Cannot read interactions of .residuals(): give a list of lists of term names, such as [["line", "shift"]]`,
    );
  }
  const seen = new Set<string>();
  for (const c of [...covariates, ...factors]) {
    pickColumn(table, c);
    if (c === response) {
      throw new PlumbError(
        "bad-option",
        `Cannot use ${c} as a term of its own model: it is the column screened; name other columns`,
      );
    }
    if (seen.has(c)) {
      throw new PlumbError(
        "bad-option",
        `Cannot use ${c} twice in one model: name it once, as a covariate or as a factor`,
      );
    }
    seen.add(c);
  }
  if (r.aliased !== undefined && r.aliased !== "refuse" && r.aliased !== "drop") {
    throw new PlumbError(
      "bad-option",
      `Unknown aliased option ${JSON.stringify(r.aliased)}: use "refuse" or "drop"`,
    );
  }
  return { covariates, factors, interactions, aliased: r.aliased };
}

/** The model in words: `y ~ a + b + a × b`. */
export function modelFormula(
  label: string,
  request: {
    covariates: readonly string[];
    factors: readonly string[];
    interactions: readonly (readonly string[])[];
  },
): string {
  const terms = [
    ...request.factors,
    ...request.covariates,
    ...request.interactions.map((i) => i.join(" × ")),
  ];
  return `${label} ~ ${terms.length ? terms.join(" + ") : "1 (the mean only)"}`;
}

/**
 * Fit the model to a chain's values and give the externally studentised
 * residuals to screen, with their table rows and the notes for the reading.
 *
 * @param table the chain's table
 * @param chain the chain's values, their 0-based table rows and label
 * @param request the model's columns (checked by {@linkcode checkResidualRequest})
 * @throws {PlumbError} `"non-numeric"` for a covariate holding text,
 *   `"constant"` for a constant covariate or a one-level factor,
 *   `"collinear"` for a column the others explain, `"too-few"` below 3
 *   residual degrees of freedom
 * @example
 * ```ts
 * import { residualValues } from "./residual_model.ts";
 * import { toTable } from "./source.ts";
 * const t = toTable({ fill: [5, 7, 6, 9, 8, 11, 10, 13], temp: [1, 2, 3, 4, 5, 6, 7, 8] });
 * const r = residualValues(t, { values: t.numeric("fill").values, rows: Int32Array.from([0, 1, 2, 3, 4, 5, 6, 7]), label: "fill" }, { covariates: ["temp"], factors: [], interactions: [] });
 * if (r.values.length !== 8 || r.fit.dfResidual !== 6) throw new Error("residuals");
 * ```
 */
export function residualValues(
  table: Table,
  chain: { readonly values: Float64Array; readonly rows: Int32Array; readonly label: string },
  request: CheckedRequest,
): ResidualValues {
  const covariates: Record<string, Float64Array> = {};
  for (const c of request.covariates) covariates[c] = modelCovariate(table, c, chain.rows);
  const factors: Record<string, (string | null)[]> = {};
  for (const f of request.factors) factors[f] = modelFactor(table, f, chain.rows);
  const fit = fitLinearModel(chain.values, {
    covariates,
    factors,
    interactions: request.interactions,
    response: chain.label,
    aliased: request.aliased ?? "refuse",
  });
  const exact = new Set(fit.exactRows);
  const m = fit.n - exact.size;
  const values = new Float64Array(m), rows = new Int32Array(m);
  for (let k = 0, w = 0; k < fit.n; k++) {
    if (exact.has(k)) continue;
    values[w] = fit.studentized[k];
    rows[w++] = chain.rows[fit.rows[k]];
  }
  const formula = modelFormula(chain.label, request);
  const notes = [
    `These are the externally studentised residuals of ${formula} (ordinary least squares, ` +
    `${fit.rank} parameters, ${fit.dfResidual} residual degrees of freedom); each follows ` +
    `Student's t with ${fit.dfResidual - 1} degrees of freedom when the errors are normal`,
    `Residuals of one fit are correlated and their spreads differ with leverage, so the tests' ` +
    `p-values are approximate; they hold as the number of rows grows with the terms fixed ` +
    `(Pierce & Kopecky 1979, Biometrika 66:1–5; White & MacDonald 1980, JASA 75:16–28), and the ` +
    `QQ plot's envelope is simulated on this design (Atkinson 1981)`,
    // The fit's last warning, when rows have leverage 1, is replaced by the note below.
    ...fit.warnings.slice(0, fit.warnings.length - (exact.size > 0 ? 1 : 0)),
  ];
  if (exact.size > 0) {
    notes.push(
      `${exact.size} row${exact.size === 1 ? " is" : "s are"} fitted exactly (leverage 1, such ` +
        `as a level seen once) and ${exact.size === 1 ? "has" : "have"} no residual to screen`,
    );
  }
  return Object.freeze({
    fit,
    values,
    rows,
    formula,
    incomplete: fit.incomplete,
    notes: Object.freeze(notes),
  });
}
