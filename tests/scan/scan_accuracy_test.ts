/**
 * The scan against the in-memory analysis of the same values at n = 1e6:
 * moments within 1e-9 relative, QQ points and histogram counts identical,
 * Box–Cox λ within 1e-6 and its interval ends within 1e-6, the same
 * verdict. The in-memory functions are plumbline's own (checked against R
 * and scipy in tests/stats and tests/reexpress).
 *
 * @module
 */
import assert from "node:assert/strict";
import { scan } from "../../mod.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import { assertClose } from "../_assert_close.ts";
import { SHAPES, writeShape } from "./_data.ts";

const N = 1_000_000;

for (const shape of Object.keys(SHAPES) as (keyof typeof SHAPES)[]) {
  Deno.test(`scan agrees with the in-memory analysis at n = 1e6: ${shape}`, async () => {
    const dir = await Deno.makeTempDir();
    try {
      const { path, values } = await writeShape(dir, shape, N);
      const a = await scan(path, { progress: false }).analyse("x");
      const b = analyse(values, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
      assert.equal(a.n, N);
      for (const k of ["mean", "sd", "g1", "g2", "G1", "G2"] as const) {
        assertClose(a.moments[k], b.moments[k], { rel: 1e-9 }, `${shape}: moments.${k}`);
      }
      for (const i of [4, 5]) {
        assertClose(
          a.tests[i].result!.statistic,
          b.tests[i].result!.statistic,
          { rel: 1e-9 },
          `${shape}: ${a.tests[i].test}`,
        );
      }
      assert.deepEqual(a.qq.rank, b.qq.rank);
      assert.deepEqual(a.qq.value, b.qq.value, `${shape}: QQ points are exact order statistics`);
      assert.deepEqual(a.histogram.edges, b.histogram.edges);
      assert.deepEqual(a.histogram.counts, b.histogram.counts);
      assert.equal(a.reading.verdict, b.reading.verdict);
      assert.equal(a.sample.size, 5000);
      assert.match(a.primary.warnings[0], /subsample of 5000 of the 1000000 values/);
      if (Math.min(...a.histogram.edges) > 0) {
        const f = boxCoxFit(values);
        const fit = a.boxCox;
        assert.ok("lambda" in fit);
        assertClose(fit.lambda, f.lambda, { abs: 1e-6 }, `${shape}: Box–Cox λ`);
        for (const j of [0, 1]) {
          const x: number | null = fit.ci[j];
          const y: number | null = f.ci[j];
          if (x === null || y === null) assert.equal(x, y);
          else assertClose(x, y, { abs: 1e-6 }, `${shape}: Box–Cox interval end ${j}`);
        }
      } else {
        assert.ok("skipped" in a.boxCox);
      }
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  });
}
