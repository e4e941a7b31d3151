import assert from "node:assert/strict";
import { normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredPositions } from "../../lib/stats/censored_positions.ts";
import { censoredQqData } from "../../lib/stats/censored_qq.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { assertPlumbError } from "../_shared.ts";

/** A seeded sample with ties, left limits and (optionally) right limits. */
function sample(n: number, seed: number, right: boolean) {
  const rng = seededRandom(seed);
  const lows = [8.5, 9, 9.5];
  const x: number[] = [];
  const c: number[] = [];
  for (let i = 0; i < n; i++) {
    const v = Math.round((10 + 2 * rng.normal()) * 10) / 10; // ties from rounding
    const low = lows[rng.integer(3)];
    if (v < low) [x[i], c[i]] = [low, -1];
    else if (right && v > 12.5) [x[i], c[i]] = [12.5, 1];
    else [x[i], c[i]] = [v, 0];
  }
  return censoredSample(x, c);
}

Deno.test("censored QQ points: in position order, each at its own data row, value and side", () => {
  for (const [n, seed, right] of [[40, 1, false], [300, 2, true], [3000, 3, true]] as const) {
    const s = sample(n, seed, right);
    const pos = censoredPositions(s).positions;
    const q = censoredQqData(s, censoredNormalFit(s));
    const sorted = Float64Array.from(pos).sort();
    assert.equal(q.shown, Math.min(n, 800));
    const rows = new Set(q.row);
    assert.equal(rows.size, q.shown, "distinct rows");
    for (let k = 0; k < q.shown; k++) {
      const i = q.row[k];
      const ctx = `n=${n} point ${k} (rank ${q.rank[k]}, row ${i})`;
      assert.equal(q.value[k], s.values[i], ctx);
      assert.equal(q.censor[k], s.censor[i], ctx);
      // The point's score is its own row's Hirsch–Stedinger position, at its rank.
      assert.ok(Math.abs(q.z[k] - normalQuantile(pos[i])) < 1e-12, ctx);
      assert.equal(pos[i], sorted[q.rank[k] - 1], ctx);
    }
    assert.equal(q.censoredShown, q.censor.filter((x) => x !== 0).length);
  }
});

Deno.test("censored QQ: bad offset and overlapping limits are refused", () => {
  const s = sample(40, 4, false);
  assertPlumbError(
    () => censoredQqData(s, censoredNormalFit(s), { offset: 1 }),
    "bad-option",
    /offset 1/,
  );
  const o = censoredSample([1, 2, 3, 4, 5, 2.5], [0, 0, 0, 0, -1, 1]);
  assertPlumbError(
    () => censoredQqData(o, censoredNormalFit(censoredSample([1, 2, 3, 4], [0, 0, 0, 0]))),
    "overlapping-limits",
    /./,
  );
});
