/**
 * No clipped or overlapping text in the static charts at any name length: every line of
 * text (with its measured width, `textLength`) lies inside the SVG, and no two lines
 * overlap. Long names are shortened with "…" in the picture and kept whole in the
 * description.
 */
import assert from "node:assert/strict";
import { renderSvg } from "../../lib/render/svg.ts";
import { fitTextLengths } from "../../lib/render/svg_text.ts";
import { KINDS, specsFor } from "./_samples.ts";

interface Box {
  text: string;
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/** Boxes of every visible text line of a vega SVG, in SVG coordinates. */
export function textBoxes(svg: string): { width: number; height: number; boxes: Box[] } {
  const [, width, height] = svg.match(/^<svg[^>]* width="([\d.]+)" height="([\d.]+)"/)!.map(Number);
  const boxes: Box[] = [];
  const stack: [number, number][] = [[0, 0]];
  const tags = /<(\/?)(g|text)\b([^>]*)>|<\/text>/g;
  for (let m; (m = tags.exec(svg));) {
    const [, close, tag, attrs = ""] = m;
    if (tag === "g" && close) stack.pop();
    else if (tag === "g") {
      const t = attrs.match(/transform="translate\(([-\d.e]+),([-\d.e]+)\)"/);
      const [px, py] = stack[stack.length - 1];
      stack.push(t ? [px + Number(t[1]), py + Number(t[2])] : [px, py]);
      if (/\/\s*$/.test(attrs)) stack.pop();
    } else if (tag === "text" && !close) {
      if (/opacity="0"/.test(attrs)) continue;
      const end = svg.indexOf("</text>", tags.lastIndex);
      const body = svg.slice(tags.lastIndex, end);
      const t = attrs.match(
        /transform="translate\(([-\d.e]+),([-\d.e]+)\)(?: rotate\(([-\d.]+)\))?(?: translate\(([-\d.e]+),([-\d.e]+)\))?"/,
      );
      const [gx, gy] = stack[stack.length - 1];
      let x = gx + (t ? Number(t[1]) : 0), y = gy + (t ? Number(t[2]) : 0);
      const rotate = t?.[3] ? Number(t[3]) : 0;
      if (t?.[4]) {
        // A translation after rotate(-90) moves (a, b) to (b, −a) in the outer frame.
        const [a, b] = [Number(t[4]), Number(t[5])];
        if (rotate === -90) [x, y] = [x + b, y - a];
        else if (rotate === 0) [x, y] = [x + a, y + b];
      }
      assert.ok(rotate === 0 || rotate === -90, `unexpected rotation ${rotate}`);
      const size = Number(attrs.match(/font-size="([\d.]+)/)?.[1] ?? 11);
      const anchor = attrs.match(/text-anchor="(\w+)"/)?.[1] ?? "start";
      const lines = body.includes("<tspan")
        ? [...body.matchAll(/<tspan([^>]*)>([^<]*)<\/tspan>/g)].map((s) => [s[1], s[2]])
        : [[attrs, body]];
      let dy = 0;
      for (const [a, content] of lines) {
        dy += Number(a.match(/\bdy="([-\d.]+)"/)?.[1] ?? 0);
        const len = Number(a.match(/textLength="([\d.]+)"/)?.[1] ?? NaN);
        assert.ok(Number.isFinite(len), `a text line without textLength: ${content}`);
        const shift = anchor === "middle" ? len / 2 : anchor === "end" ? len : 0;
        if (rotate === 0) {
          boxes.push({
            text: content,
            x0: x - shift,
            x1: x - shift + len,
            y0: y + dy - 0.8 * size,
            y1: y + dy + 0.2 * size,
          });
        } else {
          // rotate(-90): the line runs upwards from (x, y).
          boxes.push({
            text: content,
            x0: x + dy - 0.8 * size,
            x1: x + dy + 0.2 * size,
            y0: y - len + shift,
            y1: y + shift,
          });
        }
      }
      tags.lastIndex = end + 7;
    }
  }
  return { width, height, boxes };
}

const overlap = (a: Box, b: Box) =>
  Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0) > 0.5 &&
  Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0) > 0.5;

const NAMES = [
  "fill (mL)",
  "dissolved oxygen measured at the filler outlet after the second rinse, ppb (lab method 7, " +
  "corrected for temperature and for the blank of the day) — line 4 and line 5 combined",
  "W".repeat(120),
  "minutes_between_stops_on_the_night_shift_after_the_changeover_to_the_new_caps_".repeat(3),
];

for (const kind of KINDS) {
  Deno.test(`${kind}: every text line lies inside the chart and none overlaps, at any name length`, async () => {
    for (const name of NAMES) {
      const svg = await renderSvg(specsFor(300, name)[kind]);
      const { width, height, boxes } = textBoxes(svg);
      assert.ok(width < 1400, `${kind} grew to ${width} px wide for a ${name.length}-char name`);
      for (const b of boxes) {
        assert.ok(
          b.x0 >= -0.5 && b.x1 <= width + 0.5 && b.y0 >= -0.5 && b.y1 <= height + 0.5,
          `${kind}, name of ${name.length} chars: "${b.text}" at ${
            JSON.stringify(b)
          } leaves the ${width}×${height} chart`,
        );
      }
      for (let i = 0; i < boxes.length; i++) {
        for (let j = i + 1; j < boxes.length; j++) {
          assert.ok(
            !overlap(boxes[i], boxes[j]),
            `${kind}, name of ${name.length} chars: "${boxes[i].text}" overlaps "${
              boxes[j].text
            }": ` +
              JSON.stringify([boxes[i], boxes[j]]),
          );
        }
      }
      if (name.length > 100) {
        assert.ok(svg.includes("…"), `${kind}: a ${name.length}-char name is shortened with …`);
      }
    }
  });
}

Deno.test("fitTextLengths measures each line and leaves measured text alone", () => {
  const svg = '<svg><text font-size="10px" font-weight="bold"><tspan>A &amp; B</tspan>' +
    '<tspan x="0" dy="12"> </tspan></text><text textLength="5">x</text></svg>';
  const out = fitTextLengths(svg);
  // "A & B" in Arimo Bold: 722 + 278 + 722 + 278 + 722 thousandths of an em, at 10 px.
  assert.ok(
    out.includes('<tspan textLength="27.22" lengthAdjust="spacingAndGlyphs">A &amp; B</tspan>'),
    out,
  );
  assert.ok(out.includes('<tspan x="0" dy="12"> </tspan>'), "blank lines are left as they are");
  assert.ok(out.includes('<text textLength="5">x</text>'));
});
