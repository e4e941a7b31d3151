import { equal, ok, throws } from "node:assert/strict";
import fc from "fast-check";
import { PlumbError } from "../../lib/errors.ts";
import { boxCox, boxCoxInverse } from "../../lib/reexpress/box_cox.ts";
import { yeoJohnson, yeoJohnsonInverse } from "../../lib/reexpress/yeo_johnson.ts";
import { logInverse, logShift, logTransform } from "../../lib/reexpress/log.ts";
import { squareRoot, squareRootInverse } from "../../lib/reexpress/square_root.ts";
import { reciprocal, reciprocalInverse } from "../../lib/reexpress/reciprocal.ts";
import { boxCoxFit } from "../../lib/reexpress/box_cox_fit.ts";
import { yeoJohnsonFit } from "../../lib/reexpress/yeo_johnson_fit.ts";
import { assertClose } from "../_assert_close.ts";

const SEED = 20261201;
const RUNS = { seed: SEED, numRuns: 300 };
// Round trips: inverse(transform(x)) = x to 1e-12 relative, on x in [0.1, 10] and
// λ in [−2, 2]. Outside that box the forward transform itself is ill-conditioned
// (x^λ near 0 is stored as 1 + λy, which loses digits), so no inverse can recover x.
const ROUND = { rel: 1e-12, abs: 1e-300 };
const xs = fc.array(fc.double({ min: 0.1, max: 10, noNaN: true }), { minLength: 1, maxLength: 20 });
// Subnormal |x| (< 1e-300) excluded: they carry too few digits for a relative bound.
const signed = fc.array(
  fc.double({ min: -10, max: 10, noNaN: true }).filter((v) => v === 0 || Math.abs(v) >= 1e-300),
  {
    minLength: 1,
    maxLength: 20,
  },
);
const lam = fc.double({ min: -2, max: 2, noNaN: true });

const roundTrip = (x: number[], back: Float64Array, what: string) =>
  x.forEach((v, i) => assertClose(back[i], v, { ...ROUND, abs: 1e-15 * (v === 0 ? 1 : 0) }, what));

Deno.test("Box–Cox inverse ∘ transform is the identity to 1e-12 relative", () => {
  fc.assert(
    fc.property(xs, lam, (x, l) => roundTrip(x, boxCoxInverse(boxCox(x, l), l), `λ = ${l}`)),
    RUNS,
  );
});

Deno.test("Yeo–Johnson inverse ∘ transform is the identity to 1e-12 relative (|x| ≤ 10)", () => {
  fc.assert(
    fc.property(
      signed,
      lam,
      (x, l) => roundTrip(x, yeoJohnsonInverse(yeoJohnson(x, l), l), `λ = ${l}`),
    ),
    RUNS,
  );
});

Deno.test("log, square root and reciprocal round-trip to 1e-12 relative", () => {
  fc.assert(
    fc.property(xs, fc.constantFrom<"e" | 10>("e", 10), (x, base) => {
      roundTrip(x, logInverse(logTransform(x, { base }), { base }), `log base ${base}`);
      roundTrip(x, squareRootInverse(squareRoot(x)), "square root");
      roundTrip(x, reciprocalInverse(reciprocal(x)), "reciprocal");
    }),
    RUNS,
  );
});

Deno.test("Box–Cox at λ → 0 converges to log (error ≤ |λ|·(ln x)² for |λ| ≤ 1e-4)", () => {
  // (x^λ − 1)/λ − ln x = λ(ln x)²/2 + O(λ²): a first-order bound, with slack 2 on the constant.
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 20 }),
      fc.double({ min: -1e-4, max: 1e-4, noNaN: true }),
      (x, l) => {
        const y = boxCox(x, l);
        x.forEach((v, i) => {
          const lg = Math.log(v);
          ok(Math.abs(y[i] - lg) <= Math.abs(l) * lg * lg + 4e-16 * Math.abs(lg), `x=${v} λ=${l}`);
        });
      },
    ),
    RUNS,
  );
  equal(boxCox([Math.E], 0)[0], 1);
});

