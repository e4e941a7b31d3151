/**
 * `plumb(source, column)`: the chain over one numeric variable. Each method
 * returns a new frozen object; the analysis runs once, on first display or
 * first read, and is cached.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { refuseCensored } from "./_censored_guard.ts";
import { PlumbError } from "../errors.ts";
import { type Chart, chart, chartBundle } from "../render/chart_bundle.ts";
import { cardBundle } from "../render/card.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { detrendedSpec, qqSpec } from "../render/qq_spec.ts";
import { histogramSpec } from "../render/histogram_spec.ts";
import { testsTable } from "../render/analysis_tables.ts";
import { tableHtml, tableMarkdown, tableText } from "../render/table.ts";
import { histogramData, type HistogramOptions } from "../stats/histogram_data.ts";
import { qqData, type QqOptions } from "../stats/qq_data.ts";
import { analyse, ANALYSE_MIN_N } from "./analysis.ts";
import type { Analysis } from "../results/analysis.ts";
import { type ReexpressRequest, resolveStep, type Step, stepLabel } from "./steps.ts";
import { pickColumn, type PlumbSource, toTable } from "./source.ts";
import { type Sentence, sentenceOf, type SentenceOptions, writeSentence } from "./sentence.ts";
import { type CandidatesView, chooseBest, reexpressionTable } from "./reexpress_view.ts";
import { lambdaExplorer } from "./lambda_view.ts";
import type { GroupOptions } from "./group_screen.ts";
import { PlumbGroups } from "./groups.ts";
import { _csv } from "./_csv.ts";

/** Options for {@linkcode plumb}. */
export interface PlumbOptions {
  /**
   * Leave out text cells of the column (counted in every output) instead of
   * failing with a `"non-numeric"` error.
   * @default false
   */
  readonly dropText?: boolean;
  /**
   * QQ envelope options (level, `"pointwise"` or `"simultaneous"`).
   * @default {}
   */
  readonly qq?: QqOptions;
  /**
   * Name of the single column when the source is a plain array of numbers.
   * @default "value"
   */
  readonly name?: string;
}

interface _State {
  readonly table: Table;
  readonly column: string;
  readonly steps: readonly Step[];
  readonly options: PlumbOptions;
}

/**
 * The chain over one numeric variable. Create it with {@linkcode plumb}.
 *
 * @example
 * ```ts
 * import { plumb } from "./plumb.ts";
 * const p = plumb([2.1, 2.9, 3.2, 3.3, 3.8, 4.1, 4.4, 5.0, 5.6, 7.9], undefined, { name: "gap" });
 * const q = p.reexpress("log");
 * if (p.label !== "gap" || q.label !== "ln(gap)" || q === p) throw new Error("chain");
 * ```
 */
export class Plumb implements Displayable {
  readonly #state: _State;
  #values: Float64Array | undefined;
  #rows: Int32Array | undefined;
  #drops: { missing: number; text: number } | undefined;
  #analysis: Analysis | undefined;
  #card: Promise<MimeBundle> | undefined;

  /** @internal Use {@linkcode plumb}. */
  constructor(state: _State) {
    this.#state = state;
    Object.freeze(this);
  }

  /** The column analysed. */
  get column(): string {
    return this.#state.column;
  }

