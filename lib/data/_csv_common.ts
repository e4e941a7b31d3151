/**
 * What the two CSV readers share: their result shape and their errors.
 *
 * @module
 */
import type { HeaderRename } from "./table.ts";
import type { _RawColumn } from "./_raw_column.ts";
import { PlumbError } from "../errors.ts";

/** The columns read from a CSV text. */
export interface _CsvRead {
  readonly columns: _RawColumn[];
  readonly rowCount: number;
  readonly renamed: readonly HeaderRename[];
}

/** A `"malformed"` error naming the source and the line. */
export function _malformed(
  source: string,
  line: number | null,
  what: string,
  todo: string,
): PlumbError {
  const where = line === null ? source : `${source} at line ${line}`;
  return new PlumbError("malformed", `Malformed CSV in ${where}: ${what}; ${todo}`, {
    source,
    line,
  });
}

/** The error for a text with no header line. */
export function _noHeader(source: string): PlumbError {
  return _malformed(
    source,
    null,
    "there is no header row (the text is empty)",
    "start the text with a line of column names",
  );
}

/** The error for a line whose field count differs from the header's. */
export function _ragged(
  source: string,
  line: number,
  fields: number,
  expected: number,
): PlumbError {
  return _malformed(
    source,
    line,
    `${fields} ${fields === 1 ? "field" : "fields"} where the header has ${expected}`,
    "give every line as many fields as the header (an empty field still needs its delimiter)",
  );
}

/**
 * The line where a double-quoted field opens and never closes, or null when
 * every quote is closed.
 */
export function _unclosedQuoteLine(text: string): number | null {
  let line = 1;
  let open = false;
  let openedAt = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 34) {
      open = !open;
      if (open) openedAt = line;
    } else if (c === 10 || c === 13) {
      // "\r\n", "\n" and a lone "\r" each end one line
      if (c === 13 && text.charCodeAt(i + 1) === 10) i++;
      line++;
    }
  }
  return open ? openedAt : null;
}
