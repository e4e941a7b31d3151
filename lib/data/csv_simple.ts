/**
 * The quick CSV reader, for UTF-8 bytes without any double quote.
 *
 * Most measurement files have no quoted fields at all. For them this reader
 * walks the bytes once, reading each field as a number while it looks for
 * the field's end, and only turns a cell into a string when it is not a
 * plain number (missing tokens, text, numbers with a thousands separator,
 * numbers beyond the exact cases of `number_parse.ts`). That is several times
 * faster than decoding the text and handing it to csv-parse, and the tests
 * check that both readers give the same table on every fixture: the same
 * cells, missing and text cells, line numbers and malformed-line errors.
 *
 * Blank lines are skipped, except in a one-column table, where a blank
 * line after the header is a missing cell (counted like any other);
 * `\r\n` and `\n` end lines; spaces (and tabs,
 * unless tab is the delimiter) around each field are ignored. Numbers are
 * read as in `number_parse.ts`: the same strict grammar, the same exact
 * cases (Clinger 1990; Dekker 1971 double-double), `Number()` otherwise.
 *
 * Cell text is not kept as strings. A column whose every number is written
 * the plain way with one fixed count of decimals (`12.3400`: no sign `+`,
 * exponent or extra leading zero, at most 15 digits), and whose other cells
 * are empty, gets its text back from its numbers (`toFixed`, which returns
 * the same digits for decimals of at most 15 significant digits). Any other
 * column's text is cut from the bytes when it is first asked for; only then
 * are the bytes kept (and a caller that reuses its buffer is told).
 *
 * @module
 */
import {
  _cached,
  type _CellRules,
  type _RawColumn,
  _storeTextCell,
  CELL_NUMBER,
} from "./_raw_column.ts";
import { type _CsvRead, _noHeader, _ragged } from "./_csv_common.ts";
import { uniqueNames } from "./header.ts";
import { _POW10, _wideDecimal } from "./number_parse.ts";
const _utf8 = new TextDecoder();

type _Mutable = { -readonly [K in keyof _RawColumn]: _RawColumn[K] };

