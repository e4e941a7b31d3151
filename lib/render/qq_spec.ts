/**
 * Vega-Lite specs for the normal QQ plot and its detrended form, from
 * {@linkcode QqData}: ordered values (y, data units) against normal scores
 * (x), the fitted line mean + sd·z, and the envelope as a band; points
 * outside the band change colour and shape. Given the order-statistic slope
 * behind Shapiro–Wilk's W (`shapiro_wilk_geometry.ts`), a second, dashed
 * line mean + slope·z shows it beside the sd's line: W is the square of
 * their slopes' ratio, so the gap between the two lines is what W measures.
 *
 * Data reach the spec under fixed field names (`z`, `v`, `lo`, `hi`, `rk`,
 * `row`, `out`); the variable's own name appears only in titles and
 * tooltip labels, which Vega treats as text (tooltip titles escaped by `_tooltipTitle`,
 * see `escape.ts`), so any characters are safe.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import type { QqData } from "../stats/qq_data.ts";
import { formatCentre, formatCount, formatNumber, roundSig } from "../results/format.ts";
import { _tooltipTitle } from "./escape.ts";
import { CHART_CONFIG, PALETTE, PANEL } from "./theme.ts";
import { _qqInUnits } from "./value_units.ts";
import { censoredOf, censoredSentence, censoredStates, censoredSubtitle } from "./_qq_censored.ts";

/** Vega-Lite 5 schema URL. */
export const VEGALITE_SCHEMA = "https://vega.github.io/schema/vega-lite/v5.json";

/** Options for {@linkcode qqSpec} and {@linkcode detrendedSpec}. */
export interface QqSpecOptions {
  /**
   * The variable's name, shown in the title and on the value axis.
   * @default "value"
   */
  readonly name?: string;
  /**
   * Plot width in pixels.
   * @default 320
   */
  readonly width?: number;
  /**
   * Plot height in pixels.
   * @default 260
   */
  readonly height?: number;
  /**
   * The order-statistic slope Σaᵢx₍ᵢ₎/√(n − 1) (Shapiro–Wilk's numerator
   * on the scale of the sd), drawn as a dashed line mean + slope·z.
   * @default undefined (no second line)
   */
  readonly slope?: number;
}

/** Legend labels of the three point states (constant text, no user input). */
export const POINT_STATES = Object.freeze(["inside band", "below band", "above band"] as const);

/** The calculate expression that names each point's state from `out`. */
const _STATE_EXPR = `datum.out === 0 ? '${POINT_STATES[0]}' : datum.out < 0 ? '${
  POINT_STATES[1]
}' : '${POINT_STATES[2]}'`;

/**
 * One record per point, under the fixed field names; `pick` (indices into
 * the QQ data's arrays) thins further, for small panels.
 */
export function _qqRecords(
  q: QqData,
  detrended: boolean,
  pick?: readonly number[],
): Record<string, number>[] {
  const idx = pick ?? Array.from({ length: q.shown }, (_, k) => k);
  const rows: Record<string, number>[] = new Array(idx.length);
  const cen = censoredOf(q);
  for (let t = 0; t < idx.length; t++) {
    const k = idx[t];
    const fit = detrended ? q.mean + q.sd * q.z[k] : 0;
    rows[t] = {
      z: roundSig(q.z[k], 5),
      v: detrended ? roundSig(q.value[k] - fit, 7) : q.value[k],
      lo: roundSig(q.lower[k] - fit, 6),
      hi: roundSig(q.upper[k] - fit, 6),
      rk: q.rank[k],
      row: q.row[k],
      out: q.outside[k],
    };
    if (cen) rows[t].cen = cen.censor[k];
  }
  return rows;
}

