// Least squares against R 4.2.2 (tests/fixtures/linear_model.json, written by
// tools/fixtures/linear_model.R): coefficients and their standard errors,
// sigma, residuals, hatvalues, rstandard and rstudent on published data sets
// from R's datasets package and on seeded badly scaled and rank-deficient
// designs. Tolerance 1e-9 relative (absolute floor 1e-9 of the largest
// magnitude in the vector, for entries that are nearly zero).
import assert from "node:assert/strict";
import { fitLinearModel, type LinearModelFit } from "../../lib/stats/linear_model.ts";
import { assertClose } from "../_assert_close.ts";

interface Case {
  name: string;
  source: string;
  response: string;
  y: (number | null)[];
  covariates: Record<string, number[]>;
  factors: Record<string, string[]>;
  interactions: string[][];
  aliased: "refuse" | "drop";
  expected: {
    rank: number;
    df: number;
    sigma: number;
    compareCoefficients: boolean;
    coefficients: Record<string, [number | null, number | null]>;
    aliased: string[];
    residuals: number[];
    hat: number[];
    rstandard: (number | null)[];
    rstudent: (number | null)[];
  };
}

const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/linear_model.json", import.meta.url)),
) as { library: { R: string }; cases: Case[] };

function fitCase(c: Case): LinearModelFit {
  return fitLinearModel(c.y.map((v) => v ?? NaN), {
    response: c.response,
    covariates: c.covariates,
    factors: c.factors,
    interactions: c.interactions,
    aliased: c.aliased,
  });
}

/** Entry-wise relative tolerance with an absolute floor tied to the vector's size. */
function assertVector(
  actual: ArrayLike<number>,
  expected: readonly (number | null)[],
  rel: number,
  what: string,
): void {
  assert.equal(actual.length, expected.length, `${what}: length`);
  const big = Math.max(...expected.map((v) => Math.abs(v ?? 0)));
  for (let i = 0; i < expected.length; i++) {
    if (expected[i] === null) continue;
    assertClose(actual[i], expected[i]!, { rel, abs: rel * big }, `${what}[${i}]`);
  }
}

for (const c of fixture.cases) {
  Deno.test(`linear model vs R ${fixture.library.R} lm: ${c.name} (${c.source})`, () => {
    const fit = fitCase(c);
    const e = c.expected;
    const ctx = `${c.name} vs R ${fixture.library.R}`;
    assert.equal(fit.rank, e.rank, `${ctx}: rank`);
    assert.equal(fit.dfResidual, e.df, `${ctx}: residual df`);
    const left = [...fit.aliased.map((a) => a.name), ...fit.emptyCells].sort();
    assert.deepEqual(left, [...e.aliased].sort(), `${ctx}: aliased columns`);
    assertClose(fit.sigma, e.sigma, { rel: 1e-9 }, `${ctx}: sigma`);
    assertVector(fit.residuals, e.residuals, 1e-9, `${ctx}: residuals`);
    assertVector(fit.leverages, e.hat, 1e-9, `${ctx}: hatvalues`);
    assertVector(fit.standardized, e.rstandard, 1e-9, `${ctx}: rstandard`);
    assertVector(fit.studentized, e.rstudent, 1e-9, `${ctx}: rstudent`);
    // R gives NaN (written null) exactly where the leverage is 1
    const nulls = e.rstudent.flatMap((v, i) => (v === null ? [i] : []));
    assert.deepEqual([...fit.exactRows], nulls, `${ctx}: rows with leverage 1`);
    for (const v of [fit.residuals, fit.leverages, fit.standardized, fit.studentized]) {
      assert.ok(v.every(Number.isFinite), `${ctx}: every value finite`);
    }
    if (!e.compareCoefficients) return;
    for (const [name, [est, se]] of Object.entries(e.coefficients)) {
      const got = fit.coefficients.find((k) => k.name === name);
      if (est === null) {
        assert.equal(got, undefined, `${ctx}: ${name} is aliased`);
        continue;
      }
      assert.ok(got, `${ctx}: coefficient ${name} present`);
      assertClose(got.estimate, est, { rel: 1e-9 }, `${ctx}: coefficient ${name}`);
      assertClose(got.se, se!, { rel: 1e-9 }, `${ctx}: standard error of ${name}`);
    }
  });
}

// An independent check of R and of plumbline on the ill-conditioned and badly
// scaled cases: mpmath at 60 digits (tests/fixtures/linear_model_mp.json,
// written by tools/fixtures/linear_model_mp.py from the same inputs).
const precise = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/linear_model_mp.json", import.meta.url)),
) as { library: { mpmath: string }; cases: { name: string; hat: number[]; rstudent: number[] }[] };

for (const m of precise.cases) {
  Deno.test(`linear model vs mpmath ${precise.library.mpmath} at 60 digits: ${m.name}`, () => {
    const c = fixture.cases.find((k) => k.name === m.name)!;
    const fit = fitCase(c);
    assertVector(fit.leverages, m.hat, 1e-11, `${m.name}: leverages vs mpmath`);
    assertVector(fit.studentized, m.rstudent, 1e-11, `${m.name}: rstudent vs mpmath`);
    // and R's own values, for the record of its accuracy on these cases
    assertVector(m.rstudent, c.expected.rstudent, 1e-9, `${m.name}: R rstudent vs mpmath`);
  });
}
