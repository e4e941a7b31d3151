import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertSameTable } from "./_same_table.ts";

const dir = new URL("../fixtures/csv/", import.meta.url);
const fixture = (name: string) => new URL(name, dir);

// The same four rows written in each dialect: comma, ";" with decimal
// comma, tab, "|", CRLF line ends, a UTF-8 byte-order mark, quoted fields.
const DIALECTS: [string, string][] = [
  ["comma.csv", ","],
  ["semicolon_decimal_comma.csv", ";"],
  ["tab.tsv", "\t"],
  ["pipe.csv", "|"],
  ["crlf.csv", ","],
  ["bom.csv", ","],
  ["quoted.csv", ","],
];

for (const [name, delimiter] of DIALECTS) {
  Deno.test(`CSV dialect ${name}: delimiter detected, numbers and text read`, async () => {
    const table = await loadTable(fixture(name));
    assert.equal(table.source, name);
    assert.equal(table.delimiter, delimiter);
    assert.equal(table.rowCount, 4);
    assert.deepEqual(table.columns.map((c) => c.name), ["line", "volume", "torque"]);
    assert.deepEqual(table.numericNames(), ["volume", "torque"]);
    assert.deepEqual(table.textNames(), ["line"]);
    assert.deepEqual(Array.from(table.numeric("volume").values), [500.2, 499.8, 501.0, 500.5]);
    assert.deepEqual(Array.from(table.numeric("torque").values), [1.25, 1.31, 1.18, 1.4]);
    const line = table.text("line").values;
    if (name === "quoted.csv") assert.deepEqual(line, ["A", "B, north", 'A "old"', "B\nsouth"]);
    else assert.deepEqual(line, ["A", "B", "A", "B"]);
  });
}

Deno.test("quoted field spanning two lines: the row's line is where it starts", async () => {
  const table = await loadTable(fixture("quoted.csv"));
  const notes = table.info("line").provenance.nonNumericCells;
  assert.deepEqual(notes.map((n) => [n.row, n.line]), [[1, 2], [2, 3], [3, 4], [4, 5]]);
});

Deno.test("the delimiter can be given; a ';' file with '.' decimals needs decimal: '.'", () => {
  const text = "a;b\n1.5;2.5\n3.5;4.5\n";
  const table = tableFromCsv(text, { delimiter: ";", decimal: "." });
  assert.deepEqual(Array.from(table.numeric("a").values), [1.5, 3.5]);
  const wrong = tableFromCsv(text);
  assert.equal(wrong.decimal, ",");
  assert.equal(wrong.info("a").kind, "text");
  assert.equal(
    wrong.info("a").hint,
    'Read as text with decimal: ",", but all of its 2 text cells read as numbers with decimal: "."; pass that option if the column holds measurements',
  );
  assert.equal(table.info("a").hint, null);
  assert.throws(() => wrong.numeric("a"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    assert.match(e.message, /would read as numbers with decimal: "\."/);
    return true;
  });
});

Deno.test("missing-value tokens are counted, never read as numbers", async () => {
  const table = await loadTable(fixture("missing_tokens.csv"));
  const p = table.info("oxygen").provenance;
  assert.equal(p.rowsRead, 10);
  assert.equal(p.numbers, 2);
  assert.equal(p.missing, 8);
  assert.equal(p.nonNumeric, 0);
  const col = table.numeric("oxygen");
  assert.deepEqual(Array.from(col.values), [0.12, 0.3]);
  assert.deepEqual(Array.from(col.rowIndex), [0, 9]);
  assert.equal(col.provenance.missingDropped, 8);
  assert.equal(col.provenance.used, 2);
});

Deno.test("the missing-token list is configurable and replaces the default", () => {
  const text = "x,y\n1,1\nn.d.,1\nNA,1\n,1\n2,1\n";
  const table = tableFromCsv(text, { missing: ["n.d."] });
  const p = table.info("x").provenance;
  assert.equal(p.missing, 2);
  assert.equal(p.nonNumeric, 1);
  assert.deepEqual(p.nonNumericCells, [{ row: 3, line: 4, text: "NA" }]);
});

Deno.test("thousands separators are text unless the option names one", async () => {
  const plain = await loadTable(fixture("thousands.csv"));
  assert.equal(plain.info("amount").kind, "text");
  const given = await loadTable(fixture("thousands.csv"), { thousands: "," });
  assert.deepEqual(Array.from(given.numeric("amount").values), [1234.5, 12000, 7.25]);
});

Deno.test("spaces around fields and header names are ignored", async () => {
  const table = await loadTable(fixture("spaces.csv"));
  assert.deepEqual(table.columns.map((c) => c.name), ["name", "value"]);
  assert.deepEqual(table.text("name").values, ["alpha", "beta"]);
  assert.deepEqual(Array.from(table.numeric("value").values), [1.5, 2.5]);
});

