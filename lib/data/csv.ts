/**
 * The general CSV reader, built on csv-parse: quoted fields (with delimiters,
 * quotes and line breaks inside), any of `\n`, `\r\n` or `\r` line ends
 * (`\r\r\n` counts as two lines, but never makes a blank row). Cells are
 * trimmed of every Unicode space,
 * and blank lines at the end of the text are never rows, as in the quick
 * reader.
 *
 * @module
 */
import { parse } from "../_deps/csv_parse.ts";
import { type _CellRules, _newColumn, _storeTextCell } from "./_raw_column.ts";
import {
  type _CsvRead,
  _malformed,
  _noHeader,
  _ragged,
  _unclosedQuoteLine,
} from "./_csv_common.ts";
import { uniqueNames } from "./header.ts";

interface _Parsed {
  readonly record: string[];
  readonly raw: string;
  /** The line where the record ends and the byte offset just after it. */
  readonly info: { readonly lines: number; readonly bytes: number };
}

/**
 * Read a CSV text with csv-parse.
 *
 * @param text the text, without a byte-order mark
 * @param delimiter one character
 * @param rules how cells are read
 * @param source the source's name for messages
 */
export function _readCsv(
  text: string,
  delimiter: string,
  rules: _CellRules,
  source: string,
): _CsvRead {
  // End the last line, as a file read does: csv-parse drops a last line of
  // spaces that has no line end, so " " would read as an empty text.
  if (text !== "" && !/[\r\n]$/.test(text)) text += "\n";
  let all: _Parsed[];
  try {
    all = parse(text, {
      delimiter,
      // Every line end, in any mix: csv-parse otherwise takes the first one it
      // meets as the only record delimiter and reads the others as data.
      record_delimiter: ["\r\n", "\n", "\r"],
      skip_empty_lines: false,
      trim: true,
      info: true,
      raw: true,
      relax_column_count: true,
    }) as unknown as _Parsed[];
  } catch (e) {
    throw _fromParser(e, text, source);
  }
  // Blank lines: skipped before the header and, when the header has several
  // columns, everywhere; in a one-column table a blank line after the header
  // is a missing cell. Same rule as the quick reader.
  const blank = (p: _Parsed) => p.raw.replace(/[\r\n]/g, "") === "";
  let first = 0;
  while (first < all.length && blank(all[first])) first++;
  if (first === all.length) throw _noHeader(source);
  const header = all[first].record;
  // In a one-column table a blank line is a missing cell, but not the empty
  // "line" between the two ends of "\r\r\n" (a CRLF file whose "\n" was
  // turned into "\r\n" once more): a line end written twice over. Its lines
  // are still counted. csv-parse gives each record's end as a byte offset.
  const bytes = header.length === 1 && text.includes("\r\r\n") ? _encoder.encode(text) : null;
  const phantom = (r: number) => {
    if (bytes === null || !blank(all[r])) return false;
    const from = all[r - 1].info.bytes;
    return all[r].info.bytes === from + 2 && bytes[from - 1] === 13 && bytes[from] === 13 &&
      bytes[from + 1] === 10;
  };
  // Blank lines at the end of the text are never rows.
  let end = all.length;
  while (end > first + 1 && blank(all[end - 1])) end--;
  const parsed = [all[first]];
  for (let r = first + 1; r < end; r++) {
    if (header.length === 1 ? !phantom(r) : !blank(all[r])) parsed.push(all[r]);
  }
  const { names, renamed } = uniqueNames(header);
  const rows = parsed.length - 1;
  const strings: string[][] = names.map(() => new Array(rows));
  const lines = new Int32Array(rows);
  const lineOf = (row: number) => lines[row];
  const columns = names.map((name, j) =>
    Object.assign(_newColumn(name, rows, () => strings[j], lineOf), {
      originalName: header[j].trim(),
    })
  );
  // csv-parse counts a "\r\n" inside a quoted field as two lines; `extra`
  // carries that over-count, which shifts every later record.
  const count = (record: readonly string[], re: RegExp) =>
    record.reduce((k, cell) => k + (cell.match(re)?.length ?? 0), 0);
  let extra = count(header, /\r\n/g);
  for (let r = 0; r < rows; r++) {
    const { record, info } = parsed[r + 1];
    // info.lines is the line where the record ends; a quoted field may span lines.
    extra += count(record, /\r\n/g);
    const breaks = count(record, /\r\n|\r|\n/g);
    const line = info.lines - extra - breaks;
    lines[r] = line;
    if (record.length !== names.length) throw _ragged(source, line, record.length, names.length);
    for (let j = 0; j < record.length; j++) {
      // Trimmed of every Unicode space, as the quick reader trims.
      const trimmed = record[j].trim();
      strings[j][r] = rules.missing.has(trimmed.toLowerCase()) ? "" : trimmed;
      _storeTextCell(columns[j], r, trimmed, line, rules);
    }
  }
  return { columns, rowCount: rows, renamed };
}

const _encoder = new TextEncoder();
const _lineBreaks = /\r\n|\r|\n/g;

/**
 * The line of a csv-parse error, from the byte offset where the failing
 * record starts (`bytes`) and the record read so far (`raw`). csv-parse's own
 * `lines` counts a "\r\n" inside quotes as two lines, so it drifts.
 */
function _errorLine(text: string, err: { bytes?: unknown; raw?: unknown }): number | null {
  if (typeof err.bytes !== "number" || typeof err.raw !== "string") return null;
  const before = new TextDecoder().decode(new TextEncoder().encode(text).subarray(0, err.bytes));
  return 1 + (before.match(_lineBreaks)?.length ?? 0) + (err.raw.match(_lineBreaks)?.length ?? 0);
}

/** Turn a csv-parse error into a `"malformed"` PlumbError naming the line. */
function _fromParser(e: unknown, text: string, source: string) {
  const err = e as {
    code?: string;
    lines?: number;
    message?: string;
    bytes?: unknown;
    raw?: unknown;
  };
  if (err.code === "CSV_QUOTE_NOT_CLOSED") {
    return _malformed(
      source,
      _unclosedQuoteLine(text) ?? err.lines ?? null,
      "a quoted field opens on this line and is never closed",
      "add the closing double quote",
    );
  }
  const detail = String(err.message ?? e).split(":")[0].trim();
  return _malformed(
    source,
    _errorLine(text, err) ?? err.lines ?? null,
    `the quoting cannot be read (${detail})`,
    'put quotes only around whole fields and write a quote inside a quoted field as ""',
  );
}
