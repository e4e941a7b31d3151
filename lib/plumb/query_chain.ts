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
import type { QueryEngine, QueryScreening } from "../results/query_source.ts";
import type { Reading } from "../results/reading.ts";
import { searchReexpressions } from "../reexpress/search.ts";
import { cardOf } from "./analysis.ts";
import type { GroupOptions } from "./group_screen.ts";
import { QueryGroups } from "./query_groups.ts";
import type { PlumbOptions } from "./_chain_options.ts";
import { type CandidatesView, candidatesView } from "./reexpress_view.ts";
import { type Sentence, sentenceOf, type SentenceOptions, writeSentence } from "./sentence.ts";
import { type TestsTable, testsView } from "./tests_view.ts";

function _single(s: QueryScreening | Error): QueryScreening {
  if (s instanceof Error) throw s;
  return s;
}

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

  /** @internal Use `plumb(source, column)`. */
  constructor(engine: QueryEngine, column: string | undefined, options: PlumbOptions) {
    this.#engine = engine;
    this.#column = column;
    this.#options = options;
    Object.freeze(this);
  }

  /** The column analysed: the one named, or (once screened) the source's only numeric column. */
  get column(): string {
    return this.#column ?? this.#done?.origin.column ?? "";
  }

  /** What is analysed: the column. */
  get label(): string {
    return this.column;
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
    return (this.#screened ??= this.#name().then((column) =>
      this.#engine.screen([{
        column,
        label: column,
        dropText: this.#options.dropText,
        qq: this.#options.qq,
      }])
    ).then((r) => {
      const s = _single(r[0]);
      this.#done = s.analysis;
      return s;
    }));
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
    return new QueryGroups(this.#engine, () => this.#name(), column, this.#options, options);
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
