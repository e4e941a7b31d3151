/**
 * Display units for a chart's value axis. Values of extreme magnitude are
 * plotted in units of a power of ten named in the axis title
 * (`thickness (× 1e−309)`): Vega's tick computation fails outright below
 * about 1e−308 (it needs 10³⁰⁸ and more, which overflows), and its default
 * tick labels for values below about 1e−7 are rows of zeros. Plotting in
 * units keeps every chart drawable and its labels readable; the numbers in
 * titles, descriptions and tables stay in the data's own units.
 *
 * @module
 */
import type { QqData } from "../stats/qq_data.ts";
/** Magnitudes plotted as they are: [1e−6, 1e15). Outside, values are plotted in units. */
const _SMALLEST_PLAIN = 1e-6;
const _LARGEST_PLAIN = 1e15;

/** How a chart's values are plotted. */
export interface _ValueUnits {
  /** The power of ten of the unit (0: the values as they are). */
  readonly exponent: number;
  /** A value in the unit. */
  readonly of: (v: number) => number;
  /** An axis or tooltip title with the unit (unchanged when the exponent is 0). */
  readonly title: (t: string) => string;
}

const _PLAIN: _ValueUnits = Object.freeze({
  exponent: 0,
  of: (v: number) => v,
  title: (t: string) => t,
});

/**
 * The units to plot values of this largest magnitude in: the values as
 * they are inside [1e−6, 1e15), else the power of ten of the largest
 * magnitude, so that the plotted values lie in [1, 10) at the top.
 *
 * @param largest the largest absolute value the chart plots
 * @example
 * ```ts
 * import { _valueUnits } from "./value_units.ts";
 * const u = _valueUnits(4e-309);
 * if (u.exponent !== -309 || Math.abs(u.of(2e-309) - 2) > 1e-6) throw new Error("units");
 * if (u.title("x") !== "x (× 1e−309)" || _valueUnits(12.5).exponent !== 0) throw new Error("title");
 * ```
 */
export function _valueUnits(largest: number): _ValueUnits {
  const m = Math.abs(largest);
  if (!(m > 0) || !Number.isFinite(m) || (m >= _SMALLEST_PLAIN && m < _LARGEST_PLAIN)) {
    return _PLAIN;
  }
  let k = Math.floor(Math.log10(m));
  // log10 of a value just below a power of ten can round up to it.
  if (_scale(m, k) < 1) k--;
  const exponent = k;
  // The minus sign the rest of the package writes (U+2212).
  const suffix = ` (× 1e${exponent < 0 ? "\u2212" : ""}${Math.abs(exponent)})`;
  return Object.freeze({
    exponent,
    of: (v: number) => _scale(v, exponent),
    title: (t: string) => t + suffix,
  });
}

/**
 * v / 10ᵏ without overflow or underflow on the way: 10ᵏ itself is not
 * representable for k < −323 and is subnormal (inexact) below −307, so a
 * negative k multiplies by 10⁻ᵏ in steps no larger than 10³⁰⁰.
 */
function _scale(v: number, k: number): number {
  if (k >= 0) return v / 10 ** k;
  let r = v;
  let left = -k;
  while (left > 300) {
    r *= 1e300;
    left -= 300;
  }
  return r * 10 ** left;
}

/**
 * The QQ data in the units its values are plotted in (see `value_units.ts`),
 * and those units; the data unchanged for ordinary magnitudes.
 */
export function _qqInUnits(q: QqData): { readonly q: QqData; readonly units: _ValueUnits } {
  const last = q.shown - 1;
  const units = _valueUnits(
    Math.max(
      Math.abs(q.lower[0]),
      Math.abs(q.upper[last]),
      Math.abs(q.value[0]),
      Math.abs(q.value[last]),
    ),
  );
  if (units.exponent === 0) return { q, units };
  const of = (a: readonly number[]) => a.map(units.of);
  return {
    q: {
      ...q,
      mean: units.of(q.mean),
      sd: units.of(q.sd),
      value: of(q.value),
      lower: of(q.lower),
      upper: of(q.upper),
    },
    units,
  };
}
