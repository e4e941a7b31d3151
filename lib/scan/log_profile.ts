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
import { _expm1, _phi, type _Profile, type _ProfilePoint } from "../reexpress/_profile.ts";
import { _Sum, type Cell } from "./cells.ts";

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

/** One cell, prepared: n, a = ln c − ū, and T_k = S_k/cᵏ (k = 1…4). */
interface _Prepared {
  readonly n: number;
  readonly a: number;
  readonly t1: number;
  readonly t2: number;
  readonly t3: number;
  readonly t4: number;
}

const _dot = (s: Series, p: _Prepared) => s[1] * p.t1 + s[2] * p.t2 + s[3] * p.t3 + s[4] * p.t4;

/**
 * The Box–Cox profile of the positive values summarised by `cells` (every
 * one with {@linkcode seriesHolds}) and `raw` (the values of the other
 * cells, exactly), as the fitting code in `lib/reexpress` expects it.
 */
export function cellBoxCoxProfile(cells: readonly Cell[], raw: Float64Array): _Profile {
  // ū, with the log of each cell from its series ⟨g, T⟩.
  const prep: _Prepared[] = [];
  let n = raw.length;
  const sumLog = new _Sum();
  for (const c of cells) {
    const inv = 1 / c.centre;
    const [s1, s2, s3, s4] = c.s;
    const p = {
      n: c.n,
      a: Math.log(c.centre),
      t1: s1 * inv,
      t2: s2 * inv * inv,
      t3: s3 * inv * inv * inv,
      t4: s4 * (inv * inv) * (inv * inv),
    };
    prep.push(p);
    n += c.n;
    sumLog.add(c.n * p.a);
    sumLog.add(_dot(_G1, p));
  }
  const logs = new Float64Array(raw.length);
  for (let i = 0; i < raw.length; i++) {
    logs[i] = Math.log(raw[i]);
    sumLog.add(logs[i]);
  }
  let mean = sumLog.value() / n;
  // One correction round for ū, as `_centre` in lib/reexpress does.
  const r = new _Sum();
  for (const p of prep) r.add(p.n * (p.a - mean) + _dot(_G1, p));
  for (let i = 0; i < logs.length; i++) r.add(logs[i] - mean);
  mean += r.value() / n;
  let aMin = Infinity;
  let aMax = -Infinity;
  const cellA = prep.map((p) => {
    const a = p.a - mean;
    if (a < aMin) aMin = a;
    if (a > aMax) aMax = a;
    return { ...p, a };
  });
  for (let i = 0; i < logs.length; i++) {
    logs[i] -= mean;
    if (logs[i] < aMin) aMin = logs[i];
    if (logs[i] > aMax) aMax = logs[i];
  }
  let count = 0;
  const at = (lambda: number, deriv: boolean): _ProfilePoint => {
    count++;
    const p = _evaluate(cellA, logs, n, lambda, aMin, aMax, deriv);
    return { h: p.h + 2 * mean, dh: p.dh };
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
  cells: readonly _Prepared[],
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
  // Per value (or cell centre) a: E = e^{λa−K}, Z = (e^{λa} − 1)/λ·e^{−K}, D = a²φ(λa)·e^{−K}.
  const parts = (a: number): [number, number, number] => {
    if (tiny) return [1, a, 0.5 * a * a];
    const t = lam * a;
    if (K === 0) {
      const u = _expm1(t);
      return [u + 1, u / lam, a * a * _phi(t, u)];
    }
    const E = Math.exp(t - K);
    return [E, (E - eK) / lam, (t * E - E + eK) / (lam * lam)];
  };
  // Round 1: the means of z and ∂z/∂λ.
  const sz = new _Sum();
  const sd = new _Sum();
  for (const p of cells) {
    const [E, Z, D] = parts(p.a);
    sz.add(p.n * Z + E * _dot(Y, p));
    if (deriv) sd.add(p.n * D + E * (p.a * _dot(Y, p) + _dot(dY, p)));
  }
  for (let i = 0; i < logs.length; i++) {
    const [, Z, D] = parts(logs[i]);
    sz.add(Z);
    if (deriv) sd.add(D);
  }
  const mz = sz.value() / n;
  const md = sd.value() / n;
  // Round 2: sums about the means.
  const s1 = new _Sum();
  const s2 = new _Sum();
  const sc = new _Sum();
  for (const p of cells) {
    const [E, Z, D] = parts(p.a);
    const W0 = Z - mz;
    const y = _dot(Y, p);
    const yy = _dot(YY, p);
    s1.add(p.n * W0 + E * y);
    s2.add(p.n * W0 * W0 + 2 * W0 * E * y + E * E * yy);
    if (deriv) {
      const D0 = D - md;
      const dy = _dot(dY, p);
      sc.add(
        p.n * W0 * D0 + W0 * E * (p.a * y + dy) + E * D0 * y + E * E * (p.a * yy + _dot(YdY, p)),
      );
    }
  }
  for (let i = 0; i < logs.length; i++) {
    const [, Z, D] = parts(logs[i]);
    const W0 = Z - mz;
    s1.add(W0);
    s2.add(W0 * W0);
    if (deriv) sc.add(W0 * (D - md));
  }
  const c1 = s1.value();
  const v = (s2.value() - (c1 * c1) / n) / n;
  const h = Math.log(v) + 2 * K;
  return { h, dh: deriv ? (2 * sc.value()) / n / v : NaN };
}
