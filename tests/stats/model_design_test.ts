// The model design: complete rows and missing counts, level order, column
// names, centring and scaling, empty cells, and every input error.
import assert from "node:assert/strict";
import { buildDesign, MAX_DESIGN_COLUMNS } from "../../lib/stats/model_design.ts";
import { compareLabels } from "../../lib/stats/_design_columns.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

/** The filled design as columns. */
function filled(d: ReturnType<typeof buildDesign>): Float64Array[] {
  const n = d.rows.length, c = d.columns.length + 1;
  const out = new Float64Array(n * c);
  d.fillBlock(0, n, out);
  return Array.from({ length: c }, (_, j) => out.slice(j * n, (j + 1) * n));
}

Deno.test("design: complete rows, missing counts per column, natural level order", () => {
  const d = buildDesign([1, 2, NaN, 4, 5, 6, 7, 8], {
    response: "fill",
    covariates: { temp: [20, 21, 22, NaN, 24, 25, 26, 27] },
    factors: { line: ["10", "9", "9", "10", null, "B", "9", "10"] },
  });
  assert.deepEqual([...d.rows], [0, 1, 5, 6, 7]);
  assert.equal(d.incomplete, 3);
  const missing = d.missing.map((m) => `${m.column}:${m.rows}`);
  assert.deepEqual(
    missing,
    ["fill:1", "line:1", "temp:1"],
    "response, then factors, then covariates",
  );
  assert.deepEqual(d.terms[1].levels, ["9", "10", "B"], "numbers by value, then text");
  assert.deepEqual(d.columns.map((c) => c.name), ["(intercept)", "line=10", "line=B", "temp"]);
  assert.deepEqual(["b", "10", "a", "9", "-1.5"].sort(compareLabels), [
    "-1.5",
    "9",
    "10",
    "a",
    "b",
  ]);
});

Deno.test("design: every column has norm 1, the centred ones sum to 0, block fills agree", () => {
  const n = 37;
  const t = Array.from({ length: n }, (_, i) => 1e6 + 1e-3 * Math.sin(i));
  const d = buildDesign(Array.from({ length: n }, (_, i) => i % 5), {
    covariates: { t },
    factors: { g: Array.from({ length: n }, (_, i) => "abc"[i % 3]) },
    interactions: [["g", "t"]],
  });
  const cols = filled(d);
  cols.forEach((v, j) => {
    const norm = Math.hypot(...v), sum = v.reduce((a, b) => a + b, 0);
    assertClose(norm, 1, { abs: 1e-14 }, `norm of column ${j}`);
    // centred: the sum is what the rounding of the mean (half an ulp of the
    // raw values' magnitude, per row) leaves, in units of the column's scale
    const c = j < d.columns.length
      ? d.columns[j]
      : { centre: d.responseCentre, scale: d.responseScale };
    const bound = j === 0 ? Infinity : (n * Math.max(1, Math.abs(c.centre)) * 2 ** -52) / c.scale;
    assert.ok(Math.abs(sum) <= bound, `sum of column ${j}: ${sum} > ${bound}`);
  });
  // the offset 1e6 is gone: t's centred column carries the spread, not rounding noise
  const tc = cols[d.columns.findIndex((c) => c.name === "t")];
  const raw = t.map((v) => v - d.columns[3].centre);
  const rawNorm = Math.hypot(...raw);
  tc.forEach((v, i) => assertClose(v, raw[i] / rawNorm, { abs: 1e-9 }, `t[${i}]`));
  assert.deepEqual(d.columns.map((c) => c.name).slice(4), ["g=b × t", "g=c × t"]);
  const pieces = new Float64Array(n * cols.length);
  const part = new Float64Array(10 * cols.length);
  for (let start = 0; start < n; start += 10) {
    const len = Math.min(10, n - start);
    d.fillBlock(start, len, part);
    for (let j = 0; j < cols.length; j++) {
      pieces.set(part.subarray(j * len, (j + 1) * len), j * n + start);
    }
  }
  assert.deepEqual(pieces, Float64Array.from(cols.flatMap((c) => [...c])));
});

Deno.test("design: combinations of levels with no rows are named and left out", () => {
  const line = ["A", "A", "B", "B", "C", "C", "A", "B"];
  const shift = ["d", "n", "d", "n", "d", "d", "d", "d"];
  const d = buildDesign([1, 2, 3, 4, 5, 6, 7, 8], {
    factors: { line, shift },
    interactions: [["shift", "line"], ["line", "shift"]],
  });
  assert.deepEqual(d.emptyCells, ["line=C × shift=n"]);
  assert.equal(d.terms.length, 4, "the repeated interaction counts once");
  assert.deepEqual(d.terms[3].parts, ["line", "shift"], "parts in term order");
});

Deno.test("design errors: names, lengths, text, infinities, constants, levels, size", () => {
  const y = [1, 2, 3, 4, 5];
  assertPlumbError(
    () => buildDesign(y, { covariates: { a: [1, 2, 3, 4, 5] }, factors: { a: y.map(String) } }),
    "bad-option",
    /^Cannot use a twice in one model: .*name each column once$/,
  );
  assertPlumbError(
    () => buildDesign(y, { response: "fill", covariates: { t: [1, 2] } }),
    "bad-option",
    /^Cannot fit fill on t: t has 2 values and fill 5; give columns of one table$/,
  );
  assertPlumbError(
    () => buildDesign(y, { covariates: { t: [1, 2, "warm", 4, 5] as unknown as number[] } }),
    "non-numeric",
    /^Cannot use t as a numeric column: position 2 holds "warm"; .*use t as a factor$/,
  );
  assertPlumbError(
    () => buildDesign(y, { covariates: { t: [1, 2, Infinity, 4, 5] } }),
    "non-finite",
    /^Cannot fit a model with t = Infinity at position 2: /,
  );
  assertPlumbError(
    () => buildDesign(y, { covariates: { t: [3, 3, 3, NaN, 3] } }),
    "constant",
    /^Cannot use t as the covariate: it holds 3 in all 4 complete rows; .*leave it out$/,
  );
  assertPlumbError(
    () => buildDesign([2, 2, 2], { response: "fill" }),
    "constant",
    /^Cannot use fill as the response: it holds 2 in all 3 complete rows; /,
  );
  assertPlumbError(
    () => buildDesign(y, { factors: { line: ["A", "A", "A", null, "A"] } }),
    "constant",
    /^Cannot use line as a factor: all 4 complete rows are in level A; a factor needs at least two levels, so leave it out$/,
  );
  assertPlumbError(
    () => buildDesign(y, { factors: { line: y.map(String) }, interactions: [["line", "shift"]] }),
    "unknown-column",
    /^Cannot build the interaction line × shift: shift is not a covariate or factor of the model \(terms: line\); add it as a term first$/,
  );
  assertPlumbError(
    () => buildDesign(y, { factors: { line: y.map(String) }, interactions: [["line"]] }),
    "bad-option",
    /^Cannot build the interaction line: name two or more different terms$/,
  );
  const many = Array.from({ length: MAX_DESIGN_COLUMNS + 5 }, (_, i) => `id${i}`);
  assertPlumbError(
    () => buildDesign(many.map((_, i) => i), { factors: { id: many } }),
    "too-many",
    /^Cannot fit y with 1005 design columns: at most 1000 are supported; /,
  );
});
