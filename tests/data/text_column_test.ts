import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { plumb } from "../../lib/plumb/plumb.ts";

Deno.test("group labels that differ only in spaces are one label, with the spellings noted", async () => {
  const t = await loadTable({
    line: [" A", "A ", "A\u00a0", "B", "A", "B\u2009", "Line  C", "Line\u00a0C"],
  });
  const g = t.text("line");
  assert.deepEqual(g.values, ["A", "A", "A", "B", "A", "B", "Line C", "Line C"]);
  assert.deepEqual(g.merged, [
    { label: "A", spellings: [" A", "A ", "A\u00a0", "A"] },
    { label: "B", spellings: ["B", "B\u2009"] },
    { label: "Line C", spellings: ["Line  C", "Line\u00a0C"] },
  ]);
  // Nothing merged, nothing noted; a line break inside a label is kept.
  const plain = await loadTable({ line: ["A", "B", "B\nsouth"] });
  assert.deepEqual(plain.text("line").merged, []);
  assert.equal(plain.text("line").values[2], "B\nsouth");
});

Deno.test("both CSV readers trim cells alike, no-break spaces included", () => {
  const text = "v,g\n1, A\n2,A \n3,A\u00a0\n4,\u00a0A\n5,A\u3000\n6,\u00a0 7 \u00a0\n";
  const quick = tableFromCsv(text, { reader: "simple" });
  const general = tableFromCsv(text, { reader: "csv-parse" });
  for (const t of [quick, general]) {
    assert.deepEqual(t.text("g").values, ["A", "A", "A", "A", "A", "7"]);
    assert.equal(t.info("g").provenance.nonNumeric, 5);
  }
});

Deno.test(".by(): groups whose labels differ only in spaces are merged, and the table says so", () => {
  const values = [500.1, 499.8, 500.4, 500.0, 499.7, 500.2, 500.3, 499.9, 500.6, 499.5];
  const chain = plumb({
    line: ["A", " A", "A\u00a0", "A ", "A", "B", "B", "B", "B", "B"],
    fill_ml: values,
  }, "fill_ml").by("line");
  const r = chain.result();
  assert.deepEqual(r.groups.map((g) => [g.group, g.n]), [["A", 5], ["B", 5]]);
  assert.deepEqual(r.mergedLabels, [{ label: "A", spellings: ["A", " A", "A\u00a0", "A "] }]);
  assert.ok(
    chain.table().notes!.includes(
      'Labels of line that differ only in spaces were merged: "A" (written "A", " A", "A\\u00a0", "A ").',
    ),
    chain.table().notes!.join("\n"),
  );
});
