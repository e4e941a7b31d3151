/**
 * `survey(table)`: every numeric column screened at once, one row each,
 * with multiplicity-adjusted p-values, sorted by departure.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { isQuerySource, QUERY_SOURCE, type QuerySource } from "../results/query_source.ts";
import { formatCount, formatP } from "../results/format.ts";
import { bundleBytes, leftOutNote, OUTPUT_BUDGET, pickRows } from "../render/budget.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import { qqSparkline } from "../render/sparkline.ts";
import { tableMarkdown, type TableModel } from "../render/table.ts";
import { ADJUSTMENT_NAMES, checkAdjustment } from "../stats/multiplicity.ts";
import { VERDICT_SHORT } from "../results/reading.ts";
import { _csv } from "./_csv.ts";
import {
  blanks,
  censoredNote,
  subsampleNote,
  SUMMARY_COLUMNS,
  SUMMARY_HEAD,
  summaryCells,
  summaryValues,
  tableBundle,
} from "./_rows.ts";
import {
  screenColumns,
  SURVEY_OPTION_NAMES,
  surveyColumns,
  type SurveyOptions,
  type SurveyResult,
} from "./survey_screen.ts";
import { checkOptions } from "../results/options.ts";
import { QuerySurvey } from "./query_survey.ts";
import { type PlumbSource, toTable } from "./source.ts";

/**
 * A survey of a table's numeric columns. Create it with {@linkcode survey}.
 *
 * @example
 * ```ts
 * import { survey } from "@plumbline/plumbline";
 * const s = survey({ a: [1, 2, 3, 4, 5, 6, 7, 8], b: [1, 1, 2, 3, 5, 8, 13, 21] });
 * if (!s.toCSV().startsWith("column,n,missing")) throw new Error("csv");
 * ```
 */
export class Survey implements Displayable {
  readonly #table: Table | undefined;
  readonly #options: SurveyOptions;
  #result: SurveyResult | undefined;
  #bundle: MimeBundle | undefined;

  /**
   * @internal Use {@linkcode survey}.
   * @param table the table to screen, or a survey already screened elsewhere (a query source)
   */
  constructor(table: Table | SurveyResult, options: SurveyOptions) {
    checkAdjustment(options.adjust);
    if ("rows" in table && "adjust" in table) {
      this.#result = table;
    } else {
      surveyColumns(table, options.columns);
      this.#table = table;
    }
    this.#options = options;
    Object.freeze(this);
  }

  /** The survey as plain data (computed once). */
  result(): SurveyResult {
    this.#result ??= screenColumns(this.#table!, this.#options);
    return this.#result;
  }

  /** The table model, every column (also used for Markdown export). */
  table(): TableModel {
    return this.#model(this.result().rows);
  }

