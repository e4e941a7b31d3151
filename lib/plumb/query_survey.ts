/**
 * `survey()` over a query source: every numeric column screened by the
 * engine (and every text column that reads mostly as numbers, by the
 * in-memory rule), shown and exported like the in-memory survey.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import type { QueryColumn, QueryCounts, QueryEngine } from "../results/query_source.ts";
import { checkAdjustment } from "../stats/multiplicity.ts";
import { suggestReexpression } from "./reexpress_view.ts";
import { Survey } from "./survey.ts";
import {
  type SurveyOmission,
  type SurveyOptions,
  type SurveyResult,
  surveyResult,
  type SurveyRow,
} from "./survey_screen.ts";
import { _why } from "./query_groups.ts";
import { _kind } from "../data/_build_table.ts";
import {
  type HeaderFacts,
  IDENTIFIER_MIN_ROWS,
  type IdentifierColumn,
  identifierOf,
  identifierOmission,
  rowNameHeader,
} from "./identifiers.ts";

function _kindOf(cols: readonly QueryColumn[], name: string): QueryColumn["kind"] {
  return cols.find((k) => k.name === name)!.kind;
}

/**
 * Every numeric column of a query source screened (or those named). Create
 * it with `survey(scan(...))`.
 */
export class QuerySurvey implements Displayable {
  readonly #engine: QueryEngine;
  readonly #options: SurveyOptions;
  #survey: Promise<Survey> | undefined;

  /** @internal Use `survey(source)`. */
  constructor(engine: QueryEngine, options: SurveyOptions) {
    checkAdjustment(options.adjust);
    this.#engine = engine;
    this.#options = options;
    Object.freeze(this);
  }

  /** The survey, ready to show and export like the in-memory one. */
  survey(): Promise<Survey> {
    return (this.#survey ??= this.#run());
  }

  async #run(): Promise<Survey> {
    const o = this.#options;
    const cols = await this.#engine.columns();
    // Text columns are counted too: one that reads mostly as numbers is screened as in memory.
    const textual = cols.filter((k) => k.kind === "text").map((k) => k.name);
    const given = typeof o.columns === "string" ? [o.columns] : o.columns;
    for (const c of given ?? []) {
      if (!cols.some((k) => k.name === c)) {
        throw new PlumbError("unknown-column", `No column named ${JSON.stringify(c)} to survey`);
      }
    }
    // Every column named, numeric or text is counted once (one pass), so that those not
    // screened still report their empty and text cells, and columns with no value are left out.
    const asked = cols.map((k) => k.name).filter((n) =>
      given?.includes(n) || (given === undefined && _kindOf(cols, n) === "numeric") ||
      textual.includes(n)
    );
    const counts = new Map((await this.#engine.counts(asked)).map((c) => [c.column, c]));
    // The in-memory rule (lib/data/_build_table.ts): numeric when there is at least one
    // number and fewer text cells than numbers; empty when every cell is missing.
    const kind = (name: string) => {
      const c = counts.get(name)!;
      return _kindOf(cols, name) === "text" ? _kind(c.rows - c.missing - c.text, c.text) : null;
    };
    // A string is one column; a name given twice is screened once (`repeated` says so).
    const names: string[] = [];
    const repeated: string[] = [];
    const numeric = cols.map((k) => k.name).filter((n) =>
      _kindOf(cols, n) === "numeric" || kind(n) === "numeric"
    );
    for (const c of given ?? numeric) {
      if (!names.includes(c)) names.push(c);
      else if (!repeated.includes(c)) repeated.push(c);
    }
    const omitted: SurveyOmission[] = [];
    if (given === undefined) {
      for (const c of counts.values()) {
        if (c.missing === c.rows) omitted.push({ column: c.column, reason: "every cell is empty" });
      }
    }
    if (given === undefined && !o.identifiers) {
      for (const id of await this.#identifiers(cols, names, counts)) {
        omitted.push(identifierOmission(id));
      }
    }
    const rows: SurveyRow[] = [];
    const wanted: string[] = [];
    for (const name of names) {
      const c = cols.find((k) => k.name === name)!;
      const { missing } = counts.get(name)!;
      if (omitted.some((o) => o.column === name)) continue;
      if (c.kind === "numeric" || kind(name) === "numeric") wanted.push(name);
      else if (kind(name) === "text") {
        rows.push({ column: name, missing, textDropped: 0, skipped: "a text column" });
      } else rows.push({ column: name, missing, textDropped: 0, skipped: `a ${c.type} column` });
    }
    const screened = await this.#engine.screen(
      wanted.map((column) => ({ column, label: column, dropText: o.dropText })),
    );
    wanted.forEach((column, i) => {
      const s = screened[i];
      if (s instanceof Error) {
        const { rows: all, missing, text } = counts.get(column)!;
        const dropped = o.dropText ? text : 0;
        rows.push({
          column,
          missing,
          textDropped: dropped,
          skipped: _why(s, all - missing - text),
        });
        return;
      }
      const a = s.analysis;
      rows.push({
        column,
        missing: a.origin.missingDropped,
        textDropped: a.origin.textDropped,
        analysis: a,
        suggestion: a.reading.verdict === "no-clear-departure"
          ? "none needed"
          : a.reading.facts.reexpressionHelps
          ? suggestReexpression(s.sample)
          : `none: the departure comes from ${a.reading.reason}`,
      });
    });
    const text = textual.filter((c) => kind(c) === "text");
    const result = surveyResult(
      this.#engine.name,
      checkAdjustment(o.adjust),
      rows,
      text,
      repeated,
      omitted,
    );
    return new Survey(result, o);
  }

  /**
   * The columns to leave out as row identifiers, by the in-memory rules
   * (`identifiers.ts`): the counts and ranges already read rule out most
   * columns (a run k … k + n − 1 has no empty or text cell and spans n − 1),
   * and the engine reads the row order of the few left, in one pass.
   */
  async #identifiers(
    cols: readonly QueryColumn[],
    names: readonly string[],
    counts: ReadonlyMap<string, QueryCounts>,
  ): Promise<IdentifierColumn[]> {
    if (this.#engine.rowRuns === undefined) return [];
    const first = cols[0]?.name;
    // DuckDB's CSV reader names a column with an empty header column0 (the first) (checked
    // with DuckDB 1.5.6): the unnamed row-name column many exports write.
    const facts = (name: string): HeaderFacts => {
      const empty = name === first && name === "column0";
      return { first: name === first, header: empty ? "" : name, emptyHeader: empty };
    };
    const candidates = names.filter((name) => {
      const c = counts.get(name)!;
      if (c.missing > 0 || c.text > 0 || c.rows < IDENTIFIER_MIN_ROWS) return false;
      return c.range === undefined || c.range[1] - c.range[0] === c.rows - 1 ||
        rowNameHeader(facts(name));
    });
    if (candidates.length === 0) return [];
    const increasing = candidates.filter((n) => rowNameHeader(facts(n)));
    const runs = await this.#engine.rowRuns(candidates, increasing);
    return runs.flatMap((run) => identifierOf(run, facts(run.name)) ?? []);
  }

  /** The survey as plain data. */
  async result(): Promise<SurveyResult> {
    return (await this.survey()).result();
  }

  /** CSV with unrounded numbers. */
  async toCSV(): Promise<string> {
    return (await this.survey()).toCSV();
  }

  /** Markdown table. */
  async toMarkdown(): Promise<string> {
    return (await this.survey()).toMarkdown();
  }

  /** The table, with a sparkline per row. */
  async [DISPLAY](): Promise<MimeBundle> {
    return await (await this.survey())[DISPLAY]();
  }
}
