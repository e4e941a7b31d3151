/**
 * `plumb(source, column)`: the chain over one numeric variable. Each method returns a new frozen
 * object and computes nothing: the work runs on the first display or the first read, once, and is
 * kept by the object that did it, so later reads (and chains built on it) reuse it.
 *
 * Kept in one file because the chain's caches are one class's private state.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import type { ReexpressionRanking, ReexpressionSearch } from "../reexpress/candidates.ts";
import type { Reexpression } from "../reexpress/reexpression.ts";
import { rankReexpressions, testRanking } from "../reexpress/search.ts";
import { type Chart, chart } from "../render/chart_bundle.ts";
import { histogramSpec } from "../render/histogram_spec.ts";
import { detrendedSpec, qqSpec } from "../render/qq_spec.ts";
import type { Analysis } from "../results/analysis.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import type { Reading } from "../results/reading.ts";
import { stakes, type StakesOptions } from "../stakes/stakes.ts";
import { histogramData, type HistogramOptions } from "../stats/histogram_data.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { loadColumn, type Loaded, loadResiduals } from "./_loaded.ts";
import { cardOf, checkScreenable } from "./analysis.ts";
import { withEnvelope } from "./screening.ts";
import * as chain from "./_chain_values.ts";
import { saveCard } from "./card_save.ts";
import type { GroupOptions } from "./group_screen.ts";
import { CELL_SEPARATOR, groupColumns } from "./group_split.ts";
import * as order from "./serial_check.ts";
import { PlumbGroups } from "./groups.ts";
import { lambdaExplorer } from "./lambda_view.ts";
import { type CandidatesView, candidatesView } from "./reexpress_view.ts";
import { chooseBestStep } from "./best_choice.ts";
import * as fitting from "./residual_link.ts";
import type { LinearModelFit } from "../stats/linear_model.ts";
import { type Sentence, sentenceOf, type SentenceOptions, writeSentence } from "./sentence.ts";
import * as checked from "./_chain_options.ts";
import { _applyStep } from "./_apply_step.ts";
import type { PlumbOptions } from "./_chain_options.ts";
import { checkRequest, type ReexpressRequest, resolveStep, type Step } from "./steps.ts";
import type { ReexpressionChoice } from "./steps.ts";
import { stepLabel, stepsData } from "./steps.ts";
import { stakesOptions, stakesStep, type StakesView, stakesView } from "./stakes_view.ts";
import { type TestsTable, testsView } from "./tests_view.ts";

export type { PlumbOptions } from "./_chain_options.ts";

export type { ReexpressionChoice } from "./steps.ts";
export { plumb } from "./plumb_entry.ts";

/** Where a chain's values come from: the same for every chain built from one `plumb()`. */
export interface _Root {
  readonly table: Table;
  readonly column: string;
  readonly options: PlumbOptions;
  readonly order?: order.OrderRequest;
}

/**
 * The chain over one numeric variable. Create it with {@linkcode plumb}.
 *
 * @example
 * ```ts
 * import { plumb } from "@plumbline/plumbline";
 * const p = plumb([2.1, 2.9, 3.2, 3.3, 3.8, 4.1, 4.4, 5.0, 5.6, 7.9], "gap");
 * const q = p.reexpress("log");
 * if (p.label !== "gap" || q.label !== "ln(gap)" || q === p) throw new Error("chain");
 * ```
 */
export class Plumb implements Displayable {
  readonly #root: _Root;
  readonly #parent: Plumb | undefined;
  readonly #request: ReexpressRequest | undefined;
  readonly #model: fitting.ResidualLink | undefined;
  // Kept on first need; undefined means not yet computed.
  #step: Step | null | undefined;
  #bestNote: string | undefined;
  #loaded: Loaded | undefined;
  #analysis: Analysis | undefined;
  #ranking: ReexpressionRanking | undefined;
  #search: ReexpressionSearch | undefined;
  #candidates: CandidatesView | undefined;
  #lambda: Chart | undefined;
  #charts: { qq?: Chart; detrended?: Chart; histogram?: Chart } = {};
  #tests: TestsTable | undefined;
  #sentence: Sentence | undefined;
  #stakes: StakesView | undefined;
  #card: Promise<MimeBundle> | undefined;
  #sequence: Chart | undefined;

