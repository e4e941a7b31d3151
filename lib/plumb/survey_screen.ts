/**
 * The screening behind `survey(table)`, as plain data: one row per column,
 * analysed (or skipped with the reason), p-values adjusted across the
 * columns, sorted by departure.
 *
 * @module
 */
import { _numericColumnShared } from "../data/numeric_column.ts";
import type { Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import type { Analysis } from "../results/analysis.ts";
import { type Adjustment, adjustPValues, checkAdjustment } from "../stats/multiplicity.ts";
import { refuseCensored } from "./_censored_guard.ts";
import { analyse, ANALYSE_MIN_N } from "./analysis.ts";
import { suggestReexpression } from "./reexpress_view.ts";
import { rowLabelOf } from "./_loaded.ts";

/** Options for {@linkcode survey}. */
export interface SurveyOptions {
  /**
   * The columns to screen.
   * @default every numeric column
   */
  readonly columns?: readonly string[];
  /**
   * p-value adjustment across the columns screened.
   * @default "holm"
   */
  readonly adjust?: Adjustment;
  /**
   * Leave out text cells in numeric columns (counted in each row) instead of
   * listing such columns as not screened.
   * @default false
   */
  readonly dropText?: boolean;
}

/** One column's row. */
export interface SurveyRow {
  /** The column's name. */
  readonly column: string;
  /** Its missing cells, left out. */
  readonly missing: number;
  /** Its text cells, left out on request. */
  readonly textDropped: number;
  /** The analysis, when the column was screened. */
  readonly analysis?: Analysis;
  /** The primary test's p-value adjusted across the columns screened. */
  readonly adjustedP?: number;
  /** The suggested re-expression's formula, or `"none"`. */
  readonly suggestion?: string;
  /** Why the column was not screened. */
  readonly skipped?: string;
}

/** The survey as plain data. */
export interface SurveyResult {
  /** The table's source (file name, `"text"` or `"memory"`). */
  readonly source: string;
  /** How p-values were adjusted across the columns. */
  readonly adjust: Adjustment;
  /** One row per column: clear departures first, then by W; columns not screened last. */
  readonly rows: readonly SurveyRow[];
  /** Text columns, not screened (they can group: `.by(column)`). */
  readonly textColumns: readonly string[];
}

const _RANK = { "clear-departure": 0, "mild-departure": 1, "no-clear-departure": 2 } as const;

/**
 * Screen the numeric columns of a table (or those named): one analysis per
 * column with enough values, each with a suggested re-expression when it
 * departs, p-values adjusted across the columns, rows sorted by departure.
 *
 * @param t the table
 * @param options columns, adjustment, text-cell handling
 */
export function screenColumns(t: Table, options: SurveyOptions): SurveyResult {
  const adjust = checkAdjustment(options.adjust);
  const names = options.columns ? [...options.columns] : t.numericNames();
  const rows: SurveyRow[] = [];
  for (const name of names) {
    const info = t.info(name);
    const missing = info.provenance.missing;
    if (info.kind !== "numeric") {
      rows.push({ column: name, missing, textDropped: 0, skipped: `a ${info.kind} column` });
      continue;
    }
    let col;
    try {
      col = _numericColumnShared(t, name, { dropText: options.dropText ?? false });
      refuseCensored(col, name);
    } catch (e) {
      if (e instanceof PlumbError && (e.code === "non-numeric" || e.code === "censored")) {
        rows.push({ column: name, missing, textDropped: 0, skipped: `${e.message}` });
        continue;
      }
      throw e;
    }
    const v = col.values;
    if (v.length < ANALYSE_MIN_N) {
      rows.push({
        column: name,
        missing,
        textDropped: col.provenance.textDropped,
        skipped: `only ${v.length} values`,
      });
      continue;
    }
    try {
      const a = analyse(v, {
        label: name,
        column: name,
        missingDropped: col.provenance.missingDropped,
        textDropped: col.provenance.textDropped,
      }, { rowLabel: rowLabelOf(col, t.rowCount) });
      const suggestion = a.reading.verdict === "no-clear-departure"
        ? "none needed"
        : suggestReexpression(v);
      rows.push({
        column: name,
        missing,
        textDropped: col.provenance.textDropped,
        analysis: a,
        suggestion,
      });
    } catch (e) {
      if (e instanceof PlumbError && e.code === "constant") {
        rows.push({
          column: name,
          missing,
          textDropped: col.provenance.textDropped,
          skipped: "every value is the same",
        });
      } else if (e instanceof PlumbError) {
        // One column the methods cannot handle must not stop the survey of the rest.
        rows.push({
          column: name,
          missing,
          textDropped: col.provenance.textDropped,
          skipped: e.message,
        });
      } else throw e;
    }
  }
  const tested = rows.filter((r) => r.analysis);
  const adj = adjustPValues(tested.map((r) => r.analysis!.primary.pValue), adjust);
  tested.forEach((r, k) => ((r as { adjustedP?: number }).adjustedP = adj[k]));
  rows.sort((a, b) => {
    if (!a.analysis || !b.analysis) return (a.analysis ? 0 : 1) - (b.analysis ? 0 : 1);
    return _RANK[a.analysis.reading.verdict] - _RANK[b.analysis.reading.verdict] ||
      a.analysis.primary.statistic - b.analysis.primary.statistic;
  });
  return Object.freeze({
    source: t.source,
    adjust,
    rows: Object.freeze(rows.map((r) => Object.freeze(r))),
    textColumns: Object.freeze(t.textNames()),
  });
}
