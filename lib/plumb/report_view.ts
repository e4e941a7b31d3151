/**
 * `report(source)`: the HTML report of a table or of a set of chains, from a
 * notebook — the same report `deno task report` writes. It shows a short
 * summary (title, write-up) and saves the whole report with `.save(path)`.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { Plumb } from "./plumb.ts";
import { type Report, type ReportOptions, writeChainsReport, writeReport } from "./report.ts";
import { type PlumbSource, toTable } from "./source.ts";

/** A report made from a notebook: shown as a summary, saved whole. */
export interface ReportView extends Displayable {
  /** The report (computed on first need, once). */
  report(): Promise<Report>;
  /** The title and the write-up, as plain data (what `.json` files hold). */
  data(): Promise<{ title: string; sentences: readonly string[] }>;
  /**
   * Write the report to a file, by extension: `.html` (the whole report: a
   * static page, no scripts, charts inline), `.md` or `.txt` (title and
   * write-up), `.json` (the same as data).
   */
  save(path: string): Promise<SavedFile>;
}

function _summary(r: Report): MimeBundle {
  const how = 'The whole report (every card, group view and re-expression): .save("report.html").';
  return Object.freeze({
    "text/html": `<div style="max-width:860px;font-family:sans-serif"><p><strong>${
      escapeHtml(r.title)
    }</strong></p><ul>${
      r.sentences.map((t) => `<li style="margin:4px 0">${escapeHtml(t)}</li>`).join("")
    }</ul><p style="font-size:90%">${escapeHtml(how)}</p></div>`,
    "text/markdown": [
      `**${escapeMarkdown(r.title)}**`,
      r.sentences.map((t) => `- ${escapeMarkdown(t)}`).join("\n"),
      escapeMarkdown(how),
    ].join("\n\n"),
    "text/plain": plainText([r.title, ...r.sentences.map((t) => `• ${t}`), how].join("\n")),
  });
}

/**
 * The report of a table (its survey, then each numeric column: card,
 * re-expressions when it departs, write-up) or of a set of chains (each as
 * built, with its re-expressions). Text cells in a table's numeric columns
 * are left out and counted.
 *
 * @param source a table from `loadTable`, in-memory data, or one or several chains
 * @param options columns (tables only), a column to group by, title, note
 * @example
 * ```ts
 * import { plumb, report } from "@plumbline/plumbline";
 * const p = plumb([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1], "fill_ml");
 * const dir = await Deno.makeTempDir();
 * const saved = await report([p], { title: "Fill check" }).save(`${dir}/report.html`);
 * const html = await Deno.readTextFile(saved.path);
 * if (!html.includes("<title>Fill check</title>") || html.includes("<script")) throw new Error("report");
 * ```
 */
export function report(
  source: PlumbSource | Plumb | readonly Plumb[],
  options: ReportOptions = {},
): ReportView {
  let made: Promise<Report> | undefined;
  const chains = source instanceof Plumb
    ? [source]
    : Array.isArray(source) && source.length > 0 && source.every((x) => x instanceof Plumb)
    ? (source as readonly Plumb[])
    : undefined;
  const table: Table | undefined = chains ? undefined : toTable(source as PlumbSource);
  const get = () =>
    made ??= chains ? writeChainsReport(chains, options) : writeReport(table!, options);
  const data = async () => {
    const r = await get();
    return { title: r.title, sentences: r.sentences };
  };
  const view: ReportView = Object.freeze({
    report: get,
    data,
    [DISPLAY]: async () => _summary(await get()),
    save: async (path: string) => {
      const r = await get();
      const own = {
        [DISPLAY]: () => _summary(r),
        toJSON: () => ({ title: r.title, sentences: r.sentences }),
      };
      return saveDisplay(path, savable(own, r.title, { html: () => r.body }));
    },
  });
  return view;
}
