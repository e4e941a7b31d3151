import assert from "node:assert/strict";
import * as publicVega from "vega";
import { renderSvg } from "../../lib/render/svg.ts";

Deno.test("static SVG rendering leaves the vega module that other code imports unchanged", async () => {
  const metrics = (publicVega as unknown as { textMetrics: unknown }).textMetrics as {
    width: unknown;
    estimateWidth: unknown;
  };
  const before = metrics.width;
  const svg = await renderSvg({
    data: { values: [{ a: 1, b: 2 }] },
    mark: "point",
    title: "A title long enough to be measured",
    encoding: {
      x: { field: "a", type: "quantitative" },
      y: { field: "b", type: "quantitative" },
    },
  });
  assert.ok(svg.startsWith("<svg"));
  // Without a canvas, vega's own estimate is its width function; plumbline's
  // per-character widths live in its private copy of vega only.
  assert.equal(metrics.width, before);
  assert.equal(metrics.width, metrics.estimateWidth);
});
