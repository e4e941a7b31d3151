/**
 * The normal model on a re-expressed scale, seen from the original units:
 * its mean and sd on that scale, and maps of limits and quantiles between
 * the two scales. Private to `lib/stakes`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import {
  applyReexpression,
  invertReexpression,
  type Reexpression,
} from "../reexpress/reexpression.ts";
import { _sampleShape } from "../stats/moments.ts";

/** A normal model fitted on a re-expressed scale. */
export interface _ScaleModel {
  /** The re-expression. */
  readonly reexpression: Reexpression;
  /** Mean of the re-expressed values. */
  readonly mean: number;
  /** Sd (divisor n − 1) of the re-expressed values. */
  readonly sd: number;
  /** Whether the re-expression keeps order (false for 1/x, which reverses it). */
  readonly increasing: boolean;
  /**
   * The values in original units the re-expression maps monotonely (open or
   * closed ends alike): (−shift, ∞) for a log, (0, ∞) for Box–Cox, the data's
   * own sign for 1/x, everything for Yeo–Johnson.
   */
  readonly domain: readonly [number, number];
}

function _domain(r: Reexpression, x: Float64Array): [number, number] {
  switch (r.kind) {
    case "log":
    case "square-root":
      return [-r.shift, Infinity];
    case "box-cox":
      return [0, Infinity];
    case "reciprocal":
      return x[0] > 0 ? [0, Infinity] : [-Infinity, 0];
    default:
      return [-Infinity, Infinity];
  }
}

/**
 * Fit the normal model on the re-expressed scale. Returns `null` (with the
 * reason) when the re-expressed values cannot carry one: non-finite values or
 * no spread.
 */
export function _scaleModel(
  x: Float64Array,
  r: Reexpression,
): { model: _ScaleModel | null; note: string | null } {
  let y: Float64Array;
  try {
    y = applyReexpression(x, r);
  } catch (e) {
    if (e instanceof PlumbError) return { model: null, note: `${r.label}: ${e.message}` };
    throw e;
  }
  if (!y.every(Number.isFinite)) {
    return { model: null, note: `${r.label} overflows on these values; no re-expressed model` };
  }
  try {
    const { mean, sd } = _sampleShape(y, `the ${r.label} scale`);
    const model = {
      reexpression: r,
      mean,
      sd,
      increasing: r.kind !== "reciprocal",
      domain: _domain(r, x),
    };
    return { model, note: null };
  } catch (e) {
    if (e instanceof PlumbError) return { model: null, note: `${r.label}: ${e.message}` };
    throw e;
  }
}

/** Map a value in original units to the re-expressed scale; `null` outside the domain. */
export function _toScale(v: number, m: _ScaleModel): number | null {
  if (!(v > m.domain[0] && v < m.domain[1])) return null;
  try {
    const y = applyReexpression([v], m.reexpression)[0];
    return Number.isFinite(y) ? y : null;
  } catch (e) {
    if (e instanceof PlumbError) return null;
    throw e;
  }
}

/** Map values on the re-expressed scale back to original units; `null` where there is no preimage. */
export function _fromScale(y: readonly number[], m: _ScaleModel): (number | null)[] {
  return Array.from(invertReexpression(y, m.reexpression), (v) => (Number.isFinite(v) ? v : null));
}
