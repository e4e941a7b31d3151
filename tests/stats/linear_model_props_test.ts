// Properties of the least-squares residuals that hold for any data: the
// leverages sum to the rank, residuals are orthogonal to the fitted columns,
// and residuals, leverages and studentised residuals do not change under
// affine maps of a covariate, reordering of rows or relabelling of levels.
// Then the refusals: collinear terms, too few degrees of freedom, a row
// without which the rest fit exactly.
import assert from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { fitLinearModel } from "../../lib/stats/linear_model.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

const rng = seededRandom(88);

function sample(n: number) {
  const x = Array.from({ length: n }, () => rng.normal());
  const z = Array.from({ length: n }, () => 10 + rng.uniform());
  const g = Array.from({ length: n }, (_, i) => ["red", "green", "blue"][i % 3]);
  const y = x.map((v, i) => 2 * v - z[i] + (g[i] === "red" ? 1 : 0) + rng.normal());
  return { x, z, g, y };
}

function close(a: ArrayLike<number>, b: ArrayLike<number>, tol: number, what: string): void {
  assert.equal(a.length, b.length);
  for (let i = 0; i < a.length; i++) {
    assertClose(a[i], b[i], { rel: tol, abs: tol }, `${what}[${i}]`);
  }
}

Deno.test("residuals: Σh = rank, 0 ≤ h ≤ 1, residuals orthogonal to the columns", () => {
  const { x, z, g, y } = sample(40);
  const fit = fitLinearModel(y, { covariates: { x, z }, factors: { g } });
  assert.equal(fit.rank, 5);
  assertClose(fit.leverages.reduce((a, b) => a + b, 0), 5, { abs: 1e-12 }, "Σh");
  assert.ok(fit.leverages.every((h) => h >= 0 && h <= 1));
  const scale = Math.sqrt(fit.residuals.reduce((a, e) => a + e * e, 0));
  for (const col of [x.map(() => 1), x, z, g.map((v) => (v === "red" ? 1 : 0))]) {
    const dot = col.reduce((a, v, i) => a + v * fit.residuals[i], 0);
    const size = Math.sqrt(col.reduce((a, v) => a + v * v, 0)) * scale;
    assertClose(dot / size, 0, { abs: 1e-13 }, "cosine between a column and the residuals");
  }
});

Deno.test("residuals invariant under x → a + b·x (offset 2²⁰ ≈ 1e6, scale 2⁻¹⁰ ≈ 1e-3)", () => {
  const s = sample(30), z = s.z, g = s.g;
  // x on a grid of 2⁻²⁰ with |x| < 8, so that every map below is exact in doubles
  const x = s.x.map((v) => Math.round(v * 2 ** 20) / 2 ** 20);
  const y = s.y.map((v) => Math.round(v * 2 ** 20) / 2 ** 20);
  const ref = fitLinearModel(y, { covariates: { x, z }, factors: { g } });
  for (const [a, b] of [[2 ** 20, 2 ** -10], [-3, -2], [0, 2 ** 17], [2 ** 20, 1]]) {
    const fit = fitLinearModel(y, {
      covariates: { x: x.map((v) => a + b * v), z },
      factors: { g },
    });
    close(fit.residuals, ref.residuals, 1e-9, `residuals, x → ${a} + ${b}·x`);
    close(fit.leverages, ref.leverages, 1e-9, `leverages, x → ${a} + ${b}·x`);
    close(fit.studentized, ref.studentized, 1e-9, `studentized, x → ${a} + ${b}·x`);
  }
  const flipped = fitLinearModel(y.map((v) => 2 ** 20 - 2 ** -10 * v), {
    covariates: { x, z },
    factors: { g },
  });
  close(
    flipped.studentized,
    ref.studentized.map((t) => -t),
    1e-9,
    "y → 2²⁰ − 2⁻¹⁰·y flips the sign",
  );
});

