/**
 * The triangular factor R of a tall matrix (many rows, few columns) by
 * Householder QR, taken one block of rows at a time so that each block stays
 * in the processor's cache.
 *
 * Method: Householder QR (Golub & Van Loan 2013, *Matrix Computations*, 4th
 * ed., Johns Hopkins, Algorithms 5.1.1 and 5.2.1), with the reflector
 * convention of LAPACK's `dlarfg` (Anderson et al. 1999, *LAPACK Users'
 * Guide*, 3rd ed., SIAM: β = −sign(α)·‖x‖, so that no step subtracts nearly
 * equal numbers). The rows are taken in blocks in the sequential ("flat
 * tree") order of TSQR (Demmel, Grigori, Hoemmen & Langou 2012, SIAM Journal
 * on Scientific Computing 34:A206–A239): the running R is stacked on the
 * next block and the stack is reduced to triangular form again, a row
 * update of the QR factorisation (Golub & Van Loan §6.5.3). The k-th
 * reflector of a block touches row k of the running R and the block's rows
 * only, so each block costs about 2·L·c² flops for L rows and c columns.
 *
 * Accuracy: the whole sequence is a product of Householder reflections, so
 * the computed R is the exact factor of A + δA with ‖δA‖ ≤ γ·‖A‖, γ a modest
 * multiple of c·u per column (u = 2⁻⁵³; Higham 2002, *Accuracy and Stability
 * of Numerical Algorithms*, 2nd ed., SIAM, Theorem 19.4). Q is not kept:
 * callers that need residuals compute them from the original columns.
 *
 * Special cases: a column that is zero below the running R gives the
 * identity reflector (R keeps a zero or the value it had); the factor of a
 * rank-deficient matrix is computed all the same, with small diagonal
 * entries where columns depend on earlier ones. Columns should be of
 * moderate scale (the linear model scales them to unit norm first): a sum
 * of squares that overflows raises a `RangeError`.
 *
 * @module
 */

/** Options for {@linkcode tallQrFactor}. */
export interface TallQrOptions {
  /**
   * Rows per block. Blocks of a few thousand values stay in a typical
   * level-2 cache.
   * @default the largest multiple of 8 with blockRows·cols ≤ 16384, at least 64
   */
  readonly blockRows?: number;
}

/** The default number of rows per block for `cols` columns. */
export function defaultBlockRows(cols: number): number {
  return Math.max(64, Math.floor(16384 / Math.max(1, cols) / 8) * 8);
}

/**
 * Writes rows `start … start + len − 1` of a matrix into `out`,
 * column-major len × c: a way to factor a matrix that is never stored whole.
 */
export type BlockFill = (start: number, len: number, out: Float64Array) => void;

/**
 * The c × c upper-triangular factor R of the QR factorisation A = QR of an
 * n × c matrix A, given stored column by column (`a[j·n + i]` is row i,
 * column j) or as a function that fills blocks of rows. The matrix is not
 * modified. The signs of R's rows are those the reflections give (diagonal
 * entries may be negative); RᵀR = AᵀA.
 *
 * @param a the matrix, column-major (length n·c), or a block filler
 * @param shape `[n, c]`
 * @param options block size
 * @returns R, column-major c × c (`r[j·c + i]` is row i, column j), zero below the diagonal
 * @example
 * ```ts
 * import { tallQrFactor } from "./tall_qr.ts";
 * // columns (1, 1, 1, 1) and (0, 1, 2, 3): R = [[2, 3], [0, √5]] up to signs
 * const r = tallQrFactor(new Float64Array([1, 1, 1, 1, 0, 1, 2, 3]), [4, 2]);
 * if (Math.abs(Math.abs(r[0]) - 2) > 1e-15 || Math.abs(Math.abs(r[3]) - Math.sqrt(5)) > 1e-15) {
 *   throw new Error("R");
 * }
 * ```
 */
export function tallQrFactor(
  a: Float64Array | BlockFill,
  shape: readonly [number, number],
  options: TallQrOptions = {},
): Float64Array {
  const [rows, cols] = shape;
  if (a instanceof Float64Array && a.length !== rows * cols) {
    throw new RangeError(`tallQrFactor: ${a.length} values given for ${rows} × ${cols}`);
  }
  const blockRows = options.blockRows ?? defaultBlockRows(cols);
  if (!Number.isInteger(blockRows) || blockRows < 1) {
    throw new RangeError(`tallQrFactor: blockRows must be a positive whole number`);
  }
  const c = cols;
  const fill: BlockFill = typeof a === "function" ? a : (start, len, out) => {
    for (let j = 0; j < c; j++) {
      out.set(a.subarray(j * rows + start, j * rows + start + len), j * len);
    }
  };
  const r = new Float64Array(c * c);
  const block = new Float64Array(Math.min(rows, blockRows) * c);
  for (let start = 0; start < rows; start += blockRows) {
    const len = Math.min(blockRows, rows - start);
    fill(start, len, block);
    _reduceBlock(r, c, block, len);
  }
  return r;
}

/**
 * Reduce the stack [R; B] to triangular form in place: R (c × c, upper
 * triangular) receives the new factor; B (len × c, column-major) is
 * overwritten with the reflectors' lower parts.
 */
function _reduceBlock(r: Float64Array, c: number, b: Float64Array, len: number): void {
  for (let k = 0; k < c; k++) {
    const vk = k * len;
    let sigma = 0;
    for (let i = 0; i < len; i++) sigma += b[vk + i] * b[vk + i];
    if (sigma === 0) continue; // nothing below R[k][k]: the identity reflector
    const alpha = r[k * c + k];
    const norm = Math.sqrt(alpha * alpha + sigma);
    if (!Number.isFinite(norm)) {
      throw new RangeError(`tallQrFactor: column ${k} overflows; scale the columns first`);
    }
    const beta = alpha <= 0 ? norm : -norm;
    const tau = (beta - alpha) / beta;
    const scale = 1 / (alpha - beta);
    for (let i = 0; i < len; i++) b[vk + i] *= scale;
    r[k * c + k] = beta;
    // v = (1 at row k of R, b[vk …] in the block); apply I − τvvᵀ to columns
    // j > k, two at a time (one pass over v for both dot products and both updates)
    let j = k + 1;
    for (; j + 1 < c; j += 2) {
      const bj = j * len, bj2 = bj + len;
      let dot = r[j * c + k], dot2 = r[(j + 1) * c + k];
      for (let i = 0; i < len; i++) {
        const vi = b[vk + i];
        dot += vi * b[bj + i];
        dot2 += vi * b[bj2 + i];
      }
      dot *= tau;
      dot2 *= tau;
      r[j * c + k] -= dot;
      r[(j + 1) * c + k] -= dot2;
      for (let i = 0; i < len; i++) {
        const vi = b[vk + i];
        b[bj + i] -= dot * vi;
        b[bj2 + i] -= dot2 * vi;
      }
    }
    if (j < c) {
      const bj = j * len;
      let dot = r[j * c + k];
      for (let i = 0; i < len; i++) dot += b[vk + i] * b[bj + i];
      dot *= tau;
      r[j * c + k] -= dot;
      for (let i = 0; i < len; i++) b[bj + i] -= dot * b[vk + i];
    }
  }
}
