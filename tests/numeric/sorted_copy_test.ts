import { equal, ok } from "node:assert/strict";
import fc from "fast-check";
import { seededRandom } from "../../lib/numeric/random.ts";
import { sortedCopy, sortFloat64, SPLIT_MIN_N } from "../../lib/numeric/sort.ts";

/** Bit-for-bit the same doubles (−0 and +0 differ; any NaN equals any NaN). */
function sameBits(a: Float64Array, b: Float64Array): string | undefined {
  if (a.length !== b.length) return `lengths ${a.length} and ${b.length}`;
  for (let i = 0; i < a.length; i++) {
    if (!(Object.is(a[i], b[i]) || (Number.isNaN(a[i]) && Number.isNaN(b[i])))) {
      return `at ${i}: ${a[i]} and ${b[i]}`;
    }
  }
  return undefined;
}

Deno.test("sortedCopy: same order as sortFloat64 on a copy, below the split size", () => {
  fc.assert(
    fc.property(fc.array(fc.double(), { maxLength: 3000 }), (arr) => {
      const x = new Float64Array(arr);
      const before = x.slice();
      const d = sameBits(sortedCopy(x), sortFloat64(x.slice()));
      return d === undefined && sameBits(x, before) === undefined;
    }),
    { seed: 20261201, numRuns: 60 },
  );
});

Deno.test("sortedCopy: split-and-merge path keeps −0 before +0, ties, NaNs last, input intact", () => {
  const n = SPLIT_MIN_N + 3;
  const rng = seededRandom(5);
  const x = new Float64Array(n);
  // Rounded normal values (many ties), zeros of both signs on both halves, NaNs, infinities.
  for (let i = 0; i < n; i++) x[i] = Math.round(rng.normal() * 100) / 10;
  for (const i of [3, 17, n - 5, n >>> 1, (n >>> 1) + 1]) x[i] = -0;
  for (const i of [4, n - 2, (n >>> 1) - 1]) x[i] = 0;
  x[10] = NaN;
  x[n - 1] = NaN;
  x[11] = Infinity;
  x[n - 3] = -Infinity;
  const before = x.slice();
  const got = sortedCopy(x);
  const want = sortFloat64(x.slice());
  equal(sameBits(got, want), undefined);
  equal(sameBits(x, before), undefined, "the input is not modified");
  ok(Number.isNaN(got[n - 1]) && Number.isNaN(got[n - 2]));
  equal(got[0], -Infinity);
});

Deno.test("sortedCopy: split path on already sorted, reversed and constant inputs", () => {
  const n = SPLIT_MIN_N + 1;
  const up = new Float64Array(n).map((_, i) => i - n / 2);
  equal(sameBits(sortedCopy(up), up), undefined);
  equal(sameBits(sortedCopy(up.slice().reverse()), up), undefined);
  const same = new Float64Array(n).fill(-2.5);
  equal(sameBits(sortedCopy(same), same), undefined);
});
