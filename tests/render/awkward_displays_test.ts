/**
 * Every display of the chain draws, whatever the column's name and the
 * values' magnitude: names with line breaks (a wrapped spreadsheet header),
 * CR, U+2028, U+2029, backslashes and quotes; values near 1e−309 (subnormal)
 * and near 1e300, plotted in units named on the axis; and names of 100,000
 * characters.
 *
 * @module
 */
import { equal, ok } from "node:assert/strict";
import { plumb } from "../../lib/plumb/plumb.ts";
import { survey } from "../../lib/plumb/survey.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../../lib/results/display.ts";
import { escapeHtml } from "../../lib/render/escape.ts";

// Invented values: a fill-volume-like column and a two-line grouping.
const values = [500.1, 499.8, 500.4, 500.0, 499.7, 500.2, 500.3, 499.9, 500.6, 499.5, 501.2, 499.1];
const lines = ["A", "A", "A", "A", "A", "A", "B", "B", "B", "B", "B", "B"];

/** Every display of a chain over column `name` of `data`, rendered. */
async function everyDisplay(
  data: Record<string, unknown[]>,
  name: string,
): Promise<Record<string, MimeBundle>> {
  const p = plumb(data, name);
  const shown: [string, Displayable][] = [
    ["card", p],
    ["qq", p.qq()],
    ["detrended", p.detrended()],
    ["histogram", p.histogram()],
    ["groups", p.by("line")],
    ["candidates", p.candidates()],
    ["lambda", p.lambda()],
    ["tests", p.tests()],
    ["sentence", p.sentence()],
    ["survey", survey(data)],
  ];
  const out: Record<string, MimeBundle> = {};
  for (const [what, d] of shown) {
    try {
      out[what] = await d[DISPLAY]();
    } catch (e) {
      throw new Error(`${what} of ${JSON.stringify(name.slice(0, 40))}: ${e}`);
    }
    ok(out[what]["text/plain"] || out[what]["text/html"], what);
  }
  return out;
}

Deno.test("displays: names with line breaks, CR, U+2028/U+2029, backslashes and quotes draw", async () => {
  for (
    const name of [
      "Fill volume\n(mL)",
      "Fill volume\r\n(mL)",
      "torque\rNm",
      "a\u2028b",
      "a\u2029b",
      "path\\to\\",
      'say "when"',
    ]
  ) {
    const out = await everyDisplay({ [name]: values, line: lines }, name);
    // The name's first part (before any break) is in the card, escaped.
    const part = name.split(/[\n\r\u2028\u2029\\"]/)[0];
    ok(out.card["text/html"]!.includes(escapeHtml(part)), `${JSON.stringify(name)} in the card`);
  }
});

Deno.test("displays: values near 1e-309 and 1e300 draw, plotted in units named on the axis", async () => {
  for (
    const [scale, unit] of [[1e-309, "(× 1e−309)"], [1e-300, "(× 1e−300)"], [
      1e300,
      "(× 1e300)",
    ]] as const
  ) {
    // Spread values so that every value stays distinct after scaling.
    const x = values.map((v, i) => (v - 499 + i * 0.01) * scale);
    const out = await everyDisplay({ tiny: x, line: lines }, "tiny");
    const qq = plumb({ tiny: x }, "tiny").qq().spec as {
      layer: { encoding: { y: { title: string } } }[];
      data: { values: { v: number }[] };
    };
    equal(
      qq.layer[0].encoding.y.title.endsWith(unit),
      true,
      `${qq.layer[0].encoding.y.title} for ${scale}`,
    );
    // Plotted values are of ordinary size.
    for (const r of qq.data.values) ok(Math.abs(r.v) >= 0.1 && Math.abs(r.v) < 1000, `${r.v}`);
    // A chart shown on its own is its Vega-Lite spec beside a PNG: the unit is in the spec.
    const histogramSpec = JSON.stringify(out.histogram["application/vnd.vegalite.v5+json"]);
    ok(histogramSpec.includes(unit), `histogram axis for ${scale}`);
  }
});

Deno.test("displays: a 100,000-character name draws in every display", async () => {
  const name = "fill volume after capping ".repeat(4000).slice(0, 100_000);
  const out = await everyDisplay({ [name]: values, line: lines }, name);
  ok(out.survey["text/plain"]!.includes(name.slice(0, 1000)));
});