/** The envelope band, the reference line and the points, as layers (data supplied by the parent). */
export function _qqLayers(
  q: QqData,
  name: string,
  detrended: boolean,
  valueTitle: string,
  slope?: number,
  // deno-lint-ignore no-explicit-any
): any[] {
  const x = { field: "z", type: "quantitative", title: "normal score z" } as const;
  const yScale = { zero: false };
  const zs = [q.z[0], q.z[q.shown - 1]];
  const line = detrended
    ? { data: { values: [{ z: roundSig(zs[0], 5), v: 0 }, { z: roundSig(zs[1], 5), v: 0 }] } }
    : {
      data: {
        values: zs.map((z) => ({ z: roundSig(z, 5), v: roundSig(q.mean + q.sd * z, 8) })),
      },
    };
  // The order-statistic line, relative to the sd's line in the detrended form.
  const second = slope === undefined || !Number.isFinite(slope) ? [] : [{
    data: {
      values: zs.map((z) => ({
        z: roundSig(z, 5),
        v: roundSig(detrended ? (slope - q.sd) * z : q.mean + slope * z, 8),
      })),
    },
    mark: {
      type: "line",
      color: PALETTE.line,
      strokeWidth: 1.5,
      strokeDash: [5, 3],
      tooltip: false,
      aria: false,
    },
    encoding: { x, y: { field: "v", type: "quantitative", title: valueTitle, scale: yScale } },
  }];
  const base = [PALETTE.point, PALETTE.outside, PALETTE.outside];
  const cen = censoredOf(q);
  const states = cen
    ? censoredStates(cen, _STATE_EXPR, POINT_STATES, base, [
      "circle",
      "triangle-down",
      "triangle-up",
    ])
    : null;
  return [
    {
      mark: { type: "area", color: PALETTE.band, opacity: 0.35, tooltip: false, aria: false },
      encoding: {
        x,
        y: { field: "lo", type: "quantitative", title: valueTitle, scale: yScale },
        y2: { field: "hi" },
      },
    },
    {
      ...line,
      mark: { type: "line", color: PALETTE.line, strokeWidth: 1.5, tooltip: false, aria: false },
      encoding: { x, y: { field: "v", type: "quantitative", title: valueTitle, scale: yScale } },
    },
    ...second,
    {
      transform: [{ calculate: states?.expr ?? _STATE_EXPR, as: "state" }],
      mark: { type: "point", filled: true, size: 24, opacity: 0.9, aria: false },
      encoding: {
        x,
        y: { field: "v", type: "quantitative", title: valueTitle, scale: yScale },
        color: {
          field: "state",
          type: "nominal",
          scale: { domain: states?.domain ?? [...POINT_STATES], range: states?.colours ?? base },
          legend: { title: null },
        },
        shape: {
          field: "state",
          type: "nominal",
          scale: {
            domain: states?.domain ?? [...POINT_STATES],
            range: states?.shapes ?? ["circle", "triangle-down", "triangle-up"],
          },
          legend: { title: null },
        },
        tooltip: [
          {
            field: "v",
            type: "quantitative",
            title: _tooltipTitle(detrended ? `${name} − line` : name),
            format: ".7~g",
          },
          { field: "rk", type: "quantitative", title: "rank" },
          { field: "row", type: "quantitative", title: "row" },
          { field: "z", type: "quantitative", title: "normal score", format: ".3f" },
        ],
      },
    },
  ];
}

/** The subtitle lines shared by both QQ forms. */
export function _qqSubtitle(q: QqData, detrended: boolean, slope?: number): string[] {
  const shown = q.shown === q.n
    ? `all ${formatCount(q.n)} points`
    : `${formatCount(q.shown)} of ${formatCount(q.n)} points shown (tails in full)`;
  const band = `${q.envelope} ${Math.round(q.level * 1000) / 10}%`;
  const two = slope !== undefined && Number.isFinite(slope);
  const lines = [
    `${detrended ? "detrended normal QQ plot" : "normal QQ plot"} · ${shown}`,
    `band: ${band} · ${two ? "solid" : "line"}: ${formatCentre(q.mean, q.sd)} + ${
      formatNumber(q.sd)
    }·z (mean, sd)`,
  ];
  if (two) {
    lines.push(`dashed: slope ${formatNumber(slope)} from the ordered values (W's numerator)`);
  }
  const cen = censoredOf(q);
  if (cen) lines.push(censoredSubtitle(cen));
  return lines;
}

