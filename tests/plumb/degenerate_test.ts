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

Deno.test("the λ explorer shows a note, not an exception, when a valid sample leaves no λ to draw", async () => {
  const cases: [string, number[], RegExp][] = [
    // ±1e300: every power but one overflows
    [
      "huge",
      Array.from({ length: 30 }, (_, i) => (i % 2 ? 1 : -1) * 1e300 * (1 + i / 100)),
      /not finite or all equal in double precision/,
    ],
    // steps of 2 at 1e16: the Box–Cox variance is not representable at λ = 5
    [
      "mass_ug",
      Array.from({ length: 30 }, (_, i) => 1e16 + (i % 5) * 2),
      /not representable in double precision/,
    ],
  ];
  for (const [name, x, why] of cases) {
    const p = plumb(x, name);
    for (
      const [what, d] of [["card", p], ["λ explorer", p.lambda()], ["best", p.reexpress()]] as const
    ) {
      const t = text(await d[DISPLAY]());
      ok(!/\bNaN\b/.test(t), `${name} ${what} holds NaN`);
    }
    const spec = JSON.stringify(p.lambda().spec);
    ok(spec.includes("λ explorer not drawn"), `${name}: the note's title`);
    ok(why.test(spec), `${name}: the reason`);
  }
});
