import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { comparisonSpec } from "../../lib/render/comparison_spec.ts";
import { groupSpec } from "../../lib/render/group_spec.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { skewed } from "./_samples.ts";

const x = skewed(2000, 4);

Deno.test("the comparison panel titles each candidate with its W and p", () => {
  const spec = comparisonSpec([
    { label: "as measured", qq: qqData(x), W: 0.912345, p: 0.00001 },
    { label: "log", qq: qqData(x.map(Math.log)), W: 0.9987, p: 0.61234, note: "best" },
  ], { name: "oxygen" }) as unknown as {
    columns: number;
    concat: { title: { text: string; subtitle: string[] } }[];
  };
  assert.equal(spec.columns, 2);
  assert.equal(spec.concat[0].title.text, "as measured");
  assert.equal(spec.concat[0].title.subtitle[0], "W = 0.9123 · p < 0.0001");
  assert.equal(spec.concat[1].title.subtitle[0], "W = 0.9987 · p = 0.6123 · best");
});

Deno.test("panels are thinned so the whole grid stays near 800 points", () => {
  const spec = comparisonSpec(
    [1, 2, 3, 4].map((k) => ({ label: `c${k}`, qq: qqData(x), W: 0.9, p: 0.1 })),
  ) as unknown as { concat: { data: { values: unknown[] } }[] };
  for (const panel of spec.concat) assert.equal(panel.data.values.length, 200);
});

Deno.test("group panels share their axes and show each group's name as typed", () => {
  const spec = groupSpec([
    { group: "line <1>", qq: qqData(x.subarray(0, 1000)) },
    { group: 'line "2"', qq: qqData(x.subarray(1000)) },
  ], { name: "fill", by: "filler" }) as unknown as {
    resolve: unknown;
    concat: { title: { text: string } }[];
  };
  assert.deepEqual(spec.resolve, { scale: { x: "shared", y: "shared" } });
  assert.deepEqual(spec.concat.map((p) => p.title.text), ["line <1>", 'line "2"']);
});

Deno.test("a grid with no panels or too many throws PlumbError", () => {
  assert.throws(() => comparisonSpec([]), (e) => e instanceof PlumbError && e.code === "too-few");
  const many = Array.from(
    { length: 25 },
    (_, k) => ({ group: `g${k}`, qq: qqData([1, 2, 3 + k]) }),
  );
  assert.throws(() => groupSpec(many), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "too-many");
    assert.equal(
      e.message,
      "Cannot draw QQ plots by group with 25 panels: at most 24 stay readable; draw them in parts",
    );
    return true;
  });
});
