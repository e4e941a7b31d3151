/**
 * `.by(column)`: one variable screened within each group, with
 * multiplicity-adjusted p-values, and the pooled within-group residuals —
 * the view that matters when the groups feed an ANOVA or a t-test.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { refuseCensored } from "./_censored_guard.ts";
import { PlumbError } from "../errors.ts";
import { cardBundle } from "../render/card.ts";
import { chartBundle } from "../render/chart_bundle.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../render/display.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { formatCount, formatP } from "../render/format.ts";
import { histogramSpec } from "../render/histogram_spec.ts";
import { groupSpec } from "../render/group_spec.ts";
import { qqSpec } from "../render/qq_spec.ts";
import { qqSparkline } from "../render/sparkline.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import { type Adjustment, adjustPValues } from "../stats/multiplicity.ts";
import { analyse, ANALYSE_MIN_N, type Analysis } from "./analysis.ts";
import { VERDICT_SHORT } from "./reading.ts";
import { writeSentence } from "./sentence.ts";
import { _csv } from "./_csv.ts";
import { blanks, SUMMARY_COLUMNS, SUMMARY_HEAD, summaryCells, summaryValues } from "./_rows.ts";
import type { Step } from "./steps.ts";
import { stepLabel } from "./steps.ts";

/** Options for `.by(column)`. */
export interface GroupOptions {
  /**
   * How p-values are adjusted across the groups: Holm (family-wise error),
   * Benjamini–Hochberg (`"bh"`, false discovery rate) or `"none"`.
   * @default "holm"
   */
  readonly adjust?: Adjustment;
}

interface _GroupState {
  readonly table: Table;
  readonly column: string;
  readonly steps: readonly Step[];
  readonly options: { readonly dropText?: boolean };
  readonly groupBy: string;
  readonly groupOptions: GroupOptions;
}

/** One group's screening, or why it was not screened. */
export interface GroupRow {
  /** The group's value. */
  readonly group: string;
  /** Values in the group. */
  readonly n: number;
  /** The analysis, when the group has enough values. */
  readonly analysis?: Analysis;
  /** The adjusted Shapiro–Wilk p-value. */
  readonly adjustedP?: number;
  /** Why the group was not screened. */
  readonly skipped?: string;
}

/** The result of a per-group screening, as plain data. */
export interface GroupResult {
  readonly label: string;
  readonly groupBy: string;
  readonly adjust: Adjustment;
  readonly groups: readonly GroupRow[];
  /** Rows left out because their group cell was missing. */
  readonly noGroup: number;
  /** Value cells missing (and text cells dropped) across all groups. */
  readonly missingDropped: number;
  readonly textDropped: number;
  /** The pooled within-group residuals (value − group mean), analysed. */
  readonly residuals?: Analysis;
}

const _ADJUST_NAME: Record<Adjustment, string> = {
  holm: "Holm",
  bh: "Benjamini–Hochberg",
  none: "unadjusted",
};

