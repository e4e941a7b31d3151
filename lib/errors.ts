/**
 * The one error class plumbline throws on purpose. Every failure a user can
 * cause (too few values, text in a numeric column, a malformed CSV line)
 * arrives as a `PlumbError` whose `code` says what kind of problem it is, and
 * whose message says what was wrong and what to do next.
 *
 * @module
 */

/** The kinds of problem a {@linkcode PlumbError} can report. */
export type PlumbErrorCode =
  /** Fewer values than the method needs. */
  | "too-few"
  /** More values than the method's published range covers. */
  | "too-many"
  /** NaN, ±Infinity or a value that is not a number. */
  | "non-finite"
  /** Every value is the same (zero range). */
  | "constant"
  /** A value ≤ 0 where the transformation needs positive data. */
  | "non-positive"
  /** A zero where the transformation divides by the value. */
  | "zero"
  /** Text found in a column that was asked for as numbers. */
  | "non-numeric"
  /** A CSV source that cannot be read as a table. */
  | "malformed"
  /** A file that does not exist. */
  | "not-found"
  /** A column or group that the table does not have. */
  | "unknown-column"
  /** An option outside its allowed values. */
  | "bad-option"
  /** A numerical search that did not converge. */
  | "no-convergence"
  /** A tool plumbline needs at run time (the PNG renderer or its font) could not be loaded. */
  | "unavailable"
  /** Values recorded below or above a limit where a method needs measured values. */
  | "censored"
  /** A file type (by its extension) that this display cannot be saved as. */
  | "unsupported-format"
  /** A model term that earlier terms already explain (aliased, collinear). */
  | "collinear"
  /** Left- and right-censoring limits that overlap, so the order of the values is unknown. */
  | "overlapping-limits"
  /** A query the SQL engine could not run (its message follows). */
  | "query-failed"
  /** Work stopped on request before it finished (nothing partial was kept). */
  | "cancelled";

/**
 * An error raised by plumbline for input it cannot use.
 *
 * @example
 * ```ts
 * import { PlumbError } from "@plumbline/plumbline";
 * const e = new PlumbError("too-few", "Cannot run the test on 2 values: at least 3 are needed");
 * if (!(e instanceof Error) || e.code !== "too-few") throw new Error("unexpected");
 * ```
 */
export class PlumbError extends Error {
  /** What kind of problem this is; stable, safe to branch on. */
  readonly code: PlumbErrorCode;
  /** Optional structured detail (positions, counts), for programs. */
  readonly detail: Readonly<Record<string, unknown>> | undefined;

  /**
   * Make the error.
   *
   * @param code the kind of problem
   * @param message what was wrong and what to do, in a sentence without a trailing period
   * @param detail optional structured detail
   */
  constructor(
    code: PlumbErrorCode,
    message: string,
    detail?: Readonly<Record<string, unknown>>,
  ) {
    super(message);
    this.name = "PlumbError";
    this.code = code;
    this.detail = detail;
  }
}
