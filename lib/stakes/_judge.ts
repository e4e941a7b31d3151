/**
 * Whether the normal-theory answer and the answer that does not assume
 * normality differ by enough to matter, quantity by quantity. The rules are
 * plumbline's own (no published rule exists for this comparison); each
 * compares the difference with the sampling or resampling noise of the
 * robust answer, so that a difference smaller than that noise never counts.
 *
 * - Central range: it matters when a normal-theory limit lies outside the
 *   confidence interval of the rank-based limit, or below zero for a
 *   quantity that is never negative; with fewer than 120 values or an open
 *   interval and no flag, it is unclear (the rank limits are too uncertain).
 * - Fraction outside: it matters when the normal fit's fraction lies outside
 *   the observed fraction's exact interval; when it does not but the normal
 *   and re-expressed fits differ by more than a factor of 2 (each counted
 *   from 1 per million), it is unclear: the data cannot tell which is right.
 * - Capability: it matters when the re-expressed or percentile-based Cpk lies
 *   outside the interval of the normal-theory Cpk. With neither available,
 *   it follows the central range's verdict (Cpk rests on the same tails),
 *   except that a range that matters makes it unclear.
 * - Mean: it matters when the bootstrap interval's centre is shifted from the
 *   t interval's by more than a tenth of the t half-width and by more than
 *   three times a bootstrap end's own resampling error. Centres, not ends:
 *   with few values every bootstrap interval is narrower than the t interval
 *   (n-divisor spread, normal rather than t quantiles), which is no sign of
 *   skewness; a shifted centre is.
 *
 * @module
 */
import { normalPdf, normalQuantile } from "../numeric/normal.ts";
import type { CentralRange } from "./central_range.ts";
import { RANK_LIMITS_MIN_N } from "./central_range.ts";
import type { CapabilityStakes, OutsideFractions } from "./specification.ts";

/** The three verdicts plumbline gives on a difference. */
export type StakesVerdict = "matters" | "negligible" | "unclear";

/** One quantity's verdict and the reasons for it. */
export interface QuantityJudgement {
  /** Whether the difference matters. */
  readonly verdict: StakesVerdict;
  /** Why, in sentences. */
  readonly reasons: readonly string[];
}

/** The verdicts of a stakes result: plain, frozen data. */
export interface StakesJudgement {
  /** The central range. */
  readonly range: QuantityJudgement;
  /** The fraction outside the limits (`null` without limits). */
  readonly outside: QuantityJudgement | null;
  /** The capability indices (`null` without limits). */
  readonly capability: QuantityJudgement | null;
  /** The mean's interval. */
  readonly mean: QuantityJudgement;
  /** `"matters"` if any quantity's does, else `"unclear"` if any is, else `"negligible"`. */
  readonly overall: StakesVerdict;
}

/** The mean's intervals, as the judge needs them. */
interface _Mean {
  readonly level: number;
  readonly t: readonly [number, number];
  readonly bootstrap: readonly [number | null, number | null];
  readonly bootstrapDetail: { readonly resamples: number; readonly acceleration: number };
  readonly tDetail: { readonly tQuantile: number };
}

function _g(v: number): string {
  return String(+v.toPrecision(3)).replace("-", "−");
}

function _pct(v: number): string {
  if (v === 0) return "0%";
  const p = v * 100;
  return p >= 0.1 ? `${_g(p)}%` : `${_g(v * 1e6)} per million`;
}

function _q(verdict: StakesVerdict, reasons: string[]): QuantityJudgement {
  return Object.freeze({ verdict, reasons: Object.freeze(reasons) });
}

function _range(r: CentralRange, n: number): QuantityJudgement {
  if (r.flags.length > 0) return _q("matters", r.flags.map((f) => f.message));
  const pct = `${+(r.ranksCiLevel * 100).toPrecision(6)}%`;
  const open = r.ranksCi.some(([a, b]) => a === null || b === null);
  if (n < RANK_LIMITS_MIN_N || open) {
    return _q("unclear", [
      `The normal-theory limits lie inside the ${pct} intervals of the rank-based limits, but ` +
      `with ${n} values those intervals are ${open ? "open on one side" : "wide"}: ` +
      "too few values to tell the two answers apart",
    ]);
  }
  return _q("negligible", [
    `Both normal-theory limits lie inside the ${pct} intervals of the rank-based limits`,
  ]);
}

function _outside(o: OutsideFractions): QuantityJudgement {
  const [lo, hi] = o.observedCi;
  const pct = `${+(o.level * 100).toPrecision(6)}%`;
  if (o.normal < lo || o.normal > hi) {
    return _q("matters", [
      `The normal fit puts ${_pct(o.normal)} outside the limits; the observed ${
        _pct(o.observed)
      } ` +
      `(${pct} interval ${_pct(lo)} to ${_pct(hi)}) rules that out`,
    ]);
  }
  if (o.reexpressed !== null) {
    const floor = 1e-6;
    const ratio = (Math.max(o.normal, o.reexpressed) + floor) /
      (Math.min(o.normal, o.reexpressed) + floor);
    if (ratio > 2) {
      return _q("unclear", [
        `The normal fit puts ${_pct(o.normal)} outside the limits and the re-expressed fit ` +
        `${_pct(o.reexpressed)}; both agree with the observed ${_pct(o.observed)} ` +
        `(${pct} interval ${_pct(lo)} to ${_pct(hi)}), so the data cannot tell which is right`,
      ]);
    }
  }
  return _q("negligible", [
    `The normal fit's ${_pct(o.normal)} outside the limits agrees with the observed ` +
    `${_pct(o.observed)} (${pct} interval ${_pct(lo)} to ${_pct(hi)})` +
    (o.reexpressed === null ? "" : ` and with the re-expressed fit's ${_pct(o.reexpressed)}`),
  ]);
}

