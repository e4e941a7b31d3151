import assert from "node:assert/strict";
import ExcelJS from "exceljs";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";

/** A lab export as a spreadsheet program writes one: a title, a blank row, then the table. */
async function labWorkbook(): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  const notes = wb.addWorksheet("Notes");
  notes.addRow(["Invented data for the tests"]);
  notes.state = "hidden";
  const qc = wb.addWorksheet("QC lab");
  qc.addRow(["Bottling lab: fill and oxygen, line A"]);
  qc.mergeCells("A1:E1");
  qc.addRow([]);
  qc.addRow(["sample", "Fill volume\n(mL)", "sampled", "Oxygen", null]);
  qc.mergeCells("D3:E3");
  qc.addRow([null, null, null, "ppb", "% sat"]);
  qc.addRow(["S1", 500.1, new Date(Date.UTC(2026, 0, 5)), 12.5, 3.1]);
  qc.addRow([
    "S2",
    { formula: "B5-0.4", result: 499.7 },
    new Date(Date.UTC(2026, 0, 5, 14, 30)),
    "<4",
    2.2,
  ]);
  qc.addRow([]);
  qc.addRow(["S3", 500.4, new Date(Date.UTC(2026, 0, 6)), "NA", { error: "#DIV/0!" }]);
  const counts = wb.addWorksheet("Counts");
  counts.addRow(["plate", "colonies"]);
  counts.addRow(["P1", 12]);
  counts.addRow(["P2", ">300"]);
  return new Uint8Array(await wb.xlsx.writeBuffer() as ArrayBuffer);
}

Deno.test("an .xlsx sheet: first visible sheet, title skipped, two-row merged header, cells typed", async () => {
  const dir = await Deno.makeTempDir();
  try {
    await Deno.writeFile(`${dir}/lab.xlsx`, await labWorkbook());
    const t = await loadTable(`${dir}/lab.xlsx`);
    assert.equal(t.source, "lab.xlsx [QC lab]");
    assert.deepEqual(t.columns.map((c) => c.name), [
      "sample",
      "Fill volume\n(mL)",
      "sampled",
      "Oxygen ppb",
      "Oxygen % sat",
    ]);
    assert.equal(t.rowCount, 3); // the blank row is skipped
    // A formula gives its cached result.
    assert.deepEqual(Array.from(t.numeric("Fill volume\n(mL)").values), [500.1, 499.7, 500.4]);
    // Dates are text: the day alone, or the time when there is one.
    assert.deepEqual(t.text("sampled").values, [
      "2026-01-05",
      "2026-01-05T14:30:00.000Z",
      "2026-01-06",
    ]);
    // "<4" is censored, "NA" missing; line numbers are the sheet's rows.
    const oxygen = t.info("Oxygen ppb").provenance;
    assert.deepEqual([oxygen.numbers, oxygen.censoredLeft, oxygen.missing], [1, 1, 1]);
    assert.deepEqual(t.info("Oxygen % sat").provenance.nonNumericCells, [
      { row: 3, line: 8, text: "#DIV/0!" },
    ]);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("the sheet option: by name or position; an unknown sheet lists the sheets", async () => {
  const dir = await Deno.makeTempDir();
  try {
    // Named .csv: a workbook is recognised by its bytes.
    await Deno.writeFile(`${dir}/export.csv`, await labWorkbook());
    const counts = await loadTable(`${dir}/export.csv`, { sheet: "counts" });
    assert.equal(counts.source, "export.csv [Counts]");
    assert.deepEqual(Array.from(counts.numeric("colonies").censor!), [0, 1]);
    const byPosition = await loadTable(`${dir}/export.csv`, { sheet: 3 });
    assert.equal(byPosition.source, "export.csv [Counts]");
    await assert.rejects(() => loadTable(`${dir}/export.csv`, { sheet: "Lab" }), (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "bad-option");
      assert.equal(
        e.message,
        'Unknown sheet "Lab" in export.csv: it has "Notes", "QC lab", "Counts"; give a sheet\'s name or its position from 1 to 3',
      );
      return true;
    });
    await Deno.writeTextFile(`${dir}/plain.csv`, "a,b\n1,2\n");
    await assert.rejects(
      () => loadTable(`${dir}/plain.csv`, { sheet: 1 }),
      /Cannot pick a sheet of plain\.csv: it is not an Excel workbook/,
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("a file that only looks like a workbook is refused clearly", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const bytes = Uint8Array.from([
      0x50,
      0x4b,
      0x03,
      0x04,
      ...new TextEncoder().encode("xl/ broken"),
    ]);
    await Deno.writeFile(`${dir}/broken.xlsx`, bytes);
    await assert.rejects(() => loadTable(`${dir}/broken.xlsx`), (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "malformed");
      assert.match(
        e.message,
        /^Cannot read broken\.xlsx as an Excel workbook: .*; check that it is an \.xlsx file/,
      );
      return true;
    });
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
