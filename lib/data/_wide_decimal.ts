/**
 * Exact decimal-to-double conversion for 16–19 significant digits by
 * double-double arithmetic (Dekker 1971), and the exact powers of ten.
 *
 * @module
 */

/** Powers of ten that are exact in binary64 (10^0 … 10^22). */
export const _POW10: readonly number[] = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

// Dekker's splitting constant 2^27 + 1.
const _SPLIT = 134217729;

/** The exact product a·b as hi + lo (Dekker 1971, TwoProduct without FMA). */
function _twoProduct(a: number, b: number, out: Float64Array): void {
  const p = a * b;
  let t = _SPLIT * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = _SPLIT * b;
  const bh = t - (t - b);
  const bl = b - bh;
  out[0] = p;
  out[1] = ((ah * bh - p) + ah * bl + al * bh) + al * bl;
}

const _pair = new Float64Array(2);

/**
 * The correctly rounded double of (high·10^lowDigits + low)·10^k for a
 * 16–19 digit decimal (high: its first 15 digits; low: the 1–4 digits
 * after them) and |k| ≤ 22, or NaN when it cannot be decided cheaply.
 *
 * Method: the decimal's integer is formed exactly as a double-double
 * (Dekker 1971, "A floating-point technique for extending the available
 * precision", Numerische Mathematik 18: TwoProduct and TwoSum), then
 * multiplied or divided by the exact power 10^|k| in double-double
 * arithmetic, whose relative error is far below 2^-95. The rounded sum s is
 * returned only when every value within that error of the computed one
 * rounds to s; otherwise (about one case in 2^40) the caller falls back to
 * the engine's correctly rounded `Number()`.
 */
export function _wideDecimal(high: number, low: number, lowDigits: number, k: number): number {
  // m = high·10^lowDigits + low, exactly, as mh + ml.
  _twoProduct(high, _POW10[lowDigits], _pair);
  let mh = _pair[0] + low;
  const bb = mh - _pair[0];
  let ml = (_pair[0] - (mh - bb)) + (low - bb) + _pair[1];
  let s = mh + ml;
  ml = ml - (s - mh);
  mh = s;
  let h: number;
  let l: number;
  const p = _POW10[k >= 0 ? k : -k];
  if (k >= 0) {
    _twoProduct(mh, p, _pair);
    h = _pair[0];
    l = _pair[1] + ml * p;
  } else {
    h = mh / p;
    _twoProduct(h, p, _pair);
    l = ((mh - _pair[0]) - _pair[1] + ml) / p;
  }
  s = h + l;
  const err = l - (s - h);
  const margin = Math.abs(s) * 2.5e-29; // ≈ 2^-95, well above the error bound
  return s + (err - margin) === s && s + (err + margin) === s ? s : NaN;
}
