/**
 * Which groups a per-group display shows when there are too many for one
 * output, and the note on the rest.
 *
 * @module
 */
import { leftOutNote, pickRows } from "../render/budget.ts";
import { VERDICT_SHORT } from "../results/reading.ts";
import type { GroupResult, GroupRow } from "./group_screen.ts";

/**
 * The groups a display shows: at most `max`, the clearest departures
 * (smallest adjusted p; groups not screened last), in table order, and the
 * note on the rest (how many, which, where they all are).
 *
 * @param r the screening
 * @param max the most groups to show
 */
export function shownGroups(
  r: GroupResult,
  max: number,
): { readonly groups: readonly GroupRow[]; readonly note?: string } {
  const pick = pickRows(r.groups, {
    max,
    score: (g) => (g.analysis ? -(g.adjustedP ?? 1) : -Infinity),
  });
  if (pick.left.length === 0) return { groups: pick.shown };
  const tally: Record<string, number> = {};
  for (const g of pick.left) {
    const k = g.analysis ? VERDICT_SHORT[g.analysis.reading.verdict] : "not screened";
    tally[k] = (tally[k] ?? 0) + 1;
  }
  const note = leftOutNote({
    noun: "group",
    total: r.groups.length,
    chosen: "the clearest departures (smallest adjusted p), in table order",
    names: pick.left.map((g) => g.group),
    tally,
    where: `.toCSV(), .save("groups.csv") and .toJSON()`,
  });
  return { groups: pick.shown, note };
}
