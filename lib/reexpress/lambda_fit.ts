/**
 * The shape of a fitted power-transformation parameter λ, and the options the
 * fitting functions share.
 *
 * @module
 */

/** Options for `boxCoxFit` and `yeoJohnsonFit`. */
export interface LambdaFitOptions {
  /**
   * Confidence level of the profile-likelihood interval for λ: the interval
   * holds every λ whose log-likelihood is within ½·χ²₁(level) of the maximum.
   * @default 0.95
   */
  readonly level?: number;
  /**
   * The λ range searched, `[lo, hi]`. ±5 spans every power anyone interprets
   * (the ladder runs from −2 to 2) with room for the interval around them on
   * small samples; a maximum beyond ±5 means a handful of values drive the
   * likelihood (see the 19-ties-plus-one case in the tests), which the result
   * then reports at the end of the range instead of chasing it. Widen it to
   * study such data.
   * @default [-5, 5]
   */
  readonly range?: readonly [number, number];
}

/** A fitted λ with its profile-likelihood interval: plain, frozen data. */
export interface LambdaFit {
  /** `"Box–Cox"` or `"Yeo–Johnson"`. */
  readonly family: "Box–Cox" | "Yeo–Johnson";
  /** The maximum-likelihood λ within the range. */
  readonly lambda: number;
  /**
   * The profile-likelihood interval `[lo, hi]` at `level`. An end is `null`
   * when the log-likelihood stays above the cut-off all the way to the end of
   * the range on that side (the interval is open there); `notes` says so.
   */
  readonly ci: readonly [number | null, number | null];
  /** The confidence level of `ci`. */
  readonly level: number;
  /**
   * The maximised log-likelihood, with all constants: the normal
   * log-likelihood of the transformed values at their ML mean and variance,
   * plus the log-Jacobian, so it is a density of the original data and can
   * be compared across λ and across families on the same data.
   */
  readonly logLikelihood: number;
  /** The number of values used. */
  readonly n: number;
  /** The λ range searched. */
  readonly range: readonly [number, number];
  /** True when the maximum lies at an end of the range (the true maximum may be beyond). */
  readonly lambdaAtRangeEnd: boolean;
  /** Plain-words notes: open interval ends, a maximum at the edge. */
  readonly notes: readonly string[];
  /** How many passes over the data the fit took. */
  readonly passes: number;
}
