import { equal, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import {
  censoredBoxCoxFit,
  censoredYeoJohnsonFit,
} from "../../lib/reexpress/censored_lambda_fit.ts";
import { censoredReexpress } from "../../lib/reexpress/censored_reexpress.ts";
import { reexpression } from "../../lib/reexpress/reexpression.ts";
import { yeoJohnsonFit } from "../../lib/reexpress/yeo_johnson_fit.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

// Reference values: tests/fixtures/censored_lambda.json, written by
// tools/fixtures/censored_lambda.R: the profile of R's survival::survreg
// (gaussian, rel.tolerance 1e-13) plus the log-Jacobian, maximised by
// stats::optimize and cut by stats::uniroot (tol 1e-11).
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/censored_lambda.json", import.meta.url)),
) as {
  library: { R: string; survival: string };
  cases: {
    name: string;
    family: string;
    lambda: number;
    logLik: number;
    ci: [number | null, number | null];
    x: number[];
    censor: number[];
  }[];
};
const src = `R ${fixture.library.R} survival ${fixture.library.survival}`;

// Tolerances: λ̂ of a smooth maximum located from function values is good to
// about √ε·scale ≈ 1e-8 in both implementations; 1e-6 absolute leaves room for
// both. The maximised log-likelihood is insensitive to λ̂ at first order: 1e-10
// relative. Interval ends are roots of a sloped function: 1e-7 absolute.
Deno.test(`censored Box–Cox / Yeo–Johnson λ match the survreg profile (${src})`, () => {
  for (const c of fixture.cases) {
    const s = censoredSample(c.x, c.censor);
    const fit = c.family === "Box-Cox" ? censoredBoxCoxFit(s) : censoredYeoJohnsonFit(s);
    const ctx = `${c.name} (${c.family}) vs ${src}`;
    assertClose(fit.lambda, c.lambda, { abs: 1e-6 }, `λ̂, ${ctx}`);
    assertClose(fit.logLikelihood, c.logLik, { rel: 1e-10 }, `ℓ̂, ${ctx}`);
    for (const e of [0, 1]) {
      const want = c.ci[e];
      if (want === null) equal(fit.ci[e], null, `open end ${e}, ${ctx}`);
      else assertClose(fit.ci[e]!, want, { abs: 1e-7 }, `interval end ${e}, ${ctx}`);
    }
  }
});

Deno.test("nothing censored: the same λ̂ and interval as the uncensored fits", () => {
  const rng = seededRandom(9);
  const x = Array.from({ length: 60 }, () => Math.exp(0.5 * rng.normal()) + 0.1);
  const s = censoredSample(x, x.map(() => 0));
  const a = censoredBoxCoxFit(s);
  const b = boxCoxFit(x);
  assertClose(a.lambda, b.lambda, { abs: 1e-6 }, "Box–Cox λ̂");
  assertClose(a.logLikelihood, b.logLikelihood, { rel: 1e-11 }, "Box–Cox ℓ̂");
  assertClose(a.ci[0]!, b.ci[0]!, { abs: 1e-7 }, "Box–Cox lower end");
  assertClose(a.ci[1]!, b.ci[1]!, { abs: 1e-7 }, "Box–Cox upper end");
  const y = x.map((v) => v - 1);
  const c = censoredYeoJohnsonFit(censoredSample(y, y.map(() => 0)));
  const d = yeoJohnsonFit(y);
  assertClose(c.lambda, d.lambda, { abs: 1e-6 }, "Yeo–Johnson λ̂");
  assertClose(c.logLikelihood, d.logLikelihood, { rel: 1e-11 }, "Yeo–Johnson ℓ̂");
});

Deno.test("λ̂ is invariant to scale for Box–Cox, and the median maps back", () => {
  const rng = seededRandom(12);
  const x: number[] = [];
  const c: number[] = [];
  for (let i = 0; i < 80; i++) {
    const v = Math.exp(1 + 0.6 * rng.normal());
    const l = [1.5, 2][i % 2];
    x.push(v < l ? l : v);
    c.push(v < l ? -1 : 0);
  }
  const a = censoredBoxCoxFit(censoredSample(x, c));
  const b = censoredBoxCoxFit(censoredSample(x.map((v) => 1000 * v), c));
  assertClose(b.lambda, a.lambda, { abs: 1e-6 }, "λ̂ under x → 1000x");
  assertClose(b.median!, 1000 * a.median!, { rel: 1e-5 }, "median under x → 1000x");
  ok(Math.abs(a.lambda) < 0.5, `lognormal data: λ̂ = ${a.lambda} near 0`);
  ok(a.median! > 1.5 && a.median! < 5, `median ${a.median} near e = 2.72`);
});

Deno.test("large samples are located on a subsample and refined on all values", () => {
  const rng = seededRandom(13);
  const n = 20000;
  const x = new Float64Array(n);
  const c = new Int8Array(n);
  for (let i = 0; i < n; i++) {
    const v = Math.exp(0.6 * rng.normal());
    x[i] = v < 0.7 ? 0.7 : v;
    c[i] = v < 0.7 ? -1 : 0;
  }
  const fit = censoredBoxCoxFit(censoredSample(x, c));
  ok(Math.abs(fit.lambda) < 0.05, `λ̂ = ${fit.lambda}`);
  ok(fit.ci[0]! < fit.lambda && fit.lambda < fit.ci[1]!);
});

Deno.test("censoredReexpress: limits go with the values, 1/x flips the sides", () => {
  const s = censoredSample([0.05, 0.2, 0.4, 0.9, 2], [-1, 0, 0, 0, 1]);
  const l = censoredReexpress(s, reexpression("log"));
  assertClose(l.values[0], Math.log(0.05), { rel: 1e-15 }, "ln 0.05");
  equal(l.censor[0], -1);
  equal(l.censor[4], 1);
  const r = censoredReexpress(s, reexpression("reciprocal"));
  equal(r.censor[0], 1);
  equal(r.censor[4], -1);
  equal(r.values[0], 20);
  assertPlumbError(
    () =>
      censoredReexpress(
        censoredSample([-1, 0.2, 0.4, 0.9], [-1, 0, 0, 0]),
        reexpression("reciprocal"),
      ),
    "non-positive",
    /both signs/,
  );
  assertPlumbError(
    () => censoredBoxCoxFit(censoredSample([0, 0.2, 0.4, 0.9], [-1, 0, 0, 0])),
    "non-positive",
    /values ≤ 0/,
  );
});
