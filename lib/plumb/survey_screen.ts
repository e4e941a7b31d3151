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
import { optionNames } from "../results/options.ts";
import { type Adjustment, adjustPValues, checkAdjustment } from "../stats/multiplicity.ts";
import { ANALYSE_MIN_N } from "./analysis.ts";
import { analyseSides } from "./censored_analysis.ts";
import { suggestCensoredReexpression } from "./censored_suggest.ts";
import { identifierColumns, identifierOmission } from "./identifiers.ts";
import { suggestReexpression } from "./reexpress_view.ts";
import { rowLabelOf } from "./_loaded.ts";
import { pickColumn } from "./source.ts";

/** Options for {@linkcode survey}. */
export interface SurveyOptions {
  /**
   * The columns to screen (one name may be given as a string). A name given
   * twice is screened once (`repeated` in the result says so).
   * @default every numeric column
   */
  readonly columns?: readonly string[] | string;
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
  /**
   * Screen columns that look like row identifiers too (a row number, a
   * 1..n sequence, the unnamed first column an export writes). Columns named
   * in `columns` are always screened.
   * @default false (left out, listed in `omitted` with the reason)
   */
  readonly identifiers?: boolean;
}

/** A column of the table left out of the survey, and why. */
export interface SurveyOmission {
  /** The column's name. */
  readonly column: string;
  /** Why it was left out, in words, with how to include it when that is possible. */
  readonly reason: string;
}

/** Every option name of {@linkcode SurveyOptions}. */
export const SURVEY_OPTION_NAMES: readonly string[] = optionNames<SurveyOptions>({
  columns: true,
  adjust: true,
  dropText: true,
  identifiers: true,
});

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
  /** Names given more than once in `columns`, each screened once. */
  readonly repeated: readonly string[];
  /** Columns left out before screening: identifiers and columns with no value at all. */
  readonly omitted: readonly SurveyOmission[];
}

/**
 * The columns a survey screens: every numeric column, or those named (a
 * string is one name), each once, checked against the table.
 *
 * @param t the table
 * @param columns the `columns` option
 * @returns the names in order of first mention, and those given more than once
 * @throws {PlumbError} `"bad-option"` for a list that is not of names,
 *   `"unknown-column"` for a name the table does not have
 */
export function surveyColumns(
  t: Table,
  columns: SurveyOptions["columns"],
): { readonly names: readonly string[]; readonly repeated: readonly string[] } {
  if (columns === undefined) return { names: t.numericNames(), repeated: [] };
  const given: unknown = typeof columns === "string" ? [columns] : columns;
  if (!Array.isArray(given) || given.some((c) => typeof c !== "string")) {
    throw new PlumbError(
      "bad-option",
      `Cannot read the columns option of survey: give column names, as in { columns: ["fill_ml", "torque_nm"] }`,
    );
  }
  const names: string[] = [];
  const repeated: string[] = [];
  for (const c of given as string[]) {
    pickColumn(t, c);
    if (!names.includes(c)) names.push(c);
    else if (!repeated.includes(c)) repeated.push(c);
  }
  return { names, repeated };
}

const _RANK = { "clear-departure": 0, "mild-departure": 1, "no-clear-departure": 2 } as const;

/**
 * Screen the numeric columns of a table (or those named): one analysis per
 * column with enough values, each with a suggested re-expression when it
 * departs, p-values adjusted across the columns, rows sorted by departure.
 *
 * @param t the table
 * @param options columns, adjustment, text-cell handling, identifiers
 */
export function screenColumns(t: Table, options: SurveyOptions): SurveyResult {
  const adjust = checkAdjustment(options.adjust);
  const chosen = surveyColumns(t, options.columns);
  const { repeated } = chosen;
  let names = chosen.names;
  const omitted: SurveyOmission[] = [];
  if (options.columns === undefined) {
    for (const c of t.columns) {
      if (c.kind === "empty") omitted.push({ column: c.name, reason: "every cell is empty" });
    }
    if (!options.identifiers) {
      const ids = identifierColumns(t, names);
      for (const id of ids) omitted.push(identifierOmission(id));
      const left = new Set(ids.map((c) => c.name));
      names = names.filter((n) => !left.has(n));
    }
  }
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
    } catch (e) {
      if (e instanceof PlumbError && e.code === "non-numeric") {
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
      const origin = {
        label: name,
        column: name,
        missingDropped: col.provenance.missingDropped,
        textDropped: col.provenance.textDropped,
      };
      const a = analyseSides(v, col.censor ?? null, origin, {
        rowLabel: rowLabelOf(col, t.rowCount),
      });
      const suggestion = a.reading.verdict === "no-clear-departure"
        ? "none needed"
        : col.censor
        ? suggestCensoredReexpression(v, col.censor)
        : a.reading.facts.reexpressionHelps
        ? suggestReexpression(v)
        : `none: the departure comes from ${a.reading.reason}`;
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
  return surveyResult(t.source, adjust, rows, t.textNames(), repeated, omitted);
}

/**
 * Finish a survey from its rows: p-values adjusted across the columns
 * screened, rows sorted by departure (clear first, then by W; columns not
 * screened last), everything frozen. Shared by every kind of source.
 *
 * @param source the source in words
 * @param adjust the adjustment across the columns
 * @param rows one row per column, screened or skipped
 * @param textColumns text columns, not screened
 * @param repeated column names asked for more than once (screened once)
 * @param omitted columns left out before screening, with the reason
 */
export function surveyResult(
  source: string,
  adjust: Adjustment,
  rows: SurveyRow[],
  textColumns: readonly string[],
  repeated: readonly string[],
  omitted: readonly SurveyOmission[] = [],
): SurveyResult {
  const tested = rows.filter((r) => r.analysis);
  const adj = adjustPValues(tested.map((r) => r.analysis!.primary.pValue), adjust);
  tested.forEach((r, k) => ((r as { adjustedP?: number }).adjustedP = adj[k]));
  rows.sort((a, b) => {
    if (!a.analysis || !b.analysis) return (a.analysis ? 0 : 1) - (b.analysis ? 0 : 1);
    return _RANK[a.analysis.reading.verdict] - _RANK[b.analysis.reading.verdict] ||
      a.analysis.primary.statistic - b.analysis.primary.statistic;
  });
  return Object.freeze({
    source,
    adjust,
    rows: Object.freeze(rows.map((r) => Object.freeze(r))),
    textColumns: Object.freeze([...textColumns]),
    repeated: Object.freeze([...repeated]),
    omitted: Object.freeze(omitted.map((o) => Object.freeze(o))),
  });
}
