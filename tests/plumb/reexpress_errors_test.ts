/**
 * Errors of the chain speak of the table: a re-expression that cannot apply
 * names the data rows (1-based) and the file's lines, not 0-based
 * positions; a λ whose results overflow blames λ, not the data; a constant
 * column says how many values it has.
 *
 * @module
 */
import { deepEqual, equal, match, ok } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { caughtPlumbError as caught } from "../_shared.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { qqData } from "../../lib/stats/qq_data.ts";

// Invented lab export: a blank line after row 5 shifts the lines below it.
const csv = "id,x,g\n1,1,a\n2,2,a\n3,-3,a\n4,4,a\n5,5,b\n\n6,0,b\n7,7,b\n8,800,b\n";
const t = await loadTable(csv);
const tPositive = await loadTable("id,x\n1,1\n2,2\n3,3\n4,4\n5,5\n6,6\n7,7\n8,800\n");

Deno.test("re-expression errors name rows and lines of the column", () => {
  const sqrt = caught(() => plumb(t, "x").reexpress("sqrt").analysis());
  equal(sqrt.code, "non-positive");
  match(sqrt.message, /in row 3 \(line 4\) of "x"/);
  ok(!/position/.test(sqrt.message), sqrt.message);
  deepEqual(sqrt.detail?.rows, [3]);
  // Row 6 is on line 8: the blank line is not a row.
  const recip = caught(() => plumb(t, "x").reexpress("reciprocal").analysis());
  equal(recip.code, "zero");
  match(recip.message, /in row 6 \(line 8\) of "x"/);
  const bc = caught(() => plumb(t, "x").reexpress({ boxCox: 0.5 }).analysis());
  match(bc.message, /2 of 8 .*in rows 3 \(line 4\), 6 \(line 8\) of "x"/);
  // Within groups, the rows are still the table's rows.
  const byGroup = caught(() => plumb(t, "x").reexpress("sqrt").by("g").result());
  match(byGroup.message, /in row 3 \(line 4\) of "x"/);
  // In-memory data have rows but no lines.
  const mem = caught(() => plumb([1, 2, -3, 4, 5, 6], "v").reexpress("sqrt").analysis());
  match(mem.message, /in row 3 of "v"/);
  ok(!/line/.test(mem.message), mem.message);
});

Deno.test("a λ whose results overflow blames λ, not the data", () => {
  for (const request of [{ boxCox: 200 }, { yeoJohnson: 150 }]) {
    const e = caught(() => plumb(tPositive, "x").reexpress(request).analysis());
    equal(e.code, "bad-option");
    match(e.message, /beyond the largest number a double holds/);
    match(e.message, /1 of 8 values \(most extreme 800, row 8 \(line 9\)\)/);
    match(e.message, /the values are fine but the power is too strong/);
    match(e.message, /choose a λ nearer 0/);
    ok(!/not finite numbers|remove or replace them/.test(e.message), e.message);
  }
});

Deno.test("a constant column's error states its real count, from the chain and the chart data", () => {
  for (const n of [4, 7, 250]) {
    const x = new Array(n).fill(5);
    const card = caught(() => plumb(x, "c").analysis());
    equal(card.code, "constant");
    equal(
      card.message,
      `Cannot screen c: all ${n} values are 5, and values with no spread have no shape to test; ` +
        "check the column, its units or the rows chosen",
    );
    match(caught(() => plumb(x, "c").qq().spec).message, new RegExp(`all ${n} values are 5`));
    match(caught(() => plumb(x, "c").histogram().spec).message, new RegExp(`all ${n} values`));
    match(caught(() => qqData(x)).message, new RegExp(`on ${n} identical values \\(all 5\\)`));
    match(caught(() => histogramData(x)).message, new RegExp(`on ${n} identical values`));
    match(
      caught(() => plumb(x, "c").qq({ level: 0.9 }).spec).message,
      new RegExp(`on ${n} identical values`),
    );
  }
});
