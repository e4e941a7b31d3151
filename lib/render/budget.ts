/**
 * Outputs stay small at any size of input: a display shows at most a fixed
 * number of rows (groups, columns), the most informative ones, and says how
 * many and which it left out and where they all are. No output may exceed
 * {@linkcode OUTPUT_BUDGET} bytes, whatever n, the number of groups or of
 * columns.
 *
 * @module
 */
import type { MimeBundle } from "../results/display.ts";
import { formatCount } from "../results/format.ts";

/** The most bytes one display output may hold, all MIME types together. */
export const OUTPUT_BUDGET = 300_000;

/**
 * The size in bytes of a display bundle as a notebook stores it (UTF-8 text,
 * JSON for the Vega-Lite spec).
 *
 * @example
 * ```ts
 * import { bundleBytes } from "./budget.ts";
 * if (bundleBytes({ "text/plain": "λ" }) !== 2) throw new Error("utf-8");
 * ```
 */
export function bundleBytes(bundle: MimeBundle): number {
  const enc = new TextEncoder();
  let n = 0;
  for (const v of Object.values(bundle)) {
    n += enc.encode(typeof v === "string" ? v : JSON.stringify(v)).length;
  }
  return n;
}

/** The rows chosen for display and the rest. */
export interface Pick<T> {
  /** The rows to show, in their original order. */
  readonly shown: readonly T[];
  /** The rows left out, in their original order. */
  readonly left: readonly T[];
}

/**
 * Choose at most `max` rows to show: those with the highest `score` (ties:
 * the earlier row), kept in their original order. O(n log n), no spread of
 * the input into a call, so any number of rows works.
 *
 * @param rows every row
 * @param options how many to show and how informative each row is
 * @example
 * ```ts
 * import { pickRows } from "./budget.ts";
 * const p = pickRows([5, 1, 9, 3], { max: 2, score: (x) => x });
 * if (p.shown.join() !== "5,9" || p.left.join() !== "1,3") throw new Error("pick");
 * ```
 */
export function pickRows<T>(
  rows: readonly T[],
  options: { readonly max: number; readonly score: (row: T, index: number) => number },
): Pick<T> {
  if (rows.length <= options.max) return { shown: rows, left: [] };
  const order = Array.from(rows.keys());
  const scores = Float64Array.from(rows, (r, i) => {
    const s = options.score(r, i);
    return Number.isNaN(s) ? -Infinity : s;
  });
  order.sort((a, b) => scores[b] - scores[a] || a - b);
  const keep = new Uint8Array(rows.length);
  for (let k = 0; k < options.max; k++) keep[order[k]] = 1;
  const shown: T[] = [];
  const left: T[] = [];
  rows.forEach((r, i) => (keep[i] ? shown : left).push(r));
  return { shown, left };
}

/** What {@linkcode leftOutNote} says about the rows left out. */
export interface LeftOut {
  /** "group", "column": the kind of row, singular. */
  readonly noun: string;
  /** How many rows there are in all. */
  readonly total: number;
  /** How the shown rows were chosen, e.g. "the clearest departures (smallest adjusted p)". */
  readonly chosen: string;
  /** Names of the rows left out, in order. */
  readonly names: readonly string[];
  /** A count per kind of left-out row, e.g. { "no clear departure": 930 }. */
  readonly tally?: Readonly<Record<string, number>>;
  /** Where every row is, e.g. `.toCSV() or .save("groups.csv")`. */
  readonly where: string;
}

/**
 * The note under a shortened table: how many rows are shown and why, how many
 * and which are left out (up to 12 names, each cut to 40 characters, then how
 * many more), and where all of them are.
 *
 * @example
 * ```ts
 * import { leftOutNote } from "./budget.ts";
 * const s = leftOutNote({
 *   noun: "group", total: 5, chosen: "the clearest departures", names: ["C", "E"],
 *   tally: { "no clear departure": 2 }, where: ".toCSV()",
 * });
 * if (s !== "Showing 3 of 5 groups: the clearest departures. Left out: 2 groups (2 no clear departure): C, E. Every group is in .toCSV().") throw new Error(s);
 * ```
 */
export function leftOutNote(l: LeftOut): string {
  const plural = (n: number) => `${formatCount(n)} ${l.noun}${n === 1 ? "" : "s"}`;
  const shown = l.total - l.names.length;
  const tally = Object.entries(l.tally ?? {}).filter(([, n]) => n > 0)
    .map(([k, n]) => `${formatCount(n)} ${k}`).join(", ");
  const head = l.names.slice(0, 12).map((
    n,
  ) => ([...n].length > 40 ? `${[...n].slice(0, 39).join("")}…` : n))
    .join(", ");
  const more = l.names.length > 12 ? ` and ${formatCount(l.names.length - 12)} more` : "";
  return `Showing ${formatCount(shown)} of ${plural(l.total)}: ${l.chosen}. ` +
    `Left out: ${plural(l.names.length)}${tally ? ` (${tally})` : ""}: ${head}${more}. ` +
    `Every ${l.noun} is in ${l.where}.`;
}
