/**
 * Long names shortened with an ellipsis in the picture, whole everywhere else.
 *
 * A column name can be any length; in a chart it appears in titles,
 * subtitles and axis titles, where vega would widen the chart for it or let
 * it run into the next panel. {@linkcode withTextLimits} shortens each such
 * string to the width of the view it belongs to, ending it with "…", measured
 * with text_width.ts at the font size the spec's config gives that element
 * (as everything else in the layout). The strings are shortened in the spec
 * itself, not with vega's `limit`: vega sizes a chart by the width of the
 * whole text when the width function is its own, as here. The spec's
 * `description`, the SVG's `<title>`/`<desc>`, tooltips and every table keep
 * the whole name.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { textWidth } from "./text_width.ts";

// deno-lint-ignore no-explicit-any
type _Node = Record<string, any>;

/** Spacing between concatenated views when the spec does not set one (CHART_CONFIG's). */
const _SPACING = 24;

function _max(xs: readonly number[]): number {
  let m = -Infinity;
  for (const x of xs) if (x > m) m = x;
  return m;
}

function _width(node: _Node): number | undefined {
  if (typeof node.width === "number") return node.width;
  const spacing = typeof node.spacing === "number" ? node.spacing : _SPACING;
  const widths = (children: _Node[]) => children.map(_width);
  if (Array.isArray(node.hconcat)) {
    const w = widths(node.hconcat);
    return w.every((x) => x !== undefined)
      ? w.reduce((a, b) => a! + b!, 0)! + spacing * (w.length - 1)
      : undefined;
  }
  if (Array.isArray(node.concat)) {
    const w = widths(node.concat);
    if (w.some((x) => x === undefined)) return undefined;
    const cols = Math.min(typeof node.columns === "number" ? node.columns : w.length, w.length);
    return cols * _max(w as number[]) + spacing * (cols - 1);
  }
  if (Array.isArray(node.vconcat)) {
    const w = widths(node.vconcat);
    return w.every((x) => x !== undefined) ? _max(w as number[]) : undefined;
  }
  if (Array.isArray(node.layer)) {
    const w = widths(node.layer).filter((x) => x !== undefined) as number[];
    return w.length > 0 ? _max(w) : undefined;
  }
  return undefined;
}

/** Font size and weight of each kind of text, from the spec's config (vega's defaults otherwise). */
interface _Fonts {
  title: [number, boolean];
  subtitle: [number, boolean];
  axisTitle: [number, boolean];
}

const _bold = (w: unknown) => w === "bold" || w === "bolder" || (typeof w === "number" && w >= 600);

function _fonts(config: _Node | undefined): _Fonts {
  const t = config?.title ?? {};
  const a = config?.axis ?? {};
  return {
    title: [t.fontSize ?? 13, _bold(t.fontWeight ?? "bold")],
    subtitle: [t.subtitleFontSize ?? 10, _bold(t.subtitleFontWeight ?? "normal")],
    axisTitle: [a.titleFontSize ?? 11, _bold(a.titleFontWeight ?? "bold")],
  };
}

/**
 * `text` shortened with "…" so that it is at most `limit` pixels wide at this
 * font size (the longest prefix that fits, as vega's own truncation does).
 *
 * @example
 * ```ts
 * import { shortenText } from "./text_limits.ts";
 * const s = shortenText("dissolved oxygen after the second rinse", 80, 11);
 * if (!s.endsWith("…") || s.length >= 39) throw new Error(s);
 * ```
 */
export function shortenText(text: string, limit: number, size: number, bold = false): string {
  if (textWidth(text, size, bold) <= limit) return text;
  const chars = [...text];
  const room = limit - textWidth("…", size, bold);
  let lo = 0, hi = chars.length;
  while (lo < hi) {
    const mid = (lo + hi + 1) >>> 1;
    if (textWidth(chars.slice(0, mid).join(""), size, bold) <= room) lo = mid;
    else hi = mid - 1;
  }
  return chars.slice(0, lo).join("").trimEnd() + "…";
}

