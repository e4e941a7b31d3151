/**
 * One variable's full display as a user gets it: `plumb(x)` shown in a
 * notebook — the analysis (sort, tests, reading), both charts as Vega-Lite,
 * static SVG and PNG (the raster), and the card's HTML — and each chart's
 * PNG size. Target: ≤ 400 ms at n = 1e6, ≤ 100 KB per chart's PNG.
 *
 * Run: `deno bench --allow-read --allow-env bench/card_bench.ts`
 *
 * @module
 */
import { DISPLAY, plumb } from "../mod.ts";
import { seededRandom } from "../lib/numeric/random.ts";
import { cardSpecs } from "../lib/render/card.ts";
import { drawChart } from "../lib/render/chart_image.ts";
import { chartMeta } from "../lib/render/chart_bundle.ts";

/** Invented data: exp(1 + 0.5·Z), Z seeded standard normals. */
function sample(n: number): Float64Array {
  const rng = seededRandom(2026);
  return Float64Array.from({ length: n }, () => Math.exp(1 + 0.5 * rng.normal()));
}

// Load the raster engine and fonts once, outside the timings.
await plumb(sample(100), "warm-up")[DISPLAY]();

for (const n of [1e3, 1e5, 1e6]) {
  const x = sample(n);
  const p = plumb(x, "net fill volume (mL)");
  const specs = cardSpecs(p.analysis(), p.label);
  for (const [kind, spec] of Object.entries(specs)) {
    const drawn = await drawChart(spec, chartMeta(spec));
    console.log(
      `n = ${n}: ${kind} PNG ${drawn.raster.png.length} bytes at ${drawn.raster.scale}×`,
    );
  }
  Deno.bench({
    name: `card of one variable (analysis, charts, raster), n = ${n}`,
    group: "card",
    async fn() {
      await plumb(x, "net fill volume (mL)")[DISPLAY]();
    },
  });
}
