/**
 * The per-group screening behind `.by(column)` and `.by([a, b])` (the cells
 * of several columns; their pooled residuals are those of the cell-means
 * model: every factor and their interactions, the cells the rows screen — a
 * main-effects model would count an interaction as a departure), as plain data: the groups in
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
import { pooledMeasurementStep } from "../stats/measurement_step.ts";
import type { QqOptions } from "../stats/qq_data.ts";
import { type Adjustment, checkAdjustment } from "../stats/multiplicity.ts";
import { ANALYSE_MIN_N } from "./analysis.ts";
import { analyseSides } from "./censored_analysis.ts";
import { groupCentre, stepGroup } from "./_group_values.ts";
import { groupResult } from "./_group_result.ts";
import { type Step, stepLabel } from "./steps.ts";
import { splitGroups } from "./group_split.ts";
import { notesWith, type OrderRequest, serialCheck } from "./serial_check.ts";

export { type GroupSample, type GroupSplit, splitGroups } from "./group_split.ts";

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
  /** The grouping column, or the grouping columns joined by " × ". */
  readonly groupBy: string;
  /**
   * The grouping columns when there are several: their cells are the groups.
   * @default [groupBy]
   */
  readonly groupColumns?: readonly string[];
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
  /**
   * The order in which to check each group for serial dependence.
   * @default none
   */
  readonly order?: OrderRequest;
  /**
   * The values to group instead of the column's (e.g. a model's residuals),
   * with their 0-based table rows; no steps, no pooled residuals.
   * @default the column's values
   */
  readonly values?: () => {
    readonly values: Float64Array;
    readonly rows: Int32Array;
    readonly label: string;
    readonly missing: number;
    readonly text: number;
    readonly notes?: readonly string[];
  };
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
  /** The grouping column, or the grouping columns joined by " × ". */
  readonly groupBy: string;
  /**
   * The grouping columns.
   * @default [groupBy]
   */
  readonly groupColumns?: readonly string[];
  /** The order each group was checked in for serial dependence, if one was named. */
  readonly order?: string;
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

/**
 * Screen one variable within each group of a grouping column: one analysis
 * per group with enough values, adjusted p-values across the groups, and the
 * pooled within-group residuals (value − group mean) analysed.
 *
 * @param state the table, the column and its steps, the grouping column and options
 */
export function screenGroups(state: GroupState): GroupResult {
  const { column, groupBy, options } = state;
  const groupColumns = state.groupColumns ?? [groupBy];
  const given = state.values?.();
  const steps = given ? [] : state.steps();
  const adjust = checkAdjustment(state.groupOptions.adjust);
  const split = splitGroups(given ? { ...state, values: () => given } : state);
  const label = given ? given.label : stepLabel(column, steps);
  // Each group's values less its centre, pooled (at most one value per used row), with their sides.
  const total = split.groups.reduce((k, g) => k + g.values.length, 0);
  const residuals = new Float64Array(given ? 0 : total);
  const residualSides = new Int8Array(given ? 0 : total);
  let pooled = 0;
  const rows: GroupRow[] = [];
  for (const group of split.groups) {
    const { group: key, rows: idx, missingDropped, textDropped } = group;
    const counts = { missingDropped, textDropped };
    const { values: v, censor: c } = stepGroup(group, steps, { column, table: state.table });
    const centre = groupCentre(v, c);
    if (centre !== null && !given) {
      for (let i = 0; i < v.length; i++) {
        residuals[pooled] = v[i] - centre;
        if (c) residualSides[pooled] = c[i];
        pooled++;
      }
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
    const transform = steps.length ? label : undefined;
    try {
      const serial = state.order &&
        serialCheck(state.table, state.order, { values: v, rows: idx });
      const notes = notesWith(given?.notes, serial);
      const origin = {
        label: `${label} — ${groupBy} = ${key}`,
        column,
        group: key,
        transform,
        notes,
      };
      const a0 = analyseSides(v, c, { ...origin, ...counts }, {
        qq: options.qq,
        rowLabel: (j) => idx[j] + 1,
      });
      const a = serial ? Object.freeze({ ...a0, serial }) : a0;
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
  if (pooled >= ANALYSE_MIN_N) {
    const cells = groupColumns.length > 1;
    const origin = {
      label: `${label} residuals within ${groupBy}${cells ? " cells" : ""}`,
      column,
      transform: steps.length ? label : undefined,
      missingDropped: split.missingDropped,
      textDropped: split.textDropped,
      notes: cells
        ? [
          `Pooled residuals of the cell-means model: each value minus the centre of its ${groupBy} cell (both factors and their interaction)`,
        ]
        : undefined,
    };
    // residuals keep the data's step; a re-expression keeps no grid
    const step = steps.length ? null : pooledMeasurementStep(split.groups.map((g) => g.values));
    try {
      const sides = residualSides.subarray(0, pooled);
      const censored = sides.some((side) => side !== 0) ? sides : null;
      res = analyseSides(residuals.subarray(0, pooled), censored, origin, {
        qq: options.qq,
        step,
      });
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
    groupColumns: Object.freeze([...groupColumns]),
    order: state.order ? state.order.column ?? "file order" : undefined,
  });
}
