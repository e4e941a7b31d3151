// Householder QR: the blocked factor of tall matrices and the pivoted QR of
// small ones. Properties that identify the factorisation: RᵀR = AᵀA with R
// upper triangular (R is then unique up to the signs of its rows), Q
// orthogonal, the pivoted diagonal non-increasing, and the rank of matrices
// built with a known rank. Tolerances are stated per check, as multiples of
// the unit roundoff u = 2⁻⁵³ times the sizes involved.
import assert from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import {
  applyQ,
  applyQt,
  pivotedQr,
  solveUpper,
  solveUpperTransposed,
} from "../../lib/numeric/small_qr.ts";
import { tallQrFactor } from "../../lib/numeric/tall_qr.ts";
import { assertClose } from "../_assert_close.ts";

const rng = seededRandom(5401);

function randomMatrix(m: number, c: number): Float64Array {
  return Float64Array.from({ length: m * c }, () => rng.normal());
}

/** AᵀA for a column-major m × c matrix. */
function gram(a: Float64Array, m: number, c: number): Float64Array {
  const g = new Float64Array(c * c);
  for (let i = 0; i < c; i++) {
    for (let j = 0; j < c; j++) {
      let s = 0;
      for (let k = 0; k < m; k++) s += a[i * m + k] * a[j * m + k];
      g[j * c + i] = s;
    }
  }
  return g;
}

Deno.test("tallQrFactor: RᵀR = AᵀA, R upper triangular, for every block size", () => {
  const m = 333, c = 7;
  const a = randomMatrix(m, c);
  const g = gram(a, m, c);
  const ref = tallQrFactor(a, [m, c], { blockRows: m });
  for (const blockRows of [1, 3, 8, 64, 100, 333, 1000]) {
    const r = tallQrFactor(a, [m, c], { blockRows });
    for (let i = 0; i < c; i++) {
      for (let j = 0; j < i; j++) assert.equal(r[j * c + i], 0, "zero below the diagonal");
    }
    const rtr = gram(r, c, c);
    for (let k = 0; k < c * c; k++) {
      // entries of AᵀA are sums of m products of O(1) values: error ≲ m·u·‖a‖²
      assertClose(rtr[k], g[k], { abs: 1e-12 * m }, `RᵀR[${k}], blockRows ${blockRows}`);
      assertClose(Math.abs(r[k]), Math.abs(ref[k]), { abs: 1e-12 }, `|R| independent of blocks`);
    }
  }
});

Deno.test("tallQrFactor: a block filler gives the same R as the stored matrix", () => {
  const m = 50, c = 4;
  const a = randomMatrix(m, c);
  const fill = (start: number, len: number, out: Float64Array) => {
    for (let j = 0; j < c; j++) {
      for (let i = 0; i < len; i++) out[j * len + i] = a[j * m + start + i];
    }
  };
  assert.deepEqual(
    tallQrFactor(fill, [m, c], { blockRows: 16 }),
    tallQrFactor(a, [m, c], { blockRows: 16 }),
  );
});

Deno.test("tallQrFactor: zero and repeated columns give finite R with a zero pivot", () => {
  const m = 20;
  const x = Float64Array.from({ length: m }, () => rng.normal());
  const a = new Float64Array(3 * m);
  a.set(x, 0);
  a.set(x, 2 * m); // column 1 zero, column 2 repeats column 0
  const r = tallQrFactor(a, [m, 3], { blockRows: 7 });
  assert.ok(r.every(Number.isFinite));
  assert.equal(r[1 * 3 + 1], 0);
  assertClose(
    Math.abs(r[2 * 3 + 2]),
    0,
    { abs: 1e-14 },
    "dependent column leaves ~0 on the diagonal",
  );
  assert.throws(() => tallQrFactor(new Float64Array(5), [2, 2]), RangeError);
});

