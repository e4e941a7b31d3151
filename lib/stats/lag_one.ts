/**
 * The lag-1 autocorrelation of values (or model residuals) taken in a stated
 * order, with a test of independence.
 *
 * r₁ = Σₜ dₜdₜ₊₁ / Σₜ dₜ², with d the values minus their mean (the
 * definition of R's `acf`), or the residuals of a least-squares fit, which
 * are already centred.
 *
 * Test: under independent normal errors, r₁ = e′Ae / e′e with e = My, M the
 * projection off the fitted columns (the constant alone for plain values)
 * and A the matrix with ½ beside its diagonal; the ratio is independent of
 * its denominator, so its exact mean and variance follow from the traces
 * of AM and (AM)² (Durbin & Watson 1950, Biometrika 37:409–428, §3, for
 * their d = 2(1 − r₁) approximately):
 *   E r₁ = tr(AM)/ν,  E r₁² = [tr(AM)² + 2·tr((AM)²)] / [ν(ν + 2)],  ν = n − rank.
 * For plain values E r₁ = −1/n exactly. z = (r₁ − E r₁)/sd, and p = 2Q(|z|)
 * (normal approximation with exact moments). Using the fit's own basis
 * takes account of the negative autocorrelation that fitting induces in
 * residuals (noticeable when rank/n is not small).
 *
 * Also reported, for plain values only, the Ljung–Box statistic at lag 1,
 * Q = n(n + 2)·r₁²/(n − 1) with p from χ²₁ (Ljung & Box 1978, Biometrika
 * 65:297–303), as R's `Box.test(x, 1, "Ljung-Box")` computes it.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalSf } from "../numeric/normal.ts";
import { checkSize, finiteCopy } from "./_input.ts";

/** Options for {@linkcode lagOneTest}. */
export interface LagOneOptions {
  /**
   * The orthonormal basis (n × rank, column-major) of a least-squares fit's
   * columns, rows in the same order as the values, when the values are that
   * fit's residuals (see `residualBasis` in `linear_model.ts`).
   * @default the constant column (plain values, centred at their mean)
   */
  readonly basis?: { readonly values: Float64Array; readonly rank: number };
}

/** The lag-1 autocorrelation and its test. Frozen plain data. */
export interface LagOneResult {
  /** Values used. */
  readonly n: number;
  /** The lag-1 autocorrelation r₁. */
  readonly r1: number;
  /** E r₁ under independence. */
  readonly expected: number;
  /** The standard deviation of r₁ under independence. */
  readonly sd: number;
  /** z = (r₁ − E r₁)/sd. */
  readonly z: number;
  /** Two-sided p-value. */
  readonly pValue: number;
  /** Ljung–Box at lag 1 (plain values only; `null` for residuals). */
  readonly ljungBox: { readonly statistic: number; readonly pValue: number } | null;
  /** The method and its sources. */
  readonly method: string;
}

/**
 * The lag-1 autocorrelation of `x` (in the order given) and its two-sided
 * test of independence.
 *
 * @param x the values, or a fit's residuals, in sequence order
 * @param options the fit's basis, for residuals
 * @throws {PlumbError} `"too-few"` below 4 values (or 3 residual degrees of
 *   freedom), `"constant"` when every value is the same, `"non-finite"`
 * @example
 * ```ts
 * import { lagOneTest } from "./lag_one.ts";
 * const drift = Array.from({ length: 40 }, (_, t) => t / 10 + Math.sin(7 * t));
 * const r = lagOneTest(drift);
 * if (!(r.r1 > 0.3 && r.pValue < 0.05 && Math.abs(r.expected + 1 / 40) < 1e-15)) throw new Error("lag 1");
 * ```
 */
