/**
 * The candidate search: try the usual re-expressions, rank them by how far
 * each departs from normal, say which one to carry forward and why, and
 * re-test them.
 *
 * Cost: the data are sorted once (radix sort); every candidate is scored on
 * its re-expressed sorted values (each re-expression is monotone, so their
 * order carries over) with one departure measure; the full battery of tests
 * runs only when the re-tested candidates are asked for
 * ({@linkcode searchReexpressions}, or {@linkcode testRanking} on a ranking
 * already made), and then shares each candidate's sort among the tests.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { sortFloat64 } from "../numeric/sort.ts";
import { checkSize, finiteCopy } from "../stats/_input.ts";
import { randomSubsample } from "../numeric/random.ts";
import { NORMALITY_TESTS, prepareSample } from "../stats/battery.ts";
import { SHAPIRO_WILK_MAX_N } from "../stats/shapiro_wilk.ts";
import { _momentsOf, _sampleShape, type _Shape } from "../stats/moments.ts";
import { normalScores } from "../stats/plotting_positions.ts";
import { applyReexpression, applyToSorted } from "./reexpression.ts";
import { _departureSorted, _nullDepartureMedian } from "./_departure.ts";
import { _candidateDrafts } from "./_drafts.ts";
import {
  _reason,
  type CandidateTest,
  type RankedCandidate,
  RANKING_RULE,
  type ReexpressionCandidate,
  type ReexpressionRanking,
  type ReexpressionSearch,
  type SearchOptions,
} from "./candidates.ts";

const _WHAT = "a re-expression search";

/** Validated values with their range and zeros; throws as the search does. */
function _checked(x: ArrayLike<number>): {
  v: Float64Array;
  range: { min: number; max: number; zeros: number };
} {
  checkSize(x.length, 3, Number.POSITIVE_INFINITY, _WHAT);
  const v = finiteCopy(x, _WHAT);
  let min = Infinity;
  let max = -Infinity;
  let zeros = 0;
  for (let i = 0; i < v.length; i++) {
    const t = v[i];
    if (t < min) min = t;
    if (t > max) max = t;
    if (t === 0) zeros++;
  }
  if (min === max) {
    throw new PlumbError(
      "constant",
      `Cannot run ${_WHAT} on ${v.length} identical values (all ${min}): ` +
        `no re-expression changes the shape of a sample with no spread; check the column`,
      { value: min },
    );
  }
  return { v, range: { min, max, zeros } };
}

function _allFinite(y: Float64Array): boolean {
  for (let i = 0; i < y.length; i++) if (y[i] - y[i] !== 0) return false;
  return true;
}

/**
 * Rank the re-expressions of a sample by departure from normal, without
 * re-running the tests on them: the candidates, the choice and its reason
 * exactly as {@linkcode searchReexpressions} gives them, at the cost of one
 * sort and one pass per candidate (and the λ fits). What a survey row or a
 * `.reexpress("best")` needs.
 *
 * @param x finite values, at least 3, not all equal
 * @param options λ interval level, λ range and log base
 * @example
 * ```ts
 * import { rankReexpressions } from "./search.ts";
 * const x = [1.1, 1.9, 2.3, 2.8, 3.9, 4.4, 5.6, 7.7, 9.8, 14.1, 19.5, 31.2];
 * const r = rankReexpressions(x);
 * if (r.chosen.reexpression.kind === "identity" || r.candidates.length < 5) throw new Error("unexpected");
 * ```
 */
export function rankReexpressions(
  x: ArrayLike<number>,
  options: SearchOptions = {},
): ReexpressionRanking {
  const { v, range } = _checked(x);
  const n = v.length;
  const { drafts, skipped, boxCox, yeoJohnson } = _candidateDrafts(v, range, options);
  const sorted = sortFloat64(v.slice());
  const scores = normalScores(n);
  const scored = drafts.flatMap((d) => {
    const y = applyToSorted(sorted, d.reexpression);
    // A power that overflows (x² near 1e308, 1/x of a subnormal) cannot be
    // tested or ranked: it is listed as skipped instead.
    if (!_allFinite(y)) {
      skipped.push(`${d.reexpression.label}: some re-expressed values overflow double precision`);
      return [];
    }
    const departure = _departureSorted(y, scores);
    if (!Number.isFinite(departure)) {
      skipped.push(
        `${d.reexpression.label}: the re-expressed values are all equal in double precision`,
      );
      return [];
    }
    return [{ ...d, departure }];
  });
  const margin = _nullDepartureMedian(n);
  const best = scored.reduce((a, b) => (b.departure < a.departure ? b : a), scored[0]);
  const close = (c: { departure: number }) => c.departure <= best.departure + margin;
  const ordered = [...scored].sort((a, b) => {
    const ca = close(a);
    const cb = close(b);
    if (ca !== cb) return ca ? -1 : 1;
    if (ca) return a.simplicity - b.simplicity;
    return a.departure - b.departure;
  });
  const candidates: RankedCandidate[] = ordered.map((c, i) =>
    Object.freeze({
      rank: i + 1,
      reexpression: c.reexpression,
      departure: c.departure,
      closeToBest: close(c),
      simplicity: c.simplicity,
      notes: Object.freeze(c.notes),
    })
  );
  const chosen = candidates[0];
  const bestC = candidates.find((c) => c.reexpression === best.reexpression)!;
  return Object.freeze({
    n,
    candidates: Object.freeze(candidates),
    chosen,
    reason: _reason(chosen, bestC, candidates, margin, n),
    rule: RANKING_RULE,
    margin,
    boxCox,
    yeoJohnson,
    skipped: Object.freeze(skipped),
  });
}

