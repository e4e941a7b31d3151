/**
 * Input checks of the model design: missing values, constant columns,
 * interaction terms. Private to `lib/stats`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";

/** A main-effect term as given: its kind, name and raw values. */
export interface _Part {
  readonly kind: "factor" | "covariate";
  readonly name: string;
  readonly raw: ArrayLike<unknown>;
}

/**
 * A numeric column as doubles, NaN where missing (NaN, null, undefined);
 * throws `"non-numeric"` for text and `"non-finite"` for ±Infinity. A
 * `Float64Array` is checked and returned as it is (not copied).
 */
export function _numbers(raw: ArrayLike<unknown>, name: string): Float64Array {
  const len = raw.length;
  if (raw instanceof Float64Array) {
    for (let i = 0; i < len; i++) {
      const v = raw[i];
      if (v - v !== 0 && v === v) _infinite(name, i, v);
    }
    return raw;
  }
  const out = new Float64Array(len);
  for (let i = 0; i < len; i++) {
    const v = raw[i];
    if (typeof v === "number") {
      if (v - v !== 0 && v === v) _infinite(name, i, v);
      out[i] = v;
    } else if (v === null || v === undefined) {
      out[i] = NaN;
    } else {
      throw new PlumbError(
        "non-numeric",
        `Cannot use ${name} as a numeric column: position ${i} holds ${
          JSON.stringify(String(v))
        }; ` +
          `give numbers (NaN or null for missing), or use ${name} as a factor`,
        { column: name, position: i },
      );
    }
  }
  return out;
}

function _infinite(name: string, i: number, v: number): never {
  throw new PlumbError(
    "non-finite",
    `Cannot fit a model with ${name} = ${v} at position ${i}: values must be finite numbers; ` +
      `remove or replace that value`,
    { column: name, position: i },
  );
}

/** Whether a factor label is missing (null, undefined, "" or NaN). */
export function _missingLabel(v: unknown): boolean {
  return v === null || v === undefined || v === "" || (typeof v === "number" && v !== v);
}

/** The `"constant"` error for a covariate or response that holds one value on every complete row. */
export function _constantError(
  name: string,
  role: "covariate" | "response",
  value: number,
  n: number,
): PlumbError {
  return new PlumbError(
    "constant",
    `Cannot use ${name} as the ${role}: it holds ${value} in all ${n} complete rows; ` +
      (role === "covariate"
        ? `a constant is already in the model as the intercept, so leave it out`
        : `a response with no spread has no residuals to judge; check the column`),
    { column: name, value },
  );
}

/** Check the interactions and put each one's parts in term order; duplicates are dropped. */
export function _checkInteractions(
  list: readonly (readonly string[])[],
  parts: readonly _Part[],
): string[][] {
  const names = new Set(parts.map((p) => p.name));
  const done = new Set<string>();
  const out: string[][] = [];
  for (const raw of list) {
    const inter = [...raw];
    const label = inter.join(" × ");
    if (inter.length < 2 || new Set(inter).size !== inter.length) {
      throw new PlumbError(
        "bad-option",
        `Cannot build the interaction ${label || "(empty)"}: name two or more different terms`,
      );
    }
    for (const nm of inter) {
      if (!names.has(nm)) {
        throw new PlumbError(
          "unknown-column",
          `Cannot build the interaction ${label}: ${nm} is not a covariate or factor of the ` +
            `model (terms: ${[...names].join(", ") || "none"}); add it as a term first`,
          { column: nm },
        );
      }
    }
    const order = parts.map((p) => p.name).filter((nm) => inter.includes(nm));
    const key = order.join("\u0000");
    if (done.has(key)) continue;
    done.add(key);
    out.push(order);
  }
  return out;
}
