/**
 * The Box–Cox profile likelihood from cells, without another pass over the
 * data. Private to `lib/scan`.
 *
 * The profile (see `lib/reexpress/_profile.ts`) needs, for each λ, the mean
 * and variance of z = expm1(λ·ℓ)/λ, with ℓ = ln v − ū the centred logs,
 * and its covariance with ∂z/∂λ. Within a cell of centre c, v = c·(1 + t)
 * with t = e/c, so ℓ = a + g(t) with a = ln c − ū and g(t) = ln(1 + t), and
 *
 *   z = e^{λa}·Y(t) + expm1(λa)/λ,   Y = g + λg²/2 + λ²g³/6 + λ³g⁴/24 + …,
 *   ∂z/∂λ = e^{λa}·(a·Y + ∂Y/∂λ) + a²·φ(λa),
 *
 * where Y and ∂Y/∂λ are power series in t that are the same for every cell
 * (they depend on λ only). Summed over a cell, each term tᵏ becomes
 * T_k = S_k/cᵏ from the cell's centred sums, so the sums Σz, Σz², Σz·∂z are
 * dot products of four numbers per cell (Taylor expansion to t⁴; the
 * method of moments of a transformed variable, e.g. Kendall & Stuart,
 * "The Advanced Theory of Statistics", vol. 1, §10.5–10.6). A cell is used
 * this way only when every |t| ≤ 2⁻¹⁰, so the omitted t⁵ terms are below
 * 1e-15 of the leading ones; values in other cells (near zero, where t is
 * large) are fetched and summed exactly. The mean and variance are taken
 * in two rounds (mean first, then sums about it), as the corrected
 * two-pass algorithm does, with compensated sums over the cells.
 *
 * @module
 */
import { _ZERO_LAMBDA } from "../reexpress/_checks.ts";
import type { _Profile, _ProfilePoint } from "../reexpress/_profile.ts";
import { _expm1, _phi } from "../reexpress/_profile_terms.ts";
import type { Cell } from "./cells.ts";

/** Largest |t| = |v − c|/c a cell may hold to be summed by its series. */
export const SERIES_MAX_T = 2 ** -10;

/** Whether a cell of positive values can be summed by the series. */
export function seriesHolds(cell: Cell): boolean {
  const c = cell.centre;
  return c > 0 && cell.lo > 0 && Math.max(c - cell.lo, cell.hi - c) <= SERIES_MAX_T * c;
}

/** Coefficients t⁰…t⁴ of a series; products are truncated after t⁴. */
type Series = Float64Array;

function _mul(a: Series, b: Series): Series {
  const out = new Float64Array(5);
  for (let i = 0; i < 5; i++) {
    for (let j = 0; i + j < 5; j++) out[i + j] += a[i] * b[j];
  }
  return out;
}

/** g = ln(1 + t) and its powers. */
const _G1 = Float64Array.of(0, 1, -1 / 2, 1 / 3, -1 / 4);
const _G2 = _mul(_G1, _G1);
const _G3 = _mul(_G2, _G1);
const _G4 = _mul(_G3, _G1);

/**
 * The cells, prepared once: count, a = ln c − ū, and T_k = S_k/cᵏ
 * (k = 1…4), in parallel typed arrays so that each λ is one tight loop.
 */
interface _Prepared {
  readonly n: Float64Array;
  readonly a: Float64Array;
  readonly t1: Float64Array;
  readonly t2: Float64Array;
  readonly t3: Float64Array;
  readonly t4: Float64Array;
}

/** Neumaier's compensated sum of the values of `add` calls, as [sum, compensation]. */
function _neumaier(s: Float64Array, v: number): void {
  const t = s[0] + v;
  s[1] += Math.abs(s[0]) >= Math.abs(v) ? (s[0] - t) + v : (v - t) + s[0];
  s[0] = t;
}

/**
 * The Box–Cox profile of the positive values summarised by `cells` (every
 * one with {@linkcode seriesHolds}) and `raw` (the values of the other
 * cells, exactly), as the fitting code in `lib/reexpress` expects it.
 */
