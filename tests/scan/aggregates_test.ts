/**
 * The aggregate interface, tested once and run on both implementations:
 * in memory (`memoryAggregates`) and through DuckDB
 * (`scan(...).aggregates(column)`), on the same values. Each answer is
 * checked against a reference computed here from the sorted values
 * (order statistics, counts below edges, the sample's draw rules) or
 * against the in-memory Box–Cox profile; moments against a compensated
 * two-pass written out in the test.
 *
 * @module
 */
import assert from "node:assert/strict";
import { DuckDBInstance } from "@duckdb/node-api";
import { scan } from "../../mod.ts";
import type { ColumnAggregates } from "../../lib/results/aggregates.ts";
import { memoryAggregates } from "../../lib/plumb/memory_aggregates.ts";
import { _boxCoxProfile } from "../../lib/reexpress/_profile.ts";
import { sortFloat64 } from "../../lib/numeric/sort.ts";
import { assertClose } from "../_assert_close.ts";

const _U = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;
const _Z = `sqrt(-2 * ln(${_U(0)})) * cos(2 * pi() * ${_U(7777777777)})`;
const N = 100_000;

/** Invented columns: a skewed fill volume, one sitting on 1e6, and gauge readings with ties. */
const _SHAPES: Record<string, { sql: string; positive: boolean }> = {
  lognormal: { sql: `500 * exp(0.3 * ${_Z})`, positive: true },
  "offset by 1e6": { sql: `1e6 + exp(${_Z})`, positive: true },
  "ties and a spike": {
    sql: `CASE WHEN i % 10 < 7 THEN 2.5 ELSE round(2 + ${_Z}, 1) END`,
    positive: false,
  },
};

async function _values(sql: string): Promise<Float64Array> {
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    return Float64Array.from((await con.runAndReadAll(sql)).getColumns()[0] as number[]);
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

/** Neumaier-compensated sum, written out for the reference moments. */
function _sum(terms: Iterable<number>): number {
  let s = 0, c = 0;
  for (const v of terms) {
    const t = s + v;
    c += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
    s = t;
  }
  return s + c;
}

function _below(sorted: Float64Array, e: number): number {
  let k = 0;
  while (k < sorted.length && sorted[k] < e) k++;
  return k;
}

/** Everything the interface promises, checked on one implementation. */
async function _check(a: ColumnAggregates, x: Float64Array, positive: boolean, what: string) {
  const s = sortFloat64(x);
  const n = s.length;
  assert.deepEqual(await a.range(), { n, min: s[0], max: s[n - 1] }, `${what}: range`);

  const mean = _sum(x) / n;
  const m = (j: number) => _sum(Array.from(x, (v) => (v - mean) ** j)) / n;
  const [m2, m3, m4] = [m(2), m(3), m(4)];
  const shape = await a.shape();
  assertClose(shape.mean, mean, { rel: 1e-12 }, `${what}: mean`);
  assertClose(shape.sd, Math.sqrt(m2 * n / (n - 1)), { rel: 1e-9 }, `${what}: sd`);
  assertClose(shape.g1, m3 / m2 ** 1.5, { rel: 1e-9, abs: 1e-12 }, `${what}: g1`);
  assertClose(shape.g2, m4 / (m2 * m2) - 3, { rel: 1e-9, abs: 1e-12 }, `${what}: g2`);

  const ranks = [1, 2, 3, 1000, n >> 2, n >> 1, (n >> 1) + 1, n - 1, n];
  assert.deepEqual(
    Array.from(await a.orderStatistics(ranks)),
    ranks.map((r) => s[r - 1]),
    `${what}: order statistics`,
  );

  const edges = [
    s[0] - 1,
    s[0],
    s[17],
    (s[n >> 1] + s[n - 1]) / 2,
    s[n >> 1],
    s[n - 1],
    s[n - 1] + 1,
  ]
    .sort((p, q) => p - q);
  assert.deepEqual(
    Array.from(await a.countsBelow(edges)),
    edges.map((e) => _below(s, e)),
    `${what}: counts below edges`,
  );

  const one = await a.sample(5000, 7);
  assert.equal(one.length, 5000, `${what}: sample size`);
  assert.deepEqual(one, sortFloat64(one), `${what}: sample sorted`);
  assert.deepEqual(await a.sample(5000, 7), one, `${what}: the same seed, the same sample`);
  assert.notDeepEqual(await a.sample(5000, 8), one, `${what}: another seed, another sample`);
  for (const v of one) assert.ok(s[_below(s, v)] === v, `${what}: ${v} is one of the values`);
  assert.deepEqual(await a.sample(n + 1, 7), s, `${what}: a sample as large as n is every value`);

  if (positive) {
    const mine = await a.boxCoxProfile();
    const ref = _boxCoxProfile(x);
    for (const l of [-1, 0, 0.5, 1]) {
      assertClose(mine.h(l), ref.h(l), { rel: 1e-9 }, `${what}: Box–Cox profile at λ = ${l}`);
    }
  }
}

for (const [name, { sql, positive }] of Object.entries(_SHAPES)) {
  const query = `SELECT ${sql} AS fill FROM range(${N}) t(i)`;
  Deno.test(`aggregates in memory: ${name}`, async () => {
    const x = await _values(query);
    await _check(memoryAggregates(x), x, positive, `memory, ${name}`);
  });
  Deno.test(`aggregates through DuckDB: ${name}`, async () => {
    const x = await _values(query);
    await _check(
      scan(query, { progress: false }).aggregates("fill"),
      x,
      positive,
      `DuckDB, ${name}`,
    );
  });
}
