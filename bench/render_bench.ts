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

/** Invented data: exp(1 + 0.5·Z), Z from xorshift32 and Box–Muller, seeded. */
function sample(n: number): Float64Array {
  let s = 2026;
  const u = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    out[i] = Math.exp(1 + 0.5 * Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u()));
  }
  return out;
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
