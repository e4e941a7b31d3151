import { deepEqual, equal, match } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { identifierColumns } from "../../lib/plumb/identifiers.ts";
import { toTable } from "../../lib/plumb/source.ts";
import { survey } from "../../lib/plumb/survey.ts";

const names = (t: Awaited<ReturnType<typeof loadTable>>) =>
  identifierColumns(t, t.numericNames()).map((c) => c.name);

Deno.test("a 1..n or k..k+n−1 sequence down the rows is an identifier, whatever its header", () => {
  const t = toTable({
    sample: [101, 102, 103, 104, 105, 106],
    fill: [5.1, 4.9, 5.3, 5.0, 5.2, 4.8],
    day: [3, 1, 2, 4, 6, 5],
  });
  deepEqual(identifierColumns(t, ["sample", "fill", "day"]).map((c) => c.name), ["sample"]);
  match(identifierColumns(t, ["sample"])[0].reason, /101, 102, … 106/);
});

Deno.test("an unnamed leading row-number column (as exports write it) is an identifier", async () => {
  // row names kept after filtering: increasing, not consecutive
  const t = await loadTable(
    `,fill,torque\n1,5.1,2.2\n3,4.9,2.4\n4,5.3,2.1\n7,5.0,2.6\n9,5.2,2.3\n12,4.8,2.5\n`,
  );
  deepEqual(names(t), ["column_1"]);
  match(identifierColumns(t, ["column_1"])[0].reason, /first column, with no header/);
  const u = await loadTable(`Unnamed: 0,fill\n0,5.1\n2,4.9\n5,5.3\n6,5.0\n8,5.2\n`);
  deepEqual(names(u), ["Unnamed: 0"]);
});

Deno.test("measurements are not identifiers: decreasing, repeated, decimal, short, not first, gaps with a name", async () => {
  const t = await loadTable(
    `fill,rank\n5.1,1\n4.9,2\n5.3,2\n5.0,4\n5.2,5\n4.8,6\n`,
  );
  deepEqual(names(t), []);
  equal(identifierColumns(toTable({ x: [1, 2, 3, 4] }), ["x"]).length, 0, "fewer than 5 rows");
  // increasing whole numbers in the first column, but under a measurement's name
  const v = await loadTable(`count,fill\n2,5.1\n5,4.9\n9,5.3\n11,5.0\n17,5.2\n`);
  deepEqual(names(v), []);
  // a missing cell breaks a sequence
  const w = await loadTable(`id,fill\n1,5.1\n2,4.9\n,5.3\n4,5.0\n5,5.2\n6,4.4\n`);
  deepEqual(names(w), []);
});

Deno.test("survey leaves identifiers and empty columns out, says so, and screens them on request", async () => {
  const t = await loadTable(
    `,sample,fill,blank\n` +
      Array.from(
        { length: 12 },
        (_, i) => `${i * 2 + 1},${201 + i},${(5 + ((i * 37) % 11) / 20).toFixed(2)},`,
      ).join("\n") + "\n",
  );
  const r = survey(t).result();
  deepEqual(r.rows.map((x) => x.column), ["fill"]);
  deepEqual(r.omitted.map((o) => o.column).sort(), ["blank", "column_1", "sample"]);
  match(r.omitted.find((o) => o.column === "blank")!.reason, /every cell is empty/);
  match(r.omitted.find((o) => o.column === "sample")!.reason, /201, 202, … 212.*identifiers: true/);
  const md = survey(t).toMarkdown();
  match(md, /Left out, column\\?_1: the first column, with no header/);
  match(md, /Left out, blank: every cell is empty\./);
  match(survey(t).toCSV(), /\nsample,.*left out: its values run 201/);
  // asked for: screened
  deepEqual(
    survey(t, { identifiers: true }).result().rows.map((x) => x.column).sort(),
    ["column_1", "fill", "sample"],
  );
  deepEqual(survey(t, { columns: ["sample"] }).result().rows.map((x) => x.column), ["sample"]);
  equal(survey(t, { columns: ["sample"] }).result().omitted.length, 0);
});
