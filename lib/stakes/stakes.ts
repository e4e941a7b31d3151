/**
 * What the departure from normality changes downstream: the quantities an
 * analyst computes next — a central range, the fraction outside
 * specification limits, capability indices, the mean's interval — each the
 * normal-theory way and a way that does not assume normality, side by side,
 * with a judgement of whether the difference matters.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { Reexpression } from "../reexpress/reexpression.ts";
import { rankReexpressions } from "../reexpress/search.ts";
import { sortedSample } from "../stats/_input.ts";
import { type BcaInterval, bootstrapMean } from "../stats/bootstrap_bca.ts";
import { _limitsOption } from "../stats/capability.ts";
import { type TInterval, tInterval } from "../stats/mean_interval.ts";
import { _sampleShape } from "../stats/moments.ts";
import { _levelOption } from "../stats/quantile_interval.ts";
import { checkOptions } from "../results/options.ts";
import { _judge, type StakesJudgement } from "./_judge.ts";
import { _stakesJSON } from "./_json.ts";
import { type _ScaleModel, _scaleModel } from "./_model.ts";
import { _centralRange, type CentralRange } from "./central_range.ts";
import { _specification, type CapabilityStakes, type OutsideFractions } from "./specification.ts";

/** Options for {@linkcode stakes}. */
export interface StakesOptions {
  /**
   * Share of the population the central range should hold.
   * @default 0.95
   */
  readonly coverage?: number;
  /**
   * Lower specification limit.
   * @default undefined (none)
   */
  readonly lower?: number;
  /**
   * Upper specification limit.
   * @default undefined (none)
   */
  readonly upper?: number;
  /**
   * Confidence level of the mean's intervals, the capability intervals and
   * the observed fraction's interval.
   * @default 0.95
   */
  readonly level?: number;
  /**
   * Confidence level of the intervals around the rank-based limits.
   * @default 0.9
   */
  readonly rankLevel?: number;
  /**
   * The re-expression for the re-expressed figures: a {@linkcode Reexpression},
   * `"best"` (the candidate search's choice; none when it keeps the data as
   * measured) or `"none"`.
   * @default "best"
   */
  readonly reexpression?: Reexpression | "best" | "none";
  /**
   * Bootstrap resamples for the mean. Left out, 2000, reduced for large
   * samples so that resamples × n stays near 1e8 (never below 200).
   * @default 2000 (see above)
   */
  readonly resamples?: number;
  /**
   * Seed of the bootstrap.
   * @default 1
   */
  readonly seed?: number;
}

/** The mean two ways: plain, frozen data. */
export interface MeanStakes {
  /** The sample mean. */
  readonly estimate: number;
  /** Confidence level. */
  readonly level: number;
  /** The t interval. */
  readonly t: readonly [number, number];
  /** The BCa bootstrap interval (`null` ends only for degenerate data). */
  readonly bootstrap: readonly [number | null, number | null];
  /** The t computation. */
  readonly tDetail: TInterval;
  /** The bootstrap computation. */
  readonly bootstrapDetail: BcaInterval;
  /** Seed of the bootstrap. */
  readonly seed: number;
  /** About the bootstrap (resamples reduced, extreme replicates). */
  readonly notes: readonly string[];
}

/** Everything {@linkcode stakes} computes: plain, frozen data with `toJSON()`. */
export interface Stakes {
  /** Number of values. */
  readonly n: number;
  /** The re-expression behind the re-expressed figures, or `null`. */
  readonly reexpression: Reexpression | null;
  /** Why there is no re-expression, or how it was chosen. */
  readonly reexpressionNote: string;
  /** The central range three ways. */
  readonly range: CentralRange;
  /** Fractions outside the limits, when limits were given. */
  readonly outside: OutsideFractions | null;
  /** Capability indices, when limits were given. */
  readonly capability: CapabilityStakes | null;
  /** The mean's interval two ways. */
  readonly mean: MeanStakes;
  /** Whether the differences matter, per quantity, with reasons. */
  readonly judgement: StakesJudgement;
  /** Cautions for anyone acting on these figures. */
  readonly cautions: readonly string[];
  /** The contract's plain-data form (see the module README). */
  toJSON(): Record<string, unknown>;
}

/** Every option {@linkcode stakes} knows, for the options check. */
export const STAKES_OPTIONS: readonly string[] = Object.freeze([
  "coverage",
  "lower",
  "upper",
  "level",
  "rankLevel",
  "reexpression",
  "resamples",
  "seed",
]);

/** Bootstrap work budget: resamples × n. */
const _BOOTSTRAP_BUDGET = 1e8;
/** The fewest resamples the budget may leave. */
const _BOOTSTRAP_FLOOR = 200;