/** A description of the chart for screen readers and plain text. */
export function _qqDescription(
  q: QqData,
  name: string,
  detrended: boolean,
  slope?: number,
): string {
  const below = q.outside.filter((o) => o < 0).length;
  const above = q.outside.filter((o) => o > 0).length;
  const what = detrended
    ? `Detrended normal QQ plot of ${name}: each ordered value minus the fitted line ` +
      `${formatCentre(q.mean, q.sd)} + ${formatNumber(q.sd)}·z, against its normal score z`
    : `Normal QQ plot of ${name}: ordered values against normal scores z, with the line ` +
      `${formatCentre(q.mean, q.sd)} + ${
        formatNumber(q.sd)
      }·z (intercept the mean, slope the standard deviation)`;
  const dashed = slope === undefined || !Number.isFinite(slope)
    ? ""
    : `, and a dashed line with the ` +
      `order-statistic slope ${
        formatNumber(slope)
      } (Shapiro–Wilk's W is the square of the ratio of ` +
      `this slope to the sd)`;
  return `${what}${dashed}. Normal scores use ${q.positions}. ${q.thinning[0].toUpperCase()}${
    q.thinning.slice(1)
  }. ` +
    `The band is the ${q.envelopeMethod}. ` +
    `${formatCount(below + above)} of the ${formatCount(q.shown)} points shown lie outside it ` +
    `(${formatCount(below)} below, ${formatCount(above)} above).` +
    (censoredOf(q) ? censoredSentence(censoredOf(q)!) : "");
}

function _spec(q: QqData, options: QqSpecOptions, detrended: boolean): TopLevelSpec {
  const name = options.name ?? "value";
  // Text in the data's units; the plotted values in display units.
  const { q: shown, units } = _qqInUnits(q);
  const valueTitle = units.title(detrended ? `${name} − line` : name);
  return {
    $schema: VEGALITE_SCHEMA,
    description: _qqDescription(q, name, detrended, options.slope),
    title: { text: name, subtitle: _qqSubtitle(q, detrended, options.slope) },
    config: CHART_CONFIG,
    width: options.width ?? PANEL.width,
    height: options.height ?? PANEL.height,
    data: { values: _qqRecords(shown, detrended) },
    layer: _qqLayers(
      shown,
      units.title(name),
      detrended,
      valueTitle,
      options.slope === undefined ? undefined : units.of(options.slope),
    ),
  } as TopLevelSpec;
}

/**
 * The normal QQ plot of one sample.
 *
 * @param q the QQ data (see `qqData`)
 * @param options name, size and the order-statistic slope for the dashed line
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * import { shapiroWilkGeometry } from "../stats/shapiro_wilk_geometry.ts";
 * import { qqSpec } from "./qq_spec.ts";
 * const x = [5.1, 4.9, 5.3, 5.0, 5.2, 4.7];
 * const spec = qqSpec(qqData(x), { name: "fill (mL)", slope: shapiroWilkGeometry(x).slope });
 * if (!JSON.stringify(spec).includes("fill (mL)") || !JSON.stringify(spec).includes("dashed")) throw new Error("title");
 * ```
 */
export function qqSpec(q: QqData, options: QqSpecOptions = {}): TopLevelSpec {
  return _spec(q, options, false);
}

/**
 * The detrended QQ plot: each ordered value minus the fitted line, with the
 * envelope minus the line, around a zero line; subtle tail departures that
 * hug the line in the plain QQ plot become visible.
 *
 * @param q the QQ data (see `qqData`)
 * @param options name and size
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * import { detrendedSpec } from "./qq_spec.ts";
 * const spec = detrendedSpec(qqData([5.1, 4.9, 5.3, 5.0, 5.2, 4.7]));
 * if (!JSON.stringify(spec).includes("detrended")) throw new Error("detrended");
 * ```
 */
export function detrendedSpec(q: QqData, options: QqSpecOptions = {}): TopLevelSpec {
  return _spec(q, options, true);
}
