/**
 * `.by(column)` and `.by([a, b])`: one variable screened within each group
 * (or each cell of several columns), with
 * multiplicity-adjusted p-values, and the pooled within-group residuals —
 * the view that matters when the groups feed an ANOVA or a t-test.
 *
 * Kept in one file because the view's caches (screening, bundle, residual
 * card) are the private state of one class.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { bundleBytes, OUTPUT_BUDGET } from "../render/budget.ts";
import { cardSpecs } from "../render/card.ts";
import { chartBundle, specSvg } from "../render/chart_bundle.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { formatCount, formatNumber, formatP } from "../results/format.ts";
import { groupSpec } from "../render/group_spec.ts";
import { qqSparkline } from "../render/sparkline.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import { ADJUSTMENT_NAMES, checkAdjustment } from "../stats/multiplicity.ts";
import { VERDICT_SHORT } from "../results/reading.ts";
import type { StakesOptions } from "../stakes/stakes.ts";
import { stakesOptions } from "./stakes_view.ts";
import { LIST_CAUTIONS, writeSentence } from "./sentence.ts";
import { type GroupStakesView, groupStakesView } from "./stakes_groups.ts";
import { cardOf } from "./analysis.ts";
import { shownGroups } from "./group_pick.ts";
import { type GroupSentences, listBundle } from "./group_sentences.ts";
import { _csv } from "./_csv.ts";
import { mergedLabelsNote } from "./merged_labels_note.ts";
import * as summary from "./_rows.ts";
import { type GroupResult, type GroupRow, type GroupState, screenGroups } from "./group_screen.ts";

/** The cells a skipped group left out, as a clause (empty when none). */
function _leftOut(missing: number, text: number): string {
  const parts = [];
  if (missing > 0) parts.push(`${formatCount(missing)} missing cell${missing === 1 ? "" : "s"}`);
  if (text > 0) parts.push(`${formatCount(text)} non-numeric cell${text === 1 ? "" : "s"}`);
  return parts.length ? ` (${parts.join(" and ")} left out)` : "";
}

/** What to say when the grouping column gives no group at all. */
function _noGroups(r: GroupResult): string {
  return `No group to screen: every cell of ${r.groupBy} is empty` +
    (r.noGroup > 0 ? `, so all ${formatCount(r.noGroup)} values of ${r.label} are left out` : "");
}

/** A group's serial dependence in a cell: whether it shows, and r₁. */
function serialCell(a: NonNullable<GroupResult["groups"][number]["analysis"]>): string {
  const s = a.serial!.result;
  return `${s.shows ? "dependent" : "no sign"} (r₁ ${formatNumber(s.lagOne.r1, 2)})`;
}

/**
 * The per-group chain. Create it with `plumb(table, column).by(group)`.
 *
 * @example
 * ```ts
 * import { plumb } from "@plumbline/plumbline";
 * const g = plumb({ line: ["a", "b", "a", "b", "a", "b", "a", "b", "a", "b"], v: [1, 4, 2, 5, 3, 7, 2, 6, 4, 5] }, "v").by("line");
 * if (g.result().groups.length !== 2 || g.result().residuals?.n !== 10) throw new Error("groups");
 * ```
 */
export class PlumbGroups implements Displayable {
  readonly #s: GroupState | GroupResult;
  #result: GroupResult | undefined;
  #bundle: Promise<MimeBundle> | undefined;
  #residualCard: Promise<{ resHtml: string; resMd: string; resText: string }> | undefined;

  /**
   * @internal Use `plumb(...).by(column)`.
   * @param state what to screen, or a result already screened elsewhere (a query source)
   */
  constructor(state: GroupState | GroupResult) {
    if ("groupOptions" in state) checkAdjustment(state.groupOptions.adjust);
    else this.#result = state;
    this.#s = state;
    Object.freeze(this);
  }

  /** The screening of every group, as plain data (computed once). */
  result(): GroupResult {
    this.#result ??= screenGroups(this.#s as GroupState);
    return this.#result;
  }

  /** The per-group table model, every group (also used for Markdown export). */
  table(): TableModel {
    return this.#model(this.result().groups);
  }

