/**
 * The bins of a histogram and its fitted normal curve, apart from counting
 * the values: shared by the in-memory histogram (`histogram_data.ts`) and
 * the SQL engine's, which counts elsewhere.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalPdf } from "../numeric/normal.ts";
import type { BinRule, HistogramData, HistogramOptions } from "./histogram_data.ts";

/** The bins of a histogram before counting: the rule used, k, the width and the edges. */
export interface _HistogramLayout {
  readonly rule: BinRule;
  readonly ruleNote: string;
  readonly k: number;
  readonly width: number;
  readonly edges: readonly number[];
  readonly min: number;
  readonly max: number;
  readonly curvePoints: number;
}

/**
 * Choose the bins for n values in [min, max] with standard deviation `sd`;
 * `interquartile` is called only by the Freedman–Diaconis rule.
 */
export function _histogramLayout(
  n: number,
  min: number,
  max: number,
  sd: number,
  options: HistogramOptions,
  interquartile: () => number,
): _HistogramLayout {
  const maxBins = options.maxBins ?? 200;
  const curvePoints = options.curvePoints ?? 121;
  if (!Number.isInteger(maxBins) || maxBins < 1) {
    throw new PlumbError(
      "bad-option",
      `Cannot use maxBins = ${maxBins}: use a whole number of at least 1`,
    );
  }
  if (!Number.isInteger(curvePoints) || curvePoints < 2) {
    throw new PlumbError(
      "bad-option",
      `Cannot use curvePoints = ${curvePoints}: use a whole number of at least 2`,
    );
  }
  let rule: BinRule = options.rule ?? "freedman-diaconis";
  const range = max - min;
  const cube = Math.cbrt(n);
  let k: number;
  let ruleNote: string;
  if (rule === "freedman-diaconis") {
    const iqr = interquartile();
    if (iqr > 0) {
      k = Math.ceil(range / ((2 * iqr) / cube));
      ruleNote = "Freedman–Diaconis bin width 2·IQR·n^(−1/3) (Freedman & Diaconis 1981)";
    } else {
      rule = "scott";
      k = Math.ceil(range / ((3.49 * sd) / cube));
      ruleNote = "Scott bin width 3.49·sd·n^(−1/3) (Scott 1979), because the interquartile " +
        "range is 0 and the Freedman–Diaconis width would be 0";
    }
  } else if (rule === "scott") {
    k = Math.ceil(range / ((3.49 * sd) / cube));
    ruleNote = "Scott bin width 3.49·sd·n^(−1/3) (Scott 1979)";
  } else if (rule === "sturges") {
    k = Math.ceil(Math.log2(n)) + 1;
    ruleNote = "Sturges's ⌈log₂ n⌉ + 1 bins (Sturges 1926)";
  } else {
    throw new PlumbError(
      "bad-option",
      `Cannot bin with rule ${JSON.stringify(rule)}: use "freedman-diaconis", "scott" or "sturges"`,
    );
  }
  if (k > maxBins) {
    k = maxBins;
    ruleNote += `, capped at ${maxBins} bins`;
  }
  k = Math.max(1, k);
  const width = range / k;
  const edges: number[] = new Array(k + 1);
  for (let j = 0; j <= k; j++) edges[j] = j === k ? max : min + j * width;
  return { rule, ruleNote, k, width, edges, min, max, curvePoints };
}

/** The frozen histogram from its layout, the bin counts, and the fitted normal's mean and sd. */
export function _histogramFinish(
  layout: _HistogramLayout,
  counts: readonly number[],
  n: number,
  mean: number,
  sd: number,
): HistogramData {
  const { min, max, width, curvePoints } = layout;
  const range = max - min;
  const curveX: number[] = new Array(curvePoints);
  const curveY: number[] = new Array(curvePoints);
  const scale = (n * width) / sd;
  for (let j = 0; j < curvePoints; j++) {
    const t = j === curvePoints - 1 ? max : min + (j * range) / (curvePoints - 1);
    curveX[j] = t;
    curveY[j] = scale * normalPdf((t - mean) / sd);
  }
  return Object.freeze({
    n,
    rule: layout.rule,
    ruleNote: layout.ruleNote,
    binWidth: width,
    edges: Object.freeze([...layout.edges]),
    counts: Object.freeze([...counts]),
    mean,
    sd,
    curveX: Object.freeze(curveX),
    curveY: Object.freeze(curveY),
  });
}
