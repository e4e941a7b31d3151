/**
 * Column helpers for the model design: named inputs, factor levels in
 * natural order, and the design's columns, which are never stored: each is
 * described by its source and filled block by block, centred and scaled, on
 * demand. Private to `lib/stats`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** Columns by name: a plain object, or a list of `[name, values]` pairs (keeps any name's order). */
export type Named<T> = Readonly<Record<string, T>> | readonly (readonly [string, T])[];

/** The `[name, values]` pairs of a {@linkcode Named} input, in order. */
export function _namedList<T>(input: Named<T> | undefined, what: string): [string, T][] {
  if (input === undefined) return [];
  if (Array.isArray(input)) {
    return input.map((pair, i) => {
      if (!Array.isArray(pair) || pair.length !== 2 || typeof pair[0] !== "string") {
        throw new PlumbError(
          "bad-option",
          `Cannot read ${what} entry ${i}: give [name, values] pairs or an object of columns`,
        );
      }
      return [pair[0], pair[1]] as [string, T];
    });
  }
  if (typeof input !== "object" || input === null) {
    throw new PlumbError("bad-option", `Cannot read ${what}: give an object of named columns`);
  }
  return Object.entries(input as Record<string, T>);
}

/**
 * Natural order of labels: labels that all read as numbers sort by value,
 * otherwise numbers first (by value), then text by code units.
 *
 * @example
 * ```ts
 * import { compareLabels } from "./_design_columns.ts";
 * if (["10", "9", "B", "A"].sort(compareLabels).join() !== "9,10,A,B") throw new Error("order");
 * ```
 */
export function compareLabels(a: string, b: string): number {
  const x = a.trim() === "" ? NaN : Number(a), y = b.trim() === "" ? NaN : Number(b);
  const xn = Number.isFinite(x), yn = Number.isFinite(y);
  if (xn && yn) return x - y || (a < b ? -1 : a > b ? 1 : 0);
  if (xn !== yn) return xn ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * The levels of a factor on the given rows (natural order, see
 * {@linkcode compareLabels}) and each row's level index.
 */
export function _levelCodes(
  raw: ArrayLike<string | number | null | undefined>,
  rows: Int32Array | null,
  n: number,
): { levels: string[]; codes: Int32Array } {
  const index = new Map<string, number>();
  const first: string[] = [];
  const tmp = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    const label = String(raw[rows === null ? k : rows[k]]);
    let c = index.get(label);
    if (c === undefined) {
      c = first.length;
      index.set(label, c);
      first.push(label);
    }
    tmp[k] = c;
  }
  const levels = first.slice().sort(compareLabels);
  const remap = new Int32Array(first.length);
  levels.forEach((l, i) => (remap[index.get(l)!] = i));
  for (let k = 0; k < n; k++) tmp[k] = remap[tmp[k]];
  return { levels, codes: tmp };
}

/** Where a design column's raw values come from. */
export type _Source =
  | { readonly kind: "intercept" }
  /** An input column (full length: indexed through the complete rows). */
  | { readonly kind: "numeric"; readonly values: Float64Array }
  /** An indicator of one level; `codes` are indexed by complete row. */
  | { readonly kind: "dummy"; readonly codes: Int32Array; readonly level: number }
  /** A product of covariates (centred and divided by their root mean square) and indicators. */
  | {
    readonly kind: "product";
    readonly numeric: readonly { values: Float64Array; centre: number; scale: number }[];
    readonly dummies: readonly { codes: Int32Array; level: number }[];
  };

/** A design column: its raw values are (source − centre) / scale. */
export interface _ColumnSpec {
  readonly source: _Source;
  readonly centre: number;
  readonly scale: number;
}

/**
 * Write complete rows `start … start + len − 1` of a column into
 * `out[off …]`. `rows` maps complete rows to input positions (`null` when
 * every row is complete).
 */
