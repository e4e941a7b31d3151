/**
 * D'Agostino–Pearson K² omnibus test: normal scores for skewness and
 * kurtosis, combined.
 *
 * @module
 */
import { normalSf } from "../numeric/normal.ts";
import { formatNumber } from "../results/format.ts";
import { checkSize, finiteCopy } from "./_input.ts";
import { _sampleShape, type _Shape } from "./moments.ts";
import { freezeResult, type TestResult } from "./result.ts";

/** The K² result: the {@linkcode TestResult} fields plus the two components. */
export interface DagostinoPearsonResult extends TestResult {
  /** Normal score of the skewness √b1 (D'Agostino 1970); positive for a long right tail. */
  readonly skewnessZ: number;
  /** Two-sided p of `skewnessZ` alone. */
  readonly skewnessP: number;
  /** Normal score of the kurtosis b2 (Anscombe & Glynn 1983); positive for heavy tails. */
  readonly kurtosisZ: number;
  /** Two-sided p of `kurtosisZ` alone. */
  readonly kurtosisP: number;
}

const _WHAT = "the D'Agostino–Pearson K² test";
/** Smallest n: D'Agostino's (1970) skewness transformation is defined from n = 8. */
const _MIN_N = 8;
/** Below this n the kurtosis score is a rougher approximation (see the doc comment). */
const _KURTOSIS_SMALL_N = 20;

/**
 * D'Agostino (1970, "Transformation to normality of the null distribution
 * of g1", Biometrika 57:679–681): Z = δ·asinh(y/α) with
 * y = √b1·√((n+1)(n+3)/(6(n−2))), β₂ = 3(n²+27n−70)(n+1)(n+3)/((n−2)(n+5)(n+7)(n+9)),
 * W² = √(2(β₂−1)) − 1, δ = 1/√(ln W), α = √(2/(W²−1)).
 */
function _skewnessZ(g1: number, n: number): number {
  const y = g1 * Math.sqrt(((n + 1) * (n + 3)) / (6 * (n - 2)));
  const beta2 = (3 * (n * n + 27 * n - 70) * (n + 1) * (n + 3)) /
    ((n - 2) * (n + 5) * (n + 7) * (n + 9));
  const w2 = Math.sqrt(2 * (beta2 - 1)) - 1;
  const delta = 1 / Math.sqrt(0.5 * Math.log(w2));
  const alpha = Math.sqrt(2 / (w2 - 1));
  return delta * Math.asinh(y / alpha);
}

/**
 * Anscombe & Glynn (1983, "Distribution of the kurtosis statistic b2 for
 * normal samples", Biometrika 70:227–234): with b2 = g2 + 3, its exact null
 * mean 3(n−1)/(n+1) and variance 24n(n−2)(n−3)/((n+1)²(n+3)(n+5)), the
 * standardised x, the third standardised moment √β₁ of b2 and
 * A = 6 + (8/√β₁)(2/√β₁ + √(1 + 4/β₁)),
 * Z = ((1 − 2/(9A)) − ∛((1 − 2/A)/(1 + x√(2/(A−4))))) / √(2/(9A)).
 *
 * The approximation needs 1 + x√(2/(A−4)) > 0. For very light tails
 * (two tight clusters) it is not: Z tends to −∞ as that term falls to 0.
 * Past it, plumbline keeps the magnitude given by the real cube root and
 * the negative sign that matches the limit, and reports `outside = true`.
 * (scipy 1.10's kurtosistest keeps the real cube root's positive sign
 * there, so its Z reads "heavy tails" for such data; K² is the same.)
 */
function _kurtosisZ(g2: number, n: number): { z: number; outside: boolean } {
  const b2 = g2 + 3;
  const mean = (3 * (n - 1)) / (n + 1);
  const variance = (24 * n * (n - 2) * (n - 3)) / ((n + 1) * (n + 1) * (n + 3) * (n + 5));
  const x = (b2 - mean) / Math.sqrt(variance);
  const sqrtBeta1 = ((6 * (n * n - 5 * n + 2)) / ((n + 7) * (n + 9))) *
    Math.sqrt((6 * (n + 3) * (n + 5)) / (n * (n - 2) * (n - 3)));
  const a = 6 + (8 / sqrtBeta1) * (2 / sqrtBeta1 + Math.sqrt(1 + 4 / (sqrtBeta1 * sqrtBeta1)));
  const term1 = 1 - 2 / (9 * a);
  const denom = 1 + x * Math.sqrt(2 / (a - 4));
  const scale = Math.sqrt(2 / (9 * a));
  if (denom > 0) {
    return { z: (term1 - Math.cbrt((1 - 2 / a) / denom)) / scale, outside: false };
  }
  const mag = Math.cbrt((1 - 2 / a) / Math.max(-denom, Number.MIN_VALUE));
  return { z: -(term1 + mag) / scale, outside: true };
}

