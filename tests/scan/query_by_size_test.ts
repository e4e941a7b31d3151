/**
 * `.by()` over a scanned source stays within the display budget every
 * notebook output keeps, at a quarter of a million values per group, and
 * its analyses carry no query text or timings (they would differ from run
 * to run).
 *
 * @module
 */
import assert from "node:assert/strict";
import { plumb, scan } from "../../mod.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import { bundleBytes, OUTPUT_BUDGET } from "../../lib/render/budget.ts";

Deno.test("plumb(scan).by(): 250,000 values per group within the output budget", async () => {
  // Invented fill volumes of two filler lines.
  const src = scan(
    `SELECT 'line ' || CAST(i % 2 AS VARCHAR) AS line, ` +
      `500 + 3 * sin(i * 0.7) + exp(cos(i * 0.13)) + (i % 2) AS fill_ml FROM range(500000) t(i)`,
    { progress: false },
  );
  const by = plumb(src, "fill_ml").by("line");
  const bytes = bundleBytes(await by[DISPLAY]());
  assert.ok(bytes <= OUTPUT_BUDGET, `display ${bytes} bytes`);
  const r = await by.result();
  assert.deepEqual(r.groups.map((g) => g.n), [250000, 250000]);
  for (const g of r.groups) {
    assert.ok(g.analysis, `group ${g.group} screened`);
    assert.ok(!("passes" in g.analysis!), "no query log in the chain's analysis");
    assert.ok(!("fitSeconds" in g.analysis!), "no timing in the chain's analysis");
    assert.deepEqual(g.analysis!.subsample, { size: 5000, seed: 1 });
  }
});
