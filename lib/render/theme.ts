/**
 * plumbline's chart look: one palette and one Vega-Lite config shared by
 * every chart.
 *
 * Colours are from the palette of Okabe & Ito (2008, "Color Universal
 * Design: how to make figures and presentations that are friendly to
 * colorblind people", J*FLY), chosen to stay distinct under the common
 * colour-vision deficiencies; meaning never rests on colour alone (points
 * outside an envelope also change shape). Every chart draws its own white
 * background, so it stays legible on a dark notebook theme.
 *
 * @module
 */
import type { Config } from "../_deps/vega_lite.ts";

/** Colours by role. */
export const PALETTE = Object.freeze({
  /** Data points inside the envelope: Okabe–Ito blue. */
  point: "#0072B2",
  /** Data points outside the envelope: Okabe–Ito vermillion. */
  outside: "#D55E00",
  /** Envelope band fill: Okabe–Ito sky blue (drawn translucent). */
  band: "#56B4E9",
  /** Reference lines and fitted curves: near-black. */
  line: "#222222",
  /** Histogram bars: Okabe–Ito sky blue. */
  bar: "#56B4E9",
  /** A highlighted choice (the selected λ): Okabe–Ito orange. */
  highlight: "#E69F00",
  /** An interval of plausible values: Okabe–Ito bluish green (translucent). */
  interval: "#009E73",
  /** Secondary text and grid. */
  muted: "#555555",
  /** Chart background. */
  background: "#ffffff",
});

/** Width and height of one plot panel, in pixels. */
export const PANEL = Object.freeze({ width: 320, height: 260, small: 200 });

/** The Vega-Lite config every plumbline chart carries. */
export const CHART_CONFIG: Config = Object.freeze({
  background: PALETTE.background,
  padding: 10,
  // Arimo is the font the PNG raster draws with; Arial, Helvetica and Liberation Sans share
  // its advance widths, which text_width.ts measures chart text with.
  font: "Arimo, Arial, Helvetica, Liberation Sans, sans-serif",
  view: { stroke: "#bbbbbb" },
  title: {
    anchor: "start",
    fontSize: 14,
    fontWeight: "bold",
    color: "#111111",
    subtitleColor: PALETTE.muted,
    subtitleFontSize: 11,
    offset: 8,
  },
  axis: {
    labelColor: "#333333",
    titleColor: "#222222",
    titleFontWeight: "normal",
    titleFontSize: 12,
    labelFontSize: 11,
    gridColor: "#e6e6e6",
    domainColor: "#888888",
    tickColor: "#888888",
  },
  legend: {
    labelColor: "#333333",
    titleColor: "#222222",
    titleFontWeight: "normal",
    orient: "bottom",
    direction: "horizontal",
  },
  header: { labelFontSize: 12, titleFontSize: 12 },
  concat: { spacing: 24 },
}) as Config;