  #model(groups: readonly GroupRow[], leftOut?: string): TableModel {
    const r = this.result();
    const adjName = ADJUSTMENT_NAMES[r.adjust];
    const rows = groups.map((g) => {
      const a = g.analysis;
      if (!a) {
        return [
          g.group,
          formatCount(g.n),
          ...summary.blanks(7),
          `not screened: ${g.skipped}`,
          ...(r.order ? [""] : []),
          "",
        ];
      }
      const spark = qqSparkline(a.qq, { title: `QQ sparkline of ${a.origin.label}` });
      return [
        g.group,
        formatCount(a.n),
        ...summary.summaryCells(a),
        formatP(g.adjustedP!),
        VERDICT_SHORT[a.reading.verdict],
        ...(r.order ? [serialCell(a)] : []),
        { text: "", html: spark },
      ];
    });
    const count = r.groups.filter((g) => g.analysis).length;
    const notes = count > 0
      ? [`p: Shapiro–Wilk; adjusted p: ${adjName} across the ${count} groups screened.`]
      : [];
    if (r.order) {
      notes.push(
        `In ${
          r.order === "file order" ? "file" : r.order
        } order: serial dependence of each group (lag-1 autocorrelation and runs about the median, Bonferroni), with r₁.`,
      );
    }
    const screened = r.groups.flatMap((g) => (g.analysis ? [g.analysis] : []));
    const sub = summary.subsampleNote(screened);
    if (sub) notes.push(sub);
    const censored = summary.censoredNote(screened);
    if (censored) notes.push(censored);
    if (r.mergedLabels.length > 0) notes.push(mergedLabelsNote(r.groupBy, r.mergedLabels));
    if (r.groups.length === 0) notes.push(`${_noGroups(r)}.`);
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
    if (leftOut) notes.unshift(leftOut);
    return {
      caption: `${r.label} by ${r.groupBy}`,
      columns: [
        { title: r.groupBy },
        { title: "n", align: "right" },
        ...summary.SUMMARY_COLUMNS,
        { title: `${r.adjust === "none" ? "" : "adj. "}p (${adjName})`, align: "right" },
        { title: "reading" },
        ...(r.order ? [{ title: `in ${r.order === "file order" ? "file" : r.order} order` }] : []),
        { title: "QQ" },
      ],
      rows,
      notes,
    };
  }

  /**
   * One write-up paragraph per group (screened, with its adjusted p, or
   * why not), one for the pooled residuals, then the cautions that apply to
   * all of them, once; displayable as a list.
   */
  sentences(): GroupSentences {
    const r = this.result();
    const family = r.groups.filter((g) => g.analysis).length;
    const write = (g: GroupRow) =>
      g.analysis
        ? writeSentence(g.analysis, {
          adjusted: r.adjust === "none"
            ? undefined
            : { p: g.adjustedP!, method: ADJUSTMENT_NAMES[r.adjust], family },
          cautions: false,
        })
        : `${r.label} — ${r.groupBy} = ${g.group}: not screened, ${g.skipped}${
          _leftOut(g.missingDropped, g.textDropped)
        }.`;
    const tail = r.groups.length === 0 ? [`${_noGroups(r)}.`] : [];
    if (r.residuals) tail.push(writeSentence(r.residuals, { cautions: false }));
    tail.push(`For all of the above: a${LIST_CAUTIONS.slice(1)}`); // "A large p …"
    const texts = [...r.groups.map(write), ...tail];
    const frozen = Object.freeze(texts);
    // The display holds the groups the table shows; every paragraph is in
    // `texts` and in saved files.
    const shown = shownGroups(this.result(), MAX_GROUP_ROWS);
    const visible = [...shown.groups.map(write), ...tail];
    const bundle = listBundle(visible, shown.note);
    let all: MimeBundle | undefined;
    const view: GroupSentences = Object.freeze({
      texts: frozen,
      toJSON: () => frozen,
      [DISPLAY]: () => bundle,
      save: (path: string) =>
        saveDisplay(
          path,
          savable(
            { [DISPLAY]: () => (all ??= listBundle(frozen)), toJSON: () => frozen },
            `the write-up of ${r.label} by ${r.groupBy}`,
          ),
        ),
    });
    return view;
  }

  /**
   * What the departure changes within each group: each group's central
   * range, share outside the limits, Cpk and mean interval, the
   * normal-theory way beside the ways without a model (see `Plumb.stakes`).
   *
   * @param options coverage (default 0.95), lower and upper limits, levels, bootstrap seed
   */
  stakes(options: StakesOptions = {}): GroupStakesView {
    if (!("groupOptions" in this.#s)) {
      throw new PlumbError(
        "bad-option",
        "Cannot compute the stakes of groups screened through a query: they need every value; " +
          "load the rows of interest with loadTable, or filter them in the query to fit in memory",
      );
    }
    const opts = stakesOptions(options, this.#s.reexpressed ?? false, ".by(...).stakes()");
    return groupStakesView(this.#s, opts);
  }

  /** The per-group table as CSV (numbers unrounded). */
  toCSV(): string {
    const r = this.result();
    const head = [
      "group",
      "n",
      ...summary.SUMMARY_HEAD,
      "adjusted_p",
      "adjustment",
      "verdict",
      "note",
    ];
    const lines = r.groups.map((g) => {
      const a = g.analysis;
      return a
        ? [g.group, a.n, ...summary.summaryValues(a), g.adjustedP, r.adjust, a.reading.verdict, ""]
        : [g.group, g.n, ...summary.blanks(7), r.adjust, "", g.skipped];
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

  /** The QQ plots of (at most 24 of) the groups shown, as one faceted spec. */
  #facets(groups: readonly GroupRow[]) {
    const r = this.result();
    const screened = groups.filter((g) => g.analysis).slice(0, MAX_FACETS);
    if (screened.length === 0) return undefined;
    return groupSpec(screened.map((g) => ({ group: g.group, qq: g.analysis!.qq })), {
      name: r.label,
      by: r.groupBy,
    });
  }

  /**
   * Write the view to a file, by extension: `.html` (static page), `.md`,
   * `.txt`, `.csv` (every group), `.json` (every group, plain data), `.svg` or
   * `.png` (the QQ plots by group shown, and the pooled residuals' QQ plot).
   */
  save(path: string): Promise<SavedFile> {
    return saveDisplay(
      path,
      savable(this, `${this.result().label} by ${this.result().groupBy}`, {
        charts: async () => {
          const r = this.result();
          const specs = [this.#facets(shownGroups(this.result(), MAX_GROUP_ROWS).groups)];
          if (r.residuals) specs.push(cardSpecs(r.residuals, r.residuals.origin.label).qq);
          return await Promise.all(specs.filter((x) => x !== undefined).map((x) => specSvg(x!)));
        },
      }),
    );
  }

  /**
   * Table of groups (at most 40, the clearest departures, with a note on the
   * rest), their QQ plots, then the pooled residuals' card.
   */
  [DISPLAY](): Promise<MimeBundle> {
    this.#bundle ??= (async () => {
      let max = MAX_GROUP_ROWS;
      for (;;) {
        const b = await this.#bundleOf(max);
        if (bundleBytes(b) <= OUTPUT_BUDGET || max <= 1) return b;
        max = Math.floor(max / 2);
      }
    })();
    return this.#bundle;
  }

  async #cardOfResiduals(): Promise<{ resHtml: string; resMd: string; resText: string }> {
    const a = this.result().residuals;
    const card = a ? await cardOf(a, a.origin.label) : undefined;
    return {
      resHtml: card?.["text/html"] ?? "",
      resMd: card?.["text/markdown"] ?? "",
      resText: card?.["text/plain"] ?? "",
    };
  }

  async #bundleOf(max: number): Promise<MimeBundle> {
    const r = this.result();
    const shown = shownGroups(r, max);
    const t = this.#model(shown.groups, shown.note);
    const spec = this.#facets(shown.groups);
    const facets = spec ? await chartBundle(spec) : undefined;
    const { resHtml, resMd, resText } = await (this.#residualCard ??= this.#cardOfResiduals());
    const lead = r.residuals
      ? `For an ANOVA or t-test the assumption concerns the residuals, pooled below; the per-group rows show where a departure comes from.`
      : `Each row screens the values of one ${
        (r.groupColumns?.length ?? 1) > 1 ? "cell" : "group"
      }; the rows show where a departure comes from.`;
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
  }
}

/** The most groups a display's table shows (the rest are in the exports). */
const MAX_GROUP_ROWS = 40;
/** The most QQ plots by group in one chart. */
const MAX_FACETS = 24;
