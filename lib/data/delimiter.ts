/**
 * Choosing the field delimiter of a CSV text.
 *
 * @module
 */
import { parseNumber } from "./number_parse.ts";

/** The delimiters {@linkcode detectDelimiter} chooses among, in order of preference on a tie. */
export const DELIMITERS: readonly string[] = Object.freeze([",", ";", "\t", "|"]);

/** How many non-empty lines the detection looks at. */
const _SAMPLE_LINES = 20;

/**
 * Pick the delimiter of a CSV text among `,` `;` tab and `|`.
 *
 * The rule: count each candidate outside quotes on the first 20 non-empty
 * lines. A candidate qualifies when it appears on the header line; among
 * those, the one whose count is the same on the most sampled lines wins;
 * on a tie, the one that splits the data lines into more cells that read
 * as numbers (with the decimal comma for `;`, the point otherwise), so that
 * `Zeit;Konzentration, mg/L` over `1;2,5` splits on `;` and not inside the
 * numbers; then the one with more fields, then the earlier in `,` `;` tab
 * `|`. When no candidate appears on the header line, the text has a single
 * column and `,` is returned.
 *
 * @param text the CSV text (or its beginning)
 * @returns the delimiter
 *
 * @example
 * ```ts
 * import { detectDelimiter } from "./delimiter.ts";
 * if (detectDelimiter("a;b\n1,5;2\n") !== ";") throw new Error("unexpected");
 * if (detectDelimiter("a\tb\n1\t2\n") !== "\t") throw new Error("unexpected");
 * if (detectDelimiter("Zeit;Konzentration, mg/L\n1;2,5\n2;3,1\n") !== ";") {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function detectDelimiter(text: string): string {
  const lines = _sampleLines(text);
  if (lines.length === 0) return ",";
  const candidates = DELIMITERS.map((d, k) => {
    const header = lines[0].counts[k];
    let agree = 0;
    for (const line of lines) if (line.counts[k] === header) agree++;
    return { d, header, agree, numeric: 0 };
  }).filter((c) => c.header > 0);
  if (candidates.length === 0) return ",";
  const top = candidates.reduce((m, c) => Math.max(m, c.agree), 0);
  const tied = candidates.filter((c) => c.agree === top);
  if (tied.length > 1) {
    for (const c of tied) c.numeric = _numericCells(lines.slice(1), c.d);
  }
  tied.sort((a, b) =>
    b.numeric - a.numeric || b.header - a.header ||
    DELIMITERS.indexOf(a.d) - DELIMITERS.indexOf(b.d)
  );
  return tied[0].d;
}

/** A sampled line: its text and the count of each candidate outside double quotes. */
interface _Line {
  readonly text: string;
  readonly counts: number[];
}

/** The first non-blank lines (a quoted line break does not end a line). */
function _sampleLines(text: string): _Line[] {
  const codes = DELIMITERS.map((d) => d.charCodeAt(0));
  const lines: _Line[] = [];
  let counts = codes.map(() => 0);
  let start = 0;
  let inQuote = false;
  let blank = true;
  const limit = Math.min(text.length, 1 << 20);
  const end = (i: number) => {
    if (!blank) lines.push({ text: text.slice(start, i), counts });
    counts = codes.map(() => 0);
    blank = true;
    start = i + 1;
  };
  for (let i = 0; i < limit && lines.length < _SAMPLE_LINES; i++) {
    const c = text.charCodeAt(i);
    if (c === 34) {
      inQuote = !inQuote;
      blank = false;
    } else if (!inQuote && (c === 10 || c === 13)) {
      end(i);
    } else {
      if (c !== 32) blank = false;
      if (!inQuote) {
        const k = codes.indexOf(c);
        if (k >= 0) counts[k]++;
      }
    }
  }
  if (lines.length < _SAMPLE_LINES) end(limit);
  return lines;
}

/**
 * How many cells of the lines, split on `d` (quotes ignored: this is only a
 * tie-break), read as numbers with the decimal mark that goes with `d`.
 */
function _numericCells(lines: readonly _Line[], d: string): number {
  const decimal = d === ";" ? "," : ".";
  let k = 0;
  for (const line of lines) {
    for (const cell of line.text.split(d)) {
      if (cell.trim() !== "" && parseNumber(cell, { decimal }) === parseNumber(cell, { decimal })) {
        k++;
      }
    }
  }
  return k;
}
