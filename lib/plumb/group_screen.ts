/**
 * The per-group screening behind `.by(column)`, as plain data: the groups in
 * natural order, each analysed (or skipped with the reason), p-values
 * adjusted across them, and the pooled within-group residuals.
 *
 * @module
 */
import type { MergedLabel, Table } from "../data/table.ts";
import { PlumbError } from "../errors.ts";
import { optionNames } from "../results/options.ts";
import type { Analysis } from "../results/analysis.ts";
import type { Reexpression } from "../reexpress/reexpression.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { type Adjustment, checkAdjustment } from "../stats/multiplicity.ts";
import { ANALYSE_MIN_N } from "./analysis.ts";
import { analyseSides } from "./censored_analysis.ts";
import { groupCentre, stepGroup } from "./_group_values.ts";
import { groupResult } from "./_group_result.ts";
import { type Step, stepLabel } from "./steps.ts";

/** Options for `.by(column)`. */
export interface GroupOptions {
  /**
   * How p-values are adjusted across the groups: Holm (family-wise error),
   * Benjamini–Hochberg (`"bh"`, false discovery rate) or `"none"`.
   * @default "holm"
   */
  readonly adjust?: Adjustment;
}

/** Every option name of {@linkcode GroupOptions}. */
export const GROUP_OPTION_NAMES: readonly string[] = optionNames<GroupOptions>({ adjust: true });

/** What a per-group chain holds: the table, the variable and its steps, the grouping. */
export interface GroupState {
  /** The table. */
  readonly table: Table;
  /** The variable's column. */
  readonly column: string;
  /** The chain's re-expressions, resolved on first need (against the whole column). */
  readonly steps: () => readonly Step[];
  /** The chain's options: text cells, and the QQ envelope of every group and the residuals. */
  readonly options: { readonly dropText?: boolean; readonly qq?: QqOptions };
  /** The grouping column. */
  readonly groupBy: string;
  /** The options of `.by()`. */
  readonly groupOptions: GroupOptions;
  /**
   * The re-expression of the chain's `.stakes()` figures, on first need;
   * `undefined` when the chain has none, so each group uses its own ranked
   * candidates' first.
   */
  readonly stakesModel?: () => Reexpression | undefined;
  /** Whether the chain carries a `.reexpress()` (known without resolving it). */
  readonly reexpressed?: boolean;
}

/** One group's screening, or why it was not screened. */
export interface GroupRow {
  /** The group's value. */
  readonly group: string;
  /** Values in the group. */
  readonly n: number;
  /** The group's missing cells, left out. */
  readonly missingDropped: number;
  /** The group's text cells, left out on request. */
  readonly textDropped: number;
  /** The analysis, when the group has enough values. */
  readonly analysis?: Analysis;
  /** The adjusted Shapiro–Wilk p-value. */
  readonly adjustedP?: number;
  /** Why the group was not screened. */
  readonly skipped?: string;
}

/** The result of a per-group screening, as plain data. */
export interface GroupResult {
  /** The variable, with its re-expressions. */
  readonly label: string;
  /** The grouping column. */
  readonly groupBy: string;
  /** How p-values were adjusted across the groups. */
  readonly adjust: Adjustment;
  /** One row per group, in natural order (numbers by value, then text). */
  readonly groups: readonly GroupRow[];
  /** Rows with a value but no group (their group cell was missing), left out. */
  readonly noGroup: number;
  /** Missing cells of the variable, in all rows. */
  readonly missingDropped: number;
  /** Text cells of the variable left out on request, in all rows. */
  readonly textDropped: number;
  /** The pooled within-group residuals (value − group mean), analysed. */
  readonly residuals?: Analysis;
  /** Group labels written in several ways that differ only in spaces, merged into one group. */
  readonly mergedLabels: readonly MergedLabel[];
}

