/**
 * Adjusting p-values when many columns or groups are tested at once.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** The adjustment methods plumbline offers. */
export type Adjustment = "holm" | "bh" | "none";

/** Each adjustment's name in words, for tables and sentences. */
export const ADJUSTMENT_NAMES: Readonly<Record<Adjustment, string>> = Object.freeze({
  holm: "Holm",
  bh: "Benjamini–Hochberg",
  none: "unadjusted",
});

/**
 * The adjustment named by an option, checked: `"holm"` when absent, and
 * `PlumbError("bad-option")` for anything that is not a method plumbline
 * offers.
 *
 * @param method the option's value
 * @example
 * ```ts
 * import { checkAdjustment } from "./multiplicity.ts";
 * if (checkAdjustment(undefined) !== "holm" || checkAdjustment("bh") !== "bh") throw new Error("adjust");
 * ```
 */
export function checkAdjustment(method: unknown): Adjustment {
  const m = method ?? "holm";
  if (m === "holm" || m === "bh" || m === "none") return m;
  return _unknownAdjustment(m);
}

function _unknownAdjustment(method: unknown): never {
  throw new PlumbError(
    "bad-option",
    `Unknown p-value adjustment "${String(method)}": use "holm", "bh" or "none"`,
  );
}

function _check(p: readonly number[]): void {
  for (let i = 0; i < p.length; i++) {
    if (!(p[i] >= 0 && p[i] <= 1)) {
      throw new PlumbError(
        "bad-option",
        `Cannot adjust p-values: entry ${i} is ${p[i]}, and p-values must lie in [0, 1]`,
      );
    }
  }
}

/**
 * Holm's step-down adjustment (Holm 1979, "A simple sequentially rejective
 * multiple test procedure", Scandinavian Journal of Statistics 6:65–70):
 * controls the family-wise error rate under any dependence. With p sorted
 * ascending, p̃₍ᵢ₎ = max_{j ≤ i} min(1, (m − j + 1)·p₍ⱼ₎). Returned in the
 * input's order.
 *
 * @param p the unadjusted p-values
 *
 * @example
 * ```ts
 * import { holmAdjust } from "@plumbline/plumbline";
 * const q = holmAdjust([0.01, 0.04, 0.03]);
 * if (q.join() !== "0.03,0.06,0.06") throw new Error(q.join());
 * ```
 */
export function holmAdjust(p: readonly number[]): number[] {
  _check(p);
  const m = p.length;
  const order = p.map((_, i) => i).sort((a, b) => p[a] - p[b] || a - b);
  const out = new Array<number>(m);
  let running = 0;
  for (let k = 0; k < m; k++) {
    const i = order[k];
    running = Math.max(running, Math.min(1, (m - k) * p[i]));
    out[i] = running;
  }
  return out;
}

/**
 * The Benjamini–Hochberg step-up adjustment (Benjamini & Hochberg 1995,
 * "Controlling the false discovery rate", Journal of the Royal Statistical
 * Society B 57:289–300): controls the false discovery rate for independent
 * or positively dependent tests. With p sorted ascending,
 * p̃₍ᵢ₎ = min_{j ≥ i} min(1, m·p₍ⱼ₎/j). Returned in the input's order.
 *
 * @param p the unadjusted p-values
 *
 * @example
 * ```ts
 * import { benjaminiHochbergAdjust } from "@plumbline/plumbline";
 * const q = benjaminiHochbergAdjust([0.01, 0.04, 0.03]);
 * if (q.join() !== "0.03,0.04,0.04") throw new Error(q.join());
 * ```
 */
export function benjaminiHochbergAdjust(p: readonly number[]): number[] {
  _check(p);
  const m = p.length;
  const order = p.map((_, i) => i).sort((a, b) => p[a] - p[b] || a - b);
  const out = new Array<number>(m);
  let running = 1;
  for (let k = m - 1; k >= 0; k--) {
    const i = order[k];
    running = Math.min(running, Math.min(1, (m * p[i]) / (k + 1)));
    out[i] = running;
  }
  return out;
}

/**
 * Adjust by the named method.
 *
 * @param p the unadjusted p-values
 * @param method `"holm"`, `"bh"` (Benjamini–Hochberg) or `"none"`
 *
 * @example
 * ```ts
 * import { adjustPValues } from "@plumbline/plumbline";
 * if (adjustPValues([0.5], "holm")[0] !== 0.5) throw new Error("one test is unchanged");
 * ```
 */
export function adjustPValues(p: readonly number[], method: Adjustment): number[] {
  if (method === "holm") return holmAdjust(p);
  if (method === "bh") return benjaminiHochbergAdjust(p);
  if (method !== "none") _unknownAdjustment(method);
  _check(p);
  return [...p];
}
