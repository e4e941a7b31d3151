/**
 * The Yeo–Johnson profile log-likelihood, prepared for λ fitting: one-signed
 * samples through the accurate centred form of `_profile.ts` (with local
 * series models for large samples), samples of both signs through the two
 * branches directly. Private to `lib/reexpress`.
 *
 * @module
 */
import { _ZERO_LAMBDA } from "./_checks.ts";
import {
  _centre,
  _moments,
  _oneBranch,
  type _Profile,
  type _ProfilePoint,
  _SCALE_AT,
} from "./_profile.ts";
import { _localBranch } from "./_profile_local.ts";
import { _expm1, _phi } from "./_profile_terms.ts";

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
