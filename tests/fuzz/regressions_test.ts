/**
 * One regression test per defect the fuzz suite found, each on the smallest
 * input that showed it (before the fix: a RangeError, a NaN or ±Infinity in
 * a result, a wrong line number, or quadratic time).
 */
import assert from "node:assert/strict";
import {
  histogramData,
  logShift,
  moments,
  plumb,
  qqData,
  searchReexpressions,
  shapiroFrancia,
  shapiroWilk,
  survey,
  yeoJohnsonFit,
} from "../../mod.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { uniqueNames } from "../../lib/data/header.ts";
import { escapeHtml } from "../../lib/render/escape.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertAllFinite } from "./_fuzz.ts";

const M = Number.MAX_VALUE;

Deno.test("regression: Shapiro–Wilk and Shapiro–Francia on values near ±1.8e308 of both signs", () => {
  // The range overflowed, so (x − min)/range was ∞/∞ and p came out NaN (a RangeError).
  const x = [9.25880715045575e307, -1.4813801249787364e308, 1.7801655792852096e308];
  const w = shapiroWilk(x);
  const wScaled = shapiroWilk(x.map((v) => v / 2 ** 20));
  assert.ok(Math.abs(w.statistic - wScaled.statistic) <= 1e-12, "W scale invariant");
  const y = [0, 0, 0, 3.293136510732288e293, -1.7976931348623125e308, 1e308, -1e308];
  const f = shapiroFrancia(y);
  const fScaled = shapiroFrancia(y.map((v) => v / 2 ** 20));
  assert.ok(Math.abs(f.statistic - fScaled.statistic) <= 1e-12, "W′ scale invariant");
  assertAllFinite([w, f], "tests");
});

Deno.test("regression: the QQ data and histogram of huge, mixed and subnormal values are finite", () => {
  const samples = [
    [M, M, M, 1e308, 5, 1e-300, 2e-300, 3e-300], // the sum overflowed
    [1e308, 1e-308, 2e-308, 3e-308, 4e-308, 5e-308, 6e-308, 7e-308], // squares overflowed
    [1.71e-321, 7.57427e-319, 2.823714e-318, 3.36217e-318, 5e-324, 1e-323], // sd underflowed
    [-1.3032089373101951e308, -1.7923568075863894e308, 5.3363272759265194e305, 0], // range overflowed
  ];
  for (const x of samples) {
    const what = JSON.stringify(x);
    assertAllFinite(qqData(x), `qqData ${what}`);
    const h = histogramData(x);
    assertAllFinite(h, `histogramData ${what}`);
    assert.equal(h.counts.reduce((a, b) => a + b, 0), x.length, `${what}: counts`);
    const [lo, hi] = [Math.min(...x), Math.max(...x)];
    const last = h.edges[h.edges.length - 1];
    if (h.step === null) {
      assert.equal(h.edges[0], lo, `${what}: first edge`);
      assert.equal(last, hi, `${what}: last edge`);
    } else {
      // on a measurement grid the edges lie half a step outside the recorded values
      assert.ok(h.edges[0] < lo && lo - h.edges[0] <= h.step, `${what}: first edge`);
      assert.ok(last > hi && last - hi <= h.binWidth, `${what}: last edge`);
    }
    assertAllFinite(plumb(x).analysis(), `plumb ${what}`);
  }
});

Deno.test("regression: a spread beyond the largest double is refused with a PlumbError", () => {
  // The sd of ±1.8e308 is about 1.15·1.8e308: it was reported as Infinity.
  const x = [-M, -M, M, M];
  for (
    const f of [
      () => moments(x),
      () => qqData(x),
      () => histogramData(x),
      () => plumb(x).analysis(),
    ]
  ) {
    assert.throws(f, (e) =>
      e instanceof PlumbError && e.code === "non-finite" &&
      /standard deviation exceeds the largest double/.test(e.message));
  }
  // and a survey lists such a column as not screened instead of failing
  const s = survey({ wide: x, fine: [1, 2, 4, 8] }).result();
  assert.equal(s.rows.length, 2);
  assert.match(s.rows.find((r) => r.column === "wide")!.skipped!, /largest double/);
});

Deno.test("regression: the re-expression search on huge, subnormal and last-bit samples", () => {
  const samples = [
    [1e308, -1e308, 1.7e308, -1.7e308, 0, 1, 5e307, -5e307], // departures were NaN
    [-1.7976931348623157e308, 1.7976931348623157e308, 0, 1, 2, 3, 4, 5], // crashed: best undefined
    [0, -1.1984620899082105e308, 0], // log shift overflowed: bad-option
    [-2e-323, -1e-323, -1.5e-323, 0], // log shift rounded back to −min: log(0)
    [0.09999999999999996, 0.09999999999999998, 0.09999999999999998], // Box–Cox ℓ = +∞
  ];
  for (const x of samples) {
    const r = searchReexpressions(x);
    assertAllFinite(r, `search ${JSON.stringify(x)}`);
    assert.equal(r.chosen, r.candidates[0]);
  }
  const s = logShift([-2e-323, -1e-323, -1.5e-323, 0]);
  assert.ok(-2e-323 + s.shift > 0, "the smallest value lands above zero");
  assert.throws(
    () => logShift([0, -1.1984620899082105e308, 0]),
    (e) => e instanceof PlumbError && e.code === "non-finite",
  );
});

