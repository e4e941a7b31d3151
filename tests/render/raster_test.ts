import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { pngSize } from "../../lib/render/png.ts";
import { rasterize } from "../../lib/render/raster.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { decodePng, inkFraction } from "../../tools/notebooks/png_read.ts";
import { KINDS, specsFor } from "./_samples.ts";

const specs = specsFor(1000, "net fill volume (mL)");

for (const kind of KINDS) {
  Deno.test(`${kind}: the raster is a PNG of the chart's size at 2×, not blank, ≤ 100 KB, reproducible`, async () => {
    const svg = await renderSvg(specs[kind]);
    const [, w, h] = svg.match(/^<svg[^>]* width="(\d+)" height="(\d+)"/)!.map(Number);
    const options = { title: "a title", description: "what it shows" };
    const r = await rasterize(svg, options);
    assert.deepEqual([r.width, r.height, r.scale], [w, h, 2]);
    assert.deepEqual(pngSize(r.png), { width: 2 * w, height: 2 * h });
    assert.ok(r.png.length <= 100_000, `${kind}: ${r.png.length} bytes`);
    const img = decodePng(r.png);
    const ink = inkFraction(img);
    // Axes, points, bands and text cover a few percent of a chart; a blank or
    // background-only image has none.
    assert.ok(ink > 0.02 && ink < 0.6, `${kind}: ink ${ink}`);
    assert.equal(img.text.Title, "a title");
    assert.equal(img.text.Description, "what it shows");
    assert.equal(img.pixelsPerMetre, Math.round(192 / 0.0254));
    assert.deepEqual((await rasterize(svg, options)).png, r.png);
  });
}

Deno.test("text is drawn with the shipped font, without system fonts", async () => {
  // Only text: with no font the picture would stay white.
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="120" height="30">' +
    '<rect width="120" height="30" fill="#ffffff"/>' +
    '<text x="4" y="22" font-family="sans-serif" font-size="20">W λ ≤ √</text>' +
    '<text x="80" y="22" font-family="sans-serif" font-weight="bold" font-size="20">W</text></svg>';
  const img = decodePng((await rasterize(svg, { scale: 1 })).png);
  assert.ok(inkFraction(img) > 0.05, `ink ${inkFraction(img)}`);
  // Arimo has Arial's widths: "W" at 20 px is 18.9 px wide (0.944 em).
  const narrow = decodePng(
    (await rasterize(
      '<svg xmlns="http://www.w3.org/2000/svg" width="60" height="30"><rect width="60" height="30" fill="#fff"/>' +
        '<text x="10" y="22" font-family="sans-serif" font-size="20">W</text></svg>',
      { scale: 1 },
    )).png,
  );
  let left = 60, right = 0;
  for (let y = 0; y < 30; y++) {
    for (let x = 0; x < 60; x++) {
      if (narrow.rgba[4 * (y * 60 + x)] < 128) {
        left = Math.min(left, x);
        right = Math.max(right, x);
      }
    }
  }
  assert.ok(right - left + 1 >= 17 && right - left + 1 <= 20, `W ink width ${right - left + 1}`);
});

Deno.test("rasterize refuses a scale outside (0, 8]", async () => {
  for (const scale of [0, -1, 9, NaN]) {
    await assert.rejects(
      rasterize('<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"/>', { scale }),
      (e: unknown) =>
        e instanceof PlumbError && e.code === "bad-option" &&
        /^Cannot draw at scale .*: give a number above 0 and at most 8/.test(e.message),
    );
  }
});
