/**
 * Every SQL statement a scan runs, in one place. The statements use plain
 * SQL (aggregates with FILTER, GROUP BY, a window `row_number()`, a join on
 * VALUES) so that the same screening can run on a distributed engine; the
 * few places where engines differ are the fields of {@linkcode Dialect}:
 *
 * - sampling syntax: DuckDB's `USING SAMPLE reservoir(n ROWS) REPEATABLE
 *   (seed)` gives exactly n rows, the same rows for the same seed; other
 *   engines spell a seeded sample differently (`TABLESAMPLE … REPEATABLE`
 *   in PostgreSQL and Trino takes a percentage, Spark's `TABLESAMPLE (n
 *   ROWS)` has no seed), or need `ORDER BY` a seeded hash of a row key
 *   `LIMIT n`;
 * - the finite-number test: DuckDB's `isfinite(v)` (NaN sorts above
 *   +Infinity in DuckDB, so range comparisons cannot exclude it);
 * - reading text as numbers: `TRY_CAST(c AS DOUBLE)` (DuckDB, Trino,
 *   Snowflake, Spark 3.2+; `SAFE_CAST` in BigQuery);
 * - regular expressions, for censored cells (`<0.5`): DuckDB's
 *   `regexp_full_match` and `regexp_extract` (RE2 syntax; Trino spells them
 *   `regexp_like` with anchors and `regexp_extract`, Spark `rlike` and
 *   `regexp_extract`);
 * - row order, for telling a row number from a measurement: DuckDB keeps
 *   the order in which it reads one source (files in name order, rows in
 *   file order) through a window with an empty `OVER ()` clause, so
 *   `row_number() OVER ()` and `lag(v) OVER ()` see the rows as the file
 *   holds them (DuckDB documentation, "Order preservation"; checked with
 *   DuckDB 1.5.6 on a two-file glob); a distributed engine reads in no
 *   fixed order and needs a row key (file name, row number in the file) to
 *   order the window by;
 * - approximate quantiles are not used: the order statistics are exact (a
 *   window `row_number()` over the few cells that hold the wanted ranks),
 *   so no engine's sketch error enters the QQ plot.
 *
 * Identifiers are always quoted; numbers are written as exponent literals with 17
 * significant digits, so that a bound sent to SQL is the double computed here.
 *
 * Kept in one file because porting the screening to another engine means
 * reading every statement it runs side by side with the dialect above.
 *
 * @module
 */

import { DEFAULT_MISSING } from "../data/missing.ts";

/** The engine-specific fragments. */
export interface Dialect {
  /** The engine's name, for messages. */
  readonly name: string;
  /** A predicate true when the double expression `v` is finite. */
  finite(v: string): string;
  /** A relation of `size` rows drawn from `relation` (seeded, repeatable). */
  sample(relation: string, size: number, seed: number): string;
  /** Text column `c` read as a double, NULL where it is not a number. */
  tryDouble(c: string): string;
  /** Each row's 1-based position in the source's own order (see the module doc). */
  readonly rowNumber: string;
  /** The value of `v` on the row above, in the source's own order (NULL on the first row). */
  previous(v: string): string;
  /** A predicate true when the whole of text `t` matches the (RE2) pattern literal `p`. */
  fullMatch(t: string, p: string): string;
  /** The text of capturing group `g` of pattern literal `p` in text `t`. */
  capture(t: string, p: string, g: number): string;
}

/** DuckDB's spelling. */
export const DUCKDB: Dialect = Object.freeze({
  name: "DuckDB",
  finite: (v: string) => `isfinite(${v})`,
  sample: (relation: string, size: number, seed: number) =>
    `SELECT * FROM ${relation} USING SAMPLE reservoir(${size} ROWS) REPEATABLE (${seed})`,
  tryDouble: (c: string) => `TRY_CAST(${c} AS DOUBLE)`,
  rowNumber: "row_number() OVER ()",
  previous: (v: string) => `lag(${v}) OVER ()`,
  fullMatch: (t: string, p: string) => `regexp_full_match(${t}, ${p})`,
  capture: (t: string, p: string, g: number) => `regexp_extract(${t}, ${p}, ${g})`,
});

