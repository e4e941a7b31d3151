/**
 * The options shared by every way of loading a table, and their checks.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { DEFAULT_MISSING, missingSet } from "./missing.ts";
import type { _CellRules } from "./_raw_column.ts";

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
  return { decimal, decimalCode: decimal.charCodeAt(0), thousands, missing: missingSet(missing) };
}
