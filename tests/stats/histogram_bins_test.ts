import { deepEqual, equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { histogramBins } from "../../lib/stats/histogram_bins.ts";
import { assertClose } from "../_assert_close.ts";

const sample = (min: number, max: number, step: number | null, n = 500) => ({
  n,
  min,
  max,
  sd: (max - min) / 6,
  iqr: () => (max - min) / 4,
  step,
});

Deno.test("with a step, the width is a whole number of steps and edges sit at half-steps", () => {
  for (const step of [1, 0.1, 0.01, 0.25, 5]) {
    const b = histogramBins(sample(20 * step, 60 * step, step), {});
    const m = b.width / step;
    assertClose(m, Math.round(m), { abs: 1e-9 }, `width ${b.width} for step ${step}`);
    ok(Math.round(m) >= 1);
    assertClose(b.edges[0], 20 * step - step / 2, { abs: 1e-12 }, "first edge");
    // every edge lies half a step off the grid
    for (const e of b.edges) {
      const off = (e - 20 * step) / step - Math.floor((e - 20 * step) / step);
      assertClose(off, 0.5, { abs: 1e-6 }, `edge ${e}, step ${step}`);
    }
    ok(b.edges[b.edges.length - 1] >= 60 * step + step / 2 - 1e-9);
  }
});

Deno.test("whole numbers get whole widths (no empty gaps); 0.1 data get multiples of 0.1", () => {
  // the cases: Freedman–Diaconis would give 0.684 and 0.118
  const whole = histogramBins({ n: 300, min: 0, max: 12, sd: 2, iqr: () => 2.7, step: 1 }, {});
  equal(whole.width, 1);
  const tenth = histogramBins({ n: 3000, min: 2, max: 9, sd: 1, iqr: () => 1.35, step: 0.1 }, {});
  assertClose(tenth.width / 0.1, Math.round(tenth.width / 0.1), { abs: 1e-9 }, "0.1 multiple");
});

Deno.test("a width or a number of bins can be asked for", () => {
  const w = histogramBins(sample(0, 10, null), { width: 0.5 });
  equal(w.width, 0.5);
  equal(w.edges.length, 21);
  equal(w.rule, "width");
  const k = histogramBins(sample(0, 10, null), { bins: 8 });
  equal(k.edges.length, 9);
  equal(k.edges[8], 10);
  // with a step, an asked width is made a whole number of steps, and the note says so
  const s = histogramBins(sample(0, 10, 0.5), { width: 1.2 });
  equal(s.width, 1);
  ok(s.note.includes("whole number (2) of measurement steps"), s.note);
  deepEqual(histogramBins(sample(0, 10, 0.5), { width: 1 }).width, 1);
});

Deno.test("the bin cap holds with a step, and bad requests are refused with a clear message", () => {
  const b = histogramBins(sample(0, 1000, 0.001, 1e6), { maxBins: 50 });
  ok(b.edges.length - 1 <= 50);
  const bad = (r: Record<string, unknown>, pattern: RegExp) =>
    throws(
      () => histogramBins(sample(0, 10, null), r),
      (e) => e instanceof PlumbError && e.code === "bad-option" && pattern.test(e.message),
    );
  bad({ width: 0 }, /Cannot use a bin width of 0: pass a positive finite number/);
  bad({ width: -1 }, /bin width of -1/);
  bad({ width: NaN }, /bin width of NaN/);
  bad({ width: "2" }, /bin width of 2/);
  bad({ bins: 0 }, /Cannot use 0 bins: pass a whole number from 1 to 10000/);
  bad({ bins: 2.5 }, /2.5 bins/);
  bad({ width: 1, bins: 3 }, /Cannot use both width = 1 and bins = 3: pass one of them/);
  bad({ rule: "rice" }, /Cannot bin with rule "rice"/);
  bad({ width: 1e-6 }, /more than maxBins = 200; pass a wider width or a larger maxBins/);
});
