/**
 * Upper-tail quantiles of Student's t distribution, through the beta
 * quantile.
 *
 * Method: for T with ν degrees of freedom, P(|T| > t) = I_x(ν/2, ½) with
 * x = ν/(ν + t²), and equally 1 − I_y(½, ν/2) with y = t²/(ν + t²)
 * (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, 26.7.1
 * with 26.5.2). The start is t = √(ν(1 − x)/x) with x the 2q-quantile of
 * Beta(ν/2, ½) (`betaQuantile`); Newton steps on log P(T > t) − log q then
 * refine it, evaluating the tail with whichever of x and y is below ½ (so
 * neither is a rounded number near 1) and the density in logarithms. This
 * keeps full relative accuracy up to ν = 1e5. From ν = 1e5 on, where
 * Beta(ν/2, ½) is too concentrated for the iteration, t comes from the
 * normal quantile by the expansion of Abramowitz & Stegun 26.7.5.
 *
 * Accuracy: within 1e-11 relative of R 4.2.2's `qt` on the cases of
 * tests/fixtures/outliers.json (ν from 1 to 1e6, upper tails from 0.25 to
 * 1e-12); the expansion agrees with `qt` to a few ulps from ν = 1e5 to 1e12.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { betaCdfPair, betaQuantile, logBeta } from "./beta.ts";
import { normalQuantile } from "./normal.ts";

/**
 * The t with P(T > t) = q for Student's t with ν degrees of freedom.
 *
 * @param q the upper-tail probability, 0 < q < ½
 * @param df the degrees of freedom, ν > 0
 * @returns t > 0
 * @throws {PlumbError} `"bad-option"` for q outside (0, ½) or ν ≤ 0
 *
 * @example
 * ```ts
 * import { studentTUpper } from "./student_t.ts";
 * // t with 1 degree of freedom is Cauchy: the upper 0.25 point is tan(π/4) = 1
 * if (Math.abs(studentTUpper(0.25, 1) - 1) > 1e-12) throw new Error("Cauchy quartile");
 * ```
 */
export function studentTUpper(q: number, df: number): number {
  if (!(q > 0 && q < 0.5)) {
    throw new PlumbError(
      "bad-option",
      `Cannot find a t quantile for upper tail ${q}: use a probability between 0 and 0.5`,
    );
  }
  if (!(df > 0) || !Number.isFinite(df)) {
    throw new PlumbError(
      "bad-option",
      `Cannot find a t quantile with ${df} degrees of freedom: use a positive number`,
    );
  }
  if (df >= _EXPANSION_FROM) return _expansion(normalQuantile(q) * -1, df);
  const x = betaQuantile(2 * q, df / 2, 0.5);
  let t = Math.sqrt(df * ((1 - x) / x));
  const logB = logBeta(df / 2, 0.5);
  const logQ = Math.log(q);
  for (let iter = 0; iter < 30; iter++) {
    const logTail = Math.log(_upperTail(t, df, logB));
    const logDensity = -logB - 0.5 * Math.log(df) - ((df + 1) / 2) * Math.log1p((t * t) / df);
    // d log S / dt = −f/S, so the Newton step on log S − log q is (log S − log q)·S/f.
    const step = (logTail - logQ) * Math.exp(logTail - logDensity);
    const next = t + step;
    if (!(next > 0) || !Number.isFinite(next)) break;
    t = next;
    if (Math.abs(step) <= 1e-15 * t) break;
  }
  return t;
}

/** From this many degrees of freedom on, the expansion in 1/ν is used. */
const _EXPANSION_FROM = 1e5;

/**
 * t from the normal quantile z by the expansion of Abramowitz & Stegun
 * 26.7.5 (Cornish–Fisher, terms to 1/ν⁴); its error is of order z¹¹/ν⁵,
 * below 1e-15 relative for ν ≥ 1e5 and z ≤ 8.
 */
function _expansion(z: number, df: number): number {
  const z2 = z * z;
  const g1 = (z * (z2 + 1)) / 4;
  const g2 = (z * ((5 * z2 + 16) * z2 + 3)) / 96;
  const g3 = (z * (((3 * z2 + 19) * z2 + 17) * z2 - 15)) / 384;
  const g4 = (z * ((((79 * z2 + 776) * z2 + 1482) * z2 - 1920) * z2 - 945)) / 92160;
  const r = 1 / df;
  return z + r * (g1 + r * (g2 + r * (g3 + r * g4)));
}

/** P(T > t) for t > 0, from the side of the incomplete beta function whose argument is below ½. */
function _upperTail(t: number, df: number, logB: number): number {
  const t2 = t * t;
  if (t2 < df) {
    const y = t2 / (df + t2);
    return 0.5 * betaCdfPair(y, 0.5, df / 2)[1];
  }
  const x = df / (df + t2);
  return 0.5 * betaCdfPair(x, df / 2, 0.5, logB)[0];
}
