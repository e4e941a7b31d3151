/**
 * The profile log-likelihood of a power-transformation parameter λ, in a form
 * that stays accurate at extreme λ. Private to `lib/reexpress`.
 *
 * Both families are scored by
 *
 *   h(λ) = ln σ̂²(λ) − (2/n)·(λ − 1)·J,    ℓ(λ) = −(n/2)·(ln 2π + 1 + h(λ)),
 *
 * where σ̂² is the maximum-likelihood variance (divisor n) of the transformed
 * values and J the log-Jacobian sum (Σ ln x for Box–Cox, Box & Cox 1964 §3;
 * Σ sign(x)·ln(1 + |x|) for Yeo–Johnson, Yeo & Johnson 2000 §3). ℓ is the
 * normal log-likelihood maximised over the mean and variance for fixed λ.
 *
 * Accuracy. The variance is shift-invariant, so for a sample on one branch the
 * "−1" of the power transform cancels: with u = ln x (or ln(1 + |x|)), ū its
 * mean and c = u − ū,
 *
 *   var((e^{λu} − 1)/λ) = e^{2λū}·var(expm1(λc)/λ),
 *
 * which is how the scaled geometric mean enters: for Box–Cox the e^{2λū}
 * factor cancels the Jacobian exactly and h(λ) = ln var(expm1(λc)/λ) + 2ū.
 * `expm1(λc)/λ` has full relative accuracy (to 1e-15) at every λ (no cancellation as
 * λ → 0, and no loss when e^{λu} is far below 1, the failure of the direct
 * form at λ ≈ −130). When max λc exceeds 300 the squares would overflow, so
 * the values are scaled by e^{−K}, K = max λc, and 2K is added back to the
 * log. The variance is taken by the corrected two-pass formula (Björck 1996,
 * *Numerical Methods for Least Squares Problems*, §2.2; Chan, Golub & LeVeque
 * 1983, Am. Stat. 37:242–247). Samples with values on both sides of 0 under
 * Yeo–Johnson use the two branches directly, with the same overflow scaling.
 *
 * The derivative h′(λ) = 2·cov(z, ∂z/∂λ)/var(z) − (2/n)·J′ comes from the same
 * pass: ∂/∂λ [expm1(λc)/λ] = c²·φ(λc), φ(t) = (t·eᵗ − expm1 t)/t², with φ
 * summed as its Taylor series Σ (j+1)tʲ/(j+2)! for |t| < 0.1, where the closed
 * form cancels (beyond it the closed form loses at most 2ε/|t| ≤ 2e-15 relative).
 *
 * @module
 */
import { _ZERO_LAMBDA } from "./_checks.ts";
import { _localBranch } from "./_profile_local.ts";
import { _expm1, _phi } from "./_profile_terms.ts";

/** Above this exponent the values are rescaled: e^{2·300} is still finite. */
export const _SCALE_AT = 300;

/** One evaluation: h and, when asked for, h′. */
export interface _ProfilePoint {
  readonly h: number;
  readonly dh: number;
}

/** A prepared sample: evaluates h(λ) (and h′) with scratch space reused. */
export interface _Profile {
  readonly family: "Box–Cox" | "Yeo–Johnson";
  readonly n: number;
  /** h(λ) only (cheaper). */
  h(lambda: number): number;
  /** h(λ) and h′(λ). */
  hd(lambda: number): _ProfilePoint;
  /** Passes over the data so far (for reports and benchmarks). */
  passes(): number;
  /**
   * The same profile evaluated through local power-series models (see
   * {@linkcode _localBranch}), for many evaluations close together on a
   * large sample; absent where no such model exists (samples of both signs).
   */
  local?: () => _Profile;
}

/** ℓ from h. */
export function _logLik(n: number, h: number): number {
  return -0.5 * n * (Math.log(2 * Math.PI) + 1 + h);
}

/**
 * ln var(z) and d/dλ ln var(z) for values z_i = s·(e^{λ·c_i} − 1)/λ on one
 * branch; `c` need not be centred, but centring it keeps the mean of z small.
 * Returns the derivative only when `dz` scratch is given.
 */
export function _oneBranch(
  c: Float64Array,
  cMin: number,
  cMax: number,
  lambda: number,
  z: Float64Array,
  dz: Float64Array | undefined,
): _ProfilePoint {
  const n = c.length;
  const tiny = Math.abs(lambda) < _ZERO_LAMBDA;
  if (!tiny && lambda * (lambda > 0 ? cMax : cMin) <= _SCALE_AT) {
    const fast = _oneBranchOnePass(c, lambda, dz !== undefined);
    if (fast !== undefined) return fast;
  }
  let sz = 0;
  let sd = 0;
  let logScale = 0;
  if (tiny) {
    for (let i = 0; i < n; i++) {
      const t = c[i];
      z[i] = t;
      sz += t;
      if (dz) {
        const q = 0.5 * t * t;
        dz[i] = q;
        sd += q;
      }
    }
  } else {
    const k = lambda * (lambda > 0 ? cMax : cMin);
    if (k <= _SCALE_AT) {
      const inv = 1 / lambda;
      for (let i = 0; i < n; i++) {
        const ci = c[i];
        const t = lambda * ci;
        const u = _expm1(t);
        const zi = u * inv;
        z[i] = zi;
        sz += zi;
        if (dz) {
          const q = ci * ci * _phi(t, u);
          dz[i] = q;
          sd += q;
        }
      }
    } else {
      // Scaled by e^{-k}: z·e^{-k} = (e^{t−k} − e^{−k})/λ, and likewise ∂z/∂λ.
      logScale = 2 * k;
      const ek = Math.exp(-k);
      const inv = 1 / lambda;
      const inv2 = inv * inv;
      for (let i = 0; i < n; i++) {
        const t = lambda * c[i];
        const e = Math.exp(t - k);
        const zi = (e - ek) * inv;
        z[i] = zi;
        sz += zi;
        if (dz) {
          const q = (t * e - e + ek) * inv2;
          dz[i] = q;
          sd += q;
        }
      }
    }
  }
  return _moments(z, dz, sz, sd, n, logScale);
}

