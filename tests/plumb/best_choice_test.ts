import { equal, match } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { analyse } from "../../lib/plumb/analysis.ts";
import { chooseBestStep } from "../../lib/plumb/best_choice.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { searchReexpressions } from "../../lib/reexpress/search.ts";

const rng = seededRandom(5);
const choose = (v: number[]) => {
  const x = Float64Array.from(v);
  const a = analyse(x, { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
  return chooseBestStep(x, a.reading, searchReexpressions(x));
};

Deno.test("a pile-up at the floor is not re-expressed, and the note says why and what to do", () => {
  // 372 of 506 values at 0 (the case): once ln(x + 6.25) was applied
  const x = [
    ...Array(372).fill(0),
    ...Array.from({ length: 134 }, () => Math.round(Math.exp(1 + rng.normal()) * 10) / 10),
  ];
  const c = choose(x);
  equal(c.step, undefined);
  match(
    c.note,
    /^No re-expression applied: the departure comes from 372 values piled up at the minimum, 0,/,
  );
  match(c.note, /methods for censored data$/);
});

Deno.test("a skewed sample gets its re-expression; a normal one needs none", () => {
  equal(
    choose(Array.from({ length: 200 }, () => Math.exp(0.5 * rng.normal()))).step?.formula,
    "ln(x)",
  );
  match(
    choose(Array.from({ length: 100 }, () => 10 + rng.normal())).note,
    /^No re-expression needed/,
  );
});

Deno.test("a separate cluster is not bent away", () => {
  const x = [
    ...Array.from({ length: 489 }, () => 4.2 + 0.35 * rng.normal()),
    ...Array.from({ length: 17 }, () => 6.4 + 0.3 * rng.normal()),
  ];
  const c = choose(x);
  equal(c.step, undefined);
  match(c.note, /separate cluster of 17 values/);
});

Deno.test("when even the best candidate still departs clearly, none is applied and its W and p are given", () => {
  // a right skew (so a power is worth trying) plus six wild values that stay wild on any scale
  const x = [
    ...Array.from({ length: 300 }, () => Math.exp(0.5 * rng.normal())),
    ...[60, 75, 80, 90, 110, 140],
  ];
  const c = choose(x);
  equal(c.step, undefined);
  match(
    c.note,
    /^No candidate is adequate: the best, .*, still departs clearly from normal \(W = 0\.\d{4}, p/,
  );
});

Deno.test("the chain: .reexpress() keeps a clustered sample as it is and says why; a skewed one is re-expressed", () => {
  const x = [
    ...Array.from({ length: 543 }, () => 4.2 + 0.35 * rng.normal()),
    ...Array.from({ length: 17 }, () => 6.8 + 0.3 * rng.normal()),
  ];
  const kept = plumb(x, "potassium").reexpress();
  equal(kept.steps.length, 0);
  equal(kept.label, "potassium");
  equal(kept.choice?.reexpression, null);
  match(
    kept.choice!.reason,
    /^No re-expression applied: the departure comes from a separate cluster/,
  );
  // the kept chain's card says why first, where the user looks
  equal(kept.analysis().reading.points[0], kept.choice!.reason);
  const logged = plumb(Array.from({ length: 200 }, () => Math.exp(0.5 * rng.normal())), "gap")
    .reexpress("best");
  equal(logged.label, "ln(gap)");
});

Deno.test("the chain: a floor pile-up (372 of 506 at 0) is kept by .reexpress(), with the reason", () => {
  // the case: ln(x + 6.25) was once applied to it
  const x = [
    ...Array(372).fill(0),
    ...Array.from({ length: 134 }, () => Math.round(Math.exp(1 + rng.normal()) * 10) / 10),
  ];
  const kept = plumb(x, "turbidity").reexpress();
  equal(kept.steps.length, 0);
  equal(kept.choice?.reexpression, null);
  match(kept.choice!.reason, /piled up at the minimum, 0/);
});
