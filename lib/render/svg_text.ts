/**
 * Every line of text in a static chart gets the width it was laid out with.
 *
 * Vega places text by the widths text_width.ts measures (the Arimo / Arial
 * advance widths). A viewer that draws the SVG with a wider fallback font
 * (DejaVu Sans runs 12–26% wider than Arial) would push titles past the
 * chart's edge and into the next panel. SVG's `textLength` with
 * `lengthAdjust="spacingAndGlyphs"` (SVG 1.1, §10.5) makes every viewer fit
 * each line into exactly the measured width, so nothing is clipped and
 * nothing overlaps, whatever fonts the viewer has; with Arimo or Arial the
 * text is drawn at its natural width.
 *
 * @module
 */
import { textWidth } from "./text_width.ts";

const _ENTITY: Readonly<Record<string, string>> = {
  amp: "&",
  lt: "<",
  gt: ">",
  quot: '"',
  apos: "'",
};

/** XML text content to plain text (the five named entities and numeric references). */
export function _unescapeXml(s: string): string {
  return s.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|[a-z]+);/g, (m, e: string) => {
    if (e[0] === "#") {
      const cp = e[1] === "x" ? parseInt(e.slice(2), 16) : parseInt(e.slice(1), 10);
      return Number.isFinite(cp) && cp <= 0x10ffff ? String.fromCodePoint(cp) : m;
    }
    return _ENTITY[e] ?? m;
  });
}

function _length(text: string, size: number, bold: boolean): string | undefined {
  const plain = _unescapeXml(text);
  if (plain.trim() === "") return undefined;
  const w = textWidth(plain, size, bold);
  return ` textLength="${Math.round(w * 100) / 100}" lengthAdjust="spacingAndGlyphs"`;
}

/**
 * Add `textLength` (the measured width) to every text line of a vega SVG:
 * on a `<text>` holding one line, on each `<tspan>` of a multi-line one.
 *
 * @param svg an SVG document as vega's `toSVG()` writes it
 * @example
 * ```ts
 * import { fitTextLengths } from "./svg_text.ts";
 * const out = fitTextLengths('<svg><text font-size="10px">ab</text></svg>');
 * if (!/<text font-size="10px" textLength="[\d.]+" lengthAdjust="spacingAndGlyphs">ab<\/text>/.test(out)) {
 *   throw new Error(out);
 * }
 * ```
 */
export function fitTextLengths(svg: string): string {
  return svg.replace(
    /<text([^>]*)>([\s\S]*?)<\/text>/g,
    (whole, attrs: string, body: string) => {
      if (/\btextLength=/.test(attrs)) return whole;
      const size = Number(attrs.match(/\bfont-size="([\d.]+)(?:px)?"/)?.[1] ?? 11);
      const weight = attrs.match(/\bfont-weight="([^"]*)"/)?.[1] ?? "normal";
      const bold = weight === "bold" || weight === "bolder" || Number(weight) >= 600;
      if (!body.includes("<tspan")) {
        const len = _length(body, size, bold);
        return len === undefined ? whole : `<text${attrs}${len}>${body}</text>`;
      }
      const lines = body.replace(
        /<tspan([^>]*)>([^<]*)<\/tspan>/g,
        (span, a: string, t: string) => {
          const len = _length(t, size, bold);
          return len === undefined || /\btextLength=/.test(a)
            ? span
            : `<tspan${a}${len}>${t}</tspan>`;
        },
      );
      return `<text${attrs}>${lines}</text>`;
    },
  );
}
