/**
 * Data for a histogram with the fitted normal curve: bin counts under a
 * named bin-width rule, and the normal density with the sample mean and
 * standard deviation scaled to counts (n · bin width · density), so that
 * curve and bars share one axis.
 *
 * Bin-width rules:
 * - `"freedman-diaconis"` (default): h = 2 · IQR · n^(−1/3) (Freedman &
 *   Diaconis 1981, "On the histogram as a density estimator: L2 theory",
 *   Zeitschrift für Wahrscheinlichkeitstheorie und verwandte Gebiete
 *   57:453–476). The quartiles are Hyndman & Fan's (1996, The American
 *   Statistician 50:361–365) type 7, found by selection (`numeric/select.ts`)
 *   without sorting a large sample.
 *   When the IQR is 0 the Scott rule is used instead, and the result says so.
 * - `"scott"`: h = 3.49 · sd · n^(−1/3) (Scott 1979, "On optimal and
 *   data-based histograms", Biometrika 66:605–610).
 * - `"sturges"`: ⌈log₂ n⌉ + 1 bins (Sturges 1926, Journal of the American
 *   Statistical Association 21:65–66).
 *
 * Bins (`histogram_bins.ts`): when the values sit on a measurement step h
 * (found from the data, or passed in), the width is a whole number of steps
 * and the edges lie half a step off the recorded values, so every bin holds
 * the same number of grid values; otherwise [min, max] is split into
 * k = ⌈range / w⌉ equal parts, capped at `maxBins`. A width or a number of
 * bins can be asked for instead of a rule.
 *
 * @module
 */
import { checkOptions, optionNames } from "../results/options.ts";
import { ldexp, rescaleExponent } from "../numeric/ldexp.ts";
import { selectRanks } from "../numeric/select.ts";
import { checkNotConstant, checkSize, checkSpreadFinite, finiteCopy } from "./_input.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { type BinRule, checkBinRequest } from "./histogram_bins.ts";
import { _measurementStepSorted } from "./measurement_step.ts";
import { _sampleShape, type _Shape } from "./moments.ts";
import { _histogramFinish, _histogramLayout } from "./histogram_layout.ts";

export type { BinRule };

/** Options for {@linkcode histogramData}. */
export interface HistogramOptions {
  /**
   * How the bin width is chosen.
   * @default "freedman-diaconis"
   */
  readonly rule?: BinRule;
  /**
   * A bin width in the data's units (instead of a rule); with a measurement
   * step it is made a whole number of steps, and the note says so.
   * @default undefined (the rule decides)
   */
  readonly width?: number;
  /**
   * A number of bins (instead of a rule); with a measurement step the width
   * is a whole number of steps, so the count can differ slightly.
   * @default undefined (the rule decides)
   */
  readonly bins?: number;
  /**
   * The measurement step the values sit on; `null` for none.
   * @default found from the values (`measurement_step.ts`)
   */
  readonly step?: number | null;
  /**
   * Upper limit on the number of bins.
   * @default 200
   */
  readonly maxBins?: number;
  /**
   * Number of points on the fitted normal curve.
   * @default 121
   */
  readonly curvePoints?: number;
}

/** Every option name of {@linkcode HistogramOptions}, for the check of an options object. */
export const HISTOGRAM_OPTION_NAMES: readonly string[] = optionNames<HistogramOptions>({
  rule: true,
  width: true,
  bins: true,
  step: true,
  maxBins: true,
  curvePoints: true,
});

/** A histogram and its fitted normal curve, as frozen plain data. */
export interface HistogramData {
  /** Number of values. */
  readonly n: number;
  /** The rule that set the width (after any fallback), or `"width"` / `"bins"` when asked for. */
  readonly rule: BinRule | "width" | "bins";
  /** The measurement step the bins follow, or `null`. */
  readonly step: number | null;
  /** The rule and its source, in words, with any fallback explained. */
  readonly ruleNote: string;
  /** Width of every bin. */
  readonly binWidth: number;
  /** k + 1 bin edges, ascending. */
  readonly edges: readonly number[];
  /** k counts. */
  readonly counts: readonly number[];
  /** Sample mean of the fitted normal. */
  readonly mean: number;
  /** Sample standard deviation (divisor n − 1) of the fitted normal. */
  readonly sd: number;
  /** Curve abscissae. */
  readonly curveX: readonly number[];
  /** Curve ordinates in counts per bin: n · binWidth · φ((x − mean)/sd)/sd. */
  readonly curveY: readonly number[];
}

/** Type-7 quantile at probability p, from the two order statistics around it. */
export function _quantile7(at: (rank: number) => number, n: number, p: number): number {
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const v = at(lo + 1);
  if (h === lo) return v;
  return v + (h - lo) * (at(lo + 2) - v);
}

/** The interquartile range (type 7) of data in any order, by selection. */
function _iqrBySelection(data: Float64Array): number {
  const n = data.length;
  const ranks = new Set<number>();
  for (const p of [0.25, 0.75]) {
    const lo = Math.floor((n - 1) * p);
    ranks.add(lo + 1);
    if (lo + 2 <= n) ranks.add(lo + 2);
  }
  const wanted = [...ranks].sort((a, b) => a - b);
  const got = selectRanks(data, wanted).value;
  const at = (r: number) => got[wanted.indexOf(r)];
  return _quantile7(at, n, 0.75) - _quantile7(at, n, 0.25);
}

