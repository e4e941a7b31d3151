import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { numericCells, numericColumn } from "../../lib/data/numeric_column.ts";
import { textColumn } from "../../lib/data/text_column.ts";
import { PlumbError } from "../../lib/errors.ts";

const mixed = new URL("../fixtures/csv/mixed.csv", import.meta.url);

Deno.test("a column mixing numbers and text is numeric but refuses to hand over its numbers", async () => {
  const table = await loadTable(mixed);
  const info = table.info("weight");
  assert.equal(info.kind, "numeric");
  assert.equal(info.provenance.numbers, 6);
  assert.equal(info.provenance.nonNumeric, 4);
  assert.deepEqual(info.provenance.nonNumericCells, [
    { row: 2, line: 3, text: "12abc" },
    { row: 4, line: 5, text: "n.d." },
    { row: 5, line: 6, text: "Inf" },
    { row: 8, line: 9, text: "0x10" },
  ]);
  assert.throws(() => table.numeric("weight"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    assert.equal(
      e.message,
      `Column "weight" of mixed.csv is not numeric: 4 text cells among 6 numbers: row 2 (line 3) "12abc", row 4 (line 5) "n.d.", row 5 (line 6) "Inf", row 8 (line 9) "0x10" (infinite values are not accepted; "n.d." says the value is below a limit without giving it: to read such cells as censored, give the column's limit when loading, loadTable(source, { detectionLimits: { "weight": 0.5 } }) with your limit in place of 0.5); correct the source, add the tokens to the missing list, or pass { dropText: true } to leave them out`,
    );
    assert.equal(e.detail?.count, 4);
    return true;
  });
});

Deno.test("dropText leaves the text cells out and counts them", async () => {
  const table = await loadTable(mixed);
  const col = numericColumn(table, "weight", { dropText: true });
  assert.deepEqual(Array.from(col.values), [12.5, 13.1, 12.9, 13.4, 12.7, 13.0]);
  assert.deepEqual(Array.from(col.rowIndex), [0, 2, 5, 6, 8, 9]);
  assert.equal(col.provenance.textDropped, 4);
  assert.equal(col.provenance.missingDropped, 0);
  assert.equal(col.provenance.used, 6);
  assert.equal(col.provenance.source, "mixed.csv");
  assert.ok(Object.isFrozen(col) && Object.isFrozen(col.provenance));
});

Deno.test("asking a text column for numbers names it a text column", async () => {
  const table = await loadTable(mixed);
  assert.throws(() => table.numeric("batch"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    assert.match(
      e.message,
      /^Column "batch" of mixed.csv is not numeric: 10 text cells and 0 numbers, so it is a text column: row 1 \(line 2\) "B1", .* and 5 more;/,
    );
    return true;
  });
});

Deno.test("an unknown column name is refused with the list of names", async () => {
  const table = await loadTable(mixed);
  for (
    const f of [
      () => table.numeric("wieght"),
      () => table.text("wieght"),
      () => table.info("wieght"),
    ]
  ) {
    assert.throws(f, (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "unknown-column");
      assert.equal(
        e.message,
        'Unknown column "wieght": the table has "batch", "weight"; check the spelling',
      );
      return true;
    });
  }
});

Deno.test("numericCells aligns every cell with its row and flags missing and text", async () => {
  const table = await loadTable("x,g\n1,a\nNA,b\nzz,a\n4,\n");
  const cells = numericCells(table, "x");
  assert.deepEqual(Array.from(cells.missing), [0, 1, 0, 0]);
  assert.deepEqual(Array.from(cells.nonNumeric), [0, 0, 1, 0]);
  assert.equal(cells.values[0], 1);
  assert.ok(Number.isNaN(cells.values[1]) && Number.isNaN(cells.values[2]));
  const groups = textColumn(table, "g");
  assert.deepEqual(groups.values, ["a", "b", "a", ""]);
  assert.deepEqual(Array.from(groups.missing), [0, 0, 0, 1]);
  assert.ok(Object.isFrozen(groups.values));
});

Deno.test("the text of a numeric column keeps the cells as written", async () => {
  const table = await loadTable("code,v\n07,1\n1.50,2\n");
  assert.equal(table.info("code").kind, "numeric");
  assert.deepEqual(table.text("code").values, ["07", "1.50"]);
});

Deno.test("copies handed out do not change the table", async () => {
  const table = await loadTable([3, 1, 2]);
  const a = table.numeric("value");
  a.values[0] = 99;
  a.values.sort();
  assert.deepEqual(Array.from(table.numeric("value").values), [3, 1, 2]);
  assert.ok(Object.isFrozen(table) && Object.isFrozen(table.columns));
});

Deno.test("the kind rule: numeric when numbers outnumber text cells", async () => {
  const t = await loadTable({
    half: [1, 2, "a", "b"],
    most: [1, 2, 3, "a"],
    none: [null, NaN, undefined, ""],
    words: ["a", "b", "c", 1],
  });
  assert.deepEqual(t.columns.map((c) => [c.name, c.kind]), [
    ["half", "text"],
    ["most", "numeric"],
    ["none", "empty"],
    ["words", "text"],
  ]);
  assert.deepEqual(t.numericNames(), ["most"]);
  assert.deepEqual(t.textNames(), ["half", "words"]);
});

Deno.test("tables and numeric columns serialise to plain JSON", async () => {
  const table = await loadTable("x,g\n1,a\n,b\n");
  const summary = JSON.parse(JSON.stringify(table));
  assert.equal(summary.rowCount, 2);
  assert.deepEqual(summary.columns[0], {
    name: "x",
    kind: "numeric",
    hint: null,
    provenance: {
      source: "text",
      column: "x",
      originalName: "x",
      rowsRead: 2,
      numbers: 1,
      censoredLeft: 0,
      censoredRight: 0,
      censoredLimits: [],
      missing: 1,
      nonNumeric: 0,
      nonNumericCells: [],
    },
  });
  const col = table.numeric("x");
  assert.equal(col.rowIndex, col.rowIndex);
  const json = JSON.parse(JSON.stringify(col));
  assert.deepEqual(json.values, [1]);
  assert.deepEqual(json.rowIndex, [0]);
  assert.equal(json.provenance.missingDropped, 1);
});