  /** What is analysed, with any re-expression: e.g. `"log(oxygen_ppb + 2)"`. */
  get label(): string {
    return stepLabel(this.#state.column, this.#state.steps);
  }

  /** The re-expressions applied so far, in order. */
  get steps(): readonly Step[] {
    return this.#state.steps;
  }

  /** The values analysed (after any re-expression); a fresh copy. */
  values(): Float64Array {
    return this.#load().slice();
  }

  #load(): Float64Array {
    if (this.#values) return this.#values;
    const { table, column, steps, options } = this.#state;
    const col = table.numeric(column, { dropText: options.dropText ?? false });
    refuseCensored(col, this.label);
    let v: Float64Array = col.values;
    for (const s of steps) v = s.apply(v);
    this.#values = v;
    this.#rows = col.rowIndex;
    this.#drops = { missing: col.provenance.missingDropped, text: col.provenance.textDropped };
    return v;
  }

  /** The full analysis as plain data (computed once). */
  analysis(): Analysis {
    if (this.#analysis) return this.#analysis;
    const v = this.#load();
    if (v.length < ANALYSE_MIN_N) {
      throw new PlumbError(
        "too-few",
        `Cannot screen ${this.label}: ${v.length} value${
          v.length === 1 ? "" : "s"
        } after leaving out ` +
          `${this.#drops!.missing} missing and ${
            this.#drops!.text
          } non-numeric cells, and at least ${ANALYSE_MIN_N} are needed`,
      );
    }
    // 1-based data rows; Int32Array.prototype.map, unlike Int32Array.from with a
    // mapping function, does not copy the input into a temporary list first.
    const rows = this.#rows!.map((r) => r + 1);
    this.#analysis = analyse(v, {
      label: this.label,
      column: this.#state.column,
      transform: this.#state.steps.length ? this.label : undefined,
      missingDropped: this.#drops!.missing,
      textDropped: this.#drops!.text,
      rows,
    }, { qq: this.#state.options.qq });
    return this.#analysis;
  }

  /** The reading (shape in words). */
  reading(): Analysis["reading"] {
    return this.analysis().reading;
  }

  /** A new chain on the same column split by a grouping column. */
  by(column: string, options: GroupOptions = {}): PlumbGroups {
    pickColumn(this.#state.table, column);
    return new PlumbGroups({ ...this.#state, groupBy: column, groupOptions: options });
  }

  /**
   * With no argument: the ranked re-expression candidates, re-tested
   * (displayable). With a request: a new chain on the re-expressed values.
   */
  reexpress(): CandidatesView;
  reexpress(request: ReexpressRequest): Plumb;
  reexpress(request?: ReexpressRequest): Plumb | CandidatesView {
    if (request === undefined) return reexpressionTable(this.#load(), this.label);
    const step = request === "best" ? chooseBest(this.#load()) : resolveStep(request, this.#load());
    if (step === undefined) return this; // the data are best left as they are
    return new Plumb({ ...this.#state, steps: [...this.#state.steps, step] });
  }

  /** The QQ plot with its envelope, as a displayable chart. */
  qq(options: QqOptions = {}): Chart {
    const q = this.#qqFor(options);
    return chart(qqSpec(q, { name: this.label }));
  }

  /** The detrended QQ plot (deviation from the line, with the envelope). */
  detrended(options: QqOptions = {}): Chart {
    const q = this.#qqFor(options);
    return chart(detrendedSpec(q, { name: this.label }));
  }

  #qqFor(options: QqOptions) {
    if (Object.keys(options).length === 0 && this.#analysis) return this.#analysis.qq;
    const values = this.#load();
    return qqData(values, {
      ...this.#state.options.qq,
      ...options,
      rows: this.#rows!.map((r) => r + 1),
    });
  }

  /** The histogram with the fitted normal curve. */
  histogram(options: HistogramOptions = {}): Chart {
    const h = Object.keys(options).length
      ? histogramData(this.#load(), options)
      : this.analysis().histogram;
    return chart(histogramSpec(h, { name: this.label }));
  }

  /** Every normality test, as a displayable table with `toCSV()` / `toMarkdown()`. */
  tests(): Displayable & { toJSON(): unknown; toMarkdown(): string; toCSV(): string } {
    const a = this.analysis();
    const model = testsTable(a.tests, `Normality tests — ${a.origin.label} (n = ${a.n})`);
    const bundle = Object.freeze({
      "text/html": tableHtml(model),
      "text/markdown": tableMarkdown(model),
      "text/plain": tableText(model),
    });
    return Object.freeze({
      [DISPLAY]: () => bundle,
      toJSON: () => a.tests,
      toMarkdown: () => bundle["text/markdown"],
      toCSV: () =>
        _csv(
          ["test", "statistic", "value", "p", "method"],
          a.tests.map((t) =>
            t.result
              ? [
                t.test,
                t.result.statisticName,
                t.result.statistic,
                t.result.pValue,
                t.result.method,
              ]
              : [t.test, "", "", "", t.skipped ?? ""]
          ),
        ),
    }) as never;
  }

  /** The λ explorer for Box–Cox (or Yeo–Johnson when values are not all positive). */
  lambda(): Chart {
    return lambdaExplorer(this.#load(), this.label);
  }

  /** The write-up paragraph. */
  sentence(options: SentenceOptions = {}): Sentence {
    return sentenceOf(writeSentence(this.analysis(), options));
  }

  /** The analysis as plain data. */
  toJSON(): unknown {
    const a = this.analysis();
    return {
      ...a,
      steps: this.#state.steps.map((s) => ({
        reexpression: s.reexpression,
        formula: s.formula,
        note: s.note,
      })),
    };
  }

  /** The card: label, counts, reading, QQ plot and histogram, tests, cautions. */
  [DISPLAY](): Promise<MimeBundle> {
    this.#card ??= (async () => {
      const a = this.analysis();
      const [qq, hist] = await Promise.all([
        chartBundle(qqSpec(a.qq, { name: this.label })),
        chartBundle(histogramSpec(a.histogram, { name: this.label })),
      ]);
      return cardBundle(a, { qq: qq["text/html"] ?? "", histogram: hist["text/html"] ?? "" });
    })();
    return this.#card;
  }
}

/**
 * Start a chain over one numeric variable.
 *
 * @param source a table from {@linkcode loadTable}, an array of numbers, or
 *   in-memory data (rows, columns, a data frame)
 * @param column the column to analyse (optional when there is only one)
 * @param options text-cell handling, envelope options, the name of a plain array
 *
 * @example
 * ```ts
 * import { plumb } from "./plumb.ts";
 * const p = plumb([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1], undefined, { name: "fill" });
 * if (p.analysis().n !== 10 || p.label !== "fill") throw new Error("chain");
 * ```
 */
export function plumb(source: PlumbSource, column?: string, options: PlumbOptions = {}): Plumb {
  const table = toTable(source, options.name ?? "value");
  const col = pickColumn(table, column);
  return new Plumb({ table, column: col, steps: [], options });
}
