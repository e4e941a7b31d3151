/**
 * Parquet and CSV files for the scan tests, written by DuckDB into a
 * temporary folder from deterministic formulas (pseudo-random numbers from
 * DuckDB's `hash` of the row number, turned into normal scores by the
 * Box–Muller transform), and the same values read back into memory for the
 * in-memory reference.
 *
 * @module
 */
import { DuckDBInstance } from "@duckdb/node-api";

const _U1 = `((hash(i) % 2147483629) + 0.5) / 2147483629.0`;
const _U2 = `((hash(i + 7777777777) % 2147483629) + 0.5) / 2147483629.0`;
const _Z = `sqrt(-2 * ln(${_U1})) * cos(2 * pi() * ${_U2})`;

/** The test columns, as SQL expressions of the row number i. */
export const SHAPES = {
  lognormal: `10 * exp(0.3 * ${_Z})`,
  offsetNormal: `1e6 + ${_Z}`,
  exponential: `-ln(${_U1})`,
  /** 70% of the values at 5.0, one far outlier, the rest normal around 5. */
  spikeOutlier: `CASE WHEN i = 3 THEN 1e9 WHEN i % 10 < 7 THEN 5.0 ELSE 5 + ${_Z} END`,
} as const;

/** Write `n` rows of one shape to a Parquet file; returns its path and the values in memory. */
export async function writeShape(
  dir: string,
  shape: keyof typeof SHAPES,
  n: number,
): Promise<{ path: string; values: Float64Array }> {
  const path = `${dir}/${shape}.parquet`;
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    await con.run(
      `COPY (SELECT ${SHAPES[shape]} AS x FROM range(${n}) t(i)) TO '${path}' (FORMAT parquet)`,
    );
    const r = await con.runAndReadAll(`SELECT x FROM read_parquet('${path}')`);
    return { path, values: Float64Array.from(r.getColumns()[0] as number[]) };
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}
