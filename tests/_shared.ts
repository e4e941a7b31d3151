/**
 * Helpers shared by the test files: the PlumbError check and the sample
 * generators of the invariance properties.
 *
 * @module
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../lib/errors.ts";

/** Assert that `f` throws a PlumbError with this code and a message matching `message`. */
export function assertPlumbError(f: () => unknown, code: string, message: RegExp): void {
  assert.throws(f, (e: unknown) => {
    assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
    assert.equal(e.code, code);
    assert.match(e.message, message);
    return true;
  });
}

/**
 * Samples of 8–40 doubles in [−100, 100] whose range is not negligible next to
 * their magnitude (so that a + b·x keeps the shape to about 1e-7 relative).
 */
export const spreadSample: fc.Arbitrary<number[]> = fc.array(
  fc.double({ min: -100, max: 100, noNaN: true }),
  { minLength: 8, maxLength: 40 },
).filter((x) => Math.max(...x) - Math.min(...x) > 1e-3 * Math.max(1, ...x.map(Math.abs)));
