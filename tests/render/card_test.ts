import { deepEqual, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { cardBundle, cardCharts } from "../../lib/render/card.ts";
import { evidenceLedger } from "../../lib/render/evidence_ledger.ts";

const rng = seededRandom(31);
const origin = { label: "potassium", column: "potassium", missingDropped: 0, textDropped: 0 };
// invented: 489 potassium-like values and 17 (3.4%) haemolysed-like ones
const x = Float64Array.from([
  ...Array.from({ length: 489 }, () => Math.round((4.2 + 0.35 * rng.normal()) * 100) / 100),
  ...Array.from({ length: 17 }, () => Math.round((6.4 + 0.2 * rng.normal()) * 100) / 100),
]);
const a = analyse(x, origin);

Deno.test("the evidence is grouped by what each measure looks at, Lilliefors apart from Shapiro–Wilk", () => {
  const l = evidenceLedger(a);
  deepEqual(l.map((g) => g.title.split(":")[0]), [
    "The ends",
    "The lean",
    "The middle",
    "The whole line",
  ]);
  const where = (name: string) => l.findIndex((g) => g.rows.some((r) => r.what.startsWith(name)));
  deepEqual(
    [where("Anderson–Darling"), where("skewness"), where("Lilliefors"), where("Shapiro–Wilk")],
    [0, 1, 2, 3],
  );
  const sw = l[3].rows[0];
  ok(sw.value.includes("= (") && sw.value.endsWith(")²"), "W shown as (slope / sd)²");
  // the cluster is named once: the far values on its side are not also counted as outliers
  const ends = l[0].rows;
  ok(ends.find((r) => r.what === "separate cluster")!.value === "17 values");
  ok(ends.find((r) => r.what.startsWith("outliers"))!.value === "none");
});

Deno.test("the card puts the reading first, the QQ plot beside the evidence, the histogram last", async () => {
  const html = cardBundle(a, await cardCharts(a, "potassium"))["text/html"]!;
  const at = (s: string) => html.indexOf(s);
  ok(at("Clear departure from normal") > 0);
  ok(at("Clear departure from normal") < at("normal QQ plot"), "reading before the QQ plot");
  ok(
    at("normal QQ plot") < at("Where the evidence points"),
    "QQ plot, then the evidence beside it",
  );
  ok(at("Where the evidence points") < at("histogram ·"), "histogram after the evidence");
  ok(html.includes("dashed: slope"), "the order-statistic line is drawn and named");
  ok(!html.includes("detrended"), "no detrended plot on the card");
  ok(!/\bNaN\b/.test(html));
  // A viewer that strips styles (an untrusted notebook) still separates the name from the counts.
  const bare = html.replace(/<[^>]*>/g, "");
  ok(/^\s*potassium n = /.test(bare), JSON.stringify(bare.slice(0, 60)));
});

Deno.test("bounds on p stay visible in the evidence (≥ for Lilliefors above 0.1)", () => {
  const calm = analyse(Float64Array.from({ length: 60 }, () => 10 + rng.normal()), origin);
  const lil = evidenceLedger(calm)[2].rows[0];
  ok(lil.evidence.startsWith("p ≥ 0.1000"), lil.evidence);
});
