/**
 * Householder QR with column pivoting for small dense matrices (tens to a
 * few hundred columns), with a tolerance that decides the numerical rank,
 * and the triangular solves that go with it.
 *
 * Method: Householder QR with column pivoting (Golub & Van Loan 2013,
 * *Matrix Computations*, 4th ed., Johns Hopkins, Algorithm 5.4.1; reflectors
 * by Algorithm 5.1.1 with LAPACK's sign convention, β = −sign(α)·‖x‖). Two
 * pivot rules:
 * - `"largest"` (Golub & Van Loan 5.4.1): at step k, bring forward the
 *   column whose part below row k has the largest norm; stop when that norm
 *   is at most `tolerance` × the largest original column norm. This is the
 *   rank-revealing rule.
 * - `"given"`: keep the columns in the order given, except that a column
 *   whose remaining norm is at most `tolerance` × its original norm is moved
 *   to the end and left unreduced (the "limited pivoting" of LINPACK's
 *   `dqrdc` as modified for R's `lm`; Dongarra, Bunch, Moler & Stewart 1979,
 *   *LINPACK Users' Guide*, SIAM, ch. 9). Earlier columns win, so the
 *   columns called dependent are the later ones, in the user's terms.
 *
 * Remaining column norms are recomputed from scratch at every step rather
 * than downdated (the matrices are small), which avoids the cancellation of
 * norm downdating that Golub & Van Loan §5.4.1 warn about (see also Drmač &
 * Bujanović 2008, ACM Transactions on Mathematical Software 35(2):12).
 *
 * Accuracy: backward stable (Higham 2002, *Accuracy and Stability of
 * Numerical Algorithms*, 2nd ed., Theorem 19.4).
 *
 * @module
 */

/** Options for {@linkcode pivotedQr}. */
export interface PivotedQrOptions {
  /**
   * Relative norm below which a column counts as dependent on the columns
   * already taken; 0 means only exact zeros count.
   * @default 1e-7
   */
  readonly tolerance?: number;
  /**
   * `"largest"` (rank-revealing, Golub & Van Loan 5.4.1) or `"given"` (keep
   * the order, move dependent columns to the end).
   * @default "largest"
   */
  readonly pivoting?: "largest" | "given";
  /**
   * Reduce at most this many columns (the rest are left as they are after
   * the reflections, with their position kept).
   * @default the smaller of rows and columns
   */
  readonly maxRank?: number;
}

/** A compact QR factorisation A·P = Q·R of a small matrix. */
export interface PivotedQr {
  /** Rows m. */
  readonly rows: number;
  /** Columns c. */
  readonly cols: number;
  /**
   * Column-major m × c: R on and above the diagonal (first `rank` columns
   * reduced), Householder vectors below it (their leading 1 implicit).
   */
  readonly qr: Float64Array;
  /** The reflectors' τ, one per reduced column (length `rank`). */
  readonly tau: Float64Array;
  /** `pivot[k]` is the original index of the column in position k. */
  readonly pivot: Int32Array;
  /** The numerical rank: the number of columns reduced. */
  readonly rank: number;
}

/**
 * Householder QR with column pivoting of a small m × c matrix (column-major,
 * not modified), reducing only the columns found independent.
 *
 * @param a the matrix, column-major (`a[j·m + i]` is row i, column j)
 * @param shape `[m, c]`
 * @param options tolerance and pivot rule
 * @example
 * ```ts
 * import { pivotedQr } from "./small_qr.ts";
 * // the third column is the sum of the first two
 * const f = pivotedQr(new Float64Array([1, 0, 1, 0, 1, 1, 1, 1, 2]), [3, 3], { pivoting: "given" });
 * if (f.rank !== 2 || f.pivot[2] !== 2) throw new Error("rank");
 * ```
 */