/**
 * D'Agostino–Pearson K² test of normality: K² = Zs² + Zk², where Zs is
 * D'Agostino's (1970) normal score for the skewness √b1 = g1 and Zk the
 * Anscombe & Glynn (1983) normal score for the kurtosis b2 = g2 + 3; the
 * combination is D'Agostino & Pearson (1973, "Tests for departure from
 * normality", Biometrika 60:613–622). p is the χ²(2) upper tail, which is
 * exactly exp(−K²/2), so it stays a correct tiny number down to about 1e−308.
 * The component p-values are two-sided normal tails.
 *
 * Range: n ≥ 8 (the skewness transformation needs it; scipy's skewtest has
 * the same limit). Below n = 20 a warning says that the kurtosis score is
 * rough: D'Agostino, Belanger & D'Agostino (1990, The American Statistician
 * 44:316–321) advise n ≥ 20 for it (from memory), and scipy's kurtosistest
 * warns likewise. No upper limit and no sort: two passes over the data.
 *
 * Checked against scipy 1.10 skewtest, kurtosistest and normaltest to 1e−9
 * (tests/stats/dagostino_pearson_test.ts).
 *
 * @param x the sample: finite numbers, at least 8, not all equal
 * @throws {PlumbError} `"too-few"`, `"non-finite"` or `"constant"`
 *
 * @example
 * ```ts
 * import { dagostinoPearson } from "@plumbline/plumbline";
 * const r = dagostinoPearson([2.1, 3.4, 1.9, 5.6, 4.4, 3.8, 2.9, 4.1, 3.3, 3.0, 6.2, 2.5]);
 * const sum = r.skewnessZ ** 2 + r.kurtosisZ ** 2;
 * if (Math.abs(r.statistic - sum) > 1e-12) throw new Error("K² = Zs² + Zk²");
 * if (!(r.pValue > 0 && r.pValue <= 1)) throw new Error("p in (0, 1]");
 * ```
 */
export function dagostinoPearson(x: ArrayLike<number>): DagostinoPearsonResult {
  checkSize(x.length, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const s = finiteCopy(x, _WHAT);
  return _dagostinoPearsonOf(s.length, _sampleShape(s, _WHAT));
}

/**
 * {@linkcode dagostinoPearson} from the {@linkcode _sampleShape} of a
 * finite, non-constant sample of `n` values (the size is checked here).
 */
export function _dagostinoPearsonOf(n: number, shape: _Shape): DagostinoPearsonResult {
  checkSize(n, _MIN_N, Number.POSITIVE_INFINITY, _WHAT);
  const { g1, g2 } = shape;
  const zs = _skewnessZ(g1, n);
  const { z: zk, outside } = _kurtosisZ(g2, n);
  const k2 = zs * zs + zk * zk;
  const warnings: string[] = [];
  if (n < _KURTOSIS_SMALL_N) {
    warnings.push(
      `With ${n} values the kurtosis score is a rough approximation (it is advised ` +
        `from 20 values on); give the skewness score more weight`,
    );
  }
  if (outside) {
    warnings.push(
      `The tails are far lighter than normal (excess kurtosis ${formatNumber(g2, 3)}), beyond ` +
        `the range of the Anscombe–Glynn approximation: the kurtosis score only says ` +
        `"much lighter than normal"; look at the histogram for two or more clusters`,
    );
  }
  return freezeResult({
    test: "D'Agostino–Pearson",
    statisticName: "K²",
    statistic: k2,
    pValue: Math.exp(-k2 / 2),
    n,
    method: "K² = Zs² + Zk² with D'Agostino (1970) skewness and Anscombe–Glynn (1983) " +
      "kurtosis scores; p from χ²(2), exp(−K²/2)",
    warnings,
    skewnessZ: zs,
    skewnessP: Math.min(1, 2 * normalSf(Math.abs(zs))),
    kurtosisZ: zk,
    kurtosisP: Math.min(1, 2 * normalSf(Math.abs(zk))),
  });
}
