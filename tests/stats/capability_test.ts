// Capability indices (the R comparison of Cp, Cpk and their intervals is in
// tests/stakes/stakes_test.ts); here: one-sided limits, the percentile-based
// indices, the t interval's edges, and errors.
import { deepEqual, equal, ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { rankQuantile } from "../../lib/stats/rank_quantile.ts";
import { capabilityIndices } from "../../lib/stats/capability.ts";
import { tInterval } from "../../lib/stats/mean_interval.ts";
import {
  PERCENTILE_CAPABILITY_MIN_N,
  percentileCapability,
} from "../../lib/stats/percentile_capability.ts";
import { assertClose } from "../_assert_close.ts";

const is = (code: string, re: RegExp) => (e: unknown) =>
  e instanceof PlumbError && e.code === code && re.test(e.message);

Deno.test("one-sided limits: Cpk is that side's index and Cp is absent", () => {
  const up = capabilityIndices({ n: 30, mean: 4, sd: 0.5 }, { upper: 5.5 });
  equal(up.cp, null);
  equal(up.cpCi, null);
  equal(up.cpl, null);
  assertClose(up.cpk, 1, { rel: 1e-15 }, "Cpu = (5.5 − 4)/1.5");
  const lo = capabilityIndices({ n: 30, mean: 4, sd: 0.5 }, { lower: 2.5 });
  assertClose(lo.cpk, 1, { rel: 1e-15 }, "Cpl = (4 − 2.5)/1.5");
  deepEqual(lo.cpkCi, up.cpkCi); // same Ĉpk and n, same Bissell interval
});

Deno.test("Cpk's interval widens as n falls and is centred on Ĉpk", () => {
  const w = (n: number) => {
    const c = capabilityIndices({ n, mean: 0, sd: 1 }, { lower: -4, upper: 4 });
    assertClose((c.cpkCi[0] + c.cpkCi[1]) / 2, c.cpk, { rel: 1e-15 }, `centre at n ${n}`);
    return c.cpkCi[1] - c.cpkCi[0];
  };
  ok(w(10) > w(50) && w(50) > w(500));
});

Deno.test("percentile-based indices: the definition, and refusal below 740 values", () => {
  equal(PERCENTILE_CAPABILITY_MIN_N, 740);
  const x = Float64Array.from({ length: 2000 }, (_, i) => Math.exp((i - 1000) / 400));
  const q = percentileCapability(x, { lower: 0.05, upper: 20 });
  const [a, m, b] = [0.00135, 0.5, 0.99865].map((p) => rankQuantile(x, p));
  deepEqual(q.points, [a, m, b]);
  assertClose(q.cp!, (20 - 0.05) / (b - a), { rel: 1e-15 }, "Cp(q)");
  assertClose(q.cpk!, Math.min((20 - m) / (b - m), (m - 0.05) / (m - a)), { rel: 1e-15 }, "Cpk(q)");
  const few = percentileCapability(x.subarray(0, 739), { upper: 20 });
  equal(few.cpk, null);
  ok(/at least 740 values/.test(few.note!));
  ok(percentileCapability(x.subarray(0, 740), { upper: 20 }).cpk !== null);
  const tied = percentileCapability(new Float64Array(800).fill(1), { lower: 0, upper: 2 });
  equal(tied.cpk, null);
  ok(/tied/.test(tied.note!));
});

Deno.test("tInterval: n = 2 uses t with 1 degree of freedom; the level is honoured", () => {
  const r = tInterval([1, 3]);
  assertClose(r.tQuantile, 12.706204736174707, { rel: 1e-14 }, "qt(0.975, 1), R 4.2.2");
  assertClose(
    r.interval[1] - r.mean,
    12.706204736174707,
    { rel: 1e-14 },
    "half-width t·s/√n = t (s = √2, n = 2)",
  );
  const narrow = tInterval([1, 2, 3, 4, 5], { level: 0.5 });
  ok(narrow.interval[1] - narrow.interval[0] < tInterval([1, 2, 3, 4, 5]).interval[1] - 1);
});

Deno.test("errors: no limits, crossed limits, too few, no spread, bad level", () => {
  const s = { n: 10, mean: 0, sd: 1 };
  throws(() => capabilityIndices(s, {}), is("bad-option", /without specification limits/));
  throws(() => capabilityIndices(s, { lower: 1, upper: 1 }), is("bad-option", /not below upper/));
  throws(() => capabilityIndices(s, { lower: Infinity }), is("bad-option", /lower limit Infinity/));
  throws(
    () => capabilityIndices({ n: 1, mean: 0, sd: 1 }, { upper: 3 }),
    is("too-few", /at least 2/),
  );
  throws(
    () => capabilityIndices({ n: 5, mean: 0, sd: 0 }, { upper: 3 }),
    is("constant", /no spread/),
  );
  throws(() => capabilityIndices(s, { upper: 3, level: 0 }), is("bad-option", /level 0/));
  throws(() => tInterval([1]), is("too-few", /at least 2/));
  throws(() => tInterval([2, 2]), is("constant", /identical/));
});
