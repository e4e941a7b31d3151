/**
 * What specification limits say about the data three ways: the fraction
 * outside under the normal fit, under the normal fit on a re-expressed
 * scale (limits mapped there), and as observed, with an exact
 * Clopper–Pearson interval; and the capability indices that go with each
 * (Cp/Cpk with their published intervals, the same on the re-expressed
 * scale, and the percentile-based indices).
 *
 * @module
 */
import { normalCdf, normalSf } from "../numeric/normal.ts";
import { type Capability, capabilityIndices } from "../stats/capability.ts";
import { type PercentileCapability, percentileCapability } from "../stats/percentile_capability.ts";
import { clopperPearson } from "../stats/proportion_interval.ts";
import { type _ScaleModel, _toScale } from "./_model.ts";

/** Fractions outside the limits: plain, frozen data. */
export interface OutsideFractions {
  /** The lower limit, or `null`. */
  readonly lower: number | null;
  /** The upper limit, or `null`. */
  readonly upper: number | null;
  /** Fraction outside under the normal fit. */
  readonly normal: number;
  /** Below the lower and above the upper limit, under the normal fit. */
  readonly normalSides: readonly [number, number];
  /** Fraction outside under the normal fit on the re-expressed scale, or `null` without one. */
  readonly reexpressed: number | null;
  /** Below and above, under the re-expressed fit. */
  readonly reexpressedSides: readonly [number, number] | null;
  /** Observed fraction outside (below the lower or above the upper limit; on a limit is inside). */
  readonly observed: number;
  /** Observed counts below and above. */
  readonly observedCounts: readonly [number, number];
  /** Clopper–Pearson interval of the observed fraction. */
  readonly observedCi: readonly [number, number];
  /** Confidence level of `observedCi`. */
  readonly level: number;
}

/** Capability three ways: plain, frozen data. */
export interface CapabilityStakes {
  /** Cp/Cpk on the data as measured (normal model). */
  readonly normal: Capability;
  /** Cp/Cpk on the re-expressed scale with the limits mapped there, or `null`. */
  readonly reexpressed: Capability | null;
  /** The percentile-based indices (no distribution assumed). */
  readonly percentile: PercentileCapability;
  /** Limits that have no image on the re-expressed scale, and other remarks. */
  readonly notes: readonly string[];
}

/**
 * The limits on the re-expressed scale, in that scale's order. A lower limit
 * below the re-expression's domain (or an upper limit above it) bounds
 * nothing there and becomes `null`; a limit on the wrong side of the domain
 * (every value beyond it) leaves no re-expressed figures at all (`null`).
 */
function _scaledLimits(
  lower: number | null,
  upper: number | null,
  m: _ScaleModel,
  notes: string[],
): { lower: number | null; upper: number | null } | null {
  const [d0, d1] = m.domain;
  if ((lower !== null && lower >= d1) || (upper !== null && upper <= d0)) {
    notes.push(
      `A limit lies where ${m.reexpression.label} cannot represent the values beyond it ` +
        "(every value is on the far side), so no re-expressed figures are given",
    );
    return null;
  }
  const map = (v: number | null, side: string) => {
    if (v === null) return null;
    const y = _toScale(v, m);
    if (y === null) {
      notes.push(
        `The ${side} limit ${v} lies outside the values ${m.reexpression.label} accepts: on that ` +
          "scale nothing falls beyond it, so that side counts nothing in the re-expressed figures",
      );
    }
    return y;
  };
  const a = map(lower, "lower");
  const b = map(upper, "upper");
  return m.increasing ? { lower: a, upper: b } : { lower: b, upper: a };
}

/**
 * Fractions outside and capability, from an ascending sample.
 *
 * @param sorted the sample, ascending, finite, at least 2 values
 * @param shape its mean and sd (divisor n − 1)
 * @param options limits (already checked), the confidence level, the re-expressed model
 */
export function _specification(
  sorted: Float64Array,
  shape: { readonly mean: number; readonly sd: number },
  options: { lower: number | null; upper: number | null; level: number; model: _ScaleModel | null },
): { outside: OutsideFractions; capability: CapabilityStakes } {
  const { lower, upper, level, model } = options;
  const n = sorted.length;
  const notes: string[] = [];
  const zLo = (v: number | null, mean: number, sd: number) =>
    v === null ? 0 : normalCdf((v - mean) / sd);
  const zHi = (v: number | null, mean: number, sd: number) =>
    v === null ? 0 : normalSf((v - mean) / sd);
  const normalSides = [zLo(lower, shape.mean, shape.sd), zHi(upper, shape.mean, shape.sd)] as const;

  let below = 0;
  let above = 0;
  for (let i = 0; i < n && lower !== null && sorted[i] < lower; i++) below++;
  for (let i = n - 1; i >= 0 && upper !== null && sorted[i] > upper; i--) above++;
  const observedCi = clopperPearson(below + above, n, { level });

  let reexpressedSides: readonly [number, number] | null = null;
  let reexpressedCap: Capability | null = null;
  const s = model === null ? null : _scaledLimits(lower, upper, model, notes);
  if (model !== null && s !== null) {
    const sides = [zLo(s.lower, model.mean, model.sd), zHi(s.upper, model.mean, model.sd)];
    // in original units, "below the lower limit" is the low side of the scale only if it keeps order
    reexpressedSides = Object.freeze(
      (model.increasing ? sides : [sides[1], sides[0]]) as [number, number],
    );
    if (s.lower !== null || s.upper !== null) {
      reexpressedCap = capabilityIndices(
        { n, mean: model.mean, sd: model.sd },
        { lower: s.lower ?? undefined, upper: s.upper ?? undefined, level },
      );
    }
  }
  const outside: OutsideFractions = Object.freeze({
    lower,
    upper,
    normal: normalSides[0] + normalSides[1],
    normalSides: Object.freeze(normalSides),
    reexpressed: reexpressedSides === null ? null : reexpressedSides[0] + reexpressedSides[1],
    reexpressedSides,
    observed: (below + above) / n,
    observedCounts: Object.freeze([below, above] as const),
    observedCi,
    level,
  });
  const limits = { lower: lower ?? undefined, upper: upper ?? undefined };
  const capability: CapabilityStakes = Object.freeze({
    normal: capabilityIndices({ n, mean: shape.mean, sd: shape.sd }, { ...limits, level }),
    reexpressed: reexpressedCap,
    percentile: percentileCapability(sorted, limits),
    notes: Object.freeze(notes),
  });
  return { outside, capability };
}