/** `"name"` with inner quotes doubled. */
export function quoteIdent(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}

/** `'text'` with inner quotes doubled. */
export function quoteText(text: string): string {
  return `'${text.replaceAll("'", "''")}'`;
}

/**
 * A double as an SQL literal that reads back as the same double: an
 * approximate-numeric literal (with an exponent, which SQL reads as a
 * double, where a plain decimal would first become an exact DECIMAL and
 * then be rounded again), in parentheses so that a minus sign never meets
 * another one.
 */
export function num(v: number): string {
  if (!Number.isFinite(v)) throw new Error(`not a finite number: ${v}`);
  return `(${v.toExponential(16)})`;
}

/** The columns of a relation and their types. */
export function describeSql(relation: string): string {
  return `DESCRIBE SELECT * FROM ${relation}`;
}

/**
 * A cell of `column` as the screening sees it: for a text column, NULL
 * where the cell holds a missing-value token (`DEFAULT_MISSING` of
 * `lib/data/missing.ts`: the empty cell, `NA`, `N/A`, `null`, `NaN`, `-`,
 * `.`, compared trimmed and in lower case), so that such cells count as
 * missing, not as text, as in memory.
 */
export function cellExpr(column: string, textual: boolean): string {
  const c = quoteIdent(column);
  if (!textual) return c;
  const tokens = [...new Set(DEFAULT_MISSING.map((t) => t.trim().toLowerCase()))];
  return `(CASE WHEN lower(trim(${c})) IN (${tokens.map(quoteText).join(", ")}) ` +
    `THEN NULL ELSE ${c} END)`;
}

/**
 * The value expression analysed: the column as a double (`TRY_CAST` for a
 * text column, its missing-value tokens NULL, and text that reads as an
 * infinite number, such as `inf` or `1e400`, NULL too: text in memory),
 * times an exact power of two when magnitudes are extreme.
 */
export function valueExpr(
  dialect: Dialect,
  column: string,
  textual: boolean,
  scale: number,
): string {
  const c = cellExpr(column, textual);
  const t = dialect.tryDouble(c);
  const v = textual ? `(CASE WHEN ${dialect.finite(t)} THEN ${t} END)` : `CAST(${c} AS DOUBLE)`;
  return scale === 1 ? v : `(${v} * ${num(scale)})`;
}

/** A re-expression as SQL sees it: the family, its λ and shift, the log's base. */
export interface SqlReexpression {
  readonly kind: "identity" | "log" | "square-root" | "reciprocal" | "box-cox" | "yeo-johnson";
  readonly lambda: number | null;
  readonly shift: number;
  readonly base: "e" | 10 | null;
}

/**
 * The re-expressed value of the double expression `v`, in functions every
 * engine has (`ln`, `log10`, `sqrt`, `exp`, `power`; no `expm1`/`log1p`,
 * which DuckDB lacks). The power families follow `_powerTerm` in
 * `lib/reexpress/_checks.ts`: (e^{λ·a} − 1)/λ with a = ln x, and its series
 * a·(1 + t·(½ + t/6)) where |t = λ·a| < 1e-5, so that λ near 0 keeps its
 * digits; λ = 0 (below 1e-150) is the log. Domain checks are the caller's
 * (it knows the range).
 */
export function reexpressedSql(v: string, r: SqlReexpression): string {
  const sh = (x: string) => (r.shift === 0 ? x : `(${x} + ${num(r.shift)})`);
  const power = (a: string, lambda: number) => {
    if (Math.abs(lambda) < 1e-150) return a;
    const L = num(lambda);
    return `(CASE WHEN abs(${L} * ${a}) < 1e-5 THEN ${a} * (1 + ${L} * ${a} * ` +
      `(0.5 + ${L} * ${a} / 6)) ELSE (exp(${L} * ${a}) - 1) / ${L} END)`;
  };
  switch (r.kind) {
    case "identity":
      return v;
    case "log":
      return r.base === 10 ? `log10(${sh(v)})` : `ln(${sh(v)})`;
    case "square-root":
      return `sqrt(${sh(v)})`;
    case "reciprocal":
      return `(1 / ${v})`;
    case "box-cox":
      return power(`ln(${v})`, r.lambda!);
    case "yeo-johnson": {
      const l = r.lambda!;
      return `(CASE WHEN ${v} >= 0 THEN ${power(`ln(${v} + 1)`, l)} ` +
        `ELSE -${power(`ln(1 - ${v})`, 2 - l)} END)`;
    }
  }
}

