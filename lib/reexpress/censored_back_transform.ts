/**
 * The mean of a censored sample on a re-expressed scale, with its interval,
 * mapped back to the original units.
 *
 * @module
 */
import { normalQuantile } from "../numeric/normal.ts";
import { censoredNormalFit } from "../stats/censored_fit.ts";
import type { CensoredSample } from "../stats/censored_sample.ts";
import {
  _backTransformed,
  _levelOption,
  type BackTransformed,
  type BackTransformOptions,
} from "./back_transform.ts";
import { censoredReexpress } from "./censored_reexpress.ts";
import type { Reexpression } from "./reexpression.ts";

/**
 * {@linkcode backTransformMean} for a censored sample: the sample is
 * re-expressed with its limits (`censoredReexpress`), the mean μ̂ and sd σ̂ on
 * that scale come from the maximum-likelihood fit (`censoredNormalFit`), the
 * interval is the Wald interval μ̂ ± z·se(μ̂) with z the standard normal
 * quantile (the usual large-sample interval for a maximum-likelihood
 * estimate; Cohen 1991, *Truncated and Censored Samples*, chapter 2), and
 * both are mapped back and named as in `backTransformMean` (geometric mean,
 * harmonic mean, median). The cautions say how many values were censored.
 *
 * @param sample the censored sample in original units
 * @param r the re-expression
 * @param options the confidence level
 * @example
 * ```ts
 * import { censoredSample } from "../stats/censored_sample.ts";
 * import { censoredBackTransformMean } from "./censored_back_transform.ts";
 * import { reexpression } from "./reexpression.ts";
 * const s = censoredSample([0.05, 0.12, 0.05, 0.09, 0.21, 0.15, 0.11, 0.3], [-1, 0, -1, 0, 0, 0, 0, 0]);
 * const b = censoredBackTransformMean(s, reexpression("log"));
 * if (b.estimateName !== "geometric mean" || !(b.estimate < 0.12)) throw new Error("unexpected");
 * ```
 */
export function censoredBackTransformMean(
  sample: CensoredSample,
  r: Reexpression,
  options: BackTransformOptions = {},
): BackTransformed {
  const level = _levelOption(options.level, "a back-transformed mean");
  const fit = censoredNormalFit(censoredReexpress(sample, r));
  const z = normalQuantile(1 - (1 - level) / 2);
  const censored = sample.left + sample.right;
  const note = censored === 0 ? [] : [
    `${censored} of ${sample.n} values are censored: the mean and its interval on the ` +
    `re-expressed scale come from the maximum-likelihood fit with the limits re-expressed ` +
    `too (Wald interval, mean ± ${+z.toPrecision(4)}·standard error)`,
  ];
  return _backTransformed(r, {
    n: sample.n,
    level,
    mean: fit.mean,
    sd: fit.sd,
    quantile: z,
    half: z * fit.seMean,
  }, note);
}
