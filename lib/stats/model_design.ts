/**
 * The design matrix of a linear model with numeric covariates, categorical
 * factors and their interactions, built on the complete rows and centred and
 * scaled so that badly scaled data (an offset of 1e6 with a spread of 1e-3)
 * lose no digits in the fit.
 *
 * - Complete rows: a row is used when the response, every covariate and
 *   every factor named in the model hold a value there; the rows left out
 *   are counted, per column.
 * - Factors: treatment coding, the usual indicator columns for every level
 *   but the first (the reference); levels in natural order (numbers by
 *   value, then text), as the per-group screening sorts groups.
 * - Interactions: the products of their components' columns (R's coding
 *   when the lower-order terms are in the model; Chambers & Hastie 1992,
 *   *Statistical Models in S*, §2.4). Covariates enter a product centred at
 *   their mean, so that the product keeps its digits; the main effects of an
 *   interacting factor are then its effects at the covariate's mean. A
 *   product column that is zero on every row (a combination of levels with
 *   no data: an empty cell) is left out and named.
 * - Every column except the intercept is centred at its mean (two passes:
 *   the mean, then the mean of the deviations added back; Chan, Golub &
 *   LeVeque 1983, The American Statistician 37:242–247) and divided by its
 *   norm, and the intercept column is 1/√n: all columns have norm 1 and the
 *   centred ones are orthogonal to the intercept. This changes the
 *   parametrisation, not the fitted values, residuals or leverages; the
 *   centres and scales are kept for the coefficients. The response is
 *   centred and scaled the same way.
 *
 * Terms are ordered factors, covariates, interactions, each in the order
 * given, so that when a covariate is explained by a factor (a temperature
 * set per line), the covariate is the one reported as aliased.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import {
  type _ColumnSpec,
  _columnStats,
  _fillColumn,
  _levelCodes,
  _namedList,
  type _Source,
} from "./_design_columns.ts";
import {
  _checkInteractions,
  _constantError,
  _missingLabel,
  _numbers,
  type _Part,
} from "./_design_checks.ts";
import type {
  DesignColumn,
  DesignTerm,
  FactorValues,
  MissingCount,
  ModelDesign,
  ModelTerms,
} from "./model_design_types.ts";

export type * from "./model_design_types.ts";

/** At most this many design columns (a factor with thousands of levels is a row label). */
export const MAX_DESIGN_COLUMNS = 1000;

/**
 * Build the centred and scaled design of `y` on the given terms, on the
 * complete rows.
 *
 * @param y the response (NaN marks a missing value)
 * @param terms covariates, factors, interactions, the response's name
 * @throws {PlumbError} `"bad-option"` for columns of the wrong length or
 *   names used twice, `"unknown-column"` for an interaction naming no term,
 *   `"non-finite"` for ±Infinity, `"constant"` for a constant covariate or
 *   response or a one-level factor, `"too-many"` past
 *   {@linkcode MAX_DESIGN_COLUMNS} columns
 * @example
 * ```ts
 * import { buildDesign } from "./model_design.ts";
 * const d = buildDesign([5, 6, 7, 9, NaN], {
 *   covariates: { t: [1, 2, 3, 4, 5] },
 *   factors: { line: ["A", "B", "A", "B", "A"] },
 * });
 * if (d.rows.length !== 4 || d.columns.map((c) => c.name).join() !== "(intercept),line=B,t") {
 *   throw new Error("design");
 * }
 * ```
 */
