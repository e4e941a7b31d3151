import { deepEqual, equal, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../../lib/errors.ts";
import { randomSubsample, seededRandom } from "../../lib/numeric/random.ts";
import { searchReexpressions } from "../../lib/reexpress/search.ts";
import { _departure, _nullDepartureMedian } from "../../lib/reexpress/_departure.ts";
import { applyReexpression } from "../../lib/reexpress/reexpression.ts";
import { normalScores } from "../../lib/stats/plotting_positions.ts";
import { shapiroWilk } from "../../lib/stats/shapiro_wilk.ts";

const rng = seededRandom(4242);
const normal = (n: number, m = 10, s = 2) => Array.from({ length: n }, () => m + s * rng.normal());
const lognormal = (n: number, s = 0.8) =>
  Array.from({ length: n }, () => Math.exp(s * rng.normal()));

Deno.test("the chance margin (Royston 1993, from memory) matches simulated null medians within 15%", () => {
  // 801 seeded normal samples per n; the median of 1 − W′ has a sampling error of a few
  // per cent at this count, so 15% separates a wrong constant from simulation noise.
  for (const n of [20, 100, 1000]) {
    const d = Array.from({ length: 801 }, () => _departure(normal(n))).sort((a, b) => a - b);
    const sim = d[400];
    const ratio = _nullDepartureMedian(n) / sim;
    ok(
      ratio > 0.85 && ratio < 1.15,
      `n=${n}: formula ${_nullDepartureMedian(n)}, simulated ${sim}`,
    );
  }
});

Deno.test("departure is 0 for Blom scores themselves and invariant to x → a + b·x", () => {
  // Data lying exactly on the scores lie on a QQ line: 1 − r² is 0 up to rounding
  // (a few ulps of the sums of 50 products).
  for (const n of [3, 10, 50, 1001]) {
    const m = Array.from(normalScores(n));
    ok(_departure(m) < 1e-14, `n = ${n}: ${_departure(m)}`);
    ok(_departure(m.map((v) => 12.5 + 0.25 * v)) < 1e-14, `n = ${n}, mapped`);
  }
  const x = lognormal(50);
  const d = _departure(x);
  const e = _departure(x.map((v) => 3 - 7 * v));
  ok(Math.abs(d - e) < 1e-12, `${d} vs ${e}`);
  ok(d > 0 && d < 1);
  ok(Number.isNaN(_departure([2, 2, 2])));
});

Deno.test("log-normal data: the log is chosen, with a reason, and every test is re-run", () => {
  const x = lognormal(200);
  const s = searchReexpressions(x);
  equal(s.chosen.reexpression.kind, "log");
  equal(s.chosen.rank, 1);
  ok(s.reason.startsWith("ln(x) is chosen") || s.reason.startsWith("ln(x) departs"), s.reason);
  const kinds = s.candidates.map((c) => c.reexpression.kind).sort();
  deepEqual(kinds, ["box-cox", "identity", "log", "reciprocal", "square-root"].sort());
  for (const c of s.candidates) {
    deepEqual(c.tests.map((t) => t.test), [
      "Shapiro–Wilk",
      "Shapiro–Francia",
      "Anderson–Darling",
      "Lilliefors",
      "D'Agostino–Pearson",
      "Jarque–Bera",
    ]);
    ok(c.tests.every((t) => t.result !== null && t.note === null));
  }
  // The re-run result equals running the test on the re-expressed data directly.
  const sw = s.chosen.tests[0].result!;
  equal(sw.statistic, shapiroWilk(applyReexpression(x, s.chosen.reexpression)).statistic);
  const asIs = s.candidates.find((c) => c.reexpression.kind === "identity")!;
  ok(asIs.departure > s.chosen.departure && !asIs.closeToBest);
  ok(s.boxCox !== null && s.yeoJohnson === null);
});

Deno.test("normal data: kept as measured", () => {
  const s = searchReexpressions(normal(300, 50, 3));
  equal(s.chosen.reexpression.kind, "identity");
  ok(s.reason.startsWith("No re-expression needed"), s.reason);
});

Deno.test("data with zeros: shifted log with its rule, Yeo–Johnson, and stated skips", () => {
  const x = lognormal(80).map((v, i) => (i % 10 === 0 ? 0 : v));
  const s = searchReexpressions(x);
  const log = s.candidates.find((c) => c.reexpression.kind === "log")!;
  const minPos = Math.min(...x.filter((v) => v > 0));
  equal(log.reexpression.shift, minPos / 2);
  ok(log.notes.some((n) => n.includes("half the smallest positive value")), log.notes.join());
  ok(s.candidates.some((c) => c.reexpression.kind === "yeo-johnson"));
  ok(s.yeoJohnson !== null && s.boxCox === null);
  ok(s.skipped.some((m) => m.startsWith("Reciprocal: 8 zeros")), s.skipped.join("; "));
  ok(s.skipped.some((m) => m.startsWith("Box–Cox: it needs positive values")));
});

Deno.test("data of both signs: square root, reciprocal and Box–Cox are skipped with reasons", () => {
  const s = searchReexpressions(lognormal(60).map((v) => v - 1.2));
  const kinds = s.candidates.map((c) => c.reexpression.kind);
  ok(!kinds.includes("square-root") && !kinds.includes("reciprocal") && !kinds.includes("box-cox"));
  ok(kinds.includes("yeo-johnson") && kinds.includes("log"));
  equal(s.skipped.length, 3);
});

Deno.test("above 5000 values W and p come from the chain's subsample; tests that do not apply are notes (n = 6)", () => {
  const x = lognormal(6000);
  const big = searchReexpressions(x);
  for (const c of big.candidates) {
    const sw = c.tests.find((t) => t.test === "Shapiro–Wilk")!;
    // the same seeded subsample (5000, seed 1) a chain on the re-expressed values tests
    const y = applyReexpression(Float64Array.from(x), c.reexpression);
    equal(sw.result?.statistic, shapiroWilk(randomSubsample(y, 5000, 1)).statistic);
    equal(sw.result?.n, 5000);
    ok(sw.result?.method.includes("subsample of 5000 of the 6000 values"));
    ok(c.tests.find((t) => t.test === "Anderson–Darling")!.result !== null);
  }
  const small = searchReexpressions([1.2, 3.4, 2.2, 9.9, 4.1, 1.7]);
  const dp = small.chosen.tests.find((t) => t.test === "D'Agostino–Pearson")!;
  equal(dp.result, null);
  ok(/at least/.test(dp.note ?? ""), dp.note ?? "");
});

Deno.test("property: the ranking follows the stated rule", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: 0.05, max: 50, noNaN: true }), { minLength: 8, maxLength: 60 }),
      (x) => {
        fc.pre(Math.max(...x) > 1.01 * Math.min(...x));
        const s = searchReexpressions(x);
        const best = Math.min(...s.candidates.map((c) => c.departure));
        ok(s.chosen.departure <= best + s.margin + 1e-15);
        let seenFar = false;
        let lastSimplicity = -1;
        for (const c of s.candidates) {
          equal(c.closeToBest, c.departure <= best + s.margin);
          if (!c.closeToBest) seenFar = true;
          else {
            ok(!seenFar, "equally good candidates come first");
            ok(c.simplicity > lastSimplicity, "simplest first among equally good");
            lastSimplicity = c.simplicity;
          }
        }
        ok(Object.isFrozen(s) && Object.isFrozen(s.candidates) && Object.isFrozen(s.chosen));
        deepEqual(JSON.parse(JSON.stringify(s)).chosen.reexpression, s.chosen.reexpression);
      },
    ),
    { seed: 20261201, numRuns: 25 },
  );
});

