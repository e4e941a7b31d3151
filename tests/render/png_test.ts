import assert from "node:assert/strict";
import { crc32, encodePng, pngSize } from "../../lib/render/png.ts";
import { Resvg } from "../../lib/_deps/resvg.ts";
import { rasterize } from "../../lib/render/raster.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { decodePng } from "../../tools/notebooks/png_read.ts";

function randomImage(width: number, height: number, opaque: boolean, seed: number): Uint8Array {
  const u = seededRandom(seed);
  const px = new Uint8Array(width * height * 4);
  for (let i = 0; i < px.length; i++) {
    // Runs of equal bytes and noise.
    px[i] = i % 4 === 3 && opaque ? 255 : (i % 97 < 40 ? 200 : u.integer(256));
  }
  return px;
}

Deno.test("crc32 gives the standard check value for '123456789'", () => {
  // 0xCBF43926: the check value of CRC-32 (ISO 3309 / ITU-T V.42, the CRC of PNG Annex D),
  // as listed in Williams (1993), "A painless guide to CRC error detection algorithms".
  assert.equal(crc32(new TextEncoder().encode("123456789")), 0xcbf43926);
});

Deno.test("encodePng round-trips RGB and RGBA pixels exactly, with text and density", () => {
  for (
    const [w, h, opaque, seed] of [[1, 1, true, 1], [7, 5, true, 2], [33, 17, false, 3]] as const
  ) {
    const px = randomImage(w, h, opaque, seed);
    const png = encodePng(px, {
      width: w,
      height: h,
      text: { Title: "x ≤ y" },
      pixelsPerMetre: 7559,
    });
    assert.deepEqual(pngSize(png), { width: w, height: h });
    const back = decodePng(png);
    assert.deepEqual([back.width, back.height], [w, h]);
    assert.deepEqual(back.rgba, px);
    assert.equal(back.text.Title, "x ? y"); // outside Latin-1 becomes "?"
    assert.equal(back.pixelsPerMetre, 7559);
    // Opaque images are stored as RGB (colour type 2), others as RGBA (6).
    assert.equal(png[25], opaque ? 2 : 6);
  }
});

Deno.test("resvg's own PNG decoder reads encodePng's output as the same pixels", async () => {
  await rasterize('<svg xmlns="http://www.w3.org/2000/svg" width="1" height="1"/>'); // loads resvg
  const w = 24, h = 10;
  const px = randomImage(w, h, true, 9);
  const png = encodePng(px, { width: w, height: h });
  let b64 = "";
  for (const byte of png) b64 += String.fromCharCode(byte);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}">` +
    `<image width="${w}" height="${h}" image-rendering="optimizeSpeed" ` +
    `href="data:image/png;base64,${btoa(b64)}"/></svg>`;
  const r = new Resvg(svg, { font: { loadSystemFonts: false } });
  const img = r.render();
  try {
    assert.deepEqual([img.width, img.height], [w, h]);
    assert.deepEqual(new Uint8Array(img.pixels), px);
  } finally {
    img.free();
    r.free();
  }
});

Deno.test("encodePng refuses a buffer of the wrong size", () => {
  assert.throws(
    () => encodePng(new Uint8Array(7), { width: 1, height: 2 }),
    /Cannot encode 7 bytes as a 1×2 RGBA image: give width × height × 4 bytes/,
  );
  assert.equal(pngSize(new Uint8Array(30)), undefined);
});