  /** @internal Use {@linkcode plumb}. */
  constructor(root: _Root, parent?: Plumb, request?: ReexpressRequest | fitting.ResidualLink) {
    this.#root = root;
    this.#parent = parent;
    this.#model = request instanceof fitting.ResidualLink ? request : undefined;
    this.#request = request instanceof fitting.ResidualLink ? undefined : request;
    Object.freeze(this);
  }

  /** The column analysed. */
  get column(): string {
    return this.#root.column;
  }

  /**
   * What is analysed, with any re-expression: e.g. `"ln(oxygen_ppb + 2)"`.
   * Reading it resolves the chain's re-expressions (a `"best"` runs its search).
   */
  get label(): string {
    if (this.#parent === undefined) return this.#root.column;
    if (this.#model) return `studentised residuals of ${this.#fitted().formula}`;
    const step = this.#resolved();
    const label = this.#parent.label;
    return step === null ? label : step.formula.replace(/\bx\b/, () => label);
  }

  /** The re-expressions applied so far, in order (resolved on first read). */
  get steps(): readonly Step[] {
    if (this.#parent === undefined) return [];
    if (this.#model) return this.#parent.steps;
    const step = this.#resolved();
    return step === null ? this.#parent.steps : [...this.#parent.steps, step];
  }

  /** What this chain's `.reexpress()` request became, or `null` on the chain `plumb()` made. */
  get choice(): ReexpressionChoice | null {
    if (this.#parent === undefined || this.#request === undefined) return null;
    const step = this.#resolved(), request = this.#request;
    const reason = request === "best" ? this.#bestNote : step?.note;
    return Object.freeze({
      request,
      reexpression: step?.reexpression ?? null,
      reason: reason ?? "as requested",
    });
  }

  /** The values analysed (after any re-expression); a fresh copy; a censored value is its limit. */
  values(): Float64Array {
    return this.#load().values.slice();
  }

  /** Each value's side when any is censored (0 measured, −1 below, 1 above its limit), or `null`. */
  censor(): Int8Array | null {
    return this.#load().censor?.slice() ?? null;
  }

  #resolved(): Step | null {
    if (this.#step !== undefined) return this.#step;
    const parent = this.#parent!, request = this.#request!, values = parent.#load().values;
    if (request !== "best") return (this.#step = resolveStep(request, values));
    // kept as they are when a power cannot help or no candidate is adequate
    const best = chooseBestStep(values, parent.analysis().reading, parent.#ranked());
    this.#bestNote = best.note;
    return (this.#step = best.step ?? null);
  }

  #fitted(): fitting.ResidualValues {
    return this.#model!.of(() => {
      const from = this.#parent!.#load();
      return { values: from.values, rows: from.rows(), label: this.#parent!.label };
    });
  }

  /** A residual chain's envelope, simulated on its design (Atkinson 1981). */
  #envelope = (level?: number) => fitting.envelopeOf(this.#fitted().fit, level);

  #load(): Loaded {
    if (this.#loaded) return this.#loaded;
    if (this.#model) {
      this.#parent!.#measured(chain.REFUSALS.model);
      this.#loaded = loadResiduals(this.#parent!.#load(), this.#fitted());
    } else if (this.#parent === undefined) {
      const { table, column, options } = this.#root;
      this.#loaded = loadColumn(table, column, options.dropText ?? false);
    } else {
      const from = this.#parent.#load();
      const { table, column } = this.#root;
      const at = { column, rowLabel: from.rowLabel, lineOf: (r: number) => table.lineOf(r) };
      const apply = (s: Step, x: Float64Array) => _applyStep(s, x, at);
      this.#loaded = chain.stepValues(from, this.#resolved(), apply);
    }
    return this.#loaded;
  }

  /** The candidates ranked (cheap: one sort, one pass each); enough for a choice. */
  #ranked(): ReexpressionRanking {
    return (this.#ranking ??= rankReexpressions(this.#measured(chain.REFUSALS.search)));
  }

  /** The values, for a step that needs every one measured (refused when any is censored). */
  #measured(refusal: chain.CensoredRefusal): Float64Array {
    return chain.refuseCensored(this.#load(), this.label, this.#root.column, refusal);
  }

  /** The ranked candidates re-tested, for the candidates panel. */
  #searched(): ReexpressionSearch {
    return (this.#search ??= testRanking(this.#load().values, this.#ranked()));
  }

  /** The full analysis as plain data (computed once). */
  analysis(): Analysis {
    if (this.#analysis) return this.#analysis;
    const loaded = this.#load();
    const { values, missing, text } = loaded;
    checkScreenable(this.label, values, missing, text);
    const model = this.#model ? this.#fitted() : undefined;
    const serial = order.serialOf(this.#root, loaded, model && fitting.basisOf(model));
    const a = chain.analyseValues(loaded, {
      label: this.label,
      column: this.#root.column,
      transform: this.steps.length ? stepLabel(this.#root.column, this.steps) : undefined,
      notes: order.notesWith(model?.notes ?? this.#keptNote(), serial),
    }, {
      qq: this.#root.options.qq,
      envelope: model && this.#envelope(this.#root.options.qq?.level),
    });
    return (this.#analysis = serial ? Object.freeze({ ...a, serial }) : a);
  }

  /** Why a `"best"` request kept the data as they are: the reading's first point. */
  #keptNote(): string[] | undefined {
    const c = this.#request === "best" ? this.choice : null;
    return c && c.reexpression === null ? [c.reason] : undefined;
  }

  /** The reading (shape in words). */
  reading(): Reading {
    return this.analysis().reading;
  }

  /** These values screened within each group of a column, or each cell of several (`.by([a, b])`). */
  by(columns: string | readonly string[], options: GroupOptions | null = {}): PlumbGroups {
    options = checked.groupOptions(options);
    const { table, column: variable, options: own } = this.#root;
    const cols = groupColumns(table, columns);
    return new PlumbGroups({
      table,
      column: variable,
      steps: () => this.steps,
      options: { dropText: own.dropText, qq: own.qq },
      groupBy: cols.join(CELL_SEPARATOR),
      groupColumns: cols,
      order: this.#root.order,
      values: this.#model && (() => fitting.givenValues(this.#load(), this.label, this.#fitted())),
      groupOptions: options,
      stakesModel: () =>
        this.#parent === undefined ? undefined : this.#stakesModel({}) as Reexpression,
      reexpressed: this.#parent !== undefined,
    });
  }

  /**
   * A new chain on the re-expressed values. With no argument, or `"best"`:
   * the first of the ranked candidates (see {@linkcode Plumb.candidates}),
   * which may be the data as they are; `.choice` says what was chosen and why.
   */
  reexpress(request: ReexpressRequest = "best"): Plumb {
    if (this.#model) fitting.refuseAfterResiduals(".reexpress()");
    checkRequest(request);
    return new Plumb(this.#root, this, request);
  }

  /**
   * A chain over the externally studentised residuals of a least-squares fit of these values on
   * other columns (complete rows; `.values()` in their order; QQ envelope simulated on the design).
   *
   * @param request the covariates, factors and interactions, by column name
   * @example
   * ```ts
   * import { plumb } from "@plumbline/plumbline";
   * const t = { fill: [5.1, 7.2, 5.8, 9.1, 8.2, 11.3, 9.7, 13.1, 12.2, 14.8], temp: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] };
   * const r = plumb(t, "fill").residuals({ covariates: ["temp"] }); // fill ~ temp
   * if (r.values().length !== 10 || r.model().dfResidual !== 8) throw new Error("residuals");
   * ```
   */
  residuals(request: fitting.ResidualRequest = {}): Plumb {
    if (this.#model) fitting.refuseAfterResiduals(".residuals()");
    const { table, column } = this.#root;
    return new Plumb(this.#root, this, new fitting.ResidualLink(table, request, column));
  }

  /** The least-squares fit behind a chain made by `.residuals()`. */
  model(): LinearModelFit {
    if (!this.#model) fitting.refuseWithoutModel(this.label);
    return this.#fitted().fit;
  }

  /** The ranked re-expression candidates, each re-tested: displayable and exportable. */
  candidates(): CandidatesView {
    return (this.#candidates ??= candidatesView(
      () => this.#load().values,
      () => this.#searched(),
      () => this.label,
    ));
  }

  /** The QQ plot with its envelope, as a displayable chart. */
  qq(options: QqOptions | null = {}): Chart {
    options = checked.qqOptions(options, ".qq()");
    return this.#chart("qq", options, qqSpec);
  }

  /** The values (or residuals) in the order named by `plumb(…, { order })`, with the median. */
  sequence(): Chart {
    if (!this.#root.order) order.refuseNoOrder(this.label);
    return (this.#sequence ??= order.sequenceChart(() => this.analysis().serial!, this.label));
  }

  /** The detrended QQ plot (deviation from the line, with the envelope). */
  detrended(options: QqOptions | null = {}): Chart {
    options = checked.qqOptions(options, ".detrended()");
    return this.#chart("detrended", options, detrendedSpec);
  }

  #chart(kind: "qq" | "detrended", options: QqOptions, draw: typeof qqSpec): Chart {
    const own = Object.keys(options).length === 0;
    if (own && this.#charts[kind]) return this.#charts[kind]!;
    const slope =
      () => (this.#load().censor ? undefined : this.analysis().reading.facts.sigma.slope);
    const spec = (q: Analysis["qq"]) => draw(q, { name: this.label, slope: slope() });
    const c = chart(() => {
      if (own) return spec(this.analysis().qq);
      const merged = { ...this.#root.options.qq, ...options };
      const q = chain.qqOfValues(this.#load(), merged, this.label); // a residual chain keeps its simulated envelope
      return spec(this.#model ? withEnvelope(q, this.#envelope(merged.level)(q.rank)) : q);
    });
    if (own) this.#charts[kind] = c;
    return c;
  }

  /** The histogram with the fitted normal curve. */
  histogram(options: HistogramOptions | null = {}): Chart {
    options = checked.histogramOptions(options);
    const own = Object.keys(options).length === 0;
    if (own && this.#charts.histogram) return this.#charts.histogram;
    const c = chart(() =>
      histogramSpec(
        own
          ? this.analysis().histogram
          : histogramData(chain.measuredValues(this.#load()), options),
        { name: this.label },
      )
    );
    if (own) this.#charts.histogram = c;
    return c;
  }

  /** Every normality test, as a displayable table with `toCSV()` / `toMarkdown()`. */
  tests(): TestsTable {
    return (this.#tests ??= testsView(() => this.analysis()));
  }

  /** The λ explorer for Box–Cox (or Yeo–Johnson when values are not all positive). */
  lambda(): Chart {
    const values = () => this.#measured(chain.REFUSALS.lambda);
    return (this.#lambda ??= lambdaExplorer(values, () => this.label));
  }

  /** The write-up paragraph. */
  sentence(options: SentenceOptions | null = {}): Sentence {
    options = checked.sentenceOptions(options);
    const make = () => sentenceOf(() => writeSentence(this.analysis(), options));
    if (Object.keys(options).length > 0) return make();
    return (this.#sentence ??= make());
  }

  /**
   * What the departure from normality changes for the next figure: central
   * range, share outside `lower` / `upper` and Cpk, the mean's interval,
   * each the normal-theory way, on a re-expression mapped back, and without
   * a model, in original units. After `.reexpress(...)` the chain's
   * re-expression is used; otherwise the ranked candidates' first.
   *
   * @param options coverage (default 0.95), lower and upper limits, levels, bootstrap seed
   */
  stakes(options: StakesOptions = {}): StakesView {
    if (this.#model) fitting.refuseAfterResiduals(".stakes()");
    const opts = stakesOptions(options, this.#parent !== undefined, ".stakes()");
    const own = Object.keys(opts).length === 0;
    if (own && this.#stakes) return this.#stakes;
    const view = stakesView(
      () => {
        const values = this.#origin().#measured(chain.REFUSALS.stakes);
        return stakes(values, { ...opts, reexpression: this.#stakesModel(opts) });
      },
      () => this.#root.column,
    );
    if (own) this.#stakes = view;
    return view;
  }

  /** The chain plumb() made, whose values are in original units. */
  #origin(): Plumb {
    return this.#parent === undefined ? this : this.#parent.#origin();
  }

  /** The re-expression behind the stakes' re-expressed figures. */
  #stakesModel(opts: StakesOptions): StakesOptions["reexpression"] {
    if (this.#parent === undefined) {
      return opts.reexpression ?? this.#ranked().chosen.reexpression;
    }
    return stakesStep(this.steps, this.label);
  }

  /** The analysis as plain data, with the re-expressions applied. */
  toJSON(): Analysis & { readonly steps: readonly Omit<Step, "apply">[] } {
    return { ...this.analysis(), steps: stepsData(this.steps) };
  }

  /** Write the card to a file by extension: .html .md .txt .json, .svg/.png (its two charts). */
  readonly save = (path: string): ReturnType<typeof saveCard> => saveCard(path, this);

  /** The card: label, counts, reading, QQ plot and histogram, tests, cautions. */
  [DISPLAY](): Promise<MimeBundle> {
    return (this.#card ??= cardOf(this.analysis(), this.label));
  }
}
