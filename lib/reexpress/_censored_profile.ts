/**
 * The censored profile log-likelihood of a power-transformation parameter λ
 * (Box–Cox or Yeo–Johnson) and the pieces the λ fit needs: precomputed
 * log-scale values, the transformed sample with its limits, an even
 * subsample, the inverse transform. Private to `lib/reexpress` (see
 * `censored_lambda_fit.ts` for the method and its sources).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { _censoredFit } from "../stats/censored_fit.ts";
import type { CensoredSample } from "../stats/censored_sample.ts";
import { _inversePowerTerm, _powerTerm } from "./_checks.ts";

/** Largest sample located on in full; bigger ones are located on an even subsample. */
const _SUBSAMPLE = 4096;
/** Newton iterations per profile point. */
export const _ITERATIONS = 100;
/** The profile's value where it cannot be evaluated. */
export const _LOW = -1e300;

export type _Family = "Box–Cox" | "Yeo–Johnson";

/** The censored sample with its log-scale values precomputed, for fast re-transformation. */
export interface _Prepared {
  readonly sample: CensoredSample;
  /** ln x (Box–Cox) or sign(x)·ln(1 + |x|) (Yeo–Johnson), per value. */
  readonly a: Float64Array;
  /** The log-Jacobian sum over measured values (the factor of λ − 1). */
  readonly jacobian: number;
}

export function _prepare(sample: CensoredSample, family: _Family): _Prepared {
  const { values, censor } = sample;
  const a = new Float64Array(values.length);
  let jacobian = 0;
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    a[i] = family === "Box–Cox" ? Math.log(x) : x >= 0 ? Math.log1p(x) : -Math.log1p(-x);
    if (censor[i] === 0) jacobian += a[i];
  }
  return { sample, a, jacobian };
}

/** The transform of one prepared value at λ (increasing in the value for every λ). */
function _transform(a: number, lambda: number, family: _Family): number {
  if (family === "Box–Cox" || a >= 0) return _powerTerm(a, lambda);
  return -_powerTerm(-a, 2 - lambda);
}

/** The sample transformed at λ, limits included; undefined when a value overflows. */
export function _transformed(
  p: _Prepared,
  lambda: number,
  family: _Family,
): CensoredSample | undefined {
  const s = p.sample;
  const y = new Float64Array(p.a.length);
  for (let i = 0; i < y.length; i++) {
    y[i] = _transform(p.a[i], lambda, family);
    if (!Number.isFinite(y[i])) return undefined;
  }
  const at = (x: number) =>
    _transform(family === "Box–Cox" ? Math.log(x) : _yjA(x), lambda, family);
  return {
    ...s,
    values: y,
    leftLimits: s.leftLimits.map(at),
    rightLimits: s.rightLimits.map(at),
  };
}

/**
 * The profile log-likelihood at λ; a very large negative number where the
 * transformed sample cannot be fitted (so that searches treat it as low
 * without meeting ±∞).
 */
export function _profile(p: _Prepared, lambda: number, family: _Family): number {
  const t = _transformed(p, lambda, family);
  if (t === undefined) return _LOW;
  try {
    const l = _censoredFit(t, _ITERATIONS, false).logLikelihood + (lambda - 1) * p.jacobian;
    return Number.isFinite(l) ? l : _LOW;
  } catch (e) {
    if (e instanceof PlumbError) return _LOW;
    throw e;
  }
}

function _yjA(x: number): number {
  return x >= 0 ? Math.log1p(x) : -Math.log1p(-x);
}

/** An even subsample (every n/m-th value, with its side) of a large censored sample. */
export function _thin(s: CensoredSample): CensoredSample {
  const n = s.n;
  if (n <= _SUBSAMPLE) return s;
  const m = Math.min(_SUBSAMPLE, Math.max(1024, Math.floor(n / 32)));
  const values = new Float64Array(m);
  const censor = new Int8Array(m);
  let left = 0;
  let right = 0;
  for (let i = 0; i < m; i++) {
    const j = Math.floor(((i + 0.5) * n) / m);
    values[i] = s.values[j];
    censor[i] = s.censor[j];
    if (censor[i] < 0) left++;
    if (censor[i] > 0) right++;
  }
  const count = (limits: readonly number[], side: number) =>
    limits.map((l) => {
      let k = 0;
      for (let i = 0; i < m; i++) if (censor[i] === side && values[i] === l) k++;
      return k;
    });
  const keep = (limits: readonly number[], side: number) => {
    const c = count(limits, side);
    return [limits.filter((_, j) => c[j] > 0), c.filter((k) => k > 0)];
  };
  const [leftLimits, leftCounts] = keep(s.leftLimits, -1);
  const [rightLimits, rightCounts] = keep(s.rightLimits, 1);
  return {
    values,
    censor,
    n: m,
    observed: m - left - right,
    left,
    right,
    leftLimits,
    leftCounts,
    rightLimits,
    rightCounts,
  };
}

/** The inverse transform of one value (NaN outside the transform's range). */
export function _invert(y: number, lambda: number, family: _Family): number {
  if (family === "Box–Cox") return Math.exp(_inversePowerTerm(y, lambda));
  return y >= 0
    ? Math.expm1(_inversePowerTerm(y, lambda))
    : -Math.expm1(_inversePowerTerm(-y, 2 - lambda));
}
