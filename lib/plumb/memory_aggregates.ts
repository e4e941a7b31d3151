/**
 * The in-memory implementation of {@linkcode ColumnAggregates}: the same
 * computations the in-memory analysis runs (compensated central sums,
 * radix sort, the seeded subsample of `numeric/random.ts`, the Box–Cox
 * profile of `reexpress/_profile.ts`), answered through the interface the
 * SQL engine answers too.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { randomSubsample } from "../numeric/random.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import type {
  AggregateProfile,
  AggregateRange,
  AggregateShape,
  ColumnAggregates,
} from "../results/aggregates.ts";
import { _boxCoxProfile } from "../reexpress/_profile.ts";
import { _sampleShape } from "../stats/moments.ts";

/**
 * The aggregates of finite values held in memory.
 *
 * @param values finite numbers (not modified; at least 2, not all equal, for `shape`)
 * @returns the aggregates, computed on demand (the sort once)
 * @throws {PlumbError} `"non-finite"` when a value is NaN or ±Infinity
 * @example
 * ```ts
 * import { memoryAggregates } from "./memory_aggregates.ts";
 * const a = memoryAggregates(Float64Array.of(4, 1, 3, 2));
 * const q = await a.orderStatistics([1, 4]);
 * if (q.join() !== "1,4" || (await a.countsBelow([2.5])).join() !== "2") throw new Error("aggregates");
 * ```
 */
export function memoryAggregates(values: Float64Array): ColumnAggregates {
  const bad = values.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) {
    throw new PlumbError(
      "non-finite",
      `Cannot summarise the values: value ${bad + 1} is ${
        values[bad]
      }; leave out NaN and ±Infinity first`,
    );
  }
  let sorted: Float64Array | undefined;
  const sort = () => (sorted ??= sortFloat64(values));
  return Object.freeze({
    where: "memory",
    range(): Promise<AggregateRange> {
      const s = sort();
      return Promise.resolve({ n: s.length, min: s[0], max: s[s.length - 1] });
    },
    shape(): Promise<AggregateShape> {
      return Promise.resolve(_sampleShape(values, "the values"));
    },
    orderStatistics(ranks: readonly number[]): Promise<Float64Array> {
      const s = sort();
      return Promise.resolve(Float64Array.from(ranks, (r) => s[r - 1]));
    },
    countsBelow(edges: readonly number[]): Promise<Float64Array> {
      const s = sort();
      return Promise.resolve(Float64Array.from(edges, (e) => {
        let lo = 0;
        let hi = s.length;
        while (lo < hi) {
          const mid = (lo + hi) >>> 1;
          if (s[mid] < e) lo = mid + 1;
          else hi = mid;
        }
        return lo;
      }));
    },
    sample(size: number, seed: number): Promise<Float64Array> {
      return Promise.resolve(
        values.length <= size ? sort().slice() : sortFloat64(randomSubsample(values, size, seed)),
      );
    },
    boxCoxProfile(): Promise<AggregateProfile> {
      return Promise.resolve(_boxCoxProfile(values));
    },
  });
}
