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

/** Above this exponent the values are rescaled: e^{2·300} is still finite. */
const _SCALE_AT = 300;
/** Taylor coefficients of φ(t) = Σ (j+1)/(j+2)! tʲ, j = 0…10 (|t| < 0.1: remainder < 3e-18). */
const _PHI: Float64Array = (() => {
  const c = new Float64Array(11);
  let fact = 2; // (j + 2)!
  for (let j = 0; j < c.length; j++) {
    c[j] = (j + 1) / fact;
    fact *= j + 3;
  }
  return c;
})();

/** 1/k! for k = 2…13, the Taylor coefficients of expm1 after the linear term. */
const _EXP: Float64Array = (() => {
  const c = new Float64Array(12);
  let f = 1;
  for (let k = 2; k <= 13; k++) {
    f *= k;
    c[k - 2] = 1 / f;
  }
  return c;
})();

/**
 * eᵗ − 1 with relative error below 1e-15: its Taylor series to t¹³ for
 * |t| < 0.25 (truncation below 1e-17 relative), and `Math.exp(t) − 1` beyond,
 * where the subtraction loses at most eᵗ/|eᵗ − 1|·ε ≤ 1e-15. Written out
 * because `Math.expm1` is several times slower than this on small arguments
 * in V8, and the profile calls it once per value per pass.
 */
function _expm1(t: number): number {
  if (t < 0.25 && t > -0.25) {
    const c = _EXP;
    return t * (1 + t * (c[0] + t * (c[1] + t * (c[2] + t * (c[3] + t * (c[4] + t * (c[5] +
                              t *
                                (c[6] +
                                  t *
                                    (c[7] +
                                      t * (c[8] + t * (c[9] + t * (c[10] + t * c[11]))))))))))));
  }
  return Math.exp(t) - 1;
}

/** φ(t) = (t·eᵗ − expm1 t)/t², with φ(0) = 1/2; `u` is expm1(t). */
function _phi(t: number, u: number): number {
  if (t < 0.1 && t > -0.1) {
    const c = _PHI;
    return c[0] + t * (c[1] + t * (c[2] + t * (c[3] + t * (c[4] + t * (c[5] + t * (c[6] +
                              t * (c[7] + t * (c[8] + t * (c[9] + t * c[10])))))))));
  }
  return (t * (u + 1) - u) / (t * t);
}

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

/** Series order of the local model: terms up to δᵏ, k = 0…_K. */
const _K = 20;
/** Trust radius of a local model, in units of |δ|·max|c|. */
const _RADIUS = 0.5;
/** Largest |p|·max|c| (and max|c|) a local model is built for. */
const _LOCAL_LIMIT = 50;

/**
 * A local model of ln var(expm1(p·c)/p) around a centre p₀, exact to
 * rounding within its trust region, so that the many evaluations of a root
 * search near λ̂ cost one pass over the data instead of one each.
 *
 * With u₀ = expm1(p₀c), u = expm1(pc) = u₀·e^{δc} + expm1(δc) for p = p₀ + δ,
 * so E[u] = A₀ + Σ_{k≥1} δᵏ(A_k + C_k)/k! and
 * E[u²] = Σ_k δᵏ(2ᵏB_k + 2(2ᵏ − 1)A_k + (2ᵏ − 2)C_k)/k!, with the moments
 * A_k = E[u₀cᵏ], B_k = E[u₀²cᵏ], C_k = E[cᵏ] from one pass. Truncation after
 * δ²⁰ with |δ|·max|c| ≤ ½ (and the e^{2δc} series at 1) leaves under 1e-19
 * relative. When the region reaches p = 0 the centre is put at 0 exactly and
 * var(z) is summed directly as E[z²] − E[z]², E[z] = Σ_{k≥1} p^{k−1}C_k/k!,
 * E[z²] = Σ_{k≥2} (2ᵏ − 2)p^{k−2}C_k/k!, so nothing cancels as p → 0;
 * otherwise the region is kept within |δ| ≤ |p₀|/2, where the subtraction
 * E[u²] − E[u]² loses at most about one digit. Outside the region a new
 * centre is taken (one more pass). Returns undefined beyond |p|·max|c| = 50
 * or max|c| = 50, where the moments could overflow; the caller then uses the
 * direct form.
 */
