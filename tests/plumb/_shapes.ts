/**
 * Constructed samples with known shapes, built from quantiles (no noise), for
 * the reading and sentence tests. Invented data, for tests only.
 *
 * @module
 */
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";

const p = (i: number, n: number) => (i + 0.5) / n;
const grid = (n: number, f: (u: number) => number) =>
  Float64Array.from({ length: n }, (_, i) => f(p(i, n)));

/** The constructed samples by name. */
export const SHAPES = {
  rightSkewed: grid(100, (u) => Math.exp(0.8 * normalQuantile(u))),
  leftSkewed: grid(100, (u) => -Math.exp(0.8 * normalQuantile(u))),
  heavyTailed: grid(200, (u) => (u < 0.5 ? Math.log(2 * u) : -Math.log(2 * (1 - u)))),
  lightTailed: grid(200, (u) => u),
  rounded: grid(100, (u) => Math.round(2 * normalQuantile(u)) / 2),
  bimodal: Float64Array.from(
    { length: 200 },
    (_, i) => (i % 2 === 0 ? -2.5 : 2.5) + 0.5 * normalQuantile(p(Math.floor(i / 2), 100)),
  ),
  normal15: grid(15, (u) => 10 + 2 * normalQuantile(u)),
  normal50000: (() => {
    const r = seededRandom(50000);
    return Float64Array.from({ length: 50000 }, () => 10 + 2 * r.normal());
  })(),
};
