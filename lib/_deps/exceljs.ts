/**
 * exceljs, pinned: the one place `lib/` imports it from (see README.md
 * here). It reads .xlsx workbooks (zip + XML) in plain JavaScript: cell
 * values with their types, dates, formulas with their cached results, and
 * merged cells. `lib/data/workbook.ts` imports this file only when a
 * workbook is loaded.
 *
 * @module
 */
export { default as ExcelJS } from "npm:exceljs@4.4.0";
