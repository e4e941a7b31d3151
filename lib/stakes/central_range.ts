/**
 * The central range (a reference interval) three ways: the normal-theory
 * mean ± z·sd, the same on a re-expressed scale mapped back, and the
 * rank-based limits at ranks p(n + 1) with distribution-free confidence
 * intervals, as laboratory reference-interval practice computes them
 * (CLSI EP28-A3c, 2010, "Defining, Establishing, and Verifying Reference
 * Intervals in the Clinical Laboratory; Approved Guideline — Third
 * Edition", which asks for at least 120 reference values for the
 * non-parametric limits and their 90% confidence intervals — from memory).
 *
 * @module
 */
import { normalQuantile } from "../numeric/normal.ts";
import {
  _quantileIntervalSorted,
  type QuantileInterval,
  quantileRanks,
} from "../stats/quantile_interval.ts";
import { _rankQuantileSorted, quantileRank } from "../stats/rank_quantile.ts";
import { _fromScale, type _ScaleModel } from "./_model.ts";

/** The fewest reference values CLSI EP28-A3c asks for with rank-based limits. */
export const RANK_LIMITS_MIN_N = 120;

/** A flag raised on the central range. */
export interface RangeFlag {
  /** Stable code: `"outside-rank-interval"`, `"below-zero"`. */
  readonly code: "outside-rank-interval" | "below-zero";
  /** Which limit. */
  readonly side: "lower" | "upper";
  /** What it means, in a sentence. */
  readonly message: string;
}

/** The central range three ways: plain, frozen data. */
export interface CentralRange {
  /** The share of the population the range should hold, e.g. 0.95. */
  readonly coverage: number;
  /** mean ± z·sd on the data as measured. */
  readonly normal: readonly [number, number];
  /** mean ± z·sd on the re-expressed scale, mapped back; `null` ends have no preimage. */
  readonly reexpressed: readonly [number | null, number | null] | null;
  /** Rank-based limits at ranks p(n + 1), interpolated. */
  readonly ranks: readonly [number, number];
  /** Distribution-free confidence intervals of the two rank-based limits (`null` ends are open). */
  readonly ranksCi: readonly [
    readonly [number | null, number | null],
    readonly [number | null, number | null],
  ];
  /** The order-statistic ranks behind `ranksCi` (0 and n + 1 mean open). */
  readonly ranksCiRanks: readonly [readonly [number, number], readonly [number, number]];
  /** Exact coverage of each interval for continuous data (≥ `ranksCiLevel`). */
  readonly ranksCiCoverage: readonly [number, number];
  /** Nominal level of `ranksCi`. */
  readonly ranksCiLevel: number;
  /** The normal-theory limit outside the rank-based limit's interval, or below zero. */
  readonly flags: readonly RangeFlag[];
  /** About sample size and open ends. */
  readonly notes: readonly string[];
  /** The data's quantiles at p = 0, 0.01, …, 1 (rank p(n + 1)), for drawing: 101 values at any n. */
  readonly strip: readonly number[];
}

function _g(v: number): string {
  return String(+v.toPrecision(4)).replace("-", "−");
}

/**
 * The central range of an ascending sample.
 *
 * @param sorted the sample, ascending, finite, at least 2 values
 * @param shape its mean and sd (divisor n − 1)
 * @param options coverage, the level of the rank intervals, and the
 *   re-expressed model (or `null`)
 */
export function _centralRange(
  sorted: Float64Array,
  shape: { readonly mean: number; readonly sd: number },
  options: { coverage: number; rankLevel: number; model: _ScaleModel | null },
): CentralRange {
  const { coverage, rankLevel, model } = options;
  const n = sorted.length;
  const pLo = (1 - coverage) / 2;
  const pHi = (1 + coverage) / 2;
  const z = normalQuantile(pHi);
  const normal = [shape.mean - z * shape.sd, shape.mean + z * shape.sd] as const;
  let reexpressed: [number | null, number | null] | null = null;
  if (model !== null) {
    const back = _fromScale([model.mean - z * model.sd, model.mean + z * model.sd], model);
    reexpressed = model.increasing ? [back[0], back[1]] : [back[1], back[0]];
  }
  const ranks = [_rankQuantileSorted(sorted, pLo), _rankQuantileSorted(sorted, pHi)] as const;
  const ci: QuantileInterval[] = [pLo, pHi].map((p) =>
    _quantileIntervalSorted(sorted, quantileRanks(n, p, { level: rankLevel }))
  );
  const flags: RangeFlag[] = [];
  const pct = `${+(rankLevel * 100).toPrecision(6)}%`;
  (["lower", "upper"] as const).forEach((side, j) => {
    const [a, b] = ci[j].interval;
    const v = normal[j];
    if ((a !== null && v < a) || (b !== null && v > b)) {
      flags.push({
        code: "outside-rank-interval",
        side,
        message: `The normal-theory ${side} limit (${_g(v)}) lies outside the ${pct} confidence ` +
          `interval of the rank-based ${side} limit (${a === null ? "open" : _g(a)} to ` +
          `${b === null ? "open" : _g(b)}): the normal model misplaces that tail`,
      });
    }
  });
  if (normal[0] < 0 && sorted[0] >= 0) {
    flags.push({
      code: "below-zero",
      side: "lower",
      message: `The normal-theory lower limit (${_g(normal[0])}) is below zero, which this ` +
        `quantity never reaches in the data (smallest value ${_g(sorted[0])}): the normal ` +
        "model does not fit its lower tail",
    });
  }
  const notes: string[] = [];
  if (n < RANK_LIMITS_MIN_N) {
    notes.push(
      `Rank-based limits from ${n} values: CLSI EP28-A3c (2010) asks for at least ` +
        `${RANK_LIMITS_MIN_N} reference values for them and their ${pct} confidence intervals, ` +
        "so read them as rough",
    );
  }
  if (!quantileRank(n, pLo).inside) {
    const need = Math.ceil(1 / pLo - 1 - 1e-9);
    notes.push(
      `With ${n} values the rank ${_g(pLo * (n + 1))} = p(n + 1) falls outside the sample: the ` +
        `rank-based limits are the sample's extremes, which understate the range; ${need} ` +
        "values are needed",
    );
  }
  if (ci.some((q) => q.interval[0] === null || q.interval[1] === null)) {
    notes.push(
      `A ${pct} confidence interval of a rank-based limit is open on one side (shown as none): ` +
        "there are too few values beyond that limit to bound it",
    );
  }
  if (reexpressed !== null && (reexpressed[0] === null || reexpressed[1] === null)) {
    notes.push(
      `An end of the re-expressed range falls outside what ${model!.reexpression.label} can map ` +
        "back to original units, so it has no value there",
    );
  }
  return Object.freeze({
    coverage,
    normal: Object.freeze(normal),
    reexpressed: reexpressed === null ? null : Object.freeze(reexpressed),
    ranks: Object.freeze(ranks),
    ranksCi: Object.freeze([ci[0].interval, ci[1].interval] as const),
    ranksCiRanks: Object.freeze([ci[0].ranks, ci[1].ranks] as const),
    ranksCiCoverage: Object.freeze([ci[0].coverage, ci[1].coverage] as const),
    ranksCiLevel: rankLevel,
    flags: Object.freeze(flags.map((f) => Object.freeze(f))),
    notes: Object.freeze(notes),
    strip: Object.freeze(
      Array.from({ length: 101 }, (_, i) => _rankQuantileSorted(sorted, i / 100)),
    ),
  });
}
