/**
 * The {@linkcode QueryEngine} of a scanned source: what `plumb`, `survey`
 * and `.by()` ask of it, answered through DuckDB. Private to `lib/scan`.
 *
 * Kept in one file because it is the one implementation of the protocol:
 * every method opens an engine, checks the names it is given against the
 * source and reads the same value expressions, and they are read side by
 * side with `lib/results/query_source.ts`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type {
  QueryColumn,
  QueryCounts,
  QueryEngine,
  QueryGroup,
  QueryRequest,
  QueryScreening,
  QueryTransform,
  RowRun,
} from "../results/query_source.ts";
import { _NUMERIC, _screen } from "./column.ts";
import type { Screened } from "./screen.ts";
import { _Engine } from "./engine.ts";
import { _progressReporter } from "./progress.ts";
import type { ScanOptions } from "./scan.ts";
import {
  cellExpr,
  describeSql,
  DUCKDB,
  groupCountsSql,
  groupExpr,
  groupRelation,
  reexpressedSql,
  residualRelation,
  valueExpr,
} from "./sql.ts";
import { presenceSql, rowRunsSql } from "./sql_survey.ts";

/** The most groups one `.by()` screens through a scan: each costs one screening. */
export const MAX_SCAN_GROUPS = 200;

/** Open an engine with the scan's options and its progress display. */
export function _openEngine(o: ScanOptions): Promise<_Engine> {
  const onProgress = o.progress === false
    ? undefined
    : typeof o.progress === "function"
    ? o.progress
    : _progressReporter();
  return _Engine.open({ ...o, onProgress });
}

/** The columns of `relation`, with their types. */
export async function _describe(
  engine: _Engine,
  relation: string,
  subject: string,
): Promise<{ name: string; type: string }[]> {
  const rows = await engine.rows(describeSql(relation), "reading the columns", subject);
  return rows.map((r) => ({ name: String(r[0]), type: String(r[1]) }));
}

function _kind(type: string): QueryColumn["kind"] {
  return _NUMERIC.test(type) ? "numeric" : /^VARCHAR$/i.test(type) ? "text" : "other";
}

/**
 * The engine `plumb`, `survey` and `.by()` use for a scanned source.
 *
 * @param relation the FROM-clause text of the source
 * @param name the source in words
 * @param options the scan's options
 */
export function scanQueryEngine(relation: string, name: string, options: ScanOptions): QueryEngine {
  const what = (column?: string) =>
    column === undefined ? name : `column ${JSON.stringify(column)} of ${name}`;
  return Object.freeze({
    name,
    async columns(): Promise<readonly QueryColumn[]> {
      const engine = await _Engine.open(options);
      try {
        const cols = await _describe(engine, relation, what());
        return cols.map((c) => Object.freeze({ ...c, kind: _kind(c.type) }));
      } finally {
        engine.close();
      }
    },
    async counts(columns: readonly string[]): Promise<readonly QueryCounts[]> {
      if (columns.length === 0) return [];
      const engine = await _Engine.open(options);
      try {
        const cols = await _describe(engine, relation, what());
        for (const c of columns) _known(cols, c, name);
        const which = columns.map((c) => {
          const type = cols.find((k) => k.name === c)!.type;
          return { name: c, textual: /^VARCHAR$/i.test(type), numeric: _NUMERIC.test(type) };
        });
        const [r] = await engine.rows(
          presenceSql(DUCKDB, relation, which),
          "counting the cells",
          what(),
        );
        const rows = Number(r[0]);
        return which.map((c, i) => {
          const [present, numeric, lo, hi, below, above] = r.slice(1 + 6 * i, 7 + 6 * i).map((
            x,
          ) => (x === null ? null : Number(x)));
          const censored = Object.freeze({ below: below!, above: above! });
          return Object.freeze({
            column: c.name,
            rows,
            missing: rows - present!,
            text: c.textual ? present! - numeric! - below! - above! : 0,
            censored,
            ...(lo === null || hi === null
              ? {}
              : { range: Object.freeze([Number(lo), Number(hi)] as const) }),
          });
        });
      } finally {
        engine.close();
      }
    },
    async rowRuns(
      columns: readonly string[],
      increasing: readonly string[],
    ): Promise<readonly RowRun[]> {
      if (columns.length === 0) return [];
      const engine = await _Engine.open(options);
      try {
        const cols = await _describe(engine, relation, what());
        for (const c of columns) _known(cols, c, name);
        const [r] = await engine.rows(
          rowRunsSql(
            DUCKDB,
            relation,
            columns.map((c) => ({
              v: _value(cols, c, undefined),
              increasing: increasing.includes(c),
            })),
          ),
          "reading the row order",
          what(),
        );
        const rows = Number(r[0]);
        return columns.map((c, i) => {
          const [a, b, f, d] = r.slice(1 + 4 * i, 5 + 4 * i).map((
            x,
          ) => (x === null ? NaN : Number(x)));
          const whole = rows > 0 && f === 0;
          // v − (row number) is the same whole number k − 1 on every row of a run from k.
          const runs = whole && a === b && Number.isInteger(a);
          return Object.freeze({
            name: c,
            rows,
            whole,
            runsFrom: runs ? a + 1 : null,
            increasing: whole && (rows === 1 || d > 0),
          });
        });
      } finally {
        engine.close();
      }
    },
    async groups(
      column: string,
      by: string,
      transform?: QueryTransform,
    ): Promise<readonly QueryGroup[]> {
      const engine = await _Engine.open(options);
      try {
        const all = await _describe(engine, relation, what());
        for (const c of [column, by]) _known(all, c, name);
        const v = _value(all, column, transform);
        const textual = /^VARCHAR$/i.test(all.find((c) => c.name === column)!.type);
        const rows = await engine.rows(
          groupCountsSql(
            DUCKDB,
            relation,
            cellExpr(column, textual),
            v,
            _groupOf(all, by),
            MAX_SCAN_GROUPS + 2,
          ),
          "counting the groups",
          what(by),
        );
        if (rows.filter((r) => r[0] !== null).length > MAX_SCAN_GROUPS) {
          throw new PlumbError(
            "too-many",
            `Cannot screen ${what(column)} by ${JSON.stringify(by)}: it has more than ` +
              `${MAX_SCAN_GROUPS} groups, and each group costs one screening; filter or bin ` +
              `the groups in an SQL query first`,
            { max: MAX_SCAN_GROUPS },
          );
        }
        return rows.map(([g, n, mean, missing, text]) =>
          Object.freeze({
            value: g === null ? null : String(g),
            n: Number(n),
            missing: Number(missing),
            text: Number(text),
            mean: mean === null ? NaN : Number(mean),
          })
        );
      } finally {
        engine.close();
      }
    },
    async screen(requests: readonly QueryRequest[]): Promise<(QueryScreening | Error)[]> {
      const engine = await _openEngine(options);
      try {
        const cols = await _describe(engine, relation, what());
        const out: (QueryScreening | Error)[] = [];
        for (const r of requests) {
          try {
            out.push(_plainScreening(await _one(engine, relation, cols, r, options, what)));
          } catch (e) {
            // Only the methods' refusals stay in place; engine failures and cancellation stop all.
            if (!(e instanceof PlumbError) || !_REFUSALS.has(e.code)) throw e;
            out.push(e);
          }
        }
        engine.finish();
        return out;
      } finally {
        engine.close();
      }
    },
  });
}

