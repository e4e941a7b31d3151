// deno bench: Shapiro–Wilk at n = 20, 1000, 5000, against one sort of the same
// array (the target: within 1.3× of one sort of a copy). Seeded data.
import { seededRandom } from "../lib/numeric/random.ts";
import { sortFloat64 } from "../lib/numeric/sort.ts";
import { shapiroWilk } from "../lib/stats/shapiro_wilk.ts";

const rng = seededRandom(1);
for (const n of [20, 1000, 5000]) {
  const x = new Float64Array(n).map(() => rng.normal());
  Deno.bench({
    name: `shapiroWilk n=${n}`,
    group: `sw ${n}`,
    baseline: true,
    fn: () => void shapiroWilk(x),
  });
  Deno.bench({ name: `built-in sort n=${n}`, group: `sw ${n}`, fn: () => void x.slice().sort() });
  Deno.bench({
    name: `radix sort n=${n}`,
    group: `sw ${n}`,
    fn: () => void sortFloat64(x.slice()),
  });
}
// Repeated samples of one size: the coefficients are cached after the first call.
const many = Array.from({ length: 50 }, () => new Float64Array(5000).map(() => rng.normal()));
let k = 0;
Deno.bench({
  name: "shapiroWilk n=5000, fresh sample each call",
  fn: () => void shapiroWilk(many[k++ % many.length]),
});
