/**
 * A self-contained HTML report of a table: the survey, a card per column
 * screened, the per-group view when asked, the ranked re-expressions of
 * every column that departs, and the write-up sentences. Static SVG only:
 * no scripts, no external requests, readable anywhere.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { DISPLAY, type MimeBundle } from "../results/display.ts";
import { escapeHtml } from "../render/escape.ts";
import { plumb } from "./plumb.ts";
import { survey } from "./survey.ts";

/** Options for {@linkcode writeReport}. */
export interface ReportOptions {
  /**
   * Columns to report on.
   * @default every numeric column
   */
  readonly columns?: readonly string[];
  /**
   * A text column to split each variable by.
   * @default undefined (no split)
   */
  readonly by?: string;
  /**
   * A title for the report.
   * @default "Normality report: <source>"
   */
  readonly title?: string;
  /**
   * A line of context shown under the title (e.g. "The data are invented").
   * @default undefined
   */
  readonly note?: string;
  /**
   * Called with a short message before each section, for progress lines.
   * @default undefined
   */
  readonly progress?: (message: string) => void;
}

/** The report's sentences, for a terminal summary. */
export interface Report {
  /** The HTML document. */
  readonly html: string;
  /** One write-up sentence per column screened. */
  readonly sentences: readonly string[];
}

const _html = async (d: { [DISPLAY](): MimeBundle | Promise<MimeBundle> }) =>
  (await d[DISPLAY]())["text/html"] ?? "";

/**
 * Build the report. Text cells in numeric columns are left out and counted
 * (the counts show in every section), since a report must not stop on one
 * stray cell.
 *
 * @param table the table
 * @param options columns, grouping, title, progress callback
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * import { writeReport } from "./report.ts";
 * const t = await loadTable("v\n" + Array.from({ length: 20 }, (_, i) => String(Math.exp(i / 5))).join("\n"));
 * const r = await writeReport(t);
 * if (!r.html.startsWith("<!DOCTYPE html>") || r.html.includes("<script")) throw new Error("report");
 * ```
 */
export async function writeReport(table: Table, options: ReportOptions = {}): Promise<Report> {
  const say = options.progress ?? (() => {});
  const title = options.title ?? `Normality report: ${table.source}`;
  const columns = options.columns ? [...options.columns] : table.numericNames();
  const parts: string[] = [];
  const sentences: string[] = [];
  say(`surveying ${columns.length} columns`);
  const s = survey(table, { columns, dropText: true });
  parts.push(`<h2>Survey</h2>${await _html(s)}`);
  for (const row of s.result().rows) {
    if (!row.analysis) continue;
    const col = row.column;
    say(`column ${col}`);
    const p = plumb(table, col, { dropText: true });
    parts.push(`<h2>${escapeHtml(col)}</h2>${await _html(p)}`);
    if (options.by) {
      parts.push(
        `<h3>${escapeHtml(col)} by ${escapeHtml(options.by)}</h3>${await _html(p.by(options.by))}`,
      );
    }
    const c = row.analysis.censoring;
    if (c && row.analysis.reading.verdict !== "no-clear-departure") {
      // The ranked panel needs measured values; the survey's suggestion uses the censored λ.
      parts.push(
        `<h3>Re-expressions of ${escapeHtml(col)}</h3><p>${
          escapeHtml(
            `${c.left + c.right} values are censored, so the ranked panel (tests for measured ` +
              `values) is not shown; the ladder power nearest the censored Box–Cox λ is ` +
              `${row.suggestion ?? "none"}.`,
          )
        }</p>`,
      );
      if (row.suggestion === "ln(x)") {
        const logged = p.reexpress("log");
        parts.push(`<h3>${escapeHtml(logged.label)}</h3>${await _html(logged)}`);
        sentences.push(logged.sentence().text);
      }
    } else if (row.analysis.reading.verdict !== "no-clear-departure") {
      parts.push(`<h3>Re-expressions of ${escapeHtml(col)}</h3>${await _html(p.candidates())}`);
      const best = p.reexpress("best");
      if (best.steps.length > 0) {
        parts.push(`<h3>${escapeHtml(best.label)}</h3>${await _html(best)}`);
        sentences.push(best.sentence().text);
      }
    }
    sentences.push(p.sentence().text);
  }
  parts.push(
    `<h2>Write-up</h2>${
      sentences.map((t) => `<p style="max-width:860px">${escapeHtml(t)}</p>`).join("\n")
    }`,
  );
  const html = `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>body{font-family:sans-serif;background:#ffffff;color:#111111;margin:24px;max-width:1400px}h2{border-bottom:1px solid #ccc;padding-bottom:4px;margin-top:32px}</style>
</head><body>
<h1>${escapeHtml(title)}</h1>
${options.note ? `<p><em>${escapeHtml(options.note)}</em></p>` : ""}
<p>Made with plumbline. A normality check is one input to a decision (a reference range, a product release), which follows your organisation's own procedures and the applicable standards.</p>
${parts.join("\n")}
</body></html>
`;
  return Object.freeze({ html, sentences: Object.freeze(sentences) });
}
