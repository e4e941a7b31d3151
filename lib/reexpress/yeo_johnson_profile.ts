/**
 * The Yeo–Johnson profile log-likelihood on a grid of λ, for charts.
 *
 * @module
 */
import { _logLik } from "./_profile.ts";
import { _yeoJohnsonProfile } from "./_profile_yeo_johnson.ts";
import { _lambdaGrid, _lambdaSample } from "./_sample.ts";

/**
 * The Yeo–Johnson profile log-likelihood ℓ(λ) at each λ given, with all constants
 * (the same quantity as `yeoJohnsonFit`'s `logLikelihood`, whose maximum it
 * traces). One pass over the data per λ: 41 points at n = 5000 take about
 * 2–3 ms (bench/reexpress_bench.ts).
 *
 * @param x finite values of any sign, at least 3, not all equal
 * @param lambdas the λ values, finite
 * @example
 * ```ts
 * import { yeoJohnsonProfile } from "./yeo_johnson_profile.ts";
 * const ll = yeoJohnsonProfile([0, 2.9, -0.8, 5.1, 1.7, 3.3], [-1, 0, 1]);
 * if (ll.length !== 3 || !ll.every(Number.isFinite)) throw new Error("unexpected");
 * ```
 */
export function yeoJohnsonProfile(x: ArrayLike<number>, lambdas: ArrayLike<number>): Float64Array {
  const what = "the Yeo–Johnson profile likelihood";
  const grid = _lambdaGrid(lambdas, what);
  const v = _lambdaSample(x, what, false);
  const p = _yeoJohnsonProfile(v);
  const out = new Float64Array(grid.length);
  for (let i = 0; i < grid.length; i++) out[i] = _logLik(v.length, p.h(grid[i]));
  return out;
}
