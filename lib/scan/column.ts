/**
 * Screening one numeric column of a relation through the engine: its type,
 * its counts (text cells, missing, NaN and ±Infinity), then the passes of
 * `screen.ts`. Private to `lib/scan`.
 *
 * @module
 */
import { limitWordSide } from "../data/censored_cell.ts";
import { PlumbError } from "../errors.ts";
import type { _Engine } from "./engine.ts";
import type { ScanOptions } from "./scan.ts";
import { type ColumnCounts, screenColumn, type Screened } from "./screen.ts";
import type { ColumnQuery } from "./select.ts";
import { cellExpr, DUCKDB, valueExpr } from "./sql.ts";
import { censoredLimitsSql, countsSql, quickCountsSql, textCellsSql } from "./sql_counts.ts";

export const _NUMERIC =
  /^(TINYINT|SMALLINT|INTEGER|BIGINT|HUGEINT|UTINYINT|USMALLINT|UINTEGER|UBIGINT|UHUGEINT|FLOAT|DOUBLE|REAL|DECIMAL.*)$/i;

/**
 * The column `name` of `relation` as the passes read it, with its counts
 * (text cells refused unless `dropText`, too few values or a constant
 * column refused): the first query of every screening. `value` is the
 * value expression when it is not the column itself (a re-expression of
 * it); cells where the column holds something and `value` is NULL count as
 * text.
 */
export async function _columnQuery(
  engine: _Engine,
  relation: string,
  cols: readonly { name: string; type: string }[],
  name: string,
  o: ScanOptions,
  subject: string,
  value?: string,
): Promise<{ q: ColumnQuery; counts: ColumnCounts }> {
  const type = cols.find((c) => c.name === name)!.type;
  const textual = /^VARCHAR$/i.test(type);
  if (!textual && !_NUMERIC.test(type)) {
    throw new PlumbError(
      "non-numeric",
      `Cannot screen ${subject}: its type is ${type}, not a number; pick a numeric column ` +
        `or convert it in an SQL query (e.g. SELECT CAST(x AS DOUBLE) AS x FROM …)`,
      { type },
    );
  }
  const v = value ?? valueExpr(DUCKDB, name, textual, 1);
  const cell = cellExpr(name, textual);
  // From the file's statistics when it can; a filtered pass when NaN or ±Infinity are present.
  let [c] = textual
    ? [[]]
    : await engine.rows(quickCountsSql(relation, name, v), "counting", subject);
  if (textual || !(Number.isFinite(c[4]) && Number.isFinite(c[5]))) {
    [c] = await engine.rows(
      countsSql(DUCKDB, relation, cell, v, textual),
      "counting",
      subject,
    );
  }
  const [rows, present, numeric, nonFinite] = c as number[];
  const [below, above] = [c[6], c[7]] as number[];
  if (below + above > 0) {
    await _refuseCensored(engine, relation, cell, v, subject, { present, below, above }, o);
  }
  const text = present - numeric;
  if (text > 0 && !o.dropText) {
    const shown = await engine.rows(
      textCellsSql(DUCKDB, relation, cell, v, 5),
      "finding text",
      subject,
    );
    throw new PlumbError(
      "non-numeric",
      `Cannot screen ${subject}: ${text} of ${present} cells are text, not numbers ` +
        `(${shown.map((r) => JSON.stringify(r[0])).join(", ")}${text > 5 ? ", …" : ""}` +
        `${_limitWordHint(shown.map((r) => String(r[0])), name)}); ` +
        `clean them, or pass { dropText: true } to leave them out (they are counted)`,
      { text },
    );
  }
  const n = numeric - nonFinite;
  const lo = c[4] as number;
  const hi = c[5] as number;
  _checkRange(subject, n, lo, hi);
  const keep = nonFinite > 0 ? "finite" : numeric < rows ? "present" : "all";
  const q: ColumnQuery = { engine, dialect: DUCKDB, relation, v, subject, keep };
  return { q, counts: { rows, missing: rows - present, text, nonFinite, n, lo, hi } };
}

/**
 * When a shown text cell is a limit word (`ND`, `<LOD`: below a limit that
 * the cell does not give), what to do: the in-memory reader takes the
 * column's limit (`detectionLimits`) and runs the censored analysis; the
 * screening through SQL cannot.
 */
function _limitWordHint(cells: readonly string[], column: string): string {
  const word = cells.find((c) => limitWordSide(c) !== null);
  if (word === undefined) return "";
  const below = limitWordSide(word) === -1;
  const limit = below ? "0.5" : "{ above: 300 }";
  return `; ${JSON.stringify(word)} says the value is ${below ? "below" : "above"} a limit ` +
    `without giving it, which the screening through SQL cannot take: load the column into ` +
    `memory with its limit, loadTable(path, { detectionLimits: { ${JSON.stringify(column)}: ` +
    `${limit} } }) with your limit in place of ${
      below ? "0.5" : "300"
    }, and plumb(table, column) ` +
    `runs the censored analysis`;
}

/**
 * Refuse a column with censored cells (`<0.5`, `>100`), whatever
 * `dropText` says: the screening through SQL reads measured values only,
 * and leaving out the cells below a limit (the smallest values) would bias
 * every result, so the message names the cells, their commonest limits and
 * the in-memory chain, which runs the censored analysis.
 */
