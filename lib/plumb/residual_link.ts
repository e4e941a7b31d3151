/**
 * How a chain and its residual chain are linked: the checked request, the
 * fit made once on first need, the values the residual chain analyses, its
 * QQ envelope, and the steps that make no sense on residuals.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import { type LinearModelFit, residualBasis } from "../stats/linear_model.ts";
import { type ResidualEnvelope, residualEnvelope } from "../stats/residual_envelope.ts";
import {
  type CheckedRequest,
  checkResidualRequest,
  type ResidualRequest,
  type ResidualValues,
  residualValues,
} from "./residual_model.ts";

export type { ResidualRequest, ResidualValues } from "./residual_model.ts";
/**
 * The link from a chain to its residual chain: the checked request, and the
 * fit made once, on first need, from the parent chain's values.
 */
export class ResidualLink {
  readonly #table: Table;
  readonly #request: CheckedRequest;
  #done: ResidualValues | undefined;

  /** Check the request at once (see {@linkcode checkResidualRequest}). */
  constructor(table: Table, request: ResidualRequest | undefined, response: string) {
    this.#table = table;
    this.#request = checkResidualRequest(table, request, response);
  }

  /** The residuals, fitted on first call from the parent's values. */
  of(
    parent: () => {
      readonly values: Float64Array;
      readonly rows: Int32Array;
      readonly label: string;
    },
  ): ResidualValues {
    return (this.#done ??= residualValues(this.#table, parent(), this.#request));
  }
}

/**
 * What a residual chain analyses: the residuals and their rows, with the
 * parent's rows left out for an incomplete model column counted as missing.
 *
 * @param from the parent chain's values and counts
 * @param r the residuals
 */
export function residualsLoaded<T extends { readonly missing: number }>(
  from: T,
  r: ResidualValues,
): T & { values: Float64Array; rows: Int32Array } {
  return { ...from, values: r.values, rows: r.rows, missing: from.missing + r.incomplete };
}

/**
 * Refuse a step that makes no sense on residuals (re-expressing them, or
 * fitting a model to them).
 *
 * @param step the method called
 * @throws {PlumbError} always, `"bad-option"`
 */
export function refuseAfterResiduals(step: string): never {
  throw new PlumbError(
    "bad-option",
    `Cannot call ${step} on a chain of residuals: re-express the column, or name every model term, ` +
      `before .residuals(), e.g. plumb(table, y).reexpress("log").residuals({ factors: ["line"] })`,
  );
}

/**
 * The fit's orthonormal basis for the lag-1 test of its residuals, or
 * `undefined` when rows fitted exactly were left out (the basis would not
 * match the residuals shown; the test then centres them as plain values).
 *
 * @param r the residuals
 */
export function basisOf(
  r: ResidualValues,
): { readonly values: Float64Array; readonly rank: number } | undefined {
  if (r.fit.exactRows.length > 0) return undefined;
  return { values: residualBasis(r.fit), rank: r.fit.rank };
}

/**
 * Refuse to show a model where none was fitted.
 *
 * @param label the chain's label
 * @throws {PlumbError} always, `"bad-option"`
 */
export function refuseWithoutModel(label: string): never {
  throw new PlumbError(
    "bad-option",
    `Cannot show a model of ${label}: no model was fitted; call .residuals({ covariates, factors }) first`,
  );
}

/**
 * The QQ envelope of a fit's studentised residuals at given ranks, simulated
 * on its design (Atkinson 1981; `residualEnvelope`).
 *
 * @param fit the fit
 * @param level the pointwise coverage
 */
export function envelopeOf(
  fit: LinearModelFit,
  level = 0.95,
): (ranks: readonly number[]) => ResidualEnvelope {
  return (ranks) => residualEnvelope(fit, { ranks, level });
}

/**
 * A residual chain's values as `.by()` groups them: the residuals at their
 * table rows, with the chain's label and the residual notes.
 *
 * @param loaded the residual chain's values (rows on demand) and counts
 * @param label the residual chain's label
 * @param r the residuals
 */
export function givenValues(
  loaded: {
    readonly values: Float64Array;
    readonly rows: () => Int32Array;
    readonly missing: number;
    readonly text: number;
  },
  label: string,
  r: ResidualValues,
): {
  values: Float64Array;
  rows: Int32Array;
  label: string;
  missing: number;
  text: number;
  notes: readonly string[];
} {
  const { values, missing, text } = loaded;
  return { values, rows: loaded.rows(), missing, text, label, notes: r.notes };
}
