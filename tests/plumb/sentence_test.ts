import { equal, match, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { proseP, writeSentence } from "../../lib/plumb/sentence.ts";
import { SHAPES } from "./_shapes.ts";

const origin = (label: string, missing = 0, text = 0) => ({
  label,
  column: label,
  missingDropped: missing,
  textDropped: text,
});
const CAUTION_GATE =
  "Before a t-test or ANOVA, judge normality from the residuals' QQ plot rather than using this test as a gate.";
const CAUTION_DECISION =
  "Where this result feeds a clinical, safety or product-release decision, that decision follows your organisation's own procedures and the applicable standards; a normality check is one input to it.";

Deno.test("proseP: three decimals, p < 0.001 below that", () => {
  equal(proseP(0.04567), "p = 0.046");
  equal(proseP(0.001), "p = 0.001");
  equal(proseP(0.000999), "p < 0.001");
  equal(proseP(0), "p < 0.001");
  equal(proseP(1), "p = 1.000");
});

for (const [name, x] of Object.entries(SHAPES)) {
  Deno.test(`sentence for the ${name} sample: variable, n, W, p and the cautions`, () => {
    const a = analyse(x, origin(name));
    const s = writeSentence(a);
    ok(s.startsWith(`${name}: n = ${a.n.toLocaleString("en-US")}.`), s);
    match(s, /Shapiro–Wilk W = \d\.\d{4}, p (=|<) \d\.\d{3}; skewness G1 = /);
    ok(s.includes(CAUTION_GATE));
    ok(s.endsWith(CAUTION_DECISION));
    if (a.primary.pValue >= 0.05) {
      ok(s.includes("A large p does not show that the data are normal"));
    }
    if (a.n > 5000) ok(s.includes("seeded random subsample of 5,000 of the 50,000 values"));
  });
}

Deno.test("sentence: exact text for the normal n = 15 sample with dropped cells", () => {
  const a = analyse(SHAPES.normal15, origin("fill (mL)", 2, 1));
  const w = a.primary.statistic.toFixed(4);
  const p = a.primary.pValue.toFixed(3);
  const g1 = a.moments.G1, g2 = a.moments.G2;
  const f = (v: number) =>
    Math.abs(v) < 0.0005 ? "0.000" : (v < 0 ? "−" : "") + Math.abs(v).toPrecision(3);
  equal(
    writeSentence(a),
    `fill (mL): n = 15 (2 missing cells and 1 non-numeric cell left out). ` +
      `Shapiro–Wilk W = ${w}, p = ${p}; skewness G1 = ${f(g1)}, excess kurtosis G2 = ${f(g2)}. ` +
      `Reading: no clear departure from normal. ` +
      `A large p does not show that the data are normal, only that this sample cannot tell them apart ` +
      `from a normal distribution, and with 15 values that is weak evidence. ${CAUTION_GATE} ${CAUTION_DECISION}`,
  );
});

Deno.test("sentence: an adjusted p is reported beside the raw one", () => {
  const a = analyse(SHAPES.rightSkewed, origin("delay"));
  const s = writeSentence(a, { adjusted: { p: 0.0004, method: "Holm", family: 12 } });
  match(s, /p < 0\.001 \(Holm-adjusted p < 0\.001 over 12 tests\)/);
});

Deno.test("sentence: the reason for the verdict and what was found are kept", () => {
  const a = analyse(SHAPES.rightSkewed, origin("delay"));
  match(writeSentence(a), /Reading: clear departure from normal, from strong right skew\./);
  const rng = seededRandom(7);
  const bulk = Float64Array.from({ length: 40 }, () => 10 + 0.2 * rng.normal());
  const b = analyse(Float64Array.from([...bulk, 12.5]), origin("fill"));
  match(
    writeSentence(b),
    /One value stands apart by the generalized ESD procedure: 12\.50 \(row 41\); without it the rest looks normal/,
  );
});

Deno.test("sentence: cautions can be left to the end of a list", () => {
  const a = analyse(SHAPES.normal15, origin("fill"));
  const s = writeSentence(a, { cautions: false });
  ok(!s.includes(CAUTION_GATE) && !s.includes(CAUTION_DECISION));
});
