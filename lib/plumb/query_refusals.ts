/**
 * What a chain over a scanned source does not offer, and the re-expressions
 * whose domain the range of every value rules out: each a `PlumbError`
 * that names what to do instead, never a crash or a silent change of the
 * data.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import type { Reexpression } from "../reexpress/reexpression.ts";

const _INSTEAD: Readonly<Record<string, string>> = {
  ".lambda()": "the Box–Cox λ over every value and its interval are in " +
    "(await scan(source).analyse(column)).boxCox; for the profile chart, load the column " +
    '(or a sample of it, e.g. scan("SELECT … USING SAMPLE 100000 ROWS")) into memory and ' +
    "call plumb(table, column).lambda()",
  ".stakes()": "load the column into memory (loadTable, or a sample of it through an SQL " +
    "query) and call plumb(table, column).stakes(), checking the result against your own " +
    "procedures",
  ".residuals()": 'compute the residuals in the SQL query (e.g. scan("SELECT y - (a + b * x) ' +
    'AS residual FROM …")) and screen that column, or use .by(group) for residuals from ' +
    "group means",
  ".values()": "the values stay in the engine; read them with DuckDB or load them into memory",
  ".reexpress() twice": "re-express once with the combined step, e.g. .reexpress({ boxCox: λ }), " +
    "or write the re-expression in the SQL query",
};

/**
 * Refuse a chain call a scanned source does not offer.
 *
 * @param call the call, e.g. `".lambda()"`
 * @throws {PlumbError} always, code `"unavailable"`
 * @example
 * ```ts
 * import { refuseOnScan } from "./query_refusals.ts";
 * try {
 *   refuseOnScan(".lambda()");
 * } catch (e) {
 *   if (!/\.boxCox/.test((e as Error).message)) throw e;
 * }
 * ```
 */
export function refuseOnScan(call: string): never {
  throw new PlumbError(
    "unavailable",
    `Cannot run ${call} on a scanned source: ${_INSTEAD[call] ?? "load the column into memory"}`,
    { call },
  );
}

/**
 * Check that a re-expression is defined on every value of a scanned column,
 * whose smallest and largest values are known (the engine would otherwise
 * fail on a logarithm of zero, or give ±Infinity for 1/0).
 *
 * @param column the column's name, for the message
 * @param r the re-expression
 * @param range the smallest and largest finite value
 * @throws {PlumbError} `"non-positive"` or `"zero"` naming the smallest value and what to use
 * @example
 * ```ts
 * import { scanStepDomain } from "./query_refusals.ts";
 * import { reexpression } from "../reexpress/reexpression.ts";
 * scanStepDomain("fill", reexpression("log"), [0.5, 9]); // defined: no error
 * ```
 */
export function scanStepDomain(
  column: string,
  r: Reexpression,
  range: readonly [number, number],
): void {
  const [lo, hi] = range;
  const fail = (code: "non-positive" | "zero", need: string) => {
    throw new PlumbError(
      code,
      `Cannot re-express ${JSON.stringify(column)} by ${r.label}: ${need}, and its values run ` +
        `from ${lo} to ${hi}; use { yeoJohnson: λ }, or a log with a shift ` +
        `({ log: { shift } }) that makes every value positive`,
      { min: lo, max: hi },
    );
  };
  if (r.kind === "log" && !(lo + r.shift > 0)) fail("non-positive", "the log needs x + shift > 0");
  if (r.kind === "square-root" && !(lo + r.shift >= 0)) {
    fail("non-positive", "the square root needs x + shift ≥ 0");
  }
  if (r.kind === "box-cox" && !(lo > 0)) fail("non-positive", "Box–Cox needs positive values");
  if (r.kind === "reciprocal" && lo <= 0 && hi >= 0) {
    fail("zero", "1/x needs every value on one side of zero");
  }
}
