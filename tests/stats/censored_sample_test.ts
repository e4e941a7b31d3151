import { deepEqual, equal, ok } from "node:assert/strict";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertPlumbError } from "../_shared.ts";

Deno.test("censoredSample counts sides and distinct limits, and copies its input", () => {
  const values = [0.05, 0.12, 0.05, 0.09, 0.02, 5, 0.21, 5, 0.3];
  const censor = [-1, 0, -1, 0, -1, 1, 0, 1, 0];
  const s = censoredSample(values, censor);
  equal(s.n, 9);
  equal(s.observed, 4);
  equal(s.left, 3);
  equal(s.right, 2);
  deepEqual(s.leftLimits, [0.02, 0.05]);
  deepEqual(s.leftCounts, [1, 2]);
  deepEqual(s.rightLimits, [5]);
  deepEqual(s.rightCounts, [2]);
  values[0] = 99;
  equal(s.values[0], 0.05, "a copy, not a view of the caller's array");
  ok(Object.isFrozen(s) && Object.isFrozen(s.leftLimits));
});

Deno.test("accepts typed arrays from ingest (Float64Array values, Int8Array sides)", () => {
  const s = censoredSample(new Float64Array([1, 2, 3, 0.5]), new Int8Array([0, 0, 0, -1]));
  equal(s.left, 1);
  equal(s.observed, 3);
});

Deno.test("errors: lengths, sides, non-finite values and limits, too few measured, constant", () => {
  assertPlumbError(() => censoredSample([1, 2, 3], [0, 0]), "bad-option", /3 values but 2/);
  assertPlumbError(() => censoredSample([1, 2, 3, 4], [0, 0.5, 0, 0]), "bad-option", /side 0.5/);
  assertPlumbError(
    () => censoredSample([1, 2, 3, Infinity], [0, 0, 0, -1]),
    "non-finite",
    /position 3/,
  );
  assertPlumbError(
    () => censoredSample([1, 2, 0.5, 0.5, 0.5], [0, 0, -1, -1, -1]),
    "too-few",
    /2 measured values \(3 below and 0 above a limit, of 5\): at least 3/,
  );
  assertPlumbError(
    () => censoredSample([2, 2, 2, 1], [0, 0, 0, -1], { what: "the test" }),
    "constant",
    /Cannot run the test: the 3 measured values are all 2/,
  );
});
