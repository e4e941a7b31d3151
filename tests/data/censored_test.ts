import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { limitWordSide, parseCensored } from "../../lib/data/censored_cell.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertSameTable } from "./_same_table.ts";

const isPlumbError = (code: string, message?: RegExp) => (e: unknown) => {
  assert.ok(e instanceof PlumbError, String(e));
  assert.equal(e.code, code, e.message);
  if (message) assert.match(e.message, message);
  return true;
};

Deno.test("every spelling of a limit is read with its side and limit", () => {
  const cases: [string, "." | ",", -1 | 1, number][] = [
    ["<0.5", ".", -1, 0.5],
    ["< 0.5", ".", -1, 0.5],
    ["  <  0.5  ", ".", -1, 0.5],
    ["≤0.5", ".", -1, 0.5],
    ["<=0.5", ".", -1, 0.5],
    ["≦ 2", ".", -1, 2],
    ["＜3", ".", -1, 3],
    ["<0,5", ",", -1, 0.5],
    ["< 0,05", ",", -1, 0.05],
    ["<-1.5", ".", -1, -1.5],
    ["<1e-3", ".", -1, 0.001],
    [">1000", ".", 1, 1000],
    ["> 1000", ".", 1, 1000],
    ["≥1000", ".", 1, 1000],
    [">=2.5", ".", 1, 2.5],
    ["≧7", ".", 1, 7],
    ["＞8", ".", 1, 8],
    [">2,5", ",", 1, 2.5],
  ];
  for (const [text, decimal, side, limit] of cases) {
    const c = parseCensored(text, { decimal });
    assert.deepEqual(c, { side, limit }, JSON.stringify(text));
  }
  assert.deepEqual(parseCensored("<1 000,5", { decimal: ",", thousands: " " }), {
    side: -1,
    limit: 1000.5,
  });
});

Deno.test("a sign without a clean number is not a limit", () => {
  for (
    const text of [
      "<",
      "< ",
      "<<5",
      "<>5",
      "<=<5",
      "<0.5 mg/L",
      "<LOD",
      "<inf",
      "<1e999",
      "5<",
      "<0,5",
      "=5",
      "",
      "0.5",
    ]
  ) {
    assert.equal(parseCensored(text), null, JSON.stringify(text));
  }
  // "<0,5" with the decimal point is text: the comma is not this file's decimal mark.
  assert.equal(parseCensored("<0.5", { decimal: "," }), null);
});

Deno.test("limit words: their side, and nothing else counts", () => {
  for (
    const w of ["ND", "n.d.", "n.n.", "N/D", "bdl", "BLD", "not detected", "<LOD", "< LOQ", "<MDL"]
  ) {
    assert.equal(limitWordSide(w), -1, w);
  }
  for (const w of ["TNTC", ">ULOQ", "> range", "above range"]) assert.equal(limitWordSide(w), 1, w);
  for (const w of ["", "NA", "broken vial", "<5", "5", "LOD"]) {
    assert.equal(limitWordSide(w), null, w);
  }
});

const LAB = [
  "sample;crp_mg_l;colonies",
  "S1;1,2;12",
  "S2;<0,5;>300",
  "S3;< 0,5;45",
  "S4;≤0,2;>300",
  "S5;3,4;ND",
  "S6;;7",
  "S7;<=0,5;>=250",
].join("\n") + "\n";

Deno.test("loadTable reads <x and >x cells as censored without options (decimal-comma file)", async () => {
  const t = await loadTable(LAB);
  const crp = t.info("crp_mg_l");
  assert.equal(crp.kind, "numeric");
  const p = crp.provenance;
  assert.deepEqual([p.numbers, p.censoredLeft, p.censoredRight, p.missing, p.nonNumeric], [
    2,
    4,
    0,
    1,
    0,
  ]);
  assert.deepEqual(p.censoredLimits, [
    { side: "below", limit: 0.2, count: 1 },
    { side: "below", limit: 0.5, count: 3 },
  ]);
  const col = t.numeric("crp_mg_l");
  assert.deepEqual(Array.from(col.values), [1.2, 0.5, 0.5, 0.2, 3.4, 0.5]);
  assert.deepEqual(Array.from(col.censor!), [0, -1, -1, -1, 0, -1]);
  assert.deepEqual(Array.from(col.rowIndex), [0, 1, 2, 3, 4, 6]);
  assert.equal(col.provenance.used, 6);
  assert.equal(col.provenance.missingDropped, 1);
  // Right-censored counts, with the one word cell left as text.
  const colonies = t.info("colonies").provenance;
  assert.deepEqual(
    [colonies.numbers, colonies.censoredLeft, colonies.censoredRight, colonies.nonNumeric],
    [3, 0, 3, 1],
  );
  assert.deepEqual(colonies.censoredLimits, [
    { side: "above", limit: 250, count: 1 },
    { side: "above", limit: 300, count: 2 },
  ]);
  // The cells' text is kept as written.
  assert.deepEqual(t.text("crp_mg_l").values, ["1,2", "<0,5", "< 0,5", "≤0,2", "3,4", "", "<=0,5"]);
});

