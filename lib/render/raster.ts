/**
 * SVG to PNG in-process: resvg (WebAssembly) draws the chart with the Arimo
 * font shipped as a dependency, so the picture needs no browser, no canvas
 * and no system fonts, and comes out the same on every machine. The PNG is
 * written by plumbline's own encoder (png.ts), which is lossless and about a
 * third smaller than resvg's.
 *
 * The WebAssembly module and the fonts are read from Deno's package cache
 * once per process, on the first raster (this needs read access to it, which
 * a notebook kernel has).
 *
 * @module
 */
import { ARIMO_FAMILY, ARIMO_FONT_URLS } from "../_deps/arimo_font.ts";
import { initWasm, Resvg, RESVG_WASM_URL } from "../_deps/resvg.ts";
import { PlumbError } from "../errors.ts";
import { encodePng } from "./png.ts";

/** Options for {@linkcode rasterize}. */
export interface RasterOptions {
  /**
   * Device pixels per SVG pixel: 2 keeps text sharp on high-density screens
   * and in slides; 1 makes the smallest file.
   * @default 2
   */
  readonly scale?: number;
  /**
   * Written into the PNG as its `Title` text chunk.
   * @default undefined (none)
   */
  readonly title?: string;
  /**
   * Written into the PNG as its `Description` text chunk.
   * @default undefined (none)
   */
  readonly description?: string;
}

/** A chart as PNG, with the size it is meant to be shown at. */
export interface Raster {
  /** The PNG file's bytes. */
  readonly png: Uint8Array;
  /** Width to show it at, in CSS pixels (the SVG's width). */
  readonly width: number;
  /** Height to show it at, in CSS pixels (the SVG's height). */
  readonly height: number;
  /** Device pixels per CSS pixel. */
  readonly scale: number;
}

let _engine: Promise<Uint8Array[]> | undefined;

async function _load(): Promise<Uint8Array[]> {
  try {
    await initWasm(await Deno.readFile(new URL(RESVG_WASM_URL)));
    return await Promise.all(ARIMO_FONT_URLS.map((u) => Deno.readFile(new URL(u))));
  } catch (e) {
    _engine = undefined; // let a later call try again (e.g. after a permission prompt)
    throw new PlumbError(
      "unavailable",
      `Cannot load the PNG renderer or its font: ${(e as Error).message}; ` +
        "run with read access to Deno's package cache (--allow-read), or save as .svg",
    );
  }
}

const _MAX_PIXELS = 40_000_000;

/**
 * Draw an SVG document as a PNG image.
 *
 * @param svg an SVG document string (as vega writes it: `width`/`height` in pixels)
 * @param options scale and the PNG's text chunks
 * @example
 * ```ts
 * import { rasterize } from "./raster.ts";
 * const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="40" height="20">' +
 *   '<rect width="40" height="20" fill="#ffffff"/><text x="2" y="15" font-size="12">W</text></svg>';
 * const r = await rasterize(svg, { scale: 2 });
 * if (r.width !== 40 || r.height !== 20 || r.png[1] !== 0x50) throw new Error("raster");
 * ```
 */
export async function rasterize(svg: string, options: RasterOptions = {}): Promise<Raster> {
  const scale = options.scale ?? 2;
  if (!(scale > 0 && scale <= 8)) {
    throw new PlumbError(
      "bad-option",
      `Cannot draw at scale ${scale}: give a number above 0 and at most 8 (2 is the default)`,
    );
  }
  const fonts = await (_engine ??= _load());
  const resvg = new Resvg(svg, {
    fitTo: { mode: "zoom", value: scale },
    font: {
      fontBuffers: fonts,
      loadSystemFonts: false,
      defaultFontFamily: ARIMO_FAMILY,
      sansSerifFamily: ARIMO_FAMILY,
      serifFamily: ARIMO_FAMILY,
      monospaceFamily: ARIMO_FAMILY,
    },
  });
  try {
    const width = resvg.width;
    const height = resvg.height;
    if (Math.ceil(width * scale) * Math.ceil(height * scale) > _MAX_PIXELS) {
      throw new PlumbError(
        "too-many",
        `Cannot draw a ${width}×${height} chart at scale ${scale}: ` +
          "it would exceed 40 million pixels; use a smaller scale or save as .svg",
      );
    }
    const image = resvg.render();
    try {
      const rgba = _straightAlpha(image.pixels);
      const text: Record<string, string> = { Software: "plumbline" };
      if (options.title) text.Title = options.title;
      if (options.description) text.Description = options.description;
      const png = encodePng(rgba, {
        width: image.width,
        height: image.height,
        text,
        pixelsPerMetre: (96 * scale) / 0.0254,
      });
      return Object.freeze({ png, width, height, scale });
    } finally {
      image.free();
    }
  } finally {
    resvg.free();
  }
}

/** resvg's pixels are premultiplied by alpha; PNG stores straight alpha. */
function _straightAlpha(px: Uint8Array): Uint8Array {
  for (let i = 3; i < px.length; i += 4) {
    const a = px[i];
    if (a === 255) continue;
    if (a === 0) {
      px[i - 3] = px[i - 2] = px[i - 1] = 0;
      continue;
    }
    px[i - 3] = Math.min(255, Math.round((px[i - 3] * 255) / a));
    px[i - 2] = Math.min(255, Math.round((px[i - 2] * 255) / a));
    px[i - 1] = Math.min(255, Math.round((px[i - 1] * 255) / a));
  }
  return px;
}