export function cellBoxCoxProfile(cells: readonly Cell[], raw: Float64Array): _Profile {
  const m = cells.length;
  const p: _Prepared = {
    n: new Float64Array(m),
    a: new Float64Array(m),
    t1: new Float64Array(m),
    t2: new Float64Array(m),
    t3: new Float64Array(m),
    t4: new Float64Array(m),
  };
  // ū, with the log of each cell's values from its series ⟨g, T⟩.
  let n = raw.length;
  const acc = new Float64Array(2);
  for (let i = 0; i < m; i++) {
    const c = cells[i];
    const inv = 1 / c.centre;
    const inv2 = inv * inv;
    p.n[i] = c.n;
    p.a[i] = Math.log(c.centre);
    p.t1[i] = c.s[0] * inv;
    p.t2[i] = c.s[1] * inv2;
    p.t3[i] = c.s[2] * inv2 * inv;
    p.t4[i] = c.s[3] * inv2 * inv2;
    n += c.n;
    _neumaier(acc, c.n * p.a[i]);
    _neumaier(acc, _G1[1] * p.t1[i] + _G1[2] * p.t2[i] + _G1[3] * p.t3[i] + _G1[4] * p.t4[i]);
  }
  const logs = new Float64Array(raw.length);
  for (let i = 0; i < raw.length; i++) {
    logs[i] = Math.log(raw[i]);
    _neumaier(acc, logs[i]);
  }
  let mean = (acc[0] + acc[1]) / n;
  // One correction round for ū, as `_centre` in lib/reexpress does.
  acc.fill(0);
  for (let i = 0; i < m; i++) {
    _neumaier(acc, p.n[i] * (p.a[i] - mean));
    _neumaier(acc, _G1[1] * p.t1[i] + _G1[2] * p.t2[i] + _G1[3] * p.t3[i] + _G1[4] * p.t4[i]);
  }
  for (let i = 0; i < logs.length; i++) _neumaier(acc, logs[i] - mean);
  mean += (acc[0] + acc[1]) / n;
  let aMin = Infinity;
  let aMax = -Infinity;
  for (let i = 0; i < m; i++) {
    p.a[i] -= mean;
    if (p.a[i] < aMin) aMin = p.a[i];
    if (p.a[i] > aMax) aMax = p.a[i];
  }
  for (let i = 0; i < logs.length; i++) {
    logs[i] -= mean;
    if (logs[i] < aMin) aMin = logs[i];
    if (logs[i] > aMax) aMax = logs[i];
  }
  let count = 0;
  const at = (lambda: number, deriv: boolean): _ProfilePoint => {
    count++;
    const q = _evaluate(p, logs, n, lambda, aMin, aMax, deriv);
    return { h: q.h + 2 * mean, dh: q.dh };
  };
  return {
    family: "Box–Cox",
    n,
    h: (lambda) => at(lambda, false).h,
    hd: (lambda) => at(lambda, true),
    passes: () => count,
  };
}

/** Above this exponent the terms are scaled by e^{−K} (as in lib/reexpress). */
const _SCALE_AT = 300;