/**
 * Re-test every candidate of a ranking made from the same values: the
 * skewness, excess kurtosis and every normality test of the battery on each
 * re-expressed sample (one sort of the data shared by all candidates, each
 * candidate's tests sharing its moments, ties scan and Φ pass). A test that
 * does not apply (too few or too many values) is recorded with its reason.
 *
 * @param x the values the ranking was made from
 * @param ranking their {@linkcode rankReexpressions}
 * @example
 * ```ts
 * import { rankReexpressions, testRanking } from "./search.ts";
 * const x = [1.1, 1.9, 2.3, 2.8, 3.9, 4.4, 5.6, 7.7, 9.8, 14.1, 19.5, 31.2];
 * const s = testRanking(x, rankReexpressions(x));
 * if (s.chosen.tests.length !== 6 || s.chosen.skewness === null) throw new Error("re-tested");
 * ```
 */
export function testRanking(
  x: ArrayLike<number>,
  ranking: ReexpressionRanking,
): ReexpressionSearch {
  const { v } = _checked(x);
  if (v.length !== ranking.n) {
    throw new PlumbError(
      "bad-option",
      `Cannot re-test a ranking of ${ranking.n} values on ${v.length}: pass the values it was made from`,
    );
  }
  const sorted = sortFloat64(v.slice());
  const candidates: ReexpressionCandidate[] = ranking.candidates.map((c) => {
    const y = applyReexpression(v, c.reexpression);
    // Values equal in double precision (a log of values a few ulps apart)
    // have no summary: each test then says why it cannot run, on its own.
    let shape: _Shape | null = null;
    try {
      shape = _sampleShape(y, _WHAT);
    } catch (e) {
      if (!(e instanceof PlumbError)) throw e;
    }
    const prepared = shape && prepareSample(y, applyToSorted(sorted, c.reexpression), shape);
    const tests = NORMALITY_TESTS.map(({ name: test, run, runPrepared }): CandidateTest => {
      try {
        // Above Shapiro–Wilk's calibrated range, W and p come from the same seeded
        // subsample a chain on these values would use (size 5000, seed 1).
        if (test === "Shapiro–Wilk" && y.length > SHAPIRO_WILK_MAX_N) {
          const sub = run(randomSubsample(y, SHAPIRO_WILK_MAX_N, 1));
          const method = `${sub.method}, on a seeded random subsample of ${SHAPIRO_WILK_MAX_N} ` +
            `of the ${y.length} values`;
          return Object.freeze({ test, result: Object.freeze({ ...sub, method }), note: null });
        }
        const result = prepared ? runPrepared(prepared) : run(y);
        return Object.freeze({ test, result, note: null });
      } catch (e) {
        if (!(e instanceof PlumbError)) throw e;
        return Object.freeze({ test, result: null, note: e.message });
      }
    });
    let skewness: number | null = null;
    let excessKurtosis: number | null = null;
    if (shape && y.length >= 4) {
      try {
        const m = _momentsOf(y.length, shape);
        skewness = m.g1;
        excessKurtosis = m.g2;
      } catch (e) {
        if (!(e instanceof PlumbError)) throw e;
      }
    }
    return Object.freeze({
      rank: c.rank,
      reexpression: c.reexpression,
      departure: c.departure,
      closeToBest: c.closeToBest,
      simplicity: c.simplicity,
      skewness,
      excessKurtosis,
      tests: Object.freeze(tests),
      notes: c.notes,
    });
  });
  return Object.freeze({
    ...ranking,
    candidates: Object.freeze(candidates),
    chosen: candidates[0],
  });
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
 * D'Agostino–Pearson, Jarque–Bera) is re-run on every candidate; a test that
 * does not apply (too few or too many values) is recorded with its reason,
 * not thrown. The same as {@linkcode testRanking} of
 * {@linkcode rankReexpressions}; use the ranking alone when only the choice
 * is needed.
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
  return testRanking(x, rankReexpressions(x, options));
}
