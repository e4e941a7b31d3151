/**
 * Helpers shared by the test files: the PlumbError check and the sample
 * generators of the invariance properties.
 *
 * @module
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../lib/errors.ts";
import { seededRandom } from "../lib/numeric/random.ts";

/** Assert that `f` throws a PlumbError with this code and a message matching `message`. */
export function assertPlumbError(f: () => unknown, code: string, message: RegExp): void {
  assert.throws(f, (e: unknown) => {
    assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
    assert.equal(e.code, code);
    assert.match(e.message, message);
    return true;
  });
}

/** The PlumbError `f` throws (failing when it throws nothing or something else), to inspect. */
export function caughtPlumbError(f: () => unknown): PlumbError {
  try {
    f();
  } catch (e) {
    assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
    return e;
  }
  throw new assert.AssertionError({ message: "expected a PlumbError, nothing was thrown" });
}

/**
 * Samples of 8–40 doubles in [−100, 100] whose range is not negligible next to
 * their magnitude (so that a + b·x keeps the shape to about 1e-7 relative).
 */
export const spreadSample: fc.Arbitrary<number[]> = fc.array(
  fc.double({ min: -100, max: 100, noNaN: true }),
  { minLength: 8, maxLength: 40 },
).filter((x) => Math.max(...x) - Math.min(...x) > 1e-3 * Math.max(1, ...x.map(Math.abs)));

/** Location shifts a of the affine map x → a + b·x. */
export const shiftArb: fc.Arbitrary<number> = fc.double({ min: -100, max: 100, noNaN: true });

/** Scales b (either sign, |b| ≥ 0.01) of the affine map x → a + b·x. */
export const scaleArb: fc.Arbitrary<number> = fc.double({ min: -100, max: 100, noNaN: true })
  .filter((b) => Math.abs(b) >= 0.01);

/** Every numeric field of a result is finite, and the result and its warnings are frozen. */
export function assertFiniteFrozen(r: object & { readonly warnings?: readonly string[] }): void {
  for (const [k, v] of Object.entries(r)) {
    if (typeof v === "number") assert.ok(Number.isFinite(v), `${k} finite`);
  }
  assert.ok(Object.isFrozen(r) && (r.warnings === undefined || Object.isFrozen(r.warnings)));
}

/** Seeded standard normals, from plumbline's one generator. */
export function normalSample(n: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  return Float64Array.from({ length: n }, () => rng.normal());
}
