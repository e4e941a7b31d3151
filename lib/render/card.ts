/**
 * The card of one analysed variable, arranged around what plumbline adds:
 * the reading first (verdict, what the departure comes from, what to do),
 * then the QQ plot with its envelope, marked exits and both σ lines beside
 * the evidence grouped by what each measure looks at, then the rest of the
 * reading, a histogram strip and the cautions. HTML, Markdown and plain text
 * from the same plain data; the full test table stays one call away
 * (`.tests()`).
 *
 * @module
 */
import type { Analysis } from "../results/analysis.ts";
import { type Verdict, VERDICT_WORDS } from "../results/reading.ts";
import type { MimeBundle } from "../results/display.ts";
import { chartBundle } from "./chart_bundle.ts";
import { escapeHtml, escapeMarkdown, plainText } from "./escape.ts";
import { formatCentre, formatCompact, formatCount, formatNumber } from "../results/format.ts";
import { evidenceLedger, ledgerHtml, ledgerLines } from "./evidence_ledger.ts";
import { histogramSpec } from "./histogram_spec.ts";
import { qqSpec } from "./qq_spec.ts";
import { sequenceSpec } from "./sequence_spec.ts";

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
  const c = a.censoring;
  if (c) {
    parts.push(
      `${formatCount(c.left + c.right)} censored (${
        c.limits.slice(0, 3).map((l) =>
          `${l.side === "below" ? "<" : ">"}${formatCompact(l.limit)}`
        )
          .join(", ")
      }${c.limits.length > 3 ? ", …" : ""})`,
      `mean ${formatCentre(c.mean, c.sd, 5)}`,
      `sd ${formatNumber(c.sd, 4)} (maximum likelihood under censoring)`,
    );
    return parts.join(" · ");
  }
  parts.push(
    `mean ${formatCentre(a.moments.mean, a.moments.sd, 5)}`,
    `sd ${formatNumber(a.moments.sd, 4)}`,
  );
  return parts.join(" · ");
}

/**
 * The card's charts as specs: the QQ plot with its envelope, marked exits
 * and both reference lines (the sd's, solid; the order-statistic slope's,
 * dashed), and a wide, low histogram strip with bins that follow the
 * measurement step; and the values in order, when an order was named.
 *
 * @param a the analysis
 * @param name the variable's name for the charts' titles
 */
export function cardSpecs(
  a: Analysis,
  name: string,
): { qq: ReturnType<typeof qqSpec>; histogram: ReturnType<typeof histogramSpec> } {
  return {
    qq: qqSpec(a.qq, {
      name,
      slope: a.censoring ? undefined : a.reading.facts.sigma.slope,
      width: 340,
      height: 280,
    }),
    histogram: histogramSpec(a.histogram, { name, width: 560, height: 90 }),
  };
}

/**
 * The card's charts ({@linkcode cardSpecs}), rendered.
 *
 * @param a the analysis
 * @param name the variable's name for the charts' titles
 */
export async function cardCharts(
  a: Analysis,
  name: string,
): Promise<{ qq: string; histogram: string; sequence?: string }> {
  const specs = cardSpecs(a, name);
  const [qq, hist, seq] = await Promise.all([
    chartBundle(specs.qq),
    chartBundle(specs.histogram),
    a.serial ? chartBundle(sequenceSpec(a.serial, { name })) : undefined,
  ]);
  return {
    qq: qq["text/html"] ?? "",
    histogram: hist["text/html"] ?? "",
    sequence: seq?.["text/html"],
  };
}

/**
 * The card's bundle (`text/html`, `text/markdown`, `text/plain`), arranged
 * around the reading: the verdict and what it comes from first, then the QQ
 * plot beside the evidence grouped by what each measure looks at (the ends,
 * the lean, the middle, the whole line), then the rest of the reading, the
 * histogram strip and the cautions.
 *
 * @param a the analysis
 * @param charts the QQ plot and histogram as HTML (static SVG), already rendered (see {@linkcode cardCharts})
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
export function cardBundle(
  a: Analysis,
  charts: { qq: string; histogram: string; sequence?: string },
): MimeBundle {
  const r = a.reading;
  const colour = VERDICT_COLOUR[r.verdict];
  const ledger = evidenceLedger(a);
  const [lead, ...rest] = r.points;
  const verdict = _cap(VERDICT_WORDS[r.verdict]);
  const html = [
    `<div class="plumbline-card" style="font-family:sans-serif;max-width:940px;border:1px solid #bbb;` +
    `border-radius:6px;padding:10px 14px;background:#ffffff;color:#111111">`,
    // A space between the name and the counts: a viewer that strips styles keeps it.
    `<div><span style="font-size:16px;font-weight:bold">${escapeHtml(a.origin.label)}</span> ` +
    `<span style="color:#555;font-size:88%;margin-left:6px">${
      escapeHtml(countsLine(a))
    }</span></div>`,
    `<div style="margin:8px 0;padding:6px 12px;border-left:7px solid ${colour};background:#f5f5f5">` +
    `<div style="font-size:15px"><strong>${escapeHtml(verdict)}</strong> — ${
      escapeHtml(r.headline)
    }</div>` +
    (lead === undefined ? "" : `<div style="margin-top:4px">${escapeHtml(lead)}.</div>`) +
    `</div>`,
    `<div style="display:flex;flex-wrap:wrap;gap:12px;align-items:flex-start;margin:6px 0">` +
    `<div>${charts.qq}</div><div style="flex:1;min-width:320px">${ledgerHtml(ledger)}</div></div>`,
    `<ul style="margin:4px 0 4px 18px;padding:0">${
      rest.map((p) => `<li>${escapeHtml(p)}.</li>`).join("")
    }</ul>`,
    `<p style="margin:4px 0;font-style:italic">${escapeHtml(r.sizeNote)}.</p>`,
    `<div style="margin:6px 0">${charts.histogram}</div>`,
    charts.sequence ? `<div style="margin:6px 0">${charts.sequence}</div>` : "",
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
    `**${escapeMarkdown(verdict)}** — ${escapeMarkdown(r.headline)}`,
    "",
    ...r.points.map((p) => `- ${escapeMarkdown(p)}.`),
    "",
    ...ledgerLines(ledger).map(escapeMarkdown),
    "",
    `*${escapeMarkdown(r.sizeNote)}.*`,
    "",
    ...CARD_CAUTIONS.map((c) => escapeMarkdown(c)),
  ].join("\n");
  const text = plainText([
    a.origin.label,
    countsLine(a),
    `${verdict}: ${r.headline}`,
    ...r.points.map((p) => `  - ${p}.`),
    "",
    ...ledgerLines(ledger),
    "",
    `  ${r.sizeNote}.`,
    "",
    ...CARD_CAUTIONS,
  ].join("\n"));
  return Object.freeze({ "text/html": html, "text/markdown": md, "text/plain": text });
}
