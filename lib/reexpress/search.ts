/**
 * The candidate search: try the usual re-expressions, re-test each, rank
 * them, and say which one to carry forward and why.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { checkSize, finiteCopy } from "../stats/_input.ts";
import { randomSubsample } from "../numeric/random.ts";
import { NORMALITY_TESTS } from "../stats/battery.ts";
import { SHAPIRO_WILK_MAX_N } from "../stats/shapiro_wilk.ts";
import { moments } from "../stats/moments.ts";
import { normalScores } from "../stats/plotting_positions.ts";
import { boxCoxFit } from "./box_cox_fit.ts";
import type { LambdaFit } from "./lambda_fit.ts";
import { LADDER_POWERS, nearestLadderPower } from "./ladder.ts";
import { logShift } from "./log.ts";
import { applyReexpression, type Reexpression, reexpression } from "./reexpression.ts";
import { yeoJohnsonFit } from "./yeo_johnson_fit.ts";
import { _departure, _nullDepartureMedian } from "./_departure.ts";
import {
  _fmt,
  _reason,
  type CandidateTest,
  RANKING_RULE,
  type ReexpressionSearch,
  type SearchOptions,
} from "./candidates.ts";

interface _Draft {
  reexpression: Reexpression;
  simplicity: number;
  notes: string[];
}

/**
 * Try re-expressions of a sample, re-test each one, and rank them.
 *
 * Candidates: the data as measured; log (with the shift from `logShift`
 * when there are zeros or negatives, reported in the candidate's notes);
 * square root (data ≥ 0); reciprocal (data of one sign, no zeros); for
 * positive data, Box–Cox at its maximum-likelihood λ̂ and at the ladder power
 * (−2, −1, −½, 0, ½, 1, 2) nearest λ̂ inside the λ interval, when that power is
 * not already one of the above; for data with zeros or negatives, Yeo–Johnson
 * at its λ̂. Every normality test of the battery (`stats/battery.ts`:
 * Shapiro–Wilk, Shapiro–Francia, Anderson–Darling, Lilliefors,
 * D'Agostino–Pearson, Jarque–Bera) is re-run on every candidate; a test that does not apply (too few or too many values) is
 * recorded with its reason, not thrown.
 *
 * Ranking rule (plumbline's own; see {@linkcode RANKING_RULE}). Departure is
 * measured by 1 − W′, the complement of the Shapiro–Francia statistic, because
 * it is defined at every n, is invariant to units, and reads directly off the
 * QQ plot the user looks at; p-values are not used to rank because at large n
 * they reject every candidate and at small n they accept every one. Two
 * candidates are treated as equally good when their departures differ by less
 * than the median departure of truly normal samples of that size (Royston
 * 1993's approximation, see `_departure.ts`): a difference smaller than what
 * chance alone produces in normal data is not evidence for the more complex
 * re-expression. The margin shrinks roughly like 1/n, so with many values
 * real differences are honoured. Among equally good candidates the simplest
 * wins, because simple re-expressions are interpretable (a log turns ratios
 * into differences, a square root stabilises count variance), travel between
 * studies, and back-transform to named quantities; a fitted λ̂ is tuned to
 * this sample and is chosen only when it is clearly better. This is in the
 * spirit of Box & Cox (1964), who read a convenient λ off the likelihood
 * interval rather than using λ̂ itself.
 *
 * @param x finite values, at least 3, not all equal
 * @param options λ interval level, λ range and log base
 * @example
 * ```ts
 * import { searchReexpressions } from "@plumbline/plumbline";
 * const x = [1.1, 1.9, 2.3, 2.8, 3.9, 4.4, 5.6, 7.7, 9.8, 14.1, 19.5, 31.2];
 * const s = searchReexpressions(x);
 * if (s.chosen.reexpression.kind === "identity") throw new Error("skewed data kept as is");
 * if (s.candidates.length < 5 || s.reason.length === 0) throw new Error("unexpected");
 * ```
 */
