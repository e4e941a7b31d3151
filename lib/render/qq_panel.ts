/**
 * Small QQ panels for composed charts (the re-expression panel, the groups'
 * facets, the λ explorer): the points thinned to a budget, both ends kept.
 *
 * @module
 */
import { thinRanks } from "../numeric/thin_ranks.ts";
import type { QqData } from "../stats/qq_data.ts";
import { _qqLayers, _qqRecords } from "./qq_spec.ts";
import { _qqInUnits } from "./value_units.ts";

/**
 * Indices into a QQ data's arrays that keep at most `max` points: both ends
 * in full (a quarter of the budget each), the middle evenly spaced.
 */
export function _pickIndices(shown: number, max: number): number[] {
  if (shown <= max) return Array.from({ length: shown }, (_, k) => k);
  return thinRanks(shown, max, Math.floor(max / 4)).map((r) => r - 1);
}

/** Options of one small QQ panel inside a composed chart. */
export interface _PanelOptions {
  readonly name: string;
  readonly title: string;
  readonly subtitle: string[];
  readonly width: number;
  readonly height: number;
  readonly maxPoints: number;
}

/** One QQ panel (own data, own title) for concatenated charts. */
// deno-lint-ignore no-explicit-any
export function _qqPanel(given: QqData, o: _PanelOptions): any {
  // Plotted in display units (see value_units.ts).
  const { q, units } = _qqInUnits(given);
  const pick = _pickIndices(q.shown, o.maxPoints);
  return {
    title: { text: o.title, subtitle: o.subtitle },
    width: o.width,
    height: o.height,
    data: { values: _qqRecords(q, false, pick) },
    layer: _qqLayers(q, units.title(o.name), false, units.title(o.name)),
  };
}
