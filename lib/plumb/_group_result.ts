/**
 * Finishing a per-group screening, from memory or from a query source.
 *
 * @module
 */
import { adjustPValues } from "../stats/multiplicity.ts";
import type { GroupResult } from "./group_screen.ts";

/** Finish a per-group screening from any source: p adjusted across the groups, all frozen. */
export function groupResult(r: GroupResult): GroupResult {
  const tested = r.groups.filter((g) => g.analysis);
  const adj = adjustPValues(tested.map((g) => g.analysis!.primary.pValue), r.adjust);
  const adjusted = new Map(tested.map((g, k) => [g.group, adj[k]]));
  const groups = r.groups.map((g) =>
    Object.freeze(g.analysis ? { ...g, adjustedP: adjusted.get(g.group) } : g)
  );
  return Object.freeze({ ...r, groups: Object.freeze(groups) });
}
