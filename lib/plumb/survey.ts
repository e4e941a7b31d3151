/**
 * `survey(table)`: every numeric column screened at once, one row each,
 * with multiplicity-adjusted p-values, sorted by departure.
 *
 * @module
 */
import type { Table } from "../data/table.ts";
import { refuseCensored } from "./_censored_guard.ts";
import { PlumbError } from "../errors.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../render/display.ts";
import { formatCount, formatP } from "../render/format.ts";
import { qqSparkline } from "../render/sparkline.ts";
import { tableMarkdown, type TableModel } from "../render/table.ts";
import { type Adjustment, adjustPValues } from "../stats/multiplicity.ts";
import { analyse, ANALYSE_MIN_N, type Analysis } from "./analysis.ts";
import { VERDICT_SHORT } from "./reading.ts";
import { _csv } from "./_csv.ts";
import {
  blanks,
  SUMMARY_COLUMNS,
  SUMMARY_HEAD,
  summaryCells,
  summaryValues,
  tableBundle,
} from "./_rows.ts";
import { suggestReexpression } from "./reexpress_view.ts";
import { type PlumbSource, toTable } from "./source.ts";

/** Options for {@linkcode survey}. */
export interface SurveyOptions {
  /**
   * The columns to screen.
   * @default every numeric column
   */
  readonly columns?: readonly string[];
  /**
   * p-value adjustment across the columns screened.
   * @default "holm"
   */
  readonly adjust?: Adjustment;
  /**
   * Leave out text cells in numeric columns (counted in each row) instead of
   * listing such columns as not screened.
   * @default false
   */
  readonly dropText?: boolean;
}

/** One column's row. */
export interface SurveyRow {
  readonly column: string;
  readonly missing: number;
  readonly textDropped: number;
  readonly analysis?: Analysis;
  readonly adjustedP?: number;
  /** The suggested re-expression's formula, or `"none"`. */
  readonly suggestion?: string;
  /** Why the column was not screened. */
  readonly skipped?: string;
}

/** The survey as plain data. */
export interface SurveyResult {
  readonly source: string;
  readonly adjust: Adjustment;
  readonly rows: readonly SurveyRow[];
  /** Text columns, not screened (they can group: `.by(column)`). */
  readonly textColumns: readonly string[];
}

const _RANK = { "clear-departure": 0, "mild-departure": 1, "no-clear-departure": 2 } as const;
const _ADJ: Record<Adjustment, string> = {
  holm: "Holm",
  bh: "Benjamini–Hochberg",
  none: "unadjusted",
};

/**
 * A survey of a table's numeric columns. Create it with {@linkcode survey}.
 *
 * @example
 * ```ts
 * import { survey } from "./survey.ts";
 * const s = survey({ a: [1, 2, 3, 4, 5, 6, 7, 8], b: [1, 1, 2, 3, 5, 8, 13, 21] });
 * if (!s.toCSV().startsWith("column,n,missing")) throw new Error("csv");
 * ```
 */
export class Survey implements Displayable {
  readonly #table: Table;
  readonly #options: SurveyOptions;
  #result: SurveyResult | undefined;

  /** @internal Use {@linkcode survey}. */
  constructor(table: Table, options: SurveyOptions) {
    const adjust = options.adjust ?? "holm";
    if (!["holm", "bh", "none"].includes(adjust)) {
      throw new PlumbError(
        "bad-option",
        `Unknown adjustment "${String(adjust)}": use "holm", "bh" or "none"`,
      );
    }
    for (const c of options.columns ?? []) {
      if (!table.has(c)) {
        throw new PlumbError("unknown-column", `No column named ${JSON.stringify(c)} to survey`);
      }
    }
    this.#table = table;
    this.#options = options;
    Object.freeze(this);
  }