/** Natural order for group labels: numbers by value, then text. */
function _compare(a: string, b: string): number {
  const x = Number(a), y = Number(b);
  if (a.trim() !== "" && b.trim() !== "" && Number.isFinite(x) && Number.isFinite(y)) return x - y;
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * The per-group chain. Create it with `plumb(table, column).by(group)`.
 *
 * @example
 * ```ts
 * import { plumb } from "./plumb.ts";
 * const g = plumb({ line: ["a", "b", "a", "b", "a", "b", "a", "b", "a", "b"], v: [1, 4, 2, 5, 3, 7, 2, 6, 4, 5] }, "v").by("line");
 * if (g.result().groups.length !== 2 || g.result().residuals?.n !== 10) throw new Error("groups");
 * ```
 */
export class PlumbGroups implements Displayable {
  readonly #s: _GroupState;
  #result: GroupResult | undefined;
  #bundle: Promise<MimeBundle> | undefined;

  /** @internal Use `plumb(...).by(column)`. */
  constructor(state: _GroupState) {
    const adjust = state.groupOptions.adjust ?? "holm";
    if (!["holm", "bh", "none"].includes(adjust)) {
      throw new PlumbError(
        "bad-option",
        `Unknown adjustment "${String(adjust)}": use "holm", "bh" or "none"`,
      );
    }
    this.#s = state;
    Object.freeze(this);
  }

  /** The screening of every group, as plain data (computed once). */
  result(): GroupResult {
    if (this.#result) return this.#result;
    const { table, column, steps, groupBy, options } = this.#s;
    const adjust = this.#s.groupOptions.adjust ?? "holm";
    // Raises "non-numeric" (naming rows) unless text cells are dropped on request.
    const used = table.numeric(column, { dropText: options.dropText ?? false });
    refuseCensored(used, stepLabel(column, steps));
    const cells = table.numericCells(column);
    const g = table.text(groupBy);
    const byGroup = new Map<string, number[]>();
    let noGroup = 0;
    for (let i = 0; i < table.rowCount; i++) {
      if (cells.missing[i] || cells.nonNumeric[i]) continue;
      if (g.missing[i]) {
        noGroup++;
        continue;
      }
      const key = g.values[i];
      let list = byGroup.get(key);
      if (!list) byGroup.set(key, list = []);
      list.push(i);
    }
    const label = stepLabel(column, steps);
    const keys = [...byGroup.keys()].sort(_compare);
    const residuals: number[] = [];
    const rows: GroupRow[] = [];
    for (const key of keys) {
      const idx = byGroup.get(key)!;
      let v: Float64Array = Float64Array.from(idx, (i) => cells.values[i]);
      for (const s of steps) v = s.apply(v);
      if (v.length >= 2) {
        let mean = 0;
        for (const t of v) mean += t;
        mean /= v.length;
        for (const t of v) residuals.push(t - mean);
      }
      if (v.length < ANALYSE_MIN_N) {
        rows.push({
          group: key,
          n: v.length,
          skipped: `only ${v.length} value${
            v.length === 1 ? "" : "s"
          }; at least ${ANALYSE_MIN_N} are needed`,
        });
        continue;
      }
      const rowsOf = Int32Array.from(idx, (i) => i + 1);
      try {
        const a = analyse(v, {
          label: `${label} — ${groupBy} = ${key}`,
          column,
          group: key,
          transform: steps.length ? label : undefined,
          missingDropped: 0,
          textDropped: 0,
          rows: rowsOf,
        });
        rows.push({ group: key, n: v.length, analysis: a });
      } catch (e) {
        if (e instanceof PlumbError && e.code === "constant") {
          rows.push({ group: key, n: v.length, skipped: "every value is the same" });
        } else throw e;
      }
    }
    const tested = rows.filter((r) => r.analysis);
    const adj = adjustPValues(tested.map((r) => r.analysis!.primary.pValue), adjust);
    const adjusted = new Map(tested.map((r, k) => [r.group, adj[k]]));
    const final = rows.map((r) =>
      Object.freeze(r.analysis ? { ...r, adjustedP: adjusted.get(r.group) } : r)
    );
    let res: Analysis | undefined;
    if (residuals.length >= ANALYSE_MIN_N) {
      try {
        res = analyse(Float64Array.from(residuals), {
          label: `${label} residuals within ${groupBy}`,
          column,
          transform: steps.length ? label : undefined,
          missingDropped: used.provenance.missingDropped,
          textDropped: used.provenance.textDropped,
        });
      } catch (e) {
        if (!(e instanceof PlumbError && e.code === "constant")) throw e;
      }
    }
    this.#result = Object.freeze({
      label,
      groupBy,
      adjust,
      groups: Object.freeze(final),
      noGroup,
      missingDropped: used.provenance.missingDropped,
      textDropped: used.provenance.textDropped,
      residuals: res,
    });
    return this.#result;
  }

  /** The per-group table model (also used for CSV and Markdown export). */
  table(): TableModel {
    const r = this.result();
    const adjName = _ADJUST_NAME[r.adjust];
    const rows = r.groups.map((g) => {
      const a = g.analysis;
      if (!a) {
        return [g.group, formatCount(g.n), ...blanks(7), `not screened: ${g.skipped}`, ""];
      }
      const spark = qqSparkline(a.qq, { title: `QQ sparkline of ${a.origin.label}` });
      return [
        g.group,
        formatCount(a.n),
        ...summaryCells(a),
        formatP(g.adjustedP!),
        VERDICT_SHORT[a.reading.verdict],
        { text: "", html: spark },
      ];
    });
    const notes = [
      `p: Shapiro–Wilk; adjusted p: ${adjName} across the ${
        r.groups.filter((g) => g.analysis).length
      } groups screened.`,
    ];
    if (r.noGroup > 0) {
      notes.push(
        `${r.noGroup} row${r.noGroup === 1 ? "" : "s"} with no ${r.groupBy} value left out.`,
      );
    }
    if (r.missingDropped > 0) {
      notes.push(
        `${r.missingDropped} missing cell${
          r.missingDropped === 1 ? "" : "s"
        } of ${r.label} left out.`,
      );
    }
    if (r.textDropped > 0) {
      notes.push(
        `${r.textDropped} non-numeric cell${
          r.textDropped === 1 ? "" : "s"
        } of ${r.label} left out on request.`,
      );
    }
    return {
      caption: `${r.label} by ${r.groupBy}`,
      columns: [
        { title: r.groupBy },
        { title: "n", align: "right" },
        ...SUMMARY_COLUMNS,
        { title: `${r.adjust === "none" ? "" : "adj. "}p (${adjName})`, align: "right" },
        { title: "reading" },
        { title: "QQ" },
      ],
      rows,
      notes,
    };
  }

  /**
   * One write-up paragraph per group screened (with its adjusted p), then
   * one for the pooled residuals; displayable as a list.
   */
  sentences(): Displayable & { readonly texts: readonly string[]; toJSON(): readonly string[] } {
    const r = this.result();
    const family = r.groups.filter((g) => g.analysis).length;
    const texts = r.groups.filter((g) => g.analysis).map((g) =>
      writeSentence(g.analysis!, {
        adjusted: r.adjust === "none"
          ? undefined
          : { p: g.adjustedP!, method: _ADJUST_NAME[r.adjust], family },
      })
    );
    if (r.residuals) texts.push(writeSentence(r.residuals));
    const frozen = Object.freeze(texts);
    const bundle: MimeBundle = Object.freeze({
      "text/html": `<ul style="max-width:860px">${
        frozen.map((t) => `<li style="margin:4px 0">${escapeHtml(t)}</li>`).join("")
      }</ul>`,
      "text/markdown": frozen.map((t) => `- ${escapeMarkdown(t)}`).join("\n"),
      "text/plain": plainText(frozen.map((t) => `• ${t}`).join("\n")),
    });
    return Object.freeze({ texts: frozen, toJSON: () => frozen, [DISPLAY]: () => bundle });
  }

  /** The per-group table as CSV (numbers unrounded). */
  toCSV(): string {
    const r = this.result();
    const head = ["group", "n", ...SUMMARY_HEAD, "adjusted_p", "adjustment", "verdict", "note"];
    const lines = r.groups.map((g) => {
      const a = g.analysis;
      return a
        ? [g.group, a.n, ...summaryValues(a), g.adjustedP, r.adjust, a.reading.verdict, ""]
        : [g.group, g.n, ...blanks(7), r.adjust, "", g.skipped];
    });
    return _csv(head, lines);
  }

  /** The per-group table as Markdown. */
  toMarkdown(): string {
    return tableMarkdown(this.table());
  }

  /** Plain data. */
  toJSON(): GroupResult {
    return this.result();
  }

  /** Table of groups, then the pooled residuals' card. */
  [DISPLAY](): Promise<MimeBundle> {
    this.#bundle ??= (async () => {
      const r = this.result();
      const t = this.table();
      const shown = r.groups.filter((g) => g.analysis).slice(0, 24);
      const facets = shown.length
        ? await chartBundle(
          groupSpec(shown.map((g) => ({ group: g.group, qq: g.analysis!.qq })), {
            name: r.label,
            by: r.groupBy,
          }),
        )
        : undefined;
      let resHtml = "", resMd = "", resText = "";
      if (r.residuals) {
        const a = r.residuals;
        const [qq, hist] = await Promise.all([
          chartBundle(qqSpec(a.qq, { name: a.origin.label })),
          chartBundle(histogramSpec(a.histogram, { name: a.origin.label })),
        ]);
        const card = cardBundle(a, {
          qq: qq["text/html"] ?? "",
          histogram: hist["text/html"] ?? "",
        });
        resHtml = card["text/html"] ?? "";
        resMd = card["text/markdown"] ?? "";
        resText = card["text/plain"];
      }
      const lead =
        `For an ANOVA or t-test the assumption concerns the residuals, pooled below; the per-group rows show where a departure comes from.`;
      return Object.freeze({
        "text/html":
          `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px">${
            tableHtml(t)
          }` +
          `<div style="margin:8px 0">${facets?.["text/html"] ?? ""}</div>` +
          `<p style="max-width:780px">${escapeHtml(lead)}</p>${resHtml}</div>`,
        "text/markdown": `${tableMarkdown(t)}\n\n${escapeMarkdown(lead)}\n\n${resMd}`,
        "text/plain": plainText(`${tableText(t)}\n\n${lead}\n\n${resText}`),
      });
    })();
    return this.#bundle;
  }
}
