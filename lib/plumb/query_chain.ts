/**
 * `plumb`, `survey` and `.by()` over a source whose values stay in a query
 * engine (`scan(...)`): the same analysis, reading, card, group table and
 * survey as in memory, computed by the engine from aggregates, exact order
 * statistics and a seeded sample. Reads return promises (the engine works
 * asynchronously); shown in a notebook, nothing needs awaiting.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { type Chart, chart } from "../render/chart_bundle.ts";
import { histogramSpec } from "../render/histogram_spec.ts";
import { detrendedSpec, qqSpec } from "../render/qq_spec.ts";
import type { Analysis } from "../results/analysis.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import type { QueryEngine, QueryScreening, QueryTransform } from "../results/query_source.ts";
import type { Reading } from "../results/reading.ts";
import { rankReexpressions, searchReexpressions } from "../reexpress/search.ts";
import { chooseBestStep } from "./best_choice.ts";
import { refuseOnScan, scanStepDomain } from "./query_refusals.ts";
import {
  checkRequest,
  type ReexpressionChoice,
  type ReexpressRequest,
  resolveStep,
  type Step,
  stepLabel,
  stepOf,
} from "./steps.ts";
import { reexpression } from "../reexpress/reexpression.ts";
import { cardOf } from "./analysis.ts";
import type { GroupOptions } from "./group_screen.ts";
import { QueryGroups } from "./query_groups.ts";
import type { PlumbOptions } from "./_chain_options.ts";
import { type CandidatesView, candidatesView } from "./reexpress_view.ts";
import { type Sentence, sentenceOf, type SentenceOptions, writeSentence } from "./sentence.ts";
import { type TestsTable, testsView } from "./tests_view.ts";
import { _single, _withNote } from "./_query_screening.ts";

/**
 * The chain over one column of a query source. Create it with
 * `plumb(scan(pathOrSql), column)`.
 *
 * @example
 * ```ts
 * import { plumb, scan } from "@plumbline/plumbline";
 * const src = scan("SELECT 10 + sin(i) AS fill FROM range(1, 201) t(i)", { progress: false });
 * const a = await plumb(src, "fill").analysis();
 * if (a.n !== 200 || a.subsample !== null) throw new Error("scan chain");
 * ```
 */
export class PlumbQuery implements Displayable {
  readonly #engine: QueryEngine;
  readonly #column: string | undefined;
  readonly #options: PlumbOptions;
  #picked: Promise<string> | undefined;
  #screened: Promise<QueryScreening> | undefined;
  #done: Analysis | undefined;
  #card: Promise<MimeBundle> | undefined;
  readonly #from: { readonly parent: PlumbQuery; readonly request: ReexpressRequest } | undefined;
  #transform: Promise<QueryTransform | undefined> | undefined;
  #choice: ReexpressionChoice | undefined;

  /** @internal Use `plumb(source, column)` (and `.reexpress()` for the last argument). */
  constructor(
    engine: QueryEngine,
    column: string | undefined,
    options: PlumbOptions,
    from?: { readonly parent: PlumbQuery; readonly request: ReexpressRequest },
  ) {
    this.#engine = engine;
    this.#column = column;
    this.#options = options;
    this.#from = from;
    Object.freeze(this);
  }