Deno.test("blank lines are skipped and line numbers still count them", async () => {
  const table = await loadTable(fixture("blank_lines.csv"));
  assert.equal(table.rowCount, 3);
  assert.deepEqual(Array.from(table.numeric("v").values), [1, 3, 5]);
  const t = tableFromCsv("\nv,w\n1,1\n\nx,1\n");
  assert.deepEqual(t.info("v").provenance.nonNumericCells, [{ row: 2, line: 5, text: "x" }]);
});

Deno.test("in a one-column table a blank line is a missing cell, counted; blank lines at the end are not cells", () => {
  for (const reader of ["auto", "csv-parse"] as const) {
    const t = tableFromCsv("\nv\n1\n\nx\n\n", { reader });
    assert.equal(t.rowCount, 3);
    assert.equal(t.info("v").provenance.missing, 1);
    assert.deepEqual(t.info("v").provenance.nonNumericCells, [{ row: 3, line: 5, text: "x" }]);
  }
});

Deno.test("a header-only text gives zero rows and empty columns", () => {
  const table = tableFromCsv("a,b\n");
  assert.equal(table.rowCount, 0);
  assert.deepEqual(table.columns.map((c) => c.kind), ["empty", "empty"]);
  assert.equal(table.numeric("a").values.length, 0);
});

Deno.test("a text with no header is malformed", () => {
  for (const text of ["", "\n\n", "\r\n"]) {
    for (const reader of ["auto", "csv-parse"] as const) {
      assert.throws(() => tableFromCsv(text, { reader }), (e: unknown) => {
        assert.ok(e instanceof PlumbError);
        assert.equal(e.code, "malformed");
        assert.equal(
          e.message,
          "Malformed CSV in text: there is no header row (the text is empty); start the text with a line of column names",
        );
        return true;
      });
    }
  }
});

const MALFORMED: [string, string][] = [
  [
    "unclosed_quote.csv",
    "Malformed CSV in unclosed_quote.csv at line 3: a quoted field opens on this line and is never closed; add the closing double quote",
  ],
  [
    "ragged_long.csv",
    "Malformed CSV in ragged_long.csv at line 3: 3 fields where the header has 2; give every line as many fields as the header (an empty field still needs its delimiter)",
  ],
  [
    "ragged_short.csv",
    "Malformed CSV in ragged_short.csv at line 3: 2 fields where the header has 3; give every line as many fields as the header (an empty field still needs its delimiter)",
  ],
];

for (const [name, message] of MALFORMED) {
  for (const reader of ["auto", "csv-parse"] as const) {
    Deno.test(`malformed ${name} (${reader} reader): PlumbError naming the line`, async () => {
      await assert.rejects(() => loadTable(fixture(name), { reader }), (e: unknown) => {
        assert.ok(e instanceof PlumbError);
        assert.equal(e.code, "malformed");
        assert.equal(e.message, message);
        return true;
      });
    });
  }
}

Deno.test("a ragged row in the quick reader is found on the right line after CRLF and blank lines", () => {
  const text = "a,b\r\n1,2\r\n\r\n3\r\n";
  for (const reader of ["simple", "csv-parse"] as const) {
    assert.throws(
      () => tableFromCsv(text, { reader }),
      /at line 4: 1 field where the header has 2/,
    );
  }
});

Deno.test("a stray quote inside a field is malformed, naming its line", () => {
  assert.throws(() => tableFromCsv('a,b\n1,2\n3,4"x"\n'), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "malformed");
    assert.match(e.message, /^Malformed CSV in text at line 3: the quoting cannot be read/);
    return true;
  });
});

Deno.test("an unclosed quote near the start of a long text is reported at its line", () => {
  const text = 'a,b\n"1,2\n' + "3,4\n".repeat(50000);
  assert.throws(() => tableFromCsv(text), /at line 2: a quoted field opens/);
});

Deno.test("invalid options are refused with bad-option", () => {
  const cases: [Parameters<typeof tableFromCsv>[1], RegExp][] = [
    [{ delimiter: '"' }, /^Cannot use "\\"" as a delimiter/],
    [{ delimiter: ",," }, /^Cannot use ",," as a delimiter/],
    [{ delimiter: ",", decimal: "," }, /as both delimiter and decimal mark/],
    [{ thousands: "." }, /as both decimal mark and thousands separator/],
    [{ thousands: "5" }, /as a thousands separator/],
    [{ reader: "fast" as "auto" }, /^Unknown reader "fast"/],
  ];
  for (const [options, message] of cases) {
    assert.throws(() => tableFromCsv("a,b\n1,2\n", options), (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "bad-option");
      assert.match(e.message, message);
      return true;
    });
  }
  assert.throws(
    () => tableFromCsv('a\n"x"\n', { reader: "simple" }),
    /Cannot use the simple reader/,
  );
});

