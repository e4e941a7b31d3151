/**
 * Every normality test of one analysis as a displayable table, with CSV,
 * Markdown and plain-data export.
 *
 * @module
 */
import { testsTable } from "../render/analysis_tables.ts";
import { plainText } from "../render/escape.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import type { Analysis, TestOutcome } from "../results/analysis.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import { _csv } from "./_csv.ts";

/** The tests of one analysis: displayable (HTML, Markdown, text) and exportable. */
export interface TestsTable extends Displayable {
  /** Every test's outcome, run or skipped, in display order. */
  toJSON(): readonly TestOutcome[];
  /** The table as Markdown. */
  toMarkdown(): string;
  /** The table as CSV: test, statistic, value, p, method (numbers unrounded). */
  toCSV(): string;
  /** The bundle shown in a notebook. */
  [DISPLAY](): MimeBundle;
  /** Write the table to a file: `.csv`, `.md`, `.html`, `.txt` or `.json`, by extension. */
  save(path: string): Promise<SavedFile>;
}

/**
 * The tests table of an analysis, computed on first read or display and
 * kept.
 *
 * @param analysis the analysis, on first need
 * @example
 * ```ts
 * import { testsView } from "./tests_view.ts";
 * import { analyse } from "./analysis.ts";
 * const x = new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 4.5]);
 * const t = testsView(() => analyse(x, { label: "fill", column: "fill", missingDropped: 0, textDropped: 0 }));
 * if (!t.toCSV().startsWith("test,statistic,value,p,method\nShapiro–Wilk,W,")) throw new Error(t.toCSV());
 * ```
 */
export function testsView(analysis: () => Analysis): TestsTable {
  let model: TableModel | undefined;
  let bundle: MimeBundle | undefined;
  const table = () => {
    const a = analysis();
    return (model ??= testsTable(a.tests, `Normality tests — ${a.origin.label} (n = ${a.n})`));
  };
  const view: TestsTable = Object.freeze({
    save: (path: string) =>
      saveDisplay(path, savable(view, `the normality tests of ${analysis().origin.label}`)),
    [DISPLAY]: () => (bundle ??= Object.freeze({
      "text/html": tableHtml(table()),
      "text/markdown": tableMarkdown(table()),
      "text/plain": plainText(tableText(table())),
    })),
    toJSON: () => analysis().tests,
    toMarkdown: () => tableMarkdown(table()),
    toCSV: () =>
      _csv(
        ["test", "statistic", "value", "p", "method"],
        analysis().tests.map((t) =>
          t.result
            ? [t.test, t.result.statisticName, t.result.statistic, t.result.pValue, t.result.method]
            : [t.test, "", "", "", t.skipped ?? ""]
        ),
      ),
  });
  return view;
}