/**
 * A group column's cells as text: NULL for empty cells and, in a text
 * column, for missing-value tokens (see {@linkcode cellExpr}), so that such
 * rows belong to no group, as in memory.
 */
export function groupExpr(group: string, textual: boolean): string {
  return `CAST(${cellExpr(group, textual)} AS VARCHAR)`;
}

/** The distinct values of a group column (`g`, see {@linkcode groupExpr}), at most `limit`. */
export function groupValuesSql(relation: string, g: string, limit: number): string {
  return `SELECT DISTINCT ${g} AS g FROM ${relation} ` +
    `ORDER BY g NULLS LAST LIMIT ${limit}`;
}

/**
 * The rows of one group of `g` (see {@linkcode groupExpr}; its value as
 * text, or null for the rows of no group) as a relation.
 */
export function groupRelation(relation: string, g: string, value: string | null): string {
  const where = value === null ? `${g} IS NULL` : `${g} = ${quoteText(value)}`;
  return `(SELECT * FROM ${relation} WHERE ${where}) AS grp`;
}

/**
 * The groups of `g` (see {@linkcode groupExpr}; NULL for the rows of no
 * group, last) with, in each, the finite numbers of the value expression `v` and
 * their mean, the missing cells of the cell expression `cell` (see
 * {@linkcode cellExpr}), and its cells that are text or not finite; at most
 * `limit` groups.
 */
export function groupCountsSql(
  dialect: Dialect,
  relation: string,
  cell: string,
  v: string,
  g: string,
  limit: number,
): string {
  const f = dialect.finite("v");
  return `SELECT g, CAST(count(*) FILTER (WHERE v IS NOT NULL AND ${f}) AS DOUBLE) AS n, ` +
    `avg(v) FILTER (WHERE v IS NOT NULL AND ${f}) AS mean, ` +
    `CAST(count(*) FILTER (WHERE c IS NULL) AS DOUBLE) AS missing, ` +
    `CAST(count(*) FILTER (WHERE c IS NOT NULL AND (v IS NULL OR NOT ${f})) AS DOUBLE) AS other ` +
    `FROM (SELECT ${g} AS g, ${cell} AS c, ${v} AS v ` +
    `FROM ${relation}) AS s GROUP BY g ORDER BY g NULLS LAST LIMIT ${limit}`;
}

/**
 * The residuals of the value expression `v` from the given mean of their
 * group of `g` (see {@linkcode groupExpr}), as a relation with one DOUBLE column named `column`:
 * rows of groups not listed, and values that are not finite numbers, are
 * left out. The means come as a join on VALUES (standard SQL).
 */
export function residualRelation(
  dialect: Dialect,
  relation: string,
  column: string,
  v: string,
  g: string,
  means: readonly (readonly [string, number])[],
): string {
  const rows = means.map(([g, m]) => `(${quoteText(g)}, ${num(m)})`).join(", ");
  return `(SELECT s.v - m.mu AS ${quoteIdent(column)} ` +
    `FROM (SELECT ${g} AS g, ${v} AS v FROM ${relation}) AS s ` +
    `JOIN (VALUES ${rows}) AS m(g, mu) ON s.g = m.g ` +
    `WHERE s.v IS NOT NULL AND ${dialect.finite("s.v")}) AS res`;
}