/** Decode bytes[a, b) as UTF-8 (a cheap path for ASCII cells). */
function _decode(bytes: Uint8Array, a: number, b: number): string {
  if (b - a <= 64) {
    let ascii = true;
    for (let i = a; i < b; i++) {
      if (bytes[i] > 127) {
        ascii = false;
        break;
      }
    }
    if (ascii) return String.fromCharCode.apply(null, bytes.subarray(a, b) as unknown as number[]);
  }
  return _utf8.decode(bytes.subarray(a, b));
}

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
  // A final "\n" is a sentinel: every scan below stops at one, so none needs
  // a bounds check. Adding it changes no row, cell or line number.
  if (bytes.length > 0 && bytes[bytes.length - 1] !== 10) {
    const padded = new Uint8Array(bytes.length + 1);
    padded.set(bytes);
    padded[bytes.length] = 10;
    bytes = padded;
  }
  const n = bytes.length;
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
    if (headerEnd === -1) headerEnd = n;
    contentEnd = headerEnd > pos && bytes[headerEnd - 1] === 13 ? headerEnd - 1 : headerEnd;
    if (contentEnd > pos) break;
    pos = headerEnd + 1;
    line++;
  }
  const headerText = _utf8.decode(bytes.subarray(pos, contentEnd));
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
  let capacity = Math.ceil((n - pos) / firstLine * 1.25) + 16;
  // Lines of rows: first data line + row, until a skipped blank line makes
  // a table of them necessary.
  const firstDataLine = line;
  const dataStart = pos;
  let lines: Int32Array | null = null;
  const lineOf = (row: number) => lines === null ? firstDataLine + row : lines[row];
  const values: Float64Array[] = [];
  // A column starts compact: while every cell is a number written plainly
  // with the same d decimals and an integer part of ±(2^31 − 1) at most,
  // only the integer m = value·10^d is stored (the value is m / 10^d, the
  // very division that read it). The first other cell turns it into doubles.
  const ints: (Int32Array | null)[] = [];
  // Status arrays are made when a column first has a cell that is not a
  // plain number (until then every cell is CELL_NUMBER, 0).
  const statuses: (Uint8Array | null)[] = new Array(ncol).fill(null);
  // Per column: -1 no number yet, d ≥ 0 every number written plainly with d
  // decimals, -2 the text must be cut from the bytes.
  const format = new Int32Array(ncol).fill(-1);
  const columns: _Mutable[] = names.map((name, j) => {
    const col: _Mutable = {
      name,
      originalName: header[j].trim(),
      values: _NO_VALUES,
      status: _NO_STATUS,
      notes: [],
      texts: () => [],
      lineOf,
    };
    values.push(col.values);
    ints.push(new Int32Array(capacity));
    return col;
  });
  const more = <T extends Float64Array | Uint8Array | Int32Array>(
    a: T,
    make: (k: number) => T,
  ): T => {
    const b = make(capacity);
    b.set(a);
    return b;
  };
  const grow = () => {
    capacity *= 2;
    if (lines !== null) lines = more(lines, (k) => new Int32Array(k));
    for (let j = 0; j < ncol; j++) {
      const m = ints[j];
      if (m !== null) ints[j] = more(m, (k) => new Int32Array(k));
      else values[j] = columns[j].values = more(values[j], (k) => new Float64Array(k));
      const st = statuses[j];
      if (st !== null) statuses[j] = columns[j].status = more(st, (k) => new Uint8Array(k));
    }
  };

  // Column j from integers to doubles, for the rows before `row`.
  const toDoubles = (j: number, rows: number) => {
    const m = ints[j] as Int32Array;
    const f = new Float64Array(capacity);
    const p = _POW10[format[j] > 0 ? format[j] : 0];
    for (let r = 0; r < rows; r++) f[r] = m[r] / p;
    values[j] = columns[j].values = f;
    ints[j] = null;
  };

  const skipBlank = ncol > 1;
  let wide = 0;
  let row = 0;
  while (pos < n) {
    let c = bytes[pos];
    if (skipBlank && (c === 10 || (c === 13 && bytes[pos + 1] === 10))) {
      pos += c === 10 ? 1 : 2;
      line++;
      if (lines === null) {
        lines = new Int32Array(capacity);
        for (let r = 0; r < row; r++) lines[r] = firstDataLine + r;
      }
      continue;
    }
    if (row === capacity) grow();
    if (lines !== null) lines[row] = line;
    const rowStart = pos;
    for (let j = 0; j < ncol; j++) {
      // Leading spaces.
      let i = pos;
      c = bytes[i];
      while (c === 32 || (c === 9 && tabIsSpace)) c = bytes[++i];
      const a = i;
      // A number, read while looking for the end of the field. The digit loop
      // mirrors _scanNumber (number_parse.ts) on bytes instead of a string, kept
      // inline because it is the hot loop of a load; tests check both readers
      // give bit-identical values.
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
        while (!(c === dc || c === 10 || (c === 13 && bytes[i + 1] === 10))) {
          c = bytes[++i];
        }
        b = i;
        while (b > a && (bytes[b - 1] === 32 || (bytes[b - 1] === 9 && tabIsSpace))) b--;
      }
      const k = exponent + scale;
      if (ok && significant <= 15 && k >= -22 && k <= 22) {
        // Clinger's exact case: mantissa and 10^|k| are exact, one rounding.
        const v = k >= 0 ? mantissa * _POW10[k] : mantissa / _POW10[-k];
        // Written plainly, so that toFixed(d) gives the same text back?
        const f = format[j];
        let plain = false;
        if (f !== -2) {
          const d = -scale;
          plain = !plus && !hasExponent && intDigits > 0 && intDigits <= 15 &&
            (intDigits === 1 || bytes[intStart] !== 48) && (dot ? d > 0 : true) &&
            !(negative && v === 0) && (f === -1 || f === d);
          if (plain) format[j] = d;
        }
        const m = ints[j];
        if (m !== null && plain && mantissa <= 2147483647) {
          m[row] = negative ? -mantissa : mantissa;
        } else {
          if (m !== null) toDoubles(j, row);
          values[j][row] = negative ? -v : v;
        }
        if (!plain) format[j] = -2;
      } else if (
        ok && significant <= 19 && k >= -22 && k <= 22 &&
        (wide = _wideDecimal(mantissa, low, significant - 15, k)) === wide
      ) {
        if (ints[j] !== null) toDoubles(j, row);
        values[j][row] = negative ? -wide : wide;
        format[j] = -2;
      } else {
        const cell = _decode(bytes, a, b);
        // A quote or a lone "\r": this text is for the general reader.
        if (cell.indexOf('"') !== -1 || cell.indexOf("\r") !== -1) return null;
        if (ints[j] !== null) toDoubles(j, row);
        if (statuses[j] === null) statuses[j] = columns[j].status = new Uint8Array(capacity);
        if (b > a) format[j] = -2;
        _storeTextCell(columns[j], row, cell, line, rules);
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
  if (format.some((f) => f === -2)) {
    kept = bytes;
    keep?.();
  }
  const starts = _cached(() => _rowStarts(kept as Uint8Array, dataStart, rowCount, skipBlank));
  let allNumbers: Uint8Array | null = null;
  const trimmed: _RawColumn[] = columns.map((c, j) => {
    const st = statuses[j];
    const status = st === null ? (allNumbers ??= new Uint8Array(rowCount)) : st.subarray(0, row);
    const d = format[j];
    const decimal = rules.decimal;
    const m = ints[j];
    if (m !== null) return _compactColumn(c, m.subarray(0, row), d < 0 ? 0 : d, status, decimal);
    const vals = c.values.subarray(0, row);
    return {
      ...c,
      values: vals,
      status,
      texts: _cached(() =>
        d === -2
          ? _columnTexts(kept as Uint8Array, starts(), j, last, dc)
          : _plainTexts(vals, status, d < 0 ? 0 : d, decimal)
      ),
    };
  });
  return { columns: trimmed, rowCount, renamed };
}

/** Placeholder status until a column has a cell that is not a plain number. */
const _NO_STATUS = new Uint8Array(0);
/** Placeholder values while a column is compact. */
const _NO_VALUES = new Float64Array(0);

/**
 * A column held as integers m (every cell a number, value m / 10^d): its
 * doubles are made when first read, and a copy is made without them.
 */
function _compactColumn(
  c: _RawColumn,
  m: Int32Array,
  d: number,
  status: Uint8Array,
  decimal: "." | ",",
): _RawColumn {
  const p = _POW10[d];
  const copyValues = () => {
    const out = new Float64Array(m.length);
    for (let r = 0; r < m.length; r++) out[r] = m[r] / p;
    return out;
  };
  const values = _cached(copyValues);
  const col = {
    name: c.name,
    originalName: c.originalName,
    status,
    notes: c.notes,
    lineOf: c.lineOf,
    copyValues,
    texts: _cached(() => {
      const out: string[] = new Array(m.length);
      for (let r = 0; r < m.length; r++) {
        const t = (m[r] / p).toFixed(d);
        out[r] = decimal === "." ? t : t.replace(".", ",");
      }
      return out;
    }),
  };
  Object.defineProperty(col, "values", { get: values, enumerable: true });
  return col as unknown as _RawColumn;
}

/** A column's text from its numbers, all written plainly with `d` decimals. */
function _plainTexts(
  values: Float64Array,
  status: Uint8Array,
  d: number,
  decimal: "." | ",",
): string[] {
  const out: string[] = new Array(values.length);
  for (let r = 0; r < values.length; r++) {
    if (status[r] !== CELL_NUMBER) {
      out[r] = "";
      continue;
    }
    const t = values[r].toFixed(d);
    out[r] = decimal === "." ? t : t.replace(".", ",");
  }
  return out;
}

/**
 * The start offset of each of the `rows` rows that follow `pos`, skipping
 * blank lines as the reader did.
 */
function _rowStarts(bytes: Uint8Array, pos: number, rows: number, skipBlank: boolean): Int32Array {
  const starts = new Int32Array(rows);
  for (let r = 0; r < rows; r++) {
    if (skipBlank) {
      for (;;) {
        const c = bytes[pos];
        if (c === 10) pos++;
        else if (c === 13 && bytes[pos + 1] === 10) pos += 2;
        else break;
      }
    }
    starts[r] = pos;
    pos = bytes.indexOf(10, pos) + 1;
  }
  return starts;
}

/** How many fields the line starting at `start` has. */
function _fieldsOnLine(bytes: Uint8Array, start: number, dc: number): number {
  let fields = 1;
  for (let i = start; i < bytes.length && bytes[i] !== 10; i++) if (bytes[i] === dc) fields++;
  return fields;
}

/** Cut one column's cells out of the bytes, row by row, trimmed. */
function _columnTexts(
  bytes: Uint8Array,
  starts: Int32Array,
  j: number,
  last: number,
  dc: number,
): string[] {
  const isSpace = (c: number) => c === 32 || (c === 9 && dc !== 9);
  const out: string[] = new Array(starts.length);
  for (let r = 0; r < starts.length; r++) {
    let a = starts[r];
    for (let k = 0; k < j; k++) a = bytes.indexOf(dc, a) + 1;
    let b: number;
    if (j < last) {
      b = bytes.indexOf(dc, a);
    } else {
      b = bytes.indexOf(10, a);
      if (b === -1) b = bytes.length;
      if (b > a && bytes[b - 1] === 13) b--;
    }
    while (a < b && isSpace(bytes[a])) a++;
    while (b > a && isSpace(bytes[b - 1])) b--;
    out[r] = _decode(bytes, a, b);
  }
  return out;
}
