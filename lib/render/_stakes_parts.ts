/**
 * The parts every panel of the stakes chart shares: row layout, colours and
 * shapes by way of computing, the interval-and-ends layers, and the axis
 * extent. Private to the stakes chart.
 *
 * @module
 */
import type { StakesVerdict } from "../stakes/_judge.ts";
import { roundSig } from "../results/format.ts";
import { PALETTE } from "./theme.ts";

/** Words for the verdicts in panel titles. */
export const _VERDICT: Readonly<Record<StakesVerdict, string>> = Object.freeze({
  matters: "the difference matters",
  negligible: "the difference is negligible",
  unclear: "too uncertain to tell",
});

export const _ROW_HEIGHT = 30;
/** Every panel's row labels take the same width, so the plot areas line up. */
export const _LABEL_WIDTH = 250;
export const _Y_AXIS = {
  title: null,
  labelLimit: _LABEL_WIDTH - 10,
  labelFontSize: 11,
  domain: false,
  ticks: false,
  minExtent: _LABEL_WIDTH,
  maxExtent: _LABEL_WIDTH,
};

export interface _Interval {
  r: string;
  a: number;
  b: number;
  kind: "normal" | "reexpressed" | "free";
}
export interface _Point {
  r: string;
  v: number;
  t: string;
  kind: "normal" | "reexpressed" | "free" | "flag";
}

export function _colour(kind: string): string {
  return kind === "normal"
    ? PALETTE.line
    : kind === "reexpressed"
    ? PALETTE.interval
    : kind === "flag"
    ? PALETTE.outside
    : PALETTE.point;
}

export const _COLOUR = {
  field: "kind",
  type: "nominal",
  legend: null,
  scale: {
    domain: ["normal", "reexpressed", "free", "flag"],
    range: [_colour("normal"), _colour("reexpressed"), _colour("free"), _colour("flag")],
  },
} as const;

/** One panel: rows on y, a shared quantitative x, layers given. */
export function _panel(
  title: string,
  subtitle: string,
  rows: readonly string[],
  xTitle: string,
  domain: readonly [number, number],
  layers: unknown[],
  width: number,
  format?: string,
): Record<string, unknown> {
  const x = {
    type: "quantitative",
    title: xTitle,
    scale: { domain: [roundSig(domain[0], 8), roundSig(domain[1], 8)], nice: false, zero: false },
    axis: { tickCount: 6, ...(format === undefined ? {} : { format }) },
  };
  return {
    title: { text: title, subtitle, fontSize: 12 },
    width,
    height: rows.length * _ROW_HEIGHT,
    encoding: {
      y: { field: "r", type: "nominal", sort: rows, axis: _Y_AXIS, scale: { domain: rows } },
      x,
    },
    layer: layers,
  };
}

export function _intervalLayers(intervals: _Interval[], points: _Point[]): unknown[] {
  return [
    {
      data: { values: intervals },
      mark: { type: "rule", strokeWidth: 2.5, aria: false },
      encoding: {
        x: { field: "a" },
        x2: { field: "b" },
        color: _COLOUR,
        tooltip: [
          { field: "r", title: "way" },
          { field: "a", type: "quantitative", title: "lower end", format: ".5~g" },
          { field: "b", type: "quantitative", title: "upper end", format: ".5~g" },
        ],
      },
    },
    {
      data: { values: points },
      mark: { type: "point", filled: true, size: 55, aria: false },
      encoding: {
        x: { field: "v" },
        color: _COLOUR,
        shape: {
          field: "kind",
          type: "nominal",
          legend: null,
          scale: {
            domain: ["normal", "reexpressed", "free", "flag"],
            range: ["circle", "square", "triangle-up", "diamond"],
          },
        },
        tooltip: [{ field: "r", title: "way" }, { field: "t", title: "value" }],
      },
    },
    {
      data: { values: points },
      mark: { type: "text", dy: -11, fontSize: 10, aria: false },
      encoding: { x: { field: "v" }, text: { field: "t" }, color: _COLOUR },
    },
  ];
}

export function _extent(values: readonly (number | null)[], pad = 0.06): [number, number] {
  const v = values.filter((t): t is number => t !== null && Number.isFinite(t));
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of v) {
    if (t < lo) lo = t;
    if (t > hi) hi = t;
  }
  if (!(hi > lo)) {
    const d = Math.abs(lo) * 0.1 || 1;
    lo -= d;
    hi += d;
  }
  const d = (hi - lo) * pad;
  return [lo - d, hi + d];
}
