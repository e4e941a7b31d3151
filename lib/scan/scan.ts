/**
 * `scan(pathOrSql)`: screen columns that do not fit in memory, through an
 * embedded DuckDB database, over Parquet or CSV files (globs allowed) or an
 * SQL query over them. Only aggregates, a seeded sample of 5000 and a few
 * hundred order statistics reach JavaScript.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { holmAdjust } from "../stats/multiplicity.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { QUERY_SOURCE, type QueryEngine, type QuerySource } from "../results/query_source.ts";
import type { _Engine, EngineOptions } from "./engine.ts";
import type { ScanAnalysis } from "./screen.ts";
import { _checkSampleOptions, _columnQuery, _pick, _screen } from "./column.ts";
import { _describe, _openEngine, scanQueryEngine } from "./query_engine.ts";
import { scanAggregates } from "./scan_aggregates.ts";
import type { ColumnAggregates } from "../results/aggregates.ts";
import { groupExpr, groupRelation, groupValuesSql } from "./sql.ts";
import { _relation, _relationIsQuery } from "./relation.ts";

/** Options for {@linkcode scan}. */
export interface ScanOptions extends Omit<EngineOptions, "onProgress"> {
  /**
   * Size of the seeded sample for Shapiro–Wilk, Shapiro–Francia,
   * Anderson–Darling and Lilliefors (3 to 5000).
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
   * The exact screening (`true`: one more pass, and Σe³, Σe⁴ summed in each
   * cell), or the lighter one (`false`: QQ values, bin counts, skewness and
   * kurtosis from the cells, within bounds stated in `precision` and last
   * in the reading; the sampled tests are the same).
   * @default exact up to 10,000,000 values, the lighter one above
   */
  readonly exact?: boolean;
  /**
   * Progress for scans longer than about two seconds: `true` shows it (a
   * line that updates in a notebook, on standard error in a terminal),
   * `false` hides it, a function receives the reports.
   * @default true
   */
  readonly progress?: boolean | EngineOptions["onProgress"];
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
export class ScanSource implements QuerySource {
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
    const cols = await this[QUERY_SOURCE].columns();
    return cols.map((c) => Object.freeze({ name: c.name, type: c.type }));
  }

  /**
   * What `plumb(source, column)`, `survey(source)` and `.by()` use: the
   * screening through DuckDB behind the same chain as in memory.
   */
  get [QUERY_SOURCE](): QueryEngine {
    // Captions name a file without its folders, as for a loaded table; DuckDB's messages keep the path.
    const s = this.pathOrSql.trim();
    const name = _relationIsQuery(s) ? this.#what() : s.split(/[\\/]/).pop()!;
    return scanQueryEngine(this.#relation, name, this.#options);
  }

  #what(column?: string): string {
    const s = this.pathOrSql.trim().replace(/\s+/g, " ");
    const src = s.length > 60 ? `${s.slice(0, 57)}…` : s;
    return column === undefined
      ? JSON.stringify(src)
      : `column ${JSON.stringify(column)} of ${JSON.stringify(src)}`;
  }

