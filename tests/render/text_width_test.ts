import { ok } from "node:assert/strict";
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
