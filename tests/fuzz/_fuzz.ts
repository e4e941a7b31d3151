/**
 * Shared settings and helpers for the property and fuzz suite: fixed seeds,
 * run counts scaled ×50 when `PLUMBLINE_SOAK=1`, case counters, a NaN-free
 * walk over result objects, and samples with extreme floating-point values.
 *
 * @module
 */
import { seededRandom } from "../../lib/numeric/random.ts";
import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";

/** True when the long opt-in soak run was asked for (`PLUMBLINE_SOAK=1`). */
export const SOAK: boolean = Deno.env.get("PLUMBLINE_SOAK") === "1";

/** The number of runs for a property: `base` by default, 50 × `base` in a soak run. */
export function runs(base: number): number {
  return SOAK ? base * 50 : base;
}

/** Counts the cases a property tried; `report()` prints the count for the README. */
export class CaseCounter {
  #n = 0;
  readonly #name: string;
  constructor(name: string) {
    this.#name = name;
  }
  /** Count one case. */
  add(k = 1): void {
    this.#n += k;
  }
  /** How many cases were counted. */
  get count(): number {
    return this.#n;
  }
  /** Print `fuzz cases: <name> = <count>`. */
  report(): void {
    console.log(`fuzz cases: ${this.#name} = ${this.#n}${SOAK ? " (soak)" : ""}`);
  }
}

/**
 * Every number reachable from `v` (own enumerable properties, arrays and
 * typed arrays, recursively) is finite; returns the paths of those that are not.
 */
export function nonFinitePaths(v: unknown, path = "$", out: string[] = []): string[] {
  if (typeof v === "number") {
    if (!Number.isFinite(v)) out.push(`${path} = ${v}`);
  } else if (ArrayBuffer.isView(v) && !(v instanceof DataView)) {
    const a = v as unknown as ArrayLike<number | bigint>;
    for (let i = 0; i < a.length; i++) nonFinitePaths(a[i], `${path}[${i}]`, out);
  } else if (v !== null && typeof v === "object") {
    for (const [k, e] of Object.entries(v)) nonFinitePaths(e, `${path}.${k}`, out);
  }
  return out;
}

/** Assert that `v` holds no NaN or ±Infinity anywhere. */
export function assertAllFinite(v: unknown, what: string): void {
  const bad = nonFinitePaths(v);
  assert.deepEqual(bad.slice(0, 8), [], `${what}: non-finite numbers in the result`);
}

/**
 * Run `f`; when it throws, the error must be a `PlumbError` whose code is in
 * `codes`. Returns the result, or the error's code prefixed by `"error:"`.
 */
export function outcome<T>(
  f: () => T,
  codes: readonly string[],
  what: string,
): { ok: true; value: T } | { ok: false; code: string; message: string } {
  try {
    return { ok: true, value: f() };
  } catch (e) {
    if (!(e instanceof PlumbError)) {
      throw new assert.AssertionError({
        message: `${what}: threw ${(e as Error)?.constructor?.name} instead of PlumbError: ${
          (e as Error)?.message
        }`,
      });
    }
    assert.ok(codes.includes(e.code), `${what}: unexpected code ${e.code}: ${e.message}`);
    assert.ok(/^[A-Z]/.test(e.message) && !e.message.endsWith("."), `${what}: message style`);
    return { ok: false, code: e.code, message: e.message };
  }
}

/** The double `k` units in the last place away from `x` (k may be negative), via its bits. */
export function ulpStep(x: number, k: number): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  let bits = view.getBigInt64(0);
  // Map the sign-magnitude order onto integers so that stepping crosses zero correctly.
  let ord = bits < 0n ? -(bits & 0x7fffffffffffffffn) : bits;
  ord += BigInt(k);
  bits = ord < 0n ? (-ord) | -0x8000000000000000n : ord;
  view.setBigInt64(0, bits);
  const y = view.getFloat64(0);
  return Number.isFinite(y) ? y : x;
}

/** Uniforms in (0, 1) from plumbline's seeded generator, for large samples built from one seed. */
export function prng(seed: number): () => number {
  const rng = seededRandom(seed);
  return () => rng.uniform();
}

/** The kinds of extreme sample {@linkcode extremeSample} builds. */
export const SAMPLE_KINDS = [
  "ordinary",
  "subnormal",
  "huge",
  "huge-both-signs",
  "max-both-signs",
  "tiny-and-huge",
  "last-bit",
  "last-bit-huge",
  "last-bit-subnormal",
  "wide-exponents",
  "ties",
  "integers",
] as const;
/** One kind of extreme sample. */
export type SampleKind = typeof SAMPLE_KINDS[number];

/**
 * A seeded sample of `n` finite doubles of the given kind: subnormals,
 * values near ±1e308, 1e308 beside 1e-308, values a few bits apart.
 */
export function extremeSample(kind: SampleKind, n: number, seed: number): number[] {
  const r = prng(seed);
  const sign = () => (r() < 0.5 ? -1 : 1);
  const out: number[] = new Array(n);
  const base = [1, 0.1, 1e300, -7.5e-301, 123456.789, Number.MAX_VALUE / 3, 2 ** -1022][
    Math.floor(r() * 7)
  ];
  for (let i = 0; i < n; i++) {
    let v: number;
    switch (kind) {
      case "ordinary":
        v = (r() - 0.5) * 10 ** Math.floor(r() * 12 - 6);
        break;
      case "subnormal":
        v = Math.floor(r() * 2 ** 20 + 1) * 5e-324 * (r() < 0.2 ? -1 : 1);
        break;
      case "huge":
        v = Number.MAX_VALUE * (0.05 + 0.95 * r());
        break;
      case "huge-both-signs":
        v = sign() * Number.MAX_VALUE * (0.01 + 0.99 * r());
        break;
      case "max-both-signs":
        v = r() < 0.3 ? 0 : sign() * Number.MAX_VALUE;
        break;
      case "tiny-and-huge":
        v = r() < 0.5 ? 1e-308 * (1 + r() * 100) : 1e308 * (1 + r() * 0.79);
        break;
      case "last-bit":
        v = ulpStep(base, Math.floor(r() * 7) - 3);
        break;
      case "last-bit-huge":
        v = ulpStep(Number.MAX_VALUE, -Math.floor(r() * 5));
        break;
      case "last-bit-subnormal":
        v = ulpStep(0, Math.floor(r() * 9) - 4);
        break;
      case "wide-exponents":
        v = sign() * 2 ** (Math.floor(r() * 2098) - 1074);
        break;
      case "ties":
        v = Math.floor(r() * 3);
        break;
      case "integers":
        v = Math.floor(r() * 2001) - 1000;
        break;
    }
    out[i] = Number.isFinite(v) ? v : 0;
  }
  return out;
}
