/**
 * Tables from CSV text: the choice of delimiter, decimal mark and reader.
 *
 * @module
 */
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import { _buildTable } from "./_build_table.ts";
import { detectDelimiter } from "./delimiter.ts";
import { _cellRules, _checkLimitColumns, type CellOptions } from "./read_options.ts";
import { _readSimpleCsv } from "./csv_simple.ts";
import { _readCsv } from "./csv.ts";

const _utf8 = new TextDecoder();
const _encoder = new TextEncoder();

/** Options for {@linkcode tableFromCsv}. */
export interface CsvOptions extends CellOptions {
  /**
   * The field delimiter: one character other than a double quote or a line
   * break. Detected among `,` `;` tab `|` when not given (see
   * `detectDelimiter`).
   * @default detected
   */
  readonly delimiter?: string;
  /**
   * Which reader to use: `"auto"` takes the quick reader for texts without
   * double quotes and csv-parse otherwise; `"csv-parse"` and `"simple"`
   * force one (`"simple"` refuses texts with quotes). Both give the same
   * table.
   * @default "auto"
   */
  readonly reader?: "auto" | "csv-parse" | "simple";
  /**
   * The name shown as the table's source.
   * @default "text"
   */
  readonly sourceName?: string;
}

/**
 * Build a table from CSV text (a string, or UTF-8 bytes). The first
 * non-blank line is the header; later blank lines are skipped, except in a
 * one-column table, where each is a missing cell; a UTF-8 byte-order mark is dropped; `\n`, `\r\n`
 * (and, with quotes or the general reader, `\r`) end lines.
 *
 * @param text the CSV text, or its UTF-8 bytes
 * @param options delimiter, decimal mark, thousands separator, missing tokens, reader
 * @returns a frozen table
 * @throws {PlumbError} `"malformed"` naming the line for an unclosed quote,
 *   a line with the wrong number of fields, or a text without a header;
 *   `"bad-option"` for options that cannot be used together
 *
 * @example
 * ```ts
 * import { tableFromCsv } from "./csv_text.ts";
 * const t = tableFromCsv("fill;line\n500,2;A\n499,8;B\n");
 * if (t.numeric("fill").values.join() !== "500.2,499.8" || t.textNames().join() !== "line") {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function tableFromCsv(text: string | Uint8Array, options: CsvOptions = {}): Table {
  return _tableFromCsv(text, options, null);
}

/**
 * {@linkcode tableFromCsv} for a caller that reuses its bytes after the
 * call unless the table keeps them: `keep` is called when it does.
 */
export function _tableFromCsv(
  text: string | Uint8Array,
  options: CsvOptions,
  keep: (() => void) | null,
): Table {
  let bytes: Uint8Array | null = null;
  let body: string | null = null;
  if (text instanceof Uint8Array) {
    bytes = text[0] === 0xef && text[1] === 0xbb && text[2] === 0xbf ? text.subarray(3) : text;
  } else if (typeof text === "string") {
    body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  } else {
    throw new PlumbError(
      "bad-option",
      "Cannot read CSV from a value that is neither a string nor bytes: give the CSV text",
    );
  }
  const source = options.sourceName ?? "text";
  const delimiter = options.delimiter ??
    detectDelimiter(body ?? _utf8.decode((bytes as Uint8Array).subarray(0, 1 << 16)));
  if (typeof delimiter !== "string" || delimiter.length !== 1 || /["\r\n]/.test(delimiter)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${
        JSON.stringify(delimiter)
      } as a delimiter: give one character other than a double quote or a line break`,
    );
  }
  const rules = _cellRules(options, delimiter === ";" ? "," : ".");
  // A thousands separator equal to the delimiter is allowed: it can only
  // occur inside quoted fields ("1,234" in a comma file).
  if (rules.decimal === delimiter) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${JSON.stringify(delimiter)} as both delimiter and decimal mark: give decimal: ${
        delimiter === "," ? '"."' : '","'
      } or another delimiter`,
    );
  }
  const reader = options.reader ?? "auto";
  if (reader !== "auto" && reader !== "csv-parse" && reader !== "simple") {
    throw new PlumbError(
      "bad-option",
      `Unknown reader ${JSON.stringify(reader)}: use "auto", "csv-parse" or "simple"`,
    );
  }
  let read = null;
  if (reader !== "csv-parse" && delimiter.charCodeAt(0) < 128) {
    read = _readSimpleCsv(
      bytes ?? _encoder.encode(body as string),
      delimiter,
      rules,
      source,
      bytes === null ? null : keep,
    );
  }
  if (read === null && reader === "simple") {
    throw new PlumbError(
      "bad-option",
      'Cannot use the simple reader on this text: it has double quotes, lone "\\r" line ends or a delimiter outside ASCII; use reader: "auto"',
    );
  }
  if (read === null) {
    read = _readCsv(body ?? _utf8.decode(bytes as Uint8Array), delimiter, rules, source);
  }
  _checkLimitColumns(rules, read.columns.map((c) => c.name));
  return _buildTable(read.columns, {
    source,
    rowCount: read.rowCount,
    renamed: read.renamed,
    delimiter,
    decimal: rules.decimal,
  });
}
