import { equal, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { minimizeInInterval } from "../../lib/numeric/optimize.ts";
import { assertClose } from "../_assert_close.ts";

// Tolerance: Brent's localmin locates a smooth minimum to about
// relativeTolerance·|x| + absoluteTolerance in x; the checks allow 1e-7 (5× the
// default 1.49e-8 relative tolerance, plus function-value rounding near the minimum).
const LOC = { abs: 1e-7 };

Deno.test("minimum of a parabola and of a non-symmetric smooth function", () => {
  const r = minimizeInInterval((x) => 3 * (x - 1.25) ** 2 - 7, [-10, 10]);
  assertClose(r.x, 1.25, LOC, "parabola vertex");
  assertClose(r.value, -7, { abs: 1e-12 }, "parabola minimum value");
  ok(r.converged && r.evaluations < 30, `${r.evaluations} evaluations`);
  // x·ln x has its minimum at 1/e (calculus: derivative ln x + 1 = 0).
  const s = minimizeInInterval((x) => x * Math.log(x), [0.01, 3]);
  assertClose(s.x, 1 / Math.E, LOC, "x ln x");
});

Deno.test("a minimum at an end of the interval is approached, never left", () => {
  const seen: number[] = [];
  const r = minimizeInInterval((x) => {
    seen.push(x);
    return x;
  }, [2, 5]);
  ok(seen.every((x) => x > 2 && x < 5), "every evaluation strictly inside");
  assertClose(r.x, 2, { abs: 1e-6 }, "decreasing function: minimum at the lower end");
});

Deno.test("NaN values are never chosen; budget exhaustion is reported", () => {
  const r = minimizeInInterval((x) => (x < 1 ? NaN : (x - 2) ** 2), [0, 4]);
  assertClose(r.x, 2, LOC, "minimum where f is defined");
  const b = minimizeInInterval((x) => Math.abs(x - 0.3), [0, 1], { maxEvaluations: 4 });
  equal(b.converged, false);
  equal(b.evaluations, 4);
  throws(() => minimizeInInterval((x) => x, [1, 1]), RangeError);
});

Deno.test("property: quartic-plus-parabola minima are located to 1e-7", () => {
  fc.assert(
    fc.property(
      fc.double({ min: -50, max: 50, noNaN: true }),
      fc.double({ min: 0.1, max: 10, noNaN: true }),
      (m, k) => {
        // f(x) = k(x − m)² + (x − m)⁴ has its only minimum at m.
        const r = minimizeInInterval((x) => k * (x - m) ** 2 + (x - m) ** 4, [m - 7, m + 13]);
        assertClose(r.x, m, { abs: 1e-7, rel: 1e-7 }, `m=${m} k=${k}`);
      },
    ),
    { seed: 20261201, numRuns: 200 },
  );
});