Deno.test("known values: Box–Cox, Yeo–Johnson, log10", () => {
  // Direct from the definitions (Box & Cox 1964 eq. 1; Yeo & Johnson 2000 eq. 2.1).
  assertClose(boxCox([8], 1 / 3)[0], 3, { rel: 1e-15 }, "(8^(1/3) − 1)/(1/3)");
  assertClose(boxCox([4], -1)[0], 0.75, { rel: 1e-15 }, "(4^−1 − 1)/−1");
  assertClose(yeoJohnson([3], 0.5)[0], 2, { rel: 1e-15 }, "((3+1)^0.5 − 1)/0.5");
  assertClose(yeoJohnson([-3], 1.5)[0], -2, { rel: 1e-15 }, "−((1+3)^0.5 − 1)/0.5");
  assertClose(yeoJohnson([-3], 2)[0], -Math.log(4), { rel: 1e-15 }, "λ = 2 branch");
  assertClose(yeoJohnson([3], 0)[0], Math.log(4), { rel: 1e-15 }, "λ = 0 branch");
  equal(logTransform([1000], { base: 10 })[0], 3);
  const y = yeoJohnson([-2.5, 0, 4], 1);
  ok(y[0] === -2.5 && y[1] === 0 && Math.abs(y[2] - 4) < 1e-15, "λ = 1 is the identity");
});

Deno.test("Box–Cox λ̂ is invariant to x → c·x (to 1e-9)", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: 0.01, max: 100, noNaN: true }), { minLength: 5, maxLength: 40 }),
      fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
      (x, c) => {
        fc.pre(Math.max(...x) > Math.min(...x) * 1.01);
        const a = boxCoxFit(x);
        const b = boxCoxFit(x.map((v) => v * c));
        assertClose(b.lambda, a.lambda, { abs: 1e-9 }, `λ̂ for x·${c} vs x`);
      },
    ),
    { seed: SEED, numRuns: 100 },
  );
});

Deno.test("the interval contains λ̂ (both families)", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: 0.01, max: 100, noNaN: true }), { minLength: 5, maxLength: 40 }),
      (x) => {
        fc.pre(Math.max(...x) > Math.min(...x) * 1.01);
        for (const r of [boxCoxFit(x), yeoJohnsonFit(x.map((v) => v - 20))]) {
          const [lo, hi] = r.ci;
          ok(
            lo === null || lo < r.lambda || (r.lambdaAtRangeEnd && lo <= r.lambda),
            `${lo} ${r.lambda}`,
          );
          ok(
            hi === null || r.lambda < hi || (r.lambdaAtRangeEnd && r.lambda <= hi),
            `${r.lambda} ${hi}`,
          );
        }
      },
    ),
    { seed: SEED, numRuns: 100 },
  );
});

Deno.test("logShift states its rule: none for positive data, half the smallest positive for zeros", () => {
  const none = logShift([0.5, 2, 3]);
  equal(none.shift, 0);
  equal(none.rule, "No shift: every value is positive");
  const z = logShift([0, 0, 0.4, 2, 7]);
  equal(z.shift, 0.2);
  ok(z.rule.includes("half the smallest positive value"));
  const neg = logShift([-3, -1, 4]);
  equal(neg.shift, 4); // −(−3) + (−1 − (−3))/2
  ok(Math.min(...logTransform([-3, -1, 4], { shift: neg.shift })) === 0); // ln(1)
  ok(Object.isFrozen(z));
});

Deno.test("preconditions throw PlumbError codes with messages that say what to do", () => {
  const check = (f: () => unknown, code: string, re: RegExp) =>
    throws(f, (e: unknown) => {
      ok(e instanceof PlumbError, String(e));
      equal(e.code, code);
      ok(re.test(e.message), e.message);
      ok(!e.message.endsWith("."), "no trailing period");
      return true;
    });
  check(
    () => boxCox([1, 0, 2], 0.5),
    "non-positive",
    /^Cannot apply the Box–Cox .*≤ 0: 1 of 3.*shift.*Yeo–Johnson/,
  );
  check(
    () => logTransform([3, -1]),
    "non-positive",
    /^Cannot apply the log .*logShift.*Yeo–Johnson/,
  );
  check(() => logTransform([0, 1], { shift: -0.5 }), "non-positive", /after a shift of -0.5/);
  check(() => reciprocal([2, 0, 0]), "zero", /^Cannot apply the reciprocal .*zeros: 2 of 3/);
  check(() => squareRoot([4, -1]), "non-positive", /negative values: 1 of 2/);
  check(() => boxCox([1, NaN], 1), "non-finite", /not finite/);
  check(() => boxCox([1], NaN), "bad-option", /λ must be a finite number/);
  check(() => logTransform([1], { shift: Infinity }), "bad-option", /finite number/);
  check(() => logShift([0, 0, 0]), "constant", /identical/);
});

Deno.test("inverses outside the transform's range give NaN, not a wrong number", () => {
  ok(Number.isNaN(boxCoxInverse([-3], 0.5)[0])); // 1 + λy < 0
  ok(Number.isNaN(squareRootInverse([-1])[0]));
  equal(boxCoxInverse([1], -1)[0], Infinity); // 1 + λy = 0 with λ < 0
});
