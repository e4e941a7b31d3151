// .by([a, b]): groups by the cells of several columns, pooled residuals of
// the cell-means model; .by() on a residual chain groups the residuals.
import assert from "node:assert/strict";
import { plumb } from "../../mod.ts";
import { assertPlumbError } from "../_shared.ts";
import { DISPLAY } from "../../lib/results/display.ts";

// Invented: fill volumes on two lines and two shifts, 8 per cell, with a
// line × shift interaction (line B runs high on the late shift only).
function cells() {
  const line: (string | null)[] = [], shift: string[] = [], fill: number[] = [];
  const wiggle = [-0.9, 0.4, -0.2, 1.1, 0.3, -0.6, 0.8, -0.5];
  for (const l of ["A", "B"]) {
    for (const s of ["early", "late"]) {
      for (const w of wiggle) {
        line.push(l);
        shift.push(s);
        fill.push(500 + (l === "B" && s === "late" ? 3 : 0) + w);
      }
    }
  }
  return { line, shift, fill };
}

Deno.test(".by([a, b]) screens each cell and pools the cell-means residuals", async () => {
  const data = cells();
  data.line[0] = null; // a row without a line: left out, counted
  const g = plumb(data, "fill").by(["line", "shift"]);
  const r = g.result();
  assert.equal(r.groupBy, "line × shift");
  assert.deepEqual(r.groupColumns, ["line", "shift"]);
  assert.deepEqual(r.groups.map((x) => x.group), [
    "A × early",
    "A × late",
    "B × early",
    "B × late",
  ]);
  assert.deepEqual(r.groups.map((x) => x.n), [7, 8, 8, 8]);
  assert.equal(r.noGroup, 1);
  // residuals: value − cell mean, so the interaction is not in them
  const res = r.residuals!;
  assert.equal(res.n, 31);
  assert.ok(Math.abs(res.moments.mean) < 1e-12);
  assert.ok(res.moments.sd < 0.8, `sd ${res.moments.sd}: the +3 cell must not widen the residuals`);
  assert.match(res.origin.label, /fill residuals within line × shift cells/);
  assert.match(res.reading.points[0], /^Pooled residuals of the cell-means model/);
  const html = (await g[DISPLAY]())["text/html"]!;
  assert.match(html, /line × shift/);
  assert.match(html, /B × late/);
  assert.match(g.toCSV(), /^group,n,/);
  assert.match(g.toCSV(), /\nB × late,8,/);
  // one column still works as before
  assert.deepEqual(plumb(data, "fill").by("line").result().groupColumns, ["line"]);
});

Deno.test(".by() refuses an empty list, an unknown column and a column named twice", () => {
  const p = plumb(cells(), "fill");
  assertPlumbError(() => p.by([]), "bad-option", /name a column, or a list of columns/);
  assertPlumbError(() => p.by(["line", "shfit"]), "unknown-column", /shfit/);
  assertPlumbError(() => p.by(["line", "line"]), "bad-option", /name each column once/);
});

Deno.test(".by() on a residual chain groups the studentised residuals", () => {
  const data = { ...cells(), temp: Array.from({ length: 32 }, (_, i) => 18 + (i * 7) % 5) };
  const r = plumb(data, "fill").residuals({ factors: ["line", "shift"], covariates: ["temp"] });
  const g = r.by("line").result();
  assert.equal(g.groups.length, 2);
  assert.equal(g.groups[0].n + g.groups[1].n, r.values().length);
  assert.equal(g.residuals, undefined); // residuals already: no second pooling
  const all = [...g.groups[0].analysis!.qq.value, ...g.groups[1].analysis!.qq.value].sort((a, b) =>
    a - b
  );
  const mine = Array.from(r.values()).sort((a, b) => a - b);
  assert.deepEqual(all, mine);
  assert.match(g.label, /^studentised residuals of fill ~ line \+ shift \+ temp/);
});

Deno.test(".by([a, b]) keeps cells apart and in order when a label itself contains ' × '", () => {
  // ("x × 1", "2") and ("x", "1 × 2") would both read "x × 1 × 2" if the parts were joined for the key
  const parts: [string, string, number][] = [
    ["x × 1", "2", 2],
    ["x", "1 × 2", 11],
    ["10", "z", 6],
    [
      "9",
      "z",
      4,
    ],
  ];
  const a: string[] = [], b: string[] = [], fill: number[] = [];
  const wiggle = [-0.9, 0.4, -0.2, 1.1, 0.3, -0.6, 0.8, -0.5];
  for (const [p, q, centre] of parts) {
    for (const w of wiggle) {
      a.push(p);
      b.push(q);
      fill.push(centre + w);
    }
  }
  const r = plumb({ a, b, fill }, "fill").by(["a", "b"]).result();
  assert.deepEqual(r.groups.map((g) => [g.group, g.n]), [
    ["9 × z", 8],
    ["10 × z", 8],
    ["x × 1 × 2", 8],
    ["x × 1 × 2", 8],
  ]);
  // "x" sorts before "x × 1": the first of the two equal labels is the cell centred at 11
  const means = r.groups.map((g) => g.analysis!.moments.mean);
  assert.ok(Math.abs(means[2] - 11.05) < 1e-12 && Math.abs(means[3] - 2.05) < 1e-12, `${means}`);
});
