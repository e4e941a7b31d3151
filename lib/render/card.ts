/**
 * The card of one analysed variable: its label and counts, the reading, the
 * QQ plot and histogram side by side (as static SVG), the test table and the
 * cautions. HTML, Markdown and plain text from the same plain data.
 *
 * @module
 */
import type { Analysis } from "../results/analysis.ts";
import { type Verdict, VERDICT_WORDS } from "../results/reading.ts";
import { testsTable } from "./analysis_tables.ts";
import type { MimeBundle } from "../results/display.ts";
import { escapeHtml, escapeMarkdown, plainText } from "./escape.ts";
import { formatCentre, formatCount, formatNumber } from "../results/format.ts";
import { tableHtml, tableMarkdown, tableText } from "./table.ts";

/** Accent colour per verdict (Okabe–Ito); the verdict is always also written out. */
export const VERDICT_COLOUR: Readonly<Record<Verdict, string>> = Object.freeze({
  "no-clear-departure": "#0072B2",
  "mild-departure": "#E69F00",
  "clear-departure": "#D55E00",
});

/** The cautions every card carries. */
export const CARD_CAUTIONS: readonly string[] = Object.freeze([
  "A large p does not show normality; with few values it is weak evidence, with many values a small p can reflect a departure too small to matter.",
  "Before a t-test or ANOVA, judge the residuals' QQ plot rather than using a normality test as a gate.",
  "A normality check is one input to a decision (a reference range, a product release), which follows your organisation's own procedures and the applicable standards.",
]);

const _cap = (s: string) => s[0].toUpperCase() + s.slice(1);

/** The counts line: n used and what was left out. */
export function countsLine(a: Analysis): string {
  const parts = [`n = ${formatCount(a.n)} used`];
  if (a.origin.missingDropped > 0) {
    parts.push(`${formatCount(a.origin.missingDropped)} missing left out`);
  }
  if (a.origin.textDropped > 0) {
    parts.push(`${formatCount(a.origin.textDropped)} non-numeric left out`);
  }
  parts.push(
    `mean ${formatCentre(a.moments.mean, a.moments.sd, 5)}`,
    `sd ${formatNumber(a.moments.sd, 4)}`,
  );
  return parts.join(" · ");
}

/**
 * The card's bundle (`text/html`, `text/markdown`, `text/plain`).
 *
 * @param a the analysis
 * @param charts the QQ plot and histogram as HTML (static SVG), already rendered
 *
 * @example
 * ```ts
 * import { analyse } from "../plumb/analysis.ts";
 * import { cardBundle } from "./card.ts";
 * const x = new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 4.5]);
 * const b = cardBundle(analyse(x, { label: "fill <L>", column: "fill", missingDropped: 1, textDropped: 0 }), { qq: "", histogram: "" });
 * if (!b["text/html"]?.includes("fill &lt;L&gt;") || !b["text/plain"].startsWith("fill <L>")) throw new Error("card");
 * ```
 */
export function cardBundle(a: Analysis, charts: { qq: string; histogram: string }): MimeBundle {
  const r = a.reading;
  const colour = VERDICT_COLOUR[r.verdict];
  const tests = testsTable(a.tests, "Tests");
  const html = [
    `<div class="plumbline-card" style="font-family:sans-serif;max-width:920px;border:1px solid #bbb;` +
    `border-radius:6px;padding:10px 14px;background:#ffffff;color:#111111">`,
    `<div style="font-size:16px;font-weight:bold">${escapeHtml(a.origin.label)}</div>`,
    `<div style="color:#444;font-size:90%">${escapeHtml(countsLine(a))}</div>`,
    `<div style="margin:8px 0;padding:4px 10px;border-left:6px solid ${colour};background:#f6f6f6">` +
    `<strong>${escapeHtml(_cap(VERDICT_WORDS[r.verdict]))}</strong> — ${
      escapeHtml(r.headline)
    }</div>`,
    `<ul style="margin:4px 0 4px 18px;padding:0">${
      r.points.map((p) => `<li>${escapeHtml(p)}.</li>`).join("")
    }</ul>`,
    `<p style="margin:4px 0;font-style:italic">${escapeHtml(r.sizeNote)}.</p>`,
    `<div style="display:flex;flex-wrap:wrap;gap:10px;margin:8px 0">${charts.qq}${charts.histogram}</div>`,
    tableHtml(tests),
    `<div style="margin-top:6px;font-size:85%;color:#444">${
      CARD_CAUTIONS.map((c) => `<p style="margin:2px 0">${escapeHtml(c)}</p>`).join("")
    }</div>`,
    `</div>`,
  ].join("\n");
  const md = [
    `### ${escapeMarkdown(a.origin.label)}`,
    "",
    escapeMarkdown(countsLine(a)),
    "",
    `**${escapeMarkdown(_cap(VERDICT_WORDS[r.verdict]))}** — ${escapeMarkdown(r.headline)}`,
    "",
    ...r.points.map((p) => `- ${escapeMarkdown(p)}.`),
    "",
    `*${escapeMarkdown(r.sizeNote)}.*`,
    "",
    tableMarkdown(tests),
    "",
    ...CARD_CAUTIONS.map((c) => escapeMarkdown(c)),
  ].join("\n");
  const text = plainText([
    a.origin.label,
    countsLine(a),
    `${_cap(VERDICT_WORDS[r.verdict])}: ${r.headline}`,
    ...r.points.map((p) => `  - ${p}.`),
    `  ${r.sizeNote}.`,
    "",
    tableText(tests),
    "",
    ...CARD_CAUTIONS,
  ].join("\n"));
  return Object.freeze({ "text/html": html, "text/markdown": md, "text/plain": text });
}
