/**
 * Static SVG from a Vega-Lite spec, rendered by vega without a browser or
 * canvas (`renderer: "none"`; text widths from per-character metrics, see text_width.ts), and made
 * accessible with a `<title>` and a `<desc>`.
 *
 * @module
 */
import vega from "../_deps/vega.ts";
import { compile } from "../_deps/vega_lite.ts";
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { _xmlChars, escapeHtml } from "./escape.ts";
import { fitTextLengths } from "./svg_text.ts";
import { withTextLimits } from "./text_limits.ts";
import { vegaTextWidth } from "./text_width.ts";

// Without a canvas vega estimates 0.8 em per character, which makes charts
// wider and taller than their text; measure with per-character widths instead.
// This changes plumbline's own copy of vega only (see lib/_deps/vega.ts).
(vega as unknown as { textMetrics: { width: typeof vegaTextWidth } }).textMetrics.width =
  vegaTextWidth;

/** Options for {@linkcode renderSvg}. */
export interface RenderOptions {
  /**
   * Compiler and runtime warnings are pushed here when given (tests use
   * this to require a warning-free spec).
   * @default undefined (warnings are dropped)
   */
  readonly warnings?: string[];
}

/** A vega/vega-lite logger that records warnings and errors as text. */
function _logger(sink: string[] | undefined) {
  const push = (kind: string) => (...args: readonly unknown[]) => {
    sink?.push(`${kind}: ${args.map((a) => String(a)).join(" ")}`);
    return logger;
  };
  let lvl = 0;
  const logger = {
    level(v?: number) {
      if (v === undefined) return lvl as never;
      lvl = v;
      return logger as never;
    },
    error: push("error"),
    warn: push("warning"),
    info: () => logger,
    debug: () => logger,
  };
  return logger;
}

/**
 * Compile a Vega-Lite spec and render it to an SVG string with vega.
 *
 * @param spec a Vega-Lite 5 spec with inline data
 * @param options where to collect warnings
 * @example
 * ```ts
 * import { renderSvg } from "./svg.ts";
 * const svg = await renderSvg({
 *   data: { values: [{ a: 1, b: 2 }] },
 *   mark: "point",
 *   encoding: { x: { field: "a", type: "quantitative" }, y: { field: "b", type: "quantitative" } },
 * });
 * if (!svg.startsWith("<svg")) throw new Error("svg");
 * ```
 */
export async function renderSvg(spec: TopLevelSpec, options: RenderOptions = {}): Promise<string> {
  const logger = _logger(options.warnings);
  // deno-lint-ignore no-explicit-any
  const vgSpec = compile(withTextLimits(spec), { logger: logger as any }).spec;
  // deno-lint-ignore no-explicit-any
  const view = new vega.View(vega.parse(vgSpec), { renderer: "none", logger: logger as any });
  try {
    // vega escapes markup in text but passes control characters through: an
    // SVG must stay well-formed XML whatever a name holds.
    return _xmlChars(fitTextLengths(_compactSvg(await view.toSVG())));
  } finally {
    view.finalize();
  }
}

/**
 * Round the coordinates in `d`, `transform` and `points` attributes to two
 * decimals (1/100 px): vega writes full double precision, which roughly
 * doubles the size of a scatter plot for no visible difference. Text content
 * and other attributes are left as they are.
 */
export function _compactSvg(svg: string): string {
  return svg.replace(/ (d|transform|points)="([^"]*)"/g, (_m, attr: string, value: string) => {
    const v = value.replace(/-?\d+\.\d{3,}(?:e-?\d+)?/g, (num) => {
      const r = Math.round(Number(num) * 100) / 100;
      return Object.is(r, -0) ? "0" : String(r);
    });
    return ` ${attr}="${v}"`;
  });
}

/** FNV-1a 32-bit hash (Fowler, Noll & Vo), as 8 hex digits: stable ids. */
export function _hash(s: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, "0");
}

/** Options for {@linkcode accessibleSvg}. */
export interface AccessibleOptions {
  /** Short name of the chart (the SVG `<title>`). */
  readonly title: string;
  /** What the chart shows, in sentences (the SVG `<desc>`). */
  readonly description: string;
  /**
   * Prefix of the element ids; must be unique in the page.
   * @default "plumbline-" + a hash of the SVG, title and description
   */
  readonly id?: string;
}

/**
 * Add `role="img"`, `<title>` and `<desc>` (escaped) to an SVG string, so
 * that screen readers announce what the chart shows.
 *
 * @param svg an SVG document string starting with `<svg`
 * @param options title, description, id prefix
 * @example
 * ```ts
 * import { accessibleSvg } from "./svg.ts";
 * const s = accessibleSvg("<svg width=\"1\"></svg>", { title: "a<b", description: "d", id: "c" });
 * if (!s.includes("<title id=\"c-title\">a&lt;b</title>")) throw new Error("title");
 * ```
 */
export function accessibleSvg(svg: string, options: AccessibleOptions): string {
  if (!svg.startsWith("<svg")) {
    throw new TypeError("accessibleSvg needs an SVG document string starting with <svg");
  }
  const id = options.id ??
    `plumbline-${_hash(svg + "\u0000" + options.title + "\u0000" + options.description)}`;
  const end = svg.indexOf(">");
  const open = svg.slice(0, end);
  const rest = svg.slice(end + 1);
  const attrs = ` role="img" aria-labelledby="${escapeHtml(id)}-title ${escapeHtml(id)}-desc"`;
  return `${open}${attrs}><title id="${escapeHtml(id)}-title">${
    escapeHtml(options.title)
  }</title>` +
    `<desc id="${escapeHtml(id)}-desc">${escapeHtml(options.description)}</desc>${rest}`;
}