function _localBranch(c: Float64Array, cMin: number, cMax: number, onPass: () => void) {
  const n = c.length;
  const cAbs = Math.max(-cMin, cMax);
  let cMoments: Float64Array | undefined;
  const powerMoments = (): Float64Array => {
    if (cMoments) return cMoments;
    onPass();
    const acc = new Float64Array(_K + 2);
    for (let i = 0; i < n; i++) {
      const ci = c[i];
      let q = 1;
      for (let k = 0; k <= _K + 1; k++) {
        acc[k] += q;
        q *= ci;
      }
    }
    for (let k = 0; k <= _K + 1; k++) acc[k] /= n;
    cMoments = acc;
    return acc;
  };
  const fact = new Float64Array(_K + 3);
  fact[0] = 1;
  for (let k = 1; k < fact.length; k++) fact[k] = fact[k - 1] * k;
  // Current model: centre, radius, and Horner coefficients.
  let centre = NaN;
  let radius = -1;
  let eu = new Float64Array(0); // E[u] or, at centre 0, E[z] coefficients
  let eu2 = new Float64Array(0); // E[u²] or E[z²] coefficients
  const build = (p0: number): void => {
    const C = powerMoments();
    if (Math.abs(p0) * cAbs < _RADIUS) {
      centre = 0;
      radius = _RADIUS / cAbs;
      eu = new Float64Array(_K + 1);
      eu2 = new Float64Array(_K + 1);
      for (let j = 0; j <= _K; j++) {
        eu[j] = C[j + 1] / fact[j + 1]; // E[z] = Σ_j p^j C_{j+1}/(j+1)!
        eu2[j] = ((2 ** (j + 2) - 2) * (j + 2 <= _K + 1 ? C[j + 2] : 0)) / fact[j + 2];
      }
      return;
    }
    onPass();
    const A = new Float64Array(_K + 2);
    const B = new Float64Array(_K + 2);
    for (let i = 0; i < n; i++) {
      const ci = c[i];
      const u0 = _expm1(p0 * ci);
      let a = u0;
      let b = u0 * u0;
      for (let k = 0; k <= _K + 1; k++) {
        A[k] += a;
        B[k] += b;
        a *= ci;
        b *= ci;
      }
    }
    centre = p0;
    radius = Math.min(_RADIUS / cAbs, Math.abs(p0) / 2);
    eu = new Float64Array(_K + 2);
    eu2 = new Float64Array(_K + 2);
    for (let k = 0; k <= _K + 1; k++) {
      const a = A[k] / n;
      const b = B[k] / n;
      const t = 2 ** k;
      eu[k] = (k === 0 ? a : a + C[k]) / fact[k];
      // At k = 0 the expm1(δc)² series has no term: (2⁰ − 2)·C₀ + 1 = 0.
      eu2[k] = (t * b + 2 * (t - 1) * a + (k === 0 ? 0 : (t - 2) * C[k])) / fact[k];
    }
  };
  const horner = (coef: Float64Array, x: number, last: number): number => {
    let s = 0;
    for (let k = last; k >= 0; k--) s = s * x + coef[k];
    return s;
  };
  // Σ_k coef[k+1]·(k+1)·x^k, the derivative of Σ coef[k] x^k.
  const hornerD = (coef: Float64Array, x: number, last: number): number => {
    let s = 0;
    for (let k = last; k >= 1; k--) s = s * x + k * coef[k];
    return s;
  };
  return (p: number, deriv: boolean): _ProfilePoint | undefined => {
    // Moments of u₀²·c²¹ must stay far from overflow: |p|·max|c| ≤ 50 and max|c| ≤ 50
    // keep them below about e¹⁰⁰·50²¹ ≈ 1e79. Beyond that the direct form is used.
    if (Math.abs(p) * cAbs > _LOCAL_LIMIT || cAbs > _LOCAL_LIMIT) return undefined;
    if (!(Math.abs(p - centre) <= radius)) build(p);
    if (centre === 0) {
      const ez = horner(eu, p, _K);
      const ez2 = horner(eu2, p, _K);
      const v = ez2 - ez * ez;
      if (!deriv) return { h: Math.log(v), dh: NaN };
      const dv = hornerD(eu2, p, _K) - 2 * ez * hornerD(eu, p, _K);
      return { h: Math.log(v), dh: dv / v };
    }
    // Coefficients are Σ m_k δ^k with m_k already divided by k!.
    const d = p - centre;
    const mu = horner(eu, d, _K + 1);
    const mu2 = horner(eu2, d, _K + 1);
    const v = mu2 - mu * mu;
    const h = Math.log(v) - 2 * Math.log(Math.abs(p));
    if (!deriv) return { h, dh: NaN };
    const dv = hornerD(eu2, d, _K + 1) - 2 * mu * hornerD(eu, d, _K + 1);
    return { h, dh: dv / v - 2 / p };
  };
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
function _oneBranch(
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
function _moments(
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
function _centre(c: Float64Array, sum: number): { mean: number; cMin: number; cMax: number } {
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

/**
 * Prepare a finite, non-constant sample for the Yeo–Johnson profile.
 */
export function _yeoJohnsonProfile(x: Float64Array): _Profile {
  const n = x.length;
  let nNeg = 0;
  for (let i = 0; i < n; i++) if (x[i] < 0) nNeg++;
  const z = new Float64Array(n);
  let dz: Float64Array | undefined;
  let count = 0;
  if (nNeg === 0 || nNeg === n) {
    // One branch: u = ln(1 + |x|); J = ±Σu; values centred as for Box–Cox.
    const neg = nNeg === n;
    const c = new Float64Array(n);
    let s = 0;
    for (let i = 0; i < n; i++) {
      const u = Math.log1p(Math.abs(x[i]));
      c[i] = u;
      s += u;
    }
    const { mean, cMin, cMax } = _centre(c, s);
    // Positive branch: ln var = core(λ) + 2λū, J/n = ū.
    // Negative branch: ln var = core(μ) + 2μū with μ = 2 − λ, J/n = −ū.
    const direct = (p: number, want: boolean): _ProfilePoint => {
      count++;
      if (want) dz ??= new Float64Array(n);
      return _oneBranch(c, cMin, cMax, p, z, want ? dz : undefined);
    };
    const make = (
      core: (p: number, want: boolean) => _ProfilePoint,
    ): (lambda: number, want: boolean) => _ProfilePoint =>
    (lambda, want) => {
      const p = neg ? 2 - lambda : lambda;
      return finish(lambda, p, core(p, want));
    };
    const finish = (lambda: number, p: number, core: _ProfilePoint): _ProfilePoint => {
      const jac = neg ? -mean : mean;
      const h = core.h + 2 * p * mean - 2 * (lambda - 1) * jac;
      const dh = neg ? -(core.dh + 2 * mean) - 2 * jac : core.dh + 2 * mean - 2 * jac;
      return { h, dh };
    };
    const evalAt = make(direct);
    return {
      family: "Yeo–Johnson",
      n,
      h: (lambda) => evalAt(lambda, false).h,
      hd: (lambda) => evalAt(lambda, true),
      passes: () => count,
      local(): _Profile {
        const model = _localBranch(c, cMin, cMax, () => count++);
        const ev = make((p, want) => model(p, want) ?? direct(p, want));
        return {
          family: "Yeo–Johnson",
          n,
          h: (lambda) => ev(lambda, false).h,
          hd: (lambda) => ev(lambda, true),
          passes: () => count,
        };
      },
    };
  }
  // Both signs: a_i = ln(1 + |x_i|), branch by sign.
  const a = new Float64Array(n);
  const isNeg = new Uint8Array(n);
  let jac = 0;
  let posMax = -Infinity;
  let negMax = -Infinity;
  for (let i = 0; i < n; i++) {
    const t = x[i];
    const u = Math.log1p(Math.abs(t));
    a[i] = u;
    if (t < 0) {
      isNeg[i] = 1;
      jac -= u;
      if (u > negMax) negMax = u;
    } else {
      jac += u;
      if (u > posMax) posMax = u;
    }
  }
  const jn = jac / n;
  const evalAt = (lambda: number, want: boolean): _ProfilePoint => {
    count++;
    if (want) dz ??= new Float64Array(n);
    const d = want ? dz : undefined;
    const mu = 2 - lambda;
    const k = Math.max(lambda * posMax, mu * negMax, 0);
    const scaled = k > _SCALE_AT;
    const ek = scaled ? Math.exp(-k) : 0;
    const lamZero = Math.abs(lambda) < _ZERO_LAMBDA;
    const muZero = Math.abs(mu) < _ZERO_LAMBDA;
    let sz = 0;
    let sd = 0;
    for (let i = 0; i < n; i++) {
      const ai = a[i];
      const neg = isNeg[i] === 1;
      const p = neg ? mu : lambda;
      const sign = neg ? -1 : 1;
      let zi: number;
      let qi = 0;
      if (neg ? muZero : lamZero) {
        zi = sign * ai * (scaled ? ek : 1);
        if (d) qi = 0.5 * ai * ai * (scaled ? ek : 1);
      } else if (!scaled) {
        const t = p * ai;
        const u = _expm1(t);
        zi = (sign * u) / p;
        if (d) qi = ai * ai * _phi(t, u);
      } else {
        const t = p * ai;
        const e = Math.exp(t - k);
        zi = (sign * (e - ek)) / p;
        if (d) qi = (t * e - e + ek) / (p * p);
      }
      z[i] = zi;
      sz += zi;
      if (d) {
        d[i] = qi;
        sd += qi;
      }
    }
    const m = _moments(z, d, sz, sd, n, scaled ? 2 * k : 0);
    return { h: m.h - 2 * (lambda - 1) * jn, dh: m.dh - 2 * jn };
  };
  return {
    family: "Yeo–Johnson",
    n,
    h: (lambda) => evalAt(lambda, false).h,
    hd: (lambda) => evalAt(lambda, true),
    passes: () => count,
  };
}
