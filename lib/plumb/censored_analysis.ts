/**
 * The screening of a sample with values below or above detection limits:
 * the same {@linkcode Analysis} as for measured values, with every part that
 * the limits would bias computed by a method for censored data, and a
 * `censoring` record saying how many values were censored, where, and how
 * they were handled.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { randomSubsample } from "../numeric/random.ts";
import type { Analysis, SampleOrigin, Subsample, TestOutcome } from "../results/analysis.ts";
import { type Censoring, type CensoringLimit, censoringWords } from "../results/censoring.ts";
import { formatCompact } from "../results/format.ts";
import type { Reading } from "../results/reading.ts";
import { NORMALITY_TESTS } from "../stats/battery.ts";
import { _censoredFit, type CensoredFit } from "../stats/censored_fit.ts";
import {
  CENSORED_CAUTION_FRACTION,
  CENSORED_TEST_MAX_N,
  censoredShapiroFrancia,
} from "../stats/censored_normality.ts";
import { _checkOffset, _checkOverlap, _positionsSorted } from "../stats/censored_positions.ts";
import { _censoredQqFrom } from "../stats/censored_qq.ts";
import { _rosFrom } from "../stats/censored_ros.ts";
import { type CensoredSample, censoredSample } from "../stats/censored_sample.ts";
import { _histogramDataSorted } from "../stats/histogram_data.ts";
import { BLOM_OFFSET } from "../stats/plotting_positions.ts";
import { _measurementStepSorted } from "../stats/measurement_step.ts";
import { _momentsOf, _sampleShape } from "../stats/moments.ts";
import type { TestResult } from "../stats/result.ts";
import { analyse, ANALYSE_MIN_N, type AnalyseOptions } from "./analysis.ts";
import { readShape } from "./reading.ts";

const _ML_METHOD = "maximum likelihood for a normal sample with censored values " +
  "(Cohen 1991, Truncated and Censored Samples, ch. 2), Newton's method on (mean, ln sd)";

/**
 * Screen a sample in which some values are known only to lie below (or
 * above) a limit. With no value censored this is {@linkcode analyse}.
 *
 * What changes with censoring:
 * - `n` counts every value, censored ones included;
 * - `primary` is the censored-sample Shapiro–Francia test
 *   (`censoredShapiroFrancia`: Royston 1993, Verrill & Johnson 1988, with
 *   plumbline's simulated calibration); above 5000 values it runs on a
 *   seeded random subsample of 5000 that keeps each value's side, and says
 *   so; the tests for complete samples are listed as not run;
 * - `censoring` holds the counts by side, the limits, the
 *   maximum-likelihood mean and sd (`censoredNormalFit`) and the
 *   regression-on-order-statistics estimates (`censoredRos`);
 * - the QQ plot uses Hirsch–Stedinger positions, draws censored values at
 *   their limits and takes its line from the ML fit;
 * - skewness and kurtosis (and so the reading) come from the measured values
 *   with the censored ones imputed by ROS (Helsel 2012, ch. 6), the device
 *   Helsel uses for summary statistics; the histogram shows the measured
 *   values only.
 *
 * Errors: those of `censoredSample` (`"too-few"` with fewer than 3 measured
 * values, `"constant"`), of the test (`"too-few"` above 80% censored) and
 * `"overlapping-limits"`.
 *
 * @param values the measured values, and the limit for each censored value
 * @param censor the side of each value: 0 measured, −1 below its limit, 1 above it
 * @param origin where the values came from, for labels and counts
 * @param options QQ options and the subsample seed
 * @example
 * ```ts
 * import { analyseCensored } from "./censored_analysis.ts";
 * const x = new Float64Array([0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3, 0.08, 0.14]);
 * const c = new Int8Array([-1, 0, -1, 0, 0, 0, 0, 0, 0, 0]);
 * const a = analyseCensored(x, c, { label: "cl", column: "cl", missingDropped: 0, textDropped: 0 });
 * if (a.n !== 10 || a.censoring?.left !== 2 || !(a.censoring.mean < 0.14)) throw new Error("censored");
 * ```
 */
