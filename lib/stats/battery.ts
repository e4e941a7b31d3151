/**
 * The battery: every normality test plumbline runs, in display order. The
 * screening of a sample (`plumb`, `survey`, `.by()`) and the re-testing of
 * re-expression candidates both run this one list, so a test added here
 * appears everywhere.
 *
 * @module
 */
import { type _EdfPass, _edfPass } from "./_edf_pass.ts";
import { roundingWarning } from "./rounding.ts";
import { _andersonDarlingOf, andersonDarling } from "./anderson_darling.ts";
import { _dagostinoPearsonOf, dagostinoPearson } from "./dagostino_pearson.ts";
import { _jarqueBeraOf, jarqueBera } from "./jarque_bera.ts";
import { _lillieforsOf, lilliefors } from "./lilliefors.ts";
import type { _Shape } from "./moments.ts";
import type { TestResult } from "./result.ts";
import { _shapiroFranciaSorted, shapiroFrancia } from "./shapiro_francia.ts";
import { _shapiroWilkSorted, shapiroWilk } from "./shapiro_wilk.ts";

/**
 * A sample validated once (finite, not constant) and prepared for every
 * test: its values in their own order, a sorted copy, their moment summary,
 * and the work several tests share, each done once on first use: the scan
 * for rounding and the pass over the fitted normal's distribution function.
 */
export interface PreparedSample {
  /** Number of values. */
  readonly n: number;
  /** The values in their own order. */
  readonly values: Float64Array;
  /** The same values, ascending. */
  readonly sorted: Float64Array;
  /** The moment summary of `values`, summed in their own order. */
  readonly shape: _Shape;
  /**
   * The rounding warning of the sample for a test that sees at most 5,000
   * values (`capped`) or all of them: `roundingWarning(sorted, capped)`.
   */
  ties(capped: boolean): string | undefined;
  /** The EDF pass over `sorted` with `shape` (`_edfPass(sorted, shape)`). */
  edf(): _EdfPass;
}

/**
 * A {@linkcode PreparedSample} from values already validated (finite, not
 * constant), their sorted copy and their moment summary; the shared work is
 * done on first use and kept.
 */
export function prepareSample(
  values: Float64Array,
  sorted: Float64Array,
  shape: _Shape,
): PreparedSample {
  const ties = new Map<boolean, string | undefined>();
  let edf: _EdfPass | undefined;
  return {
    n: values.length,
    values,
    sorted,
    shape,
    ties: (capped) => {
      if (!ties.has(capped)) ties.set(capped, roundingWarning(sorted, capped));
      return ties.get(capped);
    },
    edf: () => (edf ??= _edfPass(sorted, shape)),
  };
}

/** One test of the battery. */
export interface NormalityTest {
  /** The test's published name, as in its results' `test` field. */
  readonly name: string;
  /** Run on any sample (validates and sorts as needed). */
  readonly run: (x: ArrayLike<number>) => TestResult;
  /**
   * Run on a prepared sample, without validating, copying or sorting again;
   * gives exactly the result of `run(sample.values)`.
   */
  readonly runPrepared: (s: PreparedSample) => TestResult;
  /**
   * For a test that needs nothing but n and the moment summary (the moment
   * tests): the result from those alone, as a query engine gives them from
   * its sums over every value; the same as `runPrepared` on a sample with
   * that n and summary. Absent for a test that needs the values in order.
   */
  readonly fromShape?: (n: number, shape: _Shape) => TestResult;
}

/**
 * Every test, in display order: Shapiro–Wilk (the primary test) first.
 *
 * @example
 * ```ts
 * import { NORMALITY_TESTS } from "./battery.ts";
 * const x = [2.1, 2.9, 3.2, 3.3, 3.8, 4.1, 4.4, 5.0, 5.6, 7.9];
 * const names = NORMALITY_TESTS.map((t) => t.run(x).test);
 * if (names[0] !== "Shapiro–Wilk" || names.length !== 6) throw new Error(names.join());
 * ```
 */
export const NORMALITY_TESTS: readonly NormalityTest[] = Object.freeze([
  Object.freeze({
    name: "Shapiro–Wilk",
    run: shapiroWilk,
    runPrepared: (s: PreparedSample) => _shapiroWilkSorted(s.sorted, s.ties(true)),
  }),
  Object.freeze({
    name: "Shapiro–Francia",
    run: shapiroFrancia,
    runPrepared: (s: PreparedSample) => _shapiroFranciaSorted(s.sorted, s.ties(true)),
  }),
  Object.freeze({
    name: "Anderson–Darling",
    run: andersonDarling,
    runPrepared: (s: PreparedSample) => _andersonDarlingOf(s.edf(), s.ties(false)),
  }),
  Object.freeze({
    name: "Lilliefors",
    run: lilliefors,
    runPrepared: (s: PreparedSample) => _lillieforsOf(s.edf(), s.ties(false)),
  }),
  Object.freeze({
    name: "D'Agostino–Pearson",
    run: dagostinoPearson,
    runPrepared: (s: PreparedSample) => _dagostinoPearsonOf(s.n, s.shape),
    fromShape: _dagostinoPearsonOf,
  }),
  Object.freeze({
    name: "Jarque–Bera",
    run: jarqueBera,
    runPrepared: (s: PreparedSample) => _jarqueBeraOf(s.n, s.shape),
    fromShape: _jarqueBeraOf,
  }),
]);
