/**
 * The evidence a reading rests on, gathered from one sorted sample: the
 * measurement step and whether it is coarse against the spread, outliers by
 * the generalized ESD procedure, a separate cluster, the Shapiro–Wilk
 * geometry (the order-statistic slope beside the sd), and the verdict the
 * rules in `reading_rules.ts` draw from them.
 *
 * @module
 */
import { _separateClusterSorted, type ClusterResult } from "../stats/clusters.ts";
import { _measurementStepSorted } from "../stats/measurement_step.ts";
import type { Moments } from "../stats/moments.ts";
import { _generalizedEsdSorted, type OutlierResult } from "../stats/outliers.ts";
import { judgeRounding, type RoundingJudgement } from "../stats/rounding.ts";
import {
  _shapiroWilkGeometrySorted,
  type ShapiroWilkGeometry,
} from "../stats/shapiro_wilk_geometry.ts";
import { decideVerdict, READING_RULES, type VerdictGrounds } from "./reading_rules.ts";

/** What {@linkcode gatherEvidence} needs beside the sorted sample. */
export interface EvidenceInput {
  /** The moments of the sample (absent below 4 values). */
  readonly moments?: Moments;
  /** Shapiro–Wilk p and the number of values it used (≤ 5,000). */
  readonly primary: { readonly pValue: number; readonly n: number };
  /**
   * The measurement step of the data the values come from, when the caller
   * knows it (residuals inherit their data's step); otherwise found here.
   * `null` means "no step".
   * @default found from the values
   */
  readonly step?: number | null;
  /** The sample sd, when there are no moments (n = 3). */
  readonly sd?: number;
  /**
   * The sorted values Shapiro–Wilk ran on, when a subsample: the σ estimates
   * behind W are taken on the same values as W.
   * @default the sample itself
   */
  readonly primarySorted?: Float64Array;
}

/** Everything the reading weighs, as frozen plain data. */
export interface ReadingEvidence {
  /** The measurement step (inherited or found) and distinct values. */
  readonly step: number | null;
  readonly distinct: number;
  /** The step against the spread. */
  readonly rounding: RoundingJudgement;
  /** Outliers (generalized ESD, 1% level). */
  readonly outliers: OutlierResult;
  /** A separate cluster, or why none. */
  readonly cluster: ClusterResult;
  /** The order-statistic slope and the sd behind W (on the values W came from). */
  readonly geometry: ShapiroWilkGeometry;
  /** The verdict and what carried it. */
  readonly grounds: VerdictGrounds;
}

/**
 * Gather the reading's evidence from a sorted sample.
 *
 * @param sorted the values, ascending, finite, not all equal, at least 3
 * @param input the moments, Shapiro–Wilk p and any inherited step
 *
 * @example
 * ```ts
 * import { gatherEvidence } from "./reading_evidence.ts";
 * import { moments } from "@plumbline/plumbline";
 * import { shapiroWilk } from "@plumbline/plumbline";
 * const x = [1, 2, 3, 4, 5, 6];
 * const e = gatherEvidence(Float64Array.from(x), { moments: moments(x), primary: shapiroWilk(x) });
 * if (e.grounds.verdict !== "no-clear-departure" || e.step !== 1) throw new Error(e.grounds.verdict);
 * ```
 */
export function gatherEvidence(sorted: Float64Array, input: EvidenceInput): ReadingEvidence {
  const n = sorted.length;
  const found = _measurementStepSorted(sorted);
  const step = input.step === undefined ? found.step : input.step;
  const m = input.moments;
  const sd = m?.sd ?? input.sd ?? 0;
  const rounding = judgeRounding(step, sd, input.primary.n);
  const outliers = _generalizedEsdSorted(sorted, { alpha: READING_RULES.outlierAlpha });
  const cluster = _separateClusterSorted(sorted, { step, coarse: rounding.coarse });
  const geometry = _shapiroWilkGeometrySorted(input.primarySorted ?? sorted);
  const grounds = decideVerdict({
    n,
    p: input.primary.pValue,
    G1: m?.G1,
    seG1: m?.seG1,
    G2: m?.G2,
    seG2: m?.seG2,
    outliers: outliers.count,
    cluster: cluster.found,
    coarse: rounding.coarse,
  });
  return Object.freeze({
    step,
    distinct: found.distinct,
    rounding,
    outliers,
    cluster,
    geometry,
    grounds,
  });
}