  /**
   * The aggregates of one numeric column (see `ColumnAggregates`): range, moments from
   * compensated central sums, exact order statistics at chosen ranks, counts below edges, a
   * seeded sample, the Box–Cox profile. Each call runs its own passes through DuckDB.
   *
   * @param column the column (the only numeric one when omitted)
   * @example
   * ```ts
   * import { scan } from "../../mod.ts";
   * const a = scan("SELECT i * 0.5 AS gap FROM range(1, 1001) t(i)", { progress: false }).aggregates();
   * const [median] = await a.orderStatistics([500]);
   * if (median !== 250 || (await a.shape()).mean !== 250.25) throw new Error("aggregates");
   * ```
   */
  aggregates(column?: string): ColumnAggregates {
    return scanAggregates(async () => {
      const engine = await this.#open();
      try {
        const cols = await this.#columns(engine);
        const name = _pick(cols, column);
        const o = this.#options;
        return {
          engine,
          ...(await _columnQuery(engine, this.#relation, cols, name, o, this.#what(name))),
        };
      } catch (e) {
        engine.close();
        throw e;
      }
    });
  }

  /**
   * Screen one numeric column (or the only one): counts, moments, every
   * test, the QQ plot, the histogram, the Box–Cox λ and the reading.
   */
  async analyse(column?: string): Promise<ScanAnalysis> {
    const engine = await this.#open();
    try {
      const cols = await this.#columns(engine);
      const name = _pick(cols, column);
      const { analysis: result } = await _screen(
        engine,
        this.#relation,
        cols,
        name,
        this.#options,
        {
          subject: this.#what(name),
          label: name,
        },
      );
      engine.finish();
      return result;
    } finally {
      engine.close();
    }
  }

  /**
   * Screen one numeric column within each group of another: one screening
   * per group (each group's values are read through a filter on the group
   * column, so the work grows with the number of groups), with Holm-adjusted
   * Shapiro–Wilk p-values across the groups.
   *
   * @param column the numeric column
   * @param group the column whose values define the groups (read as text; empty cells, and a
   *   text column's missing-value tokens such as "NA", form their own group)
   */
  async analyseBy(column: string, group: string): Promise<ScanGroups> {
    const engine = await this.#open();
    try {
      const cols = await this.#columns(engine);
      const name = _pick(cols, column);
      _pick(cols, group);
      const g = groupExpr(group, /^VARCHAR$/i.test(cols.find((c) => c.name === group)!.type));
      const values = await engine.rows(
        groupValuesSql(this.#relation, g, _MAX_GROUPS + 1),
        "listing the groups",
        this.#what(group),
      );
      if (values.length > _MAX_GROUPS) {
        throw new PlumbError(
          "bad-option",
          `Cannot screen ${this.#what(name)} by ${JSON.stringify(group)}: it has more than ` +
            `${_MAX_GROUPS} groups, and each group costs one screening; filter or bin the groups ` +
            `in an SQL query first`,
        );
      }
      const out: ScanGroup[] = [];
      for (const [v] of values) {
        const value = v === null ? null : String(v);
        const shown = value === null ? "(empty)" : value;
        out.push({
          value,
          analysis: (await _screen(
            engine,
            groupRelation(this.#relation, g, value),
            cols,
            name,
            this.#options,
            {
              subject: `${this.#what(name)}, ${group} = ${shown}`,
              label: `${name} | ${shown}`,
              group: shown,
            },
          )).analysis,
        });
      }
      engine.finish();
      return _groups(name, group, out);
    } finally {
      engine.close();
    }
  }

  #open(): Promise<_Engine> {
    return _openEngine(this.#options);
  }

  #columns(engine: _Engine): Promise<{ name: string; type: string }[]> {
    return _describe(engine, this.#relation, this.#what());
  }
}

/** The most groups `analyseBy` screens. */
const _MAX_GROUPS = 200;

/** One group of {@linkcode ScanSource.analyseBy}. */
export interface ScanGroup {
  /** The group's value as text, or null for empty cells. */
  readonly value: string | null;
  /** The group's screening. */
  readonly analysis: ScanAnalysis;
}

/** The screening of a column within each group. */
export interface ScanGroups {
  /** The numeric column screened. */
  readonly column: string;
  /** The column whose values define the groups. */
  readonly group: string;
  /** The groups, in the order of their values. */
  readonly groups: readonly ScanGroup[];
  /** Holm-adjusted Shapiro–Wilk p-values, aligned with `groups`. */
  readonly pAdjusted: readonly number[];
  /** The plain data above, for JSON. */
  toJSON(): unknown;
}

function _groups(column: string, group: string, groups: ScanGroup[]): ScanGroups {
  const pAdjusted = Object.freeze(holmAdjust(groups.map((g) => g.analysis.primary.pValue)));
  const frozen = Object.freeze(groups.map((g) => Object.freeze(g)));
  const data = { column, group, groups: frozen, pAdjusted };
  return Object.freeze({ ...data, toJSON: () => data });
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
  _checkSampleOptions(options);
  return new ScanSource(pathOrSql, options);
}
