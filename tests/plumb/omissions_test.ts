/**
 * What a screening leaves out is said where the user looks: per-group
 * sentences name skipped groups and their missing cells, the standard
 * cautions come once per list, a grouping column with no value says so, and
 * the pooled within-group residuals keep the data's measurement step.
 */
import { equal, match, ok } from "node:assert/strict";
import { plumb } from "../../lib/plumb/plumb.ts";
import { SENTENCE_CAUTIONS } from "../../lib/plumb/sentence.ts";
import { seededRandom } from "../../lib/numeric/random.ts";

const fill = [5.1, 4.9, 5.3, 5.0, 5.2, 4.8, 5.0, 5.1, null, 4.7, 5.5, 5.2];
const line = ["A", "A", "A", "A", "A", "B", "B", null, "B", "A", "A", "A"];

Deno.test("per-group sentences include a skipped group with its missing cells, and the cautions once", () => {
  const texts = plumb({ fill, line }, "fill").by("line").sentences().texts;
  equal(texts.length, 4, "A, B, the pooled residuals, the cautions");
  match(
    texts[1],
    /^fill — line = B: not screened, only 2 values; at least 4 are needed \(1 missing cell left out\)\.$/,
  );
  for (const c of SENTENCE_CAUTIONS) {
    equal(texts.filter((t) => t.includes(c)).length, 1, `stated once: ${c.slice(0, 30)}`);
  }
  ok(texts[3].startsWith("For all of the above: a large p does not show"));
});

Deno.test("a grouping column with no value: the table and the sentences say there is no group", () => {
  const g = plumb({ fill, none: Array(12).fill(null) }, "fill").by("none");
  const md = g.toMarkdown();
  match(
    md,
    /No group to screen: every cell of none is empty, so all 11 values of fill are left out\./,
  );
  ok(!/across the 0 groups/.test(md), "no adjustment across nothing");
  match(g.sentences().texts[0], /^No group to screen/);
});

Deno.test("pooled within-group residuals inherit the data's step (no spurious fine step, no ties warning)", () => {
  // glucose recorded to 0.01 mmol/L, sd 0.48, three sites with different means (n = 600)
  const r = seededRandom(5);
  const glucose = Array.from(
    { length: 600 },
    (_, i) => Math.round((5 + (i % 3) * 0.37 + 0.48 * r.normal()) * 100) / 100,
  );
  const site = glucose.map((_, i) => ["north", "south", "east"][i % 3]);
  const res = plumb({ glucose, site }, "glucose").by("site").result().residuals!;
  equal(res.reading.facts.step, 0.01);
  equal(res.reading.facts.rounding.coarse, false);
  for (const t of res.tests) {
    ok(!(t.result?.warnings ?? []).some((w) => /steps of|rounded/.test(w)), t.test);
  }
});
