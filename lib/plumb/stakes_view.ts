/**
 * The stakes view of one variable on the chain (`plumb(...).stakes()`): the
 * chart with each quantity on its own axis, the table, the paragraph for a
 * write-up with its caution, and exports (JSON, CSV, Markdown, files).
 * Nothing is computed until the view is first read or shown; then the
 * figures are computed once and kept.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { chartBundle } from "../render/chart_bundle.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { rasterize } from "../render/raster.ts";
import { type SavedFile, saveDisplay } from "../render/save.ts";
import { stakesSpec } from "../render/stakes_spec.ts";
import { stakesSentence, stakesTable } from "../render/stakes_words.ts";
import { accessibleSvg, renderSvg } from "../render/svg.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { PlumbError } from "../errors.ts";
import { type Reexpression, reexpression } from "../reexpress/reexpression.ts";
import { checkOptions } from "../results/options.ts";
import { type Stakes, STAKES_OPTIONS, type StakesOptions } from "../stakes/stakes.ts";
import type { Step } from "./steps.ts";
import { _csv } from "./_csv.ts";
import { type Sentence, sentenceOf } from "./sentence.ts";

/** What the departure changes for one variable: displayable, exportable, savable. */
export interface StakesView extends Displayable {
  /** The figures as plain, frozen data (computed once). */
  result(): Stakes;
  /** The contract's plain-data form: `range`, `outside`, `capability`, `mean`, with details. */
  toJSON(): Record<string, unknown>;
  /** The chart's Vega-Lite spec: one axis per quantity, one row per way of computing it. */
  spec(): TopLevelSpec;
  /** The table: one row per quantity, the ways side by side, and the verdict. */
  table(): TableModel;
  /** The paragraph for a write-up, ending with the caution. */
  sentence(): Sentence;
  /** The table as Markdown. */
  toMarkdown(): string;
  /** Every figure as CSV: quantity, way, value, lower, upper, verdict (numbers unrounded). */
  toCSV(): string;
  /** Write the view to a file; the type follows the extension (.svg .png .html .md .txt .csv .json). */
  save(path: string): Promise<SavedFile>;
}

/**
 * Check the options of a chain's `.stakes()`: known names only, and no
 * `reexpression` on a chain that carries its own.
 *
 * @param options what the user passed
 * @param reexpressed whether the chain carries a `.reexpress()`
 * @param where the call, for messages
 */
export function stakesOptions(
  options: StakesOptions,
  reexpressed: boolean,
  where: string,
): StakesOptions {
  const opts = checkOptions(options, STAKES_OPTIONS, where);
  if (reexpressed && opts.reexpression !== undefined) {
    throw new PlumbError(
      "bad-option",
      `Cannot use the reexpression option of ${where} after .reexpress(): the chain's own ` +
        "re-expression is used; call .stakes() on the chain plumb() made to choose another",
      { reexpression: opts.reexpression },
    );
  }
  return opts;
}

/**
 * The one re-expression the stakes figures map back through: the chain's
 * step, or the identity when its `.reexpress()` kept the data as measured.
 *
 * @param steps the chain's resolved steps
 * @param label the chain's label, for the message
 * @throws {PlumbError} `"bad-option"` for more than one step
 */
export function stakesStep(steps: readonly Step[], label: string): Reexpression {
  if (steps.length > 1) {
    throw new PlumbError(
      "bad-option",
      `Cannot compute the stakes of ${label}: it applies ${steps.length} re-expressions ` +
        "in turn, and the stakes view maps back through one: call .stakes() after one .reexpress()",
    );
  }
  return steps.length === 1 ? steps[0].reexpression : reexpression("identity");
}

/** The CSV header of the stakes figures. */
export const STAKES_CSV_HEAD: readonly string[] = [
  "quantity",
  "way",
  "value",
  "lower",
  "upper",
  "verdict",
];