/**
 * The common case in one pass without storing z: sums of z, z², ∂z and z·∂z.
 * With c centred, the mean of z is small beside its spread, so the
 * one-pass variance E[z²] − (E z)² loses almost nothing; when the mean is
 * not small (mean² > E[z²]/2, which costs more than one bit) this returns
 * undefined and the caller uses the corrected two-pass formula instead.
 */
function _oneBranchOnePass(
  c: Float64Array,
  lambda: number,
  deriv: boolean,
): _ProfilePoint | undefined {
  const n = c.length;
  const inv = 1 / lambda;
  let s1 = 0;
  let s2 = 0;
  let sd = 0;
  let sc = 0;
  if (deriv) {
    for (let i = 0; i < n; i++) {
      const ci = c[i];
      const t = lambda * ci;
      const u = _expm1(t);
      const zi = u * inv;
      const q = ci * ci * _phi(t, u);
      s1 += zi;
      s2 += zi * zi;
      sd += q;
      sc += zi * q;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const zi = _expm1(lambda * c[i]) * inv;
      s1 += zi;
      s2 += zi * zi;
    }
  }
  const m = s1 / n;
  const e2 = s2 / n;
  if (!(m * m <= 0.5 * e2)) return undefined;
  const v = e2 - m * m;
  return { h: Math.log(v), dh: deriv ? (2 * (sc / n - (m * sd) / n)) / v : NaN };
}

/** Corrected two-pass variance and covariance; returns ln var + logScale and 2·cov/var. */
export function _moments(
  z: Float64Array,
  dz: Float64Array | undefined,
  sz: number,
  sd: number,
  n: number,
  logScale: number,
): _ProfilePoint {
  const mz = sz / n;
  let ss = 0;
  let corr = 0;
  if (dz) {
    const md = sd / n;
    let sc = 0;
    for (let i = 0; i < n; i++) {
      const a = z[i] - mz;
      ss += a * a;
      corr += a;
      sc += a * (dz[i] - md);
    }
    const v = (ss - (corr * corr) / n) / n;
    return { h: Math.log(v) + logScale, dh: (2 * sc) / n / v };
  }
  for (let i = 0; i < n; i++) {
    const a = z[i] - mz;
    ss += a * a;
    corr += a;
  }
  const v = (ss - (corr * corr) / n) / n;
  return { h: Math.log(v) + logScale, dh: NaN };
}

/**
 * Centre `c` in place at its mean (`sum` is Σc; the mean gets one corrected
 * pass, as in the corrected two-pass algorithm) and return the mean and the
 * centred range.
 */
export function _centre(
  c: Float64Array,
  sum: number,
): { mean: number; cMin: number; cMax: number } {
  const n = c.length;
  let mean = sum / n;
  let r = 0;
  for (let i = 0; i < n; i++) r += c[i] - mean;
  mean += r / n;
  let cMin = Infinity;
  let cMax = -Infinity;
  for (let i = 0; i < n; i++) {
    const t = c[i] - mean;
    c[i] = t;
    if (t < cMin) cMin = t;
    if (t > cMax) cMax = t;
  }
  return { mean, cMin, cMax };
}

/**
 * Prepare a positive sample for the Box–Cox profile. The caller has checked
 * that every value is finite and positive and that they are not all equal.
 */
export function _boxCoxProfile(x: Float64Array): _Profile {
  const n = x.length;
  const c = new Float64Array(n);
  let s = 0;
  for (let i = 0; i < n; i++) {
    const l = Math.log(x[i]);
    c[i] = l;
    s += l;
  }
  const { mean, cMin, cMax } = _centre(c, s);
  const z = new Float64Array(n);
  let dz: Float64Array | undefined;
  let count = 0;
  return {
    family: "Box–Cox",
    n,
    h(lambda: number): number {
      count++;
      return _oneBranch(c, cMin, cMax, lambda, z, undefined).h + 2 * mean;
    },
    hd(lambda: number): _ProfilePoint {
      count++;
      dz ??= new Float64Array(n);
      const p = _oneBranch(c, cMin, cMax, lambda, z, dz);
      return { h: p.h + 2 * mean, dh: p.dh };
    },
    passes: () => count,
    local(): _Profile {
      const model = _localBranch(c, cMin, cMax, () => count++);
      const at = (lambda: number, want: boolean): _ProfilePoint => {
        const q = model(lambda, want);
        if (q !== undefined) return { h: q.h + 2 * mean, dh: q.dh };
        count++;
        if (want) dz ??= new Float64Array(n);
        const r = _oneBranch(c, cMin, cMax, lambda, z, want ? dz : undefined);
        return { h: r.h + 2 * mean, dh: r.dh };
      };
      return {
        family: "Box–Cox",
        n,
        h: (lambda) => at(lambda, false).h,
        hd: (lambda) => at(lambda, true),
        passes: () => count,
      };
    },
  };
}
