/**
 * Precise data near a large value (1000 ± 0.3 g, recorded to 0.1 mg) once made
 * some re-expressions collapse to one double, and an exception from inside a
 * display aborted a whole report. Every display, export and the report must now
 * work on such data, and no display text may hold "NaN".
 */
import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { writeReport } from "../../lib/plumb/report.ts";
import { toTable } from "../../lib/plumb/source.ts";
import { DISPLAY, type MimeBundle } from "../../lib/results/display.ts";

const rng = seededRandom(8);
const mass = Array.from({ length: 200 }, () => Math.round((1000 + 0.1 * rng.normal()) * 1e4) / 1e4);
const text = (b: MimeBundle) =>
  Object.values(b).map((v) => typeof v === "string" ? v : JSON.stringify(v)).join("\n");

Deno.test("precise data near 1000: every display renders, none says NaN", async () => {
  const p = plumb(mass, undefined, { name: "net mass (g)" });
  const shows: [string, { [DISPLAY](): MimeBundle | Promise<MimeBundle> }][] = [
    ["card", p],
    ["λ explorer", p.lambda()],
    ["candidates", p.reexpress()],
    ["best", p.reexpress("best")],
    ["tests", p.tests()],
    ["sentence", p.sentence()],
    ["QQ", p.qq()],
    ["histogram", p.histogram()],
  ];
  for (const [what, d] of shows) {
    const t = text(await d[DISPLAY]());
    ok(t.length > 100, `${what} rendered`);
    ok(!/\bNaN\b/.test(t), `${what} holds NaN`);
  }
});

Deno.test("precise data near 1000: the report of a table with such a column completes", async () => {
  const t = toTable({ mass, torque: mass.map((_, i) => 2 + ((i * 7919) % 101) / 50) });
  const r = await writeReport(t, { title: "mass" });
  ok(r.html.includes("net") || r.html.includes("mass"));
  ok(!/\bNaN\b/.test(r.html), "the report holds NaN");
  ok(r.sentences.length === 2);
});
