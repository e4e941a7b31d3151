/**
 * Number formatting for chart labels, tables and plain text: fixed rules so
 * the same number always prints the same way.
 *
 * @module
 */

/** What a number that could not be computed reads as in any display. */
export const NOT_COMPUTED = "not computed";

/**
 * A count with comma thousands separators, e.g. `1,000,000`.
 *
 * @param n a whole number
 * @example
 * ```ts
 * import { formatCount } from "./format.ts";
 * if (formatCount(1234567) !== "1,234,567") throw new Error("count");
 * ```
 */
export function formatCount(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  const s = Math.round(Math.abs(n)).toString().replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return n < 0 ? "−" + s : s;
}

/**
 * A number to `digits` significant digits, trailing zeros kept, with the
 * minus sign (U+2212) for negative numbers and negative exponents alike, and
 * exponent form outside [1e-4, 1e6). Every number plumbline writes into
 * text for people goes through this function or {@linkcode formatCompact}.
 *
 * @param x the number
 * @param digits significant digits, default 4
 * @example
 * ```ts
 * import { formatNumber } from "./format.ts";
 * if (formatNumber(-0.0123456) !== "−0.01235") throw new Error("sig");
 * if (formatNumber(1234567) !== "1.235e6" || formatNumber(-1.5e-7) !== "−1.500e−7") throw new Error("exp");
 * ```
 */
export function formatNumber(x: number, digits = 4): string {
  // A missing value reads as such in every display, never as "NaN".
  if (Number.isNaN(x)) return NOT_COMPUTED;
  if (x === Infinity) return "∞";
  if (x === -Infinity) return "−∞";
  if (x === 0) return "0";
  const a = Math.abs(x);
  let s: string;
  if (a >= 1e-4 && a < 1e6) s = a.toPrecision(digits);
  else s = a.toExponential(digits - 1).replace("e+", "e");
  // toPrecision may itself switch to exponent form near the limits
  s = s.replace("e+", "e").replace("e-", "e−");
  return x < 0 ? "−" + s : s;
}

/**
 * A number to at most `digits` significant digits without trailing zeros
 * (`0.5`, `−2`, `1.234e−5`), with the minus sign (U+2212): for parameters
 * written into labels and formulas, such as a power λ or a shift.
 *
 * @param x the number
 * @param digits significant digits at most, default 4
 * @example
 * ```ts
 * import { formatCompact } from "./format.ts";
 * if (formatCompact(-0.5) !== "−0.5" || formatCompact(0.123456) !== "0.1235") throw new Error("compact");
 * ```
 */
export function formatCompact(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return formatNumber(x);
  const s = String(Number(x.toPrecision(digits))).replace("e+", "e").replace(/-/g, "−");
  return s;
}

/**
 * A p-value: four decimals, `< 0.0001` below that.
 *
 * @param p the p-value in [0, 1]
 * @example
 * ```ts
 * import { formatP } from "./format.ts";
 * if (formatP(0.04567) !== "0.0457" || formatP(1e-9) !== "< 0.0001") throw new Error("p");
 * ```
 */
export function formatP(p: number): string {
  if (Number.isNaN(p)) return NOT_COMPUTED;
  if (p < 0.0001) return "< 0.0001";
  return p.toFixed(4);
}

/**
 * Round a number to `digits` significant digits for storage in a chart
 * spec (smaller JSON); not for values a reader is shown exactly.
 *
 * @param x the number
 * @param digits significant digits, default 6
 * @example
 * ```ts
 * import { roundSig } from "./format.ts";
 * if (roundSig(1.23456789, 4) !== 1.235) throw new Error("round");
 * ```
 */
export function roundSig(x: number, digits = 6): number {
  if (!Number.isFinite(x) || x === 0) return x;
  return Number(x.toPrecision(digits));
}

/**
 * A p-value as a clause: `p = 0.0457`, or `p < 0.0001`.
 *
 * @param p the p-value in [0, 1]
 * @example
 * ```ts
 * import { formatPClause } from "./format.ts";
 * if (formatPClause(0.5) !== "p = 0.5000" || formatPClause(0) !== "p < 0.0001") throw new Error("p");
 * ```
 */
export function formatPClause(p: number): string {
  if (Number.isNaN(p)) return `p ${NOT_COMPUTED}`;
  const s = formatP(p);
  return s.startsWith("<") ? `p ${s}` : `p = ${s}`;
}

/**
 * A mean (or other centre) beside its spread: `0` when it is rounding noise
 * next to the standard deviation (|mean| ≤ 1e-9·sd, as for residuals), else
 * {@linkcode formatNumber}.
 *
 * @param mean the centre
 * @param sd the spread
 * @param digits significant digits, default 4
 * @example
 * ```ts
 * import { formatCentre } from "./format.ts";
 * if (formatCentre(-7.6e-14, 1.3) !== "0" || formatCentre(2.5, 1) !== "2.500") throw new Error("centre");
 * ```
 */
export function formatCentre(mean: number, sd: number, digits = 4): string {
  return Math.abs(mean) <= 1e-9 * Math.abs(sd) ? "0" : formatNumber(mean, digits);
}
