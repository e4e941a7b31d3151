import assert from "node:assert/strict";
import { assertClose } from "../_assert_close.ts";
import { PlumbError } from "../../lib/errors.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { seededRandom } from "../../lib/numeric/random.ts";

/** Type-7 quantile by sorting (Hyndman & Fan 1996), independent of the selection code. */
function quantile7(x: ArrayLike<number>, p: number): number {
  const s = Float64Array.from(x).sort();
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return lo + 1 < s.length ? s[lo] + (h - lo) * (s[lo + 1] - s[lo]) : s[lo];
}

/** Seeded standard exponentials. */
function sample(n: number): number[] {
  const rng = seededRandom(99);
  return Array.from({ length: n }, () => -Math.log(rng.uniform()));
}

Deno.test("Freedman–Diaconis bins: k = ⌈range / (2·IQR·n^(−1/3))⌉, every value counted once", () => {
  const x = sample(1000);
  const h = histogramData(x);
  const iqr = quantile7(x, 0.75) - quantile7(x, 0.25);
  const min = Math.min(...x);
  const max = Math.max(...x);
  const k = Math.ceil((max - min) / ((2 * iqr) / Math.cbrt(1000)));
  assert.equal(h.counts.length, k);
  assert.equal(h.rule, "freedman-diaconis");
  assert.equal(h.edges[0], min);
  assert.equal(h.edges[k], max);
  assertClose(h.binWidth, (max - min) / k, { rel: 1e-15 }, "width");
  assert.equal(h.counts.reduce((a, b) => a + b, 0), 1000);
  // each count equals a direct count over [edge_j, edge_{j+1}) (last bin closed)
  h.counts.forEach((c, j) => {
    const inBin = x.filter((v) =>
      v >= h.edges[j] && (j === k - 1 ? v <= h.edges[j + 1] : v < h.edges[j + 1])
    ).length;
    assert.equal(c, inBin, `bin ${j}`);
  });
});

Deno.test("the curve is the fitted normal density scaled to counts", () => {
  const x = [1, 2, 2, 3, 3, 3, 4, 4, 5];
  const h = histogramData(x, { curvePoints: 5, step: null });
  assert.equal(h.curveX.length, 5);
  assert.equal(h.curveX[0], 1);
  assert.equal(h.curveX[4], 5);
  // mean 3, Σ(x − 3)² = 12, sd √(12/8) worked by hand; y = n·w·φ((x − 3)/sd)/sd
  const sd = Math.sqrt(12 / 8);
  assertClose(h.sd, sd, { rel: 1e-15 }, "sd");
  const phi0 = 1 / Math.sqrt(2 * Math.PI);
  assertClose(
    h.curveY[2],
    (9 * h.binWidth * phi0) / sd,
    { rel: 1e-14 },
    "peak of the curve at the mean",
  );
});

Deno.test("Scott's rule is used, and said, when the IQR is zero; Sturges and the cap work", () => {
  const x = [0, 5, 5, 5, 5, 5, 5, 5, 10];
  const h = histogramData(x);
  assert.equal(h.rule, "scott");
  assert.match(h.ruleNote, /because the interquartile range is 0/);
  const st = histogramData(sample(100), { rule: "sturges" });
  assert.equal(st.counts.length, Math.ceil(Math.log2(100)) + 1);
  const capped = histogramData(sample(5000), { maxBins: 7 });
  assert.equal(capped.counts.length, 7);
  assert.match(capped.ruleNote, /capped at 7 bins$/);
});

Deno.test("histogramData rejects unusable input with PlumbError", () => {
  assert.throws(() => histogramData([1]), (e) => e instanceof PlumbError && e.code === "too-few");
  assert.throws(
    () => histogramData([3, 3]),
    (e) => e instanceof PlumbError && e.code === "constant",
  );
  assert.throws(
    // deno-lint-ignore no-explicit-any
    () => histogramData([1, 2], { rule: "rice" as any }),
    (e) => {
      assert.ok(e instanceof PlumbError && e.code === "bad-option");
      assert.equal(
        e.message,
        `Cannot bin with rule "rice": use "freedman-diaconis", "scott" or "sturges"`,
      );
      return true;
    },
  );
});

Deno.test("with a measurement step, widths are whole steps and edges half-steps; width and bins can be asked", () => {
  // the case: data to 0.1 once gave width 0.118 and a false spike of 120 among bars of 58
  const rng = seededRandom(12);
  const x = Array.from({ length: 3000 }, () => Math.round((20 + 1.5 * rng.normal()) * 10) / 10);
  const h = histogramData(x);
  assert.equal(h.step, 0.1);
  assertClose(h.binWidth / 0.1, Math.round(h.binWidth / 0.1), { abs: 1e-9 }, "width in steps");
  assertClose(((h.edges[0] - Math.min(...x)) / 0.1) % 1, -0.5, { abs: 1e-9 }, "first edge");
  // every value sits half a step from the nearest edge, so each bin holds the same number of
  // grid values (no bin catches two where its neighbour catches one)
  for (const v of new Set(x)) {
    const j = h.edges.findIndex((e) => e > v) - 1;
    assertClose(
      Math.min(v - h.edges[j], h.edges[j + 1] - v) % 0.1,
      0.05,
      { abs: 1e-9 },
      `value ${v}`,
    );
  }
  const whole = histogramData(x.map((v) => Math.round(v)));
  assert.equal(whole.binWidth % 1, 0);
  assert.equal(histogramData(x, { width: 0.5 }).binWidth, 0.5);
  assert.equal(histogramData(x, { step: null, bins: 12 }).counts.length, 12);
  assert.throws(
    () => histogramData(x, { width: -1 }),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
  assert.throws(
    () => histogramData(x, { bins: 0 }),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
});

Deno.test("a pile-up holding a quarter of the values or more hands the width to Scott's rule", () => {
  // Invented: 372 readings at a floor of 0 among 506; the rest spread from 0.05 to 40.
  const rest = Array.from({ length: 134 }, (_, i) => 0.05 + (40 * (i / 133)) ** 1.5 / 40 ** 0.5);
  const x = [...new Array(372).fill(0), ...rest];
  const h = histogramData(x);
  assert.equal(h.rule, "scott");
  assert.match(h.ruleNote, /74% of the values sit at one value/);
  assert.ok(h.counts.length < 40, `${h.counts.length} bins`);
  // the non-zero values are not lost in hundreds of near-empty bins
  assert.ok(Math.max(...h.counts.slice(1)) >= 10, `${h.counts}`);
  // below a quarter at one value, Freedman–Diaconis stays
  const mild = [...new Array(100).fill(0), ...Array.from({ length: 406 }, (_, i) => 1 + i / 40)];
  assert.equal(histogramData(mild).rule, "freedman-diaconis");
});
