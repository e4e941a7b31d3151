/**
 * The battery: every normality test plumbline runs, in display order. The
 * screening of a sample (`plumb`, `survey`, `.by()`) and the re-testing of
 * re-expression candidates both run this one list, so a test added here
 * appears everywhere.
 *
 * @module
 */
import { _andersonDarlingSorted, andersonDarling } from "./anderson_darling.ts";
import { _dagostinoPearsonOf, dagostinoPearson } from "./dagostino_pearson.ts";
import { _jarqueBeraOf, jarqueBera } from "./jarque_bera.ts";
import { _lillieforsSorted, lilliefors } from "./lilliefors.ts";
import type { _Shape } from "./moments.ts";
import type { TestResult } from "./result.ts";
import { _shapiroFranciaSorted, shapiroFrancia } from "./shapiro_francia.ts";
import { _shapiroWilkSorted, shapiroWilk } from "./shapiro_wilk.ts";

/**
 * A sample validated once (finite, not constant) and prepared for every
 * test: its values in their own order, a sorted copy, and the moment
 * summaries of each (the summary of the sorted copy is computed on first use).
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
  /** The moment summary of `sorted`, summed in ascending order. */
  sortedShape(): _Shape;
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
    runPrepared: (s: PreparedSample) => _shapiroWilkSorted(s.sorted),
  }),
  Object.freeze({
    name: "Shapiro–Francia",
    run: shapiroFrancia,
    runPrepared: (s: PreparedSample) => _shapiroFranciaSorted(s.sorted),
  }),
  Object.freeze({
    name: "Anderson–Darling",
    run: andersonDarling,
    runPrepared: (s: PreparedSample) => _andersonDarlingSorted(s.sorted, s.sortedShape()),
  }),
  Object.freeze({
    name: "Lilliefors",
    run: lilliefors,
    runPrepared: (s: PreparedSample) => _lillieforsSorted(s.sorted, s.sortedShape()),
  }),
  Object.freeze({
    name: "D'Agostino–Pearson",
    run: dagostinoPearson,
    runPrepared: (s: PreparedSample) => _dagostinoPearsonOf(s.n, s.shape),
  }),
  Object.freeze({
    name: "Jarque–Bera",
    run: jarqueBera,
    runPrepared: (s: PreparedSample) => _jarqueBeraOf(s.n, s.shape),
  }),
]);
