/**
 * Vega-Lite spec of the Box–Cox λ explorer: the profile log-likelihood over
 * a grid of λ with λ̂ and its interval marked, beside the normal QQ plot of
 * the data re-expressed at one λ of the grid, chosen with a slider. Moving
 * the slider filters the QQ points to that λ and shows its W and p. The
 * static SVG shows the grid point nearest λ̂.
 *
 * The QQ plot is standardised (value minus the fitted mean, over the
 * fitted sd, for each λ), so every λ shares the reference line y = z and
 * the plots can be compared as the slider moves. Fixed field names: profile
 * `lam`, `ll`; points `lam`, `z`, `s`, `lo`, `hi`; labels `lam`, `txt`.
 *
 * Kept in one file because it builds one spec whose layers refer to each
 * other by these field names and by the slider's parameter name: split up,
 * the names would have to be kept in step across files.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { PlumbError } from "../errors.ts";
import type { QqData } from "../stats/qq_data.ts";
import { formatCount, formatNumber, formatPClause, roundSig } from "../results/format.ts";
import { _pickIndices } from "./qq_panel.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { CHART_CONFIG, PALETTE, PANEL } from "./theme.ts";

/** What the λ explorer shows, filled from a Box–Cox profile fit. */
export interface LambdaExplorerInput {
  /** The grid of λ, ascending. */
  readonly lambdas: readonly number[];
  /** Profile log-likelihood at each λ of the grid. */
  readonly logLik: readonly number[];
  /** The maximum-likelihood λ. */
  readonly lambdaHat: number;
  /**
   * The profile-likelihood interval for λ; an end that is not finite
   * (±Infinity or NaN) means the interval reaches past the grid on that side.
   */
  readonly ci: readonly [number, number];
  /** Coverage of the interval. @default 0.95 */
  readonly ciLevel?: number;
  /** For each λ of the grid: W, p, and the QQ data of the re-expressed values. */
  readonly perLambda: readonly {
    readonly W: number;
    readonly p: number;
    readonly qq: QqData;
  }[];
}

/** Options for {@linkcode lambdaExplorerSpec}. */
export interface LambdaExplorerOptions {
  /**
   * The variable's name, in the title.
   * @default "value"
   */
  readonly name?: string;
  /**
   * Most QQ points kept over all λ together (the points of every λ travel
   * in the spec; the SVG draws one λ).
   * @default 2400
   */
  readonly maxPoints?: number;
  /**
   * The statistic's symbol.
   * @default "W"
   */
  readonly statistic?: string;
}

function _check(input: LambdaExplorerInput): void {
  const m = input.lambdas.length;
  if (m < 2) {
    throw new PlumbError(
      "too-few",
      `Cannot explore ${m} λ value${m === 1 ? "" : "s"}: pass a grid of at least 2`,
    );
  }
  if (input.logLik.length !== m || input.perLambda.length !== m) {
    throw new PlumbError(
      "bad-option",
      `Cannot explore λ: the grid has ${m} values but logLik has ${input.logLik.length} and perLambda ` +
        `${input.perLambda.length}; pass one of each per λ`,
    );
  }
  for (let k = 0; k < m; k++) {
    if (
      !Number.isFinite(input.lambdas[k]) || (k > 0 && !(input.lambdas[k] > input.lambdas[k - 1]))
    ) {
      throw new PlumbError(
        "bad-option",
        `Cannot explore λ: the grid must be finite and strictly ascending (position ${k} is ${
          input.lambdas[k]
        })`,
      );
    }
  }
  if (!Number.isFinite(input.lambdaHat)) {
    throw new PlumbError(
      "non-finite",
      `Cannot mark λ̂ = ${input.lambdaHat}: pass a finite estimate`,
    );
  }
}

/** The grid step when the grid is evenly spaced (to 1e-9 relative), else undefined. */
function _evenStep(l: readonly number[]): number | undefined {
  const step = (l[l.length - 1] - l[0]) / (l.length - 1);
  for (let k = 1; k < l.length; k++) {
    if (Math.abs(l[k] - l[k - 1] - step) > 1e-9 * Math.max(1, Math.abs(step))) return undefined;
  }
  return step;
}

