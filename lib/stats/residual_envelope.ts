/**
 * The simulated envelope for a QQ plot of externally studentised residuals
 * (Atkinson 1981, "Two graphical displays for outlying and influential
 * observations in regression", Biometrika 68:13–20).
 *
 * Studentised residuals are neither independent nor identically spread
 * about their own order statistics, so the envelope of an independent
 * sample does not fit them. Their joint distribution under normal errors
 * depends only on the design, not on the coefficients or σ: Atkinson
 * simulates normal responses on the same design, studentises the residuals
 * of each simulated fit, sorts them, and takes at each rank the spread of
 * the simulated values. Here: `draws` simulated fits (e = z − U·Uᵀz with U the
 * fit's orthonormal basis, z standard normal from a seeded stream), and at
 * each rank the k-th smallest and k-th largest simulated values with
 * k = ⌊(draws + 1)·(1 − level)/2⌋, the usual Monte Carlo convention (common
 * practice); Atkinson's own choice, 19 draws and their extremes, is
 * `{ draws: 19, level: 0.9 }`. Rows with leverage 1 (no residual) are left
 * out, as in the plot.
 *
 * Fallback above {@linkcode SIMULATED_ENVELOPE_MAX_N} residuals: the exact
 * pointwise envelope of the order statistics of an independent sample from
 * Student's t with n − rank − 1 degrees of freedom, each studentised
 * residual's exact distribution under normal errors (Cook & Weisberg 1982,
 * *Residuals and Influence in Regression*, §2.2.2): t⁻¹ of the Beta(k, m − k + 1)
 * quantiles. With that many rows the leverages, and so the correlations
 * between residuals, are of order rank/n, and the simulation would cost
 * draws × n log n.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { betaQuantile } from "../numeric/beta.ts";
import { seededRandom } from "../numeric/random.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { studentTUpper } from "../numeric/student_t.ts";
import { type LinearModelFit, residualBasis } from "./linear_model.ts";

/** Above this many residuals the order-statistic envelope replaces the simulation. */
export const SIMULATED_ENVELOPE_MAX_N = 5000;

/** Options for {@linkcode residualEnvelope}. */
export interface ResidualEnvelopeOptions {
  /**
   * Pointwise coverage, in (0, 1).
   * @default 0.95
   */
  readonly level?: number;
  /**
   * Simulated fits.
   * @default 199
   */
  readonly draws?: number;
  /**
   * Seed of the simulation.
   * @default 1981
   */
  readonly seed?: number;
  /**
   * Ranks (1-based, among the residuals shown) at which to report limits.
   * @default every rank
   */
  readonly ranks?: ArrayLike<number>;
}

/** Envelope limits in studentised units, aligned with `ranks`. Frozen plain data. */
export interface ResidualEnvelope {
  /** Residuals covered (leverage-1 rows left out). */
  readonly n: number;
  /** Pointwise coverage. */
  readonly level: number;
  /** `"simulated"` (Atkinson) or `"order-statistic"` (the fallback). */
  readonly kind: "simulated" | "order-statistic";
  /** Simulated fits (0 for the fallback). */
  readonly draws: number;
  /** The seed (for the simulation). */
  readonly seed: number;
  /** The ranks, 1-based. */
  readonly ranks: readonly number[];
  /** Lower limits. */
  readonly lower: readonly number[];
  /** Upper limits. */
  readonly upper: readonly number[];
  /** The method, in words. */
  readonly method: string;
}

/**
 * The envelope for the QQ plot of a fit's externally studentised residuals.
 *
 * @param fit a fit from `fitLinearModel`
 * @param options level, simulation size and seed, ranks
 * @example
 * ```ts
 * import { fitLinearModel } from "./linear_model.ts";
 * import { residualEnvelope } from "./residual_envelope.ts";
 * const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12];
 * const fit = fitLinearModel(x.map((v) => 2 * v + Math.sin(v)), { covariates: { x } });
 * const env = residualEnvelope(fit, { draws: 99 });
 * if (env.kind !== "simulated" || !(env.lower[0] < -1 && env.upper[11] > 1)) throw new Error("envelope");
 * ```
 */
