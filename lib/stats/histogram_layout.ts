/**
 * The bins of a histogram and its fitted normal curve, apart from counting
 * the values: shared by the in-memory histogram (`histogram_data.ts`) and
 * the SQL engine's, which counts elsewhere. The bins themselves (rules,
 * widths that follow the measurement step, edges at half-steps) are chosen
 * in `histogram_bins.ts`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { normalPdf } from "../numeric/normal.ts";
import { type BinLayout, histogramBins } from "./histogram_bins.ts";
import type { HistogramData, HistogramOptions } from "./histogram_data.ts";

/** The bins of a histogram before counting: the rule used, k, the width and the edges. */
export interface _HistogramLayout {
  readonly rule: BinLayout["rule"];
  readonly ruleNote: string;
  readonly k: number;
  readonly width: number;
  readonly edges: readonly number[];
  readonly step: number | null;
  readonly curvePoints: number;
}

/**
 * Choose the bins for n values in [min, max] with standard deviation `sd`;
 * `interquartile` is called only by the Freedman–Diaconis rule; `step` is
 * the measurement step the values sit on (`null` when unknown or none);
 * `largestTie`, the largest share of values at one value, where known.
 */
export function _histogramLayout(
  n: number,
  min: number,
  max: number,
  sd: number,
  options: HistogramOptions,
  interquartile: () => number,
  step: number | null = null,
  largestTie?: () => number,
): _HistogramLayout {
  const curvePoints = options.curvePoints ?? 121;
  if (!Number.isInteger(curvePoints) || curvePoints < 2) {
    throw new PlumbError(
      "bad-option",
      `Cannot use curvePoints = ${curvePoints}: use a whole number of at least 2`,
    );
  }
  const bins = histogramBins(
    { n, min, max, sd, iqr: interquartile, step, ...(largestTie ? { largestTie } : {}) },
    options,
  );
  return {
    rule: bins.rule,
    ruleNote: bins.note,
    k: bins.edges.length - 1,
    width: bins.width,
    edges: bins.edges,
    step,
    curvePoints,
  };
}

/** The frozen histogram from its layout, the bin counts, and the fitted normal's mean and sd. */
export function _histogramFinish(
  layout: _HistogramLayout,
  counts: readonly number[],
  n: number,
  mean: number,
  sd: number,
): HistogramData {
  const { edges, k, width, curvePoints } = layout;
  const lo = edges[0];
  const span = edges[k] - lo;
  const curveX: number[] = new Array(curvePoints);
  const curveY: number[] = new Array(curvePoints);
  const scale = (n * width) / sd;
  for (let j = 0; j < curvePoints; j++) {
    const t = j === curvePoints - 1 ? edges[k] : lo + (j * span) / (curvePoints - 1);
    curveX[j] = t;
    curveY[j] = scale * normalPdf((t - mean) / sd);
  }
  return Object.freeze({
    n,
    rule: layout.rule,
    ruleNote: layout.ruleNote,
    step: layout.step,
    binWidth: width,
    edges: Object.freeze([...edges]),
    counts: Object.freeze([...counts]),
    mean,
    sd,
    curveX: Object.freeze(curveX),
    curveY: Object.freeze(curveY),
  });
}