/**
 * The λ explorer as one Vega-Lite spec with a slider (`bind: "range"`).
 *
 * @param input grid, profile, λ̂ and interval, per-λ W, p and QQ data
 * @param options name, point budget, statistic symbol
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * import { lambdaExplorerSpec } from "./lambda_explorer_spec.ts";
 * const x = [1.1, 1.6, 2.0, 2.7, 3.9, 5.2, 8.8, 13.5];
 * const lambdas = [-1, 0, 1];
 * const bc = (l: number) => x.map((v) => (l === 0 ? Math.log(v) : (v ** l - 1) / l));
 * const spec = lambdaExplorerSpec({
 *   lambdas, logLik: [-20, -17, -22], lambdaHat: 0.05, ci: [-0.6, 0.7],
 *   perLambda: lambdas.map((l) => ({ W: 0.9, p: 0.3, qq: qqData(bc(l)) })),
 * });
 * if (!JSON.stringify(spec).includes('"range"')) throw new Error("slider");
 * ```
 */
export function lambdaExplorerSpec(
  input: LambdaExplorerInput,
  options: LambdaExplorerOptions = {},
): TopLevelSpec {
  _check(input);
  const name = options.name ?? "value";
  const stat = options.statistic ?? "W";
  const m = input.lambdas.length;
  // a grid built by repeated addition can hold 4e-16 for 0: snap such values
  const span = input.lambdas[m - 1] - input.lambdas[0];
  const lam = input.lambdas.map((l) => (Math.abs(l) < 1e-9 * span ? 0 : l));
  const level = input.ciLevel ?? 0.95;
  const step = _evenStep(lam);
  // the grid point nearest λ̂ is the slider's starting value
  let start = 0;
  for (let k = 1; k < m; k++) {
    if (Math.abs(lam[k] - input.lambdaHat) < Math.abs(lam[start] - input.lambdaHat)) start = k;
  }
  // with an uneven grid the slider moves over positions 0 … m − 1
  const key = (k: number) => (step === undefined ? k : roundSig(lam[k], 10));
  const paramValue = key(start);
  const match = step === undefined ? "datum.lam === sel" : `abs(datum.lam - sel) < ${step / 2}`;
  const per = Math.max(20, Math.floor((options.maxPoints ?? 2400) / m));
  const points: Record<string, number>[] = [];
  const labels: { lam: number; txt: string }[] = [];
  for (let k = 0; k < m; k++) {
    const { qq, W, p } = input.perLambda[k];
    for (const j of _pickIndices(qq.shown, per)) {
      points.push({
        lam: key(k),
        z: roundSig(qq.z[j], 5),
        s: roundSig((qq.value[j] - qq.mean) / qq.sd, 6),
        lo: roundSig((qq.lower[j] - qq.mean) / qq.sd, 5),
        hi: roundSig((qq.upper[j] - qq.mean) / qq.sd, 5),
      });
    }
    labels.push({
      lam: key(k),
      txt: `λ = ${formatNumber(lam[k], 3)} · ${stat} = ${formatNumber(W, 4)} · ${formatPClause(p)}`,
    });
  }
  const lo = Number.isFinite(input.ci[0]) ? input.ci[0] : lam[0];
  const hi = Number.isFinite(input.ci[1]) ? input.ci[1] : lam[m - 1];
  const open = [
    Number.isFinite(input.ci[0]) ? "" : "lower end beyond the grid",
    Number.isFinite(input.ci[1]) ? "" : "upper end beyond the grid",
  ].filter((s) => s).join(", ");
  const ciText = `${formatNumber(input.ci[0], 3)} to ${formatNumber(input.ci[1], 3)}` +
    (open ? ` (${open})` : "");
  const profileX = {
    field: "lam",
    type: "quantitative",
    title: "λ",
    scale: { zero: false, nice: false },
  };
  const profileY = {
    field: "ll",
    type: "quantitative",
    title: "log-likelihood",
    scale: { zero: false },
  } as const;
  const profile = lam.map((l, k) => ({ lam: roundSig(l, 10), ll: roundSig(input.logLik[k], 10) }));
  const selOnProfile = step === undefined
    ? `datum.k === sel`
    : `abs(datum.lam - sel) < ${step / 2}`;
  const w = PANEL.small + 60;
  const h = PANEL.small + 20;
  const chosen = input.perLambda[start];
  return {
    $schema: VEGALITE_SCHEMA,
    description:
      `Box–Cox λ explorer for ${name}: the profile log-likelihood over ${m} values of λ ` +
      `from ${formatNumber(lam[0], 3)} to ${formatNumber(lam[m - 1], 3)}, with λ̂ = ` +
      `${formatNumber(input.lambdaHat, 3)} and its ${
        level * 100
      }% interval ${ciText} marked; beside it the ` +
      `standardised normal QQ plot of the re-expressed data at the chosen λ (here ` +
      `${formatNumber(lam[start], 3)}: ${stat} = ${formatNumber(chosen.W, 4)}, ${
        formatPClause(chosen.p)
      }, ` +
      `${formatCount(chosen.qq.n)} values).`,
    title: {
      text: name,
      subtitle: [
        `Box–Cox λ explorer · λ̂ = ${formatNumber(input.lambdaHat, 3)} · ${
          level * 100
        }% interval ${ciText}`,
        `QQ plot at λ = ${formatNumber(lam[start], 3)}, the grid point nearest λ̂ · ` +
        `where Vega-Lite runs, a slider under the chart picks any λ of the grid`,
      ],
    },
    config: CHART_CONFIG,
    params: [{
      name: "sel",
      value: paramValue,
      bind: step === undefined
        ? { input: "range", min: 0, max: m - 1, step: 1, name: "λ grid position " }
        : {
          input: "range",
          min: roundSig(lam[0], 10),
          max: roundSig(lam[m - 1], 10),
          step,
          name: "λ ",
        },
    }],
    hconcat: [
      {
        width: w,
        height: h,
        title: { text: "profile log-likelihood", fontSize: 12 },
        layer: [
          {
            data: { values: [{ a: roundSig(lo, 10), b: roundSig(hi, 10) }] },
            mark: {
              type: "rect",
              color: PALETTE.interval,
              opacity: 0.18,
              aria: false,
              tooltip: false,
            },
            encoding: {
              x: { field: "a", type: "quantitative", ...{ scale: profileX.scale } },
              x2: { field: "b" },
            },
          },
          {
            data: { values: profile.map((r, k) => ({ ...r, k })) },
            mark: {
              type: "line",
              color: PALETTE.line,
              strokeWidth: 1.5,
              aria: false,
              point: false,
            },
            encoding: {
              x: profileX,
              y: profileY,
            },
          },
          {
            data: { values: [{ lam: roundSig(input.lambdaHat, 10) }] },
            mark: { type: "rule", color: PALETTE.line, strokeDash: [4, 3], aria: false },
            encoding: { x: profileX },
          },
          {
            data: { values: profile.map((r, k) => ({ ...r, k })) },
            transform: [{ filter: selOnProfile }],
            mark: {
              type: "point",
              filled: true,
              size: 90,
              color: PALETTE.highlight,
              shape: "diamond",
              aria: false,
            },
            encoding: {
              x: profileX,
              y: profileY,
              tooltip: [
                { field: "lam", type: "quantitative", title: "λ", format: ".4~g" },
                { field: "ll", type: "quantitative", title: "log-likelihood", format: ".6~g" },
              ],
            },
          },
        ],
      },
      {
        width: w,
        height: h,
        title: { text: "QQ plot at the chosen λ (standardised)", fontSize: 12 },
        data: { values: points },
        transform: [{ filter: match }],
        layer: [
          {
            mark: { type: "area", color: PALETTE.band, opacity: 0.35, aria: false, tooltip: false },
            encoding: {
              x: { field: "z", type: "quantitative", title: "normal score z" },
              y: { field: "lo", type: "quantitative", title: "standardised value" },
              y2: { field: "hi" },
            },
          },
          {
            mark: {
              type: "line",
              color: PALETTE.line,
              strokeWidth: 1.5,
              aria: false,
              tooltip: false,
            },
            encoding: {
              x: { field: "z", type: "quantitative", title: "normal score z" },
              y: { field: "z", type: "quantitative", title: "standardised value" },
            },
          },
          {
            mark: {
              type: "point",
              filled: true,
              size: 22,
              color: PALETTE.point,
              opacity: 0.9,
              aria: false,
            },
            encoding: {
              x: { field: "z", type: "quantitative", title: "normal score z" },
              y: { field: "s", type: "quantitative", title: "standardised value" },
              tooltip: [
                { field: "s", type: "quantitative", title: "standardised value", format: ".4~g" },
                { field: "z", type: "quantitative", title: "normal score", format: ".3f" },
              ],
            },
          },
          {
            data: { values: labels },
            transform: [{ filter: match }],
            mark: {
              type: "text",
              align: "left",
              baseline: "top",
              fontSize: 12,
              fontWeight: "bold",
              color: "#111111",
              x: 6,
              y: 6,
              aria: false,
            },
            encoding: { text: { field: "txt", type: "nominal" } },
          },
        ],
      },
    ],
  } as TopLevelSpec;
}
