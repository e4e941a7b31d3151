/**
 * The full screening of one sample held in memory: moments, every normality
 * test that applies at this n, the QQ data with its envelope, the histogram,
 * and the reading. Plain data, computed once per chain and cached there.
 * This file validates the values and answers from one sorted copy; the
 * screening is put together from those answers by `screenFromAnswers`
 * (`screening.ts`), as for a column scanned through SQL.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { selectFromSorted } from "../numeric/select.ts";
import { sortedCopy } from "../numeric/sort.ts";
import { checkFinite, checkSize } from "../stats/_input.ts";
import { prepareSample } from "../stats/battery.ts";
import { _histogramDataSorted } from "../stats/histogram_data.ts";
import { _sampleShape } from "../stats/moments.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import type { Analysis, SampleOrigin } from "../results/analysis.ts";
import { screenFromAnswers } from "./screening.ts";
import { cardBundle, cardCharts } from "../render/card.ts";
import type { MimeBundle } from "../results/display.ts";

/** Options for {@linkcode analyse}. */
export interface AnalyseOptions {
  /**
   * QQ envelope options (level, pointwise or simultaneous, thinning).
   * @default {}
   */
  readonly qq?: QqOptions;
  /**
   * Seed for the Shapiro–Wilk subsample when n > 5000.
   * @default 1
   */
  readonly seed?: number;
  /**
   * An envelope to draw in place of the independent-sample one, in the
   * values' own units, at the QQ plot's ranks (1-based): e.g. the simulated
   * envelope of a model's studentised residuals.
   * @default the envelope of `qq`
   */
  readonly envelope?: (ranks: readonly number[]) => {
    readonly lower: readonly number[];
    readonly upper: readonly number[];
    readonly method: string;
  };
  /**
   * The measurement step of the data the values come from, when known
   * (residuals inherit their data's step); `null` for none.
   * @default found from the values
   */
  readonly step?: number | null;
  /**
   * The row label of the value at a 0-based position, asked only for the QQ
   * points drawn (at most `qq.maxPoints`), so that no label is built for the
   * other values and the few the reading names; used in place of `origin.rows`.
   * @default `origin.rows[position]`, or the position itself
   */
  readonly rowLabel?: (position: number) => number;
}

/** The smallest sample plumbline analyses: moments need 4 values. */
export const ANALYSE_MIN_N = 4;

/** The name input errors give, as `moments()` would (the first step of the analysis). */
const _MOMENTS = "the skewness and kurtosis summary";

/**
 * Screen one sample for normality: every test, the QQ data, the histogram
 * and the reading.
 *
 * For n > 5000, Shapiro–Wilk (whose p-value approximation is calibrated up
 * to n = 5000, Royston 1995) runs on a seeded random subsample of 5000
 * values, and says so in its warnings and in the reading; every other test
 * uses all values.
 *
 * @param values the sample (finite numbers, at least 4, not all equal)
 * @param origin where the values came from, for labels and counts
 * @param options QQ options and the subsample seed
 *
 * @example
 * ```ts
 * import { analyse } from "./analysis.ts";
 * const a = analyse(new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1]), {
 *   label: "fill", column: "fill", missingDropped: 0, textDropped: 0,
 * });
 * if (a.primary.test !== "Shapiro–Wilk" || a.n !== 10) throw new Error("analysis");
 * ```
 */
export function analyse(
  values: Float64Array,
  origin: SampleOrigin,
  options: AnalyseOptions = {},
): Analysis {
  const n = values.length;
  // Validate once, with the messages the moments summary gives, then share
  // the work: one summary of the values in their own order (moments, every
  // test, QQ line, histogram), one radix-sorted copy (every order-statistic
  // test, the QQ points, the quartiles, the reading), one scan for ties and
  // one pass over Φ (Anderson–Darling and Lilliefors).
  checkSize(n, ANALYSE_MIN_N, Number.POSITIVE_INFINITY, _MOMENTS);
  checkFinite(values, _MOMENTS);
  const shape = _sampleShape(values, _MOMENTS);
  const sorted = sortedCopy(values);
  return screenFromAnswers(
    {
      n,
      shape,
      orderStatistics: (ranks) => selectFromSorted(values, sorted, ranks),
      histogram: () =>
        _histogramDataSorted(
          values,
          sorted,
          shape,
          options.step !== undefined ? { step: options.step } : {},
        ),
      values: { every: prepareSample(values, sorted, shape), seed: options.seed ?? 1 },
    },
    origin,
    options,
  );
}

/**
 * Refuse to screen fewer than {@linkcode ANALYSE_MIN_N} values, saying what
 * was left out.
 *
 * @param label what is screened
 * @param n values left
 * @param missing missing cells left out
 * @param text non-numeric cells left out
 * @throws {PlumbError} always, `"too-few"`
 */
export function refuseTooFew(label: string, n: number, missing: number, text: number): never {
  throw new PlumbError(
    "too-few",
    `Cannot screen ${label}: ${n} value${n === 1 ? "" : "s"} after leaving out ` +
      `${missing} missing and ${text} non-numeric cells, and at least ${ANALYSE_MIN_N} are needed`,
  );
}

/**
 * Refuse values that are all equal, naming what is screened, how many values
 * there are and the value (the statistics' own message would name the first
 * summary that needs a spread, not the column).
 *
 * @param label what is screened
 * @param values the values left
 * @throws {PlumbError} `"constant"` when every value is the same
 */
export function refuseConstant(label: string, values: Float64Array): void {
  const first = values[0];
  for (let i = 1; i < values.length; i++) if (values[i] !== first) return;
  throw new PlumbError(
    "constant",
    `Cannot screen ${label}: all ${values.length} values are ${first}, and values with no ` +
      `spread have no shape to test; check the column, its units or the rows chosen`,
    { value: first, n: values.length },
  );
}

/**
 * Refuse values too few or all equal to screen (see {@linkcode refuseTooFew}
 * and {@linkcode refuseConstant}).
 *
 * @param label what is screened
 * @param values the values left
 * @param missing missing cells left out
 * @param text non-numeric cells left out
 */
export function checkScreenable(
  label: string,
  values: Float64Array,
  missing: number,
  text: number,
): void {
  if (values.length < ANALYSE_MIN_N) refuseTooFew(label, values.length, missing, text);
  refuseConstant(label, values);
}

/**
 * The card of an analysis: its QQ plot and histogram rendered, then the
 * card's bundle (`lib/render/card.ts`).
 *
 * @param a the analysis
 * @param label the name the charts carry
 */
export async function cardOf(a: Analysis, label: string): Promise<MimeBundle> {
  return cardBundle(a, await cardCharts(a, label));
}
