/**
 * Vega-Lite spec of a histogram with the fitted normal curve scaled to
 * counts, from {@linkcode HistogramData}. The data arrive already binned,
 * so the spec's size depends on the number of bins, never on n.
 *
 * Fixed field names: bins `a` (left edge), `b` (right edge), `c` (count);
 * curve `x`, `y`. The variable's name appears only in titles.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import type { HistogramData } from "../stats/histogram_data.ts";
import { formatCentre, formatCount, formatNumber, roundSig } from "../results/format.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { CHART_CONFIG, PALETTE, PANEL } from "./theme.ts";
import { _valueUnits } from "./value_units.ts";

/** Options for {@linkcode histogramSpec}. */
export interface HistogramSpecOptions {
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
}

/** A description of the histogram for screen readers and plain text. */
export function _histogramDescription(h: HistogramData, name: string): string {
  let peak = 0;
  for (let j = 1; j < h.counts.length; j++) if (h.counts[j] > h.counts[peak]) peak = j;
  return `Histogram of ${name}: ${formatCount(h.n)} values in ${h.counts.length} bins of width ` +
    `${formatNumber(h.binWidth)} from ${formatNumber(h.edges[0])} to ` +
    `${formatNumber(h.edges[h.edges.length - 1])}; bins by the ${h.ruleNote}. The tallest bin, ` +
    `${formatNumber(h.edges[peak])} to ${formatNumber(h.edges[peak + 1])}, holds ` +
    `${formatCount(h.counts[peak])} values. The curve is the normal density with mean ` +
    `${formatCentre(h.mean, h.sd)} and standard deviation ${
      formatNumber(h.sd)
    }, scaled to counts ` +
    `(n × bin width × density).`;
}

/**
 * The histogram of one sample with its fitted normal curve.
 *
 * @param h the histogram data (see `histogramData`)
 * @param options name and size
 * @example
 * ```ts
 * import { histogramData } from "@plumbline/plumbline";
 * import { histogramSpec } from "./histogram_spec.ts";
 * const spec = histogramSpec(histogramData([3, 4, 4, 5, 5, 5, 6, 6, 7]), { name: "torque" });
 * if (!JSON.stringify(spec).includes("torque")) throw new Error("title");
 * ```
 */
export function histogramSpec(h: HistogramData, options: HistogramSpecOptions = {}): TopLevelSpec {
  const name = options.name ?? "value";
  // Plotted in display units (see value_units.ts); text in the data's units.
  const u = _valueUnits(Math.max(Math.abs(h.edges[0]), Math.abs(h.edges[h.edges.length - 1])));
  const bins = h.counts.map((c, j) => ({
    a: roundSig(u.of(h.edges[j]), 8),
    b: roundSig(u.of(h.edges[j + 1]), 8),
    c,
  }));
  const curve = h.curveX.map((x, j) => ({
    x: roundSig(u.of(x), 6),
    y: roundSig(h.curveY[j], 5),
  }));
  const valueTitle = u.title(name);
  const x = {
    field: "a",
    type: "quantitative",
    title: valueTitle,
    scale: { zero: false, nice: false },
  };
  return {
    $schema: VEGALITE_SCHEMA,
    description: _histogramDescription(h, name),
    title: {
      text: name,
      subtitle: [
        `histogram · ${formatCount(h.n)} values · ${h.counts.length} bins of width ${
          formatNumber(h.binWidth)
        }`,
        `normal curve: mean ${formatCentre(h.mean, h.sd)}, sd ${
          formatNumber(h.sd)
        }, scaled to counts`,
      ],
    },
    config: CHART_CONFIG,
    width: options.width ?? PANEL.width,
    height: options.height ?? PANEL.height,
    layer: [
      {
        data: { values: bins },
        mark: {
          type: "rect",
          color: PALETTE.bar,
          stroke: "#ffffff",
          strokeWidth: h.counts.length > 80 ? 0 : 0.5,
          aria: false,
        },
        encoding: {
          x,
          x2: { field: "b" },
          y: { field: "c", type: "quantitative", title: "count" },
          y2: { datum: 0 },
          tooltip: [
            { field: "a", type: "quantitative", title: u.title("from"), format: ".6~g" },
            { field: "b", type: "quantitative", title: u.title("to"), format: ".6~g" },
            { field: "c", type: "quantitative", title: "count" },
          ],
        },
      },
      {
        data: { values: curve },
        mark: { type: "line", color: PALETTE.line, strokeWidth: 2, tooltip: false, aria: false },
        encoding: {
          x: { field: "x", type: "quantitative", title: valueTitle },
          y: { field: "y", type: "quantitative", title: "count" },
        },
      },
    ],
  } as TopLevelSpec;
}
