/**
 * Tables from Excel workbooks (.xlsx), read with exceljs.
 *
 * - The sheet: by name or 1-based position (`sheet`), else the first
 *   visible sheet.
 * - The header row: the first row with at least two filled cells (one for
 *   a one-column sheet); title rows above it (a single text, often merged
 *   across the columns) and blank rows are skipped. A header cell merged
 *   across several columns names each of them; when the row under such a
 *   header holds only text, it is a second header row and each name is
 *   joined from both (`Oxygen` over `mg/L` and `% sat` gives `Oxygen mg/L`
 *   and `Oxygen % sat`).
 * - Cells: numbers are numbers; text is read like a CSV cell (so `<0.5` is
 *   censored, `NA` missing, `12,5` a number with `decimal: ","`); a
 *   formula gives its cached result (the value the workbook last showed); a
 *   date is text (`2026-01-05`, or the full time when it has one); a
 *   merged cell repeats its first cell's value; an error (`#DIV/0!`) and a
 *   boolean are text; blank rows below the header are skipped.
 * - Provenance: `line` is the sheet's own row number, so messages point at
 *   the row a spreadsheet shows.
 *
 * @module
 */
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import type { CellOptions } from "./read_options.ts";
import { _dateText, _tableFromPairs } from "./in_memory.ts";

/** Options for {@linkcode tableFromWorkbook}. */
export interface WorkbookOptions extends CellOptions {
  /**
   * The sheet to read: its name, or its 1-based position among the sheets.
   * @default the first visible sheet
   */
  readonly sheet?: string | number;
  /**
   * The file name shown as the table's source (the sheet's name is added).
   * @default "workbook"
   */
  readonly sourceName?: string;
}

type _Value = number | string | Date | null;
type _Sheet = {
  name: string;
  state?: string;
  rowCount: number;
  columnCount: number;
  getCell(
    row: number,
    col: number,
  ): { value: unknown; isMerged: boolean; master: { value: unknown } };
};

/**
 * Build a table from the bytes of an .xlsx workbook.
 *
 * @param bytes the workbook file's bytes
 * @param options the sheet, the source name, and how text cells are read
 * @returns a frozen table whose source is `file.xlsx [sheet]`
 * @throws {PlumbError} `"bad-option"` for a sheet the workbook does not
 *   have (the message lists its sheets); `"malformed"` for bytes that are
 *   not a readable workbook or a sheet without any filled cell
 *
 * @example
 * ```ts
 * import { tableFromWorkbook } from "./workbook.ts";
 * import { ExcelJS } from "../_deps/exceljs.ts";
 * const wb = new ExcelJS.Workbook();
 * const sheet = wb.addWorksheet("QC");
 * sheet.addRow(["line", "oxygen_ppb"]);
 * sheet.addRow(["A", 12.5]);
 * sheet.addRow(["B", "<4"]);
 * const bytes = new Uint8Array(await wb.xlsx.writeBuffer() as ArrayBuffer);
 * const t = await tableFromWorkbook(bytes, { sourceName: "lab.xlsx" });
 * if (t.source !== "lab.xlsx [QC]" || t.info("oxygen_ppb").provenance.censoredLeft !== 1) {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export async function tableFromWorkbook(
  bytes: Uint8Array,
  options: WorkbookOptions = {},
): Promise<Table> {
  const file = options.sourceName ?? "workbook";
  const { ExcelJS } = await import("../_deps/exceljs.ts");
  const workbook = new ExcelJS.Workbook();
  try {
    // A copy of exactly these bytes (the caller's buffer may be larger).
    await workbook.xlsx.load(bytes.slice().buffer as ArrayBuffer);
  } catch (e) {
    throw new PlumbError(
      "malformed",
      `Cannot read ${file} as an Excel workbook: ${
        String((e as Error)?.message ?? e).split("\n")[0]
      }; check that it is an .xlsx file (save older .xls files as .xlsx)`,
      { source: file },
    );
  }
  const sheet = _pickSheet(workbook.worksheets as unknown as _Sheet[], options.sheet, file);
  const source = `${file} [${sheet.name}]`;
  const grid = _grid(sheet);
  const header = _headerRow(grid, sheet, source);
  const names = header.names;
  const rows: number[] = [];
  for (let r = header.dataStart; r <= grid.length; r++) {
    if (grid[r - 1].some((v) => v !== null)) rows.push(r);
  }
  const pairs: [string, _Value[]][] = names.map((name, j) => [
    name,
    rows.map((r) => grid[r - 1][j] ?? null),
  ]);
  const dated = pairs.map(([name, cells]) => [name, cells.map(_cellOf)] as [string, unknown[]]);
  return _tableFromPairs(dated, options, { source, lineOf: (row) => rows[row] });
}

function _pickSheet(sheets: _Sheet[], wanted: string | number | undefined, file: string): _Sheet {
  const list = sheets.map((s) => JSON.stringify(s.name)).join(", ");
  if (sheets.length === 0) {
    throw new PlumbError("malformed", `Cannot read ${file}: the workbook has no sheets`);
  }
  if (wanted === undefined) {
    return sheets.find((s) => (s.state ?? "visible") === "visible") ?? sheets[0];
  }
  if (typeof wanted === "number") {
    if (Number.isInteger(wanted) && wanted >= 1 && wanted <= sheets.length) {
      return sheets[wanted - 1];
    }
  } else if (typeof wanted === "string") {
    const exact = sheets.find((s) => s.name === wanted);
    if (exact) return exact;
    const loose = sheets.find((s) => s.name.trim().toLowerCase() === wanted.trim().toLowerCase());
    if (loose) return loose;
  }
  throw new PlumbError(
    "bad-option",
    `Unknown sheet ${
      JSON.stringify(wanted)
    } in ${file}: it has ${list}; give a sheet's name or its position from 1 to ${sheets.length}`,
    { sheets: sheets.map((s) => s.name) },
  );
}

/** The sheet's values, row by row (1-based rows at index r − 1), merged cells filled in. */
function _grid(sheet: _Sheet): _Value[][] {
  const grid: _Value[][] = [];
  for (let r = 1; r <= sheet.rowCount; r++) {
    const row: _Value[] = new Array(sheet.columnCount).fill(null);
    for (let c = 1; c <= sheet.columnCount; c++) {
      const cell = sheet.getCell(r, c);
      row[c - 1] = _value(cell.isMerged ? cell.master.value : cell.value);
    }
    grid.push(row);
  }
  // Trailing empty rows are not part of the table.
  while (grid.length > 0 && grid[grid.length - 1].every((v) => v === null)) grid.pop();
  return grid;
}

