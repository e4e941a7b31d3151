/**
 * The λ explorer of a chain: Box–Cox (positive data) or Yeo–Johnson (data
 * with zeros or negatives) over a λ grid, with the profile log-likelihood,
 * λ̂ and its interval, and for each λ the QQ plot, W and p — all precomputed
 * into one Vega-Lite spec with a slider.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { randomSubsample } from "../numeric/random.ts";
import { boxCoxFit } from "../reexpress/box_cox_fit.ts";
import { boxCoxProfile } from "../reexpress/box_cox_profile.ts";
import { applyReexpression, reexpression } from "../reexpress/reexpression.ts";
import { yeoJohnsonFit } from "../reexpress/yeo_johnson_fit.ts";
import { yeoJohnsonProfile } from "../reexpress/yeo_johnson_profile.ts";
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { type Chart, chart } from "../render/chart_bundle.ts";
import { lambdaExplorerSpec } from "../render/lambda_explorer_spec.ts";
import { noteSpec } from "../render/note_spec.ts";
import { qqData } from "../stats/qq_data.ts";
import { SHAPIRO_WILK_MAX_N, shapiroWilk } from "../stats/shapiro_wilk.ts";

/** Whether re-expressed values can be tested: finite, and not all equal. */
function _usable(y: Float64Array): boolean {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of y) {
    if (!Number.isFinite(v)) return false;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return hi > lo;
}

/** Grid points of the explorer. */
export const LAMBDA_GRID_POINTS = 41;

/**
 * The λ explorer chart for a sample, computed on the first read of its spec
 * or its first display. Above 5000 values the grid is computed on a seeded
 * random subsample of 5000 (the fit itself uses all values), and the chart's
 * title says so.
 *
 * @param sample the sample, on first need
 * @param name what it is (for titles), on first need
 *
 * @example
 * ```ts
 * import { lambdaExplorer } from "./lambda_view.ts";
 * const x = new Float64Array([1.1, 1.9, 2.3, 2.8, 3.9, 4.4, 5.6, 7.7, 9.8, 14.1]);
 * const c = lambdaExplorer(() => x, () => "gap");
 * if (!JSON.stringify(c.spec).includes("range")) throw new Error("slider");
 * ```
 */
export function lambdaExplorer(sample: () => Float64Array, name: () => string): Chart {
  return chart(() => _spec(sample(), name()));
}

/**
 * The explorer's spec, or a note in its place when a valid sample leaves no
 * profile to fit or fewer than two λ to draw (values too large, or varying
 * too little relative to their size): a display never throws on a valid
 * sample.
 */
function _spec(values: Float64Array, name: string): TopLevelSpec {
  try {
    return _explorer(values, name);
  } catch (e) {
    // a column that cannot be screened at all is refused as by every display
    if (!(e instanceof PlumbError) || e.code === "too-few" || !_usable(values)) throw e;
    return noteSpec(`${name}: λ explorer not drawn`, `${e.message}.`);
  }
}

function _explorer(values: Float64Array, name: string): TopLevelSpec {
  let positive = true;
  for (const v of values) if (!(v > 0)) positive = false;
  const fit = positive ? boxCoxFit(values) : yeoJohnsonFit(values);
  const kind = positive ? "box-cox" : "yeo-johnson";
  const lo0 = fit.ci[0] ?? fit.range[0];
  const hi0 = fit.ci[1] ?? fit.range[1];
  const lo = Math.max(fit.range[0], Math.min(-2, Math.floor(2 * lo0) / 2 - 0.5));
  const hi = Math.min(fit.range[1], Math.max(2, Math.ceil(2 * hi0) / 2 + 0.5));
  const m = LAMBDA_GRID_POINTS;
  const lambdas = Array.from(
    { length: m },
    (_, k) => +(lo + ((hi - lo) * k) / (m - 1)).toPrecision(12),
  );
  const sample = values.length > SHAPIRO_WILK_MAX_N
    ? randomSubsample(values, SHAPIRO_WILK_MAX_N, 1)
    : values;
  const logLik = Array.from(
    positive ? boxCoxProfile(values, lambdas) : yeoJohnsonProfile(values, lambdas),
  );
  // Box–Cox of x/g is an affine map of Box–Cox of x (g the geometric mean), so W
  // and the QQ shape are the same; it keeps values that vary little relative to
  // their size (1000 ± 0.3) from collapsing to one double at extreme λ.
  let scaled: Float64Array | undefined;
  const scaledSample = () => {
    if (scaled) return scaled;
    let logSum = 0;
    for (const v of sample) logSum += Math.log(v);
    const g = Math.exp(logSum / sample.length);
    return scaled = sample.map((v) => v / g);
  };
  const kept: number[] = [];
  const perLambda = lambdas.flatMap((l, k) => {
    const step = reexpression(kind, { lambda: l });
    for (const x of positive ? [sample, scaledSample()] : [sample]) {
      const y = applyReexpression(x, step);
      if (!_usable(y)) continue;
      const w = shapiroWilk(y);
      kept.push(k);
      return [{ W: w.statistic, p: w.pValue, qq: qqData(y, { maxPoints: 60, tailPoints: 15 }) }];
    }
    return [];
  });
  const family = positive ? "Box–Cox" : "Yeo–Johnson";
  const dropped = lambdas.length - kept.length;
  const label =
    (values.length > SHAPIRO_WILK_MAX_N
      ? `${name} (${family}; QQ, W and p on a seeded subsample of ${SHAPIRO_WILK_MAX_N})`
      : `${name} (${family})`) +
    (dropped > 0
      ? `; ${dropped} λ left out: the re-expressed values are equal in double precision there`
      : "");
  if (kept.length < 2) {
    throw new PlumbError(
      "constant",
      `Cannot draw the λ explorer for ${name}: at ${dropped} of ${lambdas.length} powers the ` +
        `re-expressed values are not finite or all equal in double precision; the data are too ` +
        `large, or vary too little relative to their size, for powers to be computed; rescale ` +
        `the data (change its units) to explore λ`,
    );
  }
  return lambdaExplorerSpec({
    lambdas: kept.map((k) => lambdas[k]),
    logLik: kept.map((k) => logLik[k]),
    lambdaHat: fit.lambda,
    ci: [fit.ci[0] ?? -Infinity, fit.ci[1] ?? Infinity],
    ciLevel: fit.level,
    perLambda,
  }, { name: label });
}
