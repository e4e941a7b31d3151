import assert from "node:assert/strict";
import { bundleBytes, leftOutNote, pickRows } from "../../lib/render/budget.ts";

Deno.test("pickRows keeps the highest scores in their original order, ties to the earlier row", () => {
  const rows = ["a", "b", "c", "d", "e"];
  const score: Record<string, number> = { a: 1, b: 3, c: 3, d: NaN, e: 2 };
  const p = pickRows(rows, { max: 3, score: (r) => score[r] });
  assert.deepEqual(p.shown, ["b", "c", "e"]);
  assert.deepEqual(p.left, ["a", "d"]); // NaN counts as the least informative
  assert.deepEqual(pickRows(rows, { max: 9, score: () => 0 }), { shown: rows, left: [] });
});

Deno.test("pickRows handles 130,000 rows (no argument spread)", () => {
  const rows = Array.from({ length: 130_000 }, (_, i) => i);
  const p = pickRows(rows, { max: 30, score: (i) => (i * 7919) % 130_000 });
  assert.equal(p.shown.length, 30);
  assert.equal(p.left.length, 129_970);
  assert.ok(p.shown.every((i) => (i * 7919) % 130_000 >= 129_970));
});

Deno.test("leftOutNote counts, names at most 12 (each cut to 40 characters) and says where", () => {
  const names = Array.from({ length: 20 }, (_, i) => (i === 0 ? "x".repeat(100) : `L${i}`));
  const s = leftOutNote({
    noun: "group",
    total: 1020,
    chosen: "the 1,000 with the clearest departures",
    names,
    tally: { "no clear departure": 19, "mild departure": 1, "clear departure": 0 },
    where: '.toCSV() and .save("groups.csv")',
  });
  assert.equal(
    s,
    "Showing 1,000 of 1,020 groups: the 1,000 with the clearest departures. Left out: 20 groups " +
      `(19 no clear departure, 1 mild departure): ${
        "x".repeat(39)
      }…, L1, L2, L3, L4, L5, L6, L7, L8, ` +
      'L9, L10, L11 and 8 more. Every group is in .toCSV() and .save("groups.csv").',
  );
});

Deno.test("bundleBytes counts UTF-8 bytes of every part, the spec as JSON", () => {
  assert.equal(bundleBytes({ "text/plain": "ab", "text/html": "é" }), 4);
  assert.equal(
    bundleBytes({
      "text/plain": "",
      "application/vnd.vegalite.v5+json": { mark: "point" } as never,
    }),
    16,
  );
});
