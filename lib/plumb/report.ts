/**
 * A self-contained HTML report of a table: the survey, a card per column
 * screened, the per-group view when asked, the ranked re-expressions of
 * every column that departs, and the write-up sentences; or the same for a
 * set of chains. Charts are inline pictures: no scripts, no external
 * requests, readable anywhere.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { DISPLAY, type MimeBundle } from "../results/display.ts";
import { escapeHtml } from "../render/escape.ts";
import { staticPage } from "../render/save.ts";
import { type Plumb, plumb } from "./plumb.ts";
import { survey } from "./survey.ts";
import { LIST_CAUTIONS } from "./sentence.ts";

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

/** A report: its HTML page and its write-up. */
export interface Report {
  /** The report's title. */
  readonly title: string;
  /** The HTML document: static, self-contained, no scripts. */
  readonly html: string;
  /** The document's body (what a saved page holds). */
  readonly body: string;
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
  const columns = options.columns ? [...options.columns] : table.numericNames();
  say(`surveying ${columns.length} columns`);
  const s = survey(table, { columns, dropText: true });
  const parts = [`<h2>Survey</h2>${await _html(s)}`];
  const rows = s.result().rows.filter((row) => row.analysis);
  const chains = rows.map((row) => plumb(table, row.column, { dropText: true }));
  const suggestions = rows.map((row) => row.suggestion);
  return await _assemble(`Normality report: ${table.source}`, parts, chains, options, suggestions);
}

/** A chain's sections: its card, by group when asked, and its re-expressions when it departs. */
async function _sections(
  p: Plumb,
  by: string | undefined,
  sentences: string[],
  suggestion?: string | null,
): Promise<string> {
  const name = escapeHtml(p.label);
  const parts = [`<h2>${name}</h2>${await _html(p)}`];
  if (by) parts.push(`<h3>${name} by ${escapeHtml(by)}</h3>${await _html(p.by(by))}`);
  const a = p.analysis();
  const c = a.censoring;
  if (c && a.reading.verdict !== "no-clear-departure") {
    // The ranked panel needs measured values; the survey's suggestion uses the censored λ.
    parts.push(
      `<h3>Re-expressions of ${name}</h3><p>${
        escapeHtml(
          `${c.left + c.right} values are censored, so the ranked panel (tests for measured ` +
            `values) is not shown; the ladder power nearest the censored Box–Cox λ is ` +
            `${suggestion ?? "none"}.`,
        )
      }</p>`,
    );
    if (suggestion === "ln(x)") {
      const logged = p.reexpress("log");
      parts.push(`<h3>${escapeHtml(logged.label)}</h3>${await _html(logged)}`);
      sentences.push(logged.sentence({ cautions: false }).text);
    }
  } else if (a.reading.verdict !== "no-clear-departure") {
    parts.push(`<h3>Re-expressions of ${name}</h3>${await _html(p.candidates())}`);
    const best = p.reexpress("best");
    if (best.steps.length > p.steps.length) {
      parts.push(`<h3>${escapeHtml(best.label)}</h3>${await _html(best)}`);
      sentences.push(best.sentence({ cautions: false }).text);
    }
  }
  sentences.push(p.sentence({ cautions: false }).text);
  return parts.join("\n");
}

async function _assemble(
  fallbackTitle: string,
  parts: string[],
  chains: readonly Plumb[],
  options: ReportOptions,
  suggestions: readonly (string | null | undefined)[] = [],
): Promise<Report> {
  const say = options.progress ?? (() => {});
  const title = options.title ?? fallbackTitle;
  const sentences: string[] = [];
  for (const [i, p] of chains.entries()) {
    say(`column ${p.label}`);
    parts.push(await _sections(p, options.by, sentences, suggestions[i]));
  }
  parts.push(
    `<h2>Write-up</h2>${
      [...sentences, LIST_CAUTIONS]
        .map((t) => `<p style="max-width:860px">${escapeHtml(t)}</p>`).join("\n")
    }`,
  );
  const body = `<h1>${escapeHtml(title)}</h1>
${options.note ? `<p><em>${escapeHtml(options.note)}</em></p>` : ""}
<p>${escapeHtml(REPORT_CAUTION)}</p>
${parts.join("\n")}`;
  return Object.freeze({
    title,
    html: staticPage(title, body),
    body,
    sentences: Object.freeze(sentences),
  });
}

const REPORT_CAUTION =
  "Made with plumbline. A normality check is one input to a decision (a reference range, a product release), which follows your organisation's own procedures and the applicable standards.";

/**
 * The report of a set of chains (each with its re-expressions as built): a
 * card per chain, by group when asked, and the ranked re-expressions of each
 * one that departs, then the write-up.
 *
 * @param chains the chains, e.g. `[plumb(t, "fill_ml"), plumb(t, "gap").reexpress("log")]`
 * @param options grouping, title, note, progress callback (`columns` does not apply)
 * @example
 * ```ts
 * import { plumb } from "@plumbline/plumbline";
 * import { writeChainsReport } from "./report.ts";
 * const r = await writeChainsReport([plumb([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3], "fill")]);
 * if (!r.html.includes("<h2>fill</h2>") || r.sentences.length !== 1) throw new Error("report");
 * ```
 */
export async function writeChainsReport(
  chains: readonly Plumb[],
  options: ReportOptions = {},
): Promise<Report> {
  const labels = chains.map((p) => p.label);
  return await _assemble(`Normality report: ${labels.join(", ")}`, [], chains, options);
}
