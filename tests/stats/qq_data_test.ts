import assert from "node:assert/strict";
import { assertClose } from "../_assert_close.ts";
import { PlumbError } from "../../lib/errors.ts";
import { normalEnvelope } from "../../lib/stats/envelope.ts";
import { normalScores } from "../../lib/stats/plotting_positions.ts";
import { qqData } from "../../lib/stats/qq_data.ts";
import { normalSample } from "../_shared.ts";

const normals = normalSample;

Deno.test("qqData orders the values, keeps their rows and fits mean and sd", () => {
  const x = [4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6];
  const q = qqData(x);
  assert.deepEqual(q.value, [3.7, 3.9, 4.0, 4.1, 4.2, 4.4, 4.6]);
  assert.deepEqual(q.row, [5, 1, 3, 0, 4, 2, 6]);
  assert.deepEqual(q.rank, [1, 2, 3, 4, 5, 6, 7]);
  // exact rational arithmetic (Python fractions): mean 289/70, Σ(x − mean)² = 97/175;
  // tolerance 1e-14 relative for the rounding of the decimal inputs
  assertClose(q.mean, 289 / 70, { rel: 1e-14 }, "mean");
  assertClose(q.sd, Math.sqrt(97 / 175 / 6), { rel: 1e-14 }, "sd");
  assert.deepEqual(q.z, Array.from(normalScores(7)));
  const env = normalEnvelope(7);
  q.rank.forEach((_, k) => {
    assertClose(q.lower[k], q.mean + q.sd * env.lower[k], { rel: 1e-15 }, `lower ${k}`);
    assertClose(q.upper[k], q.mean + q.sd * env.upper[k], { rel: 1e-15 }, `upper ${k}`);
  });
  assert.equal(q.shown, 7);
  assert.equal(q.positions, "Blom's plotting positions (i − 3/8)/(n + 1/4)");
  assert.ok(Object.isFrozen(q) && Object.isFrozen(q.value));
  assert.equal(JSON.parse(JSON.stringify(q)).n, 7);
});

Deno.test("tied values get rows in their original order, and given row labels are used", () => {
  const q = qqData([2, 1, 2, 2, 0], { rows: [10, 11, 12, 13, 14] });
  assert.deepEqual(q.value, [0, 1, 2, 2, 2]);
  assert.deepEqual(q.row, [14, 11, 10, 12, 13]);
});

Deno.test("points outside the envelope are flagged and counted", () => {
  const x = Array.from(normals(200, 11));
  x[0] = 40; // far above any plausible largest value
  const q = qqData(x);
  const last = q.shown - 1;
  assert.equal(q.value[last], 40);
  assert.equal(q.outside[last], 1);
  const count = q.outside.filter((o) => o !== 0).length;
  assert.equal(q.outsideCount, count);
  q.value.forEach((v, k) => {
    const expected = v < q.lower[k] ? -1 : v > q.upper[k] ? 1 : 0;
    assert.equal(q.outside[k], expected, `point ${k}`);
  });
});

Deno.test("large samples keep both tails in full and thin the middle evenly", () => {
  const n = 100000;
  const x = normals(n, 5);
  const q = qqData(x);
  assert.equal(q.shown, 800);
  for (let k = 0; k < 200; k++) {
    assert.equal(q.rank[k], k + 1);
    assert.equal(q.rank[q.shown - 1 - k], n - k);
  }
  const gaps = new Set<number>();
  for (let k = 201; k < 600; k++) gaps.add(q.rank[k] - q.rank[k - 1]);
  assert.ok(Math.max(...gaps) - Math.min(...gaps) <= 1, `middle gaps ${[...gaps]}`);
  for (let k = 0; k < q.shown; k++) assert.equal(x[q.row[k]], q.value[k], `row of point ${k}`);
  const sorted = x.slice().sort();
  for (let k = 0; k < q.shown; k++) assert.equal(q.value[k], sorted[q.rank[k] - 1]);
  assert.equal(
    q.thinning,
    "800 of 100000 values shown: the 200 smallest and largest in full, the middle at evenly spaced ranks",
  );
});

Deno.test("qqData rejects unusable input with PlumbError", () => {
  assert.throws(() => qqData([1, 2]), (e) => e instanceof PlumbError && e.code === "too-few");
  assert.throws(
    () => qqData([1, NaN, 3]),
    (e) => e instanceof PlumbError && e.code === "non-finite",
  );
  assert.throws(() => qqData([2, 2, 2]), (e) => e instanceof PlumbError && e.code === "constant");
  assert.throws(() => qqData([1, 2, 3], { rows: [1] }), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(e.message, "Cannot label 3 values with 1 row labels: pass one label per value");
    return true;
  });
  assert.throws(() => qqData([1, 2, 3], { maxPoints: 5 }), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(e.message, "Cannot use maxPoints = 5: use a whole number of at least 20");
    return true;
  });
});

Deno.test("a simultaneous envelope is wider than the pointwise one at every rank", () => {
  const x = normals(60, 3);
  const point = qqData(x);
  const joint = qqData(x, { envelope: "simultaneous" });
  assert.equal(joint.envelope, "simultaneous");
  assert.match(joint.envelopeMethod, /Aldor-Noiman et al\. 2013/);
  for (let k = 0; k < 60; k++) {
    assert.ok(joint.lower[k] < point.lower[k] && joint.upper[k] > point.upper[k], `rank ${k + 1}`);
  }
});
