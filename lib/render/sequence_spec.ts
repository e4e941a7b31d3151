/**
 * Vega-Lite spec of values in a named order: the values (or, for long
 * series, each slice's mean with its lowest and highest) against their
 * position, with the median the runs were counted about. The spec's size is
 * bounded whatever n (at most 1000 points, or 500 slices).
 *
 * Fixed field names: `t` (position), `v` (value), `lo`, `hi`.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import type { SerialCheck } from "../results/analysis.ts";
import { formatCount, formatNumber, roundSig } from "../results/format.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { CHART_CONFIG, PALETTE, PANEL } from "./theme.ts";

/**
 * The values in order, with the median and the two tests in the subtitle.
 *
 * @param c the serial check
 * @param options the variable's name
 * @example
 * ```ts
 * import { serialCheck } from "../plumb/serial_check.ts";
 * import { toTable } from "../plumb/source.ts";
 * import { sequenceSpec } from "./sequence_spec.ts";
 * const v = Array.from({ length: 30 }, (_, i) => Math.sin(i / 3));
 * const c = serialCheck(toTable({ v }), { column: null }, { values: Float64Array.from(v), rows: Int32Array.from(v, (_, i) => i) });
 * if (!JSON.stringify(sequenceSpec(c, { name: "fill" })).includes("fill in file order")) throw new Error("title");
 * ```
 */
export function sequenceSpec(
  c: SerialCheck,
  options: { readonly name?: string } = {},
): TopLevelSpec {
  const name = options.name ?? "value";
  const p = c.points;
  const sliced = p.position.length > 0 && p.low.some((v, i) => v !== p.value[i]);
  const rows = p.position.map((t, i) => ({
    t,
    v: roundSig(p.value[i], 8),
    lo: roundSig(p.low[i], 8),
    hi: roundSig(p.high[i], 8),
  }));
  const r = c.result;
  const where = c.order === "file order" ? "file order" : `${c.order} order`;
  const x = {
    field: "t",
    type: "quantitative",
    title: `position in ${where}`,
    scale: { nice: false },
  };
  const y = { field: "v", type: "quantitative", title: name, scale: { zero: false } };
  const layer: unknown[] = [];
  if (sliced) {
    layer.push({
      data: { values: rows },
      mark: { type: "area", color: PALETTE.band, opacity: 0.35, aria: false, tooltip: false },
      encoding: { x, y: { field: "lo", type: "quantitative", title: name }, y2: { field: "hi" } },
    });
  }
  layer.push(
    {
      data: { values: rows },
      mark: { type: "line", color: PALETTE.point, strokeWidth: 1, aria: false, tooltip: false },
      encoding: { x, y },
    },
    {
      data: { values: rows },
      mark: {
        type: "point",
        filled: true,
        size: sliced ? 0 : 14,
        color: PALETTE.point,
        aria: false,
      },
      encoding: {
        x,
        y,
        tooltip: [
          { field: "t", type: "quantitative", title: "position" },
          { field: "v", type: "quantitative", title: name, format: ".6~g" },
        ],
      },
    },
    {
      data: { values: [{ m: roundSig(c.median, 8) }] },
      mark: { type: "rule", color: PALETTE.line, strokeDash: [4, 3], aria: false, tooltip: false },
      encoding: { y: { field: "m", type: "quantitative" } },
    },
  );
  return {
    $schema: VEGALITE_SCHEMA,
    description: `${name} in ${where}: ${formatCount(r.n)} values` +
      `${sliced ? `, shown as ${p.position.length} slices (mean, lowest and highest)` : ""}; ` +
      `dashed line at the median ${formatNumber(c.median)}. Lag-1 autocorrelation ` +
      `${formatNumber(r.lagOne.r1, 3)}, ${r.runs.runs} runs about the median where ` +
      `${formatNumber(r.runs.expected, 3)} are expected; ` +
      `${r.shows ? "serial dependence shows" : "no serial dependence shows"}.`,
    title: {
      text: `${name} in ${where}`,
      subtitle: [
        `${formatCount(r.n)} values${
          sliced ? ` · ${p.position.length} slices: mean, lowest–highest` : ""
        } · dashed: median`,
        `r₁ = ${formatNumber(r.lagOne.r1, 3)} · runs ${r.runs.runs} (expected ${
          formatNumber(r.runs.expected, 3)
        }) · ${r.shows ? "serial dependence shows" : "no serial dependence shows"}`,
      ],
    },
    config: CHART_CONFIG,
    width: PANEL.width * 2,
    height: PANEL.height * 0.7,
    layer,
  } as TopLevelSpec;
}