  /**
   * A new chain on the values re-expressed by the engine, over every value:
   * `"log"`, `"log10"`, `"sqrt"`, `"reciprocal"`, `{ boxCox: λ }`,
   * `{ yeoJohnson: λ }`, `{ log: { shift, base } }`, or `"best"` (the
   * default): the top candidate re-tested on the seeded sample, with a
   * Box–Cox λ fitted by maximum likelihood over every value.
   */
  reexpress(request: ReexpressRequest = "best"): PlumbQuery {
    checkRequest(request);
    if (this.#from !== undefined) refuseOnScan(".reexpress() twice");
    return new PlumbQuery(this.#engine, this.#column, this.#options, { parent: this, request });
  }

  /** Not offered on a scanned source: throws a `PlumbError` naming what to do instead. */
  lambda(): never {
    return refuseOnScan(".lambda()");
  }

  /** Not offered on a scanned source: throws a `PlumbError` naming what to do instead. */
  stakes(): never {
    return refuseOnScan(".stakes()");
  }

  /** Not offered on a scanned source: throws a `PlumbError` naming what to do instead. */
  residuals(): never {
    return refuseOnScan(".residuals()");
  }

  /** Not offered on a scanned source: throws a `PlumbError` naming what to do instead. */
  values(): never {
    return refuseOnScan(".values()");
  }

  /**
   * What this chain's `.reexpress()` request became and why (`null` on the
   * chain `plumb()` made), as in memory's `.choice`.
   */
  async choice(): Promise<ReexpressionChoice | null> {
    if (this.#from === undefined) return null;
    await this.#transformed();
    return this.#choice!;
  }

  /** The re-expression this chain screens (none on the chain `plumb()` made), resolved once. */
  #transformed(): Promise<QueryTransform | undefined> {
    return (this.#transform ??= this.#resolve());
  }

  async #resolve(): Promise<QueryTransform | undefined> {
    if (this.#from === undefined) return undefined;
    const { parent, request } = this.#from;
    const [s, column] = await Promise.all([parent.#screen(), this.#name()]);
    let step: Step | undefined;
    let reason: string | undefined;
    if (request === "best") {
      const best = chooseBestStep(s.sample, s.analysis.reading, rankReexpressions(s.sample));
      step = best.step;
      reason = `${best.note} (ranked on the seeded sample of ${s.sample.length})`;
      // The power chosen on the sample, with λ fitted over every value.
      if (step?.reexpression.kind === "box-cox" && s.lambda !== undefined) {
        step = stepOf(reexpression("box-cox", { lambda: s.lambda }));
        reason += `; the engine applies ${step.reexpression.label}, its λ fitted by maximum ` +
          `likelihood over every value`;
      }
    } else {
      // The sample with the extremes, so that a log's shift sees the smallest value.
      step = resolveStep(request, Float64Array.of(s.range[0], ...s.sample, s.range[1]));
    }
    this.#choice = Object.freeze({
      request,
      reexpression: step?.reexpression ?? null,
      reason: reason ?? step?.note ?? "as requested",
    });
    if (step === undefined) return undefined;
    scanStepDomain(column, step.reexpression, s.range);
    return Object.freeze({ reexpression: step.reexpression, label: stepLabel(column, [step]) });
  }

  /** The column analysed: the one named, or (once screened) the source's only numeric column. */
  get column(): string {
    return this.#column ?? this.#done?.origin.column ?? "";
  }

  /** What is analysed: the column. */
  get label(): string {
    return this.#done?.origin.label ?? this.column;
  }

  /** The column named, or the source's only numeric one. */
  #name(): Promise<string> {
    return (this.#picked ??= (async () => {
      if (this.#column !== undefined) return this.#column;
      const numeric = (await this.#engine.columns()).filter((c) => c.kind === "numeric");
      if (numeric.length === 1) return numeric[0].name;
      throw new PlumbError(
        "bad-option",
        numeric.length === 0
          ? `${this.#engine.name} has no numeric column to analyse`
          : `${this.#engine.name} has ${numeric.length} numeric columns (${
            numeric.map((c) => c.name).join(", ")
          }): name the one to analyse, e.g. plumb(source, "${numeric[0].name}")`,
      );
    })());
  }

  #screen(): Promise<QueryScreening> {
    return (this.#screened ??= (async () => {
      const [column, transform] = await Promise.all([this.#name(), this.#transformed()]);
      // "best" that keeps the data as they are: the parent's screening, not another scan,
      // with the reason as the reading's first point (as in memory).
      const s = transform === undefined && this.#from !== undefined
        ? _withNote(await this.#from.parent.#screen(), this.#choice?.reason)
        : _single(
          (await this.#engine.screen([{
            column,
            label: transform?.label ?? column,
            dropText: this.#options.dropText,
            qq: this.#options.qq,
            transform,
          }]))[0],
        );
      this.#done = s.analysis;
      return s;
    })());
  }

  /**
   * The full analysis as plain data (computed once): the same fields as in
   * memory, `subsample` stating the seeded sample behind Shapiro–Wilk,
   * Shapiro–Francia, Anderson–Darling and Lilliefors.
   */
  async analysis(): Promise<Analysis> {
    return (await this.#screen()).analysis;
  }

  /** The reading (shape in words). */
  async reading(): Promise<Reading> {
    return (await this.analysis()).reading;
  }

  /** Every normality test, as a table with `toCSV()` / `toMarkdown()`. */
  async tests(): Promise<TestsTable> {
    const a = await this.analysis();
    return testsView(() => a);
  }

  /** The QQ plot with its envelope (exact order statistics at the plotted ranks). */
  async qq(): Promise<Chart> {
    const a = await this.analysis();
    return chart(qqSpec(a.qq, { name: this.label, slope: a.reading.facts.sigma.slope }));
  }

  /** The detrended QQ plot. */
  async detrended(): Promise<Chart> {
    const a = await this.analysis();
    return chart(detrendedSpec(a.qq, { name: this.label, slope: a.reading.facts.sigma.slope }));
  }

  /** The histogram with the fitted normal curve (counts over every value). */
  async histogram(): Promise<Chart> {
    const a = await this.analysis();
    return chart(histogramSpec(a.histogram, { name: this.label }));
  }

  /** The write-up paragraph. */
  async sentence(options: SentenceOptions = {}): Promise<Sentence> {
    const a = await this.analysis();
    return sentenceOf(() => writeSentence(a, options));
  }

  /**
   * The ranked re-expression candidates, each re-tested on the seeded
   * sample (not on every value): a guide to which re-expression to try.
   */
  async candidates(): Promise<CandidatesView> {
    const { sample } = await this.#screen();
    const label = `${this.column} (seeded sample of ${sample.length})`;
    return candidatesView(() => sample, () => searchReexpressions(sample), () => label);
  }

  /** The same column screened within each group of another, and the pooled residuals. */
  by(column: string, options: GroupOptions = {}): QueryGroups {
    return new QueryGroups(
      this.#engine,
      async () => ({ column: await this.#name(), transform: await this.#transformed() }),
      column,
      this.#options,
      options,
    );
  }

  /**
   * The analysis as plain data once computed (`await p.analysis()` first);
   * before that, the column and the source with a note.
   */
  toJSON(): Analysis | {
    readonly column?: string;
    readonly source: string;
    readonly note: string;
  } {
    return this.#done ?? {
      column: this.#column,
      source: this.#engine.name,
      note: "not screened yet: await analysis() first",
    };
  }

  /** The card: label, counts, reading, QQ plot and histogram, tests, cautions. */
  [DISPLAY](): Promise<MimeBundle> {
    return (this.#card ??= this.analysis().then((a) => cardOf(a, this.label)));
  }
}
