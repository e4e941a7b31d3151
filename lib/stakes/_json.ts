/**
 * The plain-data form of a stakes result (its `toJSON()`): the fields the
 * contract names — `range`, `outside`, `capability`, `mean` — with the
 * details beside them. Optional parts are left out when absent rather than
 * written as null.
 *
 * @module
 */
import type { Stakes } from "./stakes.ts";

/** The JSON form of a stakes result. */
export function _stakesJSON(s: Omit<Stakes, "toJSON">): Record<string, unknown> {
  const range: Record<string, unknown> = {
    coverage: s.range.coverage,
    normal: s.range.normal,
    ...(s.range.reexpressed === null ? {} : { reexpressed: s.range.reexpressed }),
    ranks: s.range.ranks,
    ranksCi: s.range.ranksCi,
    ranksCiRanks: s.range.ranksCiRanks,
    ranksCiCoverage: s.range.ranksCiCoverage,
    ranksCiLevel: s.range.ranksCiLevel,
    flags: s.range.flags,
    notes: s.range.notes,
  };
  const out: Record<string, unknown> = {
    n: s.n,
    reexpression: s.reexpression,
    reexpressionNote: s.reexpressionNote,
    range,
  };
  if (s.outside !== null) {
    const o = s.outside;
    out.outside = {
      lower: o.lower,
      upper: o.upper,
      normal: o.normal,
      normalSides: o.normalSides,
      ...(o.reexpressed === null ? {} : { reexpressed: o.reexpressed }),
      ...(o.reexpressedSides === null ? {} : { reexpressedSides: o.reexpressedSides }),
      observed: o.observed,
      observedCounts: o.observedCounts,
      observedCi: o.observedCi,
      level: o.level,
    };
  }
  if (s.capability !== null) {
    const c = s.capability;
    out.capability = {
      cp: c.normal.cp,
      cpCi: c.normal.cpCi,
      cpk: c.normal.cpk,
      cpkCi: c.normal.cpkCi,
      cpl: c.normal.cpl,
      cpu: c.normal.cpu,
      level: c.normal.level,
      ...(c.reexpressed === null ? {} : {
        reexpressed: {
          cp: c.reexpressed.cp,
          cpCi: c.reexpressed.cpCi,
          cpk: c.reexpressed.cpk,
          cpkCi: c.reexpressed.cpkCi,
          limits: [c.reexpressed.lower, c.reexpressed.upper],
        },
      }),
      percentile: c.percentile,
      notes: c.notes,
    };
  }
  const m = s.mean;
  out.mean = {
    estimate: m.estimate,
    level: m.level,
    t: m.t,
    bootstrap: m.bootstrap,
    resamples: m.bootstrapDetail.resamples,
    seed: m.seed,
    acceleration: m.bootstrapDetail.acceleration,
    bias: m.bootstrapDetail.bias,
    notes: m.notes,
  };
  out.judgement = s.judgement;
  out.cautions = s.cautions;
  return out;
}
