import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { numericGroups } from "../../lib/data/numeric_groups.ts";
import { PlumbError } from "../../lib/errors.ts";

const text = [
  "line,fill",
  "A,500.1",
  "B,499.2",
  ",500.0",
  "A,NA",
  "B,oops",
  "A,500.3",
  "C,501.0",
].join("\n");

Deno.test("numericGroups splits by first-seen group with counts per group", async () => {
  const table = await loadTable(text);
  const split = numericGroups(table, "fill", { by: "line", dropText: true });
  assert.equal(split.rowsWithoutGroup, 1);
  assert.deepEqual(split.groups.map((g) => g.group), ["A", "B", "C"]);
  const [a, b, c] = split.groups.map((g) => g.column);
  assert.deepEqual(Array.from(a.values), [500.1, 500.3]);
  assert.deepEqual(Array.from(a.rowIndex), [0, 5]);
  assert.equal(a.provenance.rowsRead, 3);
  assert.equal(a.provenance.missingDropped, 1);
  assert.deepEqual(Array.from(b.values), [499.2]);
  assert.equal(b.provenance.textDropped, 1);
  assert.deepEqual(b.provenance.nonNumericCells, [{ row: 5, line: 6, text: "oops" }]);
  assert.deepEqual(Array.from(c.values), [501]);
  assert.equal(c.provenance.source, "text");
});

Deno.test("numericGroups refuses text cells unless dropText, and needs by", async () => {
  const table = await loadTable(text);
  assert.throws(() => numericGroups(table, "fill", { by: "line" }), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    return true;
  });
  assert.throws(
    () => numericGroups(table, "fill", {} as { by: string }),
    /^PlumbError: Cannot split without a grouping column/,
  );
  assert.throws(() => numericGroups(table, "fill", { by: "lane", dropText: true }), {
    name: "PlumbError",
    message: 'Unknown column "lane": the table has "line", "fill"; check the spelling',
  });
});

Deno.test("group notes past the column's first ten text cells still carry their line", async () => {
  const rows = ["g,v"];
  for (let i = 0; i < 12; i++) rows.push(`A,x${i}`);
  rows.push("", "B,late");
  const table = await loadTable(rows.join("\n"));
  const split = numericGroups(table, "v", { by: "g", dropText: true });
  assert.deepEqual(split.groups[1].column.provenance.nonNumericCells, [{
    row: 13,
    line: 15,
    text: "late",
  }]);
});
