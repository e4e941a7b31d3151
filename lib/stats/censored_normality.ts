/**
 * A Shapiro–Francia-type test of normality for samples with values below or
 * above detection limits.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalSf } from "../numeric/normal.ts";
import { _checkOverlap, _positionsSorted } from "./censored_positions.ts";
import { _oneMinusWPrime } from "./_censored_statistic.ts";
import type { CensoredSample } from "./censored_sample.ts";
import {
  _NULL_DELTA,
  _NULL_N,
  _NULL_ONE_LIMIT,
  _NULL_SEVERAL_LIMITS,
} from "./_censored_null_table.ts";
import { BLOM_OFFSET } from "./plotting_positions.ts";
import { roundingWarning } from "./rounding.ts";
import { freezeResult, type TestResult } from "./result.ts";

const _NAME = "the censored-sample Shapiro–Francia test";
/** Smallest and largest total n of the calibration. */
export const CENSORED_TEST_MIN_N = _NULL_N[0];
export const CENSORED_TEST_MAX_N = _NULL_N[_NULL_N.length - 1];
/** Largest censored fraction of the calibration. */
export const CENSORED_TEST_MAX_FRACTION = _NULL_DELTA[_NULL_DELTA.length - 1];
/** Above this censored fraction the result carries a caution (common practice). */
export const CENSORED_CAUTION_FRACTION = 0.5;
/** The standard normal quantiles of the calibrated null quantiles (50%, 90%, 95%, 99%). */
const _Z = [0, 1.2815515655446004, 1.6448536269514722, 2.3263478740408408];

/** The result of the censored-sample test: a {@linkcode TestResult} with the censoring. */
export interface CensoredTestResult extends TestResult {
  /** Measured values (the statistic uses these). */
  readonly observed: number;
  /** Left-censored values. */
  readonly left: number;
  /** Right-censored values. */
  readonly right: number;
  /** The censored fraction, (left + right)/n. */
  readonly censoredFraction: number;
  /** Where the p-value is calibrated, in words. */
  readonly validity: string;
}

/**
 * The calibrated null quantiles of ln(1 − W′) at (n, censored fraction),
 * bilinear in (ln n, fraction) between the table's grid points; from the
 * one-limit table unless the sample has several limits.
 */
export function _nullQuantiles(n: number, fraction: number, several: boolean): number[] {
  const table = several ? _NULL_SEVERAL_LIMITS : _NULL_ONE_LIMIT;
  const ln = Math.log(n);
  let i = 0;
  while (i + 2 < _NULL_N.length && _NULL_N[i + 1] <= n) i++;
  const tn = Math.min(
    1,
    Math.max(0, (ln - Math.log(_NULL_N[i])) / (Math.log(_NULL_N[i + 1]) - Math.log(_NULL_N[i]))),
  );
  let j = 0;
  while (j + 2 < _NULL_DELTA.length && _NULL_DELTA[j + 1] <= fraction) j++;
  const td = Math.min(
    1,
    Math.max(0, (fraction - _NULL_DELTA[j]) / (_NULL_DELTA[j + 1] - _NULL_DELTA[j])),
  );
  const at = (a: number, b: number, q: number) => table[a][b][q];
  return _Z.map((_, q) =>
    (1 - tn) * ((1 - td) * at(i, j, q) + td * at(i, j + 1, q)) +
    tn * ((1 - td) * at(i + 1, j, q) + td * at(i + 1, j + 1, q))
  );
}

/**
 * The upper-tail p-value of ln(1 − W′) = y: the standard normal z of y is
 * interpolated linearly between the calibrated quantiles (50%, 90%, 95%,
 * 99%), continued beyond them with the slopes of the outer segments.
 */
export function _censoredPValue(y: number, q: readonly number[]): number {
  let s = 0;
  if (y > q[2]) s = 2;
  else if (y > q[1]) s = 1;
  const z = _Z[s] + (_Z[s + 1] - _Z[s]) * (y - q[s]) / (q[s + 1] - q[s]);
  return normalSf(z);
}

