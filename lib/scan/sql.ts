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
 * - approximate quantiles are not used: the order statistics are exact (a
 *   window `row_number()` over the few cells that hold the wanted ranks),
 *   so no engine's sketch error enters the QQ plot.
 *
 * Identifiers are always quoted; numbers are written as exponent literals with 17
 * significant digits, so that a bound sent to SQL is the double computed here.
 *
 * @module
 */

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
}

/** DuckDB's spelling. */
export const DUCKDB: Dialect = Object.freeze({
  name: "DuckDB",
  finite: (v: string) => `isfinite(${v})`,
  sample: (relation: string, size: number, seed: number) =>
    `SELECT * FROM ${relation} USING SAMPLE reservoir(${size} ROWS) REPEATABLE (${seed})`,
  tryDouble: (c: string) => `TRY_CAST(${c} AS DOUBLE)`,
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
 * The value expression analysed: the column as a double (`TRY_CAST` for a
 * text column), times an exact power of two when magnitudes are extreme.
 */
export function valueExpr(
  dialect: Dialect,
  column: string,
  textual: boolean,
  scale: number,
): string {
  const c = quoteIdent(column);
  const v = textual ? dialect.tryDouble(c) : `CAST(${c} AS DOUBLE)`;
  return scale === 1 ? v : `(${v} * ${num(scale)})`;
}

/**
 * Pass 0: rows, present cells, numbers, non-finite numbers, and the finite
 * range. For a text column, `present − numeric` cells hold text.
 */
export function countsSql(dialect: Dialect, relation: string, column: string, v: string): string {
  const f = dialect.finite("v");
  return `SELECT CAST(count(*) AS DOUBLE) AS total, CAST(count(c) AS DOUBLE) AS present, ` +
    `CAST(count(v) AS DOUBLE) AS numeric, ` +
    `CAST(count(*) FILTER (WHERE v IS NOT NULL AND NOT ${f}) AS DOUBLE) AS nonfinite, ` +
    `min(v) FILTER (WHERE ${f}) AS lo, max(v) FILTER (WHERE ${f}) AS hi ` +
    `FROM (SELECT ${quoteIdent(column)} AS c, ${v} AS v FROM ${relation}) AS s`;
}

/** A few cells of a text column that are not numbers, for the error message. */
export function textCellsSql(relation: string, column: string, v: string, limit: number): string {
  const c = quoteIdent(column);
  return `SELECT CAST(${c} AS VARCHAR) FROM ${relation} ` +
    `WHERE ${c} IS NOT NULL AND ${v} IS NULL LIMIT ${limit}`;
}

/** The finite values of the column, as a relation with the one column `v`. */
function _finiteValues(dialect: Dialect, relation: string, v: string, where = ""): string {
  return `(SELECT v FROM (SELECT ${v} AS v FROM ${relation}) AS s0 ` +
    `WHERE ${dialect.finite("v")}${where}) AS s1`;
}

/** The seeded sample of finite values. */
export function sampleSql(
  dialect: Dialect,
  relation: string,
  v: string,
  size: number,
  seed: number,
): string {
  return dialect.sample(_finiteValues(dialect, relation, v), size, seed);
}

/** One grid of cells: values a ≤ v ≤ b in cells of width w from lo (w a power of two). */
export interface CellGrid {
  readonly a: number;
  readonly b: number;
  readonly lo: number;
  readonly w: number;
}

/**
 * The cell pass: per cell k = ⌊(v − lo)/w⌋ of the values in [a, b], the
 * count, the smallest and largest value, and the sums of e, e², e³, e⁴ with
 * e = v − (lo + (k + ½)·w), the offset from the cell's centre (exact: lo is
 * a multiple of the power of two w). Centring each cell keeps every sum
 * small, so plain sums lose nothing that matters (see `cells.ts`).
 */
export function cellsSql(dialect: Dialect, relation: string, v: string, grid: CellGrid): string {
  const { a, b, lo, w } = grid;
  const rel = _finiteValues(dialect, relation, v, ` AND v >= ${num(a)} AND v <= ${num(b)}`);
  const keyed = `(SELECT v, floor((v - ${num(lo)}) / ${num(w)}) AS k FROM ${rel}) AS s2`;
  const centred = `(SELECT k, v, v - (${num(lo)} + (k + 0.5) * ${
    num(w)
  }) AS e FROM ${keyed}) AS s3`;
  const powers = `(SELECT k, v, e, e * e AS e2 FROM ${centred}) AS s4`;
  return `SELECT k, CAST(count(*) AS DOUBLE) AS n, min(v) AS lo, max(v) AS hi, ` +
    `sum(e) AS s1, sum(e2) AS s2, sum(e2 * e) AS s3, sum(e2 * e2) AS s4 ` +
    `FROM ${powers} GROUP BY k ORDER BY k`;
}

/** A closed range of values [lo, hi]. */
export interface ValueRange {
  readonly lo: number;
  readonly hi: number;
}

/** Some cells of one grid, by key. */
export interface CellChoice {
  readonly grid: CellGrid;
  readonly keys: readonly number[];
}

/**
 * The gather pass: the values of the chosen cells only (a filter on the
 * cell key, so the full scan does no more than the cell pass did), sorted
 * once by a window `row_number()`; returned are the values at the wanted
 * ranks within that selection, and every value inside the `raw` ranges.
 * Rows: (rank within the selection, v).
 */
export function gatherSql(
  dialect: Dialect,
  relation: string,
  v: string,
  chosen: readonly CellChoice[],
  wanted: readonly number[],
  raw: readonly ValueRange[],
): string {
  const filter = chosen.map(({ grid, keys }) =>
    `(v >= ${num(grid.a)} AND v <= ${num(grid.b)} AND ` +
    `floor((v - ${num(grid.lo)}) / ${num(grid.w)}) IN (${keys.join(", ")}))`
  ).join(" OR ");
  const sel = _finiteValues(dialect, relation, v, ` AND (${filter})`);
  const keep = [
    ...(wanted.length > 0 ? [`r IN (${wanted.join(", ")})`] : []),
    ...raw.map((r) => `(v >= ${num(r.lo)} AND v <= ${num(r.hi)})`),
  ];
  return `SELECT CAST(r AS DOUBLE) AS r, v FROM (SELECT v, row_number() OVER (ORDER BY v) AS r ` +
    `FROM ${sel}) AS ranked WHERE ${keep.join(" OR ")} ORDER BY r`;
}

/**
 * Histogram counts in one pass, for the rare case where the bin edges are
 * known only after the gather pass: bin j holds lo + j·width ≤ v <
 * lo + (j + 1)·width (the last bin closed at the maximum); the first guess
 * ⌊(v − lo)/width⌋ is moved by one where rounding put it past an edge.
 * Rows: (bin, count).
 */
export function histogramSql(
  dialect: Dialect,
  relation: string,
  v: string,
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
    `(SELECT v, ${guess} AS b0 FROM ${_finiteValues(dialect, relation, v)}) AS h0) AS h1 ` +
    `GROUP BY bin ORDER BY bin`;
}
