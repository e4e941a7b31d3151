/**
 * The within-cell third and fourth sums estimated from the count, Σe and
 * Σe² (`higherSums`): for any values in a cell, the true sums lie within
 * the stated bounds of the estimates; spread evenly, the estimates are
 * close; and the bounds on g1 and g2 built from them (`cellShapeSlack`)
 * hold for the cells of a generated sample.
 *
 * @module
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { type Cell, cellShape, cellShapeSlack, higherSums } from "../../lib/scan/cells.ts";
import { _sampleShape } from "../../lib/stats/moments.ts";

/** Σe, Σe², Σe³, Σe⁴ of offsets in cell widths. */
function sums(e: readonly number[]): [number, number, number, number] {
  let [s1, s2, s3, s4] = [0, 0, 0, 0];
  for (const x of e) [s1, s2, s3, s4] = [s1 + x, s2 + x * x, s3 + x ** 3, s4 + x ** 4];
  return [s1, s2, s3, s4];
}

// Offsets in [−½, ½): anywhere, or piled on a few values (a measurement step inside the cell).
const offset = fc.double({ min: -0.5, max: 0.5, maxExcluded: true, noNaN: true });
const cellValues = fc.oneof(
  fc.array(offset, { minLength: 1, maxLength: 200 }),
  fc.tuple(fc.array(offset, { minLength: 1, maxLength: 3 }), fc.integer({ min: 1, max: 200 }))
    .map(([spots, m]) => Array.from({ length: m }, (_, i) => spots[i % spots.length])),
);

Deno.test("higherSums: the true Σe³ and Σe⁴ lie within the stated bounds, whatever the values", () => {
  fc.assert(
    fc.property(cellValues, (e) => {
      const [s1, s2, s3, s4] = sums(e);
      const h = higherSums(e.length, s1, s2);
      // A few units of rounding in sums of at most 200 terms of size ≤ 1.
      const tiny = 1e-13;
      assert.ok(Math.abs(s3 - h.s3) <= h.slack3 + tiny, `Σe³ ${s3} vs ${h.s3} ± ${h.slack3}`);
      assert.ok(Math.abs(s4 - h.s4) <= h.slack4 + tiny, `Σe⁴ ${s4} vs ${h.s4} ± ${h.slack4}`);
    }),
    { seed: 20261202, numRuns: 2000 },
  );
});

Deno.test("higherSums: values spread evenly over the cell give estimates close to the true sums", () => {
  const m = 1000;
  const e = Array.from({ length: m }, (_, i) => (i + 0.5) / m - 0.5);
  const [s1, s2, s3, s4] = sums(e);
  const h = higherSums(m, s1, s2);
  assert.ok(Math.abs(h.s3 - s3) < 1e-12, `${h.s3} vs ${s3}`);
  // Uniform on [−½, ½): E e⁴ = 1/80; the midpoints differ from it by O(1/m²).
  assert.ok(Math.abs(h.s4 - s4) / s4 < 1e-5, `${h.s4} vs ${s4}`);
});

Deno.test("higherSums: a density that slopes across the cell gives Σe³ ≈ 0.15·Σe", () => {
  // f(e) = 1 + b·e on [−½, ½), its m quantiles at the midpoints by bisection on the CDF.
  const b = 1.2;
  const cdf = (e: number) => e + 0.5 + (b * (e * e - 0.25)) / 2;
  const m = 2000;
  const e = Array.from({ length: m }, (_, i) => {
    const p = (i + 0.5) / m;
    let [lo, hi] = [-0.5, 0.5];
    for (let k = 0; k < 60; k++) {
      [lo, hi] = cdf((lo + hi) / 2) < p ? [(lo + hi) / 2, hi] : [lo, (lo + hi) / 2];
    }
    return (lo + hi) / 2;
  });
  const [s1, s2, s3] = sums(e);
  const h = higherSums(m, s1, s2);
  // E e = b/12 and E e³ = b/80 for this density (integrals of e·f and e³·f over the cell).
  assert.ok(Math.abs(s1 / m - b / 12) < 1e-6 && Math.abs(s3 / m - b / 80) < 1e-6);
  assert.ok(Math.abs(h.s3 - s3) / Math.abs(s3) < 1e-4, `${h.s3} vs ${s3}`);
});

Deno.test("cellShapeSlack: g1 and g2 from estimated sums stay within the stated bounds", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 20, maxLength: 300 }),
      fc.integer({ min: -6, max: 1 }),
      (xs, wExp) => {
        const w = 2 ** wExp;
        const lo = Math.floor(Math.min(...xs) / w) * w;
        const byKey = new Map<number, number[]>();
        for (const v of xs) {
          const k = Math.floor((v - lo) / w);
          byKey.set(k, [...(byKey.get(k) ?? []), (v - lo) / w - (k + 0.5)]);
        }
        const cells: Cell[] = [...byKey.entries()].sort((a, b) => a[0] - b[0]).map(([k, e]) => {
          const [s1, s2] = sums(e);
          const h = higherSums(e.length, s1, s2);
          return {
            n: e.length,
            lo: lo + k * w,
            hi: lo + (k + 1) * w,
            centre: lo + (k + 0.5) * w,
            s: [s1 * w, s2 * w * w, h.s3 * w ** 3, h.s4 * w ** 4],
            slack: [h.slack3 * w ** 3, h.slack4 * w ** 4],
            grid: 0,
            key: k,
          };
        });
        const x = Float64Array.from(xs);
        let spread = false;
        for (const v of x) if (v !== x[0]) spread = true;
        fc.pre(spread);
        const truth = _sampleShape(x, "test");
        if (!(truth.sd > 1e-3)) return;
        const shape = cellShape(cells);
        const slack = cellShapeSlack(cells, shape);
        const tol = 1e-10;
        assert.ok(Math.abs(shape.g1 - truth.g1) <= slack.g1 + tol, `g1 ${shape.g1} vs ${truth.g1}`);
        assert.ok(Math.abs(shape.g2 - truth.g2) <= slack.g2 + tol, `g2 ${shape.g2} vs ${truth.g2}`);
      },
    ),
    { seed: 20261202, numRuns: 500 },
  );
});
