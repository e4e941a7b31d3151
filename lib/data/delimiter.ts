/**
 * Choosing the field delimiter of a CSV text.
 *
 * @module
 */

/** The delimiters {@linkcode detectDelimiter} chooses among, in order of preference on a tie. */
export const DELIMITERS: readonly string[] = Object.freeze([",", ";", "\t", "|"]);

/** How many non-empty lines the detection looks at. */
const _SAMPLE_LINES = 20;

/**
 * Pick the delimiter of a CSV text among `,` `;` tab and `|`.
 *
 * The rule: count each candidate outside quotes on the first 20 non-empty
 * lines. A candidate qualifies when it appears on the header line; among
 * those, the one whose count is the same on the most sampled lines wins,
 * then the one with more fields, then the earlier in `,` `;` tab `|`. When no
 * candidate appears on the header line, the text has a single column and
 * `,` is returned.
 *
 * @param text the CSV text (or its beginning)
 * @returns the delimiter
 *
 * @example
 * ```ts
 * import { detectDelimiter } from "./delimiter.ts";
 * if (detectDelimiter("a;b\n1,5;2\n") !== ";") throw new Error("unexpected");
 * if (detectDelimiter("a\tb\n1\t2\n") !== "\t") throw new Error("unexpected");
 * ```
 */
export function detectDelimiter(text: string): string {
  const counts = _countPerLine(text);
  if (counts.length === 0) return ",";
  let best = ",";
  let bestScore = -1;
  let bestFields = 0;
  DELIMITERS.forEach((d, k) => {
    const header = counts[0][k];
    if (header === 0) return;
    let agree = 0;
    for (const line of counts) if (line[k] === header) agree++;
    if (agree > bestScore || (agree === bestScore && header > bestFields)) {
      best = d;
      bestScore = agree;
      bestFields = header;
    }
  });
  return best;
}

/** Per sampled line, the count of each candidate outside double quotes. */
function _countPerLine(text: string): number[][] {
  const codes = DELIMITERS.map((d) => d.charCodeAt(0));
  const lines: number[][] = [];
  let current = codes.map(() => 0);
  let inQuote = false;
  let blank = true;
  const limit = Math.min(text.length, 1 << 20);
  for (let i = 0; i < limit && lines.length < _SAMPLE_LINES; i++) {
    const c = text.charCodeAt(i);
    if (c === 34) {
      inQuote = !inQuote;
      blank = false;
    } else if (!inQuote && (c === 10 || c === 13)) {
      if (!blank) lines.push(current);
      current = codes.map(() => 0);
      blank = true;
    } else {
      if (c !== 32) blank = false;
      if (!inQuote) {
        const k = codes.indexOf(c);
        if (k >= 0) current[k]++;
      }
    }
  }
  if (!blank && lines.length < _SAMPLE_LINES) lines.push(current);
  return lines;
}
