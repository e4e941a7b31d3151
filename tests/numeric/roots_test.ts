import { equal, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { findRoot } from "../../lib/numeric/roots.ts";
import { assertClose } from "../_assert_close.ts";

// Tolerance: Brent's zero returns x within 2·relativeTolerance·|x| + absoluteTolerance
// of a sign change; with the defaults (4.4e-16, 1e-14) the checks allow 1e-13 absolute
// or 1e-14 relative.
const TOL = { abs: 1e-13, rel: 1e-14 };

Deno.test("simple roots: √2, cos x = x, and a root at an end", () => {
  assertClose(findRoot((x) => x * x - 2, [0, 2]).x, Math.SQRT2, TOL, "x² − 2");
  // Dottie number, cos x = x: 0.7390851332151607 (from memory; checked by cos(x) − x below).
  const d = findRoot((x) => Math.cos(x) - x, [0, 1]);
  // |f′| ≤ 2 on [0, 1], so a location within 1e-14 leaves a residual below 2e-14.
  ok(Math.abs(Math.cos(d.x) - d.x) < 2e-14, `residual ${Math.cos(d.x) - d.x}`);
  assertClose(d.x, 0.7390851332151607, TOL, "Dottie number");
  const e = findRoot((x) => x - 3, [3, 5]);
  equal(e.x, 3);
  equal(e.evaluations, 2);
});

Deno.test("endValues saves the two end evaluations", () => {
  let calls = 0;
  const f = (x: number) => {
    calls++;
    return Math.exp(x) - 5;
  };
  const r = findRoot(f, [0, 3], { endValues: [f(0), f(3)] });
  calls -= 2;
  equal(r.evaluations, calls);
  assertClose(r.x, Math.log(5), TOL, "ln 5");
});

Deno.test("no sign change, NaN ends, and budget exhaustion", () => {
  throws(() => findRoot((x) => x * x + 1, [-1, 1]), RangeError);
  throws(() => findRoot(() => NaN, [-1, 1]), RangeError);
  const r = findRoot((x) => Math.exp(x) - 1.5, [-2, 10], { maxEvaluations: 3 });
  equal(r.converged, false);
});

Deno.test("a flat-then-steep function still converges (bisection safeguard)", () => {
  const r = findRoot((x) => (x < 0.999 ? -1e-12 : x - 0.9995), [0, 1]);
  ok(r.converged && r.evaluations < 120, `${r.evaluations} evaluations`);
  assertClose(r.x, 0.9995, TOL, "root after a plateau");
});

Deno.test("property: cubic roots are found to the stated tolerance", () => {
  fc.assert(
    fc.property(
      fc.double({ min: -100, max: 100, noNaN: true }),
      fc.double({ min: 0.01, max: 5, noNaN: true }),
      (r0, s) => {
        // (x − r0)·((x − r0)² + s) has the single real root r0.
        const f = (x: number) => (x - r0) * ((x - r0) ** 2 + s);
        const r = findRoot(f, [r0 - 3.7, r0 + 11]);
        ok(r.converged);
        assertClose(r.x, r0, { abs: 1e-13, rel: 4e-16 * 4 }, `r0=${r0} s=${s}`);
      },
    ),
    { seed: 20261201, numRuns: 300 },
  );
});
