/**
 * The re-expression view of a chain: the ranked candidates, each re-tested,
 * the side-by-side QQ panel, and the back-transformed summary of the chosen
 * one.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { backTransformMean } from "../reexpress/back_transform.ts";
import { applyReexpression } from "../reexpress/reexpression.ts";
import type { ReexpressionSearch } from "../reexpress/candidates.ts";
import { rankReexpressions } from "../reexpress/search.ts";
import { chartBundle, specSvg } from "../render/chart_bundle.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import { comparisonSpec } from "../render/comparison_spec.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { formatCount, formatNumber, formatP } from "../results/format.ts";
import { SHAPIRO_WILK_MAX_N } from "../stats/shapiro_wilk.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import { qqData } from "../stats/qq_data.ts";
import { stepLabel, stepOf } from "./steps.ts";
import { _csv } from "./_csv.ts";

/** The ranked candidates as a table model. */
export function candidatesTable(s: ReexpressionSearch, name: string): TableModel {
  const rows = s.candidates.map((c) => {
    const sw = c.tests.find((t) => t.test === "Shapiro–Wilk")?.result;
    const label = stepLabel(name, [stepOf(c.reexpression)]);
    return [
      String(c.rank),
      label,
      formatNumber(c.departure, 3),
      sw ? formatNumber(sw.statistic, 4) : "",
      sw ? formatP(sw.pValue) : "not run",
      c.skewness === null ? "" : formatNumber(c.skewness, 3),
      c.excessKurtosis === null ? "" : formatNumber(c.excessKurtosis, 3),
      c.rank === 1 ? "chosen" : c.closeToBest ? "as good as the best" : "",
    ];
  });
  return {
    caption: `Re-expressions of ${name}, ranked`,
    columns: [
      { title: "rank", align: "right" },
      { title: "re-expression" },
      { title: "1 − W′", align: "right" },
      { title: "W", align: "right" },
      { title: "p", align: "right" },
      { title: "g1", align: "right" },
      { title: "g2", align: "right" },
      { title: "" },
    ],
    rows,
    notes: [
      s.reason,
      `Ranking: ${s.rule}.`,
      ...(s.n > SHAPIRO_WILK_MAX_N
        ? [
          `W and p: Shapiro–Wilk on a seeded random subsample of ${
            formatCount(SHAPIRO_WILK_MAX_N)
          } of the ${
            formatCount(s.n)
          } values (seed 1, as a chain on them uses); 1 − W′ uses all of them.`,
        ]
        : []),
      ...s.skipped.map((k) => `Not tried: ${k}.`),
    ],
  };
}

/** The back-transform lines for the chosen candidate. */
function _backLines(values: Float64Array, s: ReexpressionSearch): string[] {
  if (values.length < 2) return [];
  const b = backTransformMean(values, s.chosen.reexpression);
  const iv = (v: number | null) => (v === null ? "no value" : formatNumber(v, 5));
  const lines = [
    `On the original scale: ${b.estimateName} ${formatNumber(b.estimate, 5)}, ${b.intervalName} ${
      iv(b.interval[0])
    } to ${iv(b.interval[1])}` +
    (b.ratio !== null ? ` (×/÷ ${formatNumber(b.ratio, 4)})` : ""),
    ...b.cautions,
  ];
  return lines;
}

/** The ranked candidates, displayable and exportable. */
export interface CandidatesView extends Displayable {
  /** The search as plain data. */
  toJSON(): ReexpressionSearch;
  /** The ranked table as Markdown. */
  toMarkdown(): string;
  /** The ranked table as CSV (numbers unrounded). */
  toCSV(): string;
  /**
   * Write the view to a file, by extension: `.html`, `.md`, `.txt`, `.csv`
   * (the ranked table), `.json` (the search), `.svg` or `.png` (the QQ panel).
   */
  save(path: string): Promise<SavedFile>;
}