Deno.test("residuals follow their rows under reordering; levels may be renamed", () => {
  const { x, z, g, y } = sample(25);
  const ref = fitLinearModel(y, { covariates: { x, z }, factors: { g } });
  const order = Array.from({ length: 25 }, (_, i) => (i * 7) % 25);
  const fit = fitLinearModel(order.map((i) => y[i]), {
    covariates: { x: order.map((i) => x[i]), z: order.map((i) => z[i]) },
    factors: { g: order.map((i) => ({ red: "zz", green: "aa", blue: "mm" })[g[i]]!) },
  });
  close(fit.studentized, order.map((i) => ref.studentized[i]), 1e-10, "studentized");
  close(fit.leverages, order.map((i) => ref.leverages[i]), 1e-10, "leverages");
});

Deno.test("a collinear covariate is refused by name, or dropped and listed, never NaN", () => {
  const { x, z, y } = sample(20);
  const w = x.map((v, i) => 3 - v + 2 * z[i]);
  assertPlumbError(
    () => fitLinearModel(y, { response: "fill", covariates: { x, z, w } }),
    "collinear",
    /^Cannot fit fill: w is explained by the other terms \(w = 3 − 1·x \+ 2·z\); leave w out, or one of the terms it depends on$/,
  );
  const fit = fitLinearModel(y, { covariates: { x, z, w }, aliased: "drop" });
  assert.deepEqual(fit.aliased.map((a) => [a.name, [...a.with]]), [["w", ["x", "z"]]]);
  assert.equal(fit.rank, 3);
  assert.ok(
    fit.studentized.every(Number.isFinite) && fit.coefficients.every((c) => Number.isFinite(c.se)),
  );
  assert.match(fit.warnings.join("\n"), /w is left out of the fit: w = 3 − 1·x \+ 2·z/);
  const set = fitLinearModel(y, {
    factors: { line: x.map((_, i) => "PQR"[i % 3]) },
    covariates: { temp: x.map((_, i) => [20, 22.5, 25][i % 3]) },
    aliased: "drop",
  });
  assert.equal(set.aliased[0].relation, "temp = 20 + 2.5·line=Q + 5·line=R");
});

Deno.test("too few residual degrees of freedom, and a row that alone carries the spread", () => {
  const { x, z, y } = sample(5);
  assertPlumbError(
    () => fitLinearModel(y, { response: "fill", covariates: { x, z } }),
    "too-few",
    /^Cannot fit fill on 2 design columns: 5 complete rows and 3 estimated parameters leave 2 residual degrees of freedom, and at least 3 are needed; use fewer terms or more rows$/,
  );
  const line = [1, 2, 3, 4, 5, 6, 7, 8];
  assertPlumbError(
    () =>
      fitLinearModel(line.map((v, i) => (i === 5 ? 2 * v + 9 : 2 * v)), {
        covariates: { t: line },
      }),
    "constant",
    /^Cannot studentise the residuals of y: without row 6 the model fits the other rows exactly; /,
  );
  assertPlumbError(
    () => fitLinearModel(y, { tolerance: 1 }),
    "bad-option",
    /^Cannot use rank tolerance 1: /,
  );
  assertPlumbError(
    () => fitLinearModel(y, { aliased: "keep" as "drop" }),
    "bad-option",
    /^Unknown aliased option "keep": use "refuse" or "drop"$/,
  );
});

Deno.test("a level seen once has leverage 1: listed, scaled residual 0, warned", () => {
  const { x, y } = sample(12);
  const g = x.map((_, i) => (i === 11 ? "solo" : i % 2 ? "a" : "b"));
  const fit = fitLinearModel(y, { covariates: { x }, factors: { g } });
  assert.deepEqual([...fit.exactRows], [11]);
  assert.equal(fit.studentized[11], 0);
  assertClose(fit.leverages[11], 1, { abs: 1e-12 }, "leverage");
  assert.match(fit.warnings.join(), /1 row is fitted exactly \(leverage 1/);
  const json = fit.toJSON() as { studentized: number[] };
  assert.ok(Array.isArray(json.studentized) && json.studentized.length === 12);
  assert.ok(Object.isFrozen(fit));
});
