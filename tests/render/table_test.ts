import assert from "node:assert/strict";
import { tableHtml, tableMarkdown, tableText } from "../../lib/render/table.ts";

// A small table with characters that need escaping in each target.
const t = {
  caption: "Tests <n = 12>",
  columns: [{ title: "test" }, { title: "p", align: "right" as const }],
  rows: [["K² | D'Agostino", "0.4100"], ["A*", "< 0.0001"]],
  notes: ["Ties: 3 values repeat."],
};

Deno.test("tableHtml: exact output", () => {
  assert.equal(
    tableHtml(t),
    `<table style="border-collapse:collapse;font-variant-numeric:tabular-nums">` +
      `<caption style="text-align:left;font-weight:bold;padding:4px 0">Tests &lt;n = 12&gt;</caption>` +
      `<thead><tr><th style="text-align:left;padding:2px 8px">test</th>` +
      `<th style="text-align:right;padding:2px 8px;white-space:nowrap">p</th></tr></thead>\n<tbody>\n` +
      `<tr><td style="text-align:left;padding:2px 8px">K² | D&#39;Agostino</td>` +
      `<td style="text-align:right;padding:2px 8px;white-space:nowrap">0.4100</td></tr>\n` +
      `<tr><td style="text-align:left;padding:2px 8px">A*</td>` +
      `<td style="text-align:right;padding:2px 8px;white-space:nowrap">&lt; 0.0001</td></tr>\n` +
      `</tbody></table>\n` +
      `<p style="margin:2px 0;font-size:90%">Ties: 3 values repeat.</p>`,
  );
});

Deno.test("tableMarkdown: exact output", () => {
  assert.equal(
    tableMarkdown(t),
    "**Tests &lt;n = 12&gt;**\n\n| test | p |\n| :--- | ---: |\n" +
      "| K² \\| D'Agostino | 0.4100 |\n| A\\* | &lt; 0.0001 |\n\nTies: 3 values repeat.",
  );
});

Deno.test("tableText: exact output", () => {
  assert.equal(
    tableText(t),
    "Tests <n = 12>\ntest                    p\n---------------  --------\n" +
      "K² | D'Agostino    0.4100\nA*               < 0.0001\nTies: 3 values repeat.",
  );
});
