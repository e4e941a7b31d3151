/**
 * Tolerance checks that explain themselves: a failure prints the case, the
 * expected and actual values, their difference and the tolerance.
 *
 * @module
 */
import { AssertionError } from "node:assert/strict";

/** How close two numbers must be: relative, absolute, or either. */
export interface Tolerance {
  /** Pass when |a − e| ≤ rel·|e|. */
  readonly rel?: number;
  /** Pass when |a − e| ≤ abs. */
  readonly abs?: number;
}

/**
 * Assert that `actual` is within tolerance of `expected` (passes when either
 * the relative or the absolute bound holds).
 *
 * @param actual the value computed by plumbline
 * @param expected the reference value
 * @param tol the tolerance
 * @param context a description of the case (input, source), printed on failure
 */
export function assertClose(
  actual: number,
  expected: number,
  tol: Tolerance,
  context: string,
): void {
  if (Object.is(actual, expected)) return;
  const diff = Math.abs(actual - expected);
  const relOk = tol.rel !== undefined && diff <= tol.rel * Math.abs(expected);
  const absOk = tol.abs !== undefined && diff <= tol.abs;
  if (relOk || absOk) return;
  const rel = expected === 0 ? Infinity : diff / Math.abs(expected);
  throw new AssertionError({
    message: `${context}\n  expected ${expected}\n  actual   ${actual}\n` +
      `  |diff|   ${diff} (relative ${rel})\n  tolerance ${JSON.stringify(tol)}`,
    actual,
    expected,
    operator: "assertClose",
  });
}
