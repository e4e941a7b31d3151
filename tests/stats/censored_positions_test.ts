import { deepEqual, equal, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { censoredPositions } from "../../lib/stats/censored_positions.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import { plottingPosition } from "../../lib/stats/plotting_positions.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

const TOL = { abs: 1e-15 };

// Worked example, computed by hand from the published formula (Hirsch &
// Stedinger 1987; multiple-limit form of Helsel & Cohn 1988), Weibull-type
// positions (a = 0).
//   values: <1, <1, 0.5, 1.5, <2, 2.5, 3, <2, 4, 1.2   (n = 10)
//   left limits L1 = 1 (C1 = 2), L2 = 2 (C2 = 2); measured 0.5 1.2 1.5 2.5 3 4
//   j = 2: A2 = #{2.5, 3, 4} = 3; B2 = #{0.5, 1.2, 1.5} + 4 censored = 7
//          pe2 = 0 + 3/10·(1 − 0) = 0.3                   F(2) = 0.7
//   j = 1: A1 = #{1.2, 1.5} = 2; B1 = #{0.5} + 2 censored at 1 = 3
//          pe1 = 0.3 + 2/5·(1 − 0.3) = 0.58               F(1) = 0.42
//   measured below 1:    0.5 → 0.42·1/2 = 0.21
//   measured in [1, 2):  1.2 → 0.42 + 0.28·1/3, 1.5 → 0.42 + 0.28·2/3
//   measured from 2 up:  2.5, 3, 4 → 0.7 + 0.3·{1, 2, 3}/4
//   "<1": 0.42·{1, 2}/3;  "<2": 0.7·{1, 2}/3
Deno.test("Hirsch–Stedinger positions: hand computation of the published formula (a = 0)", () => {
  const values = [1, 1, 0.5, 1.5, 2, 2.5, 3, 2, 4, 1.2];
  const censor = [-1, -1, 0, 0, -1, 0, 0, -1, 0, 0];
  const p = censoredPositions(censoredSample(values, censor), { offset: 0 });
  const expected = [
    0.42 * 1 / 3,
    0.42 * 2 / 3,
    0.21,
    0.42 + 0.28 * 2 / 3,
    0.7 * 1 / 3,
    0.7 + 0.3 * 1 / 4,
    0.7 + 0.3 * 2 / 4,
    0.7 * 2 / 3,
    0.7 + 0.3 * 3 / 4,
    0.42 + 0.28 * 1 / 3,
  ];
  expected.forEach((e, i) => assertClose(p.positions[i], e, TOL, `position ${i} (${values[i]})`));
  equal(p.limits.length, 2);
  assertClose(p.limits[0].below, 0.42, TOL, "F(1)");
  assertClose(p.limits[1].below, 0.7, TOL, "F(2)");
  deepEqual(p.limits.map((l) => [l.limit, l.side, l.count]), [[1, -1, 2], [2, -1, 2]]);
});

// Both sides, by hand (a = 0): values <1, 0.5, 2, 3, 4, >5, 6, >5, 1.5 (n = 9).
//   Left pass (">5" counted above L = 1): A = #{1.5, 2, 3, 4, 6} + 2 = 7, B = #{0.5} + 1 = 2
//     pe = 7/9, F(1) = 2/9.
//   Mirrored pass for R = 5 ("<1" counted below 5): values above 5: A' = #{6} + 2 = 3,
//     B' = #{0.5, 1.5, 2, 3, 4} + 1 = 6; P(X > 5) = 3/9, F(5) = 6/9.
//   0.5 → (2/9)·1/2; middle [1, 5]: 1.5 2 3 4 → 2/9 + (4/9)·r/5; above 5: 6 → 6/9 + (3/9)·1/2
//   "<1" → (2/9)·1/2; ">5" → 1 − (3/9)·{1, 2}/3
Deno.test("both sides: a detection floor and an upper limit, by hand (a = 0)", () => {
  const values = [1, 0.5, 2, 3, 4, 5, 6, 5, 1.5];
  const censor = [-1, 0, 0, 0, 0, 1, 0, 1, 0];
  const p = censoredPositions(censoredSample(values, censor), { offset: 0 });
  const expected = [
    (2 / 9) / 2,
    (2 / 9) / 2,
    2 / 9 + (4 / 9) * 2 / 5,
    2 / 9 + (4 / 9) * 3 / 5,
    2 / 9 + (4 / 9) * 4 / 5,
    1 - (3 / 9) * 1 / 3,
    6 / 9 + (3 / 9) / 2,
    1 - (3 / 9) * 2 / 3,
    2 / 9 + (4 / 9) * 1 / 5,
  ];
  expected.forEach((e, i) => assertClose(p.positions[i], e, TOL, `position ${i} (${values[i]})`));
  assertClose(p.limits[1].below, 6 / 9, TOL, "F(5)");
});

Deno.test("nothing censored: exactly Blom's positions (default offset 3/8)", () => {
  const x = [5.1, 3.2, 4.4, 6.0, 2.9, 4.8, 5.5];
  const p = censoredPositions(censoredSample(x, x.map(() => 0)));
  const rank = x.map((v) => x.filter((w) => w < v).length + 1);
  x.forEach((_, i) =>
    assertClose(p.positions[i], plottingPosition(rank[i], x.length), TOL, `Blom ${i}`)
  );
});

Deno.test("one limit, left-censored: the measured values take ranks k+1 … n of a full sample", () => {
  // With a single limit below every measured value, F(L) = k/n and the measured
  // values' positions are k/n + (1 − k/n)(r − a)/(n − k + 1 − 2a).
  const x = [0.2, 0.2, 0.2, 0.7, 0.9, 1.3, 1.1, 2.0];
  const c = [-1, -1, -1, 0, 0, 0, 0, 0];
  const p = censoredPositions(censoredSample(x, c));
  const a = 0.375;
  [0.7, 0.9, 1.1, 1.3, 2.0].forEach((v, r) => {
    const i = x.indexOf(v);
    assertClose(p.positions[i], 3 / 8 + (5 / 8) * (r + 1 - a) / (5 + 1 - 2 * a), TOL, `${v}`);
  });
});

Deno.test("right censoring by mirroring: positions(−x, flipped) = 1 − positions(x)", () => {
  const rng = seededRandom(41);
  for (let t = 0; t < 200; t++) {
    const n = 6 + rng.integer(40);
    const limits = [-0.5, 0, 0.4];
    const x: number[] = [];
    const c: number[] = [];
    for (let i = 0; i < n; i++) {
      const v = rng.normal();
      const l = limits[rng.integer(3)];
      if (v < l && x.length >= 3) {
        x.push(l);
        c.push(-1);
      } else {
        x.push(v);
        c.push(0);
      }
    }
    const p = censoredPositions(censoredSample(x, c));
    const q = censoredPositions(censoredSample(x.map((v) => -v), c.map((s) => -s)));
    for (let i = 0; i < n; i++) {
      assertClose(q.positions[i], 1 - p.positions[i], { abs: 1e-14 }, `case ${t}, value ${i}`);
    }
  }
});

Deno.test("properties: in (0, 1); measured values keep their order; censored below their limit's F", () => {
  const rng = seededRandom(7);
  for (let t = 0; t < 300; t++) {
    const n = 5 + rng.integer(60);
    const x: number[] = [];
    const c: number[] = [];
    for (let i = 0; i < n; i++) {
      const v = Math.round(10 * rng.normal()) / 10; // ties included
      const l = [-1, -0.3, 0.2][rng.integer(3)];
      if (v < l && i % 3 !== 0) {
        x.push(l);
        c.push(-1);
      } else if (v > 1.5 && i % 3 !== 0) {
        x.push(1.5);
        c.push(1);
      } else {
        x.push(v);
        c.push(0);
      }
    }
    let s;
    try {
      s = censoredSample(x, c);
    } catch {
      continue;
    }
    const p = censoredPositions(s);
    const below = new Map(p.limits.map((l) => [`${l.side}:${l.limit}`, l.below]));
    for (let i = 0; i < n; i++) {
      ok(p.positions[i] > 0 && p.positions[i] < 1, `case ${t}: ${p.positions[i]}`);
      if (c[i] < 0) ok(p.positions[i] < below.get(`-1:${x[i]}`)!);
      if (c[i] > 0) ok(p.positions[i] > below.get(`1:${x[i]}`)!);
      for (let j = 0; j < n; j++) {
        if (c[i] === 0 && c[j] === 0 && x[i] < x[j]) ok(p.positions[i] < p.positions[j]);
      }
    }
  }
});

Deno.test("errors: overlapping left and right limits, bad offset", () => {
  const s = censoredSample([3, 1, 2, 2.5, 4, 0.5], [-1, 1, 0, 0, 0, 0]);
  assertPlumbError(
    () => censoredPositions(s),
    "overlapping-limits",
    /"<3" limit lies above a ">1"/,
  );
  const t = censoredSample([1, 2, 3, 4], [-1, 0, 0, 0]);
  assertPlumbError(() => censoredPositions(t, { offset: 1 }), "bad-option", /offset 1/);
});
