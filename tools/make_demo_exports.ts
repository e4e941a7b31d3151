/**
 * Writes the invented lab's exports from the same invented rows as
 * `demo/bottling_lab.csv` (see `make_demo_data.ts`), in the shapes real
 * exports take:
 *
 * - `demo/lab_export.xlsx`: a workbook whose "QC lab" sheet has a title row
 *   merged across the columns, a blank row, a header with a wrapped name
 *   (`Fill volume⏎(mL)`), the sampling day as a date, oxygen readings under
 *   the 4 ppb detection limit written `<4`, and a second sheet of notes;
 * - `demo/fills.parquet` (written with nodejs-polars): line and fill volume
 *   with the missing fills as nulls.
 *
 * Run: `deno run -A tools/make_demo_exports.ts`
 *
 * @module
 */
import ExcelJS from "exceljs";
import pl from "nodejs-polars";
import { demoCsv } from "./make_demo_data.ts";

/** The demo rows as cells: [sample_id, line, shift, fill, torque, oxygen, gap]. */
function demoRows(): string[][] {
  return demoCsv().trim().split("\n").slice(1).map((l) => l.split(","));
}

/** The workbook's bytes. */
export async function labWorkbook(): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  wb.creator = "plumbline demo (invented data)";
  wb.created = wb.modified = new Date(Date.UTC(2026, 0, 1));
  const qc = wb.addWorksheet("QC lab");
  qc.addRow(["Bottling lab QC export (invented data)"]);
  qc.mergeCells("A1:F1");
  qc.addRow([]);
  qc.addRow(["sample", "line", "sampled", "Fill volume\n(mL)", "Cap torque (N·m)", "Oxygen (ppb)"]);
  demoRows().forEach((r, i) => {
    const day = new Date(Date.UTC(2026, 0, 5 + Math.floor(i / 24)));
    const number = (
      t: string,
    ) => (t === "" || t === "NA" ? null : Number.isNaN(Number(t)) ? t : Number(t));
    const oxygen = r[5] === "0" ? "<4" : number(r[5]);
    qc.addRow([r[0], r[1], day, number(r[3]), number(r[4]), oxygen]);
  });
  const notes = wb.addWorksheet("Notes");
  notes.addRow(["Oxygen readings under the 4 ppb detection limit are written <4."]);
  return new Uint8Array(await wb.xlsx.writeBuffer() as ArrayBuffer);
}

if (import.meta.main) {
  const demo = new URL("../demo/", import.meta.url);
  await Deno.writeFile(new URL("lab_export.xlsx", demo), await labWorkbook());
  const rows = demoRows();
  const fill = rows.map((
    r,
  ) => (r[3] === "" || r[3] === "NA" || Number.isNaN(Number(r[3])) ? null : Number(r[3])));
  pl.DataFrame({ line: rows.map((r) => r[1]), fill_ml: fill })
    .writeParquet(new URL("fills.parquet", demo).pathname, { compression: "zstd" });
  console.log("wrote demo/lab_export.xlsx and demo/fills.parquet (invented data)");
}
