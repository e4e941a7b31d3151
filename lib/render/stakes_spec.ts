/**
 * Vega-Lite spec of the stakes view: for each quantity the analyst goes on
 * to compute, one panel with its own axis, one row per way of computing it —
 * the normal model first, then the re-expressed model, then the answer that
 * assumes no model — so the eye reads how far apart they land. Rows:
 *
 * - central range: each way's interval as a line with its ends marked; the
 *   rank-based ends carry their confidence bands; under them, a strip of the
 *   data's own quantiles; ends the judge flagged are drawn in the alert
 *   colour, as a diamond, and labelled;
 * - share outside the limits: a dot per way, the observed share with its
 *   exact interval;
 * - Cpk: a dot per way with its interval, and a faint rule at Cpk = 1;
 * - the mean: the t and bootstrap intervals.
 *
 * The data arrive summarised (at most 101 quantiles), so the spec's size
 * does not grow with n. Field names are fixed (`r` row, `a`/`b` ends, `v`
 * value, `t` label); the variable's name appears only in titles.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import type { Stakes } from "../stakes/stakes.ts";
import {
  _extent,
  type _Interval,
  _intervalLayers,
  _panel,
  type _Point,
  _ROW_HEIGHT,
  _VERDICT,
} from "./_stakes_parts.ts";
import { _capabilityPanel, _outsidePanel } from "./_stakes_limit_panels.ts";
import { roundSig } from "../results/format.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { stakesNumber as _g } from "./stakes_words.ts";
import { CHART_CONFIG, PALETTE } from "./theme.ts";

/** Options for {@linkcode stakesSpec}. */
export interface StakesSpecOptions {
  /**
   * The variable's name, for the title and the value axes.
   * @default "value"
   */
  readonly name?: string;
  /**
   * Width of each panel's plot area, in pixels.
   * @default 420
   */
  readonly width?: number;
}

/** The central-range panel. */
function _rangePanel(
  s: Stakes,
  name: string,
  width: number,
  shared?: readonly [number, number],
): Record<string, unknown> {
  const r = s.range;
  const pct = `${+(r.coverage * 100).toPrecision(6)}%`;
  const rows: string[] = ["normal model: mean ± z·sd"];
  if (r.reexpressed !== null) rows.push(`${s.reexpression!.label} model, mapped back`);
  rows.push(`ranks, no model (bands: ${+(r.ranksCiLevel * 100).toPrecision(6)}% CI)`);
  rows.push("the data: 101 quantiles");
  const all: (number | null)[] = [...r.normal, ...r.ranks, ...r.strip];
  if (r.reexpressed !== null) all.push(r.reexpressed[0], r.reexpressed[1]);
  for (const [a, b] of r.ranksCi) all.push(a, b);
  const flagged = new Set(r.flags.map((f) => f.side));
  if (r.flags.some((f) => f.code === "below-zero")) all.push(0);
  const limits = s.outside === null
    ? []
    : [[s.outside.lower, "lower limit"], [s.outside.upper, "upper limit"]]
      .filter((l): l is [number, string] => l[0] !== null)
      .map(([v, t]) => ({ v, t: `${t} ${_g(v)}` }));
  for (const l of limits) all.push(l.v);
  // Open ends and the axis reach the shared domain's edges when panels share one.
  const domain = shared ?? _extent(all);
  const intervals: _Interval[] = [{ r: rows[0], a: r.normal[0], b: r.normal[1], kind: "normal" }];
  const points: _Point[] = r.normal.map((v, j) => {
    const side = j === 0 ? "lower" : "upper";
    const why = r.flags.filter((f) => f.side === side).map((f) =>
      f.code === "below-zero" ? "below 0" : "outside band"
    );
    return {
      r: rows[0],
      v,
      t: why.length === 0 ? _g(v) : `${_g(v)} (${why.join(", ")})`,
      kind: flagged.has(side) ? "flag" : "normal",
    };
  });
  if (r.reexpressed !== null) {
    const [a, b] = r.reexpressed;
    intervals.push({ r: rows[1], a: a ?? domain[0], b: b ?? domain[1], kind: "reexpressed" });
    for (const v of [a, b]) {
      if (v !== null) points.push({ r: rows[1], v, t: _g(v), kind: "reexpressed" });
    }
  }
  const rankRow = rows[rows.length - 2];
  intervals.push({ r: rankRow, a: r.ranks[0], b: r.ranks[1], kind: "free" });
  for (const v of r.ranks) points.push({ r: rankRow, v, t: _g(v), kind: "free" });
  const bands = r.ranksCi.map(([a, b]) => ({
    r: rankRow,
    a: a ?? domain[0],
    b: b ?? domain[1],
  }));
  const strip = r.strip.map((v) => ({ r: rows[rows.length - 1], v: roundSig(v, 6) }));
  const layers: unknown[] = [
    {
      data: { values: bands },
      mark: { type: "rect", color: PALETTE.band, opacity: 0.35, height: 16, aria: false },
      encoding: { x: { field: "a" }, x2: { field: "b" } },
    },
    ..._intervalLayers(intervals, points),
    {
      data: { values: strip },
      mark: { type: "tick", color: PALETTE.muted, thickness: 1, size: 14, aria: false },
      encoding: { x: { field: "v" } },
    },
  ];
  if (limits.length > 0) {
    const h = rows.length * _ROW_HEIGHT;
    layers.unshift(
      {
        data: { values: limits },
        mark: { type: "rule", color: PALETTE.highlight, strokeWidth: 1.5, aria: false },
        encoding: { x: { field: "v" }, y: { value: 0 }, y2: { value: h } },
      },
    );
  }
  if (domain[0] < 0 && domain[1] > 0) {
    layers.unshift({
      data: { values: [{ v: 0 }] },
      mark: { type: "rule", color: PALETTE.muted, strokeDash: [3, 3], aria: false },
      encoding: { x: { field: "v" }, y: { value: 0 }, y2: { value: rows.length * _ROW_HEIGHT } },
    });
  }
  const flags = r.flags.map((f) =>
    f.code === "below-zero"
      ? "normal lower limit below 0"
      : `normal ${f.side} limit outside its band`
  );
  return _panel(
    `Central ${pct} range: ${_VERDICT[s.judgement.range.verdict]}`,
    [
      ...(flags.length > 0 ? [...new Set(flags)] : ["each way's limits, and the data's spread"]),
      ...(limits.length > 0
        ? [`solid rule${limits.length > 1 ? "s" : ""}: ${limits.map((l) => l.t).join(", ")}`]
        : []),
    ].join(" · "),
    rows,
    name,
    domain,
    layers,
    width,
  );
}

