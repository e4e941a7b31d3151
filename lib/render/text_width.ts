/**
 * Text widths for static SVG rendered without a canvas. Vega's fallback
 * estimate (0.8 em per character) is far too wide for a proportional font,
 * so titles and axis labels make charts wider and taller than they are;
 * this estimate uses per-character advance widths instead.
 *
 * Widths are the advance widths of Arimo, regular and bold (the font the PNG
 * raster draws with; it has Arial's metrics, which browsers get from Arial,
 * Helvetica or Liberation Sans, the first families charts ask for), read
 * from the font files by tools/fonts/make_glyph_widths.ts into
 * _glyph_widths.ts for 631 characters (ASCII, Latin-1, Latin Extended-A,
 * Greek, punctuation, super- and subscripts, arrows, mathematical operators).
 * Other characters count as 0.6 em, or 1 em from U+2E80 on (CJK and wider
 * scripts, emoji). The PNG raster draws text at exactly these widths; in an
 * SVG, every line carries its measured width as `textLength` (svg_text.ts),
 * so a viewer with a wider fallback font (DejaVu Sans) fits it too.
 *
 * @module
 */
import { GLYPH_WIDTHS } from "./_glyph_widths.ts";

function _advance(c: number, bold: boolean): number {
  for (const [first, regular, heavy] of GLYPH_WIDTHS) {
    const k = c - first;
    if (k >= 0 && k < regular.length) {
      const w = (bold ? heavy : regular)[k];
      if (w > 0) return w;
      break;
    }
  }
  return c >= 0x2e80 ? 1000 : 600;
}

// ASCII is by far the commonest case: look it up directly.
const _ASCII = [false, true].map((bold) =>
  Float64Array.from({ length: 95 }, (_, k) => _advance(k + 32, bold))
);

/**
 * The estimated width in pixels of `text` at `fontSize`, optionally bold.
 *
 * @example
 * ```ts
 * import { textWidth } from "./text_width.ts";
 * if (!(textWidth("MMM", 12) > textWidth("iii", 12))) throw new Error("proportional");
 * ```
 */
export function textWidth(text: string, fontSize: number, bold = false): number {
  const ascii = _ASCII[bold ? 1 : 0];
  let units = 0;
  for (const ch of text) {
    const c = ch.codePointAt(0)!;
    units += c >= 32 && c <= 126 ? ascii[c - 32] : _advance(c, bold);
  }
  return (units / 1000) * fontSize;
}

/** Vega's scenegraph item, as far as text measurement needs it. */
interface _TextItem {
  readonly fontSize?: number;
  readonly fontWeight?: string | number;
  readonly text?: unknown;
  readonly limit?: number;
}

/**
 * A replacement for vega's `textMetrics.width(item, text)`.
 *
 * @example
 * ```ts
 * import { vegaTextWidth } from "./text_width.ts";
 * const w = vegaTextWidth({ fontSize: 10 }, "normal score z");
 * if (!(w > 55 && w < 75)) throw new Error(String(w));
 * ```
 */
export function vegaTextWidth(item: _TextItem, text?: unknown): number {
  const size = item.fontSize != null ? +item.fontSize || 0 : 11;
  const s = text == null ? "" : String(text).trim();
  const w = item.fontWeight;
  const bold = w === "bold" || (typeof w === "number" && w >= 600);
  return textWidth(s, size, bold);
}