/** Natural order for group labels: numbers by value, then text. */
function _compare(a: string, b: string): number {
  const x = Number(a), y = Number(b);
  if (a.trim() !== "" && b.trim() !== "" && Number.isFinite(x) && Number.isFinite(y)) return x - y;
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Screen one variable within each group of a grouping column: one analysis
 * per group with enough values, adjusted p-values across the groups, and the
 * pooled within-group residuals (value − group mean) analysed.
 *
 * @param state the table, the column and its steps, the grouping column and options
 */
/** The rows of one group: where its numbers are, and the cells left out. */
export interface GroupSample {
  /** The group's value. */
  readonly group: string;
  /** The group's values in original units (before any re-expression), in row order. */
  readonly values: Float64Array;
  /** Their 0-based row indices in the table. */
  readonly rows: readonly number[];
  /** Each value's censoring side (0 measured, −1 below, 1 above its limit), when any is censored. */
  readonly censor?: Int8Array;
  /** The group's missing cells, left out. */
  readonly missingDropped: number;
  /** The group's text cells, left out on request. */
  readonly textDropped: number;
}

/** A variable split by a grouping column, groups in natural order. */
export interface GroupSplit {
  /** One entry per group, in natural order (numbers by value, then text). */
  readonly groups: readonly GroupSample[];
  /** Rows with a value but no group, left out. */
  readonly noGroup: number;
  /** Missing cells of the variable, in all rows. */
  readonly missingDropped: number;
  /** Text cells of the variable left out on request, in all rows. */
  readonly textDropped: number;
  /** Group labels merged because they differ only in spaces. */
  readonly mergedLabels: readonly MergedLabel[];
}

/**
 * Split the variable by the grouping column: the values of each group (in
 * original units), with what was left out. Raises `"non-numeric"` (naming
 * rows) unless text cells are dropped on request; a group with censored
 * values carries their sides in `censor`.
 *
 * @param state the table, the column and its steps, the grouping column and options
 */
export function splitGroups(state: GroupState): GroupSplit {
  const { table, column, groupBy, options } = state;
  const used = table.numeric(column, { dropText: options.dropText ?? false });
  const cells = table.numericCells(column);
  const g = table.text(groupBy);
  // Per group: the rows holding a number, and the cells left out.
  const byGroup = new Map<string, { rows: number[]; missing: number; text: number }>();
  let noGroup = 0;
  for (let i = 0; i < table.rowCount; i++) {
    if (g.missing[i]) {
      if (!cells.missing[i] && !cells.nonNumeric[i]) noGroup++;
      continue;
    }
    const key = g.values[i];
    let entry = byGroup.get(key);
    if (!entry) byGroup.set(key, entry = { rows: [], missing: 0, text: 0 });
    if (cells.missing[i]) entry.missing++;
    else if (cells.nonNumeric[i]) entry.text++;
    else entry.rows.push(i);
  }
  const groups = [...byGroup.keys()].sort(_compare).map((key) => {
    const { rows, missing, text } = byGroup.get(key)!;
    const sides = cells.censor;
    return Object.freeze({
      group: key,
      values: Float64Array.from(rows, (i) => cells.values[i]),
      rows,
      missingDropped: missing,
      textDropped: text,
      ...(sides && rows.some((i) => sides[i] !== 0)
        ? { censor: Int8Array.from(rows, (i) => sides[i]) }
        : {}),
    });
  });
  return Object.freeze({
    groups: Object.freeze(groups),
    noGroup,
    missingDropped: used.provenance.missingDropped,
    textDropped: used.provenance.textDropped,
    mergedLabels: g.merged,
  });
}

export function screenGroups(state: GroupState): GroupResult {
  const { column, groupBy, options } = state;
  const steps = state.steps();
  const adjust = checkAdjustment(state.groupOptions.adjust);
  const split = splitGroups(state);
  const label = stepLabel(column, steps);
  const residuals: number[] = [];
  const residualSides: number[] = [];
  const rows: GroupRow[] = [];
  for (const group of split.groups) {
    const { group: key, rows: idx, missingDropped, textDropped } = group;
    const counts = { missingDropped, textDropped };
    const { values: v, censor: c } = stepGroup(group, steps, { column, table: state.table });
    const centre = groupCentre(v, c);
    if (centre !== null) {
      v.forEach((t, i) => {
        residuals.push(t - centre);
        residualSides.push(c ? c[i] : 0);
      });
    }
    if (v.length < ANALYSE_MIN_N) {
      rows.push({
        group: key,
        n: v.length,
        ...counts,
        skipped: `only ${v.length} value${
          v.length === 1 ? "" : "s"
        }; at least ${ANALYSE_MIN_N} are needed`,
      });
      continue;
    }
    const rowsOf = Int32Array.from(idx, (i) => i + 1);
    const transform = steps.length ? label : undefined;
    try {
      const origin = { label: `${label} — ${groupBy} = ${key}`, column, group: key, transform };
      const a = analyseSides(v, c, { ...origin, ...counts, rows: rowsOf }, { qq: options.qq });
      rows.push({ group: key, n: v.length, ...counts, analysis: a });
    } catch (e) {
      if (e instanceof PlumbError && e.code === "constant") {
        rows.push({ group: key, n: v.length, ...counts, skipped: "every value is the same" });
      } else if (
        c && e instanceof PlumbError && ["too-few", "overlapping-limits"].includes(e.code)
      ) {
        // Too few measured values, or too many censored, for the censored methods.
        rows.push({ group: key, n: v.length, ...counts, skipped: e.message });
      } else throw e;
    }
  }
  let res: Analysis | undefined;
  if (residuals.length >= ANALYSE_MIN_N) {
    const origin = {
      label: `${label} residuals within ${groupBy}`,
      column,
      transform: steps.length ? label : undefined,
      missingDropped: split.missingDropped,
      textDropped: split.textDropped,
    };
    try {
      const sides = Int8Array.from(residualSides);
      res = analyseSides(Float64Array.from(residuals), sides, origin, { qq: options.qq });
    } catch (e) {
      const known = ["constant", "too-few", "overlapping-limits"];
      if (!(e instanceof PlumbError && known.includes(e.code))) throw e;
    }
  }
  return groupResult({
    label,
    groupBy,
    adjust,
    groups: rows,
    noGroup: split.noGroup,
    missingDropped: split.missingDropped,
    textDropped: split.textDropped,
    residuals: res,
    mergedLabels: split.mergedLabels,
  });
}

/**
 * The note for labels merged because they differ only in spaces, with each
 * spelling shown so that its spaces can be seen (`"A\u00a0"`).
 *
 * @example
 * ```ts
 * import { mergedLabelsNote } from "./group_screen.ts";
 * const note = mergedLabelsNote("line", [{ label: "A", spellings: ["A", " A", "A\u00a0"] }]);
 * if (note !== 'Labels of line that differ only in spaces were merged: "A" (written "A", " A", "A\\u00a0").') {
 *   throw new Error(note);
 * }
 * ```
 */
export function mergedLabelsNote(by: string, merged: readonly MergedLabel[]): string {
  const visible = (s: string) =>
    JSON.stringify(s).replace(
      /[\u0080-\uffff]/g,
      (c) => /\s|\u200b|\u180e/.test(c) ? `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}` : c,
    );
  const shown = merged.slice(0, 5).map((m) =>
    `${visible(m.label)} (written ${m.spellings.map(visible).join(", ")})`
  );
  const more = merged.length > 5 ? ` and ${merged.length - 5} more labels` : "";
  return `Labels of ${by} that differ only in spaces were merged: ${shown.join("; ")}${more}.`;
}
