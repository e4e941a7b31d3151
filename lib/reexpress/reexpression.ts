/**
 * A re-expression as plain data, and applying or inverting it.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { formatCompact } from "../results/format.ts";
import { boxCox, boxCoxInverse } from "./box_cox.ts";
import { logInverse, logTransform } from "./log.ts";
import { reciprocal, reciprocalInverse } from "./reciprocal.ts";
import { squareRoot, squareRootInverse } from "./square_root.ts";
import { yeoJohnson, yeoJohnsonInverse } from "./yeo_johnson.ts";

/** The kinds of re-expression plumbline tries. */
export type ReexpressionKind =
  | "identity"
  | "log"
  | "square-root"
  | "reciprocal"
  | "box-cox"
  | "yeo-johnson";

/** Which re-expression, with its parameters: plain, frozen, JSON-serialisable. */
export interface Reexpression {
  /** The family. */
  readonly kind: ReexpressionKind;
  /** The power for `"box-cox"` and `"yeo-johnson"`; `null` otherwise. */
  readonly lambda: number | null;
  /** The constant added first (`"log"` and `"square-root"`); 0 otherwise. */
  readonly shift: number;
  /** The log base for `"log"`; `null` otherwise. */
  readonly base: "e" | 10 | null;
  /** How to write it, e.g. `"log(x + 0.2)"`, `"Box–Cox[λ = 0.25](x)"`. */
  readonly label: string;
}

const _num = (v: number): string => formatCompact(v, 4);

/**
 * Build a {@linkcode Reexpression}, checking its parameters.
 *
 * @param kind the family
 * @param options λ (required for the power families), shift and base
 * @example
 * ```ts
 * import { reexpression } from "@plumbline/plumbline";
 * const r = reexpression("log", { shift: 0.5, base: 10 });
 * if (r.label !== "log10(x + 0.5)") throw new Error(r.label);
 * ```
 */
export function reexpression(
  kind: ReexpressionKind,
  options: {
    /**
     * The power, for `"box-cox"` and `"yeo-johnson"`.
     * @default undefined (required for those two)
     */
    readonly lambda?: number;
    /**
     * Constant added first, for `"log"` and `"square-root"`.
     * @default 0
     */
    readonly shift?: number;
    /**
     * Log base, for `"log"`.
     * @default "e"
     */
    readonly base?: "e" | 10;
  } = {},
): Reexpression {
  const power = kind === "box-cox" || kind === "yeo-johnson";
  const lambda = options.lambda;
  if (power && (typeof lambda !== "number" || !Number.isFinite(lambda))) {
    throw new PlumbError(
      "bad-option",
      `Cannot build a ${kind} re-expression without λ: pass { lambda } as a finite number`,
      { lambda },
    );
  }
  const shift = kind === "log" || kind === "square-root" ? options.shift ?? 0 : 0;
  if (!Number.isFinite(shift)) {
    throw new PlumbError("bad-option", `Cannot use shift ${shift}: use a finite number`, { shift });
  }
  const base = kind === "log" ? options.base ?? "e" : null;
  const inner = shift === 0 ? "x" : shift > 0 ? `x + ${_num(shift)}` : `x − ${_num(-shift)}`;
  const label = kind === "identity"
    ? "x (as measured)"
    : kind === "log"
    ? `${base === 10 ? "log10" : "ln"}(${inner})`
    : kind === "square-root"
    ? `√(${inner})`
    : kind === "reciprocal"
    ? "1/x"
    : `${kind === "box-cox" ? "Box–Cox" : "Yeo–Johnson"}[λ = ${_num(lambda!)}](x)`;
  return Object.freeze({ kind, lambda: power ? lambda! : null, shift, base, label });
}

/**
 * Apply a re-expression to data.
 *
 * @param x the data, in original units
 * @param r the re-expression
 * @example
 * ```ts
 * import { applyReexpression, reexpression } from "@plumbline/plumbline";
 * const y = applyReexpression([1, 100], reexpression("log", { base: 10 }));
 * if (y[1] !== 2) throw new Error("unexpected");
 * ```
 */
export function applyReexpression(x: ArrayLike<number>, r: Reexpression): Float64Array {
  switch (r.kind) {
    case "identity":
      return Float64Array.from(x);
    case "log":
      return logTransform(x, { shift: r.shift, base: r.base ?? "e" });
    case "square-root":
      return squareRoot(x, { shift: r.shift });
    case "reciprocal":
      return reciprocal(x);
    case "box-cox":
      return boxCox(x, r.lambda!);
    case "yeo-johnson":
      return yeoJohnson(x, r.lambda!);
  }
}

/**
 * Apply a re-expression to values sorted ascending and return the results
 * ascending, so that candidates share one sort of the data: every
 * re-expression here is monotone, so the results are already in order, or
 * in reverse order for one that reverses it (the reciprocal). Should
 * rounding ever break the order, they are sorted again. Values that are not
 * finite (an overflowing power) are left where they fall; check before use.
 *
 * @param sorted the data, ascending, in original units
 * @param r the re-expression
 * @example
 * ```ts
 * import { applyToSorted, reexpression } from "./reexpression.ts";
 * const y = applyToSorted(new Float64Array([1, 2, 4]), reexpression("reciprocal"));
 * if (y.join() !== "0.25,0.5,1") throw new Error(y.join());
 * ```
 */
export function applyToSorted(sorted: Float64Array, r: Reexpression): Float64Array {
  const y = applyReexpression(sorted, r);
  const n = y.length;
  if (n > 1 && y[0] > y[n - 1]) y.reverse();
  for (let i = 1; i < n; i++) {
    if (y[i] < y[i - 1]) return sortFloat64(y);
  }
  return y;
}

/**
 * Map values on the re-expressed scale back to original units (NaN where a
 * value has no preimage).
 *
 * @param y values on the re-expressed scale
 * @param r the re-expression
 * @example
 * ```ts
 * import { invertReexpression, reexpression } from "@plumbline/plumbline";
 * const x = invertReexpression([2], reexpression("box-cox", { lambda: 0.5 }));
 * if (Math.abs(x[0] - 4) > 1e-14) throw new Error("unexpected");
 * ```
 */
export function invertReexpression(y: ArrayLike<number>, r: Reexpression): Float64Array {
  switch (r.kind) {
    case "identity":
      return Float64Array.from(y);
    case "log":
      return logInverse(y, { shift: r.shift, base: r.base ?? "e" });
    case "square-root":
      return squareRootInverse(y, { shift: r.shift });
    case "reciprocal":
      return reciprocalInverse(y);
    case "box-cox":
      return boxCoxInverse(y, r.lambda!);
    case "yeo-johnson":
      return yeoJohnsonInverse(y, r.lambda!);
  }
}