/**
 * Bin a sample and fit the normal curve to it.
 *
 * @param x the sample (finite numbers, at least 2, not all equal)
 * @param options rule, bin cap, curve resolution
 * @example
 * ```ts
 * import { histogramData } from "@plumbline/plumbline";
 * // whole numbers: bins of whole width, edges at half-units
 * const h = histogramData([1, 2, 2, 3, 3, 3, 4, 4, 5, 9]);
 * const total = h.counts.reduce((s, c) => s + c, 0);
 * if (total !== 10 || h.step !== 1 || h.binWidth % 1 !== 0 || h.edges[0] !== 0.5) {
 *   throw new Error("bins");
 * }
 * ```
 */
export function histogramData(
  x: ArrayLike<number>,
  options: HistogramOptions | null = {},
): HistogramData {
  options = checkOptions(options, HISTOGRAM_OPTION_NAMES, "histogramData");
  const what = "a histogram";
  checkSize(x.length, 2, Infinity, what);
  const data = finiteCopy(x, what);
  const n = data.length;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    if (data[i] < min) min = data[i];
    if (data[i] > max) max = data[i];
  }
  checkNotConstant(Float64Array.of(min, max), what, n);
  checkBinRequest(options);
  // One sorted copy at most, made only when the step or the largest tie needs it.
  let sorted: Float64Array | undefined;
  const sortedOnce = () => sorted ??= sortFloat64(data.slice());
  const step = options.step !== undefined
    ? options.step
    : _measurementStepSorted(sortedOnce()).step;
  const k = rescaleExponent(Math.max(-min, max));
  if (k !== 0) {
    // Bin x·2ᵏ, whose range, squares and density cannot overflow or underflow,
    // and map the lengths back (counts and curve heights do not change).
    const scaled = {
      ...options,
      step: step === null ? null : ldexp(step, k),
      width: options.width === undefined ? undefined : ldexp(options.width, k),
    };
    const h = histogramData(data.map((v) => ldexp(v, k)), scaled);
    checkSpreadFinite(ldexp(h.sd, -k), what);
    const back = (a: readonly number[]) => Object.freeze(a.map((v) => ldexp(v, -k)));
    // Without a grid the outer edges are min and max themselves: keep them
    // exact (a tiny min scaled down and back can underflow to 0).
    const pin = (a: readonly number[]) =>
      h.step === null ? Object.freeze([min, ...back(a).slice(1, -1), max]) : back(a);
    return Object.freeze({
      ...h,
      // A bin spanning values near −1.8e308 to +1.8e308 is wider than the largest double.
      binWidth: Math.min(Number.MAX_VALUE, ldexp(h.binWidth, -k)),
      edges: pin(h.edges),
      step,
      mean: ldexp(h.mean, -k),
      sd: ldexp(h.sd, -k),
      curveX: pin(h.curveX),
    });
  }
  const { mean, sd } = _sampleShape(data, what);
  return _histogramBuild(
    data,
    { min, max, mean, sd, step },
    options,
    () => _iqrBySelection(data),
    () => _largestTie(sortedOnce()),
  );
}

/**
 * {@linkcode histogramData} for a sample whose sorted copy and
 * {@linkcode _sampleShape} the caller already holds: `values` finite and not
 * constant, in their original order, and `sorted` the same values ascending.
 * Gives the same result as `histogramData(values, options)` without copying
 * the sample, summing it or selecting the quartiles again.
 */
export function _histogramDataSorted(
  values: Float64Array,
  sorted: Float64Array,
  shape: _Shape,
  options: HistogramOptions = {},
): HistogramData {
  const what = "a histogram";
  checkSize(values.length, 2, Infinity, what);
  const n = sorted.length;
  const min = sorted[0];
  const max = sorted[n - 1];
  checkNotConstant(Float64Array.of(min, max), what, n);
  checkBinRequest(options);
  const step = options.step !== undefined ? options.step : _measurementStepSorted(sorted).step;
  if (rescaleExponent(Math.max(-min, max)) !== 0) {
    return histogramData(values, { ...options, step });
  }
  const at = (rank: number) => sorted[rank - 1];
  return _histogramBuild(
    values,
    { min, max, mean: shape.mean, sd: shape.sd, step },
    options,
    () => _quantile7(at, n, 0.75) - _quantile7(at, n, 0.25),
    () => _largestTie(sorted),
  );
}

/** The largest share of a sorted sample that sits at one value. */
function _largestTie(sorted: Float64Array): number {
  let longest = 1;
  let run = 1;
  for (let i = 1; i < sorted.length; i++) {
    run = sorted[i] === sorted[i - 1] ? run + 1 : 1;
    if (run > longest) longest = run;
  }
  return longest / sorted.length;
}

/** The histogram of finite, non-constant data with moderate magnitudes (see histogramData). */
function _histogramBuild(
  data: Float64Array,
  summary: { min: number; max: number; mean: number; sd: number; step: number | null },
  options: HistogramOptions,
  interquartile: () => number,
  largestTie: () => number,
): HistogramData {
  const n = data.length;
  const { min, max, mean, sd, step } = summary;
  const layout = _histogramLayout(n, min, max, sd, options, interquartile, step, largestTie);
  const { k, edges, width } = layout;
  const first = edges[0];
  const counts: number[] = new Array(k).fill(0);
  for (let i = 0; i < n; i++) {
    let b = Math.floor((data[i] - first) / width);
    if (b >= k) b = k - 1;
    if (b < 0) b = 0;
    // guard against rounding at an interior edge: place by the stored edges
    if (b > 0 && data[i] < edges[b]) b--;
    else if (b < k - 1 && data[i] >= edges[b + 1]) b++;
    counts[b]++;
  }
  return _histogramFinish(layout, counts, n, mean, sd);
}
