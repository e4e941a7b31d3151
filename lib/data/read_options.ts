/**
 * The options shared by every way of loading a table, and their checks.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { DEFAULT_MISSING, missingSet } from "./missing.ts";
import type { _CellRules, _WordLimits } from "./_raw_column.ts";

/** The limits a column's limit words stand for (a word for "below the limit", one for "above"). */
export interface WordLimits {
  /** The limit that "below the limit" words stand for. */
  readonly below?: number;
  /** The limit that "above the limit" words stand for. */
  readonly above?: number;
}

/** How cells are read, for CSV text and in-memory data alike. */
export interface CellOptions {
  /**
   * The decimal mark of text cells. For CSV, `","` when the delimiter is
   * `";"` and `"."` otherwise; for in-memory strings, `"."`. A cell written
   * with the other mark is text, and the `"non-numeric"` error says which
   * setting would read it.
   * @default "," for `;`-delimited CSV, "." otherwise
   */
  readonly decimal?: "." | ",";
  /**
   * A thousands separator to accept between groups of three digits
   * (`"'"`, `" "`, `"_"`, `","` or `"."`). Numbers are never guessed to have
   * one: without this option `1,234` in a `;` file is 1.234 and in a `.`
   * decimal context is text.
   * @default undefined (none)
   */
  readonly thousands?: string;
  /**
   * Cell texts that mean a missing value, compared after trimming and
   * without regard to case; replaces the default list (the empty cell is
   * always missing).
   * @default DEFAULT_MISSING: "", "NA", "N/A", "null", "NaN", "-", "."
   */
  readonly missing?: readonly string[];
  /**
   * Per column, the limit that a word without a number stands for: below-
   * limit words (`ND`, `n.d.`, `BDL`, `<LOD`, `< LOQ`, …; see
   * `BELOW_LIMIT_WORDS`) are read as left-censored at the given number, and
   * with `{ above }` the above-limit words (`TNTC`, `>ULOQ`, …) as
   * right-censored. Cells with a sign and a number (`<0.5`, `>1000`) are
   * censored in every column without this option. For instance
   * `{ detectionLimits: { crp_mg_l: 0.5, colonies: { above: 300 } } }`.
   * @default undefined (limit words are text)
   */
  readonly detectionLimits?: Readonly<Record<string, number | WordLimits>>;
}

/** Check cell options and turn them into the readers' rules. */
export function _cellRules(options: CellOptions, decimalDefault: "." | ","): _CellRules {
  const decimal = options.decimal ?? decimalDefault;
  if (decimal !== "." && decimal !== ",") {
    throw new PlumbError(
      "bad-option",
      `Unknown decimal mark ${JSON.stringify(decimal)}: use "." or ","`,
    );
  }
  const thousands = options.thousands;
  if (thousands !== undefined) {
    if (typeof thousands !== "string" || thousands.length !== 1 || /[0-9+\-eE]/.test(thousands)) {
      throw new PlumbError(
        "bad-option",
        `Cannot use ${
          JSON.stringify(thousands)
        } as a thousands separator: give one character that is not a digit, sign or "e"`,
      );
    }
    if (thousands === decimal) {
      throw new PlumbError(
        "bad-option",
        `Cannot use ${
          JSON.stringify(thousands)
        } as both decimal mark and thousands separator: choose different characters`,
      );
    }
  }
  const missing = options.missing ?? DEFAULT_MISSING;
  if (!Array.isArray(missing) || missing.some((t) => typeof t !== "string")) {
    throw new PlumbError(
      "bad-option",
      'The missing option must be an array of strings: e.g. ["NA", ""]',
    );
  }
  return {
    decimal,
    decimalCode: decimal.charCodeAt(0),
    thousands,
    missing: missingSet(missing),
    limits: _wordLimits(options.detectionLimits),
  };
}

function _wordLimits(given: CellOptions["detectionLimits"]): ReadonlyMap<string, _WordLimits> {
  const out = new Map<string, _WordLimits>();
  if (given === undefined) return out;
  const example = 'e.g. { detectionLimits: { "crp": 0.5 } } or { "count": { above: 300 } }';
  if (typeof given !== "object" || given === null || Array.isArray(given)) {
    throw new PlumbError(
      "bad-option",
      `The detectionLimits option must be an object of column name → limit: ${example}`,
    );
  }
  for (const [column, v] of Object.entries(given)) {
    const limits: _WordLimits = typeof v === "number" ? { below: v } : v;
    const bad = (what: string) =>
      new PlumbError(
        "bad-option",
        `Cannot use ${what} as the detection limit of column ${
          JSON.stringify(column)
        }: give a finite number, ${example}`,
        { column },
      );
    if (typeof limits !== "object" || limits === null) throw bad(String(v));
    for (const [key, x] of Object.entries(limits)) {
      if (key !== "below" && key !== "above") {
        throw new PlumbError(
          "bad-option",
          `Unknown key ${JSON.stringify(key)} in the detection limits of column ${
            JSON.stringify(column)
          }: use below and above, ${example}`,
          { column },
        );
      }
      if (typeof x !== "number" || !Number.isFinite(x)) throw bad(String(x));
    }
    out.set(column, Object.freeze({ ...limits }));
  }
  return out;
}

/** Refuse detection limits given for columns that the table does not have. */
export function _checkLimitColumns(rules: _CellRules, names: readonly string[]): void {
  for (const column of rules.limits.keys()) {
    if (!names.includes(column)) {
      throw new PlumbError(
        "unknown-column",
        `Unknown column ${JSON.stringify(column)} in detectionLimits: the table has ${
          names.slice(0, 20).map((n) => JSON.stringify(n)).join(", ")
        }${names.length > 20 ? ` and ${names.length - 20} more` : ""}; check the spelling`,
        { column },
      );
    }
  }
}