function _evaluate(
  p: _Prepared,
  logs: Float64Array,
  n: number,
  lambda: number,
  aMin: number,
  aMax: number,
  deriv: boolean,
): _ProfilePoint {
  const tiny = Math.abs(lambda) < _ZERO_LAMBDA;
  const lam = tiny ? 0 : lambda;
  // Y and ∂Y/∂λ, the same for every cell.
  const Y = new Float64Array(5);
  const dY = new Float64Array(5);
  for (let k = 1; k < 5; k++) {
    Y[k] = _G1[k] + (lam / 2) * _G2[k] + (lam * lam / 6) * _G3[k] + (lam ** 3 / 24) * _G4[k];
    dY[k] = _G2[k] / 2 + (lam / 3) * _G3[k] + (lam * lam / 8) * _G4[k];
  }
  const YY = _mul(Y, Y);
  const YdY = _mul(Y, dY);
  const top = lam * (lam > 0 ? aMax : aMin);
  const K = top > _SCALE_AT ? top : 0;
  const eK = Math.exp(-K);
  const m = p.n.length;
  const E = new Float64Array(m + logs.length);
  const Z = new Float64Array(m + logs.length);
  const D = new Float64Array(m + logs.length);
  // Per cell centre (then per raw value) a: E = e^{λa−K}, Z = expm1(λa)/λ·e^{−K},
  // D = a²φ(λa)·e^{−K}.
  for (let i = 0; i < E.length; i++) {
    const a = i < m ? p.a[i] : logs[i - m];
    if (tiny) {
      E[i] = 1;
      Z[i] = a;
      D[i] = 0.5 * a * a;
    } else if (K === 0) {
      const t = lam * a;
      const u = _expm1(t);
      E[i] = u + 1;
      Z[i] = u / lam;
      D[i] = a * a * _phi(t, u);
    } else {
      const t = lam * a;
      const e = Math.exp(t - K);
      E[i] = e;
      Z[i] = (e - eK) / lam;
      D[i] = (t * e - e + eK) / (lam * lam);
    }
  }
  const { n: cn, a: ca, t1, t2, t3, t4 } = p;
  const [y1, y2, y3, y4] = [Y[1], Y[2], Y[3], Y[4]];
  const [d1, d2, d3, d4] = [dY[1], dY[2], dY[3], dY[4]];
  // Round 1: the means of z and ∂z/∂λ.
  const sz = new Float64Array(2);
  const sd = new Float64Array(2);
  for (let i = 0; i < m; i++) {
    const y = y1 * t1[i] + y2 * t2[i] + y3 * t3[i] + y4 * t4[i];
    _neumaier(sz, cn[i] * Z[i] + E[i] * y);
    if (deriv) {
      const dy = d1 * t1[i] + d2 * t2[i] + d3 * t3[i] + d4 * t4[i];
      _neumaier(sd, cn[i] * D[i] + E[i] * (ca[i] * y + dy));
    }
  }
  for (let i = m; i < E.length; i++) {
    _neumaier(sz, Z[i]);
    if (deriv) _neumaier(sd, D[i]);
  }
  const mz = (sz[0] + sz[1]) / n;
  const md = (sd[0] + sd[1]) / n;
  // Round 2: sums about the means.
  const s1 = new Float64Array(2);
  const s2 = new Float64Array(2);
  const sc = new Float64Array(2);
  for (let i = 0; i < m; i++) {
    const e = E[i];
    const w0 = Z[i] - mz;
    const y = y1 * t1[i] + y2 * t2[i] + y3 * t3[i] + y4 * t4[i];
    const yy = YY[1] * t1[i] + YY[2] * t2[i] + YY[3] * t3[i] + YY[4] * t4[i];
    _neumaier(s1, cn[i] * w0 + e * y);
    _neumaier(s2, cn[i] * w0 * w0 + 2 * w0 * e * y + e * e * yy);
    if (deriv) {
      const d0 = D[i] - md;
      const dy = d1 * t1[i] + d2 * t2[i] + d3 * t3[i] + d4 * t4[i];
      const ydy = YdY[1] * t1[i] + YdY[2] * t2[i] + YdY[3] * t3[i] + YdY[4] * t4[i];
      _neumaier(
        sc,
        cn[i] * w0 * d0 + w0 * e * (ca[i] * y + dy) + e * d0 * y + e * e * (ca[i] * yy + ydy),
      );
    }
  }
  for (let i = m; i < E.length; i++) {
    const w0 = Z[i] - mz;
    _neumaier(s1, w0);
    _neumaier(s2, w0 * w0);
    if (deriv) _neumaier(sc, w0 * (D[i] - md));
  }
  const c1 = s1[0] + s1[1];
  const v = (s2[0] + s2[1] - (c1 * c1) / n) / n;
  const h = Math.log(v) + 2 * K;
  return { h, dh: deriv ? (2 * (sc[0] + sc[1])) / n / v : NaN };
}
