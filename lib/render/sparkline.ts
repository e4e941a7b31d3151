/**
 * A QQ sparkline: a tiny static SVG of ordered values against normal
 * scores with the fitted line, for one row of a screening table. Drawn
 * directly (no Vega) so that a table stays small and fast, and shown as an
 * `<img>` whose source is the SVG itself (a `data:` URL): Jupyter's sanitiser
 * removes inline `<svg>` from an untrusted notebook but keeps `<img>`, and
 * the class `unconfined` keeps the classic page from squeezing it in a table
 * cell (its style does the same in a static export).
 *
 * @module
 */
import { Buffer } from "node:buffer";
import { escapeHtml } from "./escape.ts";
import { PALETTE } from "./theme.ts";

/** The points of a sparkline: normal scores and values, aligned. */
export interface SparklineData {
  /** Normal scores (x). */
  readonly z: readonly number[];
  /** Ordered values (y). */
  readonly value: readonly number[];
  /** Line intercept (mean) and slope (sd). */
  readonly mean: number;
  readonly sd: number;
  /** −1/0/1 per point: below, inside, above the envelope. */
  readonly outside?: readonly number[];
}

/** Options for {@linkcode qqSparkline}. */
export interface SparklineOptions {
  /**
   * Width in pixels.
   * @default 90
   */
  readonly width?: number;
  /**
   * Height in pixels.
   * @default 36
   */
  readonly height?: number;
  /**
   * Accessible title.
   * @default "QQ sparkline"
   */
  readonly title?: string;
  /**
   * At most this many points are drawn (evenly spaced by rank).
   * @default 60
   */
  readonly maxPoints?: number;
}

/** Smallest and largest of two lists (a loop: no argument spread of unbounded length). */
function _range(a: readonly number[], b: readonly number[]): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const list of [a, b]) {
    for (const v of list) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return [lo, hi];
}

const _r = (v: number) => (Math.round(v * 10) / 10).toString();

/**
 * A QQ sparkline as HTML: an `<img>` of a small SVG (points as round dots on
 * two paths, the fitted line, a `<title>`), with the title as alt text;
 * deterministic.
 *
 * @param d the points
 * @param options size and title
 *
 * @example
 * ```ts
 * import { qqSparkline } from "./sparkline.ts";
 * const s = qqSparkline({ z: [-1, 0, 1], value: [1, 2, 3], mean: 2, sd: 1 });
 * if (!s.startsWith('<img class="unconfined" src="data:image/svg+xml;base64,') || !s.includes('alt="QQ sparkline"')) {
 *   throw new Error(s);
 * }
 * ```
 */
export function qqSparkline(d: SparklineData, options: SparklineOptions = {}): string {
  const w = options.width ?? 90;
  const h = options.height ?? 36;
  const svg = qqSparklineSvg(d, options);
  const b64 = Buffer.from(svg, "utf8").toString("base64");
  const title = escapeHtml(options.title ?? "QQ sparkline");
  return `<img class="unconfined" src="data:image/svg+xml;base64,${b64}" width="${w}" ` +
    `height="${h}" style="max-width:none;min-width:${w}px" alt="${title}" title="${title}"/>`;
}

/**
 * A QQ sparkline as an SVG document.
 *
 * @param d the points
 * @param options size and title
 * @example
 * ```ts
 * import { qqSparklineSvg } from "./sparkline.ts";
 * const s = qqSparklineSvg({ z: [-1, 0, 1], value: [1, 2, 3], mean: 2, sd: 1 });
 * if (!s.startsWith("<svg") || !s.includes("<title>QQ sparkline</title>")) throw new Error(s);
 * ```
 */
export function qqSparklineSvg(d: SparklineData, options: SparklineOptions = {}): string {
  const w = options.width ?? 90;
  const h = options.height ?? 36;
  const max = options.maxPoints ?? 60;
  const m = d.z.length;
  const pick: number[] = [];
  if (m <= max) { for (let i = 0; i < m; i++) pick.push(i); }
  else for (let k = 0; k < max; k++) pick.push(Math.round((k * (m - 1)) / (max - 1)));
  const zs = pick.map((i) => d.z[i]);
  const vs = pick.map((i) => d.value[i]);
  const [zMin, zMax] = _range(zs, []);
  const line = [zMin, zMax].map((z) => d.mean + d.sd * z);
  const [vMin, vMax] = _range(vs, line);
  const sx = (z: number) => 3 + ((z - zMin) / (zMax - zMin || 1)) * (w - 6);
  const sy = (v: number) => h - 3 - ((v - vMin) / (vMax - vMin || 1)) * (h - 6);
  // Each dot is a zero-length segment drawn with a round cap (3.2 px across).
  const dots = ["", ""];
  pick.forEach((i, k) => {
    dots[d.outside?.[i] ? 1 : 0] += `M${_r(sx(zs[k]))} ${_r(sy(vs[k]))}h0`;
  });
  const paths = dots.map((path, k) =>
    path
      ? `<path d="${path}" stroke="${k ? PALETTE.outside : PALETTE.point}" ` +
        `stroke-width="3.2" stroke-linecap="round"/>`
      : ""
  ).join("");
  const title = escapeHtml(options.title ?? "QQ sparkline");
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}" role="img">` +
    `<title>${title}</title><rect width="${w}" height="${h}" fill="#ffffff"/>` +
    `<line x1="${_r(sx(zMin))}" y1="${_r(sy(line[0]))}" x2="${_r(sx(zMax))}" y2="${
      _r(sy(line[1]))
    }" ` +
    `stroke="${PALETTE.line}" stroke-width="1"/>${paths}</svg>`;
}
