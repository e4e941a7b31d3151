import assert from "node:assert/strict";
import { chart, chartBundle, chartMeta } from "../../lib/render/chart_bundle.ts";
import { drawChart } from "../../lib/render/chart_image.ts";
import { pngSize } from "../../lib/render/png.ts";
import { DISPLAY, displayable, lazyDisplayable, VEGALITE_MIME } from "../../lib/results/display.ts";
import { qqSpec } from "../../lib/render/qq_spec.ts";
import { qqData } from "../../lib/stats/qq_data.ts";

const spec = qqSpec(qqData([5.1, 4.9, 5.3, 5.0, 5.2, 4.7, 5.6, 4.8]), { name: "fill" });

Deno.test("DISPLAY is the symbol the Deno kernel looks for", () => {
  assert.equal(DISPLAY, Symbol.for("Jupyter.display"));
});

Deno.test("a chart displays asynchronously, renders once, and can be prepared", async () => {
  const c = chart(spec);
  const pending = c[DISPLAY]();
  assert.ok(pending instanceof Promise, "the display method is async (the kernel awaits it)");
  const first = await pending;
  const second = await c[DISPLAY]();
  assert.equal(first, second, "rendered once and cached");
  const ready = await c.prepare();
  assert.equal(ready[DISPLAY](), ready.bundle, "a prepared chart displays synchronously");
  // On its own a chart shows as Vega-Lite or PNG, never HTML (JupyterLab would prefer HTML
  // to the interactive spec); the PNG is 1×, to show at the chart's size.
  assert.deepEqual(Object.keys(first).sort(), [VEGALITE_MIME, "image/png", "text/plain"].sort());
  const png = Uint8Array.from(atob(first["image/png"]!), (ch) => ch.charCodeAt(0));
  const drawn = await drawChart(spec, chartMeta(spec));
  assert.deepEqual(pngSize(png), { width: drawn.raster.width, height: drawn.raster.height });
  assert.ok(Object.isFrozen(c) && Object.isFrozen(first));
});

Deno.test("chartBundle's text/plain is the title line and the description", async () => {
  const b = await chartBundle(spec);
  const [title, description] = b["text/plain"].split("\n");
  assert.equal(
    title,
    "fill — normal QQ plot · all 8 points band: pointwise 95% · line: 5.075 + 0.2915·z (mean, sd)",
  );
  assert.equal(description, (spec as { description: string }).description);
  const custom = await chartBundle(spec, { title: "T", description: "D" });
  assert.equal(custom["text/plain"], "T\nD");
  assert.match(custom["text/html"]!, /<img [^>]*alt="T\. D" title="T"/);
});

Deno.test("displayable and lazyDisplayable freeze their bundles", async () => {
  const d = displayable({ "text/plain": "x" });
  assert.ok(Object.isFrozen(d.bundle));
  const l = lazyDisplayable(() => Promise.resolve({ "text/plain": "y" }));
  assert.equal((await l[DISPLAY]())["text/plain"], "y");
});