/** The column analysed: where it comes from and which rows hold finite numbers. */
export interface Values {
  readonly dialect: Dialect;
  /** The FROM-clause text. */
  readonly relation: string;
  /** The value expression (see {@linkcode valueExpr}). */
  readonly v: string;
  /**
   * Which rows to drop: none (every value is a finite number), those with
   * no value, or those whose value is not a finite number. The lighter the
   * filter, the less each pass costs.
   */
  readonly keep: "all" | "present" | "finite";
}

/** The finite values of the column, as a relation with the one column `v`. */
function _finiteValues(src: Values, where: string[] = []): string {
  const cond = [
    ...(src.keep === "all"
      ? []
      : [src.keep === "present" ? "v IS NOT NULL" : src.dialect.finite("v")]),
    ...where,
  ];
  return `(SELECT v FROM (SELECT ${src.v} AS v FROM ${src.relation}) AS s0` +
    `${cond.length ? ` WHERE ${cond.join(" AND ")}` : ""}) AS s1`;
}

/**
 * Up to `limit` of the finite values off the grid origin + k·step by more
 * than `tol` (none: every value sits on the step found on the sample).
 */
export function offGridSql(
  src: Values,
  origin: number,
  step: number,
  tol: number,
  limit: number,
): string {
  const d = `(v - ${num(origin)})`;
  return `SELECT v FROM ${_finiteValues(src)} ` +
    `WHERE abs(${d} - round(${d} / ${num(step)}) * ${num(step)}) > ${num(tol)} LIMIT ${limit}`;
}

/** The seeded sample of finite values. */
export function sampleSql(src: Values, size: number, seed: number): string {
  // Sampling the source itself lets the engine draw while it reads.
  return src.keep === "all"
    ? `SELECT ${src.v} AS v FROM (${src.dialect.sample(src.relation, size, seed)}) AS s0`
    : src.dialect.sample(_finiteValues(src), size, seed);
}

/** One grid of cells: values a ≤ v ≤ b in cells of width w from lo (w a power of two). */
export interface CellGrid {
  readonly a: number;
  readonly b: number;
  readonly lo: number;
  readonly w: number;
}

/**
 * The cell pass: per cell k = ⌊u⌋ of the values in [a, b], with
 * u = (v − lo)/w the value in cell widths from the grid's origin, the count
 * and the sums of e, e², e³, e⁴ with e = u − (k + ½), the offset from the
 * cell's centre in cell widths (−½ ≤ e < ½). Dividing by the power of two w
 * is a multiplication by its exact inverse, and the offsets are scaled back
 * by exact powers of w (see `select.ts`). Centring each cell keeps every sum
 * small, so plain sums lose nothing that matters (see `cells.ts`). `whole`:
 * the grid spans every value, so the range test is left out. `sums`: 2
 * leaves out Σe³ and Σe⁴ (about a quarter of the pass's CPU), which are
 * then estimated within stated bounds (`cells.ts`).
 *
 * Working in cell widths computes ⌊u⌋ once, for both the key and the
 * offset.
 */
export function cellsSql(src: Values, grid: CellGrid, whole: boolean, sums: 2 | 4 = 4): string {
  const { a, b, lo, w } = grid;
  const rel = _finiteValues(src, whole ? [] : [`v >= ${num(a)}`, `v <= ${num(b)}`]);
  const scaled = `(SELECT (v - ${num(lo)}) * ${num(1 / w)} AS u FROM ${rel}) AS s2`;
  const keyed = `(SELECT floor(u) AS k, u FROM ${scaled}) AS s3`;
  const centred = `(SELECT k, u - (k + 0.5) AS e FROM ${keyed}) AS s4`;
  const powers = `(SELECT k, e, e * e AS e2 FROM ${centred}) AS s5`;
  const higher = sums === 4 ? `, sum(e2 * e) AS s3, sum(e2 * e2) AS s4` : "";
  return `SELECT k, CAST(count(*) AS DOUBLE) AS n, sum(e) AS s1, sum(e2) AS s2${higher} ` +
    `FROM ${powers} GROUP BY k ORDER BY k`;
}

/** A cell of one grid: the grid's index and the cell's key. */
export interface CellId {
  readonly grid: number;
  readonly key: number;
}

