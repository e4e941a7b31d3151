/**
 * Charts as display bundles.
 *
 * A chart shown on its own ({@linkcode chart}) displays as the Vega-Lite spec,
 * the same chart as `image/png`, and a plain-text summary — and no HTML, on
 * purpose. Each viewer takes the first type it ranks highest: JupyterLab
 * ranks HTML (50) above Vega-Lite (57) above PNG (90), so with HTML present
 * it would never run the spec; without it, JupyterLab runs the interactive
 * chart (the λ explorer's slider works there). The classic Notebook page
 * renders no Vega-Lite and shows `image/png` whether or not the notebook is
 * trusted (PNG is one of its "safe" types, while HTML would be sanitised
 * first); nbconvert's HTML export and code hosts show the PNG too. Kernels
 * cannot attach image metadata (the Deno kernel sends none), so this PNG is
 * drawn at 1 device pixel per CSS pixel, to show at the chart's size.
 *
 * Views that hold charts among text and tables (the card, the group view,
 * the candidate panel) are HTML; their charts come from
 * {@linkcode chartBundle}'s `text/html`: a 2× PNG as an `<img>` (see
 * chart_image.ts for why not inline SVG).
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import {
  DISPLAY,
  type Displayable,
  lazyDisplayable,
  type MimeBundle,
  type ReadyDisplayable,
  VEGALITE_MIME,
} from "../results/display.ts";
import { OUTPUT_BUDGET } from "./budget.ts";
import { chartImageHtml, drawChart, type DrawnChart, pngBase64 } from "./chart_image.ts";
import { plainText } from "./escape.ts";
import { savable, type SavedFile, saveDisplay } from "./save.ts";
import { accessibleSvg, renderSvg } from "./svg.ts";

/** Options for {@linkcode chartBundle} and {@linkcode chart}. */
export interface ChartMeta {
  /**
   * Short name of the chart.
   * @default the spec's title text (and subtitle), or "Chart"
   */
  readonly title?: string;
  /**
   * What the chart shows, in sentences.
   * @default the spec's `description`, or the title
   */
  readonly description?: string;
  /**
   * The most bytes the chart's PNG may take; a larger one is drawn at a lower
   * scale. Views holding several charts share the output's 300 KB this way.
   * @default 100,000, or less when the spec is large, so that spec and
   * picture together stay within one output's budget
   */
  readonly maxPngBytes?: number;
}

function _text(t: unknown): string {
  if (typeof t === "string") return t;
  if (Array.isArray(t)) return t.map(String).join(" ");
  return "";
}

/** The title of a spec, as one line of text (title text, then subtitle). */
export function _specTitle(spec: TopLevelSpec): string {
  const t = (spec as { title?: unknown }).title;
  if (t === undefined) return "";
  if (typeof t === "string" || Array.isArray(t)) return _text(t);
  const o = t as { text?: unknown; subtitle?: unknown };
  const sub = _text(o.subtitle);
  return _text(o.text) + (sub ? ` — ${sub}` : "");
}

/** A spec's title and description for its picture: from `meta`, else from the spec. */
export function chartMeta(
  spec: TopLevelSpec,
  meta: ChartMeta = {},
): { title: string; description: string } {
  const title = meta.title ?? (_specTitle(spec) || "Chart");
  const description = meta.description ??
    ((spec as { description?: string }).description ?? title);
  return { title, description };
}

/**
 * The bundle of a chart already drawn: `application/vnd.vegalite.v5+json`,
 * `text/html` (a `<div>` holding the PNG as an `<img>` with the title and
 * description as alt text) and `text/plain`.
 */
export function drawnChartBundle(spec: TopLevelSpec, drawn: DrawnChart): MimeBundle {
  return Object.freeze({
    [VEGALITE_MIME]: spec,
    "text/html": chartImageHtml(drawn),
    "text/plain": plainText(`${drawn.title}\n${drawn.description}`),
  });
}

/**
 * Build the bundle of a chart for views that hold it among text:
 * `application/vnd.vegalite.v5+json`, `text/html` (a `<div>` holding the
 * chart's 2× PNG as an `<img>` with the title and description as alt text)
 * and `text/plain`.
 *
 * @param spec a Vega-Lite 5 spec with inline data
 * @param meta title and description (defaults from the spec)
 * @example
 * ```ts
 * import { chartBundle } from "./chart_bundle.ts";
 * const b = await chartBundle({
 *   $schema: "https://vega.github.io/schema/vega-lite/v5.json",
 *   data: { values: [{ a: 1 }] },
 *   mark: "tick",
 *   encoding: { x: { field: "a", type: "quantitative" } },
 * }, { title: "One tick", description: "A single tick at 1." });
 * if (!b["text/html"]?.includes('alt="One tick. A single tick at 1."')) throw new Error("html");
 * ```
 */
export async function chartBundle(spec: TopLevelSpec, meta: ChartMeta = {}): Promise<MimeBundle> {
  return drawnChartBundle(spec, await drawChart(spec, chartMeta(spec, meta)));
}

