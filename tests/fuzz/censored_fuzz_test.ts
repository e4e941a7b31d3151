/**
 * Censored-data fuzz: extreme samples (subnormals, ±1e308, values a few bits
 * apart, ties) censored at one to three limits on either or both sides, at
 * the size boundaries, through every censored method. Each call returns
 * finite, in-range fields or throws a `PlumbError` with an expected code.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import {
  censoredBoxCoxFit,
  censoredYeoJohnsonFit,
} from "../../lib/reexpress/censored_lambda_fit.ts";
import { censoredNormalFit } from "../../lib/stats/censored_fit.ts";
import { censoredShapiroFrancia } from "../../lib/stats/censored_normality.ts";
import { censoredPositions } from "../../lib/stats/censored_positions.ts";
import { censoredRos } from "../../lib/stats/censored_ros.ts";
import { censoredSample } from "../../lib/stats/censored_sample.ts";
import {
  assertAllFinite,
  CaseCounter,
  extremeSample,
  outcome,
  prng,
  runs,
  SAMPLE_KINDS,
} from "./_fuzz.ts";

const SIZES = [3, 4, 5, 6, 9, 10, 20, 100, 5000, 5001] as const;

/** Censor a sample at 1–3 limits taken from its own values, on the left, right or both sides. */
function censor(x: number[], seed: number): { v: number[]; c: number[] } {
  const r = prng(seed);
  const sorted = x.slice().sort((a, b) => a - b);
  const q = (p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
  const lows = Array.from({ length: 1 + Math.floor(r() * 3) }, () => q(0.6 * r()));
  const high = q(0.7 + 0.3 * r());
  const side = Math.floor(r() * 3);
  const v: number[] = [];
  const c: number[] = [];
  for (const t of x) {
    const lo = lows[Math.floor(r() * lows.length)];
    if (side !== 1 && t < lo) {
      v.push(lo);
      c.push(-1);
    } else if (side !== 0 && t > high) {
      v.push(high);
      c.push(1);
    } else {
      v.push(t);
      c.push(0);
    }
  }
  return { v, c };
}

Deno.test("censored fuzz: every method returns finite results or a PlumbError with a code", () => {
  const counter = new CaseCounter("censored methods");
  fc.assert(
    fc.property(
      fc.constantFrom(...SAMPLE_KINDS),
      fc.constantFrom(...SIZES),
      fc.integer({ min: 0, max: 2 ** 30 }),
      (kind, n, seed) => {
        const { v, c } = censor(extremeSample(kind, n, seed), seed + 1);
        const what = `${kind}, n = ${n}, seed ${seed}`;
        const s = outcome(() => censoredSample(v, c), ["too-few", "constant"], `sample ${what}`);
        if (!s.ok) return;
        counter.add();
        const fit = outcome(
          () => censoredNormalFit(s.value),
          ["no-convergence", "non-finite"],
          `fit ${what}`,
        );
        if (fit.ok) {
          assertAllFinite(fit.value, `fit ${what}`);
          assert.ok(fit.value.sd > 0, `sd > 0, ${what}`);
        }
        const pos = outcome(() => censoredPositions(s.value), ["overlapping-limits"], what);
        if (pos.ok) {
          assertAllFinite(pos.value, `positions ${what}`);
          for (const p of pos.value.positions) assert.ok(p > 0 && p < 1, `position ${p}, ${what}`);
        }
        const ros = outcome(
          () => censoredRos(s.value),
          ["overlapping-limits", "non-finite"],
          `ROS ${what}`,
        );
        if (ros.ok) assertAllFinite(ros.value, `ROS ${what}`);
        const test = outcome(
          () => censoredShapiroFrancia(s.value),
          ["too-few", "too-many", "overlapping-limits"],
          `test ${what}`,
        );
        if (test.ok) {
          assertAllFinite(test.value, `test ${what}`);
          const w = test.value.statistic;
          assert.ok(w >= 0 && w <= 1 && test.value.pValue >= 0 && test.value.pValue <= 1, what);
        }
        if (n <= 100) {
          for (const f of [censoredBoxCoxFit, censoredYeoJohnsonFit]) {
            const l = outcome(
              () => f(s.value),
              ["non-positive", "no-convergence"],
              `${f.name} ${what}`,
            );
            if (l.ok) {
              assertAllFinite(
                { ...l.value, ci: l.value.ci.map((e) => e ?? 0), median: l.value.median ?? 0 },
                `λ ${what}`,
              );
            }
          }
        }
      },
    ),
    { numRuns: runs(300), seed: 20261204 },
  );
  counter.report();
});