/** One CSV row per figure: quantity, way, value, lower, upper, verdict. */
export function stakesRows(s: Stakes): unknown[][] {
  const j = s.judgement;
  const re = s.reexpression?.label ?? "";
  const r = s.range;
  const v = j.range.verdict;
  const out: unknown[][] = [
    ["central range", "normal", "", r.normal[0], r.normal[1], v],
  ];
  if (r.reexpressed !== null) {
    out.push(["central range", re, "", r.reexpressed[0], r.reexpressed[1], v]);
  }
  out.push(
    ["central range", "ranks", "", r.ranks[0], r.ranks[1], v],
    ["lower rank limit CI", "order statistics", r.ranks[0], ...r.ranksCi[0], v],
    ["upper rank limit CI", "order statistics", r.ranks[1], ...r.ranksCi[1], v],
  );
  if (s.outside !== null && s.capability !== null) {
    const o = s.outside;
    const w = j.outside!.verdict;
    out.push(["share outside", "normal", o.normal, "", "", w]);
    if (o.reexpressed !== null) out.push(["share outside", re, o.reexpressed, "", "", w]);
    out.push(["share outside", "observed", o.observed, ...o.observedCi, w]);
    const c = s.capability;
    const k = j.capability!.verdict;
    out.push(["Cpk", "normal", c.normal.cpk, ...c.normal.cpkCi, k]);
    if (c.reexpressed !== null) out.push(["Cpk", re, c.reexpressed.cpk, ...c.reexpressed.cpkCi, k]);
    out.push(["Cpk", "percentiles", c.percentile.cpk ?? "", "", "", k]);
    if (c.normal.cp !== null) {
      out.push(["Cp", "normal", c.normal.cp, ...c.normal.cpCi!, k]);
      if (c.reexpressed?.cp != null) {
        out.push(["Cp", re, c.reexpressed.cp, ...c.reexpressed.cpCi!, k]);
      }
      out.push(["Cp", "percentiles", c.percentile.cp ?? "", "", "", k]);
    }
  }
  const m = s.mean;
  out.push(
    ["mean", "t", m.estimate, ...m.t, j.mean.verdict],
    ["mean", "bootstrap BCa", m.estimate, ...m.bootstrap, j.mean.verdict],
  );
  return out;
}

/**
 * A spec's chart as the SVG and PNG files `save` writes (with a title and
 * description for screen readers).
 *
 * @param spec the chart's spec, on first need
 * @param title the chart's title, on first need
 */
export function specFiles(
  spec: () => TopLevelSpec,
  title: () => string,
): { svg: () => Promise<string>; png: () => Promise<Uint8Array> } {
  const svg = async () =>
    accessibleSvg(await renderSvg(spec()), {
      title: title(),
      description: String((spec() as { description?: string }).description ?? title()),
    });
  return { svg, png: async () => (await rasterize(await svg(), { title: title() })).png };
}

/**
 * The stakes view of one variable, computed on first need.
 *
 * @param compute the figures, on first need
 * @param name the variable's name in original units, on first need
 * @example
 * ```ts
 * import { stakesView } from "./stakes_view.ts";
 * import { stakes } from "../stakes/stakes.ts";
 * const x = [0.8, 1.1, 1.2, 1.5, 1.7, 2.0, 2.2, 2.9, 3.4, 4.8, 6.9, 12.5];
 * const v = stakesView(() => stakes(x, { upper: 10 }), () => "oxygen");
 * if (!v.toCSV().startsWith("quantity,way,value,lower,upper,verdict\n")) throw new Error("csv");
 * if (!v.sentence().text.startsWith("oxygen (n = 12)")) throw new Error(v.sentence().text);
 * ```
 */
export function stakesView(compute: () => Stakes, name: () => string): StakesView {
  let result: Stakes | undefined;
  let spec: TopLevelSpec | undefined;
  let model: TableModel | undefined;
  let bundle: Promise<MimeBundle> | undefined;
  const get = () => (result ??= compute());
  const getSpec = () => (spec ??= stakesSpec(get(), { name: name() }));
  const table =
    () => (model ??= { caption: `What the departure changes: ${name()}`, ...stakesTable(get()) });
  const sentence = sentenceOf(() => stakesSentence(get(), name()));
  const title = () => `What the departure changes for ${name()}`;
  const files = specFiles(getSpec, title);
  const show = () =>
    bundle ??= (async () => {
      const chart = await chartBundle(getSpec());
      const t = table();
      const text = sentence.text;
      return Object.freeze({
        "text/html": `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px">` +
          `<div style="margin:0 0 8px 0">${chart["text/html"] ?? ""}</div>${tableHtml(t)}` +
          `<p style="max-width:860px">${escapeHtml(text)}</p></div>`,
        "text/markdown": `${tableMarkdown(t)}\n\n${escapeMarkdown(text)}`,
        "text/plain": plainText(`${tableText(t)}\n\n${text}`),
      });
    })();
  const toCSV = () => _csv(STAKES_CSV_HEAD, stakesRows(get()));
  return Object.freeze({
    [DISPLAY]: show,
    result: get,
    toJSON: () => get().toJSON(),
    spec: getSpec,
    table,
    sentence: () => sentence,
    toMarkdown: () => `${tableMarkdown(table())}\n\n${escapeMarkdown(sentence.text)}`,
    toCSV,
    save: (path: string) =>
      saveDisplay(path, {
        what: title(),
        bundle: show,
        json: () => get().toJSON(),
        csv: toCSV,
        ...files,
      }),
  });
}