// The quick reader and csv-parse must give identical tables on every
// fixture they can both read (the quick one only reads quote-free text).
Deno.test("the quick reader and csv-parse give identical tables", async () => {
  const files: string[] = [];
  for await (const e of Deno.readDir(dir)) files.push(e.name);
  files.sort();
  let compared = 0;
  for (const name of files) {
    const bytes = await Deno.readFile(fixture(name));
    let general;
    try {
      general = tableFromCsv(bytes, { reader: "csv-parse", sourceName: name });
    } catch (e) {
      // Both readers must then fail the same way.
      assert.throws(() => tableFromCsv(bytes, { reader: "auto", sourceName: name }), {
        message: (e as Error).message,
      });
      continue;
    }
    const quick = tableFromCsv(bytes, { reader: "auto", sourceName: name });
    assertSameTable(quick, general, name);
    compared++;
  }
  assert.ok(compared >= 12, `compared ${compared} fixtures`);
});

Deno.test("the quick reader and csv-parse agree on awkward cells", () => {
  const texts = [
    "a,b\n 1 ,\t2\t\n-,.\n1e5,1E-5\n+.5,5.\n0x1,1e\n--1,1 2\n",
    "a\tb\n 1\t2 \n\t\n",
    "a;b\n1,5;-0,25\n1.5;NaN\n",
    "a,b\n12345678901234567890,0.1234567890123456789\n1e400,-1e-400\n",
    "a,b\nü,ß\n1,€\n",
    "only\n1\n\n2\nx\n",
  ];
  for (const text of texts) {
    assertSameTable(
      tableFromCsv(text, { reader: "simple" }),
      tableFromCsv(text, { reader: "csv-parse" }),
      JSON.stringify(text),
    );
  }
});

Deno.test("the quick reader grows its buffers when later lines are shorter than the first", () => {
  const text = "a,b\n" + `${"1".repeat(15)}.25,${"2".repeat(15)}\n` + "1,2\n".repeat(3000) + "3,4";
  const quick = tableFromCsv(text, { reader: "simple" });
  assert.equal(quick.rowCount, 3002);
  assert.equal(quick.numeric("a").values[3001], 3);
  assertSameTable(quick, tableFromCsv(text, { reader: "csv-parse" }), "growing");
});

Deno.test("a quote or a lone carriage return late in the text hands over to csv-parse", () => {
  const late = "a,b\n" + "1,2\n".repeat(100) + '"x, y",3\n';
  const t = tableFromCsv(late);
  assert.equal(t.text("a").values[100], "x, y");
  const cr = tableFromCsv("a,b\r1,2\r3,4\r");
  assert.deepEqual(Array.from(cr.numeric("b").values), [2, 4]);
});

Deno.test("a delimiter that can be part of a number: both readers split alike", () => {
  // "-2--3" with delimiter "-": the fields are "", "2", "", "3", never −2 and −3.
  for (const reader of ["auto", "csv-parse"] as const) {
    assert.throws(
      () => tableFromCsv("a-b\n-2--3\n", { delimiter: "-", reader }),
      /at line 2: 4 fields where the header has 2/,
      reader,
    );
    const t = tableFromCsv("a-b-c\n1.5-2e3-+4\n", { delimiter: "-", reader });
    assert.deepEqual([1.5, 2000, 4], ["a", "b", "c"].map((c) => t.numeric(c).values[0]), reader);
  }
  assert.deepEqual(
    Array.from(tableFromCsv("a+b\n1+2\n", { delimiter: "+" }).numeric("b").values),
    [2],
  );
  assert.throws(
    () => tableFromCsv("a1b\n", { delimiter: "1" }),
    /give one character other than a digit/,
  );
});

Deno.test("\\r\\r\\n line ends and blank lines at the end make no phantom missing cells", () => {
  for (const reader of ["auto", "csv-parse"] as const) {
    const doubled = tableFromCsv("v\r\r\n1\r\r\n2\r\r\n3\r\r\n", { reader });
    assert.equal(doubled.rowCount, 3, reader);
    assert.equal(doubled.info("v").provenance.missing, 0, reader);
    // Lines are still counted as an editor shows them (CR, then CR LF).
    const bad = tableFromCsv("v\r\r\n1\r\r\nx\r\r\n", { reader });
    assert.deepEqual(bad.info("v").provenance.nonNumericCells, [{ row: 2, line: 5, text: "x" }]);
    const trailing = tableFromCsv("v\n1\n2\n\n\n\n\n\n", { reader });
    assert.equal(trailing.rowCount, 2, reader);
    assert.equal(trailing.info("v").provenance.missing, 0, reader);
    // A blank line between values is still a missing cell, and a quoted empty
    // cell at the end is a row.
    const inner = tableFromCsv('v\r\n1\r\n\r\n2\r\n""\r\n\r\n', { reader: "csv-parse" });
    assert.equal(inner.rowCount, 4);
    assert.equal(inner.info("v").provenance.missing, 2);
  }
});
