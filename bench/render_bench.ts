/**
 * Time to build the full display of one variable: QQ data (sort, envelope,
 * thinning), histogram data, both Vega-Lite specs, and both bundles with
 * their static SVG rendered by vega. Target: under 300 ms at n = 1e6.
 *
 * Run: `deno bench --allow-read --allow-env bench/render_bench.ts`
 *
 * @module
 */
import { chartBundle } from "../lib/render/chart_bundle.ts";
import { histogramSpec } from "../lib/render/histogram_spec.ts";
import { qqSpec } from "../lib/render/qq_spec.ts";
import { histogramData } from "../lib/stats/histogram_data.ts";
import { qqData } from "../lib/stats/qq_data.ts";
import { seededRandom } from "../lib/numeric/random.ts";

/** Invented data: exp(1 + 0.5·Z), Z seeded standard normals. */
function sample(n: number): Float64Array {
  const rng = seededRandom(2026);
  return Float64Array.from({ length: n }, () => Math.exp(1 + 0.5 * rng.normal()));
}

for (const n of [1e3, 1e5, 1e6]) {
  const x = sample(n);
  Deno.bench({
    name: `full display of one variable, n = ${n}`,
    group: "display",
    async fn() {
      const q = qqData(x);
      const h = histogramData(x);
      await chartBundle(qqSpec(q, { name: "x" }));
      await chartBundle(histogramSpec(h, { name: "x" }));
    },
  });
  Deno.bench({ name: `qqData, n = ${n}`, group: `parts ${n}`, fn: () => void qqData(x) });
  Deno.bench({
    name: `histogramData, n = ${n}`,
    group: `parts ${n}`,
    fn: () => void histogramData(x),
  });
  const q = qqData(x);
  const spec = qqSpec(q, { name: "x" });
  Deno.bench({
    name: `QQ bundle (spec + SVG), n = ${n}`,
    group: `parts ${n}`,
    fn: async () => void await chartBundle(spec),
  });
}