/**
 * The display bundle of a chart shown on its own: `application/vnd.vegalite.v5+json`,
 * `image/png` (1×, base64) and `text/plain` (see the module documentation for why no HTML).
 *
 * @param spec a Vega-Lite 5 spec with inline data
 * @param meta title and description (defaults from the spec)
 * @example
 * ```ts
 * import { chartDisplayBundle } from "./chart_bundle.ts";
 * const b = await chartDisplayBundle(
 *   { data: { values: [{ a: 1 }] }, mark: "tick", encoding: { x: { field: "a", type: "quantitative" } } },
 *   { title: "One tick", description: "A single tick at 1." },
 * );
 * if (!b["image/png"]?.startsWith("iVBORw0KGgo") || "text/html" in b) throw new Error("bundle");
 * ```
 */
export async function chartDisplayBundle(
  spec: TopLevelSpec,
  meta: ChartMeta = {},
): Promise<MimeBundle> {
  // The spec travels beside the picture: what it leaves of the output's budget
  // (less a margin for the text), in PNG bytes (base64 takes 4/3). A notebook
  // stores the spec as JSON with a space after every separator: 1.25×.
  const specBytes = new TextEncoder().encode(JSON.stringify(spec)).length;
  const room = Math.floor(((OUTPUT_BUDGET - 20_000 - 1.25 * specBytes) * 3) / 4);
  const maxPngBytes = Math.max(10_000, Math.min(meta.maxPngBytes ?? Infinity, room));
  const drawn = await drawChart(spec, { ...chartMeta(spec, meta), maxPngBytes, scales: [1, 0.75] });
  return Object.freeze({
    [VEGALITE_MIME]: spec,
    "image/png": pngBase64(drawn.raster.png),
    "text/plain": plainText(`${drawn.title}\n${drawn.description}`),
  });
}

/**
 * A chart's static SVG document, with its title and description as
 * `<title>` and `<desc>` (what `.svg` files hold).
 *
 * @param spec a Vega-Lite 5 spec with inline data
 * @param meta title and description (defaults from the spec)
 * @example
 * ```ts
 * import { specSvg } from "./chart_bundle.ts";
 * const svg = await specSvg({ data: { values: [{ a: 1 }] }, mark: "tick", encoding: { x: { field: "a", type: "quantitative" } } }, { title: "One tick" });
 * if (!svg.startsWith("<svg") || !svg.includes(">One tick</title>")) throw new Error(svg);
 * ```
 */
export async function specSvg(spec: TopLevelSpec, meta: ChartMeta = {}): Promise<string> {
  return accessibleSvg(await renderSvg(spec), chartMeta(spec, meta));
}

/** A chart that notebooks can display, with its spec. */
export interface Chart extends Displayable {
  /** The Vega-Lite spec. */
  readonly spec: TopLevelSpec;
  /**
   * Write the chart to a file; the type follows the extension: `.svg`, `.png`
   * (2×), `.html` (a static page with the SVG inline), `.json` (the Vega-Lite
   * spec), `.md` or `.txt` (its title and description).
   */
  save(path: string): Promise<SavedFile>;
  /** Render now; the result displays without further work. */
  prepare(): Promise<ReadyDisplayable>;
}

/**
 * A displayable chart: its bundle is rendered on first display (the Deno
 * kernel awaits the async display method) and cached; `await c.prepare()`
 * renders ahead of time and returns an object whose display is synchronous.
 *
 * Given a function instead of a spec, the chart is lazy: the function runs
 * once, on the first read of `spec` or the first display, and its spec is
 * kept — so a chain can hand out charts without computing them.
 *
 * @param spec a Vega-Lite 5 spec with inline data, or a function that makes one
 * @param meta title and description (defaults from the spec)
 * @example
 * ```ts
 * import { chart } from "./chart_bundle.ts";
 * import { DISPLAY } from "@plumbline/plumbline";
 * const made: string[] = [];
 * const c = chart(() => {
 *   made.push("spec");
 *   return { data: { values: [{ a: 1 }] }, mark: "tick", encoding: { x: { field: "a", type: "quantitative" } } };
 * });
 * if (made.join() !== "") throw new Error("nothing is computed before it is needed");
 * const ready = await c.prepare();
 * if (!ready[DISPLAY]()["image/png"] || !c.spec) throw new Error("prepared");
 * if (made.join() !== "spec") throw new Error("the spec is made once");
 * ```
 */
export function chart(spec: TopLevelSpec | (() => TopLevelSpec), meta: ChartMeta = {}): Chart {
  let made: TopLevelSpec | undefined = typeof spec === "function" ? undefined : spec;
  const get = (): TopLevelSpec => (made ??= (spec as () => TopLevelSpec)());
  const lazy = lazyDisplayable(() => chartDisplayBundle(get(), meta));
  return Object.freeze({
    get spec() {
      return get();
    },
    [DISPLAY]: lazy[DISPLAY],
    prepare: lazy.prepare,
    save: (path: string) => {
      const svg = () => specSvg(get(), meta);
      const own = { [DISPLAY]: lazy[DISPLAY], toJSON: () => get() };
      const what = chartMeta(get(), meta).title;
      return saveDisplay(
        path,
        savable(own, what, { charts: async () => [await svg()], html: svg }),
      );
    },
  });
}
