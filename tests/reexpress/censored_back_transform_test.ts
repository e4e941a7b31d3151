import { equal, match, ok } from "node:assert/strict";
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { backTransformMean } from "../../lib/reexpress/back_transform.ts";
import { censoredBackTransformMean } from "../../lib/reexpress/censored_back_transform.ts";
import { reexpression } from "../../lib/reexpress/reexpression.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

const x = [1.2, 2.9, 0.8, 5.1, 1.7, 3.3, 0.6, 9.4, 2.2, 1.4, 4.4, 2.6];

Deno.test("nothing censored: the geometric mean, with a Wald interval from the ML sd", () => {
  const b = censoredBackTransformMean(censoredSample(x, x.map(() => 0)), reexpression("log"));
  const t = backTransformMean(x, reexpression("log"));
  assertClose(b.estimate, t.estimate, { rel: 1e-14 }, "geometric mean");
  equal(b.estimateName, "geometric mean");
  const logs = x.map(Math.log);
  const m = logs.reduce((a, v) => a + v) / x.length;
  const sdMl = Math.sqrt(logs.reduce((a, v) => a + (v - m) ** 2, 0) / x.length);
  const z = normalQuantile(0.975);
  assertClose(b.tQuantile, z, { rel: 1e-15 }, "z");
  assertClose(b.interval[1]!, Math.exp(m + z * sdMl / Math.sqrt(x.length)), { rel: 1e-12 }, "hi");
  equal(b.cautions.some((c) => /censored/.test(c)), false);
});

Deno.test("censored: the interval widens, the cautions count the censored values", () => {
  const c = x.map((v) => (v < 1.3 ? -1 : 0));
  const y = x.map((v) => (v < 1.3 ? 1.3 : v));
  const b = censoredBackTransformMean(censoredSample(y, c), reexpression("log"));
  match(b.cautions[0], /3 of 12 values are censored/);
  ok(b.estimate > 0 && b.interval[0]! < b.estimate && b.estimate < b.interval[1]!);
  const r = censoredBackTransformMean(censoredSample(y, c), reexpression("reciprocal"));
  equal(r.estimateName, "harmonic mean");
  ok(r.interval[0]! < r.estimate && r.estimate < r.interval[1]!, "ends swapped back into order");
  assertPlumbError(
    () => censoredBackTransformMean(censoredSample(y, c), reexpression("log"), { level: 2 }),
    "bad-option",
    /level 2/,
  );
});
