/**
 * Timing of the tests without a sample-size limit at n = 1e6 (seeded data).
 * Run: deno bench --allow-read bench/other_tests_bench.ts
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { andersonDarling } from "../lib/stats/anderson_darling.ts";
import { dagostinoPearson } from "../lib/stats/dagostino_pearson.ts";
import { jarqueBera } from "../lib/stats/jarque_bera.ts";
import { lilliefors } from "../lib/stats/lilliefors.ts";
import { moments } from "../lib/stats/moments.ts";

const N = 1_000_000;
const rng = seededRandom(20261201);
const x = new Float64Array(N);
for (let i = 0; i < N; i++) x[i] = 100 + 15 * rng.normal();

Deno.bench("Anderson–Darling, n = 1e6", { group: "n = 1e6", baseline: true }, () => {
  andersonDarling(x);
});
Deno.bench("D'Agostino–Pearson K², n = 1e6", { group: "n = 1e6" }, () => {
  dagostinoPearson(x);
});
Deno.bench("Lilliefors, n = 1e6", { group: "n = 1e6" }, () => {
  lilliefors(x);
});
Deno.bench("Jarque–Bera, n = 1e6", { group: "n = 1e6" }, () => {
  jarqueBera(x);
});
Deno.bench("moments, n = 1e6", { group: "n = 1e6" }, () => {
  moments(x);
});
Deno.bench("sort of a Float64Array copy alone, n = 1e6", { group: "n = 1e6" }, () => {
  Float64Array.from(x).sort();
});
