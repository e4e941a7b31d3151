import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { _boxCoxProfile } from "../../lib/reexpress/_profile.ts";
import { _yeoJohnsonProfile } from "../../lib/reexpress/_profile_yeo_johnson.ts";
import { boxCoxProfile } from "../../lib/reexpress/box_cox_profile.ts";
import { assertClose } from "../_assert_close.ts";

// The local series models must reproduce the direct one-pass evaluation: h within
// 2(n − 1)ε ≈ 4.4e-12 absolute, h′ within 1e-9 relative or 1e-9 absolute. Both are sums
// over n = 20000 values, and a floating-point sum of positive terms carries a relative
// error up to (n − 1)ε (Higham 2002, Accuracy and Stability of Numerical Algorithms,
// §4.2), which becomes an absolute error in h = ln var + …; two such sums may differ by
// twice that. (Checked once by hand against mpmath at 40 digits on the "zeros" sample at
// λ = 4.500001, h ≈ 9.11: the direct form was off by 1.0e-13, the series by 1.1e-13.)
const H = { abs: 2 * 19999 * Number.EPSILON };
const DH = { rel: 1e-9, abs: 1e-9 };

const rng = seededRandom(11);
const lognormal = new Float64Array(20000).map(() => Math.exp(0.6 * rng.normal()));
const withZeros = new Float64Array(20000).map(() =>
  rng.uniform() < 0.1 ? 0 : Math.exp(0.7 * rng.normal())
);
const negative = lognormal.map((v) => -v);

for (
  const [name, direct, local] of [
    ["Box–Cox, lognormal", _boxCoxProfile(lognormal), _boxCoxProfile(lognormal).local!()],
    ["Yeo–Johnson, zeros", _yeoJohnsonProfile(withZeros), _yeoJohnsonProfile(withZeros).local!()],
    ["Yeo–Johnson, negative", _yeoJohnsonProfile(negative), _yeoJohnsonProfile(negative).local!()],
  ] as const
) {
  Deno.test(`local series models match direct evaluation: ${name}`, () => {
    // Centres near 0 (the λ = 0 model), moderate, and far; steps inside and across radii.
    for (const centre of [0, 0.0004, 0.05, 0.3, -0.7, 1.9, 2.05, 4.5]) {
      for (const step of [0, 1e-6, -1e-4, 3e-3, -0.02, 0.04]) {
        const l = centre + step;
        const a = direct.hd(l);
        const b = local.hd(l);
        assertClose(b.h, a.h, H, `${name}: h(${l})`);
        assertClose(b.dh, a.dh, DH, `${name}: h′(${l})`);
      }
    }
    ok(local.passes() < direct.passes(), "the local models take fewer passes");
  });
}

Deno.test("boxCoxProfile: one pass over the data per λ, the same values as the prepared profile", () => {
  // Its speed is measured by bench/reexpress_bench.ts; here, the work it does.
  const x = lognormal.subarray(0, 5000);
  const grid = Array.from({ length: 41 }, (_, i) => -2 + i / 10);
  const ll = boxCoxProfile(x, grid);
  const prepared = _boxCoxProfile(x);
  grid.forEach((l, i) => {
    const h = prepared.h(l);
    ok(Object.is(ll[i], -0.5 * 5000 * (Math.log(2 * Math.PI) + 1 + h)), `λ = ${l}`);
  });
  ok(prepared.passes() === 41, `${prepared.passes()} passes for 41 λ`);
});

Deno.test("beyond |λ|·max|c| = 50 the local model hands over to the direct form exactly", () => {
  const direct = _boxCoxProfile(lognormal);
  const local = direct.local!();
  for (const l of [40, -45, 120]) {
    const a = direct.hd(l);
    const b = local.hd(l);
    ok(Object.is(a.h, b.h) && Object.is(a.dh, b.dh), `λ = ${l}: ${a.h} vs ${b.h}`);
  }
});
