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
 * @returns a set for {@linkcode isMissingToken}
 *
 * @example
 * ```ts
 * import { isMissingToken, missingSet } from "./missing.ts";
 * const set = missingSet(["n.d."]);
 * if (!isMissingToken(" N.D. ", set) || isMissingToken("NA", set)) throw new Error("unexpected");
 * ```
 */
export function missingSet(tokens: readonly string[] = DEFAULT_MISSING): ReadonlySet<string> {
  const set = new Set<string>([""]);
  for (const t of tokens) set.add(String(t).trim().toLowerCase());
  return set;
}

/**
 * Whether a cell's text is a missing-value token of `set`.
 *
 * @param text the cell as read
 * @param set a set from {@linkcode missingSet}
 *
 * @example
 * ```ts
 * import { isMissingToken, missingSet } from "./missing.ts";
 * if (!isMissingToken("na", missingSet()) || isMissingToken("0", missingSet())) {
 *   throw new Error("unexpected");
 * }
 * ```
 */
export function isMissingToken(text: string, set: ReadonlySet<string>): boolean {
  return set.has(text.trim().toLowerCase());
}
