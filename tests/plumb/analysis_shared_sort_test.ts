/**
 * `analyse` sorts and summarises the sample once and shares the work among
 * the tests; every result must be exactly what the public functions give on
 * the same values (the same doubles, not merely close).
 */
import { deepEqual, equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { randomSubsample, seededRandom } from "../../lib/numeric/random.ts";
import { SPLIT_MIN_N } from "../../lib/numeric/sort.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { readShape } from "../../lib/plumb/reading.ts";
import { andersonDarling } from "../../lib/stats/anderson_darling.ts";
import {
  dagostinoPearson,
  type DagostinoPearsonResult,
} from "../../lib/stats/dagostino_pearson.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { jarqueBera } from "../../lib/stats/jarque_bera.ts";
import { lilliefors } from "../../lib/stats/lilliefors.ts";
import { moments } from "../../lib/stats/moments.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { shapiroFrancia } from "../../lib/stats/shapiro_francia.ts";
import { shapiroWilk } from "../../lib/stats/shapiro_wilk.ts";

const ORIGIN = { label: "x", column: "x", missingDropped: 0, textDropped: 0 };

/** The dense partial Fisher–Yates shuffle the sparse `randomSubsample` must reproduce. */
function denseSubsample(x: Float64Array, size: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  const idx = new Int32Array(x.length).map((_, i) => i);
  const out = new Float64Array(size);
  for (let i = 0; i < size; i++) {
    const j = i + rng.integer(x.length - i);
    const t = idx[i];
    idx[i] = idx[j];
    idx[j] = t;
    out[i] = x[idx[i]];
  }
  return out;
}

function sample(n: number, seed: number, kind: "normal" | "rounded" | "skewed"): Float64Array {
  const rng = seededRandom(seed);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const z = rng.normal();
    x[i] = kind === "normal"
      ? 1e6 + 0.01 * z
      : kind === "rounded"
      ? Math.round(z * 4) / 4
      : Math.exp(z);
  }
  return x;
}

function unwrap(f: () => unknown): unknown {
  try {
    return f();
  } catch (e) {
    if (e instanceof PlumbError && (e.code === "too-few" || e.code === "too-many")) {
      return { skipped: e.message };
    }
    throw e;
  }
}

const CASES: [number, "normal" | "rounded" | "skewed"][] = [
  [4, "normal"],
  [9, "rounded"],
  [700, "skewed"],
  [5000, "rounded"],
  [5001, "normal"],
  [SPLIT_MIN_N + 7, "rounded"],
];

for (const [n, kind] of CASES) {
  Deno.test(`analyse at n = ${n} (${kind}) gives exactly the public functions' results`, () => {
    const x = sample(n, n, kind);
    if (kind === "rounded" && n > 8) {
      x[1] = -0; // both zeros, so the shared sort's −0/+0 order is exercised
      x[2] = 0;
    }
    const rows = Int32Array.from({ length: n }, (_, i) => 3 * i + 2);
    const before = x.slice();
    const a = analyse(x, { ...ORIGIN, rows });
    deepEqual(x, before, "analyse leaves its input alone");
    deepEqual(a.moments, moments(x));
    const primary = n > 5000 ? shapiroWilk(denseSubsample(x, 5000, 1)) : shapiroWilk(x);
    equal(a.primary.statistic, primary.statistic);
    equal(a.primary.pValue, primary.pValue);
    equal(a.primary.n, Math.min(n, 5000), "the primary test's n is the values it used");
    deepEqual(a.subsample, n > 5000 ? { size: 5000, seed: 1 } : null);
    const expected = [
      primary,
      unwrap(() => shapiroFrancia(x)),
      unwrap(() => andersonDarling(x)),
      unwrap(() => lilliefors(x)),
      unwrap(() => dagostinoPearson(x)),
      unwrap(() => jarqueBera(x)),
    ];
    for (let t = 1; t < expected.length; t++) {
      const got = a.tests[t].result ?? { skipped: a.tests[t].skipped };
      deepEqual(got, expected[t], a.tests[t].test);
    }
    const qq = qqData(x, { rows });
    deepEqual(a.qq, qq);
    deepEqual(a.histogram, histogramData(x));
    // The reading from the public functions' results alone, none taken from the analysis.
    const k2 = expected[4] as DagostinoPearsonResult | { skipped: string };
    const reading = readShape({
      n,
      moments: moments(x),
      primary,
      dagostino: "skipped" in k2 ? undefined : k2,
      qq,
      values: x,
      rows,
      subsample: n > 5000 ? { size: 5000, seed: 1 } : null,
      subsampleSorted: n > 5000 ? Float64Array.from(denseSubsample(x, 5000, 1)).sort() : undefined,
    });
    deepEqual(a.reading, reading);
  });
}

