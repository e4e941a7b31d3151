/**
 * Bracketed root finding.
 *
 * @module
 */

/** Options for {@linkcode findRoot}. */
export interface RootOptions {
  /**
   * Absolute tolerance on the root's location.
   * @default 1e-14
   */
  readonly absoluteTolerance?: number;
  /**
   * Relative tolerance on the root's location (never below 2·machine epsilon).
   * @default 4.440892098500626e-16
   */
  readonly relativeTolerance?: number;
  /**
   * Evaluation budget; the search reports `converged: false` when it runs out.
   * @default 200
   */
  readonly maxEvaluations?: number;
  /**
   * `f(lo)` and `f(hi)` when the caller already has them, to save two
   * evaluations of an expensive function.
   * @default undefined (evaluated here)
   */
  readonly endValues?: readonly [number, number];
}

/** The outcome of {@linkcode findRoot}: plain, frozen data. */
export interface Root {
  /** The root's location, inside the bracket. */
  readonly x: number;
  /** `f(x)`. */
  readonly value: number;
  /** How many times `f` was evaluated here (not counting `endValues`). */
  readonly evaluations: number;
  /** Whether the tolerance was met within the budget. */
  readonly converged: boolean;
}

/**
 * Find a root of `f` in `[lo, hi]`, where `f(lo)` and `f(hi)` differ in sign.
 *
 * Method: Brent, R. P. (1973), *Algorithms for Minimization without
 * Derivatives*, Prentice-Hall, chapter 4 (procedure "zero"), which refines
 * Dekker (1969): inverse quadratic interpolation or secant steps while they
 * stay inside the current sign-change bracket and shrink it fast enough,
 * bisection otherwise. The bracket always contains a sign change, so the
 * search cannot leave it; it needs at most about the square of the bisection
 * count and converges superlinearly for a smooth simple root.
 *
 * Accuracy: the returned `x` lies within `2·relativeTolerance·|x| +
 * absoluteTolerance` of a point where `f` changes sign (a root of a continuous
 * `f`).
 *
 * Special cases: an end where `f` is exactly 0 is returned at once. Throws a
 * `RangeError` when the ends do not bracket a sign change or `f` is NaN there;
 * callers that search on user data check the bracket first.
 *
 * @param f the function
 * @param bracket `[lo, hi]` with `f(lo)·f(hi) ≤ 0`
 * @param options tolerances, budget and known end values
 * @example
 * ```ts
 * import { findRoot } from "./roots.ts";
 * const r = findRoot((x) => x * x - 2, [0, 2]);
 * if (Math.abs(r.x - Math.SQRT2) > 1e-14) throw new Error("unexpected");
 * ```
 */
export function findRoot(
  f: (x: number) => number,
  bracket: readonly [number, number],
  options: RootOptions = {},
): Root {
  const absTol = options.absoluteTolerance ?? 1e-14;
  const rel = Math.max(options.relativeTolerance ?? 2 * Number.EPSILON, 2 * Number.EPSILON);
  const budget = options.maxEvaluations ?? 200;
  let evaluations = 0;
  let a = bracket[0];
  let b = bracket[1];
  let fa: number;
  let fb: number;
  if (options.endValues !== undefined) {
    [fa, fb] = options.endValues;
  } else {
    fa = f(a);
    fb = f(b);
    evaluations = 2;
  }
  if (Number.isNaN(fa) || Number.isNaN(fb) || (fa > 0 && fb > 0) || (fa < 0 && fb < 0)) {
    throw new RangeError(
      `findRoot: f(${a}) = ${fa} and f(${b}) = ${fb} do not bracket a sign change`,
    );
  }
  if (fa === 0) return Object.freeze({ x: a, value: fa, evaluations, converged: true });
  if (fb === 0) return Object.freeze({ x: b, value: fb, evaluations, converged: true });
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  while (true) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * rel * Math.abs(b) + 0.5 * absTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) {
      return Object.freeze({ x: b, value: fb, evaluations, converged: true });
    }
    if (evaluations >= budget) {
      return Object.freeze({ x: b, value: fb, evaluations, converged: false });
    }
    if (Math.abs(e) < tol || Math.abs(fa) <= Math.abs(fb)) {
      d = m;
      e = m;
    } else {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s; // secant
        q = 1 - s;
      } else {
        const qq = fa / fc; // inverse quadratic interpolation
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < 3 * m * q - Math.abs(tol * q) && p < Math.abs(0.5 * e * q)) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : (m > 0 ? tol : -tol);
    fb = f(b);
    evaluations++;
    if (Number.isNaN(fb)) {
      throw new RangeError(`findRoot: f(${b}) is NaN inside the bracket`);
    }
  }
}