Deno.test("pivotedQr largest: |R₁₁| ≥ |R₂₂| ≥ …, QᵀAP = R, QQᵀ = I", () => {
  const m = 12, c = 6;
  const a = randomMatrix(m, c);
  const f = pivotedQr(a, [m, c], { tolerance: 0 });
  assert.equal(f.rank, c);
  for (let k = 1; k < c; k++) {
    assert.ok(Math.abs(f.qr[k * m + k]) <= Math.abs(f.qr[(k - 1) * m + k - 1]) * (1 + 1e-14));
  }
  for (let k = 0; k < c; k++) {
    const col = a.slice(f.pivot[k] * m, f.pivot[k] * m + m);
    applyQt(f, col);
    for (let i = 0; i < m; i++) {
      const expected = i <= k ? f.qr[k * m + i] : 0;
      assertClose(col[i], expected, { abs: 1e-14 * m }, `QᵀAP column ${k}, row ${i}`);
    }
  }
  const x = Float64Array.from({ length: m }, () => rng.normal());
  const y = x.slice();
  applyQt(f, y);
  applyQ(f, y);
  for (let i = 0; i < m; i++) assertClose(y[i], x[i], { abs: 1e-14 * m }, `QQᵀx[${i}]`);
});

Deno.test("pivotedQr: the rank of matrices built with rank 3 in 6 columns", () => {
  const m = 15, base = randomMatrix(m, 3);
  const a = new Float64Array(m * 6);
  a.set(base, 0);
  const mix = [[1, 2, 0], [0.5, -1, 3], [-2, 0, 1]];
  for (let j = 0; j < 3; j++) {
    for (let i = 0; i < m; i++) {
      a[(3 + j) * m + i] = mix[j][0] * base[i] + mix[j][1] * base[m + i] +
        mix[j][2] * base[2 * m + i];
    }
  }
  for (const pivoting of ["largest", "given"] as const) {
    const f = pivotedQr(a, [m, 6], { pivoting });
    assert.equal(f.rank, 3, pivoting);
  }
  const given = pivotedQr(a, [m, 6], { pivoting: "given" });
  assert.deepEqual(
    [...given.pivot],
    [0, 1, 2, 3, 4, 5],
    "the later columns are the dependent ones",
  );
  // a nearly dependent column counts as dependent below the tolerance only
  const near = a.slice();
  for (let i = 0; i < m; i++) near[5 * m + i] += 1e-9 * rng.normal();
  assert.equal(pivotedQr(near, [m, 6], { pivoting: "given" }).rank, 3, "1e-9 < 1e-7: dependent");
  assert.equal(pivotedQr(near, [m, 6], { pivoting: "given", tolerance: 1e-12 }).rank, 4);
  assert.equal(pivotedQr(a, [m, 6], { maxRank: 2 }).rank, 2, "maxRank caps the reduction");
});

Deno.test("solveUpper and solveUpperTransposed invert the leading triangle", () => {
  const m = 8, c = 5;
  const f = pivotedQr(randomMatrix(m, c), [m, c]);
  const b = Float64Array.from({ length: c }, () => rng.normal());
  const x = solveUpper(f, b);
  for (let i = 0; i < c; i++) {
    let s = 0;
    for (let j = i; j < c; j++) s += f.qr[j * m + i] * x[j];
    assertClose(s, b[i], { abs: 1e-13 }, `R·x = b, row ${i}`);
  }
  const w = b.slice();
  solveUpperTransposed(f, w);
  for (let j = 0; j < c; j++) {
    let s = 0;
    for (let i = 0; i <= j; i++) s += f.qr[j * m + i] * w[i];
    assertClose(s, b[j], { abs: 1e-13 }, `Rᵀ·w = b, row ${j}`);
  }
});

Deno.test("pivotedQr: bad shapes and tolerances are range errors", () => {
  assert.throws(() => pivotedQr(new Float64Array(3), [2, 2]), RangeError);
  assert.throws(() => pivotedQr(new Float64Array(4), [2, 2], { tolerance: 1 }), RangeError);
});