Deno.test("randomSubsample (sparse) draws exactly the dense shuffle's subsample", () => {
  const x = sample(20000, 3, "normal");
  for (const seed of [1, 2, 99]) {
    deepEqual(randomSubsample(x, 5000, seed), denseSubsample(x, 5000, seed));
  }
  deepEqual(
    randomSubsample(x.subarray(0, 5000), 5000, 4),
    denseSubsample(x.subarray(0, 5000), 5000, 4),
  );
});

Deno.test("analyse: input errors name the moments summary, as before the shared sort", () => {
  const bad = (x: Float64Array, code: string, text: RegExp) =>
    throws(
      () => analyse(x, ORIGIN),
      (e) => e instanceof PlumbError && e.code === code && text.test(e.message),
    );
  bad(
    new Float64Array([1, 2, 3]),
    "too-few",
    /^Cannot run the skewness and kurtosis summary on 3 values/,
  );
  bad(new Float64Array([1, 2, NaN, 4, Infinity]), "non-finite", /2 of 5 \(at positions 2, 4\)/);
  bad(new Float64Array(10).fill(7), "constant", /10 identical values \(all 7\)/);
});

Deno.test(".by() gives each group exactly analyse() of its values, and the table is left alone", async () => {
  const { loadTable } = await import("../../lib/data/load_table.ts");
  const { plumb } = await import("../../lib/plumb/plumb.ts");
  const rng = seededRandom(5);
  const n = 600;
  const line: (string | null)[] = [];
  const fill: (number | string | null)[] = [];
  for (let i = 0; i < n; i++) {
    line.push(i % 37 === 0 ? null : ["B", "A", "C"][i % 3]);
    fill.push(i % 29 === 0 ? null : i % 41 === 0 ? "n/a" : Math.exp(rng.normal()));
  }
  const table = await loadTable({ line, fill });
  const before = table.numericCells("fill").values;
  const r = plumb(table, "fill", { dropText: true }).by("line").result();
  const after = table.numericCells("fill").values;
  // Element by element with Object.is: the missing cells are NaN on both sides.
  equal(after.every((v, i) => Object.is(v, before[i])), true, "the table's numbers are unchanged");
  deepEqual(r.groups.map((g) => g.group), ["A", "B", "C"]);
  const pooled: number[] = [];
  for (const g of r.groups) {
    const rows: number[] = [];
    for (let i = 0; i < n; i++) {
      if (line[i] === g.group && typeof fill[i] === "number") rows.push(i);
    }
    const v = Float64Array.from(rows, (i) => fill[i] as number);
    const a = analyse(v, {
      ...ORIGIN,
      label: `fill — line = ${g.group}`,
      column: "fill",
      group: g.group,
      transform: undefined,
      missingDropped: g.missingDropped,
      textDropped: g.textDropped,
      rows: Int32Array.from(rows, (i) => i + 1),
    });
    deepEqual(g.analysis, a, g.group);
    const mean = moments(v).mean;
    for (const t of v) pooled.push(t - mean);
  }
  equal(r.residuals?.n, pooled.length);
  deepEqual(r.residuals?.moments, moments(pooled));
  equal(r.residuals?.primary.statistic, shapiroWilk(pooled).statistic);
});

Deno.test("plumb() and survey() with missing cells: the analysis names the table's rows", async () => {
  const { loadTable } = await import("../../lib/data/load_table.ts");
  const { plumb } = await import("../../lib/plumb/plumb.ts");
  const { survey } = await import("../../lib/plumb/survey.ts");
  const rng = seededRandom(8);
  const fill: (number | null)[] = [];
  for (let i = 0; i < 400; i++) fill.push(i % 7 === 0 ? null : Math.exp(1.2 * rng.normal()));
  const table = await loadTable({ fill });
  const rows: number[] = [];
  for (let i = 0; i < fill.length; i++) if (fill[i] !== null) rows.push(i);
  const v = Float64Array.from(rows, (i) => fill[i] as number);
  const a = analyse(v, {
    ...ORIGIN,
    label: "fill",
    column: "fill",
    transform: undefined,
    missingDropped: fill.length - rows.length,
    rows: Int32Array.from(rows, (i) => i + 1),
  });
  const p = plumb(table, "fill").analysis();
  for (const k of ["moments", "primary", "tests", "qq", "histogram", "reading"] as const) {
    deepEqual(p[k], a[k], k);
  }
  ok(a.reading.facts.outliers.count > 0, "the sample has outliers, named by row");
  const s = survey(table).result().rows[0].analysis!;
  deepEqual(s.reading, a.reading);
  deepEqual(s.qq, a.qq);
});