/**
 * Test normality of a sample with censored values: a Shapiro–Francia-type
 * statistic on the measured values (Royston, P. (1993), "A toolkit for
 * testing for non-normality in complete and censored samples", The
 * Statistician 42:37–43; Verrill, S. & Johnson, R. A. (1988), "Tables and
 * large-sample distribution theory for censored-data correlation statistics
 * for testing normality", JASA 83:1192–1197).
 *
 * Statistic: W′ is the squared correlation between the measured values and
 * their normal scores Φ⁻¹(p), with p the Hirsch–Stedinger plotting
 * positions of the whole sample (censored values take up their share of the
 * probability scale; offset 3/8, so that with nothing censored W′ is the
 * Shapiro–Francia statistic with Blom scores). This is the correlation form
 * of the two papers, extended to several limits through the positions.
 *
 p-value: no published calibration covers several limits (and the
 * published ones were not at hand to state with confidence), so the null
 * distribution of ln(1 − W′) was simulated by plumbline's own seeded script
 * (`tools/sim/censored_null.ts`; its tables of the 50%, 90%, 95% and
 * 99% quantiles are in `lib/stats/_censored_null_table.ts`) over n = 5…5000
 * and censored fractions 0…0.8, in two tables: samples with one limit, and
 * samples with two to four limits of varied spread. A sample with a single
 * distinct limit uses the first, any other the second (limits on both sides
 * count as several). Between grid points the quantiles are interpolated in
 * (ln n, fraction); the p-value maps ln(1 − W′) to a standard normal z
 * piecewise linearly through those quantiles. The size this achieves is in
 * README (by `tools/sim/censored_size.ts`): 3.9–5.9% at the 5% level
 * for normal samples of 20, 50 and 200 with 10–50% censored at one limit or
 * at three; with several limits it depends on how far apart they are (two
 * limits at the 5% and 95% quantiles: about 2%, conservative; two at the 45%
 * and 55% quantiles of 200 values: 7.6%, liberal).
 *
 * Validity: n from 5 to 5000 values in all, at least 3 measured, at most
 * 80% censored; right censoring by mirroring (the statistic is unchanged
 * when x → −x). A caution is added above half censored: the test then sees
 * only the upper (or lower) part of the distribution (common practice, not
 * a published rule).
 *
 * Errors: `PlumbError` with code `"too-few"` (n < 5, fewer than 3 measured
 * values, or more than 80% censored), `"too-many"` (n > 5000),
 * `"overlapping-limits"`.
 *
 * @param sample a checked sample from `censoredSample`
 * @returns a frozen {@linkcode CensoredTestResult} with `statisticName: "W′"`
 * @example
 * ```ts
 * import { censoredSample } from "./censored_sample.ts";
 * import { censoredShapiroFrancia } from "./censored_normality.ts";
 * const x = [0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3, 0.08, 0.05, 0.18, 0.13];
 * const c = [-1, 0, -1, 0, 0, 0, 0, 0, 0, -1, 0, 0];
 * const r = censoredShapiroFrancia(censoredSample(x, c));
 * if (!(r.statistic > 0.8 && r.pValue > 0 && r.pValue <= 1 && r.left === 3)) throw new Error("test");
 * ```
 */
export function censoredShapiroFrancia(sample: CensoredSample): CensoredTestResult {
  const { n, observed, left, right } = sample;
  const fraction = (left + right) / n;
  if (n < CENSORED_TEST_MIN_N) {
    throw new PlumbError(
      "too-few",
      `Cannot run ${_NAME} on ${n} values: at least ${CENSORED_TEST_MIN_N} are needed`,
      { n, min: CENSORED_TEST_MIN_N },
    );
  }
  if (n > CENSORED_TEST_MAX_N) {
    throw new PlumbError(
      "too-many",
      `Cannot run ${_NAME} on ${n} values: its p-value is calibrated for at most ` +
        `${CENSORED_TEST_MAX_N}; test a random subsample that keeps the censoring`,
      { n, max: CENSORED_TEST_MAX_N },
    );
  }
  if (fraction > CENSORED_TEST_MAX_FRACTION) {
    throw new PlumbError(
      "too-few",
      `Cannot run ${_NAME}: ${left + right} of ${n} values (${_pct(fraction)}) are censored, ` +
        `and its p-value is calibrated up to ${_pct(CENSORED_TEST_MAX_FRACTION)}; with so few ` +
        `measured values, report the detected fraction instead of a shape`,
      { n, censored: left + right, max: CENSORED_TEST_MAX_FRACTION },
    );
  }
  _checkOverlap(sample);
  const g = _positionsSorted(sample, BLOM_OFFSET);
  const oneMinus = _oneMinusWPrime(g);
  const several = sample.leftLimits.length + sample.rightLimits.length > 1;
  const p = oneMinus === 0
    ? 1
    : _censoredPValue(Math.log(oneMinus), _nullQuantiles(n, fraction, several));
  const warnings: string[] = [];
  if (fraction > CENSORED_CAUTION_FRACTION) {
    warnings.push(
      `${_pct(fraction)} of the values are censored: the test sees only the ` +
        `${left >= right ? "upper" : "lower"} part of the distribution, so judge the shape below ` +
        `the limit by knowledge of the process, not by this p-value`,
    );
  }
  const obs = g.obs;
  const ties = obs.length > 2 && obs[0] < obs[obs.length - 1]
    ? roundingWarning(obs, true)
    : undefined;
  if (ties) warnings.push(ties);
  if (observed < 20) {
    warnings.push(
      `With only ${observed} measured values the test has little power: a large p is weak ` +
        `evidence of normality`,
    );
  }
  const limits = [
    ...sample.leftLimits.map((l) => `<${l}`),
    ...sample.rightLimits.map((l) => `>${l}`),
  ];
  return freezeResult({
    test: "Shapiro–Francia (censored)",
    statisticName: "W′",
    statistic: 1 - oneMinus,
    pValue: p,
    n,
    method: `correlation of the ${observed} measured values with normal scores at ` +
      `Hirsch–Stedinger positions (${left + right} censored at ${_list(limits)}); p from ` +
      `plumbline's seeded null simulation for ${several ? "several limits" : "one limit"}`,
    warnings,
    observed,
    left,
    right,
    censoredFraction: fraction,
    validity: `calibrated for ${CENSORED_TEST_MIN_N}–${CENSORED_TEST_MAX_N} values with up to ` +
      `${_pct(CENSORED_TEST_MAX_FRACTION)} censored at one or several limits` +
      (several
        ? `; with several limits the true size depends on their spread (about 2–8% at the ` +
          `5% level in plumbline's simulations)`
        : ""),
  });
}

function _pct(f: number): string {
  return `${Math.round(f * 100)}%`;
}

/** At most four limits by name, then a count. */
function _list(limits: string[]): string {
  if (limits.length <= 4) return limits.join(", ");
  return `${limits.slice(0, 3).join(", ")} and ${limits.length - 3} other limits`;
}
