/**
 * Local power-series models of the Box–Cox (and one-signed Yeo–Johnson)
 * profile, so that the many evaluations of a root search near λ̂ on a large
 * sample cost one pass over the data instead of one each. Private to
 * `lib/reexpress`; the method is described at {@linkcode _localBranch}.
 *
 * @module
 */
import type { _ProfilePoint } from "./_profile.ts";
import { _expm1 } from "./_profile_terms.ts";

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
export function _localBranch(c: Float64Array, cMin: number, cMax: number, onPass: () => void) {
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