function _capability(c: CapabilityStakes, range: QuantityJudgement): QuantityJudgement {
  const [lo, hi] = c.normal.cpkCi;
  const pct = `${+(c.normal.level * 100).toPrecision(6)}%`;
  const others: [string, number][] = [];
  if (c.reexpressed !== null) others.push(["re-expressed", c.reexpressed.cpk]);
  if (c.percentile.cpk !== null) others.push(["percentile-based", c.percentile.cpk]);
  if (others.length === 0) {
    const none = "No Cpk free of the normal model is available here (no re-expression was used, " +
      "and a percentile-based index needs more values)";
    return range.verdict === "matters"
      ? _q("unclear", [`${none}, yet the central range shows the normal model misplacing a tail`])
      : _q(range.verdict, [
        `${none}; the central range shows ${
          range.verdict === "negligible" ? "no" : "no clear"
        } departure in the tails, on which Cpk rests`,
      ]);
  }
  const out = others.filter(([, v]) => v < lo || v > hi);
  const text = (list: [string, number][]) =>
    list.map(([name, v]) => `the ${name} Cpk ${_g(v)}`).join(" and ");
  const base = `the ${pct} interval of the normal-theory Cpk ${_g(c.normal.cpk)} ` +
    `(${_g(lo)} to ${_g(hi)})`;
  const verb = (list: unknown[]) => (list.length === 1 ? "lies" : "lie");
  if (out.length > 0) return _q("matters", [`${_cap(text(out))} ${verb(out)} outside ${base}`]);
  return _q("negligible", [`${_cap(text(others))} ${verb(others)} inside ${base}`]);
}

function _cap(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/**
 * How far the sample skewness g1 strays from 0 in normal samples of size n:
 * 2.576 standard deviations, with Var(g1) = 6(n − 2)/((n + 1)(n + 3))
 * (the exact variance under normality behind the skewness test of
 * D'Agostino, Belanger & D'Agostino 1990, The American Statistician
 * 44:316–321; cited from memory, and the same formula plumbline's
 * D'Agostino–Pearson test uses). A shift of
 * the bootstrap interval driven by skewness inside this band is what normal
 * samples of this size do about 99% of the time.
 */
function _normalSkewBand(n: number): number {
  return 2.576 * Math.sqrt((6 * (n - 2)) / ((n + 1) * (n + 3)));
}

function _mean(m: _Mean, n: number): QuantityJudgement {
  const [b0, b1] = m.bootstrap;
  if (b0 === null || b1 === null) {
    return _q("unclear", ["The bootstrap interval could not be formed for these data"]);
  }
  const half = (m.t[1] - m.t[0]) / 2;
  const alpha = (1 - m.level) / 2;
  const z = normalQuantile(1 - alpha);
  // resampling error of a bootstrap quantile: √(α(1 − α)/B)/φ(z_α) standard errors
  const se = half / m.tDetail.tQuantile;
  const mcse = Math.sqrt((alpha * (1 - alpha)) / m.bootstrapDetail.resamples) / normalPdf(z) * se;
  // Compare centres, not ends: at small n every bootstrap interval is narrower
  // than the t interval (it uses the n-divisor spread and no t quantile), which
  // says nothing about the shape; a shifted centre is what skewness does.
  const shift = (b0 + b1) / 2 - (m.t[0] + m.t[1]) / 2;
  const bar = Math.max(0.1 * half, 3 * mcse);
  const share = `${_g((Math.abs(shift) / half) * 100)}% of the t interval's half-width`;
  // The BCa acceleration of the mean is g1/(6√n) (Efron 1987, §4), so g1 comes back from it.
  const g1 = 6 * Math.sqrt(n) * m.bootstrapDetail.acceleration;
  if (Math.abs(shift) > bar && Math.abs(g1) <= _normalSkewBand(n)) {
    return _q("unclear", [
      `The bootstrap interval is centred ${share} ${shift > 0 ? "above" : "below"} the t ` +
      `interval's centre, but a skewness of ${_g(g1)} is common in normal samples of ${n} ` +
      "values: too few values to tell whether the shape moves the mean's uncertainty",
    ]);
  }
  if (Math.abs(shift) > bar) {
    const dir = shift > 0 ? "above" : "below";
    return _q("matters", [
      `The bootstrap interval is centred ${share} ${dir} the t interval's centre: the ` +
      `sample's skewness moves the mean's uncertainty ${shift > 0 ? "upward" : "downward"}, ` +
      "so for a one-sided statement about the mean the bootstrap interval is the safer one",
    ]);
  }
  const narrower = 1 - (b1 - b0) / (m.t[1] - m.t[0]);
  return _q("negligible", [
    `The bootstrap and t intervals are centred within ${share} of each other` +
    (narrower > 0.05
      ? `; the bootstrap one is ${_g(narrower * 100)}% narrower, as bootstrap intervals tend ` +
        "to be with few values"
      : ""),
  ]);
}

/** The verdicts for a stakes result. */
export function _judge(
  range: CentralRange,
  outside: OutsideFractions | null,
  capability: CapabilityStakes | null,
  mean: _Mean,
  n: number,
): StakesJudgement {
  const r = _range(range, n);
  const parts = {
    range: r,
    outside: outside === null ? null : _outside(outside),
    capability: capability === null ? null : _capability(capability, r),
    mean: _mean(mean, n),
  };
  const all = Object.values(parts).filter((p) => p !== null).map((p) => p!.verdict);
  const overall: StakesVerdict = all.includes("matters")
    ? "matters"
    : all.includes("unclear")
    ? "unclear"
    : "negligible";
  return Object.freeze({ ...parts, overall });
}
