/**
 * Header names: every column gets a unique, non-empty name.
 *
 * The rule: names are trimmed; an empty name becomes `column_<k>` (k is the
 * 1-based position); a name already taken by an earlier column gets the
 * first free suffix `_2`, `_3`, …. Every change is listed, so outputs can say
 * which names were not the source's own. Names are only ever used as keys of
 * a `Map`, so `__proto__`, `constructor` and the like are ordinary names.
 *
 * @module
 */
import type { HeaderRename } from "./table.ts";

/** Unique names and the changes made to reach them. */
export interface UniqueNames {
  /** One unique, non-empty name per column. */
  readonly names: readonly string[];
  /** Each name that was changed, with the reason. */
  readonly renamed: readonly HeaderRename[];
}

/**
 * Make header names unique and non-empty.
 *
 * @param raw the names as read
 * @returns the names to use and the list of changes
 *
 * @example
 * ```ts
 * import { uniqueNames } from "./header.ts";
 * const { names, renamed } = uniqueNames(["a", "", "a", "a_2"]);
 * if (names.join() !== "a,column_2,a_3,a_2" || renamed.length !== 2) {
 *   throw new Error(`unexpected: ${names}`);
 * }
 * ```
 */
export function uniqueNames(raw: readonly string[]): UniqueNames {
  const trimmed = raw.map((n) => String(n).trim());
  // Names as given are reserved first, so a later "a_2" keeps its own name.
  const taken = new Set<string>();
  const firstIndex = new Map<string, number>();
  trimmed.forEach((n, i) => {
    if (n !== "" && !firstIndex.has(n)) firstIndex.set(n, i);
    if (n !== "") taken.add(n);
  });
  const names: string[] = [];
  const renamed: HeaderRename[] = [];
  // The next suffix worth trying per base: every smaller one is taken already,
  // so many copies of one name cost linear, not quadratic, time.
  const nextSuffix = new Map<string, number>();
  trimmed.forEach((n, i) => {
    if (n !== "" && firstIndex.get(n) === i) {
      names.push(n);
      return;
    }
    const base = n === "" ? `column_${i + 1}` : n;
    let candidate = base;
    let k = nextSuffix.get(base) ?? 2;
    while (taken.has(candidate)) candidate = `${base}_${k++}`;
    nextSuffix.set(base, k);
    taken.add(candidate);
    names.push(candidate);
    renamed.push(
      Object.freeze({ index: i, from: n, to: candidate, reason: n === "" ? "empty" : "duplicate" }),
    );
  });
  return Object.freeze({ names: Object.freeze(names), renamed: Object.freeze(renamed) });
}