export function pivotedQr(
  a: Float64Array,
  shape: readonly [number, number],
  options: PivotedQrOptions = {},
): PivotedQr {
  const [m, c] = shape;
  const tol = options.tolerance ?? 1e-7;
  const rule = options.pivoting ?? "largest";
  if (a.length !== m * c) throw new RangeError(`pivotedQr: ${a.length} values for ${m} × ${c}`);
  if (!(tol >= 0 && tol < 1)) throw new RangeError(`pivotedQr: tolerance ${tol} outside [0, 1)`);
  const qr = a.slice();
  const pivot = Int32Array.from({ length: c }, (_, j) => j);
  const original = new Float64Array(c);
  for (let j = 0; j < c; j++) original[j] = _norm(qr, j * m, m);
  const largest = original.reduce((x, y) => Math.max(x, y), 0);
  const tau = new Float64Array(Math.min(m, c));
  const cap = Math.min(m, options.maxRank ?? c);
  let k = 0; // next position to reduce
  let end = c; // columns at positions ≥ end were found dependent
  while (k < Math.min(cap, end)) {
    if (rule === "largest") {
      let best = k, bestNorm = -1;
      for (let p = k; p < end; p++) {
        const nrm = _norm(qr, p * m + k, m - k);
        if (nrm > bestNorm) [best, bestNorm] = [p, nrm];
      }
      if (bestNorm <= tol * largest) break;
      _swap(qr, pivot, m, k, best);
    } else {
      const nrm = _norm(qr, k * m + k, m - k);
      if (nrm <= tol * original[pivot[k]]) {
        // dependent: rotate it to the end, keeping the others' order
        const col = qr.slice(k * m, k * m + m), id = pivot[k];
        qr.copyWithin(k * m, (k + 1) * m, c * m);
        qr.set(col, (c - 1) * m);
        pivot.copyWithin(k, k + 1, c);
        pivot[c - 1] = id;
        end--;
        continue;
      }
    }
    tau[k] = _reflect(qr, m, c, k);
    k++;
  }
  return Object.freeze({ rows: m, cols: c, qr, tau: tau.slice(0, k), pivot, rank: k });
}

function _norm(a: Float64Array, from: number, len: number): number {
  let s = 0;
  for (let i = 0; i < len; i++) s += a[from + i] * a[from + i];
  return Math.sqrt(s);
}

function _swap(a: Float64Array, pivot: Int32Array, m: number, p: number, q: number): void {
  if (p === q) return;
  for (let i = 0; i < m; i++) {
    const t = a[p * m + i];
    a[p * m + i] = a[q * m + i];
    a[q * m + i] = t;
  }
  const t = pivot[p];
  pivot[p] = pivot[q];
  pivot[q] = t;
}

/** Reduce column k below the diagonal and apply the reflector to columns k+1 … c−1; returns τ. */
function _reflect(a: Float64Array, m: number, c: number, k: number): number {
  const kk = k * m + k;
  const alpha = a[kk];
  let sigma = 0;
  for (let i = kk + 1; i < k * m + m; i++) sigma += a[i] * a[i];
  if (sigma === 0) return 0;
  const norm = Math.sqrt(alpha * alpha + sigma);
  const beta = alpha <= 0 ? norm : -norm;
  const tau = (beta - alpha) / beta;
  const scale = 1 / (alpha - beta);
  for (let i = kk + 1; i < k * m + m; i++) a[i] *= scale;
  a[kk] = beta;
  for (let j = k + 1; j < c; j++) {
    const jk = j * m + k;
    let dot = a[jk];
    for (let i = 1; i < m - k; i++) dot += a[kk + i] * a[jk + i];
    dot *= tau;
    a[jk] -= dot;
    for (let i = 1; i < m - k; i++) a[jk + i] -= dot * a[kk + i];
  }
  return tau;
}