export function analyseCensored(
  values: Float64Array,
  censor: Int8Array,
  origin: SampleOrigin,
  options: AnalyseOptions = {},
): Analysis {
  const sample = censoredSample(values, censor, { what: `a screening of ${origin.label}` });
  if (sample.observed === sample.n) return analyse(values, origin, options);
  const n = sample.n;
  if (n < ANALYSE_MIN_N) {
    throw new PlumbError(
      "too-few",
      `Cannot screen ${origin.label}: ${n} values, and at least ${ANALYSE_MIN_N} are needed`,
      { n, min: ANALYSE_MIN_N },
    );
  }
  // One sort of the measured values serves the ROS line, the QQ points and
  // the histogram; Newton starts from the measured values' mean and sd (it
  // is safeguarded, and the ROS start would need per-value positions).
  _checkOverlap(sample);
  const g = _positionsSorted(sample, BLOM_OFFSET);
  const fit = _censoredFit(sample, 100, false);
  const ros = _rosFrom(sample, g, BLOM_OFFSET);
  const { primary, subsample } = _test(sample, options.seed ?? 1);
  const shape = _sampleShape(ros.values, "the skewness and kurtosis summary");
  const moments = _momentsOf(n, shape);
  const censored = sample.left + sample.right;
  const tests: TestOutcome[] = [
    Object.freeze({ test: primary.test, result: primary }),
    ...NORMALITY_TESTS.map((t) =>
      Object.freeze({
        test: t.name,
        skipped: `for measured values only: ${censored} of the ${n} values are censored`,
      })
    ),
  ];
  // Row labels for the QQ points and the reading's outliers (the sample is copied anyway).
  const label = options.rowLabel;
  const rows = origin.rows ??
    (label ? Int32Array.from({ length: n }, (_, j) => label(j)) : undefined);
  const qqOptions = { ...options.qq, rows };
  const offset = _checkOffset(qqOptions.offset ?? BLOM_OFFSET);
  const qq = _censoredQqFrom(
    sample,
    offset === BLOM_OFFSET ? g : _positionsSorted(sample, offset),
    fit,
    qqOptions,
  );
  const measured = values.filter((_, i) => censor[i] === 0);
  const histogram = _histogramDataSorted(
    measured,
    g.obs,
    _sampleShape(measured, "a histogram"),
  );
  const censoring = _censoring(sample, fit, ros);
  const base = readShape({
    n,
    moments,
    primary,
    qq,
    values: ros.values,
    rows,
    // The step of the measured values (the imputed ones are on no grid).
    step: _measurementStepSorted(g.obs).step,
    subsample: null,
  });
  const reading = _withCensoring(base, censoring, n, subsample);
  return Object.freeze({
    origin: Object.freeze({ ...origin, rows: undefined }),
    n,
    moments,
    primary,
    subsample,
    tests: Object.freeze(tests),
    qq,
    histogram,
    reading,
    censoring,
  });
}

/**
 * {@linkcode analyseCensored} when `censor` is given (it falls back to
 * `analyse` when no value is censored), `analyse` when it is `null`.
 */
export function analyseSides(
  values: Float64Array,
  censor: Int8Array | null,
  origin: SampleOrigin,
  options: AnalyseOptions = {},
): Analysis {
  return censor
    ? analyseCensored(values, censor, origin, options)
    : analyse(values, origin, options);
}

