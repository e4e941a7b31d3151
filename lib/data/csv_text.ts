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
import {
  type _BinaryKind,
  _bomEncoding,
  _decodeAs,
  _decodeUtf8,
  _guessEncoding,
  _sniffBinary,
} from "./_encoding.ts";

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
  /**
   * The text encoding of a file or bytes: any WHATWG label such as
   * `"windows-1252"`, `"iso-8859-15"`, `"utf-16le"` or `"shift_jis"`. Without
   * it a byte-order mark decides (UTF-8, UTF-16LE, UTF-16BE), else UTF-8,
   * and bytes that are not UTF-8 are an error naming the line and the likely
   * encoding.
   * @default UTF-8, or what the byte-order mark says
   */
  readonly encoding?: string;
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
 * call unless the table keeps them: `keep` is called when it does. Such a
 * caller's bytes are followed by at least one spare byte of the same
 * buffer, where a final line end may be written without a copy.
 */
export function _tableFromCsv(
  text: string | Uint8Array,
  options: CsvOptions,
  keep: (() => void) | null,
): Table {
  const source = options.sourceName ?? "text";
  let { bytes, body } = _textOf(text, options.encoding, source);
  if (bytes !== null && keep !== null && bytes.length > 0 && bytes[bytes.length - 1] !== 10) {
    bytes = new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.length + 1);
    bytes[bytes.length - 1] = 10;
  }
  // An Excel-style first line "sep=;" names the delimiter. It is replaced by
  // its own line end (a blank line), so line numbers stay those of the file.
  const sep = _sepLine(bytes ?? (body as string));
  if (sep !== null) {
    if (bytes !== null) bytes = bytes.subarray(sep.skip);
    else body = (body as string).slice(sep.skip);
  }
  const delimiter = options.delimiter ?? sep?.delimiter ??
    detectDelimiter(body ?? _utf8.decode((bytes as Uint8Array).subarray(0, 1 << 16)));
  if (typeof delimiter !== "string" || delimiter.length !== 1 || /["\r\n0-9]/.test(delimiter)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${
        JSON.stringify(delimiter)
      } as a delimiter: give one character other than a digit, a double quote or a line break`,
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
    read = _readCsv(body ?? _decodeUtf8(bytes as Uint8Array, source), delimiter, rules, source);
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

/**
 * The text to read: UTF-8 bytes (kept as bytes, for the quick reader) or a
 * string, after the byte-order mark or the `encoding` option has said how
 * to decode. Files that are not text are refused by their signature.
 */
function _textOf(
  text: string | Uint8Array,
  encoding: string | undefined,
  source: string,
): { bytes: Uint8Array | null; body: string | null } {
  if (typeof text === "string") {
    if (encoding !== undefined) {
      throw new PlumbError(
        "bad-option",
        "Cannot apply the encoding option to a string: it is already text; give the encoding with a file path or bytes",
      );
    }
    return { bytes: null, body: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text };
  }
  if (!(text instanceof Uint8Array)) {
    throw new PlumbError(
      "bad-option",
      "Cannot read CSV from a value that is neither a string nor bytes: give the CSV text",
    );
  }
  const binary = _sniffBinary(text);
  if (binary !== null) throw _notText(binary, source);
  const bom = _bomEncoding(text);
  if (encoding !== undefined && !_isUtf8(encoding, source)) {
    // TextDecoder drops a byte-order mark that matches the encoding.
    return { bytes: null, body: _decodeAs(text, encoding, source) };
  }
  if (bom === null || bom.encoding === "utf-8") {
    const bytes = bom === null ? text : text.subarray(bom.length);
    const guess = bytes.subarray(0, 4096).includes(0) ? _guessEncoding(bytes) : "utf-8";
    if (guess.startsWith("utf-16")) {
      throw new PlumbError(
        "malformed",
        `Cannot read ${source} as UTF-8: every other byte is zero, so the text looks like ${guess.toUpperCase()} without a byte-order mark; pass { encoding: "${guess}" }`,
        { source, encoding: guess },
      );
    }
    return { bytes, body: null };
  }
  if (bom.encoding.startsWith("utf-32")) {
    throw new PlumbError(
      "malformed",
      `Cannot read ${source}: its byte-order mark says ${bom.encoding.toUpperCase()}, which is not supported; save the file as UTF-8 (or UTF-16)`,
      { source, encoding: bom.encoding },
    );
  }
  return { bytes: null, body: _decodeAs(text.subarray(bom.length), bom.encoding, source) };
}

function _isUtf8(label: string, source: string): boolean {
  if (typeof label !== "string") {
    throw new PlumbError(
      "bad-option",
      `The encoding option must be a label such as "windows-1252": ${source} was given ${
        String(label)
      }`,
    );
  }
  try {
    return new TextDecoder(label).encoding === "utf-8";
  } catch {
    return false; // _decodeAs names the unknown label
  }
}

const _KIND_NAMES: Record<_BinaryKind, string> = {
  xlsx: "an Excel workbook (.xlsx)",
  parquet: "a Parquet file",
  arrow: "an Arrow IPC file",
  "arrow-stream": "an Arrow IPC stream",
  xls: "a legacy Excel workbook (.xls)",
  gzip: "a gzip-compressed file",
  zip: "a zip archive",
};

/** The error for bytes whose signature shows they are not CSV text. */
function _notText(kind: _BinaryKind, source: string): PlumbError {
  const todo: Record<_BinaryKind, string> = {
    xlsx:
      "give the file's path to loadTable, which reads workbooks (the sheet option picks a sheet)",
    parquet: "give the file's path to loadTable, which reads Parquet files",
    arrow: "give the file's path to loadTable, which reads Arrow files",
    "arrow-stream": "give the file's path to loadTable, which reads Arrow files",
    xls: "save it as .xlsx or CSV from the spreadsheet program",
    gzip: "decompress it first (e.g. gunzip) and load the CSV inside",
    zip: "extract the CSV from the archive first",
  };
  return new PlumbError(
    "malformed",
    `Cannot read ${source} as CSV: its first bytes show it is ${_KIND_NAMES[kind]}; ${todo[kind]}`,
    { source, format: kind },
  );
}

/** A first line `sep=X`: the delimiter X and where the next line end starts. */
function _sepLine(text: Uint8Array | string): { delimiter: string; skip: number } | null {
  const at = (i: number) => typeof text === "string" ? text.charCodeAt(i) : text[i];
  // "sep=" in either case, one character, then a line end.
  const head = [115, 101, 112, 61];
  for (let i = 0; i < 4; i++) if ((at(i) | 0x20) !== head[i]) return null;
  const d = at(4);
  const end = at(5);
  // NaN or undefined past the end fails the comparison.
  if (!(d >= 9) || d === 10 || d === 13 || !(end === 10 || end === 13)) return null;
  return { delimiter: String.fromCharCode(d), skip: 5 };
}
