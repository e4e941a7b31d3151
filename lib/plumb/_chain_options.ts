/**
 * The checks of the options the chain's calls take (`plumb`, `.qq()`,
 * `.detrended()`, `.histogram()`, `.by()`, `.sentence()`), through the one
 * checker of `results/options.ts`: `null` is no options, and a misspelt
 * option is a `"bad-option"` error naming the nearest valid one.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { checkOptions, optionNames } from "../results/options.ts";
import { HISTOGRAM_OPTION_NAMES, type HistogramOptions } from "../stats/histogram_data.ts";
import { QQ_OPTION_NAMES, type QqOptions } from "../stats/qq_data.ts";
import { GROUP_OPTION_NAMES, type GroupOptions } from "./group_screen.ts";
import { SENTENCE_OPTION_NAMES, type SentenceOptions } from "./sentence.ts";

/** Options for `plumb`. */
export interface PlumbOptions {
  /**
   * Leave out text cells of the column (counted in every output) instead of
   * failing with a `"non-numeric"` error.
   * @default false
   */
  readonly dropText?: boolean;
  /**
   * QQ envelope options (level, `"pointwise"` or `"simultaneous"`), for the
   * card, `.qq()`, `.detrended()` and every group of `.by()`.
   * @default {}
   */
  readonly qq?: QqOptions;
  /**
   * Name of the single column when the source is a plain array of numbers
   * (`plumb(values, "fill_ml")` names it too).
   * @default "value"
   */
  readonly name?: string;
  /**
   * A column giving the order in which the rows were measured (numbers or
   * ISO 8601 date-times): the values, or residuals, are then checked for
   * serial dependence in that order (`.sequence()` plots them).
   * @default no order: file order is never assumed to be time order
   */
  readonly order?: string;
  /**
   * Check serial dependence in the file's row order, when that is the time
   * order.
   * @default false
   */
  readonly fileOrder?: boolean;
}

/** Every option name of {@linkcode PlumbOptions}. */
const PLUMB_OPTION_NAMES = optionNames<PlumbOptions>({
  dropText: true,
  qq: true,
  name: true,
  order: true,
  fileOrder: true,
});

/**
 * `plumb`'s column name and options, checked: the column must be a string
 * (options given in its place are refused with the call's shape), and the
 * options and their `qq` field hold only known names.
 *
 * @param column what was given as the column name
 * @param options what was given as the options
 * @returns the options (`{}` for `null`)
 * @throws {PlumbError} `"bad-option"`
 */
export function plumbArguments(column: unknown, options: PlumbOptions | null): PlumbOptions {
  if (column !== undefined && typeof column !== "string") {
    throw new PlumbError(
      "bad-option",
      `Cannot use ${
        column === null ? "null" : typeof column
      } as the column name: plumb takes the source, then the column's name, then the options, ` +
        `as in plumb(table, "fill_ml", { dropText: true })`,
    );
  }
  const checked = checkOptions(options, PLUMB_OPTION_NAMES, "plumb");
  checkOptions(checked.qq, QQ_OPTION_NAMES, "plumb's qq option");
  return checked;
}

/** `.qq()` / `.detrended()` options, checked (`where` names the call). */
export const qqOptions = (o: QqOptions | null, where: string): QqOptions =>
  checkOptions(o, QQ_OPTION_NAMES, where);

/** `.histogram()` options, checked. */
export const histogramOptions = (o: HistogramOptions | null): HistogramOptions =>
  checkOptions(o, HISTOGRAM_OPTION_NAMES, ".histogram()");

/** `.by()` options, checked. */
export const groupOptions = (o: GroupOptions | null): GroupOptions =>
  checkOptions(o, GROUP_OPTION_NAMES, ".by()");

/** `.sentence()` options, checked. */
export const sentenceOptions = (o: SentenceOptions | null): SentenceOptions =>
  checkOptions(o, SENTENCE_OPTION_NAMES, ".sentence()");
