/**
 * Re-expression steps carried by a chain: what the user asked for, resolved
 * against the data into a concrete {@linkcode Reexpression} with a formula.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { checkOptions, nearestName } from "../results/options.ts";
import { logShift } from "../reexpress/log.ts";
import { applyReexpression, type Reexpression, reexpression } from "../reexpress/reexpression.ts";

/**
 * A re-expression request: a named transformation, a power with its family,
 * or `"best"` (the top of the ranked candidates).
 */
export type ReexpressRequest =
  | "log"
  | "log10"
  | "sqrt"
  | "reciprocal"
  | "best"
  | { readonly boxCox: number }
  | { readonly yeoJohnson: number }
  | { readonly log: { readonly shift?: number; readonly base?: "e" | 10 } };

/** A resolved step: the re-expression, how to write it, and why its parameters. */
export interface Step {
  /** The re-expression (plain data). */
  readonly reexpression: Reexpression;
  /** The formula with `x` for the input, e.g. `"ln(x + 0.2)"`. */
  readonly formula: string;
  /** Why a parameter has its value (e.g. the shift rule), if any. */
  readonly note?: string;
  /** Apply to values. */
  readonly apply: (x: Float64Array) => Float64Array;
}

/**
 * The formula of a re-expression with `x` for the input: its own label, and
 * plain `x` for the data as measured.
 *
 * @example
 * ```ts
 * import { formulaOf } from "./steps.ts";
 * import { reexpression } from "@plumbline/plumbline";
 * if (formulaOf(reexpression("box-cox", { lambda: 0.5 })) !== "Box–Cox[λ = 0.5](x)") throw new Error("formula");
 * ```
 */
export function formulaOf(r: Reexpression): string {
  return r.kind === "identity" ? "x" : r.label;
}

/** A step from a re-expression. */
export function stepOf(r: Reexpression, note?: string): Step {
  return Object.freeze({
    reexpression: r,
    formula: formulaOf(r),
    note,
    apply: (v: Float64Array) => applyReexpression(v, r),
  });
}

/** The re-expressions requested by name. */
const _NAMED: readonly string[] = ["log", "log10", "sqrt", "reciprocal", "best"];

/**
 * Check a request's form before any data are read, so that a mistyped
 * request fails where it is written: a known name, `{ boxCox: λ }` or
 * `{ yeoJohnson: λ }` with a finite λ, or `{ log: { shift, base } }` with a
 * finite shift and base `"e"` or `10`.
 *
 * @param request what the user asked for
 * @example
 * ```ts
 * import { checkRequest } from "./steps.ts";
 * checkRequest({ boxCox: 0.5 });
 * let refused = false;
 * try {
 *   checkRequest("logarithm" as never);
 * } catch {
 *   refused = true;
 * }
 * if (!refused) throw new Error("an unknown name is refused");
 * ```
 */
export function checkRequest(request: ReexpressRequest): void {
  if (_NAMED.includes(request as string)) return;
  if (typeof request === "object" && request !== null) {
    const r = request as Record<string, unknown>;
    const keys = Object.keys(r);
    if (keys.length === 1 && (keys[0] === "boxCox" || keys[0] === "yeoJohnson")) {
      const lambda = r[keys[0]];
      if (typeof lambda === "number" && Number.isFinite(lambda)) return;
      throw new PlumbError(
        "bad-option",
        `Cannot re-express with ${keys[0]}: ${String(lambda)}: λ must be a finite number`,
        { lambda },
      );
    }
    if (keys.length === 1 && keys[0] === "log" && typeof r.log === "object" && r.log !== null) {
      checkOptions(r.log, ["shift", "base"], "the log re-expression");
      const { shift, base } = r.log as { shift?: unknown; base?: unknown };
      const shiftOk = shift === undefined || (typeof shift === "number" && Number.isFinite(shift));
      const baseOk = base === undefined || base === "e" || base === 10;
      if (shiftOk && baseOk) return;
      throw new PlumbError(
        "bad-option",
        `Cannot re-express with log ${JSON.stringify(r.log)}: the shift must be a finite number ` +
          `and the base "e" or 10`,
      );
    }
  }
  const given = typeof request === "string"
    ? request
    : typeof request === "object" && request !== null && Object.keys(request).length === 1
    ? Object.keys(request)[0]
    : null;
  const near = given === null ? null : nearestName(given, [..._NAMED, "boxCox", "yeoJohnson"]);
  const choices = `"log", "log10", "sqrt", "reciprocal", "best", ` +
    "{ boxCox: λ }, { yeoJohnson: λ } or { log: { shift, base } }";
  throw new PlumbError(
    "bad-option",
    `Unknown re-expression ${JSON.stringify(request)}: ` +
      (near === null
        ? `use ${choices}`
        : `did you mean ${JSON.stringify(near)}? (the choices are ${choices})`),
  );
}

