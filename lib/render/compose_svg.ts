/**
 * Several drawn charts as one SVG document, for saving a view that holds more
 * than one chart (a card's QQ plot and histogram) as a single `.svg` or `.png`.
 * Each chart keeps its own drawing, placed in rows left to right; element ids
 * are prefixed per chart so that two charts never share one.
 *
 * @module
 */
import { escapeHtml } from "./escape.ts";

/** Options for {@linkcode composeSvg}. */
export interface ComposeOptions {
  /**
   * The widest a row may be before the next chart starts a new row, in pixels.
   * @default 1200
   */
  readonly maxWidth?: number;
  /**
   * Space between charts, in pixels.
   * @default 16
   */
  readonly gap?: number;
  /**
   * The document's title (its `<title>`).
   * @default undefined (none)
   */
  readonly title?: string;
}

function _size(svg: string): { width: number; height: number } {
  const open = svg.match(/<svg\b[^>]*>/)?.[0] ?? "";
  const w = Number(open.match(/\bwidth="([\d.]+)"/)?.[1]);
  const h = Number(open.match(/\bheight="([\d.]+)"/)?.[1]);
  if (!(w > 0) || !(h > 0)) throw new Error("A chart's SVG has no width and height");
  return { width: w, height: h };
}

/** The chart's SVG with every id (and every reference to one) prefixed. */
function _prefixIds(svg: string, prefix: string): string {
  return svg
    .replace(/\bid="([^"]+)"/g, (_, id) => `id="${prefix}${id}"`)
    .replace(/url\(#([^)]+)\)/g, (_, id) => `url(#${prefix}${id})`)
    .replace(/\b(xlink:href|href)="#([^"]+)"/g, (_, a, id) => `${a}="#${prefix}${id}"`)
    .replace(
      /\baria-labelledby="([^"]+)"/g,
      (_, ids: string) =>
        `aria-labelledby="${ids.split(/\s+/).map((id) => prefix + id).join(" ")}"`,
    );
}

/**
 * Place SVG documents (as made by plumbline's renderers: `width` and `height`
 * on the root) in one document, in rows. One chart is returned as it is.
 *
 * @param svgs the charts' SVG documents, in order
 * @param options the widest row, the gap, the document's title
 * @example
 * ```ts
 * import { composeSvg } from "./compose_svg.ts";
 * const a = '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="50"><rect id="r" width="10" height="10"/></svg>';
 * const both = composeSvg([a, a], { gap: 10 });
 * if (!both.includes('width="210" height="50"') || !both.includes('id="c1-r"')) throw new Error(both);
 * ```
 */
export function composeSvg(svgs: readonly string[], options: ComposeOptions = {}): string {
  if (svgs.length === 0) throw new Error("No chart to compose");
  if (svgs.length === 1) return svgs[0];
  const maxWidth = options.maxWidth ?? 1200;
  const gap = options.gap ?? 16;
  const placed: string[] = [];
  let x = 0, y = 0, rowHeight = 0, width = 0;
  svgs.forEach((svg, i) => {
    const size = _size(svg);
    if (x > 0 && x + size.width > maxWidth) {
      y += rowHeight + gap;
      x = 0;
      rowHeight = 0;
    }
    const inner = _prefixIds(svg.replace(/^<\?xml[^>]*>\s*/, ""), `c${i}-`)
      .replace(/^<svg\b/, `<svg x="${x}" y="${y}"`);
    placed.push(inner);
    width = Math.max(width, x + size.width);
    rowHeight = Math.max(rowHeight, size.height);
    x += size.width + gap;
  });
  const height = y + rowHeight;
  const title = options.title ? `<title>${escapeHtml(options.title)}</title>` : "";
  return `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" ` +
    `version="1.1" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">` +
    `${title}<rect width="${width}" height="${height}" fill="#ffffff"/>${placed.join("")}</svg>`;
}