/** The censored test, on a seeded subsample that keeps the sides when n exceeds its range. */
function _test(
  sample: CensoredSample,
  seed: number,
): { primary: TestResult; subsample: Subsample | null } {
  const { n, values, censor } = sample;
  if (n <= CENSORED_TEST_MAX_N) return { primary: censoredShapiroFrancia(sample), subsample: null };
  const size = CENSORED_TEST_MAX_N;
  const pick = randomSubsample(Float64Array.from({ length: n }, (_, i) => i), size, seed);
  const sub = censoredSample(
    Float64Array.from(pick, (i) => values[i]),
    Int8Array.from(pick, (i) => censor[i]),
    { what: "the censored-sample test on a subsample" },
  );
  const r = censoredShapiroFrancia(sub);
  const primary = Object.freeze({
    ...r,
    method: `${r.method}; on a seeded random subsample of ${size} of the ${n} values, ` +
      `each keeping its side`,
    warnings: Object.freeze([
      `The censored test's p-value is calibrated for at most ${size} values, so W′ and p come ` +
      `from a seeded random subsample of ${size} (${sub.left + sub.right} of them censored); ` +
      `the estimates use all ${n}`,
      ...r.warnings,
    ]),
  });
  return { primary, subsample: Object.freeze({ size, seed }) };
}

function _censoring(
  sample: CensoredSample,
  fit: CensoredFit,
  ros: { mean: number; sd: number; method: string },
): Censoring {
  const limits: CensoringLimit[] = [
    ...sample.leftLimits.map((limit, j) =>
      Object.freeze({ limit, side: "below" as const, count: sample.leftCounts[j] })
    ),
    ...sample.rightLimits.map((limit, j) =>
      Object.freeze({ limit, side: "above" as const, count: sample.rightCounts[j] })
    ),
  ];
  const fraction = (sample.left + sample.right) / sample.n;
  const warnings: string[] = [...fit.warnings];
  if (fraction > CENSORED_CAUTION_FRACTION) {
    warnings.push(
      `More than half the values (${Math.round(fraction * 100)}%) are censored: the estimates ` +
        `lean on the normal model below the limit, which the data cannot check (common practice)`,
    );
  }
  return Object.freeze({
    left: sample.left,
    right: sample.right,
    observed: sample.observed,
    fraction,
    mean: fit.mean,
    sd: fit.sd,
    seMean: fit.seMean,
    seSd: fit.seSd,
    converged: fit.converged,
    limits: Object.freeze(limits),
    method: _ML_METHOD,
    ros: Object.freeze({ mean: ros.mean, sd: ros.sd, method: ros.method }),
    handling: "the mean and sd by maximum likelihood under censoring; normality by the " +
      "censored-sample Shapiro–Francia test on the measured values; skewness and kurtosis with " +
      "the censored values imputed by regression on order statistics; the QQ plot draws censored " +
      "values at their limits; the histogram shows the measured values only",
    warnings: Object.freeze(warnings),
  });
}

/** The reading with the censoring stated first and the subsample noted. */
function _withCensoring(
  r: Reading,
  c: Censoring,
  n: number,
  subsample: Subsample | null,
): Reading {
  const point = `${_cap(censoringWords(c, n))}: mean ${formatCompact(c.mean)} and sd ` +
    `${formatCompact(c.sd)} by maximum likelihood under censoring (by regression on order ` +
    `statistics: ${formatCompact(c.ros.mean)} and ${formatCompact(c.ros.sd)}); the test is ` +
    `Shapiro–Francia for censored samples, and skewness and kurtosis count the censored values ` +
    `through ROS imputation`;
  const sizeNote = subsample
    ? `${r.sizeNote}. The censored test used a seeded random subsample of ${subsample.size} ` +
      `values (its p-value is calibrated up to ${subsample.size}); the estimates used all ${n}`
    : r.sizeNote;
  return Object.freeze({
    ...r,
    headline: r.headline.replace("(W = ", "(W′ = "),
    // The two-σ point explains Shapiro–Wilk's W, which is not the test here.
    points: Object.freeze([
      point,
      ...c.warnings,
      ...r.points.filter((t) => !t.startsWith("Two estimates of σ")),
    ]),
    sizeNote,
  });
}

const _cap = (s: string) => s[0].toUpperCase() + s.slice(1);