/**
 * Resolve a request (other than `"best"`) against the data it will apply to.
 * `"log"` on data with zeros or negatives takes the shift chosen by
 * {@linkcode logShift} and says so in `note`.
 *
 * @param request what the user asked for
 * @param x the values the step will apply to
 *
 * @example
 * ```ts
 * import { resolveStep } from "./steps.ts";
 * const s = resolveStep("log", new Float64Array([0, 0.4, 2, 7]));
 * if (s.formula !== "ln(x + 0.2)") throw new Error(s.formula);
 * ```
 */
export function resolveStep(request: Exclude<ReexpressRequest, "best">, x: Float64Array): Step {
  if (
    request === "log" || request === "log10" ||
    (typeof request === "object" && request !== null && "log" in request)
  ) {
    const base = request === "log10"
      ? 10
      : typeof request === "object"
      ? request.log.base ?? "e"
      : "e";
    let shift = typeof request === "object" ? request.log.shift : undefined;
    let note: string | undefined;
    if (shift === undefined) {
      const s = logShift(x);
      shift = s.shift;
      if (shift !== 0) note = s.rule;
    }
    return stepOf(reexpression("log", { base, shift }), note);
  }
  if (request === "sqrt") return stepOf(reexpression("square-root"));
  if (request === "reciprocal") return stepOf(reexpression("reciprocal"));
  if (typeof request === "object" && request !== null && "boxCox" in request) {
    return stepOf(reexpression("box-cox", { lambda: request.boxCox }));
  }
  if (typeof request === "object" && request !== null && "yeoJohnson" in request) {
    return stepOf(reexpression("yeo-johnson", { lambda: request.yeoJohnson }));
  }
  checkRequest(request); // throws, naming the requests there are
  throw new RangeError(`resolveStep: no rule for ${JSON.stringify(request)}`);
}

/**
 * The label of a column after its steps, e.g. `"ln(oxygen_ppb + 2)"`.
 *
 * @example
 * ```ts
 * import { resolveStep, stepLabel } from "./steps.ts";
 * const steps = [resolveStep("sqrt", new Float64Array([1, 4]))];
 * if (stepLabel("count", steps) !== "√(count)") throw new Error(stepLabel("count", steps));
 * const twice = [resolveStep("reciprocal", new Float64Array([1, 4])), resolveStep("reciprocal", new Float64Array([1, 4]))];
 * if (stepLabel("count", twice) !== "1/(1/count)") throw new Error(stepLabel("count", twice));
 * ```
 */
export function stepLabel(name: string, steps: readonly Step[]): string {
  let label = name;
  for (const s of steps) {
    // Where x stands bare (1/x), anything but a single word is bracketed: 1/(1/x), 1/(fill volume).
    const bare = !/\(x[ )]/.test(s.formula);
    const inner = bare && !/^[\p{L}\p{N}_.]+$/u.test(label) ? `(${label})` : label;
    label = s.formula.replace(/\bx\b/, () => inner);
  }
  return label;
}

/**
 * Steps as plain data (without their functions), for `toJSON()`.
 *
 * @example
 * ```ts
 * import { resolveStep, stepsData } from "./steps.ts";
 * if (stepsData([resolveStep("sqrt", new Float64Array([1, 4]))])[0].formula !== "√(x)") throw new Error("data");
 * ```
 */
export function stepsData(steps: readonly Step[]): Omit<Step, "apply">[] {
  return steps.map((s) => ({ reexpression: s.reexpression, formula: s.formula, note: s.note }));
}

/** What a `.reexpress()` request became: the re-expression applied, or none, and why. */
export interface ReexpressionChoice {
  /** What was asked for. */
  readonly request: ReexpressRequest;
  /** The re-expression applied; `null` when the data are kept as they are. */
  readonly reexpression: Reexpression | null;
  /** Why: what `"best"` chose (or why it kept the data), the shift rule for a chosen log. */
  readonly reason: string;
}
