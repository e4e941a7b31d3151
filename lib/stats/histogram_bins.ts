/**
 * Where a histogram's bins go: a width from a named rule, from the user, or
 * from a number of bins asked for, made a whole multiple of the measurement
 * step with the edges half a step off the grid, so that every bin holds the
 * same number of recorded values and none sits on an edge.
 *
 * Without that, data recorded to 0.1 binned at width 0.118 put two grid
 * values in some bins and one in others, and the bars alternate in height
 * (a false spike); whole numbers binned at 0.684 leave empty bins between
 * full ones. With a step h, the width is w = max(1, round(w₀/h))·h and the
 * first edge is min − h/2 (common practice for discrete data, e.g. bins
 * centred on the integers).
 *
 * Width rules (as in `histogram_data.ts`): Freedman & Diaconis (1981),
 * Scott (1979), Sturges (1926).
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** A bin-width rule. */
export type BinRule = "freedman-diaconis" | "scott" | "sturges";

/** What the layout needs to know about the sample. */
export interface BinInput {
  /** Number of values. */
  readonly n: number;
  /** Smallest and largest value. */
  readonly min: number;
  readonly max: number;
  /** Sample standard deviation. */
  readonly sd: number;
  /** Interquartile range (only read by the Freedman–Diaconis rule). */
  readonly iqr: () => number;
  /**
   * The largest share of the values that sit at one value (only read by the
   * Freedman–Diaconis rule); absent where it is not known.
   */
  readonly largestTie?: () => number;
  /** The measurement step, or `null`. */
  readonly step: number | null;
}

/** What the user may ask for. */
export interface BinRequest {
  /** The width rule. */
  readonly rule?: BinRule;
  /** A bin width. */
  readonly width?: number;
  /** A number of bins. */
  readonly bins?: number;
  /** Upper limit on the number of bins. */
  readonly maxBins?: number;
}

/** The bins, as plain data. */
export interface BinLayout {
  /** The rule that set the width (after any fallback), or `"width"` / `"bins"` when asked for. */
  readonly rule: BinRule | "width" | "bins";
  /** How the width was chosen, in words, with its source and any adjustment. */
  readonly note: string;
  /** Width of every bin. */
  readonly width: number;
  /** k + 1 edges, ascending; the first at or below min, the last at or above max. */
  readonly edges: readonly number[];
}

/** The share of the values at one value from which the Freedman–Diaconis rule gives way to Scott's. */
export const PILE_UP_SHARE = 0.25;

const _RULES: readonly BinRule[] = ["freedman-diaconis", "scott", "sturges"];

function _fmt(v: number): string {
  return String(Number(v.toPrecision(6)));
}

/** Check the user's request, with messages that say what to pass instead. */
export function checkBinRequest(r: BinRequest): void {
  if (r.width !== undefined && r.bins !== undefined) {
    throw new PlumbError(
      "bad-option",
      `Cannot use both width = ${r.width} and bins = ${r.bins}: pass one of them`,
    );
  }
  if (r.width !== undefined && !(typeof r.width === "number" && r.width > 0 && isFinite(r.width))) {
    throw new PlumbError(
      "bad-option",
      `Cannot use a bin width of ${
        String(r.width)
      }: pass a positive finite number in the data's units`,
    );
  }
  if (r.bins !== undefined && !(Number.isInteger(r.bins) && r.bins >= 1 && r.bins <= 10000)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${String(r.bins)} bins: pass a whole number from 1 to 10000`,
    );
  }
  if (r.maxBins !== undefined && !(Number.isInteger(r.maxBins) && r.maxBins >= 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use maxBins = ${String(r.maxBins)}: use a whole number of at least 1`,
    );
  }
  if (r.rule !== undefined && !_RULES.includes(r.rule)) {
    throw new PlumbError(
      "bad-option",
      `Cannot bin with rule ${
        JSON.stringify(r.rule)
      }: use "freedman-diaconis", "scott" or "sturges"`,
    );
  }
}

/**
 * Lay out a histogram's bins.
 *
 * @param s the sample's size, range, spread and step
 * @param r the rule, width or number of bins asked for
 * @throws {PlumbError} `"bad-option"` for a bad width, number of bins, cap or rule
 *
 * @example
 * ```ts
 * import { histogramBins } from "./histogram_bins.ts";
 * // whole numbers from 3 to 17: bins of whole width, edges at half-units
 * const b = histogramBins({ n: 200, min: 3, max: 17, sd: 2.5, iqr: () => 3, step: 1 }, {});
 * if (b.width !== 1 || b.edges[0] !== 2.5 || b.edges[b.edges.length - 1] !== 17.5) throw new Error("bins");
 * ```
 */
