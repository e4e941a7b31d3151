/**
 * `scan(pathOrSql)`: screen columns that do not fit in memory, through an
 * embedded DuckDB database, over Parquet or CSV files (globs allowed) or an
 * SQL query over them. Only aggregates, a seeded sample of 5000 and a few
 * hundred order statistics reach JavaScript.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { _Engine, type EngineOptions } from "./engine.ts";
import { _progressReporter } from "./progress.ts";
import { type ScanAnalysis, screenColumn } from "./screen.ts";
import {
  countsSql,
  describeSql,
  DUCKDB,
  quickCountsSql,
  quoteText,
  textCellsSql,
  valueExpr,
} from "./sql.ts";
import type { ColumnQuery } from "./select.ts";

/** Options for {@linkcode scan}. */
export interface ScanOptions extends Omit<EngineOptions, "onProgress"> {
  /**
   * Size of the seeded sample for Shapiro–Wilk, Shapiro–Francia,
   * Anderson–Darling and Lilliefors.
   * @default 5000
   */
  readonly sampleSize?: number;
  /**
   * Seed of the sample; the same seed gives the same sample.
   * @default 1
   */
  readonly seed?: number;
  /**
   * Leave out text cells of a text column (counted in the result) instead
   * of failing with a `"non-numeric"` error.
   * @default false
   */
  readonly dropText?: boolean;
  /**
   * Fit the Box–Cox λ (positive data only).
   * @default true
   */
  readonly boxCox?: boolean;
  /**
   * QQ envelope options.
   * @default {}
   */
  readonly qq?: QqOptions;
  /**
   * Progress for scans longer than about two seconds: `true` shows it (a
   * line that updates in a notebook, on standard error in a terminal),
   * `false` hides it, a function receives the reports.
   * @default true
   */
  readonly progress?: boolean | EngineOptions["onProgress"];
}

const _NUMERIC =
  /^(TINYINT|SMALLINT|INTEGER|BIGINT|HUGEINT|UTINYINT|USMALLINT|UINTEGER|UBIGINT|UHUGEINT|FLOAT|DOUBLE|REAL|DECIMAL.*)$/i;

/** The FROM-clause text for a path or a query. */
function _relation(pathOrSql: string): string {
  const s = pathOrSql.trim();
  if (/^(select|with|from|values)\b/i.test(s) || s.startsWith("(")) return `(${s}) AS src`;
  if (/\.parquet$/i.test(s)) return `read_parquet(${quoteText(s)})`;
  if (/\.(csv|tsv|txt)(\.gz)?$/i.test(s)) return `read_csv(${quoteText(s)})`;
  throw new PlumbError(
    "bad-option",
    `Cannot tell what to scan in ${JSON.stringify(s)}: give a path ending in .parquet, .csv, ` +
      `.tsv or .txt (globs such as "data/*.parquet" allowed), or an SQL query starting with SELECT`,
  );
}

/**
 * A table read through DuckDB. Create it with {@linkcode scan}.
 *
 * @example
 * ```ts
 * import { scan } from "../../mod.ts";
 * const src = scan("SELECT 10 + sin(i) * 2 AS fill FROM range(1, 20001) t(i)", { progress: false });
 * const a = await src.analyse("fill");
 * if (a.n !== 20000 || a.sample.size !== 5000) throw new Error("scan");
 * ```
 */
export class ScanSource {
  /** What was asked for: the path or the query. */
  readonly pathOrSql: string;
  readonly #relation: string;
  readonly #options: ScanOptions;

  /** @internal Use {@linkcode scan}. */
  constructor(pathOrSql: string, options: ScanOptions) {
    this.pathOrSql = pathOrSql;
    this.#relation = _relation(pathOrSql);
    this.#options = options;
    Object.freeze(this);
  }