Deno.test("regression: λ fits whose likelihood is not representable throw no-convergence", () => {
  // ln var(z) was −∞ and logLikelihood +∞.
  for (
    const f of [
      () => boxCoxFit([0.09999999999999996, 0.09999999999999998, 0.09999999999999998]),
      () => yeoJohnsonFit([1.71e-321, 7.57427e-319, 2.823714e-318, 3.36217e-318]),
    ]
  ) {
    assert.throws(f, (e) => e instanceof PlumbError && e.code === "no-convergence");
  }
});

Deno.test("regression: the reading's resolution is finite for gaps beyond the largest double", () => {
  const a = plumb([-M, -M / 2, M / 2, M, 0, 1]).analysis();
  assert.ok(Number.isFinite(a.reading.facts.resolution));
});

Deno.test("regression: the general CSV reader accepts every line end in any mix", () => {
  // csv-parse took the first line end as the only one and read "\r" as data.
  for (const text of ["a,b\n1,2\r3,4\n", "a,b\r\n1,2\n3,4\r\n", "0\r\n1\r\n\n\r\n", "0\n1\r\r\n"]) {
    const quick = tableFromCsv(text);
    const general = tableFromCsv(text, { reader: "csv-parse" });
    assert.equal(general.rowCount, quick.rowCount, JSON.stringify(text));
  }
  assert.equal(tableFromCsv("a,b\n1,2\r3,4\n", { reader: "csv-parse" }).rowCount, 2);
});

Deno.test("regression: errors after a quoted field with a CRLF inside name the right line", () => {
  const line = (text: string) => {
    try {
      tableFromCsv(text, { reader: "csv-parse" });
    } catch (e) {
      return (e as PlumbError).detail?.line;
    }
    return undefined;
  };
  assert.equal(line('a,b\r\n"x\r\ny",1\r\n2\r\n'), 4, "ragged row");
  assert.equal(line('a,b\r"x\ry",1\r2\r'), 4, "ragged row, lone CR");
  assert.equal(line('"\ufeff0\r\n0\r\n"\u0000"'), 3, "text after a closing quote");
  assert.equal(line('a,b\r1,2\r3,"open\r'), 3, "unclosed quote with lone CR line ends");
});

Deno.test("regression: 100,000 copies of one header name are all renamed, uniquely", () => {
  // The rename was once quadratic (13 minutes here); its time is measured by
  // bench/load_table_bench.ts ("100,000 identical header names").
  const { names } = uniqueNames(new Array(100_000).fill("x"));
  assert.equal(new Set(names).size, 100_000);
  assert.equal(names[1], "x_2");
  assert.equal(names[99_999], "x_100000");
  assert.deepEqual(uniqueNames(["a", "a", "a_2", "a"]).names, ["a", "a_3", "a_2", "a_4"]);
});

Deno.test("regression: U+FFFE, U+FFFF and lone surrogates never reach HTML or SVG", async () => {
  const name = "a\ufffeb\uffffc\ud800d\udc00e🍾";
  assert.equal(escapeHtml(name), "a\ufffdb\ufffdc\ufffdd\ufffde🍾");
  const svg = await renderSvg({
    title: name,
    data: { values: [{ a: 1, b: 2 }] },
    mark: "point",
    encoding: { x: { field: "a", type: "quantitative" }, y: { field: "b", type: "quantitative" } },
  });
  assert.ok(!/[\ufffe\uffff]|[\ud800-\udbff](?![\udc00-\udfff])/.test(svg));
  assert.ok(svg.includes("🍾"), "paired surrogates are kept");
});

Deno.test("regression: a last line of spaces without a line end is read the same by both readers", () => {
  // csv-parse dropped it and reported "no header row (the text is empty)".
  for (const text of [" ", "a\n ", "  \t"]) {
    const quick = tableFromCsv(text);
    const general = tableFromCsv(text, { reader: "csv-parse" });
    assert.equal(general.rowCount, quick.rowCount, JSON.stringify(text));
    assert.deepEqual(general.columns.map((c) => c.name), quick.columns.map((c) => c.name));
  }
});

Deno.test("regression: a name ending in a backslash keeps the QQ tooltip expression valid", async () => {
  // Vega-Lite wrote the tooltip title into an expression unescaped: "Expression parse error".
  const { qqSpec } = await import("../../lib/render/qq_spec.ts");
  for (const name of ["\\", "a\\", '\\"', "! residuals within \\"]) {
    const warnings: string[] = [];
    const svg = await renderSvg(qqSpec(qqData([1, 2, 4, 7, 11, 16]), { name }), { warnings });
    assert.deepEqual(warnings, [], JSON.stringify(name));
    assert.ok(svg.startsWith("<svg"));
  }
  await plumb(
    { v: [1, 2, 4, 7, 11, 16, 3, 9], "\\": ["a", "b", "a", "b", "a", "b", "a", "b"] },
    "v",
  )
    .by("\\").result();
});
