import { match, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";

Deno.test("λ at the range end from a flat likelihood is explained as such, not as dominating values", () => {
  // data spanning about 576–582: a relative spread of 1%, so every power is nearly linear
  const rng = seededRandom(3);
  const x = Float64Array.from({ length: 200 }, () => 579 + 1.2 * rng.normal());
  const f = boxCoxFit(x);
  ok(f.lambdaAtRangeEnd);
  match(f.notes[0], /nearly flat across the whole range/);
  ok(!f.notes.some((n) => n.includes("dominate")));
});

Deno.test("λ at the range end with a sharp likelihood still points at the values that drive it", () => {
  // Box–Cox λ = −2 makes these normal; searched only over [−1, 1], the maximum is at −1
  const rng = seededRandom(4);
  const x = Float64Array.from({ length: 300 }, () => (1 - 2 * 0.08 * rng.normal()) ** -0.5);
  const f = boxCoxFit(x, { range: [-1, 1] });
  ok(f.lambdaAtRangeEnd && f.lambda === -1, String(f.lambda));
  match(f.notes[0], /a few values probably dominate the fit/);
  ok(!f.notes.some((n) => n.includes("nearly flat")));
});
