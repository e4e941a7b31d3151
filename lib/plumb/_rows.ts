/**
 * The columns that every one-row-per-sample table shares (survey rows and
 * group rows): mean, sd, G1, G2, W and p, formatted for display or raw for
 * CSV, and the display bundle of such a table.
 *
 * @module
 */
import type { MimeBundle } from "../results/display.ts";
import { plainText } from "../render/escape.ts";
import { formatNumber, formatP } from "../results/format.ts";
import {
  type TableColumn,
  tableHtml,
  tableMarkdown,
  type TableModel,
  tableText,
} from "../render/table.ts";
import type { Analysis } from "../results/analysis.ts";

/** Headings of the shared columns, for display. */
export const SUMMARY_COLUMNS: readonly TableColumn[] = Object.freeze(
  ["mean", "sd", "G1", "G2", "W", "p"].map((title) => ({ title, align: "right" as const })),
);

/** Headings of the shared columns, for CSV. */
export const SUMMARY_HEAD: readonly string[] = Object.freeze(["mean", "sd", "G1", "G2", "W", "p"]);

/** The shared cells, formatted. */
export function summaryCells(a: Analysis): string[] {
  const { mean, sd } = a.censoring ?? a.moments;
  return [
    formatNumber(mean, 5),
    formatNumber(sd, 4),
    formatNumber(a.moments.G1, 3),
    formatNumber(a.moments.G2, 3),
    formatNumber(a.primary.statistic, 4),
    formatP(a.primary.pValue),
  ];
}

/** The shared values, unrounded (CSV). */
export function summaryValues(a: Analysis): number[] {
  const { mean, sd } = a.censoring ?? a.moments;
  return [
    mean,
    sd,
    a.moments.G1,
    a.moments.G2,
    a.primary.statistic,
    a.primary.pValue,
  ];
}

/**
 * The table note for rows whose W and p come from a seeded subsample (the n
 * column shows every value used), or `undefined` when no row was subsampled.
 */
export function subsampleNote(analyses: readonly Analysis[]): string | undefined {
  const sub = analyses.filter((a) => a.subsample !== null);
  if (sub.length === 0) return undefined;
  const size = sub[0].subsample!.size;
  return `W and p of ${sub.length === 1 ? "the row" : `the ${sub.length} rows`} with more than ` +
    `${size} values come from a seeded random subsample of ${size} (the limit of Royston's ` +
    `calibration); n and the other columns use every value.`;
}

/**
 * The table note for rows with censored values (their mean and sd, W′ and p
 * come from the censored methods), or `undefined` when no row has any.
 */
export function censoredNote(analyses: readonly Analysis[]): string | undefined {
  const rows = analyses.filter((a) => a.censoring);
  if (rows.length === 0) return undefined;
  const names = rows.map((a) => a.origin.group ?? a.origin.column);
  const shown = names.length <= 6 ? names.join(", ") : `${names.slice(0, 5).join(", ")} and others`;
  return `Rows with censored values (${shown}): n counts them; mean and sd by maximum likelihood ` +
    `under censoring; W′ and p from the Shapiro–Francia test for censored samples.`;
}

/** `k` empty cells. */
export function blanks(k: number): string[] {
  return new Array<string>(k).fill("");
}

/** The bundle of a table, with optional HTML after it (charts, cards). */
export function tableBundle(
  model: TableModel,
  after: { html?: string; markdown?: string; text?: string } = {},
): MimeBundle {
  return Object.freeze({
    "text/html":
      `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px;overflow-x:auto">` +
      `${tableHtml(model)}${after.html ?? ""}</div>`,
    "text/markdown": tableMarkdown(model) + (after.markdown ? `\n\n${after.markdown}` : ""),
    "text/plain": plainText(tableText(model) + (after.text ? `\n\n${after.text}` : "")),
  });
}
