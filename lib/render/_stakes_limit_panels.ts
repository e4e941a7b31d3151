/**
 * The two panels of the stakes chart that exist only with specification
 * limits: the share of values outside them, and Cpk. Private to the stakes
 * chart.
 *
 * @module
 */
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
import { stakesNumber as _g, stakesShare as _pct } from "./stakes_words.ts";
import { PALETTE } from "./theme.ts";

/** The share-outside panel (limits given). */
export function _outsidePanel(s: Stakes, width: number): Record<string, unknown> {
  const o = s.outside!;
  const lim = [
    o.lower === null ? null : `below ${_g(o.lower)}`,
    o.upper === null ? null : `above ${_g(o.upper)}`,
  ]
    .filter((t) => t !== null).join(" or ");
  const rows = ["normal model"];
  if (o.reexpressed !== null) rows.push(`${s.reexpression!.label} model`);
  const obsRow = `observed count (${+(o.level * 100).toPrecision(6)}% exact CI)`;
  rows.push(obsRow);
  const points: _Point[] = [{ r: rows[0], v: o.normal, t: _pct(o.normal), kind: "normal" }];
  if (o.reexpressed !== null) {
    points.push({ r: rows[1], v: o.reexpressed, t: _pct(o.reexpressed), kind: "reexpressed" });
  }
  points.push({ r: obsRow, v: o.observed, t: _pct(o.observed), kind: "free" });
  const intervals: _Interval[] = [{
    r: obsRow,
    a: o.observedCi[0],
    b: o.observedCi[1],
    kind: "free",
  }];
  const domain = _extent([0, o.normal, o.reexpressed, ...o.observedCi]);
  return _panel(
    `Share outside the limits: ${_VERDICT[s.judgement.outside!.verdict]}`,
    `values ${lim}`,
    rows,
    "share of values outside",
    [Math.max(domain[0], -domain[1] * 0.02), domain[1]],
    _intervalLayers(intervals, points),
    width,
    ".2~%",
  );
}

/** The Cpk panel (limits given). */
export function _capabilityPanel(s: Stakes, width: number): Record<string, unknown> {
  const c = s.capability!;
  const rows = ["normal model (Bissell CI)"];
  const intervals: _Interval[] = [{
    r: rows[0],
    a: c.normal.cpkCi[0],
    b: c.normal.cpkCi[1],
    kind: "normal",
  }];
  const points: _Point[] = [{
    r: rows[0],
    v: c.normal.cpk,
    t: _g(c.normal.cpk),
    kind: "normal",
  }];
  if (c.reexpressed !== null) {
    const row = `${s.reexpression!.label} model (Bissell CI)`;
    rows.push(row);
    intervals.push({
      r: row,
      a: c.reexpressed.cpkCi[0],
      b: c.reexpressed.cpkCi[1],
      kind: "reexpressed",
    });
    points.push({
      r: row,
      v: c.reexpressed.cpk,
      t: _g(c.reexpressed.cpk),
      kind: "reexpressed",
    });
  }
  const pRow = "percentiles, no model";
  rows.push(pRow);
  if (c.percentile.cpk !== null) {
    points.push({
      r: pRow,
      v: c.percentile.cpk,
      t: _g(c.percentile.cpk),
      kind: "free",
    });
  }
  const domain = _extent([1, ...intervals.flatMap((i) => [i.a, i.b]), ...points.map((p) => p.v)]);
  const layers: unknown[] = [
    {
      data: { values: [{ v: 1 }] },
      mark: { type: "rule", color: PALETTE.muted, strokeDash: [2, 4], aria: false },
      encoding: { x: { field: "v" }, y: { value: 0 }, y2: { value: rows.length * _ROW_HEIGHT } },
    },
    ..._intervalLayers(intervals, points),
  ];
  if (c.percentile.cpk === null) {
    layers.push({
      data: {
        values: [{ r: pRow, v: domain[0], t: "not given: too few values for its 0.135% points" }],
      },
      mark: { type: "text", align: "left", dx: 6, fontSize: 10, color: PALETTE.muted, aria: false },
      encoding: { x: { field: "v" }, text: { field: "t" } },
    });
  }
  return _panel(
    `Cpk: ${_VERDICT[s.judgement.capability!.verdict]}`,
    "dotted rule: Cpk = 1, where ±3 sd just fits the nearer limit",
    rows,
    "Cpk",
    domain,
    layers,
    width,
  );
}
