/**
 * The growing columns of the quick CSV reader, and the raw columns they
 * become once the last row is read.
 *
 * A column starts compact: while every cell is a number written plainly
 * with the same d decimals and an integer part of ±(2^31 − 1) at most, only
 * the integer m = value·10^d is stored (the value is m / 10^d, the very
 * division that read it); its doubles are made when first read, and a copy
 * is made without them. The first other cell turns it into doubles. Status
 * arrays are made when a column first has a cell that is not a plain number
 * (until then every cell is CELL_NUMBER, 0).
 *
 * A column's text comes back from its numbers (`toFixed`, which returns the
 * same digits for decimals of at most 15 significant digits) while every
 * number was written plainly with one count of decimals; any other column's
 * text is cut from the bytes when it is first asked for.
 *
 * @module
 */
import { _cached, type _RawColumn, CELL_NUMBER } from "./_raw_column.ts";
import { _POW10 } from "./_wide_decimal.ts";

type _Mutable = { -readonly [K in keyof _RawColumn]: _RawColumn[K] };

/** Format code: no number seen yet. */
export const FORMAT_NONE = -1;
/** Format code: the column's text must be cut from the bytes. */
export const FORMAT_BYTES = -2;

const _NO_STATUS = new Uint8Array(0);
const _NO_VALUES = new Float64Array(0);

/** The columns being filled, row by row. */
export class _SimpleColumns {
  /** Rows the arrays have room for. */
  capacity: number;
  /** Per column, the doubles (once it is not compact). */
  readonly values: Float64Array[] = [];
  /** Per column, the integers m while compact, else null. */
  readonly ints: (Int32Array | null)[] = [];
  /** Per column, the status codes once some cell is not a plain number. */
  readonly statuses: (Uint8Array | null)[];
  /** Per column: FORMAT_NONE, d ≥ 0 (every number plain with d decimals), or FORMAT_BYTES. */
  readonly format: Int32Array;
  /** The line of each row, once a skipped blank line makes them irregular. */
  lines: Int32Array | null = null;
  readonly columns: _Mutable[];
  readonly #firstDataLine: number;

  constructor(names: readonly string[], header: readonly string[], capacity: number, line: number) {
    this.capacity = capacity;
    this.#firstDataLine = line;
    this.statuses = new Array(names.length).fill(null);
    this.format = new Int32Array(names.length).fill(FORMAT_NONE);
    const lineOf = (row: number) => this.lines === null ? line + row : this.lines[row];
    this.columns = names.map((name, j) => {
      const col: _Mutable = {
        name,
        originalName: header[j].trim(),
        values: _NO_VALUES,
        status: _NO_STATUS,
        notes: [],
        texts: () => [],
        lineOf,
      };
      this.values.push(col.values);
      this.ints.push(new Int32Array(capacity));
      return col;
    });
  }

  /** Double the room of every array. */
  grow(): void {
    this.capacity *= 2;
    const k = this.capacity;
    const more = <T extends Float64Array | Uint8Array | Int32Array>(a: T, b: T): T => {
      b.set(a);
      return b;
    };
    if (this.lines !== null) this.lines = more(this.lines, new Int32Array(k));
    for (let j = 0; j < this.columns.length; j++) {
      const m = this.ints[j];
      if (m !== null) this.ints[j] = more(m, new Int32Array(k));
      else this.values[j] = this.columns[j].values = more(this.values[j], new Float64Array(k));
      const st = this.statuses[j];
      if (st !== null) this.statuses[j] = this.columns[j].status = more(st, new Uint8Array(k));
    }
  }

  /** Column j from integers to doubles, for the rows before `rows`. */
  toDoubles(j: number, rows: number): void {
    const m = this.ints[j] as Int32Array;
    const f = new Float64Array(this.capacity);
    const p = _POW10[this.format[j] > 0 ? this.format[j] : 0];
    for (let r = 0; r < rows; r++) f[r] = m[r] / p;
    this.values[j] = this.columns[j].values = f;
    this.ints[j] = null;
  }

  /** Column j ready for a cell that is not a plain number: doubles and a status array. */
  forText(j: number, row: number): _RawColumn {
    if (this.ints[j] !== null) this.toDoubles(j, row);
    if (this.statuses[j] === null) {
      this.statuses[j] = this.columns[j].status = new Uint8Array(this.capacity);
    }
    return this.columns[j];
  }

  /** From now on every row's line is kept (a blank line was skipped before `row`). */
  keepLines(row: number): void {
    if (this.lines !== null) return;
    this.lines = new Int32Array(this.capacity);
    for (let r = 0; r < row; r++) this.lines[r] = this.#firstDataLine + r;
  }

  /**
   * The raw columns of `rows` rows; `bytesTexts(j)` cuts column j's text
   * from the bytes (for the columns that need it).
   */
  finish(rows: number, decimal: "." | ",", bytesTexts: (j: number) => string[]): _RawColumn[] {
    let allNumbers: Uint8Array | null = null;
    return this.columns.map((c, j) => {
      const st = this.statuses[j];
      const status = st === null ? (allNumbers ??= new Uint8Array(rows)) : st.subarray(0, rows);
      const d = this.format[j];
      const m = this.ints[j];
      if (m !== null) return _compactColumn(c, m.subarray(0, rows), d < 0 ? 0 : d, status, decimal);
      const vals = this.values[j].subarray(0, rows);
      return {
        ...c,
        values: vals,
        status,
        texts: _cached(() =>
          d === FORMAT_BYTES ? bytesTexts(j) : _plainTexts(vals, status, d < 0 ? 0 : d, decimal)
        ),
      };
    });
  }
}

/** A column held as integers m (every cell a number, value m / 10^d). */
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