/** The mean panel. */
function _meanPanel(s: Stakes, name: string, width: number): Record<string, unknown> {
  const m = s.mean;
  const pct = `${+(m.level * 100).toPrecision(6)}%`;
  const rows = ["t interval (normal model)", "bootstrap BCa (no model)"];
  const intervals: _Interval[] = [{ r: rows[0], a: m.t[0], b: m.t[1], kind: "normal" }];
  const points: _Point[] = [
    ...m.t.map((v) => ({ r: rows[0], v, t: _g(v), kind: "normal" as const })),
  ];
  const [b0, b1] = m.bootstrap;
  if (b0 !== null && b1 !== null) {
    intervals.push({ r: rows[1], a: b0, b: b1, kind: "free" });
    points.push({ r: rows[1], v: b0, t: _g(b0), kind: "free" }, {
      r: rows[1],
      v: b1,
      t: _g(b1),
      kind: "free",
    });
  }
  const domain = _extent([...m.t, b0, b1], 0.15);
  return _panel(
    `Mean, ${pct} interval: ${_VERDICT[s.judgement.mean.verdict]}`,
    `mean ${_g(m.estimate)} · bootstrap: ${m.bootstrapDetail.resamples} resamples, seed ${m.seed}`,
    rows,
    name,
    domain,
    _intervalLayers(intervals, points),
    width,
  );
}

/**
 * The stakes chart of one variable.
 *
 * @param s the stakes result
 * @param options name and width
 */
export function stakesSpec(s: Stakes, options: StakesSpecOptions = {}): TopLevelSpec {
  const name = options.name ?? "value";
  const width = options.width ?? 420;
  const panels = [_rangePanel(s, name, width)];
  if (s.outside !== null) panels.push(_outsidePanel(s, width), _capabilityPanel(s, width));
  panels.push(_meanPanel(s, name, width));
  return {
    $schema: VEGALITE_SCHEMA,
    description: `What the departure from normality changes for ${name} (n = ${s.n}): ` +
      "each quantity computed assuming a normal model and without it, on one axis per quantity",
    title: {
      text: `${name}: what the departure changes`,
      subtitle: `n = ${s.n} · overall: ${_VERDICT[s.judgement.overall]}`,
    },
    config: { ...CHART_CONFIG, concat: { spacing: 18 } },
    vconcat: panels,
  } as unknown as TopLevelSpec;
}

/** Options for {@linkcode stakesGroupsSpec}. */
export interface StakesGroupsSpecOptions extends StakesSpecOptions {
  /**
   * The grouping column, for panel titles.
   * @default "group"
   */
  readonly by?: string;
}

/**
 * The central range of each group, one panel per group (the range panel of
 * {@linkcode stakesSpec}), each titled by its group and verdict.
 *
 * @param groups the groups to draw, in order, each with its stakes
 * @param options name, grouping column and width
 */
export function stakesGroupsSpec(
  groups: readonly { readonly group: string; readonly stakes: Stakes }[],
  options: StakesGroupsSpecOptions = {},
): TopLevelSpec {
  const name = options.name ?? "value";
  const by = options.by ?? "group";
  const width = options.width ?? 420;
  // One scale for every group, so that their ranges compare by eye: the union
  // of each panel's own domain.
  type X = { scale: { domain: [number, number] } };
  const shared: [number, number] = [Infinity, -Infinity];
  for (const { stakes: s } of groups) {
    const [a, b] = (_rangePanel(s, name, width).encoding as { x: X }).x.scale.domain;
    shared[0] = Math.min(shared[0], a);
    shared[1] = Math.max(shared[1], b);
  }
  const panels = groups.map(({ group, stakes: s }) => {
    const panel = _rangePanel(s, name, width, shared);
    const title = panel.title as { text: string };
    return { ...panel, title: { ...title, text: `${by} = ${group} (n = ${s.n}) · ${title.text}` } };
  });
  return {
    $schema: VEGALITE_SCHEMA,
    description: `The central range of ${name} in each ${by} group, computed assuming a normal ` +
      "model, on a re-expression mapped back, and from the ranks, on one axis per group",
    title: { text: `${name} by ${by}: the central range three ways` },
    config: { ...CHART_CONFIG, concat: { spacing: 18 } },
    vconcat: panels,
  } as unknown as TopLevelSpec;
}
