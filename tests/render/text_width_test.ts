import assert, { ok } from "node:assert/strict";
import { qqSpec } from "../../lib/render/qq_spec.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { textWidth } from "../../lib/render/text_width.ts";
import { qqData } from "../../lib/stats/qq_data.ts";

Deno.test("text widths: proportional, bold wider, non-ASCII counted", () => {
  ok(textWidth("iiii", 12) < textWidth("MMMM", 12));
  ok(textWidth("abc", 12, true) > textWidth("abc", 12));
  ok(textWidth("λλ", 10) > 0);
  // Helvetica "normal score z" at 11 px is about 72 px (metrics × 1.08).
  const w = textWidth("normal score z", 11);
  ok(w > 65 && w < 80, String(w));
});

Deno.test("a QQ plot with a long title stays near its 320 px panel (no 0.8 em estimate)", async () => {
  const x = Array.from({ length: 100 }, (_, i) => Math.exp((i + 0.5) / 40));
  const svg = await renderSvg(
    qqSpec(qqData(x), { name: "Box–Cox[λ = 0.2399](minutes_between_stops)" }),
  );
  const width = Number(/width="(\d+)"/.exec(svg)![1]);
  ok(width < 430, `width ${width}`);
});

Deno.test("the glyph width table is what the generator reads from the shipped font files", async () => {
  const { GLYPH_WIDTHS } = await import("../../lib/render/_glyph_widths.ts");
  const { readFont, RANGES } = await import("../../tools/fonts/make_glyph_widths.ts");
  const { ARIMO_FONT_URLS } = await import("../../lib/_deps/arimo_font.ts");
  const fonts = await Promise.all(
    ARIMO_FONT_URLS.map(async (u) => readFont(await Deno.readFile(new URL(u)))),
  );
  assert.deepEqual(GLYPH_WIDTHS.map(([first]) => first), RANGES.map(([lo]) => lo));
  for (const [first, regular, bold] of GLYPH_WIDTHS) {
    regular.forEach((w, k) => {
      const a = fonts[0].advance(first + k);
      assert.equal(w, a === undefined ? 0 : Math.round((1000 * a) / fonts[0].unitsPerEm));
    });
    bold.forEach((w, k) => {
      const a = fonts[1].advance(first + k);
      assert.equal(w, a === undefined ? 0 : Math.round((1000 * a) / fonts[1].unitsPerEm));
    });
  }
  // Arial's advance widths (from memory): W 944, the minus sign 584, the em dash and the
  // ellipsis 1000, λ 500 regular; W 944 bold.
  const at = (c: string, bold = false) => {
    const cp = c.codePointAt(0)!;
    const [first, r, b] = GLYPH_WIDTHS.find(([f, r]) => cp >= f && cp < f + r.length)!;
    return (bold ? b : r)[cp - first];
  };
  assert.deepEqual(
    ["W", "−", "—", "…", "λ"].map((c) => at(c)),
    [944, 584, 1000, 1000, 500],
  );
  assert.equal(at("W", true), 944);
});
