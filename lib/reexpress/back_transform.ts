/**
 * A mean and confidence interval computed on the re-expressed scale and
 * mapped back to the original units, under the name of what it now is.
 *
 * @module
 */
import jStat from "../_deps/jstat.ts";
import { PlumbError } from "../errors.ts";
import { formatCompact } from "../results/format.ts";
import { checkSize, finiteCopy } from "../stats/_input.ts";
import { _meanSd } from "../stats/moments.ts";
import { applyReexpression, invertReexpression, type Reexpression } from "./reexpression.ts";

/** Options for {@linkcode backTransformMean}. */
export interface BackTransformOptions {
  /**
   * Confidence level of the t interval on the re-expressed scale.
   * @default 0.95
   */
  readonly level?: number;
}

/** A back-transformed estimate and interval: plain, frozen data. */
export interface BackTransformed {
  /** The re-expression used. */
  readonly reexpression: Reexpression;
  /** Number of values. */
  readonly n: number;
  /** The confidence level. */
  readonly level: number;
  /** Mean of the re-expressed values (for censored data the ML estimate). */
  readonly transformedMean: number;
  /** Standard deviation of the re-expressed values (divisor n − 1; for censored data the ML estimate). */
  readonly transformedSd: number;
  /**
   * The quantile the interval uses: Student t with n − 1 degrees of freedom,
   * or, for censored data (a Wald interval from the maximum-likelihood fit),
   * the standard normal quantile.
   */
  readonly tQuantile: number;
  /** The transformed mean mapped back to original units. */
  readonly estimate: number;
  /** What `estimate` is, e.g. `"geometric mean"`, `"median (estimated)"`. */
  readonly estimateName: string;
  /**
   * The interval mapped back, low end first; an end is `null` when it falls
   * outside the range of the re-expression and has no value in original units.
   */
  readonly interval: readonly [number | null, number | null];
  /** What `interval` is for, in words. */
  readonly intervalName: string;
  /** For a log without shift, the ×/÷ factor of the ratio interval; otherwise `null`. */
  readonly ratio: number | null;
  /** Where back-transformed quantities do not mean what they may seem to. */
  readonly cautions: readonly string[];
}

const _g = (v: number): string => formatCompact(v, 4);

