import { deepEqual, equal, ok } from "node:assert/strict";
import fc from "fast-check";
import { KEEP_SCRATCH_MAX_N, RADIX_MIN_N, sortFloat64 } from "../../lib/numeric/sort.ts";
import { seededRandom } from "../../lib/numeric/random.ts";

/** Compare element by element, telling −0 from +0 only where the order matters. */
function sameOrder(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    if (!(a[i] === b[i] || (Number.isNaN(a[i]) && Number.isNaN(b[i])))) return false;
  }
  return true;
}

Deno.test("radix sort agrees with the built-in sort on random doubles of every magnitude", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double(), { minLength: RADIX_MIN_N, maxLength: 4000 }),
      (arr) => {
        const x = new Float64Array(arr);
        return sameOrder(sortFloat64(x.slice()), x.slice().sort());
      },
    ),
    { seed: 20261204, numRuns: 100 },
  );
});

Deno.test("radix sort: −0 before +0, NaNs last, infinities and subnormals in place", () => {
  const n = 2000;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = ((i * 7919) % n) - n / 2 + 0.5; // no zeros
  x[3] = -0;
  x[4] = 0;
  x[5] = NaN;
  x[6] = -Infinity;
  x[7] = Infinity;
  x[8] = 5e-324;
  x[9] = -5e-324;
  x[10] = 1.7976931348623157e308;
  // A NaN with the sign bit set must still sort last.
  new DataView(x.buffer).setFloat64(11 * 8, -NaN, true);
  new Uint8Array(x.buffer)[11 * 8 + 7] |= 0x80;
  const s = sortFloat64(x);
  equal(s, x, "sorts in place and returns its argument");
  equal(s[0], -Infinity);
  ok(Number.isNaN(s[n - 1]) && Number.isNaN(s[n - 2]));
  equal(s[n - 3], Infinity);
  equal(s[n - 4], 1.7976931348623157e308);
  const zero = s.indexOf(0);
  ok(Object.is(s[zero], -0) && Object.is(s[zero + 1], 0), "−0 immediately before +0");
  equal(s[zero - 1], -5e-324);
  equal(s[zero + 2], 5e-324);
  for (let i = 1; i < n - 2; i++) ok(s[i - 1] <= s[i], `order at ${i}`);
});

Deno.test("radix sort: sorted, reversed and constant inputs; subarray views", () => {
  const up = new Float64Array(3000).map((_, i) => i - 1500.5);
  deepEqual(sortFloat64(up.slice()), up);
  deepEqual(sortFloat64(up.slice().reverse()), up);
  const same = new Float64Array(1000).fill(3.25);
  deepEqual(sortFloat64(same.slice()), same);
  const big = new Float64Array(4000).map((_, i) => (i * 37) % 4000);
  const view = big.subarray(1000, 3000);
  const expected = view.slice().sort();
  sortFloat64(view);
  deepEqual(view, expected);
  equal(big[0], 0, "outside the view untouched");
});

Deno.test("radix sort: the kept scratch serves sorts of every size in turn, growing and not", () => {
  // Sizes below, at and above the kept scratch's limit, growing and shrinking, so that a
  // sort after a larger one sees a longer buffer than it needs; each against the built-in.
  const rng = seededRandom(44);
  for (const n of [20_000, 200_000, 30_000, KEEP_SCRATCH_MAX_N, KEEP_SCRATCH_MAX_N + 1, 50_000]) {
    const x = new Float64Array(n).map(() => (rng.uniform() - 0.5) * 10 ** (20 * rng.uniform()));
    ok(sameOrder(sortFloat64(x.slice()), x.slice().sort()), `n = ${n}`);
  }
});
