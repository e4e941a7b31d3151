/**
 * Cells that record a value below or above a limit: `<0.5`, `< 0,5`, `≤0.5`,
 * `<=0.5` (left-censored: the true value is at most the limit) and `>1000`,
 * `≥1000`, `>=1000` (right-censored: at least the limit).
 *
 * Laboratories write a result under the detection (or quantification)
 * limit as the limit with a `<` sign; counting methods write a result over
 * the range as `>` and the top of the range. Such a cell is a measurement
 * with partial information, not text and not missing, so it is read as
 * *censored* without any option: its side and its limit are kept.
 *
 * The grammar: an optional run of spaces, one of the signs `<` `<=` `≤` `≦`
 * `＜` (below) or `>` `>=` `≥` `≧` `＞` (above), optional spaces, then a
 * number read exactly as any other cell of the source (the same decimal
 * mark and thousands separator, see `number_parse.ts`). Nothing may follow
 * the number: `<0.5 mg/L` is text.
 *
 * Words without a number (`ND`, `n.d.`, `<LOD`, `BDL`, …) say only that the
 * value was below some limit; which limit, the source does not say. They are
 * read as censored only for the columns whose limit the user gives (the
 * `detectionLimits` option of `loadTable`); elsewhere they stay text, and the
 * `"non-numeric"` error says how to give the limit.
 *
 * @module
 */
import { numberPatternSource, parseNumber } from "./number_parse.ts";

/** A censored cell's side: −1 below the limit (left-censored), +1 above it (right-censored). */
export type CensorSide = -1 | 1;

/** A censored cell: which side of the limit the true value lies, and the limit. */
export interface CensoredCell {
  /** −1: the true value is at most `limit`; +1: at least `limit`. */
  readonly side: CensorSide;
  /** The limit, a finite number. */
  readonly limit: number;
}

/** Options for {@linkcode parseCensored}. */
export interface ParseCensoredOptions {
  /**
   * The decimal mark of the number after the sign.
   * @default "."
   */
  readonly decimal?: "." | ",";
  /**
   * A thousands separator accepted in the number, as in `parseNumber`.
   * @default undefined (none)
   */
  readonly thousands?: string;
}

/** The signs of a left-censored cell (`<0.5`), longest first where one starts another. */
export const BELOW_SIGNS: readonly string[] = Object.freeze(["<=", "≤", "≦", "<", "＜"]);
/** The signs of a right-censored cell (`>1000`), longest first where one starts another. */
export const ABOVE_SIGNS: readonly string[] = Object.freeze([">=", "≥", "≧", ">", "＞"]);
const _BELOW = BELOW_SIGNS;
const _ABOVE = ABOVE_SIGNS;
const _SIGN_STARTS = "<≤≦＜>≥≧＞";

/**
 * The characters `String.prototype.trim` removes (ECMAScript's WhiteSpace
 * and LineTerminator), written out so that a pattern handed to another
 * regular-expression engine strips exactly the same ones.
 */
const _TRIMMED = "\t\n\v\f\r \u00a0\u1680\u2000-\u200a\u2028\u2029\u202f\u205f\u3000\ufeff";

/**
 * The censored cells of one side as a regular expression's source, to be
 * matched against the whole cell (anchors are the caller's): spaces, a sign
 * of that side, spaces, a number (its digits in the one capturing group),
 * spaces. It is built from {@linkcode BELOW_SIGNS}, {@linkcode ABOVE_SIGNS}
 * and the number grammar of `number_parse.ts`, with literal characters and
 * syntax that JavaScript and RE2 (DuckDB's `regexp_full_match`) read alike,
 * so that a scan counts the cells {@linkcode parseCensored} reads as
 * censored. One difference is left to the caller: a number that overflows
 * (`<1e999`) matches the pattern but is not a limit, so the captured number
 * must also be checked to be finite.
 *
 * @param side −1 for the cells below a limit, +1 above
 * @param decimal the decimal mark of the number
 * @example
 * ```ts
 * import { censoredPatternSource } from "./censored_cell.ts";
 * const below = new RegExp(`^${censoredPatternSource(-1)}$`);
 * if (below.exec(" <= 0.5")?.[1] !== "0.5" || below.test(">3")) throw new Error("unexpected");
 * ```
 */
