/**
 * Bracketed one-dimensional minimisation.
 *
 * @module
 */

/** Options for {@linkcode minimizeInInterval}. */
export interface ExtremumOptions {
  /**
   * Relative tolerance on the location. Brent advises no less than the square
   * root of the machine epsilon: below it the function values near a smooth
   * extremum no longer differ in floating point.
   * @default 1.4901161193847656e-8
   */
  readonly relativeTolerance?: number;
  /**
   * Absolute tolerance on the location, used where the location is near 0.
   * @default 1e-12
   */
  readonly absoluteTolerance?: number;
  /**
   * Evaluation budget; the search reports `converged: false` when it runs out.
   * @default 200
   */
  readonly maxEvaluations?: number;
}

/** The outcome of a bracketed search: plain, frozen data. */
export interface Extremum {
  /** Where the extremum was found, inside the interval. */
  readonly x: number;
  /** The function value there. */
  readonly value: number;
  /** How many times the function was evaluated. */
  readonly evaluations: number;
  /** Whether the tolerance was met within the budget. */
  readonly converged: boolean;
}

/** (3 − √5)/2, the golden-section fraction. */
const _GOLDEN = (3 - Math.sqrt(5)) / 2;

/**
 * Find a local minimum of `f` inside `[lo, hi]` without derivatives.
 *
 * Method: Brent, R. P. (1973), *Algorithms for Minimization without
 * Derivatives*, Prentice-Hall, chapter 5 (procedure "localmin"): golden-section
 * steps that always shrink the bracket, replaced by parabolic interpolation
 * through the three best points whenever the parabola's vertex falls inside the
 * bracket and the step is shrinking. Every evaluation is strictly inside the
 * interval, so the search cannot leave it. Convergence is superlinear for a
 * smooth function and never slower than golden section (about 1.44× bisection).
 *
 * Accuracy: the returned `x` is within `2·(relativeTolerance·|x| +
 * absoluteTolerance)` of a local minimum (or of an end of the interval when
 * the function decreases towards it). Only a local minimum is found: for a
 * function with several, bracket the one wanted first (for example with a grid).
 *
 * @param f the function; NaN values are treated as +∞ (never chosen)
 * @param bounds the interval `[lo, hi]`, lo < hi, both finite
 * @param options tolerances and budget
 * @example
 * ```ts
 * import { minimizeInInterval } from "./optimize.ts";
 * const r = minimizeInInterval((x) => (x - 2) ** 2 + 1, [0, 5]);
 * if (Math.abs(r.x - 2) > 1e-7 || !r.converged) throw new Error("unexpected");
 * ```
 */
export function minimizeInInterval(
  f: (x: number) => number,
  bounds: readonly [number, number],
  options: ExtremumOptions = {},
): Extremum {
  const rel = options.relativeTolerance ?? 1.4901161193847656e-8;
  const absTol = options.absoluteTolerance ?? 1e-12;
  const budget = options.maxEvaluations ?? 200;
  let [a, b] = bounds;
  if (!(Number.isFinite(a) && Number.isFinite(b) && a < b)) {
    throw new RangeError(
      `minimizeInInterval: bounds must be finite with lo < hi, got [${a}, ${b}]`,
    );
  }
  const g = (t: number): number => {
    const y = f(t);
    return Number.isNaN(y) ? Number.POSITIVE_INFINITY : y;
  };
  let x = a + _GOLDEN * (b - a);
  let w = x;
  let v = x;
  let fx = g(x);
  let fw = fx;
  let fv = fx;
  let evaluations = 1;
  let d = 0; // the step taken last
  let e = 0; // the step taken the time before
  let converged = false;
  while (evaluations <= budget) {
    const mid = 0.5 * (a + b);
    const tol = rel * Math.abs(x) + absTol;
    const tol2 = 2 * tol;
    if (Math.abs(x - mid) <= tol2 - 0.5 * (b - a)) {
      converged = true;
      break;
    }
    if (evaluations === budget) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      // Parabola through (v, fv), (w, fw), (x, fx); step p/q from x.
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < mid ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < mid ? b : a) - x;
      d = _GOLDEN * e;
    }
    const u = x + (Math.abs(d) >= tol ? d : (d > 0 ? tol : -tol));
    const fu = g(u);
    evaluations++;
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return Object.freeze({ x, value: fx, evaluations, converged });
}
