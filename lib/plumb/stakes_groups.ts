/**
 * `.by(column).stakes(options)`: what the departure from normality changes
 * within each group — the central range, the share outside the limits, Cpk
 * and the mean's interval of each group, each the normal-theory way and
 * without a model. Values stay in original units; the chain's
 * re-expression (resolved on the whole column) is used in every group, or,
 * with none, each group's own ranked candidates' first.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { PlumbError } from "../errors.ts";
import { refuseCensoredGroups } from "./_chain_values.ts";
import { chartBundle } from "../render/chart_bundle.ts";
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { type SavedFile, saveDisplay } from "../render/save.ts";
import { stakesGroupsSpec } from "../render/stakes_spec.ts";
import { stakesNumber, stakesSentence, stakesShare } from "../render/stakes_words.ts";
import { tableHtml, tableMarkdown, type TableModel, tableText } from "../render/table.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { type Stakes, stakes, STAKES_CAUTION, type StakesOptions } from "../stakes/stakes.ts";
import { _csv } from "./_csv.ts";
import { type GroupState, splitGroups } from "./group_screen.ts";
import { specFiles, STAKES_CSV_HEAD, stakesRows } from "./stakes_view.ts";

/** One group's stakes, or why there are none. */
export interface GroupStakesRow {
  /** The group's value. */
  readonly group: string;
  /** Values in the group. */
  readonly n: number;
  /** The group's stakes, when it has at least 3 values that are not all equal. */
  readonly stakes?: Stakes;
  /** Why the group has none. */
  readonly skipped?: string;
}

/** The stakes of every group, as plain data. */
export interface GroupStakes {
  /** The variable (original units). */
  readonly column: string;
  /** The grouping column. */
  readonly groupBy: string;
  /** One row per group, in natural order. */
  readonly groups: readonly GroupStakesRow[];
  /** Rows with a value but no group, left out. */
  readonly noGroup: number;
  /** Missing cells of the variable, left out. */
  readonly missingDropped: number;
  /** Text cells left out on request. */
  readonly textDropped: number;
  /** Cautions for anyone acting on these figures. */
  readonly cautions: readonly string[];
}

/** The per-group stakes: displayable, exportable, savable. */
export interface GroupStakesView extends Displayable {
  /** The figures of every group (computed once). */
  result(): GroupStakes;
  /** Plain data: each group's contract form (`range`, `outside`, `capability`, `mean`) or why none. */
  toJSON(): Record<string, unknown>;
  /** One row per group. */
  table(): TableModel;
  /** The write-up, one paragraph per group, then the caution once. */
  paragraphs(): readonly string[];
  /** The table as Markdown. */
  toMarkdown(): string;
  /** Every figure of every group as CSV: group, then the one-variable view's columns. */
  toCSV(): string;
  /** Write the view to a file; the type follows the extension (.svg .png .html .md .txt .csv .json). */
  save(path: string): Promise<SavedFile>;
}

/** The most groups drawn, each with its paragraph, in the display; the exports hold them all. */
export const STAKES_GROUPS_DRAWN = 8;
/** The most groups in the displayed table; `table()` and the exports hold them all. */
export const STAKES_GROUPS_SHOWN = 40;

const _SCORE = { matters: 3, unclear: 2, negligible: 1 } as const;

/**
 * The groups a display shows when there are more than `max`: those where the
 * difference matters first, then unclear, then negligible, then those not
 * computed (ties: the earlier group); kept in their natural order.
 */
function _pick(groups: readonly GroupStakesRow[], max: number): GroupStakesRow[] {
  if (groups.length <= max) return [...groups];
  const score = groups.map((g) => (g.stakes ? _SCORE[g.stakes.judgement.overall] : 0));
  const order = groups.map((_, i) => i).sort((a, b) => score[b] - score[a] || a - b);
  return order.slice(0, max).sort((a, b) => a - b).map((i) => groups[i]);
}

