/**
 * The one check of every options object a user passes: `null` and
 * `undefined` mean no options, anything but a plain object is refused, and
 * an option the function does not know is a `"bad-option"` error that names
 * it and the nearest valid one, so that a misspelling (`dropTxt`,
 * `envelop`) is never silently ignored.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/**
 * Check an options object against the names a function knows.
 *
 * @param options what the user passed (`null` and `undefined` are `{}`)
 * @param known every option name the function accepts
 * @param where the function, for the message (`"loadTable"`, `".qq()"`)
 * @returns the options, or `{}` for `null` / `undefined`
 * @throws {PlumbError} `"bad-option"` for a value that is not an object, or
 *   for an unknown option (naming the nearest known one)
 *
 * @example
 * ```ts
 * import { checkOptions } from "./options.ts";
 * const ok = checkOptions({ dropText: true }, ["dropText", "qq"], "plumb");
 * if (ok.dropText !== true || Object.keys(checkOptions(null, ["qq"], "plumb")).length !== 0) {
 *   throw new Error("unexpected");
 * }
 * let message = "";
 * try {
 *   checkOptions({ dropTxt: true }, ["dropText", "qq"], "plumb");
 * } catch (e) {
 *   message = (e as Error).message;
 * }
 * if (!message.startsWith('Unknown option "dropTxt" of plumb: did you mean "dropText"?')) {
 *   throw new Error(message);
 * }
 * ```
 */
export function checkOptions<T extends object>(
  options: T | null | undefined,
  known: readonly string[],
  where: string,
): T {
  if (options === null || options === undefined) return {} as T;
  if (typeof options !== "object" || Array.isArray(options)) {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${
        Array.isArray(options) ? "an array" : typeof options
      } as the options of ${where}: give an object such as { ${known[0]}: … }`,
    );
  }
  for (const key of Object.keys(options)) {
    if (known.includes(key)) continue;
    const near = nearestName(key, known);
    const list = known.join(", ");
    throw new PlumbError(
      "bad-option",
      near === null
        ? `Unknown option ${JSON.stringify(key)} of ${where}: the options are ${list}`
        : `Unknown option ${JSON.stringify(key)} of ${where}: did you mean ${
          JSON.stringify(near)
        }? (the options are ${list})`,
      { option: key, suggestion: near, known: [...known] },
    );
  }
  return options;
}

/**
 * The option names of an options type, from an object that must list every
 * one of them (a name left out or misspelt does not type-check), so that the
 * list {@linkcode checkOptions} is given cannot drift from the interface.
 *
 * @param every each option name of `T`, mapped to `true`
 * @returns the names, frozen
 * @example
 * ```ts
 * import { optionNames } from "./options.ts";
 * interface Opts { readonly level?: number; readonly line?: boolean }
 * const names = optionNames<Opts>({ level: true, line: true });
 * if (names.join() !== "level,line") throw new Error("names");
 * ```
 */
export function optionNames<T extends object>(
  every: { readonly [K in keyof Required<T>]: true },
): readonly string[] {
  return Object.freeze(Object.keys(every));
}

/**
 * The known name nearest to `name`: the smallest optimal-string-alignment
 * distance (insertions, deletions, substitutions and swaps of neighbours,
 * ignoring case), when it is at most a third of the name's length (and at
 * least 2); failing that, the one known name that contains `name` as a word
 * part (`bins` in `maxBins`); else `null`.
 *
 * @example
 * ```ts
 * import { nearestName } from "./options.ts";
 * if (nearestName("envelop", ["envelope", "line"]) !== "envelope") throw new Error("near");
 * if (nearestName("bins", ["rule", "maxBins"]) !== "maxBins") throw new Error("part");
 * if (nearestName("colour", ["rule", "maxBins"]) !== null) throw new Error("far");
 * ```
 */
export function nearestName(name: string, known: readonly string[]): string | null {
  const a = name.toLowerCase();
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const k of known) {
    const d = _distance(a, k.toLowerCase());
    if (d < bestDistance) {
      best = k;
      bestDistance = d;
    }
  }
  if (bestDistance <= Math.max(2, Math.floor(name.length / 3))) return best;
  const containing = a.length >= 3 ? known.filter((k) => k.toLowerCase().includes(a)) : [];
  return containing.length === 1 ? containing[0] : null;
}

/** Optimal string alignment distance (restricted Damerau–Levenshtein). */
function _distance(a: string, b: string): number {
  if (Math.abs(a.length - b.length) > 8) return Infinity;
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[][] = Array.from({ length: rows }, (_, i) => {
    const row = new Array<number>(cols).fill(0);
    row[0] = i;
    return row;
  });
  for (let j = 0; j < cols; j++) d[0][j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
      }
    }
  }
  return d[rows - 1][cols - 1];
}