/** The caution every stakes result carries. */
export const STAKES_CAUTION: string =
  "Reference ranges and release decisions follow your organisation's procedures and the " +
  "applicable standards; these figures inform such a decision, they do not make it";

function _chooseModel(
  v: Float64Array,
  option: StakesOptions["reexpression"],
): { model: _ScaleModel | null; note: string } {
  if (option === "none") return { model: null, note: "No re-expression was asked for" };
  let r: Reexpression;
  if (option === undefined || option === "best") {
    // Only the choice is needed: the ranking, without re-testing every candidate.
    r = rankReexpressions(v).chosen.reexpression;
    if (r.kind === "identity") {
      return {
        model: null,
        note:
          "The candidate search keeps the data as measured, so there are no re-expressed figures",
      };
    }
  } else if (typeof option === "object" && option !== null && "kind" in option) {
    r = option;
  } else {
    throw new PlumbError(
      "bad-option",
      `Cannot use reexpression ${JSON.stringify(option)}: pass "best", "none" or a re-expression ` +
        `(e.g. reexpression("log"))`,
      { reexpression: option },
    );
  }
  if (r.kind === "identity") {
    return {
      model: null,
      note:
        "The re-expression chosen keeps the data as measured, so there are no re-expressed figures",
    };
  }
  const { model, note } = _scaleModel(v, r);
  return { model, note: note ?? `Re-expressed figures use ${r.label}` };
}

/**
 * The stakes of a sample: central range, specification fractions and
 * capability (when limits are given), and the mean's interval, each the
 * normal-theory way and a way that does not assume normality.
 *
 * @param x finite values, at least 3, not all equal
 * @param options coverage, limits, levels, re-expression, bootstrap settings
 * @example
 * ```ts
 * import { stakes } from "./stakes.ts";
 * const x = [0.8, 1.1, 1.2, 1.5, 1.7, 2.0, 2.2, 2.9, 3.4, 4.8, 6.9, 12.5];
 * const s = stakes(x, { upper: 10 });
 * if (s.range.normal[0] >= 0) throw new Error("the normal range of skewed data goes below 0");
 * if (s.outside!.observed !== 1 / 12) throw new Error("one value above 10");
 * ```
 */
export function stakes(x: ArrayLike<number>, options: StakesOptions = {}): Stakes {
  const what = "the stakes view";
  options = checkOptions(options, STAKES_OPTIONS, "stakes");
  const coverage = options.coverage ?? 0.95;
  if (typeof coverage !== "number" || !(coverage > 0 && coverage < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} with coverage ${coverage}: the share of the population the range ` +
        "should hold must lie strictly between 0 and 1, e.g. 0.95",
      { coverage },
    );
  }
  const level = _levelOption(options.level ?? 0.95, what, "0.95");
  const rankLevel = _levelOption(options.rankLevel ?? 0.9, `${what} (rank intervals)`, "0.9");
  const hasLimits = options.lower !== undefined || options.upper !== undefined;
  const limits = hasLimits ? _limitsOption(options.lower, options.upper, what) : null;
  const sorted = sortedSample(x, what, 3);
  const n = sorted.length;
  const shape = _sampleShape(sorted, what);
  const { model, note } = _chooseModel(sorted, options.reexpression);

  const range = _centralRange(sorted, shape, { coverage, rankLevel, model });
  const spec = limits === null ? null : _specification(sorted, shape, { ...limits, level, model });

  const seed = options.seed ?? 1;
  const budgeted = Math.max(_BOOTSTRAP_FLOOR, Math.floor(_BOOTSTRAP_BUDGET / n));
  const resamples = options.resamples ?? Math.min(2000, budgeted);
  const boot = bootstrapMean(sorted, { level, resamples, seed });
  const t = tInterval(sorted, { level });
  const meanNotes = [...boot.notes];
  if (options.resamples === undefined && resamples < 2000) {
    meanNotes.push(
      `The bootstrap used ${resamples} resamples (not 2000) to bound the work at n = ${n}; ` +
        "at this size its ends carry more resampling noise than any skewness could move them, " +
        "so read the t interval; pass { resamples } to use more",
    );
  }
  const mean: MeanStakes = Object.freeze({
    estimate: shape.mean,
    level,
    t: t.interval,
    bootstrap: boot.interval,
    tDetail: t,
    bootstrapDetail: boot,
    seed,
    notes: Object.freeze(meanNotes),
  });
  const judgement = _judge(range, spec?.outside ?? null, spec?.capability ?? null, mean, n);
  const result = {
    n,
    reexpression: model?.reexpression ?? null,
    reexpressionNote: note,
    range,
    outside: spec?.outside ?? null,
    capability: spec?.capability ?? null,
    mean,
    judgement,
    cautions: Object.freeze([STAKES_CAUTION]),
    toJSON: () => _stakesJSON(result),
  };
  return Object.freeze(result);
}