function _compute(state: GroupState, options: StakesOptions): GroupStakes {
  const split = splitGroups(state);
  refuseCensoredGroups(split.groups, state.column, state.groupBy);
  const model = state.stakesModel?.();
  const groups = split.groups.map(({ group, values }): GroupStakesRow => {
    const n = values.length;
    if (n < 3) {
      return Object.freeze({ group, n, skipped: `only ${n} value${n === 1 ? "" : "s"}; 3 needed` });
    }
    try {
      const s = stakes(values, model === undefined ? options : { ...options, reexpression: model });
      return Object.freeze({ group, n, stakes: s });
    } catch (e) {
      if (e instanceof PlumbError && e.code === "constant") {
        return Object.freeze({ group, n, skipped: "every value is the same" });
      }
      throw e;
    }
  });
  return Object.freeze({
    column: state.column,
    groupBy: state.groupBy,
    groups: Object.freeze(groups),
    noGroup: split.noGroup,
    missingDropped: split.missingDropped,
    textDropped: split.textDropped,
    cautions: Object.freeze([STAKES_CAUTION]),
  });
}

const _pair = (p: readonly [number | null, number | null]) => _span(p[0], p[1]);
const _span = (a: number | null, b: number | null) =>
  `${a === null ? "open" : stakesNumber(a)} to ${b === null ? "open" : stakesNumber(b)}`;

function _table(
  r: GroupStakes,
  limits: boolean,
  groups: readonly GroupStakesRow[] = r.groups,
): TableModel {
  const rows = groups.map((g) => {
    const s = g.stakes;
    if (s === undefined) {
      const blank = Array.from({ length: limits ? 6 : 4 }, () => "");
      return [g.group, String(g.n), `not computed: ${g.skipped}`, ...blank];
    }
    const re = s.range.reexpressed === null
      ? "none"
      : `${_pair(s.range.reexpressed)} (${s.reexpression!.label})`;
    const spec = s.outside === null || s.capability === null ? [] : [
      `${stakesShare(s.outside.normal)} / ${stakesShare(s.outside.observed)}`,
      `${stakesNumber(s.capability.normal.cpk)} (${_pair(s.capability.normal.cpkCi)})`,
    ];
    return [
      g.group,
      String(s.n),
      _pair(s.range.normal),
      re,
      _pair(s.range.ranks),
      ...spec,
      `${_pair(s.mean.t)} / ${_pair(s.mean.bootstrap)}`,
      s.judgement.overall,
    ];
  });
  const first = r.groups.find((g) => g.stakes)?.stakes;
  const pct = (v: number) => `${+(v * 100).toPrecision(6)}%`;
  const notes = [
    "Re-expressed ranges are mapped back to the original units. Rank-based ranges need many " +
    "values per group to be firm: see each group's paragraph, and its notes in toJSON(). " +
    "Overall verdict: matters when it matters for any figure, else unclear when any is unclear.",
  ];
  const count = (k: number, what: string) => `${k} ${what}${k === 1 ? "" : "s"}`;
  if (r.noGroup > 0) notes.push(`${count(r.noGroup, "row")} with no ${r.groupBy} value left out.`);
  if (r.missingDropped > 0) notes.push(`${count(r.missingDropped, "missing cell")} left out.`);
  if (r.textDropped > 0) {
    notes.push(`${count(r.textDropped, "non-numeric cell")} left out on request.`);
  }
  if (groups.length < r.groups.length) {
    const left = r.groups.length - groups.length;
    notes.unshift(
      `${groups.length} of ${r.groups.length} groups shown, those where the difference matters ` +
        `first; ${count(left, "group")} left out here. Every group is in table(), toCSV(), ` +
        'toJSON() and save("….csv").',
    );
  }
  notes.push(`${STAKES_CAUTION}.`);
  return {
    caption: `What the departure changes for ${r.column}, by ${r.groupBy}`,
    columns: [
      { title: r.groupBy },
      { title: "n", align: "right" },
      { title: first ? `normal ${pct(first.range.coverage)} range` : "normal range" },
      { title: "re-expressed range" },
      { title: "rank range" },
      ...(limits ? [{ title: "outside: normal / observed" }, { title: "Cpk (CI)" }] : []),
      { title: "mean: t / bootstrap" },
      { title: "overall verdict" },
    ],
    rows,
    notes,
  };
}