export function residualEnvelope(
  fit: LinearModelFit,
  options: ResidualEnvelopeOptions = {},
): ResidualEnvelope {
  const level = options.level ?? 0.95;
  const draws = options.draws ?? 199;
  const seed = options.seed ?? 1981;
  if (!(level > 0 && level < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot build an envelope with level ${level}: use a coverage strictly between 0 and 1, such as 0.95`,
    );
  }
  // (+1e-9: so that 20·(1 − 0.9)/2 counts as the 1 it is, not 0.999…)
  const k = Math.floor(((draws + 1) * (1 - level)) / 2 + 1e-9);
  if (!Number.isInteger(draws) || k < 1) {
    throw new PlumbError(
      "bad-option",
      `Cannot simulate a ${level * 100}% envelope from ${draws} fits: use a whole number of at ` +
        `least ${Math.ceil(2 / (1 - level)) - 1}, such as 199`,
    );
  }
  const exact = new Set(fit.exactRows);
  const m = fit.n - exact.size;
  const ranks = options.ranks === undefined
    ? Array.from({ length: m }, (_, i) => i + 1)
    : Array.from(options.ranks);
  for (const r of ranks) {
    if (!Number.isInteger(r) || r < 1 || r > m) {
      throw new PlumbError(
        "bad-option",
        `Cannot use rank ${r} among ${m} residuals: ranks run from 1 to ${m}`,
      );
    }
  }
  const df = fit.dfResidual - 1;
  if (m > SIMULATED_ENVELOPE_MAX_N) {
    const tail = (1 - level) / 2;
    return Object.freeze({
      n: m,
      level,
      kind: "order-statistic",
      draws: 0,
      seed,
      ranks: Object.freeze(ranks),
      lower: Object.freeze(ranks.map((r) => _tLower(r, m, tail, df))),
      upper: Object.freeze(ranks.map((r) => -_tLower(m + 1 - r, m, tail, df))),
      method: `pointwise ${level * 100}% limits of the order statistics of ${m} independent ` +
        `Student t values with ${df} degrees of freedom (used above ${SIMULATED_ENVELOPE_MAX_N} residuals)`,
    });
  }
  const sims = _simulate(fit, exact, m, draws, seed);
  const lower: number[] = [], upper: number[] = [];
  const column = new Float64Array(draws);
  for (const r of ranks) {
    for (let d = 0; d < draws; d++) column[d] = sims[d * m + r - 1];
    column.sort();
    lower.push(column[k - 1]);
    upper.push(column[draws - k]);
  }
  return Object.freeze({
    n: m,
    level,
    kind: "simulated",
    draws,
    seed,
    ranks: Object.freeze(ranks),
    lower: Object.freeze(lower),
    upper: Object.freeze(upper),
    method: `simulated envelope (Atkinson 1981, Biometrika 68:13–20): ${draws} seeded normal ` +
      `responses on the same design, studentised, sorted; the ${
        _ordinal(k)
      } smallest and largest at each rank`,
  });
}

/** `draws` sorted vectors of simulated studentised residuals, draws × m, row-major. */
function _simulate(
  fit: LinearModelFit,
  exact: ReadonlySet<number>,
  m: number,
  draws: number,
  seed: number,
): Float64Array {
  const n = fit.n, r = fit.rank, u = residualBasis(fit), h = fit.leverages;
  const df = fit.dfResidual;
  const rng = seededRandom(seed);
  const z = new Float64Array(n), out = new Float64Array(draws * m), row = new Float64Array(m);
  const keep = Uint8Array.from({ length: n }, (_, i) => (exact.has(i) ? 0 : 1));
  for (let d = 0; d < draws; d++) {
    for (let i = 0; i < n; i++) z[i] = rng.normal();
    for (let j = 0; j < r; j++) {
      let c = 0;
      for (let i = 0; i < n; i++) c += u[j * n + i] * z[i];
      for (let i = 0; i < n; i++) z[i] -= c * u[j * n + i];
    }
    let rss = 0;
    for (let i = 0; i < n; i++) rss += z[i] * z[i];
    let w = 0;
    for (let i = 0; i < n; i++) {
      if (!keep[i]) continue;
      const q = z[i] / Math.sqrt(1 - h[i]);
      row[w++] = q / Math.sqrt(Math.max(rss - q * q, 0) / (df - 1));
    }
    out.set(sortFloat64(row), d * m);
  }
  return out;
}

/**
 * The `tail`-quantile of the r-th smallest of m independent t values: t⁻¹ of
 * the Beta(r, m − r + 1) quantile u, taking whichever of u and 1 − u is below
 * ½ from its own side (the mirrored statistic Beta(m − r + 1, r) gives 1 − u),
 * so that neither is a rounded number near 1.
 */
function _tLower(r: number, m: number, tail: number, df: number): number {
  if (2 * r <= m + 1) {
    const u = betaQuantile(tail, r, m - r + 1);
    return u === 0.5 ? 0 : u < 0.5 ? -studentTUpper(u, df) : studentTUpper(1 - u, df);
  }
  const v = betaQuantile(1 - tail, m - r + 1, r); // 1 − u
  return v === 0.5 ? 0 : v < 0.5 ? studentTUpper(v, df) : -studentTUpper(1 - v, df);
}

function _ordinal(k: number): string {
  const s = k % 100 >= 11 && k % 100 <= 13 ? "th" : ["th", "st", "nd", "rd"][k % 10] ?? "th";
  return `${k}${s}`;
}