function _lines(v: unknown, limit: number, [size, bold]: [number, boolean]): unknown {
  if (typeof v === "string") return shortenText(v, limit, size, bold);
  if (Array.isArray(v)) return v.map((x) => _lines(x, limit, [size, bold]));
  return v;
}

function _title(title: unknown, limit: number, f: _Fonts): unknown {
  if (title === undefined || title === null) return title;
  if (typeof title === "string" || Array.isArray(title)) return _lines(title, limit, f.title);
  const t = title as _Node;
  const size: [number, boolean] = [t.fontSize ?? f.title[0], _bold(t.fontWeight) || f.title[1]];
  const out: _Node = { ...t, text: _lines(t.text, limit, size) };
  if (t.subtitle !== undefined) {
    out.subtitle = _lines(t.subtitle, limit, [t.subtitleFontSize ?? f.subtitle[0], f.subtitle[1]]);
  }
  return out;
}

function _encoding(enc: _Node, w: number, h: number | undefined, f: _Fonts): _Node {
  const out: _Node = { ...enc };
  for (const [channel, def] of Object.entries(enc)) {
    if (def === null || typeof def !== "object" || Array.isArray(def)) continue;
    const d = def as _Node;
    const limit = channel === "x" || channel === "x2"
      ? w
      : channel === "y" || channel === "y2"
      ? h
      : undefined;
    if (limit === undefined || d.axis === null) continue;
    const next: _Node = { ...d };
    if (typeof d.title === "string" || Array.isArray(d.title)) {
      next.title = _lines(d.title, limit, f.axisTitle);
    }
    if (d.axis && (typeof d.axis.title === "string" || Array.isArray(d.axis.title))) {
      next.axis = { ...d.axis, title: _lines(d.axis.title, limit, f.axisTitle) };
    }
    out[channel] = next;
  }
  return out;
}

/** Room a chart's own title has beyond its plot: the y axis beside it (no neighbour to run into). */
const _ROOT_EXTRA = 60;

function _walk(
  node: _Node,
  inherited: [number | undefined, number | undefined],
  f: _Fonts,
  root = false,
): _Node {
  const w = _width(node) ?? inherited[0];
  const out: _Node = { ...node };
  if (w !== undefined && "title" in node) {
    out.title = _title(node.title, root ? w + _ROOT_EXTRA : w, f);
  }
  const h = typeof node.height === "number" ? node.height : inherited[1];
  if (w !== undefined && node.encoding) out.encoding = _encoding(node.encoding, w, h, f);
  for (const key of ["layer", "hconcat", "vconcat", "concat"]) {
    if (Array.isArray(node[key])) {
      // Children of a layer share its width and height; concatenated views have their own.
      const size: [number | undefined, number | undefined] = key === "layer"
        ? [w, h]
        : [undefined, undefined];
      out[key] = node[key].map((c: _Node) => _walk(c, size, f));
    }
  }
  if (node.spec && typeof node.spec === "object") {
    out.spec = _walk(node.spec, [undefined, undefined], f);
  }
  return out;
}

/**
 * A copy of `spec` in which every title, subtitle and axis title is shortened
 * with "…" to the width (axis titles of y: the height) of its view; the
 * chart's own title (not a panel's) may also use the room of its y axis.
 *
 * @param spec a Vega-Lite spec whose views have numeric widths
 * @example
 * ```ts
 * import { withTextLimits } from "./text_limits.ts";
 * const name = "net fill volume at the filler outlet, corrected for temperature (mL)";
 * const s = withTextLimits({
 *   title: { text: name, subtitle: "normal QQ plot" },
 *   width: 200, height: 150, mark: "point", data: { values: [] },
 *   encoding: { x: { field: "z", type: "quantitative", title: name } },
 * }) as { title: { text: string }; encoding: { x: { title: string } } };
 * if (!s.title.text.endsWith("…") || !s.encoding.x.title.endsWith("…")) throw new Error("limits");
 * ```
 */
export function withTextLimits(spec: TopLevelSpec): TopLevelSpec {
  const node = spec as _Node;
  return _walk(node, [undefined, undefined], _fonts(node.config), true) as TopLevelSpec;
}