/**
 * The per-group stakes view, computed on first need.
 *
 * @param state the chain's per-group state (table, variable, grouping, re-expression)
 * @param options the options of `.stakes()`, already checked
 * @example
 * ```ts
 * import { plumb } from "@plumbline/plumbline";
 * const v = plumb({ line: ["a", "b", "a", "b", "a", "b", "a", "b"], ml: [500.1, 499.2, 500.4, 499.9, 499.8, 500.6, 500.2, 499.5] }, "ml")
 *   .by("line").stakes({ reexpression: "none" });
 * if (v.result().groups.length !== 2 || !v.toCSV().startsWith("group,quantity,")) throw new Error("groups");
 * ```
 */
export function groupStakesView(state: GroupState, options: StakesOptions): GroupStakesView {
  let result: GroupStakes | undefined;
  let model: TableModel | undefined;
  let spec: TopLevelSpec | undefined;
  let bundle: Promise<MimeBundle> | undefined;
  const limits = options.lower !== undefined || options.upper !== undefined;
  const get = () => (result ??= _compute(state, options));
  const table = () => (model ??= _table(get(), limits));
  type Drawn = GroupStakesRow & { readonly stakes: Stakes };
  const drawn = () => _pick(get().groups.filter((g) => g.stakes), STAKES_GROUPS_DRAWN) as Drawn[];
  const getSpec = () => {
    if (drawn().length > 0) {
      return (spec ??= stakesGroupsSpec(drawn(), { name: state.column, by: state.groupBy }));
    }
    throw new PlumbError(
      "too-few",
      `Cannot draw ${title()}: no group has 3 values that are not all equal: save as .csv or .json`,
    );
  };
  const title = () => `What the departure changes for ${state.column}, by ${state.groupBy}`;
  const written = (groups: readonly GroupStakesRow[]) =>
    groups.flatMap((g) =>
      g.stakes
        ? [stakesSentence(g.stakes, `${state.groupBy} = ${g.group}`, { caution: false })]
        : []
    );
  const paragraphs = () => Object.freeze([...written(get().groups), `${STAKES_CAUTION}.`]);
  const leftOut = () => {
    const computed = get().groups.filter((g) => g.stakes).length;
    return computed > STAKES_GROUPS_DRAWN
      ? [
        `The chart and the paragraphs below cover ${STAKES_GROUPS_DRAWN} of ${computed} groups, ` +
        "those where the difference matters first; paragraphs() holds every group's.",
      ]
      : [];
  };
  const show = () =>
    bundle ??= (async () => {
      const r = get();
      const t = _table(r, limits, _pick(r.groups, STAKES_GROUPS_SHOWN));
      const texts = [...leftOut(), ...written(drawn()), `${STAKES_CAUTION}.`];
      const chart = drawn().length > 0 ? await chartBundle(getSpec()) : undefined;
      return Object.freeze({
        "text/html":
          `<div style="background:#fff;color:#111;font-family:sans-serif;padding:6px">${
            tableHtml(t)
          }<div style="margin:8px 0">${chart?.["text/html"] ?? ""}</div>` +
          texts.map((p) => `<p style="max-width:860px">${escapeHtml(p)}</p>`).join("") + "</div>",
        "text/markdown": `${tableMarkdown(t)}\n\n${texts.map(escapeMarkdown).join("\n\n")}`,
        "text/plain": plainText(`${tableText(t)}\n\n${texts.join("\n\n")}`),
      });
    })();
  const toJSON = () => {
    const r = get();
    return {
      column: r.column,
      groupBy: r.groupBy,
      groups: r.groups.map((g) =>
        g.stakes
          ? { group: g.group, ...g.stakes.toJSON() }
          : { group: g.group, n: g.n, skipped: g.skipped }
      ),
      noGroup: r.noGroup,
      missingDropped: r.missingDropped,
      textDropped: r.textDropped,
      cautions: r.cautions,
    };
  };
  const toCSV = () =>
    _csv(
      ["group", ...STAKES_CSV_HEAD],
      get().groups.flatMap((g) =>
        g.stakes ? stakesRows(g.stakes).map((row) => [g.group, ...row]) : []
      ),
    );
  return Object.freeze({
    [DISPLAY]: show,
    result: get,
    toJSON,
    table,
    paragraphs,
    toMarkdown: () => tableMarkdown(table()),
    toCSV,
    save: (path: string) =>
      saveDisplay(path, {
        what: title(),
        bundle: show,
        json: toJSON,
        csv: toCSV,
        ...specFiles(getSpec, title),
      }),
  });
}
