/**
 * The refining paths of the cell passes, reached on 1e5 values by lowering
 * the cell limits: a cell too crowded to gather is split (or found to hold
 * one value), and cells the log series cannot sum are split until few
 * enough are read raw. The results must still equal the in-memory analysis.
 *
 * @module
 */
import assert from "node:assert/strict";
import { analyse } from "../../lib/plumb/analysis.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import { _Engine } from "../../lib/scan/engine.ts";
import { screenColumn } from "../../lib/scan/screen.ts";
import { DUCKDB, valueExpr } from "../../lib/scan/sql.ts";
import { assertClose } from "../_assert_close.ts";
import { writeShape } from "./_data.ts";

const N = 100_000;

for (
  const [shape, limits] of [
    ["spikeOutlier", { pickMax: 2_000, rawMax: 500_000 }],
    ["exponential", { pickMax: 1_000_000, rawMax: 200 }],
  ] as const
) {
  Deno.test(`scan refines crowded cells and equals the in-memory analysis: ${shape}`, async () => {
    const dir = await Deno.makeTempDir();
    const engine = await _Engine.open();
    try {
      const { path, values } = await writeShape(dir, shape, N);
      let lo = Infinity;
      let hi = -Infinity;
      for (const v of values) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
      const { analysis: a } = await screenColumn(
        {
          engine,
          dialect: DUCKDB,
          relation: `read_parquet('${path}')`,
          v: valueExpr(DUCKDB, "x", false, 1),
          subject: shape,
          keep: "all",
          limits,
        },
        { rows: N, missing: 0, text: 0, nonFinite: 0, n: N, lo, hi },
        { column: "x", label: "x" },
        { sampleSize: 5000, seed: 1, qq: {}, boxCox: true },
      );
      const steps = a.passes.map((p) => p.step);
      assert.ok(steps.includes("splitting crowded cells"), steps.join(", "));
      assert.ok(steps.includes("finding crowded cells' ranges"), steps.join(", "));
      const b = analyse(values, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
      for (const k of ["mean", "sd", "g1", "g2"] as const) {
        assertClose(a.moments[k], b.moments[k], { rel: 1e-9 }, `${shape}: moments.${k}`);
      }
      assert.deepEqual(a.qq.value, b.qq.value);
      assert.deepEqual(a.histogram.counts, b.histogram.counts);
      if (lo > 0) {
        assert.ok("lambda" in a.boxCox);
        assertClose(a.boxCox.lambda, boxCoxFit(values).lambda, { abs: 1e-6 }, `${shape}: λ`);
      }
    } finally {
      engine.close();
      await Deno.remove(dir, { recursive: true });
    }
  });
}