/** One exceljs cell value as a number, text, date or null. */
function _value(v: unknown): _Value {
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string") return v;
  if (v instanceof Date) return v;
  if (typeof v === "boolean") return v ? "TRUE" : "FALSE";
  if (typeof v === "object") {
    const o = v as Record<string, unknown>;
    if ("result" in o || "formula" in o || "sharedFormula" in o) {
      // A formula: its cached result, as the workbook last showed it.
      return o.result === undefined ? `=${String(o.formula ?? o.sharedFormula)}` : _value(o.result);
    }
    if (Array.isArray(o.richText)) {
      return (o.richText as { text?: unknown }[]).map((p) => String(p.text ?? "")).join("");
    }
    if ("text" in o) return _value(o.text);
    if ("error" in o) return String(o.error);
  }
  return String(v);
}

/** A date as text (the day alone when it has no time of day); other values as they are. */
function _cellOf(v: _Value): unknown {
  return v instanceof Date ? _dateText(v) : v;
}

/** The header row: names (one or two rows joined) and the first data row. */
function _headerRow(
  grid: _Value[][],
  sheet: _Sheet,
  source: string,
): { names: string[]; dataStart: number } {
  const filled = (r: number) => grid[r - 1].filter((v) => v !== null).length;
  const onlyColumn = grid.every((row) => row.slice(1).every((v) => v === null));
  let h = 0;
  for (let r = 1; r <= grid.length; r++) {
    const k = filled(r);
    // A title: one text, alone in its row or merged across it.
    const distinct = new Set(grid[r - 1].filter((v) => v !== null).map(String)).size;
    if (k >= 2 && distinct >= 2) {
      h = r;
      break;
    }
    if (onlyColumn && k === 1) {
      h = r;
      break;
    }
  }
  if (h === 0) {
    throw new PlumbError(
      "malformed",
      `Cannot read ${source}: no row has two filled cells to serve as the header; check the sheet (or pick another with the sheet option)`,
      { source },
    );
  }
  const top = grid[h - 1].map((v) => (v === null ? "" : String(_cellOf(v))));
  const spans = top.map((_, c) => sheet.getCell(h, c + 1).isMerged);
  const below = grid[h]; // the next row, when there is one
  const second = below !== undefined && spans.some((m) => m) &&
    below.every((v) => v === null || typeof v === "string") &&
    below.filter((v) => v !== null).length >= 2;
  const names = second
    ? top.map((t, c) =>
      [t, below[c] === null ? "" : String(below[c])].filter((x) => x !== "").join(" ")
    )
    : top;
  return { names, dataStart: h + (second ? 2 : 1) };
}