  /** The survey as plain data (computed once). */
  result(): SurveyResult {
    if (this.#result) return this.#result;
    const t = this.#table;
    const adjust = this.#options.adjust ?? "holm";
    const names = this.#options.columns ? [...this.#options.columns] : t.numericNames();
    const rows: SurveyRow[] = [];
    for (const name of names) {
      const info = t.info(name);
      const missing = info.provenance.missing;
      if (info.kind !== "numeric") {
        rows.push({ column: name, missing, textDropped: 0, skipped: `a ${info.kind} column` });
        continue;
      }
      let col;
      try {
        col = t.numeric(name, { dropText: this.#options.dropText ?? false });
        refuseCensored(col, name);
      } catch (e) {
        if (e instanceof PlumbError && (e.code === "non-numeric" || e.code === "censored")) {
          rows.push({ column: name, missing, textDropped: 0, skipped: `${e.message}` });
          continue;
        }
        throw e;
      }
      const v = col.values;
      if (v.length < ANALYSE_MIN_N) {
        rows.push({
          column: name,
          missing,
          textDropped: col.provenance.textDropped,
          skipped: `only ${v.length} values`,
        });
        continue;
      }
      try {
        const a = analyse(v, {
          label: name,
          column: name,
          missingDropped: col.provenance.missingDropped,
          textDropped: col.provenance.textDropped,
          rows: col.rowIndex.map((r) => r + 1),
        });
        const suggestion = a.reading.verdict === "no-clear-departure"
          ? "none needed"
          : suggestReexpression(v, name);
        rows.push({
          column: name,
          missing,
          textDropped: col.provenance.textDropped,
          analysis: a,
          suggestion,
        });
      } catch (e) {
        if (e instanceof PlumbError && e.code === "constant") {
          rows.push({
            column: name,
            missing,
            textDropped: col.provenance.textDropped,
            skipped: "every value is the same",
          });
        } else if (e instanceof PlumbError) {
          // One column the methods cannot handle must not stop the survey of the rest.
          rows.push({
            column: name,
            missing,
            textDropped: col.provenance.textDropped,
            skipped: e.message,
          });
        } else throw e;
      }
    }
    const tested = rows.filter((r) => r.analysis);
    const adj = adjustPValues(tested.map((r) => r.analysis!.primary.pValue), adjust);
    tested.forEach((r, k) => ((r as { adjustedP?: number }).adjustedP = adj[k]));
    rows.sort((a, b) => {
      if (!a.analysis || !b.analysis) return (a.analysis ? 0 : 1) - (b.analysis ? 0 : 1);
      return _RANK[a.analysis.reading.verdict] - _RANK[b.analysis.reading.verdict] ||
        a.analysis.primary.statistic - b.analysis.primary.statistic;
    });
    this.#result = Object.freeze({
      source: t.source,
      adjust,
      rows: Object.freeze(rows.map((r) => Object.freeze(r))),
      textColumns: Object.freeze(t.textNames()),
    });
    return this.#result;
  }

  /** The table model shown (and exported). */
  table(): TableModel {
    const r = this.result();
    const rows = r.rows.map((row) => {
      const a = row.analysis;
      if (!a) {
        return [
          row.column,
          "",
          formatCount(row.missing),
          ...blanks(7),
          `not screened: ${row.skipped}`,
          "",
          "",
        ];
      }
      return [
        row.column,
        formatCount(a.n),
        formatCount(row.missing) + (row.textDropped ? ` + ${row.textDropped} text` : ""),
        ...summaryCells(a),
        formatP(row.adjustedP!),
        VERDICT_SHORT[a.reading.verdict],
        row.suggestion ?? "",
        { text: "", html: qqSparkline(a.qq, { title: `QQ sparkline of ${row.column}` }) },
      ];
    });
    const notes = [
      `Sorted by departure (clear first, then by W). p: Shapiro–Wilk; adjusted p: ${
        _ADJ[r.adjust]
      } across ${r.rows.filter((x) => x.analysis).length} columns.`,
    ];
    if (r.textColumns.length) {
      notes.push(
        `Text columns, not screened (use them to group with .by()): ${r.textColumns.join(", ")}.`,
      );
    }
    return {
      caption: `Survey of ${r.source}`,
      columns: [
        { title: "column" },
        { title: "n", align: "right" },
        { title: "missing", align: "right" },
        ...SUMMARY_COLUMNS,
        { title: `adj. p`, align: "right" },
        { title: "reading" },
        { title: "suggested re-expression of x" },
        { title: "QQ" },
      ],
      rows,
      notes,
    };
  }

  /** CSV with unrounded numbers. */
  toCSV(): string {
    const r = this.result();
    const head = [
      "column",
      "n",
      "missing",
      "text_dropped",
      ...SUMMARY_HEAD,
      "adjusted_p",
      "adjustment",
      "verdict",
      "suggestion",
      "note",
    ];
    const lines = r.rows.map((row) => {
      const a = row.analysis;
      const start = [row.column, a ? a.n : "", row.missing, row.textDropped];
      return a
        ? [
          ...start,
          ...summaryValues(a),
          row.adjustedP,
          r.adjust,
          a.reading.verdict,
          row.suggestion,
          "",
        ]
        : [...start, ...blanks(7), r.adjust, "", "", row.skipped];
    });
    return _csv(head, lines);
  }

  /** Markdown table. */
  toMarkdown(): string {
    return tableMarkdown(this.table());
  }

  /** Plain data. */
  toJSON(): SurveyResult {
    return this.result();
  }

  /** The table, with a sparkline per row. */
  [DISPLAY](): MimeBundle {
    return tableBundle(this.table());
  }
}

/**
 * Screen every numeric column of a table (or those named).
 *
 * @param source a table from `loadTable`, or in-memory data
 * @param options columns, adjustment, text-cell handling
 *
 * @example
 * ```ts
 * import { survey } from "./survey.ts";
 * const s = survey({ a: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], b: [1, 1, 2, 3, 5, 8, 13, 21, 34, 55] });
 * if (s.result().rows.length !== 2) throw new Error("rows");
 * ```
 */
export function survey(source: PlumbSource, options: SurveyOptions = {}): Survey {
  return new Survey(toTable(source), options);
}
