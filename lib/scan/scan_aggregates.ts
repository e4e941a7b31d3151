/**
 * The SQL engine's implementation of {@linkcode ColumnAggregates}: each
 * answer from passes over the column inside DuckDB (cells of centred power
 * sums, a filtered gather of exact order statistics, a seeded reservoir
 * sample), with only aggregates and the chosen values brought back. Each
 * call opens its own connection and runs its own passes; the screening
 * (`screen.ts`) shares one cell pass and one gather between the moments,
 * the QQ points, the histogram and the log series instead. Private to
 * `lib/scan`; `scan(...).aggregates(column)` hands it out.
 *
 * @module
 */
import type {
  AggregateProfile,
  AggregateRange,
  AggregateShape,
  ColumnAggregates,
} from "../results/aggregates.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { cellShape } from "./cells.ts";
import type { _Engine } from "./engine.ts";
import { cellBoxCoxProfile, seriesHolds } from "./log_profile.ts";
import type { ColumnCounts } from "./screen.ts";
import { type ColumnQuery, gather, summarise } from "./select.ts";
import { sampleSql } from "./sql.ts";

/** How a call gets the column: an open engine, the column's query and its counts. */
export type _ColumnOpener = () => Promise<{
  readonly engine: _Engine;
  readonly q: ColumnQuery;
  readonly counts: ColumnCounts;
}>;

/**
 * The aggregates of one column through the engine.
 *
 * @param open opens an engine and counts the column (closed after each call)
 */
export function scanAggregates(open: _ColumnOpener): ColumnAggregates {
  const run = async <T>(f: (q: ColumnQuery, c: ColumnCounts) => Promise<T>): Promise<T> => {
    const { engine, q, counts } = await open();
    try {
      return await f(q, counts);
    } finally {
      engine.close();
    }
  };
  return Object.freeze({
    where: "DuckDB",
    range: (): Promise<AggregateRange> =>
      run((_q, c) => Promise.resolve({ n: c.n, min: c.lo, max: c.hi })),
    shape: (): Promise<AggregateShape> =>
      run(async (q, c) => cellShape((await summarise(q, c.lo, c.hi, [], false)).cells)),
    orderStatistics: (ranks: readonly number[]): Promise<Float64Array> =>
      run(async (q, c) => {
        const s = await summarise(q, c.lo, c.hi, ranks, false);
        return (await gather(q, s, ranks, false, [])).values;
      }),
    countsBelow: (edges: readonly number[]): Promise<Float64Array> =>
      run(async (q, c) => {
        const s = await summarise(q, c.lo, c.hi, [], false);
        return (await gather(q, s, [], false, edges)).below;
      }),
    sample: (size: number, seed: number): Promise<Float64Array> =>
      run(async (q) =>
        sortFloat64(
          await q.engine.doubles(sampleSql(q, size, seed), "drawing the sample", q.subject),
        )
      ),
    boxCoxProfile: (): Promise<AggregateProfile> =>
      run(async (q, c) => {
        const s = await summarise(q, c.lo, c.hi, [], true);
        const raw = (await gather(q, s, [], true, [])).raw;
        return cellBoxCoxProfile(s.cells.filter(seriesHolds), raw);
      }),
  });
}
