// deno bench: the λ fits, the λ-explorer grid and the candidate search. Seeded data.
import { seededRandom } from "../lib/numeric/random.ts";
import { boxCoxFit } from "../lib/reexpress/box_cox_fit.ts";
import { boxCoxProfile } from "../lib/reexpress/box_cox_profile.ts";
import { yeoJohnsonFit } from "../lib/reexpress/yeo_johnson_fit.ts";
import { yeoJohnsonProfile } from "../lib/reexpress/yeo_johnson_profile.ts";
import { searchReexpressions } from "../lib/reexpress/search.ts";

const rng = seededRandom(3);
const lognormal = (n: number) => new Float64Array(n).map(() => Math.exp(0.5 * rng.normal()));
const grid = Array.from({ length: 41 }, (_, i) => -2 + i * 0.1);

for (const n of [100, 5000, 1e6]) {
  const x = lognormal(n);
  Deno.bench({
    name: `boxCoxFit n=${n}`,
    group: `fit ${n}`,
    baseline: true,
    fn: () => void boxCoxFit(x),
  });
  const y = x.map((v) => v - 1);
  Deno.bench({
    name: `yeoJohnsonFit n=${n} (both signs)`,
    group: `fit ${n}`,
    fn: () => void yeoJohnsonFit(y),
  });
}
const x5000 = lognormal(5000);
Deno.bench({ name: "boxCoxProfile, 41 λ, n=5000", fn: () => void boxCoxProfile(x5000, grid) });
Deno.bench({
  name: "yeoJohnsonProfile, 41 λ, n=5000",
  fn: () => void yeoJohnsonProfile(x5000.map((v) => v - 1), grid),
});
for (const n of [50, 1000, 5000]) {
  const x = lognormal(n);
  Deno.bench({ name: `searchReexpressions n=${n}`, fn: () => void searchReexpressions(x) });
}
