import assert from "node:assert/strict";
import { chartBundle } from "../../lib/render/chart_bundle.ts";
import { escapeHtml } from "../../lib/render/escape.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { tableHtml, tableMarkdown, tableText } from "../../lib/render/table.ts";
import { KINDS, specsFor } from "./_samples.ts";

/** Names that break naive field access, HTML, Markdown or Vega expressions. */
const HOSTILE = [
  `a.b[0]`,
  `x"y'z`,
  `<script>alert("x")</script>`,
  `datum.v || 'pwned'`,
  `fill 🍾 volume`,
  `\\n}{ | * _ # ]]>`,
  `</svg><img src=x onerror=alert(1)>`,
];

for (const name of HOSTILE) {
  Deno.test(`hostile name ${JSON.stringify(name)}: every chart compiles cleanly and shows it as typed`, async () => {
    const specs = specsFor(120, name, 9);
    for (const kind of KINDS) {
      const spec = specs[kind];
      const warnings: string[] = [];
      const svg = await renderSvg(spec, { warnings });
      assert.deepEqual(warnings, [], `${kind} warnings`);
      // the name reaches the spec only as text: the title holds it exactly
      const title = (spec as { title: { text: string } }).title.text;
      assert.equal(title, name, `${kind} title`);
      // no field name in the spec is user text
      const fields = new Set<string>();
      JSON.stringify(spec, (k, v) => {
        if (k === "field") fields.add(v);
        return v;
      });
      for (const f of fields) assert.match(f, /^[a-z]{1,5}$/, `${kind} field ${f}`);
      // in the SVG the name appears escaped, and never as live markup
      assert.ok(svg.includes(escapeHtml(name).replace(/&#39;/g, "'")), `${kind} shows the name`);
      const b = await chartBundle(spec);
      const html = b["text/html"]!;
      // One element with escaped attributes: the picture; the name only inside alt/title.
      assert.match(
        html,
        /^<div class="plumbline-chart"[^<>]*><img src="data:image\/png;base64,[A-Za-z0-9+/=]+" width="\d+" height="\d+" alt="[^"<>]*" title="[^"<>]*" style="[^"<>]*"\/><\/div>$/,
        `${kind} html is one picture`,
      );
      assert.ok(html.includes(`alt="${escapeHtml(name)}`), `${kind} alt text holds the name`);
    }
  });
}

Deno.test("hostile text in tables is escaped in every form", () => {
  const name = `<script>alert("x")</script> | *b* \u001b[31m`;
  const t = { caption: name, columns: [{ title: name }], rows: [[name]], notes: [name] };
  const html = tableHtml(t);
  assert.ok(!html.includes("<script"));
  assert.ok(html.includes("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;"));
  const md = tableMarkdown(t);
  assert.ok(!md.includes("<script"));
  assert.ok(md.includes("\\| \\*b\\*"));
  assert.ok(!tableText(t).includes("\u001b"));
});
