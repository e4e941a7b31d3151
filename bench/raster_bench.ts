/**
 * The raster's cost: each chart kind drawn as PNG (resvg + plumbline's encoder) at 2×,
 * and the split between resvg's drawing and the PNG encoding. Targets: a chart's raster
 * ≤ 100 KB; one variable's full display at n = 1e6, raster included, ≤ 400 ms
 * (bench/render_bench.ts).
 *
 * Run: `deno bench --allow-read --allow-env bench/raster_bench.ts`
 *
 * @module
 */
import { Resvg } from "../lib/_deps/resvg.ts";
import { encodePng } from "../lib/render/png.ts";
import { rasterize } from "../lib/render/raster.ts";
import { renderSvg } from "../lib/render/svg.ts";
import { KINDS, specsFor } from "../tests/render/_samples.ts";

// Invented data: a right-skewed sample (see tests/render/_samples.ts).
const specs = specsFor(1000, "net fill volume (mL)");
const svgs = Object.fromEntries(
  await Promise.all(KINDS.map(async (k) => [k, await renderSvg(specs[k])] as const)),
);
await rasterize(svgs.qq); // load the WebAssembly module and the fonts once

for (const kind of KINDS) {
  const svg = svgs[kind];
  Deno.bench({
    name: `${kind}: SVG → PNG at 2×`,
    group: "raster",
    fn: async () => void await rasterize(svg),
  });
}

const qq = new Resvg(svgs.qq, {
  fitTo: { mode: "zoom", value: 2 },
  font: { loadSystemFonts: false },
});
const image = qq.render();
const pixels = image.pixels;
Deno.bench({
  name: "qq: resvg draws (no text fonts)",
  group: "split",
  fn: () => {
    const r = new Resvg(svgs.qq, {
      fitTo: { mode: "zoom", value: 2 },
      font: { loadSystemFonts: false },
    });
    r.render().free();
    r.free();
  },
});
Deno.bench({
  name: "qq: PNG encoding of the pixels",
  group: "split",
  fn: () => void encodePng(pixels, { width: image.width, height: image.height }),
});
