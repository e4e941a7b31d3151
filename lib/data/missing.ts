/**
 * Missing-value tokens: the cell texts that mean "no measurement here".
 *
 * @module
 */

/**
 * The cell texts read as missing unless `missing` is given: the empty cell,
 * `NA`, `N/A`, `null`, `NaN`, `-` and `.` (common practice in exported lab and
 * spreadsheet data). They are compared after trimming surrounding spaces and
 * without regard to letter case, so `na`, `NULL` and `nan` count too.
 */
export const DEFAULT_MISSING: readonly string[] = Object.freeze([
  "",
  "NA",
  "N/A",
  "null",
  "NaN",
  "-",
  ".",
]);

/**
 * Build the lookup used while reading: a set of lower-cased, trimmed tokens.
 * The empty cell is always missing, whatever the list says.
 *
 * @param tokens the tokens to treat as missing
 * @returns the set of tokens, lower-cased and trimmed (a cell is missing when
 *   its trimmed, lower-cased text is in it)
 *
 * @example
 * ```ts
 * import { missingSet } from "./missing.ts";
 * const set = missingSet(["n.d."]);
 * if (!set.has("n.d.") || set.has("na") || !set.has("")) throw new Error("unexpected");
 * ```
 */
export function missingSet(tokens: readonly string[] = DEFAULT_MISSING): ReadonlySet<string> {
  const set = new Set<string>([""]);
  for (const t of tokens) set.add(String(t).trim().toLowerCase());
  return set;
}
