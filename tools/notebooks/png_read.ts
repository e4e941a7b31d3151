/**
 * A small PNG reader for the tests and viewer checks: 8-bit RGB or RGBA, not
 * interlaced (what plumbline's encoder and Chromium's screenshots write).
 * Returns RGBA pixels and the text chunks. Checked against resvg's own PNG
 * decoder in tests/render/png_test.ts.
 *
 * @module
 */
import { inflateSync } from "node:zlib";

/** A decoded PNG. */
export interface DecodedPng {
  width: number;
  height: number;
  /** RGBA, 4 bytes per pixel. */
  rgba: Uint8Array;
  /** tEXt chunks, keyword → text. */
  text: Record<string, string>;
  /** pHYs pixels per metre (x), when present. */
  pixelsPerMetre?: number;
}

/** Decode an 8-bit RGB/RGBA, non-interlaced PNG file. */
export function decodePng(bytes: Uint8Array): DecodedPng {
  const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let at = 8;
  let width = 0, height = 0, colourType = 0;
  const idat: Uint8Array[] = [];
  const text: Record<string, string> = {};
  let pixelsPerMetre: number | undefined;
  while (at < bytes.length) {
    const len = v.getUint32(at);
    const type = String.fromCharCode(...bytes.subarray(at + 4, at + 8));
    const data = bytes.subarray(at + 8, at + 8 + len);
    if (type === "IHDR") {
      width = v.getUint32(at + 8);
      height = v.getUint32(at + 12);
      if (data[8] !== 8 || data[12] !== 0) throw new Error("only 8-bit non-interlaced");
      colourType = data[9];
    } else if (type === "IDAT") idat.push(data);
    else if (type === "tEXt") {
      const z = data.indexOf(0);
      text[String.fromCharCode(...data.subarray(0, z))] = String.fromCharCode(
        ...data.subarray(z + 1),
      );
    } else if (type === "pHYs") pixelsPerMetre = v.getUint32(at + 8);
    at += 12 + len;
  }
  if (colourType !== 2 && colourType !== 6) throw new Error(`colour type ${colourType}`);
  const bpp = colourType === 2 ? 3 : 4;
  const joined = new Uint8Array(idat.reduce((n, c) => n + c.length, 0));
  let o = 0;
  for (const c of idat) {
    joined.set(c, o);
    o += c.length;
  }
  const raw = new Uint8Array(inflateSync(joined));
  const stride = width * bpp;
  const rows = new Uint8Array(stride * height);
  for (let y = 0; y < height; y++) {
    const f = raw[y * (stride + 1)];
    for (let i = 0; i < stride; i++) {
      const x = raw[y * (stride + 1) + 1 + i];
      const a = i >= bpp ? rows[y * stride + i - bpp] : 0;
      const b = y > 0 ? rows[(y - 1) * stride + i] : 0;
      const c = i >= bpp && y > 0 ? rows[(y - 1) * stride + i - bpp] : 0;
      let p = 0;
      if (f === 1) p = a;
      else if (f === 2) p = b;
      else if (f === 3) p = (a + b) >> 1;
      else if (f === 4) {
        const pa = Math.abs(b - c), pb = Math.abs(a - c), pc = Math.abs(a + b - 2 * c);
        p = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      rows[y * stride + i] = (x + p) & 0xff;
    }
  }
  const rgba = new Uint8Array(width * height * 4);
  for (let k = 0; k < width * height; k++) {
    rgba[4 * k] = rows[bpp * k];
    rgba[4 * k + 1] = rows[bpp * k + 1];
    rgba[4 * k + 2] = rows[bpp * k + 2];
    rgba[4 * k + 3] = bpp === 4 ? rows[bpp * k + 3] : 255;
  }
  return { width, height, rgba, text, pixelsPerMetre };
}

/** Fraction of pixels that differ from white by more than `tolerance` in any channel. */
export function inkFraction(png: DecodedPng, tolerance = 16): number {
  let ink = 0;
  for (let k = 0; k < png.width * png.height; k++) {
    const r = png.rgba[4 * k], g = png.rgba[4 * k + 1], b = png.rgba[4 * k + 2];
    if (255 - Math.min(r, g, b) > tolerance) ink++;
  }
  return ink / (png.width * png.height);
}
