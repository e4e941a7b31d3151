/**
 * QQ values and histogram counts read from the cells (no gather pass)
 * against the exact ones: every value within the stated error of the exact
 * order statistic of the same values in memory, every bin count within the
 * stated count error; moments, tests and λ unchanged; the note in the
 * reading. And the histogram's pile-up rule on scanned columns, both ways.
 *
 * @module
 */
import assert from "node:assert/strict";
import { scan } from "../../mod.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { sortFloat64 } from "../../lib/numeric/sort.ts";
import { DuckDBInstance } from "@duckdb/node-api";
import { writeShape } from "./_data.ts";
import { assertClose } from "../_assert_close.ts";

const N = 200_000;
const quiet = { progress: false } as const;

/** How many values lie in [a, b) (the last bin closed at b). */
function countIn(sorted: Float64Array, a: number, b: number, last: boolean): number {
  const below = (e: number, strict: boolean) => {
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (strict ? sorted[mid] < e : sorted[mid] <= e) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  return below(b, !last) - below(a, true);
}

for (const shape of ["lognormal", "offsetNormal", "exponential", "spikeOutlier"] as const) {
  Deno.test(`QQ values and bin counts from cells stay within their stated error: ${shape}`, async () => {
    const dir = await Deno.makeTempDir();
    try {
      const { path, values } = await writeShape(dir, shape, N);
      const sorted = sortFloat64(values);
      const cells = await scan(path, { ...quiet, exact: false }).analyse("x");
      const exact = await scan(path, { ...quiet, exact: true }).analyse("x");
      assert.equal(exact.precision.exact, true);
      assert.equal(exact.precision.maxValueError, 0);
      assert.equal(exact.origin.notes, undefined);
      const r = cells.precision;
      assert.equal(r.exact, false);
      // No gather pass, except for the raw values near zero the log series cannot sum.
      const gathered = cells.passes.some((p) => p.step === "gathering order statistics");
      assert.equal(gathered, shape === "exponential");
      // The bounds are real and useful: positive, and small beside the spread.
      const span = sorted[N - 1] - sorted[0];
      assert.ok(r.maxValueError < span / 5000, `${r.maxValueError}`);
      assert.ok(r.maxCountError < N / 100, `${r.maxCountError}`);
      // (The spike's bins, stretched by its far outlier, cut no cell of more than one value.)
      if (shape !== "spikeOutlier") assert.ok(r.maxValueError > 0 && r.maxCountError > 0);
      // Every QQ value within the stated error of the exact order statistic.
      assert.deepEqual(cells.qq.rank, exact.qq.rank);
      let worst = 0;
      cells.qq.rank.forEach((rank, i) => {
        const off = Math.abs(cells.qq.value[i] - sorted[rank - 1]);
        worst = Math.max(worst, off);
        assert.ok(off <= r.maxValueError, `rank ${rank}: off by ${off} > ${r.maxValueError}`);
      });
      assert.deepEqual(exact.qq.value, Array.from(exact.qq.rank, (k) => sorted[k - 1]));
      // Every bin count within the stated count error of the count of the values in memory.
      const h = cells.histogram;
      assert.equal(h.counts.reduce((t, c) => t + c, 0), N);
      h.counts.forEach((c, j) => {
        const truth = countIn(sorted, h.edges[j], h.edges[j + 1], j === h.counts.length - 1);
        assert.ok(
          Math.abs(c - truth) <= r.maxCountError,
          `bin ${j}: ${c} against ${truth} (stated ${r.maxCountError})`,
        );
      });
      // Mean and sd are exact either way; skewness and kurtosis within their stated bounds.
      // (The cells may be split differently, so the sums add in another order.)
      assertClose(cells.moments.mean, exact.moments.mean, { rel: 1e-13 }, "mean");
      assertClose(cells.moments.sd, exact.moments.sd, { rel: 1e-13 }, "sd");
      const dg1 = Math.abs(cells.moments.g1 - exact.moments.g1);
      const dg2 = Math.abs(cells.moments.g2 - exact.moments.g2);
      assert.equal(exact.precision.maxSkewnessError, 0);
      assert.ok(r.maxSkewnessError > 0 && r.maxSkewnessError < 1e-9, `${r.maxSkewnessError}`);
      assert.ok(dg1 <= r.maxSkewnessError, `g1 off by ${dg1} > ${r.maxSkewnessError}`);
      assert.ok(dg2 <= r.maxKurtosisError, `g2 off by ${dg2} > ${r.maxKurtosisError}`);
      // The sampled tests are the same; the moment tests move only within those bounds.
      assert.deepEqual(cells.tests.slice(0, 4), exact.tests.slice(0, 4));
      assert.equal(cells.reading.verdict, exact.reading.verdict);
      // The Box–Cox λ moves with the estimated within-cell sums only (measured: 0 to 1.5e-14).
      if ("lambda" in exact.boxCox) {
        assert.ok("lambda" in cells.boxCox);
        const dl = Math.abs(cells.boxCox.lambda - exact.boxCox.lambda);
        assert.ok(dl <= 1e-9, `λ off by ${dl}`);
      }
      // The reading says so, last: how the figures were read, not what they show.
      const last = cells.reading.points[cells.reading.points.length - 1];
      assert.match(
        last,
        /^The QQ values, bin counts, skewness and kurtosis come from [\d,]+ cells counted in one pass .* not from a sort/,
      );
      assert.match(
        last,
        /far inside their sampling error \(the exact screening: scan\(…, \{ exact: true \}\)\)$/,
      );
      assert.equal(cells.origin.notes, undefined);
      assert.ok(!exact.reading.points.some((p) => p.includes("not from a sort")));
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  });
}

Deno.test("a scan reads exact order statistics by default up to 10 million values", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const { path } = await writeShape(dir, "lognormal", 20_000);
    const a = await scan(path, quiet).analyse("x");
    assert.equal(a.precision.exact, true);
    assert.ok(a.passes.some((p) => p.step === "gathering order statistics"));
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

/** 30% of the values at 2.5, the rest uniform on (0, 10): the pile-up sits inside the IQR. */
async function writePileUp(
  dir: string,
  n: number,
): Promise<{ path: string; values: Float64Array }> {
  const path = `${dir}/pile.parquet`;
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  try {
    await con.run(
      `COPY (SELECT CASE WHEN i % 10 < 3 THEN 2.5 ELSE ` +
        `((hash(i) % 2147483629) + 0.5) / 2147483629.0 * 10 END AS x ` +
        `FROM range(${n}) t(i)) TO '${path}' (FORMAT parquet)`,
    );
    const r = await con.runAndReadAll(`SELECT x FROM read_parquet('${path}')`);
    return { path, values: Float64Array.from(r.getColumns()[0] as number[]) };
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

Deno.test("scanned histograms follow the pile-up rule as in memory", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const { path, values } = await writePileUp(dir, 100_000);
    const mem = analyse(values, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
    assert.equal(mem.histogram.rule, "scott");
    const exact = await scan(path, quiet).analyse("x");
    assert.equal(exact.histogram.rule, "scott");
    assert.equal(exact.histogram.ruleNote, mem.histogram.ruleNote);
    assert.deepEqual(exact.histogram.edges, mem.histogram.edges);
    assert.deepEqual(exact.histogram.counts, mem.histogram.counts);
    const cells = await scan(path, { ...quiet, exact: false }).analyse("x");
    assert.equal(cells.histogram.rule, "scott");
    assert.equal(cells.histogram.ruleNote, mem.histogram.ruleNote);
    assert.match(cells.histogram.ruleNote, /30% of the values sit at one value/);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

/** Values recorded to 0.1 (with `odd`, when given, one value off that grid), written by DuckDB. */
async function writeRounded(
  dir: string,
  n: number,
  odd: number | null,
): Promise<{ path: string; values: Float64Array }> {
  const path = `${dir}/rounded_${odd}.parquet`;
  const inst = await DuckDBInstance.create(":memory:");
  const con = await inst.connect();
  const u = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;
  const z = `sqrt(-2 * ln(${u(0)})) * cos(2 * pi() * ${u(99)})`;
  try {
    await con.run(
      `COPY (SELECT CASE WHEN ${odd !== null} AND i = 777 THEN ${odd ?? 0} ` +
        `ELSE round(10 + 0.8 * ${z}, 1) END ` +
        `AS x FROM range(${n}) t(i)) TO '${path}' (FORMAT parquet)`,
    );
    const r = await con.runAndReadAll(`SELECT x FROM read_parquet('${path}')`);
    return { path, values: Float64Array.from(r.getColumns()[0] as number[]) };
  } finally {
    con.closeSync();
    inst.closeSync();
  }
}

Deno.test("scanned histograms follow the measurement step, found on the sample and checked on every value", async () => {
  const dir = await Deno.makeTempDir();
  try {
    // On 0.1; one reading to 0.01 among them (the step becomes 0.01, in memory and here); one
    // value on no grid (no step).
    for (const [odd, step] of [[null, 0.1], [10.03, 0.01], [10.0314159265, null]] as const) {
      const { path, values } = await writeRounded(dir, 100_000, odd);
      const mem = analyse(values, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
      const a = await scan(path, quiet).analyse("x");
      assert.ok(a.passes.some((p) => p.step === "checking the measurement step"));
      assert.equal(a.histogram.step, mem.histogram.step, `odd ${odd}`);
      assert.equal(a.histogram.step, step);
      assert.deepEqual(a.histogram.edges, mem.histogram.edges);
      assert.deepEqual(a.histogram.counts, mem.histogram.counts);
      assert.equal(a.histogram.ruleNote, mem.histogram.ruleNote);
      // The reading speaks of the same recording step (its other figures come from the sample).
      const stepWords = (points: readonly string[]) => points.filter((t) => /step/i.test(t));
      assert.deepEqual(
        stepWords(a.reading.points).map((t) => t.split(":")[0]),
        stepWords(mem.reading.points).map((t) => t.split(":")[0]),
      );
      // The value off the sample's grid is read, and the step sought again with it.
      const checks = a.passes.filter((p) => p.step === "checking the measurement step").length;
      assert.equal(checks, odd === null ? 1 : odd === 10.03 ? 2 : 1);
    }
    // Continuous values pay nothing for it.
    const { path } = await writeShape(dir, "lognormal", 50_000);
    const c = await scan(path, quiet).analyse("x");
    assert.ok(!c.passes.some((p) => p.step === "checking the measurement step"));
    assert.equal(c.histogram.step, null);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
