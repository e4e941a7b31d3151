/**
 * The reading's promises, checked on seeded and invented data in one run:
 * no rounding warning when the step is fine against the spread and one when
 * it is coarse, pooled residuals on the data's step, histogram widths a whole
 * number of steps with edges at half-steps, a 3% cluster named in the reading
 * and the sentence and not re-expressed, a subsampled Shapiro–Wilk's n kept
 * apart from the full n, identifier columns left out of a survey with a note,
 * both σ lines on the QQ plot and both σ in the reading, and every display of
 * eleven awkward columns (precise values near 1000, a floor pile-up, 6,000
 * values, 6 values, negative values …) rendered without "NaN", "1/1/x" or a
 * hyphen for a minus sign in λ or a bound on a bound ("≤ < 0.0001"). Columns the chain refuses (3 values; the
 * reciprocal of zeros) must be refused with a `PlumbError`.
 *
 * The verdict's rates come from `tools/sim/verdict_rates.ts`.
 *
 * Run: `deno run -A tools/reading_checks.ts [-v]`; prints each failed check
 * (every check with `-v`) and exits with status 1 when any fails.
 *
 * @module
 */
import { plumb, PlumbError, survey } from "../mod.ts";
import { seededRandom } from "../lib/numeric/random.ts";
import { DISPLAY, type MimeBundle } from "../lib/results/display.ts";
import { toTable } from "../lib/plumb/source.ts";

const results: [string, boolean, string][] = [];
const check = (what: string, ok: boolean, detail = "") => results.push([what, ok, detail]);
const text = (b: MimeBundle) =>
  Object.entries(b).filter(([k]) => !k.startsWith("image/"))
    .map(([, v]) => typeof v === "string" ? v : JSON.stringify(v)).join("\n");
const rng = seededRandom(42);
const onGrid = (v: number, h: number, digits: number) => +(Math.round(v / h) * h).toFixed(digits);
const normals = (n: number, m: number, s: number, h: number, digits: number) =>
  Array.from({ length: n }, () => onGrid(m + s * rng.normal(), h, digits));