  #model(shown: SurveyResult["rows"], leftOut?: string): TableModel {
    const r = this.result();
    const rows = shown.map((row) => {
      const a = row.analysis;
      if (!a) {
        return [
          row.column,
          "",
          formatCount(row.missing),
          ...blanks(7),
          `not screened: ${row.skipped}`,
          "",
          "",
        ];
      }
      return [
        row.column,
        formatCount(a.n),
        formatCount(row.missing) + (row.textDropped ? ` + ${row.textDropped} text` : ""),
        ...summaryCells(a),
        formatP(row.adjustedP!),
        VERDICT_SHORT[a.reading.verdict],
        row.suggestion ?? "",
        { text: "", html: qqSparkline(a.qq, { title: `QQ sparkline of ${row.column}` }) },
      ];
    });
    const screened = r.rows.filter((x) => x.analysis).length;
    const notes = [
      ...(leftOut ? [leftOut] : []),
      `Sorted by departure (clear first, then by W). p: Shapiro–Wilk; adjusted p: ${
        ADJUSTMENT_NAMES[r.adjust]
      } across ${screened} column${screened === 1 ? "" : "s"}.`,
    ];
    const analyses = r.rows.flatMap((x) => (x.analysis ? [x.analysis] : []));
    const sub = subsampleNote(analyses);
    if (sub) notes.push(sub);
    const censored = censoredNote(analyses);
    if (censored) notes.push(censored);
    if (r.repeated.length) {
      notes.push(
        `Named more than once in columns, screened once: ${r.repeated.join(", ")}.`,
      );
    }
    if (r.omitted.length) {
      for (const o of r.omitted) notes.push(`Left out, ${o.column}: ${o.reason}.`);
    }
    if (r.textColumns.length) {
      notes.push(
        `Text columns, not screened (use them to group with .by()): ${r.textColumns.join(", ")}.`,
      );
    }
    return {
      caption: `Survey of ${r.source}`,
      columns: [
        { title: "column" },
        { title: "n", align: "right" },
        { title: "missing", align: "right" },
        ...SUMMARY_COLUMNS,
        { title: `adj. p`, align: "right" },
        { title: "reading" },
        { title: "suggested re-expression of x" },
        { title: "QQ" },
      ],
      rows,
      notes,
    };
  }

  /** CSV with unrounded numbers. */
  toCSV(): string {
    const r = this.result();
    const head = [
      "column",
      "n",
      "missing",
      "text_dropped",
      ...SUMMARY_HEAD,
      "adjusted_p",
      "adjustment",
      "verdict",
      "suggestion",
      "note",
    ];
    const lines = r.rows.map((row) => {
      const a = row.analysis;
      const start = [row.column, a ? a.n : "", row.missing, row.textDropped];
      return a
        ? [
          ...start,
          ...summaryValues(a),
          row.adjustedP,
          r.adjust,
          a.reading.verdict,
          row.suggestion,
          "",
        ]
        : [...start, ...blanks(7), r.adjust, "", "", row.skipped];
    });
    for (const o of r.omitted) {
      lines.push([o.column, "", "", "", ...blanks(7), r.adjust, "", "", `left out: ${o.reason}`]);
    }
    return _csv(head, lines);
  }

  /** Markdown table. */
  toMarkdown(): string {
    return tableMarkdown(this.table());
  }

  /** Plain data. */
  toJSON(): SurveyResult {
    return this.result();
  }

  /**
   * Write the survey to a file, by extension: `.html` (static page), `.md`,
   * `.txt`, `.csv` (every column) or `.json` (plain data).
   */
  save(path: string): Promise<SavedFile> {
    return saveDisplay(
      path,
      savable(this, `the survey of ${this.result().source}`, {
        hint: "for a column's charts, save plumb(table, column).qq() or the column's card",
      }),
    );
  }

  /**
   * The table, with a sparkline per row: at most 60 columns, the first by
   * departure, and a note on the rest (every column is in the exports).
   */
  [DISPLAY](): MimeBundle {
    if (this.#bundle) return this.#bundle;
    const r = this.result();
    for (let max = MAX_SURVEY_ROWS;; max = Math.floor(max / 2)) {
      const pick = pickRows(r.rows, { max, score: (_, i) => -i });
      const note = pick.left.length === 0 ? undefined : leftOutNote({
        noun: "column",
        total: r.rows.length,
        chosen: "the clearest departures first, as sorted",
        names: pick.left.map((x) => x.column),
        where: `.toCSV(), .save("survey.csv") and .toJSON()`,
      });
      const b = tableBundle(this.#model(pick.shown, note));
      if (bundleBytes(b) <= OUTPUT_BUDGET || max <= 1) return (this.#bundle = b);
    }
  }
}

/** The most columns a survey's display shows (the rest are in the exports). */
const MAX_SURVEY_ROWS = 60;

/**
 * Screen every numeric column of a table (or those named).
 *
 * A query source (`scan(pathOrSql)`) gives a {@linkcode QuerySurvey}: the
 * same survey computed by the engine, read with `await`.
 *
 * @param source a table from `loadTable`, in-memory data, or a query source from `scan`
 * @param options columns, adjustment, text-cell handling
 *
 * @example
 * ```ts
 * import { survey } from "@plumbline/plumbline";
 * const s = survey({ run: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], b: [1, 1, 2, 3, 5, 8, 13, 21, 34, 55] });
 * // run counts rows: left out, with the reason
 * if (s.result().rows.length !== 1 || s.result().omitted[0].column !== "run") throw new Error("rows");
 * ```
 */
export function survey(source: QuerySource, options?: SurveyOptions | null): QuerySurvey;
/** The survey of in-memory data (a table, rows, columns, a data frame). */
export function survey(source: PlumbSource, options?: SurveyOptions | null): Survey;
export function survey(
  source: PlumbSource | QuerySource,
  options: SurveyOptions | null = {},
): Survey | QuerySurvey {
  options = checkOptions(options, SURVEY_OPTION_NAMES, "survey");
  if (isQuerySource(source)) return new QuerySurvey(source[QUERY_SOURCE], options);
  return new Survey(toTable(source), options);
}