Deno.test("search rejects unusable input with PlumbError codes", () => {
  const code = (f: () => unknown, c: string) =>
    throws(f, (e: unknown) => e instanceof PlumbError && e.code === c);
  code(() => searchReexpressions([1, 2]), "too-few");
  code(() => searchReexpressions([1, 2, Infinity]), "non-finite");
  code(() => searchReexpressions([4, 4, 4, 4]), "constant");
});

Deno.test("every λ in the search's words has a true minus sign (U+2212), none a hyphen", () => {
  // reciprocal-normal data put λ̂ near −1, so the reciprocal carries the ladder note
  const r = seededRandom(5);
  for (
    const x of [
      Array.from({ length: 300 }, () => 1 / (2 + 0.3 * r.normal())),
      Array.from({ length: 200 }, () => 1 / (1 + 0.4 * Math.abs(r.normal()))),
      lognormal(150, 1.2),
    ]
  ) {
    const words = JSON.stringify(searchReexpressions(x));
    ok(!/λ̂? = -/.test(words), words.match(/[^"]*λ̂? = -[^"]*/)?.[0]);
  }
  const words = JSON.stringify(
    searchReexpressions(Array.from({ length: 300 }, () => 1 / (2 + 0.3 * r.normal()))),
  );
  ok(words.includes("Box–Cox λ = −1 (the same shape)"), "the ladder note for the reciprocal");
});