async function _refuseCensored(
  engine: _Engine,
  relation: string,
  cell: string,
  v: string,
  subject: string,
  n: { present: number; below: number; above: number },
  o: ScanOptions,
): Promise<never> {
  const rows = await engine.rows(
    censoredLimitsSql(DUCKDB, relation, cell, v, 6),
    "finding the limits",
    subject,
  );
  const limits = rows.slice(0, 5).map(([side, limit, cells]) => ({
    side: Number(side) as -1 | 1,
    limit: Number(limit),
    cells: Number(cells),
  }));
  const shown = limits.map((l) => `${l.side === -1 ? "<" : ">"}${l.limit} (${l.cells})`)
    .join(", ") + (rows.length > 5 ? ", …" : "");
  const sides = [
    ...(n.below > 0 ? [`${n.below} below a limit`] : []),
    ...(n.above > 0 ? [`${n.above} above one`] : []),
  ].join(", ");
  throw new PlumbError(
    "censored",
    `Cannot screen ${subject}: ${n.below + n.above} of ${n.present} cells are censored ` +
      `(${sides}; limits with their cells: ${shown}), and the screening through SQL cannot ` +
      `take censored values yet: leaving them out would bias every result (the cells below a ` +
      `limit hold the smallest values)${
        o.dropText ? ", and { dropText: true } leaves out stray text, not censored cells" : ""
      }; load the column into memory, where plumb(table, column) runs the censored analysis ` +
      `(loadTable(path) for a file that fits, or a sample of its rows written to a file ` +
      `through an SQL query)`,
    { below: n.below, above: n.above, limits },
  );
}

/** Screen `name` of `relation` (its columns `cols` known) with one engine. */
export async function _screen(
  engine: _Engine,
  relation: string,
  cols: readonly { name: string; type: string }[],
  name: string,
  o: ScanOptions,
  label: {
    subject: string;
    label: string;
    group?: string;
    transform?: string;
    /** The value expression, when not the column as a double (a re-expression). */
    value?: string;
  },
): Promise<Screened> {
  const { q, counts } = await _columnQuery(
    engine,
    relation,
    cols,
    name,
    o,
    label.subject,
    label.value,
  );
  return await screenColumn(
    q,
    counts,
    { column: name, label: label.label, group: label.group, transform: label.transform },
    {
      sampleSize: o.sampleSize ?? 5000,
      seed: o.seed ?? 1,
      qq: o.qq ?? {},
      boxCox: o.boxCox ?? true,
      ...(o.exact === undefined ? {} : { exact: o.exact }),
    },
  );
}

export function _pick(cols: { name: string; type: string }[], column: string | undefined): string {
  if (column !== undefined) {
    if (cols.some((c) => c.name === column)) return column;
    throw new PlumbError(
      "unknown-column",
      `No column named ${JSON.stringify(column)}: the source has ${
        cols.map((c) => JSON.stringify(c.name)).join(", ")
      }`,
    );
  }
  const numeric = cols.filter((c) => _NUMERIC.test(c.type));
  if (numeric.length === 1) return numeric[0].name;
  throw new PlumbError(
    "bad-option",
    numeric.length === 0
      ? "The source has no numeric column to screen"
      : `The source has ${numeric.length} numeric columns (${
        numeric.map((c) => c.name).join(", ")
      }): name the one to screen, e.g. analyse("${numeric[0].name}")`,
  );
}

function _checkRange(subject: string, n: number, lo: number, hi: number): void {
  if (n < 4) {
    throw new PlumbError(
      "too-few",
      `Cannot screen ${subject}: it has ${n} finite number${
        n === 1 ? "" : "s"
      }; at least 4 are needed`,
      { n, min: 4 },
    );
  }
  if (lo === hi) {
    throw new PlumbError(
      "constant",
      `Cannot screen ${subject}: all ${n} values are ${lo}; a sample with no spread has no shape to test`,
      { value: lo },
    );
  }
  const big = Math.max(Math.abs(lo), Math.abs(hi));
  if (big > 2 ** 200 || hi - lo < 2 ** -200) {
    throw new PlumbError(
      "bad-option",
      `Cannot screen ${subject} through SQL: its magnitudes (up to ${big}, spread ${hi - lo}) ` +
        `would overflow fourth powers; rescale it in the query (e.g. SELECT x * 1e-100 AS x FROM …)`,
    );
  }
}

/**
 * Refuse a sample size or seed the sampled tests cannot use: Shapiro–Wilk's
 * p-value is calibrated for 3 to 5000 values (Royston 1995), and the
 * engine's repeatable sample takes a whole, non-negative seed.
 */
export function _checkSampleOptions(o: { sampleSize?: number; seed?: number }): void {
  const size = o.sampleSize;
  if (size !== undefined && !(Number.isInteger(size) && size >= 3 && size <= 5000)) {
    throw new PlumbError(
      "bad-option",
      `Cannot draw a sample of ${size} for the order-statistic tests: give a whole number from 3 ` +
        `to 5000 (Shapiro–Wilk's p-value is calibrated for at most 5000 values); the moments, ` +
        `QQ plot and histogram use every value whatever the sample size`,
    );
  }
  const seed = o.seed;
  if (seed !== undefined && !(Number.isInteger(seed) && seed >= 0)) {
    throw new PlumbError(
      "bad-option",
      `Cannot seed the sample with ${seed}: give a whole number of 0 or more`,
    );
  }
}