  /** The source's columns and their SQL types. */
  async columns(): Promise<{ readonly name: string; readonly type: string }[]> {
    const engine = await _Engine.open(this.#options);
    try {
      const rows = await engine.rows(
        describeSql(this.#relation),
        "reading the columns",
        this.#what(),
      );
      return rows.map((r) => Object.freeze({ name: String(r[0]), type: String(r[1]) }));
    } finally {
      engine.close();
    }
  }

  #what(column?: string): string {
    const s = this.pathOrSql.trim().replace(/\s+/g, " ");
    const src = s.length > 60 ? `${s.slice(0, 57)}…` : s;
    return column === undefined
      ? JSON.stringify(src)
      : `column ${JSON.stringify(column)} of ${JSON.stringify(src)}`;
  }

  /**
   * Screen one numeric column (or the only one): counts, moments, every
   * test, the QQ plot, the histogram, the Box–Cox λ and the reading.
   */
  async analyse(column?: string): Promise<ScanAnalysis> {
    const o = this.#options;
    const onProgress = o.progress === false
      ? undefined
      : typeof o.progress === "function"
      ? o.progress
      : _progressReporter();
    const engine = await _Engine.open({ ...o, onProgress });
    try {
      const cols =
        (await engine.rows(describeSql(this.#relation), "reading the columns", this.#what()))
          .map((r) => ({ name: String(r[0]), type: String(r[1]) }));
      const name = _pick(cols, column);
      const subject = this.#what(name);
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
      const v = valueExpr(DUCKDB, name, textual, 1);
      // From the file's statistics when it can; a filtered pass when NaN or ±Infinity are present.
      let [c] = textual
        ? [[]]
        : await engine.rows(quickCountsSql(this.#relation, name, v), "counting", subject);
      if (textual || !(Number.isFinite(c[4]) && Number.isFinite(c[5]))) {
        [c] = await engine.rows(countsSql(DUCKDB, this.#relation, name, v), "counting", subject);
      }
      const [rows, present, numeric, nonFinite] = c as number[];
      const text = present - numeric;
      if (text > 0 && !o.dropText) {
        const shown = await engine.rows(
          textCellsSql(this.#relation, name, v, 5),
          "finding text",
          subject,
        );
        throw new PlumbError(
          "non-numeric",
          `Cannot screen ${subject}: ${text} of ${present} cells are text, not numbers ` +
            `(${shown.map((r) => JSON.stringify(r[0])).join(", ")}${text > 5 ? ", …" : ""}); ` +
            `clean them, or pass { dropText: true } to leave them out (they are counted)`,
          { text },
        );
      }
      const n = numeric - nonFinite;
      const lo = c[4] as number;
      const hi = c[5] as number;
      _checkRange(subject, n, lo, hi);
      const keep = nonFinite > 0 ? "finite" : numeric < rows ? "present" : "all";
      const q: ColumnQuery = {
        engine,
        dialect: DUCKDB,
        relation: this.#relation,
        v,
        subject,
        keep,
      };
      const result = await screenColumn(
        q,
        { rows, missing: rows - present, text, nonFinite, n, lo, hi },
        { column: name, label: name },
        {
          sampleSize: o.sampleSize ?? 5000,
          seed: o.seed ?? 1,
          qq: o.qq ?? {},
          boxCox: o.boxCox ?? true,
        },
      );
      engine.finish();
      return result;
    } finally {
      engine.close();
    }
  }
}

function _pick(cols: { name: string; type: string }[], column: string | undefined): string {
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
 * A table too large for memory, screened through an embedded DuckDB
 * database: a Parquet or CSV path (globs allowed) or an SQL query over
 * such files. Nothing is read until a column is analysed.
 *
 * @param pathOrSql a path ending in .parquet, .csv, .tsv or .txt, or a query starting with SELECT
 * @param options sample size and seed, engine limits, progress, cancellation
 * @example
 * ```ts
 * import { scan } from "../../mod.ts";
 * const a = await scan("SELECT exp(sin(i)) AS gap FROM range(1, 5001) t(i)", { progress: false })
 *   .analyse();
 * if (a.origin.column !== "gap" || !("lambda" in a.boxCox)) throw new Error("scan");
 * ```
 */
export function scan(pathOrSql: string, options: ScanOptions = {}): ScanSource {
  if (typeof pathOrSql !== "string" || pathOrSql.trim() === "") {
    throw new PlumbError(
      "bad-option",
      "Cannot scan an empty source: give a Parquet or CSV path, or an SQL query",
    );
  }
  return new ScanSource(pathOrSql, options);
}
