import assert from "node:assert/strict";
import { compile } from "vega-lite";
import { chartBundle, chartMeta } from "../../lib/render/chart_bundle.ts";
import { drawChart } from "../../lib/render/chart_image.ts";
import { pngSize } from "../../lib/render/png.ts";
import { VEGALITE_MIME } from "../../lib/results/display.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { KINDS, specsFor } from "./_samples.ts";
import { qqSpec } from "../../lib/render/qq_spec.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { assertClose } from "../_assert_close.ts";

const specs = specsFor(500, "fill volume (mL)");

for (const kind of KINDS) {
  Deno.test(`${kind}: the spec compiles with vega-lite 5 and renders with vega, without warnings`, async () => {
    const spec = specs[kind];
    assert.equal(
      (spec as { $schema?: string }).$schema,
      "https://vega.github.io/schema/vega-lite/v5.json",
    );
    const warnings: string[] = [];
    const logger = {
      level: () => logger,
      warn: (...a: unknown[]) => (warnings.push(a.join(" ")), logger),
      error: (...a: unknown[]) => (warnings.push(a.join(" ")), logger),
      info: () => logger,
      debug: () => logger,
    };
    // deno-lint-ignore no-explicit-any
    const vg = compile(spec, { logger: logger as any }).spec;
    assert.ok(vg.marks !== undefined && vg.marks.length > 0);
    const svg = await renderSvg(spec, { warnings });
    assert.deepEqual(warnings, []);
    assert.ok(svg.startsWith("<svg"));
    assert.ok(svg.endsWith("</svg>"));
  });

  Deno.test(`${kind}: the bundle holds Vega-Lite, HTML with the chart's PNG, and plain text`, async () => {
    const b = await chartBundle(specs[kind]);
    assert.deepEqual(Object.keys(b).sort(), [VEGALITE_MIME, "text/html", "text/plain"].sort());
    const html = b["text/html"]!;
    const m = html.match(
      /^<div class="plumbline-chart"[^>]*><img src="data:image\/png;base64,([^"]+)" width="(\d+)" height="(\d+)" alt="([^"]+)"/,
    );
    assert.ok(m, html.slice(0, 200));
    const png = Uint8Array.from(atob(m[1]), (c) => c.charCodeAt(0));
    const size = pngSize(png)!;
    // Drawn at 2× (1.5×, 1× or 0.75× for a panel whose PNG would pass its budget), shown at 1×.
    assert.ok(
      [2, 1.5, 1, 0.75].some((k) => Math.abs(size.width - Number(m[2]) * k) <= 1),
      `${size.width}`,
    );
    assert.ok(png.length <= 100_000, `${kind}: ${png.length} bytes`);
    assert.ok(m[4].length >= 40, "the alt text says what the chart shows");
    assert.ok(!b["text/plain"].includes("\u001b"), "no ANSI codes");
    assert.ok(b["text/plain"].startsWith("fill volume (mL)"));
    assert.equal(b[VEGALITE_MIME], specs[kind]);
  });

  Deno.test(`${kind}: the drawn SVG is accessible (role, title, description)`, async () => {
    const drawn = await drawChart(specs[kind], chartMeta(specs[kind]));
    assert.match(
      drawn.svg,
      /^<svg [^>]*role="img" aria-labelledby="([^"]+)-title \1-desc"><title id="\1-title">/,
    );
    assert.match(drawn.svg, /<desc id="[^"]+-desc">[^<]{40,}<\/desc>/);
  });
}

Deno.test("every chart draws its own white background (legible on a dark theme)", async () => {
  for (const kind of KINDS) {
    const svg = await renderSvg(specs[kind]);
    assert.match(svg, /^<svg[^>]*><rect width="\d+" height="\d+" fill="#ffffff"\/>/, kind);
  }
});

Deno.test("the QQ chart says how many points it shows and names its methods", () => {
  const t = JSON.stringify(specs.qq);
  assert.ok(t.includes("normal QQ plot · all 500 points"));
  assert.ok(t.includes("band: pointwise 95% · line:"));
  assert.ok(t.includes("Blom's plotting positions (i − 3/8)/(n + 1/4)"));
  const big = JSON.stringify(specsFor(5000, "x").qq);
  assert.ok(big.includes("800 of 5,000 points shown (tails in full)"));
});

Deno.test("the QQ chart draws the order-statistic slope as a dashed second line when given", () => {
  const q = qqData([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 9.5]);
  const spec = qqSpec(q, { name: "fill", slope: 1.0928 }) as unknown as {
    layer: { mark: { strokeDash?: number[] }; data?: { values: { z: number; v: number }[] } }[];
  };
  const dashed = spec.layer.filter((l) => l.mark.strokeDash !== undefined);
  assert.equal(dashed.length, 1);
  // the line passes through the mean at z = 0 with slope 1.0928: check at its two ends
  const [a, b] = dashed[0].data!.values;
  // (the spec rounds z to 5 significant digits, so the slope read back is good to about 1e-4)
  assertClose((b.v - a.v) / (b.z - a.z), 1.0928, { rel: 1e-4 }, "slope of the dashed line");
  assert.ok(JSON.stringify(spec).includes("dashed: slope 1.093 from the ordered values"));
  assert.ok(!JSON.stringify(qqSpec(q, { name: "fill" })).includes("strokeDash"));
});