/**
 * The mean and its t interval on the re-expressed scale, mapped back.
 *
 * What the result is, by re-expression:
 * - as measured: the arithmetic mean and its t interval;
 * - log without shift: exp(mean ln x), the **geometric mean**, with a **ratio
 *   interval** GM ×/÷ exp(t·s/√n) (Bland & Altman (1996), "Transformations,
 *   means, and confidence intervals", BMJ 312:1079);
 * - log with a shift c: exp(mean ln(x + c)) − c, which depends on c;
 * - reciprocal: 1/mean(1/x), the **harmonic mean**; the interval ends swap;
 * - square root, Box–Cox, Yeo–Johnson: the inverse of the mean, which
 *   estimates the population **median** when the re-expressed values are
 *   symmetric (a monotone map keeps medians, not means).
 *
 * The t quantile comes from jStat's `studentt.inv`, which agrees with
 * scipy.stats.t.ppf to 3e-8 relative (tests/reexpress/back_transform_test.ts):
 * far below the interval's own sampling error.
 *
 * @param x the data in original units, at least 2 values
 * @param r the re-expression (usually a search's chosen one)
 * @param options the confidence level
 * @example
 * ```ts
 * import { backTransformMean } from "@plumbline/plumbline";
 * import { reexpression } from "@plumbline/plumbline";
 * const b = backTransformMean([1, 10, 100], reexpression("log", { base: 10 }));
 * if (Math.abs(b.estimate - 10) > 1e-12 || b.estimateName !== "geometric mean") {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function backTransformMean(
  x: ArrayLike<number>,
  r: Reexpression,
  options: BackTransformOptions = {},
): BackTransformed {
  const what = "a back-transformed mean";
  const level = _levelOption(options.level, what);
  checkSize(x.length, 2, Number.POSITIVE_INFINITY, what);
  const y = applyReexpression(finiteCopy(x, what), r);
  const n = y.length;
  const { mean: m, sd } = _meanSd(y);
  const tq = jStat.studentt.inv(1 - (1 - level) / 2, n - 1) as number;
  return _backTransformed(r, {
    n,
    level,
    mean: m,
    sd,
    quantile: tq,
    half: (tq * sd) / Math.sqrt(n),
  });
}

/** A level option: strictly between 0 and 1 (default 0.95). */
export function _levelOption(level: unknown, what: string): number {
  const l = level ?? 0.95;
  if (typeof l !== "number" || !(l > 0 && l < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute ${what} at level ${l}: the level must lie strictly between 0 and 1, e.g. 0.95`,
      { level: l },
    );
  }
  return l;
}

/**
 * Map a mean and its interval (mean ± half) on the re-expressed scale back,
 * and name what they now are. `extra` cautions come first.
 */
export function _backTransformed(
  r: Reexpression,
  fit: {
    readonly n: number;
    readonly level: number;
    readonly mean: number;
    readonly sd: number;
    readonly quantile: number;
    readonly half: number;
  },
  extra: readonly string[] = [],
): BackTransformed {
  const { n, level, mean: m, sd, quantile: tq, half } = fit;
  const [est, a, b] = invertReexpression([m, m - half, m + half], r);
  const ends = [a, b].map((v) => (Number.isNaN(v) ? null : v));
  const flips = r.kind === "reciprocal";
  const interval = (flips ? [ends[1], ends[0]] : ends) as [number | null, number | null];
  const pct = `${+(level * 100).toPrecision(6)}%`;
  const cautions: string[] = [...extra];
  let estimateName: string;
  let intervalName: string;
  let ratio: number | null = null;
  const medianNote = "A monotone re-expression maps medians to medians but not means to means: " +
    "mapped back, the mean of the re-expressed values estimates the population median " +
    "(when the re-expressed values are symmetric), not the arithmetic mean, and the " +
    "interval is not symmetric around it";
  const unitsNote = "If the arithmetic mean itself is what matters (totals, costs, doses), " +
    "estimate it on the original scale instead; this interval is not for it";
  switch (r.kind) {
    case "identity":
      estimateName = "arithmetic mean";
      intervalName = `${pct} t interval for the mean`;
      break;
    case "log":
      if (r.shift === 0) {
        estimateName = "geometric mean";
        ratio = r.base === 10 ? 10 ** half : Math.exp(half);
        intervalName = `${pct} ratio interval for the geometric mean ` +
          `(geometric mean ×/÷ ${_g(ratio)})`;
        const lnSd = r.base === 10 ? sd * Math.LN10 : sd;
        cautions.push(
          "The geometric mean is not the arithmetic mean: it is smaller, and for " +
            `log-normal data the arithmetic mean is larger by about exp(s²/2) = ` +
            `${_g(Math.exp((lnSd * lnSd) / 2))} (s the sd of ln x); it estimates the ` +
            "population median when ln x is symmetric",
          "Differences on the log scale are ratios in original units: compare groups by the " +
            "ratio of geometric means, not by their difference",
          unitsNote,
        );
      } else {
        estimateName = `geometric mean of (x + ${_g(r.shift)}), minus ${_g(r.shift)}`;
        intervalName = `${pct} interval for that quantity, mapped back`;
        cautions.push(
          `The result depends on the shift (${_g(r.shift)}), which was chosen by a rule, ` +
            "not measured: report it, and check that a different reasonable shift " +
            "does not change the conclusion",
          medianNote,
          unitsNote,
        );
      }
      break;
    case "reciprocal":
      estimateName = "harmonic mean";
      intervalName = `${pct} interval for the harmonic mean (ends swapped: 1/x reverses order)`;
      cautions.push(
        "1/mean(1/x) is the harmonic mean, which is smaller than the arithmetic mean; it also " +
          "estimates the population median when 1/x is symmetric",
        unitsNote,
      );
      break;
    default:
      estimateName = "median (estimated)";
      intervalName = `${pct} interval for the median, mapped back from the re-expressed scale`;
      cautions.push(medianNote, unitsNote);
  }
  for (const [v, side] of [[interval[0], "lower"], [interval[1], "upper"]] as const) {
    if (v === null) {
      cautions.push(
        `The ${side} end of the interval falls outside the range of ${r.label} and has no ` +
          "value in original units: the interval is open on that side",
      );
    }
  }
  return Object.freeze({
    reexpression: r,
    n,
    level,
    transformedMean: m,
    transformedSd: sd,
    tQuantile: tq,
    estimate: est,
    estimateName,
    interval: Object.freeze(interval),
    intervalName,
    ratio,
    cautions: Object.freeze(cautions),
  });
}
