import assert from "node:assert/strict";
import { chartBundle } from "../../lib/render/chart_bundle.ts";
import { KINDS, specsFor } from "./_samples.ts";

// The bound: no output larger than 300 KB (300·1024 bytes of UTF-8), for
// any n; checked at n = 1e6, each MIME entry and the whole bundle as JSON.
const LIMIT = 300 * 1024;
const bytes = (s: string) => new TextEncoder().encode(s).length;

Deno.test("every chart's bundle stays under 300 KB at n = 1e6", async () => {
  const specs = specsFor(1_000_000, "dissolved oxygen (mg/L)", 3);
  const sizes: string[] = [];
  for (const kind of KINDS) {
    const b = await chartBundle(specs[kind]);
    const whole = bytes(JSON.stringify(b));
    sizes.push(`${kind} ${Math.round(whole / 1024)} KB`);
    assert.ok(whole <= LIMIT, `${kind}: bundle is ${whole} bytes`);
    for (const [mime, v] of Object.entries(b)) {
      const size = bytes(typeof v === "string" ? v : JSON.stringify(v));
      assert.ok(size <= LIMIT, `${kind} ${mime}: ${size} bytes`);
    }
  }
  const qq = JSON.stringify(specs.qq);
  assert.ok(
    qq.includes("800 of 1,000,000 points shown (tails in full)"),
    "the chart says what it shows",
  );
  console.log(sizes.join(", "));
});
