import assert from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { CENSORED_STATES } from "../../lib/render/_qq_censored.ts";
import { detrendedSpec, POINT_STATES, qqSpec } from "../../lib/render/qq_spec.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredQqData } from "../../lib/stats/censored_qq.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { qqData } from "../../lib/stats/qq_data.ts";

function chlorine() {
  const rng = seededRandom(31);
  const x = Array.from({ length: 60 }, () => 0.12 + 0.05 * rng.normal());
  const s = censoredSample(x.map((v) => Math.max(v, 0.08)), x.map((v) => (v < 0.08 ? -1 : 0)));
  return { s, q: censoredQqData(s, censoredNormalFit(s)) };
}

Deno.test("censored QQ spec: censored points get their own state, colour and shape; titles say so", () => {
  const { s, q } = chlorine();
  for (const spec of [qqSpec(q, { name: "chlorine" }), detrendedSpec(q, { name: "chlorine" })]) {
    const json = JSON.stringify(spec);
    // deno-lint-ignore no-explicit-any
    const records = (spec as any).data.values as Record<string, number>[];
    assert.equal(records.filter((r) => r.cen === -1).length, s.left);
    assert.equal(records.filter((r) => r.cen === 1).length, 0);
    assert.ok(json.includes(CENSORED_STATES[0]), "the below-a-limit state is in the legend");
    assert.ok(!json.includes(CENSORED_STATES[1]), "no legend entry for a side that is absent");
    // deno-lint-ignore no-explicit-any
    const subtitle = (spec as any).title.subtitle as string[];
    assert.equal(subtitle.at(-1), `grey: ${s.left} censored, drawn at their limits · line: ML fit`);
    assert.match(
      // deno-lint-ignore no-explicit-any
      (spec as any).description,
      new RegExp(`${s.left} are values reported below a limit and 0 above one`),
    );
  }
});

Deno.test("an uncensored QQ spec is unchanged: no censored field or state", () => {
  const spec = qqSpec(qqData([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6]), { name: "fill" });
  const json = JSON.stringify(spec);
  assert.ok(!json.includes('"cen"') && !json.includes(CENSORED_STATES[0]));
  assert.ok(json.includes(POINT_STATES[0]));
});