export function searchReexpressions(
  x: ArrayLike<number>,
  options: SearchOptions = {},
): ReexpressionSearch {
  const what = "a re-expression search";
  checkSize(x.length, 3, Number.POSITIVE_INFINITY, what);
  const v = finiteCopy(x, what);
  const n = v.length;
  let min = Infinity;
  let max = -Infinity;
  let zeros = 0;
  for (const t of v) {
    if (t < min) min = t;
    if (t > max) max = t;
    if (t === 0) zeros++;
  }
  if (min === max) {
    throw new PlumbError(
      "constant",
      `Cannot run ${what} on ${n} identical values (all ${min}): ` +
        `no re-expression changes the shape of a sample with no spread; check the column`,
      { value: min },
    );
  }
  const fitOptions = { level: options.level, range: options.range };
  const skipped: string[] = [];
  const drafts: _Draft[] = [{ reexpression: reexpression("identity"), simplicity: 0, notes: [] }];

  let shift: ReturnType<typeof logShift> | null = null;
  try {
    shift = logShift(v);
  } catch (e) {
    if (!(e instanceof PlumbError) || e.code !== "non-finite") throw e;
    skipped.push(`Log: ${e.message}`);
  }
  if (shift !== null) {
    drafts.push({
      reexpression: reexpression("log", { shift: shift.shift, base: options.logBase ?? "e" }),
      simplicity: 1,
      notes: shift.shift === 0 ? [] : [shift.rule],
    });
  }
  if (min >= 0) {
    drafts.push({ reexpression: reexpression("square-root"), simplicity: 2, notes: [] });
  } else skipped.push("Square root: the data have negative values (Yeo–Johnson tried instead)");
  if (zeros === 0 && (min > 0 || max < 0)) {
    drafts.push({ reexpression: reexpression("reciprocal"), simplicity: 3, notes: [] });
  } else {
    skipped.push(
      zeros > 0
        ? `Reciprocal: ${zeros} zero${zeros === 1 ? "" : "s"} in the data`
        : "Reciprocal: the data have both signs, so 1/x would not keep their order",
    );
  }

  let bc: LambdaFit | null = null;
  let yj: LambdaFit | null = null;
  // A fit the data cannot support in double precision is skipped, not fatal.
  const tryFit = (fit: () => LambdaFit, name: string): LambdaFit | null => {
    try {
      return fit();
    } catch (e) {
      if (!(e instanceof PlumbError) || e.code !== "no-convergence") throw e;
      skipped.push(`${name}: ${e.message}`);
      return null;
    }
  };
  if (min > 0) bc = tryFit(() => boxCoxFit(v, fitOptions), "Box–Cox");
  if (bc !== null) {
    const pct = `${+(bc.level * 100).toPrecision(6)}%`;
    const ladder = nearestLadderPower(bc);
    if (ladder === null) {
      // 3 significant digits and a true minus sign (U+2212), as everywhere in the displays
      const num = (v: number) => String(Number(v.toPrecision(3))).replace("-", "−");
      const iv = (v: number | null, open: string) => (v === null ? open : num(v));
      skipped.push(
        `Ladder power: none of the powers considered, ${
          LADDER_POWERS.map(num).join(", ")
        } (Tukey's ladder; 0 is the log), lies inside the Box–Cox ${pct} interval ${
          iv(bc.ci[0], "−∞")
        } to ${iv(bc.ci[1], "∞")}`,
      );
    } else if ([1, 0, 0.5, -1].includes(ladder)) {
      const which = drafts.find((d) =>
        d.simplicity === ({ 1: 0, 0: 1, 0.5: 2, [-1]: 3 } as Record<number, number>)[ladder]
      );
      which?.notes.push(
        `Box–Cox λ = ${ladder} (the same shape) is the ladder power nearest λ̂ = ` +
          `${_fmt(bc.lambda)} inside its ${pct} interval`,
      );
    } else {
      drafts.push({
        reexpression: reexpression("box-cox", { lambda: ladder }),
        simplicity: 4,
        notes: [`Ladder power nearest λ̂ = ${_fmt(bc.lambda)} inside the ${pct} interval`],
      });
    }
    drafts.push({
      reexpression: reexpression("box-cox", { lambda: bc.lambda }),
      simplicity: 5,
      notes: ["Maximum-likelihood λ", ...bc.notes],
    });
  } else if (min <= 0) {
    skipped.push("Box–Cox: it needs positive values (Yeo–Johnson tried instead)");
  }
  if (min <= 0) yj = tryFit(() => yeoJohnsonFit(v, fitOptions), "Yeo–Johnson");
  if (yj !== null) {
    drafts.push({
      reexpression: reexpression("yeo-johnson", { lambda: yj.lambda }),
      simplicity: 6,
      notes: ["Maximum-likelihood λ", ...yj.notes],
    });
  }

  const scores = normalScores(n);
  const evaluated = drafts.flatMap((d) => {
    const y = applyReexpression(v, d.reexpression);
    // A power that overflows (x² near 1e308, 1/x of a subnormal) cannot be
    // tested or ranked: it is listed as skipped instead.
    if (!y.every(Number.isFinite)) {
      skipped.push(
        `${d.reexpression.label}: some re-expressed values overflow double precision`,
      );
      return [];
    }
    const departure = _departure(y, scores);
    if (!Number.isFinite(departure)) {
      skipped.push(
        `${d.reexpression.label}: the re-expressed values are all equal in double precision`,
      );
      return [];
    }
    const tests = NORMALITY_TESTS.map(({ name: test, run }): CandidateTest => {
      try {
        // Above Shapiro–Wilk's calibrated range, W and p come from the same seeded
        // subsample a chain on these values would use (size 5000, seed 1).
        if (test === "Shapiro–Wilk" && y.length > SHAPIRO_WILK_MAX_N) {
          const sub = run(randomSubsample(y, SHAPIRO_WILK_MAX_N, 1));
          const method = `${sub.method}, on a seeded random subsample of ${SHAPIRO_WILK_MAX_N} ` +
            `of the ${y.length} values`;
          return Object.freeze({ test, result: Object.freeze({ ...sub, method }), note: null });
        }
        return Object.freeze({ test, result: run(y), note: null });
      } catch (e) {
        if (!(e instanceof PlumbError)) throw e;
        return Object.freeze({ test, result: null, note: e.message });
      }
    });
    let skewness: number | null = null;
    let excessKurtosis: number | null = null;
    try {
      const m = moments(y);
      skewness = m.g1;
      excessKurtosis = m.g2;
    } catch (e) {
      if (!(e instanceof PlumbError)) throw e;
    }
    return [{ ...d, departure, tests, skewness, excessKurtosis }];
  });

  const margin = _nullDepartureMedian(n);
  const finite = evaluated.filter((c) => Number.isFinite(c.departure));
  const best = finite.reduce((a, b) => (b.departure < a.departure ? b : a), finite[0]);
  const close = (c: { departure: number }) =>
    Number.isFinite(c.departure) && c.departure <= best.departure + margin;
  const ordered = [...evaluated].sort((a, b) => {
    const ca = close(a);
    const cb = close(b);
    if (ca !== cb) return ca ? -1 : 1;
    if (ca) return a.simplicity - b.simplicity;
    const da = Number.isFinite(a.departure) ? a.departure : Infinity;
    const db = Number.isFinite(b.departure) ? b.departure : Infinity;
    return da - db;
  });
  const candidates = ordered.map((c, i) =>
    Object.freeze({
      rank: i + 1,
      reexpression: c.reexpression,
      departure: c.departure,
      closeToBest: close(c),
      simplicity: c.simplicity,
      skewness: c.skewness,
      excessKurtosis: c.excessKurtosis,
      tests: Object.freeze(c.tests),
      notes: Object.freeze(c.notes),
    })
  );
  const chosen = candidates[0];
  const bestC = candidates.find((c) => c.reexpression === best.reexpression)!;
  const reason = _reason(chosen, bestC, candidates, margin, n);
  return Object.freeze({
    n,
    candidates: Object.freeze(candidates),
    chosen,
    reason,
    rule: RANKING_RULE,
    margin,
    boxCox: bc,
    yeoJohnson: yj,
    skipped: Object.freeze(skipped),
  });
}
