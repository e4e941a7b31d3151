import { deepEqual, equal } from "node:assert/strict";
import {
  decideVerdict,
  READING_RULES,
  type VerdictEvidence,
} from "../../lib/plumb/reading_rules.ts";

const base: VerdictEvidence = {
  n: 50,
  p: 0.5,
  G1: 0,
  seG1: 0.33,
  G2: 0,
  seG2: 0.66,
  outliers: 0,
  cluster: false,
  coarse: false,
};
const v = (e: Partial<VerdictEvidence>) => decideVerdict({ ...base, ...e }).verdict;

Deno.test("no evidence: no clear departure, whatever an effect that does not stand out", () => {
  equal(v({}), "no-clear-departure");
  // plumb([1, 2, 3, 4, 5, 6]): p = 0.96, G2 = −1.2 within its standard error 1.74
  equal(v({ n: 6, p: 0.96, G2: -1.2, seG1: 0.85, seG2: 1.74 }), "no-clear-departure");
  // |G1| = 0.6 is "moderate" in size but within 2.576 SE at n = 50
  equal(v({ G1: 0.6 }), "no-clear-departure");
});

Deno.test("each kind of evidence counts on its own", () => {
  equal(v({ p: 0.03 }), "mild-departure");
  equal(v({ G1: 0.9 }), "mild-departure"); // stands out (0.9 > 2.576 × 0.33) but p is large
  equal(v({ outliers: 1 }), "mild-departure");
  equal(v({ cluster: true }), "clear-departure");
  equal(v({ p: 0.001, G1: 1.2 }), "clear-departure");
  equal(v({ p: 0.001, outliers: 2 }), "clear-departure");
  equal(v({ p: 0.001 }), "mild-departure"); // strong p, no large effect named
});

Deno.test("a coarse step silences Shapiro–Wilk but not the effects", () => {
  equal(v({ p: 0.0001, coarse: true }), "no-clear-departure");
  equal(v({ p: 0.0001, coarse: true, G2: -1.9 }), "clear-departure"); // −1.9 < −2.576 × 0.66
});

Deno.test("above 2,000 values effect sizes decide", () => {
  const big = { n: 1e5, seG1: 0.0077, seG2: 0.0155 };
  // p tiny, skew 0.1 stands out by 13 SE but is too small to matter
  equal(v({ ...big, p: 1e-9, G1: 0.1 }), "no-clear-departure");
  equal(v({ ...big, p: 1e-9, G1: 0.3 }), "mild-departure");
  equal(v({ ...big, p: 0.2, G2: 1.5 }), "clear-departure");
  const g = decideVerdict({ ...base, ...big, p: 1e-9, G1: 0.3 });
  deepEqual([g.effectsDecide, g.bySkew, g.byTest], [true, true, true]);
});

Deno.test("three values: only the test speaks", () => {
  equal(
    v({ n: 3, p: 0.01, G1: undefined, seG1: undefined, G2: undefined, seG2: undefined }),
    "mild-departure",
  );
  equal(
    v({ n: 3, p: 0.4, G1: undefined, seG1: undefined, G2: undefined, seG2: undefined }),
    "no-clear-departure",
  );
  equal(READING_RULES.seMultiple, 2.576);
});
