import assert from "node:assert/strict";
import { selectFromSorted, selectRanks } from "../../lib/numeric/select.ts";
import { thinRanks } from "../../lib/numeric/thin_ranks.ts";
import { normalSample } from "../_shared.ts";

Deno.test("selection without a full sort gives exactly the sorted values, for awkward samples", () => {
  const n = 200_000;
  const z = normalSample(n, 77);
  const cases: Record<string, Float64Array> = {
    normal: z,
    exponential: z.map((v, i) => -Math.log((i % 9973 + 0.5) / 9973) * (1 + 0 * v)),
    rounded: z.map((v) => Math.round(v * 10) / 10),
    "half zeros": z.map((v, i) => (i % 2 === 0 ? 0 : v)),
    "already sorted": z.slice().sort(),
    reversed: z.slice().sort().reverse(),
    "wild outliers": z.map((v, i) => (i % 50_000 === 0 ? v * 1e12 : v)),
  };
  for (const [name, x] of Object.entries(cases)) {
    const ranks = thinRanks(n, 800, 200);
    const sorted = x.slice().sort();
    const got = selectRanks(x, ranks);
    const rows = new Set<number>();
    ranks.forEach((r, k) => {
      assert.equal(got.value[k], sorted[r - 1], `${name}: rank ${r}`);
      assert.equal(x[got.row[k]], got.value[k], `${name}: row of rank ${r}`);
      rows.add(got.row[k]);
    });
    assert.equal(rows.size, ranks.length, `${name}: every kept rank has its own row`);
  }
});

Deno.test("selection from a sorted copy gives the same values and rows as selection", () => {
  const x = normalSample(70_000, 5).map((v) => Math.round(v * 100) / 100);
  const ranks = thinRanks(x.length, 300, 50);
  const a = selectRanks(x, ranks);
  const b = selectFromSorted(x, x.slice().sort(), ranks);
  assert.deepEqual(b.value, a.value);
  assert.deepEqual(b.row, a.row);
});

Deno.test("thinRanks keeps both tails in full and never exceeds the budget", () => {
  assert.deepEqual(thinRanks(5, 10, 3), [1, 2, 3, 4, 5]);
  const r = thinRanks(10_000, 100, 40);
  assert.equal(r.length, 100);
  assert.deepEqual(r.slice(0, 25), Array.from({ length: 25 }, (_, k) => k + 1));
  assert.deepEqual(r.slice(-25), Array.from({ length: 25 }, (_, k) => 10_000 - 24 + k));
  for (let k = 1; k < r.length; k++) assert.ok(r[k] > r[k - 1], `ascending at ${k}`);
});
