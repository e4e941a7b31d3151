import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertSameTable } from "./_same_table.ts";

const encoder = new TextEncoder();
const isPlumbError = (code: string, message?: RegExp) => (e: unknown) => {
  assert.ok(e instanceof PlumbError, String(e));
  assert.equal(e.code, code, e.message);
  if (message) assert.match(e.message, message);
  return true;
};

/** The text as UTF-16 code units, little- or big-endian, with or without a byte-order mark. */
function utf16(text: string, order: "le" | "be", bom = true): Uint8Array {
  const out = new Uint8Array((text.length + (bom ? 1 : 0)) * 2);
  let k = 0;
  const put = (unit: number) => {
    out[k++] = order === "le" ? unit & 255 : unit >> 8;
    out[k++] = order === "le" ? unit >> 8 : unit & 255;
  };
  if (bom) put(0xfeff);
  for (let i = 0; i < text.length; i++) put(text.charCodeAt(i));
  return out;
}

const LAB =
  "Messstelle\tTemperatur °C\tNO₃ µg/L\r\nBrunnen 1\t12,5\t3,1\r\nBrunnen 2\t13,0\t<0,5\r\n";

Deno.test("UTF-16LE and UTF-16BE text is decoded by its byte-order mark", async () => {
  const reference = tableFromCsv(LAB, { decimal: "," });
  for (const order of ["le", "be"] as const) {
    const t = tableFromCsv(utf16(LAB, order), { decimal: "," });
    assertSameTable(t, reference, `UTF-16${order.toUpperCase()}`);
    assert.deepEqual(t.columns.map((c) => c.name), ["Messstelle", "Temperatur °C", "NO₃ µg/L"]);
    assert.deepEqual(Array.from(t.numeric("Temperatur °C").values), [12.5, 13]);
  }
  // From a file, as a spreadsheet program's "Unicode text" export writes it.
  const dir = await Deno.makeTempDir();
  try {
    await Deno.writeFile(`${dir}/export.txt`, utf16(LAB, "le"));
    const t = await loadTable(`${dir}/export.txt`, { decimal: "," });
    assert.equal(t.delimiter, "\t");
    assert.equal(t.info("NO₃ µg/L").provenance.censoredLeft, 1);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("UTF-16 without a byte-order mark is named, with the option that reads it", () => {
  assert.throws(
    () => tableFromCsv(utf16("a,b\n1,2\n3,4\n", "le", false)),
    isPlumbError(
      "malformed",
      /^Cannot read text as UTF-8: every other byte is zero, so the text looks like UTF-16LE without a byte-order mark; pass \{ encoding: "utf-16le" \}$/,
    ),
  );
  const t = tableFromCsv(utf16("a,b\n1,2\n3,4\n", "be", false), { encoding: "utf-16be" });
  assert.deepEqual(Array.from(t.numeric("b").values), [2, 4]);
});

// "Probe;Wert µg/L\na°;1,5\nb;2\n" in Windows-1252: µ is 0xB5, ° is 0xB0.
const WINDOWS_1252 = Uint8Array.from([
  ...encoder.encode("Probe;Wert "),
  0xb5,
  ...encoder.encode("g/L\na"),
  0xb0,
  ...encoder.encode(";1,5\nb;2\n"),
]);

Deno.test("Windows-1252 bytes: an error naming line, byte and encoding; read with encoding", async () => {
  for (const reader of ["auto", "csv-parse"] as const) {
    assert.throws(
      () => tableFromCsv(WINDOWS_1252, { reader }),
      isPlumbError(
        "malformed",
        /^Cannot read text as UTF-8 at line 1: the byte 0xB5 is not UTF-8 text; the file is probably in windows-1252 \(where 0xB5 is "µ"\): pass \{ encoding: "windows-1252" \}$/,
      ),
      reader,
    );
  }
  const t = tableFromCsv(WINDOWS_1252, { encoding: "windows-1252" });
  assert.deepEqual(t.columns.map((c) => c.name), ["Probe", "Wert µg/L"]);
  assert.deepEqual(t.text("Probe").values, ["a°", "b"]);
  assert.deepEqual(Array.from(t.numeric("Wert µg/L").values), [1.5, 2]);
  // The line of a bad byte further down, from a file.
  const dir = await Deno.makeTempDir();
  try {
    const bytes = Uint8Array.from([...encoder.encode("x,y\n1,2\n3,"), 0xe9, 0x0a]);
    await Deno.writeFile(`${dir}/latin.csv`, bytes);
    await assert.rejects(
      () => loadTable(`${dir}/latin.csv`),
      isPlumbError("malformed", /^Cannot read latin\.csv as UTF-8 at line 3: the byte 0xE9/),
    );
    const ok = await loadTable(`${dir}/latin.csv`, { encoding: "iso-8859-1" });
    assert.deepEqual(ok.text("y").values, ["2", "é"]);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("the encoding option: unknown labels, strings, and bytes the encoding cannot hold", () => {
  assert.throws(
    () => tableFromCsv(WINDOWS_1252, { encoding: "klingon" }),
    isPlumbError("bad-option", /^Unknown encoding "klingon": give a label such as/),
  );
  assert.throws(
    () => tableFromCsv("a\n1\n", { encoding: "windows-1252" }),
    isPlumbError("bad-option", /^Cannot apply the encoding option to a string: it is already text/),
  );
  // Valid UTF-8 declared as such reads as usual; "utf8" is a label for it.
  const t = tableFromCsv(encoder.encode("µ\n1\n"), { encoding: "utf8" });
  assert.deepEqual(t.columns.map((c) => c.name), ["µ"]);
  assert.throws(
    () => tableFromCsv(Uint8Array.from([0x61, 0x0a, 0xff, 0xfe, 0x0a]), { encoding: "shift_jis" }),
    isPlumbError("malformed", /^Cannot read text as shift_jis: it holds bytes that are not/),
  );
});

Deno.test("a first line sep=; names the delimiter, and line numbers stay the file's", () => {
  for (const reader of ["auto", "csv-parse"] as const) {
    for (const eol of ["\n", "\r\n"]) {
      const text = ["sep=;", "a;b", "1,5;2", "x;4"].join(eol) + eol;
      const t = tableFromCsv(text, { reader });
      assert.equal(t.delimiter, ";");
      assert.deepEqual(t.columns.map((c) => c.name), ["a", "b"]);
      assert.deepEqual(t.info("a").provenance.nonNumericCells, [{ row: 2, line: 4, text: "x" }]);
      assertSameTable(t, tableFromCsv(encoder.encode(text)), `${reader} bytes`);
    }
  }
  // Given explicitly, the delimiter option wins; the sep= line is still not a row.
  const t = tableFromCsv("SEP=,\na|b\n1|2\n", { delimiter: "|" });
  assert.deepEqual(t.columns.map((c) => c.name), ["a", "b"]);
  assert.equal(t.rowCount, 1);
  // A header that merely starts with "sep=" is a header.
  assert.deepEqual(tableFromCsv("sep=x,y\n1,2\n").columns.map((c) => c.name), ["sep=x", "y"]);
});

Deno.test("workbooks, Parquet, Arrow and compressed files given as CSV are named by their bytes", () => {
  const cases: [number[], RegExp][] = [
    [
      [0x50, 0x4b, 0x03, 0x04, ...encoder.encode("....[Content_Types].xml....xl/workbook.xml")],
      /an Excel workbook \(\.xlsx\); give the file's path to loadTable, which reads workbooks/,
    ],
    [[...encoder.encode("PAR1"), 0, 0, 0], /a Parquet file/],
    [[...encoder.encode("ARROW1"), 0, 0], /an Arrow IPC file/],
    [
      [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1],
      /a legacy Excel workbook \(\.xls\); save it as \.xlsx or CSV/,
    ],
    [[0x1f, 0x8b, 8, 0], /a gzip-compressed file; decompress it first/],
  ];
  for (const [bytes, message] of cases) {
    assert.throws(
      () => tableFromCsv(Uint8Array.from(bytes)),
      isPlumbError(
        "malformed",
        new RegExp(`^Cannot read text as CSV: its first bytes show it is ${message.source}`),
      ),
    );
  }
});
