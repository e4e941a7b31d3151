/**
 * `screenFromAnswers`: the one assembly behind the in-memory `analyse` and
 * the scanned screening. Which test runs on what, the notes a sample brings
 * and the rows a source without them gives, checked against the public
 * functions on the same values.
 */
import { deepEqual, equal, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { selectFromSorted } from "../../lib/numeric/select.ts";
import { sortFloat64 } from "../../lib/numeric/sort.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { screenFromAnswers, type ScreeningAnswers } from "../../lib/plumb/screening.ts";
import { andersonDarling } from "../../lib/stats/anderson_darling.ts";
import { NORMALITY_TESTS, prepareSample } from "../../lib/stats/battery.ts";
import { dagostinoPearson } from "../../lib/stats/dagostino_pearson.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { jarqueBera } from "../../lib/stats/jarque_bera.ts";
import { lilliefors } from "../../lib/stats/lilliefors.ts";
import { _sampleShape } from "../../lib/stats/moments.ts";
import { shapiroFrancia } from "../../lib/stats/shapiro_francia.ts";
import { shapiroWilk } from "../../lib/stats/shapiro_wilk.ts";

const ORIGIN = { label: "x", column: "x", missingDropped: 0, textDropped: 0 };

/** Lognormal values with a far outlier, so the reading names rows when it knows them. */
function skewed(n: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  const x = Float64Array.from({ length: n }, () => Math.exp(rng.normal()));
  x[7] = 400;
  return x;
}

/** The answers a source without rows gives: every value known to it, a sorted sample handed over. */
function engineAnswers(all: Float64Array, sample: Float64Array, seed: number): ScreeningAnswers {
  const sorted = sortFloat64(all.slice());
  return {
    n: all.length,
    shape: _sampleShape(all, "x"),
    orderStatistics: (ranks) => ({
      value: Float64Array.from(ranks, (r) => sorted[r - 1]),
      row: new Int32Array(ranks.length).fill(-1),
    }),
    histogram: () => histogramData(all),
    values: { sample, seed, drawnBy: "the test's engine" },
  };
}

Deno.test("the moment tests, and only they, are answered from n and the moment summary", () => {
  const x = skewed(300, 3);
  const shape = _sampleShape(x, "x");
  const prepared = prepareSample(x, sortFloat64(x.slice()), shape);
  const fromShape = NORMALITY_TESTS.filter((t) => t.fromShape);
  deepEqual(fromShape.map((t) => t.name), ["D'Agostino–Pearson", "Jarque–Bera"]);
  for (const t of fromShape) deepEqual(t.fromShape!(x.length, shape), t.runPrepared(prepared));
});

Deno.test("a sample smaller than n: the order-statistic tests run on it and say so", () => {
  const x = skewed(3000, 5);
  const rng = seededRandom(9);
  const sample = sortFloat64(Float64Array.from({ length: 400 }, () => x[rng.integer(x.length)]));
  const a = screenFromAnswers(engineAnswers(x, sample, 9), ORIGIN);
  const note = "Shapiro–Wilk, Shapiro–Francia, Anderson–Darling and Lilliefors use a seeded " +
    "random subsample of 400 of the 3000 values (drawn by the test's engine); the moments, " +
    "D'Agostino–Pearson, Jarque–Bera, the QQ plot and the histogram use all 3000";
  const onSample = [shapiroWilk, shapiroFrancia, andersonDarling, lilliefors];
  onSample.forEach((f, j) => {
    const own = f(sample);
    deepEqual(a.tests[j].result, { ...own, warnings: [note, ...own.warnings] }, own.test);
  });
  deepEqual(a.primary, a.tests[0].result);
  deepEqual(a.tests[4].result, dagostinoPearson(x));
  deepEqual(a.tests[5].result, jarqueBera(x));
  deepEqual(a.subsample, { size: 400, seed: 9 });
  equal(a.n, 3000);
  equal(a.qq.n, 3000);
  equal(a.histogram.n, 3000);
  ok(a.qq.row.every((r) => r === -1), "the source knows no rows");
});

Deno.test("a sample of every value: no note, no subsample, the same tests as in memory", () => {
  // Sorted values, so that the moment summary of the sample and of the values agree to the bit.
  const x = sortFloat64(skewed(800, 6));
  const a = screenFromAnswers(engineAnswers(x, x, 2), ORIGIN);
  const b = analyse(x, ORIGIN);
  equal(a.subsample, null);
  deepEqual(a.tests, b.tests);
  deepEqual(a.primary, b.primary);
  deepEqual(a.moments, b.moments);
  deepEqual(a.qq.value, b.qq.value);
  deepEqual(a.histogram, b.histogram);
  equal(a.reading.verdict, b.reading.verdict);
  const far = (r: typeof a.reading) => r.facts.outliers.values.filter((v) => v.value === 400);
  deepEqual(far(b.reading).map((v) => v.row), [800], "in memory the rows are known");
  deepEqual(far(a.reading).map((v) => v.row), [-1], "a source without rows names none");
  ok(a.qq.row.every((r) => r === -1));
});

Deno.test("every value in memory beyond 5000: only Shapiro–Wilk takes a subsample", () => {
  const x = skewed(6000, 8);
  const a = analyse(x, ORIGIN, { seed: 4 });
  deepEqual(a.subsample, { size: 5000, seed: 4 });
  equal(a.primary.n, 5000);
  ok(a.primary.method.endsWith(", on a seeded random subsample of 5000 of the 6000 values"));
  ok(a.primary.warnings[0].startsWith("Shapiro–Wilk's p-value is calibrated for at most 5000"));
  ok(a.tests[1].skipped !== undefined, "Shapiro–Francia is not run beyond its range");
  deepEqual(a.tests[2].result, andersonDarling(x));
  deepEqual(a.tests[3].result, lilliefors(x));
  ok(!a.tests[2].result!.warnings.some((w) => w.includes("subsample")));
});

Deno.test("in memory, the assembly keeps the rows the origin gives and its notes lead", () => {
  const x = skewed(200, 11);
  const sorted = sortFloat64(x.slice());
  const shape = _sampleShape(x, "x");
  const rows = Array.from(x, (_, i) => 100 + i);
  const a = screenFromAnswers(
    {
      n: x.length,
      shape,
      orderStatistics: (ranks) => selectFromSorted(x, sorted, ranks),
      histogram: () => histogramData(x),
      values: { every: prepareSample(x, sorted, shape), seed: 1 },
    },
    { ...ORIGIN, rows, notes: ["first"] },
  );
  deepEqual(a, analyse(x, { ...ORIGIN, rows, notes: ["first"] }));
  equal(a.reading.points[0], "first");
  equal(a.origin.rows, undefined);
  ok(a.reading.facts.outliers.values.some((v) => v.value === 400 && v.row === 107));
  equal(a.qq.row[a.qq.shown - 1], 107);
});