export function lagOneTest(x: ArrayLike<number>, options: LagOneOptions = {}): LagOneResult {
  const what = "the lag-1 autocorrelation test";
  checkSize(x.length, 4, Infinity, what);
  const d = finiteCopy(x, what);
  const n = d.length;
  const basis = options.basis;
  if (basis === undefined) {
    let m = 0;
    for (let t = 0; t < n; t++) m += d[t];
    m /= n;
    let c = 0;
    for (let t = 0; t < n; t++) c += d[t] - m;
    m += c / n;
    for (let t = 0; t < n; t++) d[t] -= m;
  } else if (basis.values.length !== n * basis.rank || n - basis.rank < 3) {
    throw new PlumbError(
      basis.values.length !== n * basis.rank ? "bad-option" : "too-few",
      basis.values.length !== n * basis.rank
        ? `Cannot use a basis of ${basis.values.length} values for ${n} residuals and rank ${basis.rank}`
        : `Cannot run ${what} on residuals with ${
          n - basis.rank
        } degrees of freedom: at least 3 are needed`,
    );
  }
  let ss = 0, lag = 0, big = 0;
  for (let t = 0; t < n; t++) big = Math.max(big, Math.abs(d[t]));
  if (big === 0) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what} on ${n} identical values: there is no variation to correlate`,
    );
  }
  for (let t = 0; t < n; t++) {
    const u = d[t] / big;
    ss += u * u;
    if (t + 1 < n) lag += u * (d[t + 1] / big);
  }
  const r1 = lag / ss;
  const { mean, variance } = basis === undefined
    ? _valueMoments(n)
    : _residualMoments(basis.values, n, basis.rank);
  const sd = Math.sqrt(variance);
  const z = (r1 - mean) / sd;
  let ljungBox: LagOneResult["ljungBox"] = null;
  if (basis === undefined) {
    const q = (n * (n + 2) * r1 * r1) / (n - 1);
    ljungBox = Object.freeze({ statistic: q, pValue: Math.min(1, 2 * normalSf(Math.sqrt(q))) });
  }
  return Object.freeze({
    n,
    r1,
    expected: mean,
    sd,
    z,
    pValue: Math.min(1, 2 * normalSf(Math.abs(z))),
    ljungBox,
    method: `lag-1 autocorrelation r₁ against its exact mean and variance under independent ` +
      `normal errors (Durbin & Watson 1950)${basis ? " for the residuals of the fit" : ""}, ` +
      `normal approximation, two-sided`,
  });
}

/** Exact moments for plain values (M = I − 11ᵀ/n), in closed form. */
function _valueMoments(n: number): { mean: number; variance: number } {
  const trAM = -(n - 1) / n;
  const trAMAM = (n - 1) / 2 - (2 * (n - 1.5)) / n + ((n - 1) / n) ** 2;
  return _moments(trAM, trAMAM, n - 1);
}

/**
 * Exact moments for residuals, M = I − UUᵀ with U orthonormal (n × r):
 * tr(AM) = −Σⱼ Σₜ uₜⱼuₜ₊₁,ⱼ and
 * tr((AM)²) = tr(A²) − 2·Σⱼ ‖Auⱼ‖² + ‖UᵀAU‖²_F, with tr(A²) = (n − 1)/2.
 */
function _residualMoments(
  u: Float64Array,
  n: number,
  r: number,
): { mean: number; variance: number } {
  let trAM = 0, aq = 0;
  const b = new Float64Array(r * r); // UᵀAU
  for (let j = 0; j < r; j++) {
    const uj = j * n;
    for (let t = 0; t + 1 < n; t++) trAM -= u[uj + t] * u[uj + t + 1];
    for (let t = 0; t < n; t++) {
      const a = ((t > 0 ? u[uj + t - 1] : 0) + (t + 1 < n ? u[uj + t + 1] : 0)) / 2;
      aq += a * a;
    }
    for (let k = 0; k <= j; k++) {
      const uk = k * n;
      let s = 0;
      for (let t = 0; t + 1 < n; t++) s += u[uj + t] * u[uk + t + 1] + u[uj + t + 1] * u[uk + t];
      b[j * r + k] = b[k * r + j] = s / 2;
    }
  }
  let frob = 0;
  for (let k = 0; k < r * r; k++) frob += b[k] * b[k];
  return _moments(trAM, (n - 1) / 2 - 2 * aq + frob, n - r);
}

function _moments(trAM: number, trAMAM: number, nu: number): { mean: number; variance: number } {
  const mean = trAM / nu;
  const second = (trAM * trAM + 2 * trAMAM) / (nu * (nu + 2));
  return { mean, variance: Math.max(second - mean * mean, 0) };
}