Deno.test("both CSV readers and a file read censored cells identically", async () => {
  const quick = tableFromCsv(LAB, { reader: "simple" });
  const general = tableFromCsv(LAB, { reader: "csv-parse" });
  assertSameTable(quick, general, "simple vs csv-parse");
  const dir = await Deno.makeTempDir();
  try {
    await Deno.writeTextFile(`${dir}/lab.csv`, LAB);
    const file = await loadTable(`${dir}/lab.csv`);
    assert.deepEqual(
      Array.from(file.numericCells("crp_mg_l").censor!),
      Array.from(quick.numericCells("crp_mg_l").censor!),
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  // A quoted censored cell takes the general reader.
  const quoted = await loadTable('v,g\n"<0.5",a\n1.5,"b"\n');
  assert.deepEqual(Array.from(quoted.numeric("v").censor!), [-1, 0]);
});

Deno.test("numericCells carries the side per row; no censor array when nothing is censored", async () => {
  const t = await loadTable(LAB);
  const cells = t.numericCells("crp_mg_l");
  assert.deepEqual(Array.from(cells.censor!), [0, -1, -1, -1, 0, 0, -1]);
  assert.deepEqual(Array.from(cells.values).map((v) => Number.isNaN(v) ? null : v), [
    1.2,
    0.5,
    0.5,
    0.2,
    3.4,
    null,
    0.5,
  ]);
  assert.deepEqual(Array.from(cells.missing), [0, 0, 0, 0, 0, 1, 0]);
  const plain = await loadTable("v\n1\n2\n");
  assert.equal(plain.numericCells("v").censor, undefined);
  assert.equal(plain.numeric("v").censor, undefined);
  assert.equal("censor" in plain.numeric("v"), false);
  assert.equal("censor" in JSON.parse(JSON.stringify(plain.numeric("v"))), false);
  assert.deepEqual(JSON.parse(JSON.stringify(t.numeric("crp_mg_l"))).censor, [
    0,
    -1,
    -1,
    -1,
    0,
    -1,
  ]);
});

Deno.test("limit words are text unless the column's limit is given, and the error says how", async () => {
  const t = await loadTable("no2\n12\nND\n15\n<LOD\n18\n");
  assert.equal(t.info("no2").provenance.nonNumeric, 2);
  assert.throws(
    () => t.numeric("no2"),
    isPlumbError(
      "non-numeric",
      /"ND" says the value is below a limit without giving it: to read such cells as censored, give the column's limit when loading, loadTable\(source, \{ detectionLimits: \{ "no2": 0\.5 \} \}\) with your limit in place of 0\.5/,
    ),
  );
  const given = await loadTable("no2\n12\nND\n15\n<LOD\n18\n", { detectionLimits: { no2: 2 } });
  const col = given.numeric("no2");
  assert.deepEqual(Array.from(col.values), [12, 2, 15, 2, 18]);
  assert.deepEqual(Array.from(col.censor!), [0, -1, 0, -1, 0]);
  // Cells with their own number keep it; the given limit is only for words.
  const mixed = await loadTable("v\n<1\nND\n3\n", { detectionLimits: { v: 2 } });
  assert.deepEqual(mixed.info("v").provenance.censoredLimits, [
    { side: "below", limit: 1, count: 1 },
    { side: "below", limit: 2, count: 1 },
  ]);
  // Above-limit words need { above }.
  const counts = await loadTable("n\n12\nTNTC\n40\n", { detectionLimits: { n: { above: 300 } } });
  assert.deepEqual(Array.from(counts.numeric("n").censor!), [0, 1, 0]);
  const belowOnly = await loadTable("n\n12\nTNTC\n40\n", { detectionLimits: { n: 1 } });
  assert.equal(belowOnly.info("n").provenance.nonNumeric, 1);
});

Deno.test("detectionLimits: unknown columns and bad limits are refused", async () => {
  await assert.rejects(
    () => loadTable("a\n1\n", { detectionLimits: { b: 1 } }),
    isPlumbError("unknown-column", /^Unknown column "b" in detectionLimits: the table has "a"/),
  );
  await assert.rejects(
    () => loadTable([1, 2], { detectionLimits: { nope: 1 } }),
    isPlumbError("unknown-column"),
  );
  for (const bad of [NaN, Infinity, "0.5", null, { below: "1" }, { low: 1 }]) {
    await assert.rejects(
      () => loadTable("a\n1\n", { detectionLimits: { a: bad as number } }),
      isPlumbError("bad-option", /detection limit|detection limits/),
      JSON.stringify(bad),
    );
  }
  await assert.rejects(
    () => loadTable("a\n1\n", { detectionLimits: [1] as unknown as Record<string, number> }),
    isPlumbError("bad-option", /must be an object/),
  );
});

Deno.test("the kind rule counts censored cells with the numbers", async () => {
  const t = await loadTable("a,b,c\n<1,x,<1\n<1,y,x\n2,<1,y\n");
  assert.deepEqual(t.columns.map((c) => c.kind), ["numeric", "text", "text"]);
  const all = await loadTable("a\n<1\n<2\n");
  assert.equal(all.info("a").kind, "numeric");
  assert.equal(all.info("a").provenance.numbers, 0);
  assert.equal(all.numeric("a").values.length, 2);
});

Deno.test("dropText leaves text cells out and keeps the censored ones", async () => {
  const t = await loadTable("v\n1\n<0.5\noops\n2\n>9\n");
  const col = t.numeric("v", { dropText: true });
  assert.deepEqual(Array.from(col.values), [1, 0.5, 2, 9]);
  assert.deepEqual(Array.from(col.censor!), [0, -1, 0, 1]);
  assert.deepEqual(Array.from(col.rowIndex), [0, 1, 3, 4]);
  assert.equal(col.provenance.textDropped, 1);
  assert.throws(
    () => t.numeric("v"),
    isPlumbError("non-numeric", /1 text cell among 2 numbers and 2 censored values/),
  );
});

Deno.test("in memory: strings, { below } / { above } cells and { values, censor } columns", async () => {
  const t = await loadTable({
    crp: [1.2, { below: 0.5 }, "<0.5", 3.4, null, { above: 20 }],
    chlorine: { values: [0.05, 0.21, 0.05, 0.3, 0.4, 0.5], censor: [-1, 0, -1, 0, 0, 1] },
    typed: {
      values: new Float64Array([1, 2, 3, 4, 5, 6]),
      censor: new Int8Array([0, 0, 0, 0, 0, -1]),
    },
  });
  const crp = t.numeric("crp");
  assert.deepEqual(Array.from(crp.values), [1.2, 0.5, 0.5, 3.4, 20]);
  assert.deepEqual(Array.from(crp.censor!), [0, -1, -1, 0, 1]);
  assert.deepEqual(t.text("crp").values, ["1.2", "<0.5", "<0.5", "3.4", "", ">20"]);
  const cl = t.numeric("chlorine");
  assert.deepEqual(Array.from(cl.censor!), [-1, 0, -1, 0, 0, 1]);
  assert.equal(cl.provenance.censoredLeft, 2);
  assert.equal(cl.provenance.censoredRight, 1);
  assert.deepEqual(Array.from(t.numeric("typed").censor!), [0, 0, 0, 0, 0, -1]);
  // Rows of objects and a Map take the same cells.
  const rows = await loadTable([{ v: 1 }, { v: { below: 0.1 } }, { v: 2 }]);
  assert.deepEqual(Array.from(rows.numeric("v").censor!), [0, -1, 0]);
  const map = await loadTable(new Map([["v", { values: [1, 2], censor: [0, 1] }]]));
  assert.deepEqual(Array.from(map.numeric("v").censor!), [0, 1]);
  // An object with other keys is still text, never silently a limit.
  const other = await loadTable([1, { below: 0.5, unit: "mg" }, { below: "0.5" }, 2]);
  assert.equal(other.info("value").provenance.nonNumeric, 2);
});

Deno.test("in memory: a { values, censor } column that does not line up is refused", async () => {
  const cases: [unknown, RegExp][] = [
    [{ values: [1, 2], censor: [0] }, /values has 2 entries and censor 1/],
    [{ values: [1, 2], censor: [0, 2] }, /censor\[1\] \(row 2\) is 2/],
    [
      { values: [1, NaN], censor: [0, -1] },
      /row 2 is censored but its limit NaN is not a finite number/,
    ],
    [{ values: "12", censor: [0, 0] }, /values is not an array/],
    [{ values: [1], censor: [0], unit: "mg" }, /unknown key "unit"/],
  ];
  for (const [column, message] of cases) {
    await assert.rejects(
      () => loadTable({ x: column } as never),
      isPlumbError("bad-option", message),
    );
  }
});
