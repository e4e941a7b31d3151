import { deepEqual, equal } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";

// loadTable reuses one read buffer between loads and rebuilds the text of plain
// fixed-decimal columns instead of keeping the file's bytes. A table loaded
// first must read exactly the same after later loads reuse that buffer.
Deno.test("tables keep their cells after later loads reuse the read buffer", async () => {
  const dir = await Deno.makeTempDir();
  const a = "x,y,label\n" +
    Array.from(
      { length: 500 },
      (_, i) =>
        `${(i * 0.0137).toFixed(4)},${i % 7 === 0 ? "NA" : (i * 1.5).toFixed(1)},${
          i % 3 ? "p" : "q"
        }`,
    ).join("\n") + "\n";
  const b = "x,y,label\n" +
    Array.from(
      { length: 800 },
      (_, i) => `${(9 - i * 0.0021).toFixed(4)},${(i * 2.25).toFixed(2)},z${i}`,
    ).join("\n") + "\n";
  await Deno.writeTextFile(`${dir}/a.csv`, a);
  await Deno.writeTextFile(`${dir}/b.csv`, b);
  const ta = await loadTable(`${dir}/a.csv`);
  const before = {
    x: ta.text("x").values.slice(),
    y: ta.text("y").values.slice(),
    n: ta.numeric("x").values.slice(),
  };
  const tb = await loadTable(`${dir}/b.csv`);
  const again = await loadTable(`${dir}/b.csv`);
  // The first table is unchanged, as text and as numbers, and equals csv-parse's reading.
  const ref = tableFromCsv(a, { reader: "csv-parse" });
  deepEqual(ta.text("x").values, before.x);
  deepEqual(ta.text("y").values, before.y);
  deepEqual(ta.text("x").values, ref.text("x").values);
  deepEqual(ta.text("label").values, ref.text("label").values);
  deepEqual(ta.numeric("x").values, before.n);
  deepEqual(ta.numeric("x").values, ref.numeric("x").values);
  equal(ta.info("y").provenance.missing, ref.info("y").provenance.missing);
  deepEqual(tb.text("label").values, again.text("label").values);
  deepEqual(tb.numeric("y").values, tableFromCsv(b, { reader: "csv-parse" }).numeric("y").values);
  await Deno.remove(dir, { recursive: true });
});
