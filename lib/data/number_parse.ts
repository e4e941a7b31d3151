/**
 * Strict reading of numbers from cell text.
 *
 * A cell is a number only when the whole of it (after trimming surrounding
 * spaces) matches: an optional sign, digits with an optional decimal mark
 * (`1`, `1.5`, `1.`, `.5`), and an optional exponent (`e` or `E`, optional
 * sign, digits). Nothing else is accepted: no partial reads (`12abc` is text,
 * not 12), no hexadecimal, no `Infinity`/`inf` (non-finite values are text,
 * because no test in plumbline accepts them), no thousands separators unless
 * `thousands` names one. A value that overflows to ±∞ (`1e999`) is text too.
 *
 * The result is the correctly rounded double: short inputs use the exact
 * fast case of Clinger (1990, "How to read floating point numbers
 * accurately", PLDI '90) — at most 15 significant digits and a power of ten
 * no larger than 10²², where one multiplication or division by an exactly
 * representable power of ten rounds once; 16 to 19 digits with the same
 * powers use double-double arithmetic (Dekker 1971) with a rounding check
 * (see `_wide_decimal.ts`); everything else goes through the engine's
 * `Number()` conversion, which is correctly rounded. The quick CSV reader
 * (`csv_simple.ts`) reads bytes with the same grammar and the same exact
 * cases; the tests check both give the same double for every cell.
 *
 * @module
 */

import { _POW10, _wideDecimal } from "./_wide_decimal.ts";

/** Options for {@linkcode parseNumber}. */
export interface ParseNumberOptions {
  /**
   * The decimal mark.
   * @default "."
   */
  readonly decimal?: "." | ",";
  /**
   * A thousands separator to accept between groups of three digits in the
   * integer part (`1,234,567`); none is accepted when not given.
   * @default undefined
   */
  readonly thousands?: string;
}

const _patterns = new Map<string, RegExp>();

function _escape(c: string): string {
  return c.replace(/[.*+?^${}()|[\]\\-]/g, "\\$&");
}

/**
 * The grammar of a number as a regular expression's source, without anchors
 * or capturing groups: an optional sign, digits with an optional decimal
 * mark, an optional exponent. It uses only syntax that JavaScript and RE2
 * (the regular expressions of DuckDB and several other SQL engines) read
 * alike, so that a query can match the same cells as this module.
 *
 * @param decimal the decimal mark
 * @param thousands a thousands separator to accept, if any
 * @example
 * ```ts
 * import { numberPatternSource } from "./number_parse.ts";
 * const re = new RegExp(`^${numberPatternSource(".")}$`);
 * if (!re.test("-1.5e3") || re.test("12abc")) throw new Error("unexpected");
 * ```
 */
export function numberPatternSource(decimal: "." | ",", thousands?: string): string {
  const d = _escape(decimal);
  const int = thousands === undefined
    ? "\\d+"
    : `(?:\\d{1,3}(?:${_escape(thousands)}\\d{3})+|\\d+)`;
  return `[+-]?(?:${int}(?:${d}\\d*)?|${d}\\d+)(?:[eE][+-]?\\d+)?`;
}

/** The full-match pattern for one (decimal, thousands) pair, cached. */
function _pattern(decimal: string, thousands: string | undefined): RegExp {
  const key = decimal + "\u0000" + (thousands ?? "");
  let re = _patterns.get(key);
  if (re === undefined) {
    re = new RegExp(`^${numberPatternSource(decimal as "." | ",", thousands)}$`);
    _patterns.set(key, re);
  }
  return re;
}

/**
 * Read a cell's text as a finite number, strictly.
 *
 * @param text the cell's text; surrounding spaces and tabs are ignored
 * @param options the decimal mark and an optional thousands separator
 * @returns the number, or `NaN` when the text is not a finite number
 *
 * @example
 * ```ts
 * import { parseNumber } from "./number_parse.ts";
 * if (parseNumber("-1.5e3") !== -1500) throw new Error("unexpected");
 * if (!Number.isNaN(parseNumber("12abc"))) throw new Error("partial read");
 * if (parseNumber("2,5", { decimal: "," }) !== 2.5) throw new Error("decimal comma");
 * if (parseNumber("1 234,5", { decimal: ",", thousands: " " }) !== 1234.5) {
 *   throw new Error("thousands");
 * }
 * ```
 */
export function parseNumber(text: string, options: ParseNumberOptions = {}): number {
  const decimal = options.decimal ?? ".";
  const thousands = options.thousands;
  const t = text.trim();
  if (thousands === undefined) {
    return _scanNumber(t, 0, t.length, decimal.charCodeAt(0));
  }
  if (!_pattern(decimal, thousands).test(t)) return NaN;
  let s = thousands === undefined ? t : t.split(thousands).join("");
  if (decimal !== ".") s = s.replace(decimal, ".");
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
}

/**
 * Read `src[start, end)` as a strict finite number (no trimming, no
 * thousands separators); `NaN` when it is not one. The hot loop of the CSV
 * readers.
 */
export function _scanNumber(src: string, start: number, end: number, decimalCode: number): number {
  let i = start;
  if (i >= end) return NaN;
  let c = src.charCodeAt(i);
  let negative = false;
  if (c === 45 || c === 43) {
    negative = c === 45;
    if (++i >= end) return NaN;
    c = src.charCodeAt(i);
  }
  let mantissa = 0; // the first 15 significant digits
  let low = 0; // significant digits 16 to 19
  let significant = 0; // digits counted from the first non-zero one
  let digits = 0;
  let scale = 0;
  while (c >= 48 && c <= 57) {
    if (significant > 0 || c !== 48) {
      if (significant < 15) mantissa = mantissa * 10 + (c - 48);
      else if (significant < 19) low = low * 10 + (c - 48);
      significant++;
    }
    digits++;
    if (++i >= end) break;
    c = src.charCodeAt(i);
  }
  if (i < end && c === decimalCode) {
    i++;
    while (i < end) {
      c = src.charCodeAt(i);
      if (c < 48 || c > 57) break;
      if (significant > 0 || c !== 48) {
        if (significant < 15) mantissa = mantissa * 10 + (c - 48);
        else if (significant < 19) low = low * 10 + (c - 48);
        significant++;
      }
      scale--;
      digits++;
      i++;
    }
  }
  if (digits === 0) return NaN;
  let exponent = 0;
  if (i < end) {
    c = src.charCodeAt(i);
    if (c !== 101 && c !== 69) return NaN;
    if (++i >= end) return NaN;
    c = src.charCodeAt(i);
    let expNegative = false;
    if (c === 45 || c === 43) {
      expNegative = c === 45;
      if (++i >= end) return NaN;
    }
    const expStart = i;
    while (i < end) {
      c = src.charCodeAt(i);
      if (c < 48 || c > 57) return NaN;
      if (exponent < 100000) exponent = exponent * 10 + (c - 48);
      i++;
    }
    if (i === expStart) return NaN;
    if (expNegative) exponent = -exponent;
  }
  const k = exponent + scale;
  if (significant <= 15 && k >= -22 && k <= 22) {
    // Clinger's exact case: mantissa and 10^|k| are exact, one rounding.
    const v = k >= 0 ? mantissa * _POW10[k] : mantissa / _POW10[-k];
    return negative ? -v : v;
  }
  if (significant <= 19 && k >= -22 && k <= 22) {
    const v = _wideDecimal(mantissa, low, significant - 15, k);
    if (v === v) return negative ? -v : v;
  }
  let s = src.slice(start, end);
  if (decimalCode !== 46) s = s.replace(String.fromCharCode(decimalCode), ".");
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
}