export function buildDesign(y: ArrayLike<number>, terms: ModelTerms = {}): ModelDesign {
  const response = terms.response ?? "y";
  const factors = _namedList(terms.factors, "factors");
  const covariates = _namedList(terms.covariates, "covariates");
  const len = y.length;
  const parts: _Part[] = [
    ...factors.map(([name, raw]) => ({ kind: "factor" as const, name, raw })),
    ...covariates.map(([name, raw]) => ({ kind: "covariate" as const, name, raw })),
  ];
  const seen = new Set<string>([response]);
  for (const p of parts) {
    if (seen.has(p.name)) {
      throw new PlumbError(
        "bad-option",
        `Cannot use ${p.name} twice in one model: it is already the response or another term; ` +
          `name each column once`,
      );
    }
    seen.add(p.name);
    if (p.raw.length !== len) {
      throw new PlumbError(
        "bad-option",
        `Cannot fit ${response} on ${p.name}: ${p.name} has ${p.raw.length} values and ` +
          `${response} ${len}; give columns of one table`,
      );
    }
  }
  const interactions = _checkInteractions(terms.interactions ?? [], parts);
  // complete rows
  const ok = new Uint8Array(len).fill(1);
  const missing: MissingCount[] = [];
  const numbers = new Map<string, Float64Array>();
  for (
    const [name, raw] of [
      [response, y] as const,
      ...parts.map((p) => [p.name, p.raw] as const),
    ]
  ) {
    let c = 0;
    if (parts.find((p) => p.name === name)?.kind === "factor") {
      for (let i = 0; i < len; i++) {
        if (_missingLabel(raw[i])) {
          c++;
          ok[i] = 0;
        }
      }
    } else {
      const v = _numbers(raw, name);
      numbers.set(name, v);
      for (let i = 0; i < len; i++) {
        if (v[i] !== v[i]) {
          c++;
          ok[i] = 0;
        }
      }
    }
    if (c > 0) missing.push({ column: name, rows: c });
  }
  let n = 0;
  for (let i = 0; i < len; i++) n += ok[i];
  let rows: Int32Array | null = null; // null: every row is complete
  if (n < len) {
    rows = new Int32Array(n);
    for (let i = 0, k = 0; i < len; i++) if (ok[i]) rows[k++] = i;
  }

  // each main effect's sources: a covariate's values, a factor's indicators
  const sourcesOf = new Map<string, { names: string[]; sources: _Source[] }>();
  const levelsOf = new Map<string, string[]>();
  for (const part of parts) {
    if (part.kind === "covariate") {
      const values = numbers.get(part.name)!;
      sourcesOf.set(part.name, { names: [part.name], sources: [{ kind: "numeric", values }] });
      continue;
    }
    const { levels, codes } = _levelCodes(part.raw as FactorValues, rows, n);
    if (levels.length < 2) {
      throw new PlumbError(
        "constant",
        `Cannot use ${part.name} as a factor: ${
          n === 0
            ? "there are no complete rows"
            : `all ${n} complete rows are in level ${levels[0]}`
        }; a factor needs at least two levels, so leave it out`,
      );
    }
    levelsOf.set(part.name, levels);
    sourcesOf.set(part.name, {
      names: levels.slice(1).map((l) => `${part.name}=${l}`),
      sources: levels.slice(1).map((_, l) => ({ kind: "dummy", codes, level: l + 1 })),
    });
  }

  // the columns: intercept, main effects, interactions
  const root = Math.sqrt(n);
  const specs: _ColumnSpec[] = [{ source: { kind: "intercept" }, centre: 0, scale: root }];
  const columns: DesignColumn[] = [
    Object.freeze({ name: "(intercept)", term: "(intercept)", centre: 0, scale: root }),
  ];
  const designTerms: DesignTerm[] = [
    { name: "(intercept)", kind: "intercept", parts: [], levels: [], columns: [0] },
  ];
  const emptyCells: string[] = [];
  const add = (name: string, term: string, source: _Source, unit = 1): number | undefined => {
    const st = _columnStats(source, rows, n);
    if (st.min === st.max) {
      if (source.kind === "numeric") throw _constantError(name, "covariate", st.min, n);
      if (st.min === 0) {
        emptyCells.push(name);
        return undefined;
      }
    }
    const scale = st.norm > 0 ? st.norm : 1;
    specs.push({ source, centre: st.centre, scale });
    columns.push(Object.freeze({ name, term, centre: st.centre * unit, scale: scale * unit }));
    return columns.length - 1;
  };
  for (const part of parts) {
    const { names, sources } = sourcesOf.get(part.name)!;
    designTerms.push({
      name: part.name,
      kind: part.kind,
      parts: [part.name],
      levels: levelsOf.get(part.name) ?? [],
      columns: sources.map((src, j) => add(names[j], part.name, src)!),
    });
  }
  for (const names of interactions) {
    const term = names.join(" × ");
    const idx: number[] = [];
    for (const combo of _products(names.map((nm) => sourcesOf.get(nm)!), rows, n)) {
      const j = add(combo.name, term, combo.source, combo.unit);
      if (j !== undefined) idx.push(j);
    }
    designTerms.push({ name: term, kind: "interaction", parts: names, levels: [], columns: idx });
  }
  const p = specs.length;
  if (p > MAX_DESIGN_COLUMNS) {
    throw new PlumbError(
      "too-many",
      `Cannot fit ${response} with ${p} design columns: at most ${MAX_DESIGN_COLUMNS} are ` +
        `supported; a factor with very many levels is a row label, not a grouping, so leave it out`,
      { columns: p, max: MAX_DESIGN_COLUMNS },
    );
  }
  const ySource: _Source = { kind: "numeric", values: numbers.get(response)! };
  const yStats = _columnStats(ySource, rows, n);
  if (n > 0 && yStats.min === yStats.max) throw _constantError(response, "response", yStats.min, n);
  const all = [...specs, { source: ySource, centre: yStats.centre, scale: yStats.norm || 1 }];
  return Object.freeze({
    response,
    rowsRead: len,
    rows: rows ?? _identity(n),
    incomplete: len - n,
    missing: Object.freeze(missing.map((m) => Object.freeze(m))),
    terms: Object.freeze(designTerms.map((t) => Object.freeze(t))),
    columns: Object.freeze(columns),
    emptyCells: Object.freeze(emptyCells),
    responseCentre: yStats.centre,
    responseScale: yStats.norm || 1,
    fillBlock(start: number, blockLen: number, out: Float64Array): void {
      for (let j = 0; j < all.length; j++) {
        _fillColumn(all[j], rows, start, blockLen, out, j * blockLen);
      }
    },
  });
}

