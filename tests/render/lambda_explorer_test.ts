import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { lambdaExplorerSpec } from "../../lib/render/lambda_explorer_spec.ts";
import { renderSvg } from "../../lib/render/svg.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { skewed } from "./_samples.ts";

const x = skewed(150, 21);
const bc = (l: number) => x.map((v) => (l === 0 ? Math.log(v) : (v ** l - 1) / l));

function input(lambdas: number[], hat: number, ci: [number, number]) {
  return {
    lambdas,
    logLik: lambdas.map((l) => -((l - hat) ** 2)),
    lambdaHat: hat,
    ci,
    perLambda: lambdas.map((l, k) => ({
      W: 0.95 + k / 1000,
      p: 0.01 * (k + 1),
      qq: qqData(bc(l)),
    })),
  };
}

Deno.test("an even grid gets a λ slider starting at the grid point nearest λ̂", () => {
  const lambdas = [-1, -0.5, 0, 0.5, 1];
  const spec = lambdaExplorerSpec(input(lambdas, 0.1, [-0.3, 0.6]), { name: "torque" }) as {
    params: { name: string; value: number; bind: Record<string, unknown> }[];
  };
  assert.equal(spec.params.length, 1);
  assert.equal(spec.params[0].value, 0);
  assert.deepEqual(spec.params[0].bind, { input: "range", min: -1, max: 1, step: 0.5, name: "λ " });
});

Deno.test("the static SVG shows the chosen λ's W and p, and only its points", async () => {
  const lambdas = [-1, -0.5, 0, 0.5, 1];
  const spec = lambdaExplorerSpec(input(lambdas, 0.4, [0.1, 0.8]));
  const svg = await renderSvg(spec);
  // λ̂ = 0.4 → grid point 0.5, the fourth: W = 0.953, p = 0.04
  assert.ok(svg.includes("λ = 0.500 · W = 0.9530 · p = 0.0400"), "label of the chosen λ");
  assert.ok(!svg.includes("λ = 0 · W"), "no other λ's label");
});

Deno.test("an uneven grid slides over grid positions", async () => {
  const lambdas = [-1, 0, 0.25, 0.5, 2];
  const spec = lambdaExplorerSpec(input(lambdas, 0.3, [0.1, 0.45])) as unknown as {
    params: { value: number; bind: Record<string, unknown> }[];
  };
  assert.equal(spec.params[0].value, 2);
  assert.deepEqual(spec.params[0].bind, {
    input: "range",
    min: 0,
    max: 4,
    step: 1,
    name: "λ grid position ",
  });
  const svg = await renderSvg(spec as never);
  assert.ok(svg.includes("λ = 0.250 · W = 0.9520 · p = 0.0300"));
});

Deno.test("an interval end beyond the grid is said in the subtitle", () => {
  const spec = lambdaExplorerSpec(input([-1, 0, 1], 0.9, [0.2, Infinity])) as {
    title: { subtitle: string[] };
  };
  assert.equal(
    spec.title.subtitle[0],
    "Box–Cox λ explorer · λ̂ = 0.900 · 95% interval 0.200 to ∞ (upper end beyond the grid)",
  );
});

Deno.test("mismatched or unordered input throws PlumbError", () => {
  const good = input([-1, 0, 1], 0, [-0.5, 0.5]);
  assert.throws(() => lambdaExplorerSpec({ ...good, logLik: [1, 2] }), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(
      e.message,
      "Cannot explore λ: the grid has 3 values but logLik has 2 and perLambda 3; pass one of each per λ",
    );
    return true;
  });
  assert.throws(
    () => lambdaExplorerSpec({ ...good, lambdas: [0, -1, 1] }),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
  assert.throws(
    () => lambdaExplorerSpec({ ...good, lambdaHat: NaN }),
    (e) => e instanceof PlumbError && e.code === "non-finite",
  );
});