/**
 * The gather pass: the values of the chosen cells only (a filter on each
 * grid's cell key, so the scan does little more than read). They are few
 * (the cells that hold a wanted rank, an edge of the histogram, or values
 * the log series cannot sum), and are sorted where they arrive: the cells
 * are contiguous ranges of values whose counts are known, so the sorted
 * values fall into one block per cell, and every order statistic, edge
 * count and raw value is read off those blocks. No window function is needed.
 */
export function gatherSql(
  src: Values,
  grids: readonly CellGrid[],
  cells: readonly CellId[],
): string {
  return `SELECT v FROM (${_chosenCells(src, grids, cells)}) AS sel`;
}

/**
 * The values of some cells, with their grid g and key k: a filter on each
 * grid's key, so that a full scan does little more than read.
 */
function _chosenCells(src: Values, grids: readonly CellGrid[], cells: readonly CellId[]): string {
  const keyOf = (g: CellGrid) => `floor((v - ${num(g.lo)}) * ${num(1 / g.w)})`;
  // A value's grid: the last (finest) grid whose range holds it.
  const gridCase = grids.length === 1
    ? "0"
    : `CASE ${
      grids.map((g, i) => ({ g, i })).slice(1).reverse()
        .map(({ g, i }) => `WHEN v >= ${num(g.a)} AND v <= ${num(g.b)} THEN ${i}`).join(" ")
    } ELSE 0 END`;
  const keyCase = grids.length === 1
    ? keyOf(grids[0])
    : `CASE g ${grids.map((g, i) => `WHEN ${i} THEN ${keyOf(g)}`).join(" ")} END`;
  const filter = grids.map((_, i) => ({ i, keys: cells.filter((c) => c.grid === i) }))
    .filter((x) => x.keys.length > 0)
    .map(({ i, keys }) => `(g = ${i} AND k IN (${keys.map((c) => c.key).join(", ")}))`)
    .join(" OR ");
  const keyed = `(SELECT v, g, ${keyCase} AS k FROM (SELECT v, ${gridCase} AS g FROM ` +
    `${_finiteValues(src)}) AS s2) AS s3`;
  return `SELECT v, g, k FROM ${keyed} WHERE ${filter}`;
}

/** The smallest and largest value of each of some cells. Rows: (position in `cells`, min, max). */
export function probeSql(
  src: Values,
  grids: readonly CellGrid[],
  cells: readonly CellId[],
): string {
  const ids = cells.map((c, i) => `(${i}, ${c.grid}, ${c.key})`).join(", ");
  return `SELECT CAST(w.id AS DOUBLE) AS id, min(sel.v) AS lo, max(sel.v) AS hi FROM ` +
    `(${_chosenCells(src, grids, cells)}) AS sel JOIN (VALUES ${ids}) AS w(id, g, k) ` +
    `ON sel.g = w.g AND sel.k = w.k GROUP BY w.id`;
}

/**
 * Histogram counts in one pass, for the rare case where the bin edges are
 * known only after the gather pass: bin j holds lo + j·width ≤ v <
 * lo + (j + 1)·width (the last bin closed at the maximum); the first guess
 * ⌊(v − lo)/width⌋ is moved by one where rounding put it past an edge.
 * Rows: (bin, count).
 */
export function histogramSql(
  src: Values,
  lo: number,
  width: number,
  bins: number,
): string {
  const L = num(lo);
  const W = num(width);
  const guess = `least(${bins - 1}, greatest(0, floor((v - ${L}) / ${W})))`;
  const bin = `CASE WHEN b0 > 0 AND v < ${L} + b0 * ${W} THEN b0 - 1 ` +
    `WHEN b0 < ${bins - 1} AND v >= ${L} + (b0 + 1) * ${W} THEN b0 + 1 ELSE b0 END`;
  return `SELECT bin, CAST(count(*) AS DOUBLE) AS n FROM (SELECT ${bin} AS bin FROM ` +
    `(SELECT v, ${guess} AS b0 FROM ${_finiteValues(src)}) AS h0) AS h1 ` +
    `GROUP BY bin ORDER BY bin`;
}
