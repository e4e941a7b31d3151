/**
 * Domain checks shared by the transformations. Private to `lib/reexpress`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/**
 * |λ| below this is treated as 0 in the power transforms: the error of doing
 * so is about |λ|·(ln x)²/2 ≤ 1e-144 for any double x, while λ·ln x for a
 * subnormal λ would lose most of its digits.
 */
export const _ZERO_LAMBDA = 1e-150;

/** How many offending positions a message lists at most. */
const _SHOWN = 5;

function _positions(x: Float64Array, bad: (v: number) => boolean): number[] {
  const out: number[] = [];
  for (let i = 0; i < x.length; i++) if (bad(x[i])) out.push(i);
  return out;
}

function _list(p: number[]): string {
  return p.slice(0, _SHOWN).join(", ") + (p.length > _SHOWN ? ", …" : "");
}

/** Throw `PlumbError("non-positive")` when any value is ≤ 0. */
export function _requirePositive(x: Float64Array, what: string): void {
  const bad = _positions(x, (v) => v <= 0);
  if (bad.length === 0) return;
  let min = Infinity;
  for (const i of bad) min = Math.min(min, x[i]);
  throw new PlumbError(
    "non-positive",
    `Cannot apply ${what} to values ≤ 0: ${bad.length} of ${x.length} (smallest ${min}, ` +
      `at position${bad.length === 1 ? "" : "s"} ${_list(bad)}); add a shift first ` +
      `(logShift states one) or use Yeo–Johnson, which accepts zeros and negatives`,
    { count: bad.length, positions: bad.slice(0, _SHOWN), smallest: min },
  );
}

/** Throw `PlumbError("non-positive")` when any value is < 0. */
export function _requireNonNegative(x: Float64Array, what: string): void {
  const bad = _positions(x, (v) => v < 0);
  if (bad.length === 0) return;
  let min = Infinity;
  for (const i of bad) min = Math.min(min, x[i]);
  throw new PlumbError(
    "non-positive",
    `Cannot apply ${what} to negative values: ${bad.length} of ${x.length} (smallest ${min}, ` +
      `at position${bad.length === 1 ? "" : "s"} ${_list(bad)}); add a shift first ` +
      `or use Yeo–Johnson, which accepts negatives`,
    { count: bad.length, positions: bad.slice(0, _SHOWN), smallest: min },
  );
}

/** Throw `PlumbError("zero")` when any value is 0. */
export function _requireNonZero(x: Float64Array, what: string): void {
  const bad = _positions(x, (v) => v === 0);
  if (bad.length === 0) return;
  throw new PlumbError(
    "zero",
    `Cannot apply ${what} to zeros: ${bad.length} of ${x.length} ` +
      `(at position${bad.length === 1 ? "" : "s"} ${_list(bad)}); add a shift first ` +
      `or use Yeo–Johnson, which accepts zeros`,
    { count: bad.length, positions: bad.slice(0, _SHOWN) },
  );
}

/** Throw `PlumbError("bad-option")` unless `lambda` is a finite number. */
export function _requireLambda(lambda: number, what: string): void {
  if (typeof lambda !== "number" || !Number.isFinite(lambda)) {
    throw new PlumbError(
      "bad-option",
      `Cannot apply ${what} with λ = ${lambda}: λ must be a finite number`,
      { lambda },
    );
  }
}

/**
 * `expm1(λ·a)/λ`, the power transform of a log-scale value `a`, with full
 * relative accuracy when λ·a underflows or is tiny: for |λa| < 1e-5 it is
 * summed as a·(1 + t/2 + t²/6), t = λa (truncation error below 1e-21 relative).
 */
export function _powerTerm(a: number, lambda: number): number {
  const t = lambda * a;
  if (Math.abs(t) < 1e-5) return a * (1 + t * (0.5 + t / 6));
  return Math.expm1(t) / lambda;
}

/**
 * `log1p(λ·y)/λ`, the inverse of {@linkcode _powerTerm}, accurate in the same
 * way: for |λy| < 1e-5 it is summed as y·(1 − s/2 + s²/3), s = λy. NaN when
 * 1 + λy < 0 (no preimage).
 */
export function _inversePowerTerm(y: number, lambda: number): number {
  const s = lambda * y;
  if (Math.abs(s) < 1e-5) return y * (1 - s * (0.5 - s / 3));
  return Math.log1p(s) / lambda;
}

/** The `shift` option of a transformation: a finite number, 0 when absent. */
export function _shiftOption(shift: unknown, what: string): number {
  const s = shift ?? 0;
  if (typeof s !== "number" || !Number.isFinite(s)) {
    throw new PlumbError(
      "bad-option",
      `Cannot apply ${what} with shift ${s}: use a finite number`,
      {
        shift: s,
      },
    );
  }
  return s;
}
