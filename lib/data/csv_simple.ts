/**
 * The quick CSV reader, for UTF-8 bytes without any double quote.
 *
 * Most measurement files have no quoted fields at all. For them this reader
 * walks the bytes once, reading each field as a number while it looks for
 * the field's end (the grammar and exact cases of `number_parse.ts`), and
 * only turns a cell into a string when it is not a
 * plain number (missing tokens, censored values, text, numbers with a
 * thousands separator, numbers beyond the exact cases). That is several
 * times faster than decoding the text and handing it to csv-parse, and the
 * tests check that both readers give the same table on every fixture: the
 * same cells, missing, censored and text cells, line numbers and
 * malformed-line errors.
 *
 * Blank lines are skipped, except in a one-column table, where a blank
 * line after the header is a missing cell (counted like any other); blank
 * lines at the end of the text are never cells. `\r\n` and `\n` end lines;
 * spaces (and tabs, unless tab is the delimiter) around each field are
 * ignored, and a cell's text is trimmed of every Unicode space. The reader
 * steps aside (returns `null`) for the general reader on a double quote, a
 * lone `\r`, or a delimiter that can be part of a number (`+ - e E`).
 *
 * Cell text is not kept as strings (see `_simple_columns.ts`): a column's
 * text comes back from its numbers or is cut from the bytes when first
 * asked for; only then are the bytes kept (and a caller that reuses its
 * buffer is told).
 *
 * @module
 */
import { _cached, type _CellRules, _storeTextCell } from "./_raw_column.ts";
import { type _CsvRead, _noHeader, _ragged } from "./_csv_common.ts";
import { uniqueNames } from "./header.ts";
import { _columnTexts, _decodeCell, _fieldsOnLine, _rowStarts } from "./_csv_bytes.ts";
import { _firstInvalidUtf8, _utf8Error } from "./_encoding.ts";
import { _SimpleColumns, FORMAT_BYTES, FORMAT_NONE } from "./_simple_columns.ts";
import { _POW10, _wideDecimal } from "./_wide_decimal.ts";

/**
 * Read a quote-free CSV held as UTF-8 bytes; `null` as soon as a double
 * quote or a lone `\r` shows that the general reader is needed.
 *
 * @param bytes the text's bytes, without a byte-order mark
 * @param delimiter one ASCII character
 * @param rules how cells are read
 * @param source the source's name for messages
 * @param keep for a caller that means to reuse `bytes`: called when the
 *   table keeps them, so that the caller lets them go
 */
