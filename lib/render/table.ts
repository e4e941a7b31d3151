/**
 * Tables as HTML, Markdown and plain text, from one plain model. Every
 * string is escaped for its target; a cell may carry trusted HTML made by
 * plumbline itself (a sparkline SVG) beside its text form.
 *
 * @module
 */
import { escapeHtml, escapeMarkdown, plainText } from "./escape.ts";

/** A cell: text, or text with an HTML form made by plumbline (never user input). */
export type TableCell = string | { readonly text: string; readonly html: string };

/** One column: its heading and alignment. */
export interface TableColumn {
  /** The heading. */
  readonly title: string;
  /**
   * Alignment: numbers right, words left.
   * @default "left"
   */
  readonly align?: "left" | "right";
}

/** A table to render. */
export interface TableModel {
  /** A caption shown above the table. */
  readonly caption?: string;
  /** The columns. */
  readonly columns: readonly TableColumn[];
  /** The rows, one cell per column. */
  readonly rows: readonly (readonly TableCell[])[];
  /** Notes shown under the table, one sentence each. */
  readonly notes?: readonly string[];
}

const _text = (c: TableCell) => (typeof c === "string" ? c : c.text);

/**
 * The table as an HTML fragment (a `<table>` with inline styles that read on
 * light and dark themes).
 *
 * @param t the table
 *
 * @example
 * ```ts
 * import { tableHtml } from "./table.ts";
 * const h = tableHtml({ columns: [{ title: "name" }], rows: [["<b>"]] });
 * if (!h.includes("<td style=\"text-align:left;padding:2px 8px\">&lt;b&gt;</td>")) throw new Error(h);
 * ```
 */
export function tableHtml(t: TableModel): string {
  const cell = (tag: string, c: TableCell, align: string) =>
    `<${tag} style="text-align:${align};padding:2px 8px${
      align === "right" ? ";white-space:nowrap" : ""
    }">${typeof c === "string" ? escapeHtml(c) : c.html}</${tag}>`;
  const head = t.columns.map((c) => cell("th", c.title, c.align ?? "left")).join("");
  const body = t.rows.map((r) =>
    `<tr>${r.map((c, i) => cell("td", c, t.columns[i]?.align ?? "left")).join("")}</tr>`
  ).join("\n");
  const caption = t.caption
    ? `<caption style="text-align:left;font-weight:bold;padding:4px 0">${
      escapeHtml(t.caption)
    }</caption>`
    : "";
  const notes = (t.notes ?? []).map((n) =>
    `<p style="margin:2px 0;font-size:90%">${escapeHtml(n)}</p>`
  )
    .join("\n");
  return `<table style="border-collapse:collapse;font-variant-numeric:tabular-nums">${caption}` +
    `<thead><tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table>${
      notes ? "\n" + notes : ""
    }`;
}

/**
 * The table as GitHub-flavoured Markdown.
 *
 * @param t the table
 *
 * @example
 * ```ts
 * import { tableMarkdown } from "./table.ts";
 * const m = tableMarkdown({ columns: [{ title: "a" }, { title: "n", align: "right" }], rows: [["x|y", "3"]] });
 * if (m !== "| a | n |\n| :--- | ---: |\n| x\\|y | 3 |") throw new Error(m);
 * ```
 */
export function tableMarkdown(t: TableModel): string {
  const line = (cells: readonly string[]) => `| ${cells.join(" | ")} |`;
  const out: string[] = [];
  if (t.caption) out.push(`**${escapeMarkdown(t.caption)}**`, "");
  out.push(line(t.columns.map((c) => escapeMarkdown(c.title))));
  out.push(line(t.columns.map((c) => (c.align === "right" ? "---:" : ":---"))));
  for (const r of t.rows) out.push(line(r.map((c) => escapeMarkdown(_text(c)))));
  if (t.notes?.length) {
    out.push("");
    for (const n of t.notes) out.push(escapeMarkdown(n));
  }
  return out.join("\n");
}

/**
 * The table as aligned plain text (no ANSI codes).
 *
 * @param t the table
 *
 * @example
 * ```ts
 * import { tableText } from "./table.ts";
 * const s = tableText({ columns: [{ title: "a" }, { title: "n", align: "right" }], rows: [["xy", "3"]] });
 * if (s !== "a   n\n--  -\nxy  3") throw new Error(JSON.stringify(s));
 * ```
 */
export function tableText(t: TableModel): string {
  const rows = [
    t.columns.map((c) => plainText(c.title)),
    ...t.rows.map((r) => r.map((c) => plainText(_text(c)))),
  ];
  // A loop, not Math.max(...rows): a spread of 130,000 rows overflows the call stack.
  const widths = t.columns.map((_, i) => {
    let w = 0;
    for (const r of rows) w = Math.max(w, [...(r[i] ?? "")].length);
    return w;
  });
  const pad = (s: string, i: number) => {
    const gap = " ".repeat(widths[i] - [...s].length);
    return t.columns[i].align === "right" ? gap + s : s + gap;
  };
  const fmt = (r: string[]) => r.map(pad).join("  ").trimEnd();
  const out: string[] = [];
  if (t.caption) out.push(plainText(t.caption));
  out.push(fmt(rows[0]), widths.map((w) => "-".repeat(w)).join("  "));
  for (const r of rows.slice(1)) out.push(fmt(r));
  for (const n of t.notes ?? []) out.push(plainText(n));
  return out.join("\n");
}