export function histogramBins(s: BinInput, r: BinRequest): BinLayout {
  checkBinRequest(r);
  const maxBins = r.maxBins ?? 200;
  const range = s.max - s.min;
  const cube = Math.cbrt(s.n);
  let rule: BinLayout["rule"];
  let note: string;
  let width: number; // the width before the step is taken into account
  if (r.width !== undefined) {
    rule = "width";
    width = r.width;
    note = `bin width ${_fmt(r.width)} as asked`;
  } else if (r.bins !== undefined) {
    rule = "bins";
    width = range / r.bins;
    note = `${r.bins} bins as asked`;
  } else {
    rule = r.rule ?? "freedman-diaconis";
    const iqr = rule === "freedman-diaconis" ? s.iqr() : 0;
    // A value holding a quarter of the sample or more puts a quartile inside
    // that pile-up, and the IQR then measures the pile-up, not the spread: 372
    // zeros among 506 values gave 198 bins in which the other values vanished
    // (plumbline's own rule; the sd-based width does not see the pile-up).
    const tie = rule === "freedman-diaconis" && iqr > 0 && s.largestTie ? s.largestTie() : 0;
    if (rule === "freedman-diaconis" && iqr > 0 && tie < PILE_UP_SHARE) {
      width = (2 * iqr) / cube;
      note = "Freedman–Diaconis bin width 2·IQR·n^(−1/3) (Freedman & Diaconis 1981)";
    } else if (rule === "sturges") {
      width = range / (Math.ceil(Math.log2(s.n)) + 1);
      note = "Sturges's ⌈log₂ n⌉ + 1 bins (Sturges 1926)";
    } else {
      const fallback = rule === "freedman-diaconis";
      rule = "scott";
      width = (3.49 * s.sd) / cube;
      note = "Scott bin width 3.49·sd·n^(−1/3) (Scott 1979)" +
        (!fallback
          ? ""
          : iqr > 0
          ? `, because ${
            Math.round(100 * tie)
          }% of the values sit at one value and the interquartile range measures that pile-up, not the spread`
          : ", because the interquartile range is 0 and the Freedman–Diaconis width would be 0");
    }
  }
  if (!(width > 0)) width = range > 0 ? range : 1;
  const step = s.step;
  const cells = step !== null && step > 0 ? Math.round(range / step) + 1 : NaN;
  // The grid is used only where it is a grid in doubles: a countable number of
  // cells, and half a step that moves the ends (not so for 1e-300 beside 1e308).
  if (
    step !== null && cells <= 2 ** 53 && s.min - step / 2 < s.min &&
    Number.isFinite(s.max + step / 2) && s.max + step / 2 > s.max
  ) {
    // Enough bins to cover the grid from min − h/2 to max + h/2, within the cap.
    let m = Math.max(1, Math.round(width / step), Math.ceil(cells / maxBins));
    while (Math.ceil(cells / m) > maxBins) m++;
    const w = m * step;
    if (Math.abs(w - width) > 1e-9 * width && rule === "width") {
      note += `, made ${_fmt(w)}: a whole number (${m}) of measurement steps of ${_fmt(step)}`;
    } else {
      note += `; width ${m === 1 ? "one measurement step" : `${m} measurement steps`} of ${
        _fmt(step)
      }, edges half a step off the recorded values`;
    }
    const k = Math.ceil(cells / m);
    const first = s.min - step / 2;
    const edges = Array.from({ length: k + 1 }, (_, j) => first + j * w);
    return Object.freeze({ rule, note, width: w, edges: Object.freeze(edges) });
  }
  let k: number;
  let w: number;
  if (rule === "width") {
    k = Math.max(1, Math.ceil(range / width));
    if (k > maxBins) {
      throw new PlumbError(
        "bad-option",
        `Cannot draw bins of width ${_fmt(width)} over a range of ${
          _fmt(range)
        }: that makes ${k} ` +
          `bins, more than maxBins = ${maxBins}; pass a wider width or a larger maxBins`,
      );
    }
    w = width;
  } else {
    k = Math.max(1, Math.ceil(range / width));
    if (k > maxBins) {
      k = maxBins;
      note += `, capped at ${maxBins} bins`;
    }
    w = range / k;
  }
  const edges = Array.from(
    { length: k + 1 },
    (_, j) => (j === k && rule !== "width" ? s.max : s.min + j * w),
  );
  return Object.freeze({ rule, note, width: w, edges: Object.freeze(edges) });
}