export function _readSimpleCsv(
  bytes: Uint8Array,
  delimiter: string,
  rules: _CellRules,
  source: string,
  keep: (() => void) | null = null,
): _CsvRead | null {
  // A delimiter that can start or continue a number would be read into it.
  if (/[-+eE0-9]/.test(delimiter)) return null;
  // A final "\n" is a sentinel: every scan below stops at one, so none needs
  // a bounds check. Adding it changes no row, cell or line number.
  if (bytes.length > 0 && bytes[bytes.length - 1] !== 10) {
    const padded = new Uint8Array(bytes.length + 1);
    padded.set(bytes);
    padded[bytes.length] = 10;
    bytes = padded;
  }
  const n = _endOfContent(bytes);
  const dc = delimiter.charCodeAt(0);
  const tabIsSpace = dc !== 9;
  const decimalCode = rules.decimalCode;
  let pos = 0;
  let line = 1;
  // Header: the first non-blank line.
  let headerEnd = 0;
  let contentEnd = 0;
  for (;;) {
    if (pos >= n) throw _noHeader(source);
    headerEnd = bytes.indexOf(10, pos);
    contentEnd = headerEnd > pos && bytes[headerEnd - 1] === 13 ? headerEnd - 1 : headerEnd;
    if (contentEnd > pos) break;
    pos = headerEnd + 1;
    line++;
  }
  const headerText = _decodeCell(bytes, pos, contentEnd);
  if (headerText === null) {
    throw _utf8Error(bytes, _firstInvalidUtf8(bytes.subarray(0, contentEnd), pos), source, line);
  }
  if (headerText.indexOf('"') !== -1 || headerText.indexOf("\r") !== -1) return null;
  const header = headerText.split(delimiter);
  const { names, renamed } = uniqueNames(header);
  const ncol = names.length;
  const last = ncol - 1;
  pos = headerEnd + 1;
  line++;

  // Room for rows: an estimate from the first data line, doubled when short.
  // Pages of a fresh buffer that are never written cost nothing.
  let firstLine = bytes.indexOf(10, pos) - pos;
  if (firstLine <= 0) firstLine = Math.max(1, n - pos);
  const dataStart = pos;
  const store = new _SimpleColumns(
    names,
    header,
    Math.ceil((n - pos) / firstLine * 1.25) + 16,
    line,
  );
  const { format, ints } = store;
  const skipBlank = ncol > 1;
  let row = 0;
  while (pos < n) {
    let c = bytes[pos];
    if (skipBlank && (c === 10 || (c === 13 && bytes[pos + 1] === 10))) {
      pos += c === 10 ? 1 : 2;
      line++;
      store.keepLines(row);
      continue;
    }
    if (row === store.capacity) store.grow();
    if (store.lines !== null) store.lines[row] = line;
    const rowStart = pos;
    for (let j = 0; j < ncol; j++) {
      // Leading spaces.
      let i = pos;
      c = bytes[i];
      while (c === 32 || (c === 9 && tabIsSpace)) c = bytes[++i];
      const a = i;
      // A number, read while looking for the end of the field. The grammar
      // and the exact cases are those of _scanNumber (number_parse.ts), on
      // bytes instead of a string. The loop is written out here because it
      // is the hot loop of a load: a shared scanner function, even inlined
      // by the engine, made 4-decimal files 25–80% slower to read (its
      // results must pass through memory; bench/csv_reader_before_after.ts).
      // The tests check both readers give bit-identical values.
      let negative = false;
      const plus = c === 43;
      if (c === 45 || plus) {
        negative = c === 45;
        c = bytes[++i];
      }
      const intStart = i;
      let mantissa = 0; // the first 15 significant digits
      let low = 0; // significant digits 16 to 19
      let significant = 0;
      let digits = 0;
      let scale = 0;
      while (c >= 48 && c <= 57) {
        if (significant > 0 || c !== 48) {
          if (significant < 15) mantissa = mantissa * 10 + (c - 48);
          else if (significant < 19) low = low * 10 + (c - 48);
          significant++;
        }
        digits++;
        c = bytes[++i];
      }
      const intDigits = i - intStart;
      const dot = c === decimalCode;
      if (dot) {
        c = bytes[++i];
        while (c >= 48 && c <= 57) {
          if (significant > 0 || c !== 48) {
            if (significant < 15) mantissa = mantissa * 10 + (c - 48);
            else if (significant < 19) low = low * 10 + (c - 48);
            significant++;
          }
          scale--;
          digits++;
          c = bytes[++i];
        }
      }
      let ok = digits > 0;
      let exponent = 0;
      const hasExponent = ok && (c === 101 || c === 69);
      if (hasExponent) {
        c = bytes[++i];
        let expNegative = false;
        if (c === 45 || c === 43) {
          expNegative = c === 45;
          c = bytes[++i];
        }
        const expStart = i;
        while (c >= 48 && c <= 57) {
          if (exponent < 100000) exponent = exponent * 10 + (c - 48);
          c = bytes[++i];
        }
        if (i === expStart) ok = false;
        if (expNegative) exponent = -exponent;
      }
      let b = i;
      // Trailing spaces, then the field must end here.
      while (c === 32 || (c === 9 && tabIsSpace)) c = bytes[++i];
      if (!(c === dc || c === 10 || (c === 13 && bytes[i + 1] === 10))) {
        ok = false;
        while (!(c === dc || c === 10 || (c === 13 && bytes[i + 1] === 10))) c = bytes[++i];
        b = i;
        while (b > a && (bytes[b - 1] === 32 || (bytes[b - 1] === 9 && tabIsSpace))) b--;
      }
      // Clinger's exact case (one rounding), or 16–19 digits by double-double.
      const k = exponent + scale;
      let v = NaN;
      if (ok && significant <= 15 && k >= -22 && k <= 22) {
        v = k >= 0 ? mantissa * _POW10[k] : mantissa / _POW10[-k];
      } else if (ok && significant <= 19 && k >= -22 && k <= 22) {
        v = _wideDecimal(mantissa, low, significant - 15, k);
      }
      if (v === v) {
        // Written plainly, so that toFixed(d) gives the same text back?
        const f = format[j];
        let plain = false;
        if (f !== FORMAT_BYTES) {
          const d = -scale;
          plain = !plus && !hasExponent && significant <= 15 && intDigits > 0 &&
            intDigits <= 15 && (intDigits === 1 || bytes[intStart] !== 48) &&
            (dot ? d > 0 : true) && !(negative && v === 0) && (f === FORMAT_NONE || f === d);
          if (plain) format[j] = d;
        }
        const m = ints[j];
        if (m !== null && plain && mantissa <= 2147483647) {
          m[row] = negative ? -mantissa : mantissa;
        } else {
          if (m !== null) store.toDoubles(j, row);
          store.values[j][row] = negative ? -v : v;
        }
        if (!plain) format[j] = FORMAT_BYTES;
      } else {
        const cell = _decodeCell(bytes, a, b);
        if (cell === null) {
          throw _utf8Error(bytes, _firstInvalidUtf8(bytes.subarray(0, b), a), source, line);
        }
        // A quote or a lone "\r": this text is for the general reader.
        if (cell.indexOf('"') !== -1 || cell.indexOf("\r") !== -1) return null;
        const col = store.forText(j, row); // before the format changes: it reads the decimals
        if (b > a) format[j] = FORMAT_BYTES;
        // Trimmed of every Unicode space (no-break spaces too), as csv-parse trims.
        _storeTextCell(col, row, cell.trim(), line, rules);
      }
      // Field separator or line end.
      if (c === dc) {
        if (j === last) throw _ragged(source, line, _fieldsOnLine(bytes, rowStart, dc), ncol);
        pos = i + 1;
      } else {
        if (j < last) throw _ragged(source, line, _fieldsOnLine(bytes, rowStart, dc), ncol);
        pos = c === 13 ? i + 2 : i + 1;
      }
    }
    row++;
    line++;
  }
  const rowCount = row;
  // The bytes are kept only when some column's text must be cut from them.
  let kept: Uint8Array | null = null;
  if (format.some((f) => f === FORMAT_BYTES)) {
    kept = bytes;
    keep?.();
  }
  const starts = _cached(() => _rowStarts(kept as Uint8Array, dataStart, rowCount, skipBlank));
  const columns = store.finish(
    rowCount,
    rules.decimal,
    (j) => _columnTexts(kept as Uint8Array, starts(), j, last, dc),
  );
  return { columns, rowCount, renamed };
}

/**
 * The end of the content: just after the line end that follows the last
 * byte that is not a line end, so that blank lines at the end of the text
 * are not rows. `bytes` ends with "\n".
 */
function _endOfContent(bytes: Uint8Array): number {
  let p = bytes.length - 1;
  while (p >= 0 && (bytes[p] === 10 || bytes[p] === 13)) p--;
  if (p < 0) return bytes.length;
  if (bytes[p + 1] === 13 && bytes[p + 2] === 10) return p + 3;
  return bytes[p + 1] === 10 ? p + 2 : bytes.length;
}