/**
 * The screening as the chain shows and exports it: the analysis without the
 * queries run and their timings (they differ from run to run, and the SQL
 * text would grow every saved table by kilobytes per group), keeping the
 * sample, counts and Box–Cox fit. `scan(...).analyse()` keeps them all.
 */
function _plainScreening(s: Screened): QueryScreening {
  const { passes: _p, fitSeconds: _f, ...rest } = s.analysis;
  const fit = s.analysis.boxCox;
  return {
    analysis: Object.freeze(rest),
    sample: s.sample,
    range: s.range,
    ...("lambda" in fit ? { lambda: fit.lambda } : {}),
  };
}

/**
 * The value expression a request reads: the column as a double (a text
 * column read as numbers), re-expressed by the engine when `transform` is
 * given. The relation stays as it is, so a text column keeps its text cells
 * apart from its empty ones (counted as text, refused unless `dropText`),
 * as in memory.
 */
function _value(
  cols: readonly { name: string; type: string }[],
  column: string,
  transform: QueryTransform | undefined,
): string {
  const type = cols.find((c) => c.name === column)!.type;
  const v = valueExpr(DUCKDB, column, /^VARCHAR$/i.test(type), 1);
  return transform === undefined ? v : reexpressedSql(v, transform.reexpression);
}

/** The group column `by` as text, its empty cells and missing-value tokens in no group. */
function _groupOf(cols: readonly { name: string; type: string }[], by: string): string {
  return groupExpr(by, /^VARCHAR$/i.test(cols.find((c) => c.name === by)!.type));
}

const _REFUSALS = new Set(["too-few", "constant", "non-numeric", "bad-option", "censored"]);

function _known(cols: readonly { name: string }[], column: string, name: string): void {
  if (cols.some((c) => c.name === column)) return;
  throw new PlumbError(
    "unknown-column",
    `No column named ${JSON.stringify(column)} in ${name}: it has ${
      cols.map((c) => JSON.stringify(c.name)).join(", ")
    }`,
  );
}

async function _one(
  engine: _Engine,
  relation: string,
  cols: { name: string; type: string }[],
  r: QueryRequest,
  options: ScanOptions,
  what: (column?: string) => string,
): Promise<Screened> {
  _known(cols, r.column, what());
  const v = _value(cols, r.column, r.transform);
  const transform = r.transform?.label;
  const o: ScanOptions = {
    ...options,
    dropText: r.dropText ?? options.dropText,
    qq: r.qq ?? options.qq,
  };
  if (r.residuals !== undefined) {
    const { by, means } = r.residuals;
    _known(cols, by, what());
    const res = residualRelation(DUCKDB, relation, r.column, v, _groupOf(cols, by), means);
    return await _screen(engine, res, [{ name: r.column, type: "DOUBLE" }], r.column, o, {
      subject: `${what(r.column)}, residuals within ${JSON.stringify(by)}`,
      label: r.label,
      transform,
    });
  }
  if (r.group !== undefined) {
    _known(cols, r.group.by, what());
    return await _screen(
      engine,
      groupRelation(relation, _groupOf(cols, r.group.by), r.group.value),
      cols,
      r.column,
      o,
      {
        subject: `${what(r.column)}, ${r.group.by} = ${r.group.value}`,
        label: r.label,
        group: r.group.value,
        transform,
        value: v,
      },
    );
  }
  return await _screen(engine, relation, cols, r.column, o, {
    subject: what(r.column),
    label: r.label,
    transform,
    value: v,
  });
}
