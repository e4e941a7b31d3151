/**
 * Text widths for static SVG rendered without a canvas. Vega's fallback
 * estimate (0.8 em per character) is far too wide for a proportional font,
 * so titles and axis labels make charts wider and taller than they are;
 * this estimate uses per-character advance widths instead.
 *
 * Widths are the advance widths of Helvetica in thousandths of an em, as in
 * Adobe's published font metrics for the standard PostScript fonts (values
 * from memory, to the nearest unit), scaled by 1.08 because the sans-serif
 * fonts found on Linux (DejaVu Sans, Liberation Sans) run a little wider;
 * bold adds 6%. Characters outside ASCII count as 0.6 em. The estimate errs
 * slightly wide, so text is never clipped.
 *
 * @module
 */

// Advance widths for ASCII 32…126, thousandths of an em (Helvetica).
const _W = [
  278,
  278,
  355,
  556,
  556,
  889,
  667,
  191,
  333,
  333,
  389,
  584,
  278,
  333,
  278,
  278, // space … /
  556,
  556,
  556,
  556,
  556,
  556,
  556,
  556,
  556,
  556, // 0 … 9
  278,
  278,
  584,
  584,
  584,
  556,
  1015, // : ; < = > ? @
  667,
  667,
  722,
  722,
  667,
  611,
  778,
  722,
  278,
  500,
  667,
  556,
  833, // A … M
  722,
  778,
  667,
  778,
  722,
  667,
  611,
  722,
  667,
  944,
  667,
  667,
  611, // N … Z
  278,
  278,
  278,
  469,
  556,
  333, // [ \ ] ^ _ `
  556,
  556,
  500,
  556,
  556,
  278,
  556,
  556,
  222,
  222,
  500,
  222,
  833, // a … m
  556,
  556,
  556,
  556,
  333,
  500,
  278,
  556,
  500,
  722,
  500,
  500,
  500, // n … z
  334,
  260,
  334,
  584, // { | } ~
];

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
  let units = 0;
  for (const ch of text) {
    const c = ch.codePointAt(0)!;
    units += c >= 32 && c <= 126 ? _W[c - 32] : 600;
  }
  return (units / 1000) * fontSize * 1.08 * (bold ? 1.06 : 1);
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
