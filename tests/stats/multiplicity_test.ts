import { equal, throws } from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../../lib/errors.ts";
import {
  adjustPValues,
  benjaminiHochbergAdjust,
  holmAdjust,
} from "../../lib/stats/multiplicity.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/multiplicity.json from R's stats::p.adjust
// (tools/fixtures/multiplicity.R; R's version in the file).
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/multiplicity.json", import.meta.url)),
) as { library: { R: string }; cases: { p: number[]; holm: number[]; bh: number[] }[] };

Deno.test(`Holm and Benjamini–Hochberg match R ${fixture.library.R} p.adjust to 1e-15`, () => {
  for (const [k, c] of fixture.cases.entries()) {
    const h = holmAdjust(c.p);
    const b = benjaminiHochbergAdjust(c.p);
    c.p.forEach((_, i) => {
      assertClose(h[i], c.holm[i], { rel: 1e-15, abs: 1e-300 }, `holm case ${k}[${i}]`);
      assertClose(b[i], c.bh[i], { rel: 1e-15, abs: 1e-300 }, `BH case ${k}[${i}]`);
    });
  }
});

Deno.test("adjustment errors: p outside [0, 1], unknown method", () => {
  throws(
    () => holmAdjust([0.2, 1.5]),
    (e: unknown) =>
      e instanceof PlumbError && e.code === "bad-option" &&
      e.message === "Cannot adjust p-values: entry 1 is 1.5, and p-values must lie in [0, 1]",
  );
  throws(() => adjustPValues([0.2], "bonf" as "holm"), /Unknown p-value adjustment "bonf"/);
  equal(holmAdjust([]).length, 0);
});

// m·p/k can round one ulp below p, so "adjusted ≥ raw" allows rounding (4e-16 relative).
Deno.test("property: adjusted ≥ raw, ≤ 1, order preserved; BH ≤ Holm", () => {
  fc.assert(
    fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 60 }), (p) => {
      const h = holmAdjust(p);
      const b = benjaminiHochbergAdjust(p);
      return p.every((v, i) =>
        h[i] >= v && b[i] >= v * (1 - 4e-16) && h[i] <= 1 && b[i] <= h[i] + 1e-15 &&
        p.every((w, j) => !(v < w) || (h[i] <= h[j] && b[i] <= b[j]))
      );
    }),
    { seed: 20261205, numRuns: 300 },
  );
});
