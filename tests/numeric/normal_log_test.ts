import { equal, ok } from "node:assert/strict";
import { normalCdf } from "../../lib/numeric/normal.ts";
import { normalHazard, normalLogCdf, normalLogSf } from "../../lib/numeric/normal_log.ts";
import { assertClose } from "../_assert_close.ts";

// Reference values: tests/fixtures/normal_log.json, written by
// tools/fixtures/normal_log.py with mpmath at 50 significant digits.
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/normal_log.json", import.meta.url)),
) as { library: Record<string, string>; rows: { z: number; logSf: number; hazard: number }[] };
const src = `mpmath ${fixture.library.mpmath}`;

// Stated tolerance: 1e-14 relative, a few ulps above the accuracy of Cody's
// tails (1e-15) after one logarithm or one division.
const REL = 1e-14;

Deno.test("normalLogSf and normalLogCdf match mpmath to 1e-14 relative on [-1e4, 1e4]", () => {
  for (const { z, logSf } of fixture.rows) {
    assertClose(normalLogSf(z), logSf, { rel: REL, abs: 1e-300 }, `normalLogSf(${z}) vs ${src}`);
    assertClose(normalLogCdf(-z), logSf, { rel: REL, abs: 1e-300 }, `normalLogCdf(${-z})`);
  }
});

Deno.test("normalHazard matches mpmath to 1e-14 relative on [-1e4, 1e4]", () => {
  for (const { z, hazard } of fixture.rows) {
    assertClose(normalHazard(z), hazard, { rel: REL, abs: 1e-300 }, `normalHazard(${z}) vs ${src}`);
  }
});

Deno.test("hazard properties: h(z) > z, h increases, h(z) − z → 0 far out", () => {
  let prev = 0;
  for (let z = -50; z <= 300; z += 0.37) {
    const h = normalHazard(z);
    ok(h > z && h >= prev, `h(${z}) = ${h}`);
    prev = h;
  }
  ok(normalHazard(1e6) - 1e6 < 1e-5);
});

Deno.test("agrees with ln of the tails where they are representable", () => {
  for (const z of [-30, -5, -1, -0.3, 0, 0.3, 1, 5, 30]) {
    assertClose(normalLogCdf(z), Math.log(normalCdf(z)), { rel: 1e-15, abs: 1e-16 }, `z = ${z}`);
  }
});

Deno.test("special cases: NaN, ±Infinity, huge |z|", () => {
  ok(Number.isNaN(normalLogSf(NaN)) && Number.isNaN(normalHazard(NaN)));
  equal(normalLogSf(-Infinity), 0);
  equal(normalLogSf(Infinity), -Infinity);
  equal(normalHazard(-Infinity), 0);
  equal(normalHazard(Infinity), Infinity);
  ok(Number.isFinite(normalLogSf(1e150)) && normalLogSf(1e150) < -1e299);
  equal(normalLogSf(1e160), -Infinity); // z²/2 overflows: the log is below −1.8e308
  equal(normalLogSf(-1e300), 0);
});
