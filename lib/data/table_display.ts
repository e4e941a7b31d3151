/**
 * The display of a loaded table: one row per column with its kind and the
 * counts of numbers, censored, missing and text cells, the limits of the
 * censored cells, and the first text cells by row, so that mistyped entries
 * are seen before any analysis.
 *
 * @module
 */
import type { ColumnProvenance, TableSummary } from "./table.ts";
import type { MimeBundle } from "../results/display.ts";
import { plainText } from "../render/escape.ts";
import { formatCount } from "../results/format.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";

/** The table model of a loaded table's columns. */
export function tableSummaryModel(t: TableSummary): TableModel {
  const rows = t.columns.map((c) => {
    const p = c.provenance;
    const cells = p.nonNumericCells.slice(0, 3).map((n) =>
      `row ${n.row}${n.line ? ` (line ${n.line})` : ""}: ${JSON.stringify(n.text)}`
    );
    const more = p.nonNumeric > cells.length
      ? ` and ${formatCount(p.nonNumeric - cells.length)} more`
      : "";
    const text = c.kind === "numeric" && p.nonNumeric > 0
      ? `text in a numeric column: ${cells.join("; ")}${more}`
      : (c as { hint?: string | null }).hint ?? "";
    const censored = p.censoredLeft + p.censoredRight;
    const note = [censored > 0 ? _limitsNote(p) : "", text].filter((x) => x !== "").join("; ");
    return [
      c.name,
      c.kind,
      formatCount(p.numbers),
      formatCount(censored),
      formatCount(p.missing),
      formatCount(p.nonNumeric),
      note,
    ];
  });
  const notes: string[] = [];
  for (const r of t.renamed) {
    notes.push(
      `Column ${r.index + 1} renamed from ${JSON.stringify(r.from)} to ${
        JSON.stringify(r.to)
      } (${r.reason} name).`,
    );
  }
  return {
    caption: `${t.source}: ${formatCount(t.rowCount)} rows, ${t.columns.length} columns` +
      (t.delimiter
        ? ` (delimiter ${JSON.stringify(t.delimiter)}, decimal ${JSON.stringify(t.decimal)})`
        : ""),
    columns: [
      { title: "column" },
      { title: "kind" },
      { title: "numbers", align: "right" },
      { title: "censored", align: "right" },
      { title: "missing", align: "right" },
      { title: "text", align: "right" },
      { title: "note" },
    ],
    rows,
    notes,
  };
}

/** The censored cells by side and limit: `censored below 0.5 (50), 0.2 (2); above 1000 (1)`. */
function _limitsNote(p: ColumnProvenance): string {
  const side = (which: "below" | "above", total: number) => {
    if (total === 0) return "";
    const listed = p.censoredLimits.filter((l) => l.side === which);
    const shown = listed.map((l) => `${l.limit} (${formatCount(l.count)})`).join(", ");
    const rest = total - listed.reduce((k, l) => k + l.count, 0);
    return `${which} ${shown}${rest > 0 ? ` and ${formatCount(rest)} at other limits` : ""}`;
  };
  const parts = [side("below", p.censoredLeft), side("above", p.censoredRight)];
  return `censored ${parts.filter((x) => x !== "").join("; ")}`;
}

/**
 * The bundle of a loaded table.
 *
 * @param t the table's summary (`table.toJSON()`)
 *
 * @example
 * ```ts
 * import { tableSummaryBundle } from "./table_display.ts";
 * const b = tableSummaryBundle({ source: "text", rowCount: 1, delimiter: ",", decimal: ".", renamed: [], columns: [] });
 * if (!b["text/plain"].startsWith("text: 1 rows, 0 columns")) throw new Error(b["text/plain"]);
 * ```
 */
export function tableSummaryBundle(t: TableSummary): MimeBundle {
  const m = tableSummaryModel(t);
  return Object.freeze({
    "text/html": `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px">${
      tableHtml(m)
    }</div>`,
    "text/markdown": tableMarkdown(m),
    "text/plain": plainText(tableText(m)),
  });
}