/**
 * The product columns of an interaction, one per combination of its parts'
 * columns. Covariates enter centred at their mean and divided by their root
 * mean square (so that products of large values cannot overflow); `unit`,
 * the product of those divisors, turns the column back into raw units.
 */
function* _products(
  comps: readonly { names: string[]; sources: _Source[] }[],
  rows: Int32Array | null,
  n: number,
): Generator<{ name: string; source: _Source; unit: number }> {
  let unit = 1;
  const numeric: { values: Float64Array; centre: number; scale: number }[] = [];
  for (const c of comps) {
    const src = c.sources[0];
    if (src.kind !== "numeric") continue;
    const st = _columnStats(src, rows, n);
    const rms = st.norm / Math.sqrt(n);
    numeric.push({ values: src.values, centre: st.centre, scale: rms });
    unit *= rms;
  }
  const factorComps = comps.filter((c) => c.sources[0].kind === "dummy");
  const idx = factorComps.map(() => 0);
  for (;;) {
    const dummies = factorComps.map((c, i) =>
      c.sources[idx[i]] as { codes: Int32Array; level: number }
    );
    let f = 0;
    const name = comps.map((c) => (c.sources[0].kind === "dummy" ? c.names[idx[f++]] : c.names[0]))
      .join(" × ");
    yield { name, source: { kind: "product", numeric, dummies }, unit };
    let c = factorComps.length - 1;
    while (c >= 0 && ++idx[c] === factorComps[c].sources.length) idx[c--] = 0;
    if (c < 0) return;
  }
}

function _identity(n: number): Int32Array {
  const out = new Int32Array(n);
  for (let k = 0; k < n; k++) out[k] = k;
  return out;
}
