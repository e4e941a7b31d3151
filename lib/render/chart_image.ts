/**
 * A chart drawn once for every viewer: the accessible static SVG (for files
 * and slides) and its PNG raster, shown in HTML as an `<img>` with the PNG
 * inline as a data URL.
 *
 * Why an `<img>` and not the inline SVG: a notebook a colleague did not run
 * opens untrusted, and Jupyter's sanitiser then removes every `<svg>` (and
 * every style) from HTML outputs but keeps `<img>` with its `src`, `width`,
 * `height` and `alt` (it does not check the scheme of `src`); the classic
 * page renders no Vega-Lite. Code hosts and exported pages show the same
 * picture.
 *
 * @module
 */
import { Buffer } from "node:buffer";
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { escapeHtml } from "./escape.ts";
import { type Raster, rasterize } from "./raster.ts";
import { accessibleSvg, renderSvg } from "./svg.ts";

/** A chart drawn as SVG and PNG. */
export interface DrawnChart {
  /** Short name of the chart. */
  readonly title: string;
  /** What it shows, in sentences. */
  readonly description: string;
  /** The static SVG, with `role="img"`, `<title>` and `<desc>`. */
  readonly svg: string;
  /** The PNG (2×) and the size to show it at. */
  readonly raster: Raster;
}

/**
 * Draw a spec as SVG and PNG.
 *
 * @param spec a Vega-Lite 5 spec with inline data
 * @param meta the chart's title and description (for `<title>`/`<desc>`, the
 *   PNG's text chunks and the `<img>`'s alt text), the most bytes its PNG may
 *   take (at most, and by default, {@linkcode MAX_CHART_PNG_BYTES}), and the
 *   scales to try in turn until the PNG fits (default 2, 1.5, 1, 0.75)
 * @example
 * ```ts
 * import { drawChart } from "./chart_image.ts";
 * const c = await drawChart(
 *   { data: { values: [{ a: 1 }] }, mark: "tick", encoding: { x: { field: "a", type: "quantitative" } } },
 *   { title: "One tick", description: "A single tick at 1." },
 * );
 * if (!c.svg.includes("<desc") || c.raster.png[1] !== 0x50) throw new Error("drawn");
 * ```
 */
export async function drawChart(
  spec: TopLevelSpec,
  meta: {
    readonly title: string;
    readonly description: string;
    readonly maxPngBytes?: number;
    readonly scales?: readonly number[];
  },
): Promise<DrawnChart> {
  const { title, description } = meta;
  const max = Math.min(meta.maxPngBytes ?? MAX_CHART_PNG_BYTES, MAX_CHART_PNG_BYTES);
  const svg = accessibleSvg(await renderSvg(spec), { title, description });
  // 2× keeps text sharp on high-density screens; a panel whose PNG would pass
  // its budget is drawn at the next scale down.
  const [first, ...rest] = meta.scales ?? [2, 1.5, 1, 0.75];
  let raster = await rasterize(svg, { title, description, scale: first });
  for (const scale of rest) {
    if (raster.png.length <= max) break;
    raster = await rasterize(svg, { title, description, scale });
  }
  return Object.freeze({ title, description, svg, raster });
}

/** The most bytes a chart's PNG should take (larger panels are drawn at a lower scale). */
export const MAX_CHART_PNG_BYTES = 100_000;

/** The PNG as a `data:` URL. */
export function pngDataUrl(png: Uint8Array): string {
  return `data:image/png;base64,${pngBase64(png)}`;
}

/** The PNG's bytes in base64 (as notebooks store `image/png`). */
export function pngBase64(png: Uint8Array): string {
  return Buffer.from(png.buffer, png.byteOffset, png.length).toString("base64");
}

/**
 * The chart as HTML: a `<div class="plumbline-chart">` holding an `<img>` of
 * the PNG at its CSS size, with the title and description as alt text.
 *
 * @param chart a drawn chart
 * @example
 * ```ts
 * import { chartImageHtml, drawChart } from "./chart_image.ts";
 * const c = await drawChart(
 *   { data: { values: [{ a: 1 }] }, mark: "tick", encoding: { x: { field: "a", type: "quantitative" } } },
 *   { title: "One tick", description: "A single tick at 1." },
 * );
 * const html = chartImageHtml(c);
 * if (!/^<div class="plumbline-chart"[^>]*><img src="data:image\/png;base64,/.test(html)) throw new Error(html);
 * ```
 */
export function chartImageHtml(chart: DrawnChart): string {
  const { width, height } = chart.raster;
  const alt = escapeHtml(`${chart.title}. ${chart.description}`);
  return `<div class="plumbline-chart" style="display:inline-block;max-width:100%;` +
    `overflow-x:auto;background:#ffffff;border-radius:4px;line-height:0">` +
    `<img src="${pngDataUrl(chart.raster.png)}" width="${width}" height="${height}" ` +
    `alt="${alt}" title="${escapeHtml(chart.title)}" style="max-width:100%;height:auto"/></div>`;
}