/**
 * Overwrite `x` (length m) with Qᵀx, for the Q of a factorisation from
 * {@linkcode pivotedQr}.
 *
 * @param f the factorisation
 * @param x the vector, changed in place
 * @example
 * ```ts
 * import { applyQt, pivotedQr } from "./small_qr.ts";
 * const f = pivotedQr(new Float64Array([3, 4]), [2, 1]);
 * const x = new Float64Array([3, 4]);
 * applyQt(f, x); // the column itself maps to (±5, 0)
 * if (Math.abs(Math.abs(x[0]) - 5) > 1e-15 || Math.abs(x[1]) > 1e-15) throw new Error("Qᵀx");
 * ```
 */
export function applyQt(f: PivotedQr, x: Float64Array): void {
  for (let k = 0; k < f.rank; k++) _applyReflector(f, k, x);
}

/**
 * Overwrite `x` (length m) with Qx, for the Q of a factorisation from
 * {@linkcode pivotedQr}.
 *
 * @param f the factorisation
 * @param x the vector, changed in place
 * @example
 * ```ts
 * import { applyQ, applyQt, pivotedQr } from "./small_qr.ts";
 * const f = pivotedQr(new Float64Array([1, 2, 2, 0, 1, 5]), [3, 2]);
 * const x = new Float64Array([0.5, -1, 2]);
 * applyQt(f, x);
 * applyQ(f, x);
 * if (Math.abs(x[1] + 1) > 1e-15) throw new Error("QQᵀ = I");
 * ```
 */
export function applyQ(f: PivotedQr, x: Float64Array): void {
  for (let k = f.rank - 1; k >= 0; k--) _applyReflector(f, k, x);
}

function _applyReflector(f: PivotedQr, k: number, x: Float64Array): void {
  const { qr, rows: m } = f;
  const t = f.tau[k];
  if (t === 0) return;
  const base = k * m;
  let dot = x[k];
  for (let i = k + 1; i < m; i++) dot += qr[base + i] * x[i];
  dot *= t;
  x[k] -= dot;
  for (let i = k + 1; i < m; i++) x[i] -= dot * qr[base + i];
}

/**
 * Solve R₁₁·b = x[0 … rank) by back substitution, with R₁₁ the leading
 * rank × rank triangle of R; returns b (in pivoted order).
 *
 * @param f the factorisation
 * @param x the right-hand side (its first `rank` entries are used)
 * @example
 * ```ts
 * import { pivotedQr, solveUpper } from "./small_qr.ts";
 * const f = pivotedQr(new Float64Array([2, 0, 1, 4]), [2, 2], { pivoting: "given" });
 * const b = solveUpper(f, new Float64Array([4, 8])); // R = [[-2, -1], [0, -4]] up to signs
 * if (!(Number.isFinite(b[0]) && Number.isFinite(b[1]))) throw new Error("solve");
 * ```
 */
export function solveUpper(f: PivotedQr, x: ArrayLike<number>): Float64Array {
  const { qr, rows: m, rank: r } = f;
  const b = new Float64Array(r);
  for (let i = r - 1; i >= 0; i--) {
    let s = x[i];
    for (let j = i + 1; j < r; j++) s -= qr[j * m + i] * b[j];
    b[i] = s / qr[i * m + i];
  }
  return b;
}

/**
 * Solve R₁₁ᵀ·w = x for w (forward substitution with the transposed leading
 * triangle), in place in `x` (its first `rank` entries).
 *
 * @param f the factorisation
 * @param x the right-hand side, overwritten with the solution
 * @example
 * ```ts
 * import { pivotedQr, solveUpperTransposed } from "./small_qr.ts";
 * const f = pivotedQr(new Float64Array([3, 4]), [2, 1]);
 * const w = new Float64Array([5]);
 * solveUpperTransposed(f, w); // R = [−5]
 * if (w[0] !== -1) throw new Error("solve");
 * ```
 */
export function solveUpperTransposed(f: PivotedQr, x: Float64Array): void {
  const { qr, rows: m, rank: r } = f;
  for (let i = 0; i < r; i++) {
    let s = x[i];
    for (let j = 0; j < i; j++) s -= qr[i * m + j] * x[j];
    x[i] = s / qr[i * m + i];
  }
}