export function censoredPatternSource(side: CensorSide, decimal: "." | "," = "."): string {
  const signs = (side === -1 ? BELOW_SIGNS : ABOVE_SIGNS)
    .map((s) => s.replace(/[.*+?^${}()|[\]\\-]/g, "\\$&")).join("|");
  const ws = `[${_TRIMMED}]*`;
  return `${ws}(?:${signs})${ws}(${numberPatternSource(decimal)})${ws}`;
}

/**
 * Read a cell such as `<0.5` or `> 1000` as a censored value.
 *
 * @param text the cell's text (surrounding spaces are ignored)
 * @param options the decimal mark and thousands separator of the number
 * @returns the side and limit, or `null` when the text is not a sign
 *   followed by a finite number
 *
 * @example
 * ```ts
 * import { parseCensored } from "./censored_cell.ts";
 * const below = parseCensored("< 0,5", { decimal: "," });
 * if (below?.side !== -1 || below.limit !== 0.5) throw new Error("unexpected");
 * if (parseCensored("≥1000")?.side !== 1) throw new Error("unexpected");
 * if (parseCensored("<0.5 mg/L") !== null) throw new Error("units make it text");
 * ```
 */
export function parseCensored(
  text: string,
  options: ParseCensoredOptions = {},
): CensoredCell | null {
  const t = text.trim();
  // Most text cells start with no sign at all: one look at the first character.
  if (!_SIGN_STARTS.includes(t.charAt(0))) return null;
  const sign = _sign(t);
  if (sign === null) return null;
  const rest = t.slice(sign.length);
  // A second sign ("<<5", "<-<5") or nothing at all is not a limit.
  if (rest.trim() === "" || _sign(rest.trim()) !== null) return null;
  const limit = parseNumber(rest, options);
  if (limit !== limit) return null;
  return Object.freeze({ side: _BELOW.includes(sign) ? -1 : 1, limit });
}

function _sign(t: string): string | null {
  for (const s of _BELOW) if (t.startsWith(s)) return s;
  for (const s of _ABOVE) if (t.startsWith(s)) return s;
  return null;
}

/**
 * Words that say a value was below a limit without giving the limit: read as
 * left-censored only where the user gives the column's limit. Compared after
 * trimming, without regard to case (common practice in laboratory exports;
 * `n.n.` is the German "nicht nachweisbar").
 * A sign followed by letters (`<LOD`, `< LOQ`, `<MDL`) counts too, see
 * {@linkcode limitWordSide}.
 */
export const BELOW_LIMIT_WORDS: readonly string[] = Object.freeze([
  "nd",
  "n.d.",
  "n/d",
  "n.n.",
  "bdl",
  "bld",
  "not detected",
  "below detection limit",
  "below detection",
]);

/**
 * Words that say a value was above a limit without giving it: read as
 * right-censored only where the user gives the column's upper limit.
 */
export const ABOVE_LIMIT_WORDS: readonly string[] = Object.freeze([
  "over range",
  "above range",
  "tntc",
]);

/**
 * Which side a limit word stands for: −1 for a below-limit word (`ND`,
 * `<LOD`), +1 for an above-limit word (`TNTC`, `>ULOQ`), `null` otherwise.
 * A sign followed by letters only (`<LLOQ`, `> range`) counts too.
 *
 * @param text the cell's text
 *
 * @example
 * ```ts
 * import { limitWordSide } from "./censored_cell.ts";
 * if (limitWordSide(" n.d. ") !== -1 || limitWordSide("TNTC") !== 1) throw new Error("unexpected");
 * if (limitWordSide("broken vial") !== null) throw new Error("unexpected");
 * ```
 */
export function limitWordSide(text: string): CensorSide | null {
  const t = text.trim().toLowerCase();
  if (BELOW_LIMIT_WORDS.includes(t)) return -1;
  if (ABOVE_LIMIT_WORDS.includes(t)) return 1;
  const sign = _sign(t);
  if (sign !== null && /^\s*[a-z][a-z .]*$/.test(t.slice(sign.length))) {
    return _BELOW.includes(sign) ? -1 : 1;
  }
  return null;
}
