/**
 * A small seeded pseudo-random generator, so that every simulation in
 * plumbline (envelopes, demo data, tests) is reproducible byte for byte.
 *
 * Generator: xoshiro128** (Blackman & Vigna 2018, "Scrambled linear
 * pseudorandom number generators", arXiv:1805.01407; ACM Transactions on
 * Mathematical Software 47(4):36, 2021), 32-bit state words seeded by
 * SplitMix32-style mixing of the seed. Uniforms carry 53 random bits;
 * normals are Φ⁻¹ of a uniform (inversion), which keeps one draw per value.
 *
 * @module
 */
import { normalQuantile } from "./normal.ts";

/** A seeded stream of random numbers. */
export interface RandomStream {
  /** A uniform draw in the open interval (0, 1). */
  uniform(): number;
  /** A standard normal draw. */
  normal(): number;
  /** A uniform integer in [0, n). */
  integer(n: number): number;
}

function _mix32(z: number): number {
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * A reproducible random stream from an integer seed.
 *
 * @param seed any integer; the same seed always gives the same stream
 *
 * @example
 * ```ts
 * import { seededRandom } from "@plumbline/plumbline";
 * const a = seededRandom(7), b = seededRandom(7);
 * if (a.normal() !== b.normal()) throw new Error("not reproducible");
 * ```
 */
export function seededRandom(seed: number): RandomStream {
  let s0 = _mix32((seed | 0) + 0x9e3779b9);
  let s1 = _mix32(s0 + 0x9e3779b9);
  let s2 = _mix32(s1 + 0x9e3779b9);
  let s3 = _mix32(s2 + 0x9e3779b9);
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
  const next = (): number => {
    const r = Math.imul(_rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = _rotl(s3, 11);
    return r;
  };
  const uniform = (): number => {
    for (;;) {
      const hi = next() >>> 5; // 27 bits
      const lo = next() >>> 6; // 26 bits
      const u = (hi * 67108864 + lo) / 9007199254740992;
      if (u > 0) return u;
    }
  };
  return Object.freeze({
    uniform,
    normal: () => normalQuantile(uniform()),
    integer: (n: number) => Math.floor(uniform() * n),
  });
}

function _rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/**
 * A seeded random subsample of `size` values, without replacement, in the
 * order drawn: the first `size` steps of a Fisher–Yates shuffle (Durstenfeld
 * 1964, Communications of the ACM 7:420, Algorithm 235) driven by
 * {@linkcode seededRandom}. The shuffled index array is kept sparse (only
 * the positions the shuffle has touched), so the memory used grows with
 * `size`, not with `x.length`. The same seed always draws the same values.
 *
 * @param x the values (not modified)
 * @param size how many to draw, 0 ≤ size ≤ x.length
 * @param seed the seed
 * @example
 * ```ts
 * import { randomSubsample } from "@plumbline/plumbline";
 * const x = Float64Array.from({ length: 100 }, (_, i) => i);
 * const a = randomSubsample(x, 10, 3);
 * if (a.join() !== randomSubsample(x, 10, 3).join() || new Set(a).size !== 10) throw new Error("draw");
 * ```
 */
export function randomSubsample(x: Float64Array, size: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  const moved = new Map<number, number>(); // position → index now there, where not the identity
  const out = new Float64Array(size);
  for (let i = 0; i < size; i++) {
    const j = i + rng.integer(x.length - i);
    const atJ = moved.get(j) ?? j;
    moved.set(j, moved.get(i) ?? i);
    moved.delete(i);
    out[i] = x[atJ];
  }
  return out;
}