export function _fillColumn(
  spec: _ColumnSpec,
  rows: Int32Array | null,
  start: number,
  len: number,
  out: Float64Array,
  off: number,
): void {
  const { source: src, centre: c, scale: s } = spec;
  if (src.kind === "intercept") {
    out.fill((1 - c) / s, off, off + len);
  } else if (src.kind === "numeric") {
    const v = src.values;
    if (rows === null) { for (let i = 0; i < len; i++) out[off + i] = (v[start + i] - c) / s; }
    else for (let i = 0; i < len; i++) out[off + i] = (v[rows[start + i]] - c) / s;
  } else if (src.kind === "dummy") {
    const one = (1 - c) / s, zero = (0 - c) / s, codes = src.codes, level = src.level;
    for (let i = 0; i < len; i++) out[off + i] = codes[start + i] === level ? one : zero;
  } else {
    for (let i = 0; i < len; i++) {
      const k = start + i, at = rows === null ? k : rows[k];
      let t = 1;
      for (const d of src.dummies) if (d.codes[k] !== d.level) t = 0;
      for (const u of src.numeric) t *= (u.values[at] - u.centre) / u.scale;
      out[off + i] = (t - c) / s;
    }
  }
}

/** A column's range on the complete rows and its centre and norm after centring. */
export interface _ColumnStats {
  readonly min: number;
  readonly max: number;
  /** The mean, by two passes (Chan, Golub & LeVeque 1983, The American Statistician 37:242–247). */
  readonly centre: number;
  /** The norm of the centred column (0 when constant); cannot overflow. */
  readonly norm: number;
}

const _STATS_BLOCK = 4096;

/**
 * The range, mean and centred norm of a column over the n complete rows, in
 * one pass over shifted data: with K the first value and t = x − K, the
 * centre is K + Σt/n and the centred norm √(Σt² − (Σt)²/n) (the
 * shifted-data algorithm: Chan, Golub & LeVeque 1983, The American
 * Statistician 37:242–247), accurate unless K lies far from the mean. When
 * that cancellation would cost more than 8 digits, or Σt² overflows or
 * underflows, a second pass shifts by the first pass's mean and divides by a
 * power of two near the spread (exact).
 */
export function _columnStats(source: _Source, rows: Int32Array | null, n: number): _ColumnStats {
  const raw: _ColumnSpec = { source, centre: 0, scale: 1 };
  const buf = new Float64Array(Math.min(n, _STATS_BLOCK));
  if (n === 0) return { min: Infinity, max: -Infinity, centre: 0, norm: 0 };
  _fillColumn(raw, rows, 0, 1, buf, 0);
  const first = _shiftedSums(raw, rows, n, buf, buf[0], 1);
  const { min, max } = first;
  if (min === max) return { min, max, centre: min, norm: 0 };
  let pass = first, shift = buf[0], b = 1;
  const ok = (q: typeof first) =>
    Number.isFinite(q.st2) && q.st2 > 1e-280 && q.st2 - (q.st * q.st) / n > 1e-8 * q.st2;
  if (!ok(pass)) {
    // the sums overflowed or underflowed, or the first value lies far from the
    // mean: shift by the mean, scale by a power of two near the spread (exact)
    const guess = shift + pass.st / n;
    shift = Number.isFinite(guess) && guess >= min && guess <= max ? guess : min / 2 + max / 2;
    b = 2 ** Math.floor(Math.log2(Math.max(max - shift, shift - min)));
    pass = _shiftedSums(raw, rows, n, buf, shift, b);
  }
  return {
    min,
    max,
    centre: shift + b * (pass.st / n),
    norm: b * Math.sqrt(Math.max(0, pass.st2 - (pass.st * pass.st) / n)),
  };
}

function _shiftedSums(
  raw: _ColumnSpec,
  rows: Int32Array | null,
  n: number,
  buf: Float64Array,
  shift: number,
  b: number,
): { min: number; max: number; st: number; st2: number } {
  let min = Infinity, max = -Infinity, st = 0, st2 = 0;
  for (let start = 0; start < n; start += _STATS_BLOCK) {
    const len = Math.min(_STATS_BLOCK, n - start);
    _fillColumn(raw, rows, start, len, buf, 0);
    for (let i = 0; i < len; i++) {
      const v = buf[i];
      if (v < min) min = v;
      if (v > max) max = v;
      const t = (v - shift) / b;
      st += t;
      st2 += t * t;
    }
  }
  return { min, max, st, st2 };
}