/**
 * The ranked candidates of a sample, displayable: table, QQ panel of the
 * top candidates, reason, back-transformed summary. Nothing is computed
 * until the view is first read or shown; then the search runs once (through
 * `search`, which the chain caches) and the view keeps what it made.
 *
 * @param values the sample, on first need
 * @param search the ranked candidates of those values, on first need
 * @param name what the sample is (for titles), on first need
 *
 * @example
 * ```ts
 * import { candidatesView } from "./reexpress_view.ts";
 * import { searchReexpressions } from "@plumbline/plumbline";
 * const x = new Float64Array([1.1, 1.9, 2.3, 2.8, 3.9, 4.4, 5.6, 7.7, 9.8, 14.1, 19.5, 31.2]);
 * const v = candidatesView(() => x, () => searchReexpressions(x), () => "gap");
 * if (!v.toMarkdown().includes("chosen")) throw new Error("table");
 * ```
 */
export function candidatesView(
  values: () => Float64Array,
  search: () => ReexpressionSearch,
  name: () => string,
): CandidatesView {
  let model: TableModel | undefined;
  let back: string[] | undefined;
  const table = () => (model ??= candidatesTable(search(), name()));
  const backLines = () => (back ??= _backLines(values(), search()));
  let bundle: Promise<MimeBundle> | undefined;
  let panelSpec: ReturnType<typeof comparisonSpec> | undefined;
  const panel = () => {
    if (panelSpec) return panelSpec;
    const s = search();
    const x = values();
    const top = s.candidates.slice(0, 6);
    return (panelSpec = comparisonSpec(
      top.flatMap((c) => {
        const sw = c.tests.find((t) => t.test === "Shapiro–Wilk")?.result;
        // The search ranks on rescaled values; on the data's own scale a strong
        // power can collapse values that differ by a few parts in 1e16 to one
        // double (Box–Cox of values near 1e−300): no panel for that candidate.
        let qq;
        try {
          qq = qqData(applyReexpression(x, c.reexpression));
        } catch (e) {
          if (
            e instanceof PlumbError && (e.code === "constant" || e.code === "non-finite")
          ) return [];
          throw e;
        }
        return [{
          // In x: the chart's title names the variable, and short panel titles keep the grid aligned.
          label: stepOf(c.reexpression).formula,
          qq,
          W: sw?.statistic ?? 1 - c.departure,
          p: sw?.pValue ?? NaN,
          note: c.rank === 1 ? "chosen" : undefined,
        }];
      }),
      { name: name() },
    ));
  };
  const show = () =>
    bundle ??= (async () => {
      const drawn = await chartBundle(panel());
      const lines = backLines();
      const backHtml = lines.map((l) => `<p style="margin:2px 0">${escapeHtml(l)}</p>`).join("");
      return Object.freeze({
        "text/html":
          `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px">${
            tableHtml(table())
          }` +
          `<div style="margin:8px 0">${drawn["text/html"] ?? ""}</div>${backHtml}</div>`,
        "text/markdown": `${tableMarkdown(table())}\n\n${lines.map(escapeMarkdown).join("\n\n")}`,
        "text/plain": plainText(`${tableText(table())}\n\n${lines.join("\n")}`),
      });
    })();
  const view: CandidatesView = Object.freeze({
    [DISPLAY]: show,
    save: (path: string) =>
      saveDisplay(
        path,
        savable(view, `the re-expressions of ${name()}`, {
          charts: async () => [await specSvg(panel())],
        }),
      ),
    toJSON: () => search(),
    toMarkdown: () => tableMarkdown(table()),
    toCSV: () =>
      _csv(
        [
          "rank",
          "reexpression",
          "kind",
          "lambda",
          "shift",
          "departure",
          "W",
          "p",
          "g1",
          "g2",
          "close_to_best",
        ],
        search().candidates.map((c) => {
          const sw = c.tests.find((t) => t.test === "Shapiro–Wilk")?.result;
          return [
            c.rank,
            c.reexpression.label,
            c.reexpression.kind,
            c.reexpression.lambda ?? "",
            c.reexpression.shift,
            c.departure,
            sw?.statistic ?? "",
            sw?.pValue ?? "",
            c.skewness ?? "",
            c.excessKurtosis ?? "",
            c.closeToBest,
          ];
        }),
      ),
  });
  return view;
}

/** The chosen candidate's formula in `x` for a survey row (`"none better than x"` when none helps). */
export function suggestReexpression(values: Float64Array): string {
  const s = rankReexpressions(values); // the choice needs no re-testing
  if (s.chosen.reexpression.kind === "identity") return "none better than x";
  return stepOf(s.chosen.reexpression).formula;
}