// Rounding judged by the step against the spread; residuals inherit the step.
{
  const glucose = normals(600, 5.4, 0.48, 0.01, 2);
  const fine = plumb(glucose, "glucose").analysis().reading.points.join(" | ");
  check("a fine step gives no rounding warning", !/coarse/i.test(fine), fine.slice(0, 200));
  const coarse = plumb(normals(600, 20, 0.5, 1, 0), "whole").analysis().reading.points.join(" | ");
  check("a coarse step gives the warning", /coarse against the spread/.test(coarse));
  const t = toTable({ v: glucose, line: glucose.map((_, i) => "ABC"[i % 3]) });
  const step = plumb(t, "v").by("line").result().residuals?.reading.facts.step;
  check("pooled residuals keep the step 0.01", Math.abs((step ?? 0) - 0.01) < 1e-12, `${step}`);
}
// Histogram bins on the step.
for (const [h, digits] of [[1, 0], [0.1, 1]] as const) {
  const hd = plumb(normals(600, 50, 60 * h, h, digits), "v").analysis().histogram;
  const k = hd.binWidth / h;
  const offset = hd.edges[0] / h - Math.round(hd.edges[0] / h);
  check(`bin width a whole number of steps of ${h}`, Math.abs(k - Math.round(k)) < 1e-9, `${k}`);
  check(`edges half a step off the values (${h})`, Math.abs(Math.abs(offset) - 0.5) < 1e-6);
}
// A 3% cluster: 17 of 600 values far above the rest.
{
  const x = [...normals(583, 4.2, 0.35, 0.1, 1), ...normals(17, 6.6, 0.3, 0.1, 1)];
  const p = plumb(x, "potassium");
  const reason = p.analysis().reading.reason;
  check("a 3% cluster named in the reading", /separate cluster of 17/.test(reason), reason);
  check("and in the sentence", /separate cluster/.test(p.sentence().text));
  check("and not re-expressed", p.reexpress().steps.length === 0, p.reexpress().choice?.reason);
}
// Subsampled Shapiro–Wilk: its n apart from the full n.
{
  const a = plumb(normals(6000, 10, 1, 1e-6, 6), "big").analysis();
  check(
    "a subsample's n apart from the full n",
    a.primary.n <= 5000 && a.n === 6000 && a.subsample?.size === a.primary.n,
    `primary.n ${a.primary.n}, n ${a.n}`,
  );
}
// Identifier columns left out of a survey, with a note.
{
  const n = 80;
  const t = toTable({
    "": Array.from({ length: n }, (_, i) => i + 1),
    sample_id: Array.from({ length: n }, (_, i) => 1001 + i),
    fill: normals(n, 500, 1, 0.1, 1),
  });
  const s = survey(t);
  const screened = s.result().rows.map((r) => r.column);
  check("identifiers not screened", screened.join() === "fill", screened.join());
  check("and a note says so", /like a row number/.test(text(await s[DISPLAY]())));
}
// Both estimates of σ: the dashed slope line on the QQ plot, both in the reading.
{
  const p = plumb([...normals(100, 10, 1, 1e-6, 6), 25], "o");
  check("the QQ plot draws the slope dashed", /strokeDash/.test(JSON.stringify(p.qq().spec)));
  check("the reading states both σ", /Two estimates of σ/.test(p.analysis().reading.points.join()));
}
// Every display of awkward columns: no exception, no NaN, no 1/1/x, λ with a true minus.
const columns: [string, number[]][] = [
  ["mass to 0.1 g", normals(200, 1000, 0.3, 0.1, 1)],
  ["mass to 0.1 mg", normals(200, 1000, 0.1, 1e-4, 4)],
  ["right skew", Array.from({ length: 120 }, () => Math.exp(0.8 * rng.normal()))],
  ["left skew", Array.from({ length: 120 }, () => 10 - Math.exp(0.8 * rng.normal()))],
  ["reciprocal normal", Array.from({ length: 300 }, () => 1 / (2 + 0.3 * rng.normal()))],
  ["floor", [...Array(372).fill(0), ...normals(134, 3, 2, 0.1, 1).map(Math.abs)]],
  ["6000 values", Array.from({ length: 6000 }, () => Math.exp(0.5 * rng.normal()))],
  ["6 values", [1, 2, 3, 4, 5, 6]],
  ["negative", Array.from({ length: 80 }, () => -5 + Math.exp(rng.normal()))],
  ["beyond A–D's range", Array.from({ length: 3000 }, () => Math.exp(1.5 * rng.normal()))],
  ["two reciprocals", Array.from({ length: 60 }, () => 2 + Math.exp(0.4 * rng.normal()))],
];
for (const [name, x] of columns) {
  const p = plumb(x, name);
  const shows: [string, () => { [DISPLAY](): MimeBundle | Promise<MimeBundle> }][] = [
    ["card", () => p],
    ["QQ", () => p.qq()],
    ["detrended", () => p.detrended()],
    ["histogram", () => p.histogram()],
    ["λ explorer", () => p.lambda()],
    ["candidates", () => p.candidates()],
    ["best", () => p.reexpress()],
    ["tests", () => p.tests()],
    ["sentence", () => p.sentence()],
    ["stakes", () => p.stakes()],
  ];
  if (name === "two reciprocals") {
    shows.push(["1/(1/x)", () => p.reexpress("reciprocal").reexpress("reciprocal")]);
  }
  for (const [what, show] of shows) {
    try {
      const shown = show();
      const data = "toJSON" in shown
        ? JSON.stringify((shown as { toJSON(): unknown }).toJSON())
        : "";
      const t = `${text(await shown[DISPLAY]())}\n${data}`;
      const bad = [
        /\bNaN\b/.test(t) ? "NaN" : "",
        /1\/1\/x/.test(t) ? "1/1/x" : "",
        /λ̂? = -\d/.test(t) ? "λ with a hyphen" : "",
        /[≤≥] </.test(t) ? "a bound on a bound (≤ <)" : "",
      ].filter((s) => s);
      check(`${name}: ${what}`, bad.length === 0, bad.join(", "));
    } catch (e) {
      check(`${name}: ${what}`, false, `throws: ${(e as Error).message.slice(0, 160)}`);
    }
  }
}
// Refusals are errors with a code, not crashes.
for (
  const [what, f] of [
    ["3 values", () => plumb([1, 2, 4], "x").analysis()],
    [
      "the reciprocal of zeros",
      () => plumb([0, 0, 1, 2, 3, 5], "x").reexpress("reciprocal").values(),
    ],
  ] as const
) {
  try {
    f();
    check(`${what} refused`, false, "not refused");
  } catch (e) {
    check(`${what} refused`, e instanceof PlumbError, String(e));
  }
}
const failed = results.filter((r) => !r[1]);
for (const [what, ok, detail] of results) {
  if (!ok || Deno.args.includes("-v")) console.log(`${ok ? "pass" : "FAIL"}  ${what}  ${detail}`);
}
console.log(`${results.length - failed.length} of ${results.length} checks pass`);
if (failed.length > 0) Deno.exit(1);
