// Differential tests for the moments and the complementary normality tests:
// fresh seeded samples each run (seed printed in the test name; set
// PLUMBLINE_DIFF_SEED to replay), compared live with scipy.stats (skew,
// kurtosis, skewtest, kurtosistest, normaltest, jarque_bera, anderson) and
// statsmodels.stats.diagnostic (normal_ad, lilliefors with pvalmethod="approx"
// and its Dallal–Wilkinson pval_lf). Skipped, with a message, when
// /usr/bin/python3 with scipy and statsmodels is missing.
//
// Tolerances (as in the fixture tests, where each is explained): relative
// 1e−9 (absolute 1e−12 for unit-free values near zero, 1e−305 for subnormal
// p); the Anderson–Darling p is compared where statsmodels' own A²* ≤ 13,
// widened by 6·|ΔA²*| (the p change its less accurate A² explains; |d ln p/dA²*| < 6); the
// Lilliefors p where Dallal–Wilkinson gives ≤ 0.1; the kurtosis score's sign
// is flipped past the Anscombe–Glynn range (plumbline's documented convention).
import { equal, ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { moments } from "../../lib/stats/moments.ts";
import { andersonDarling } from "../../lib/stats/anderson_darling.ts";
import { lilliefors } from "../../lib/stats/lilliefors.ts";
import { dagostinoPearson } from "../../lib/stats/dagostino_pearson.ts";
import { jarqueBera } from "../../lib/stats/jarque_bera.ts";
import { assertClose } from "../_assert_close.ts";
import { PYTHON, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const rng = seededRandom(seed);
const shapes = [
  (n: number) => Array.from({ length: n }, () => 50 + 3 * rng.normal()),
  (n: number) => Array.from({ length: n }, () => -Math.log(rng.uniform())),
  (n: number) => Array.from({ length: n }, () => Math.exp(rng.normal())),
  (n: number) =>
    Array.from({ length: n }, () => rng.normal() / Math.sqrt(-2 * Math.log(rng.uniform()))),
  (n: number) => Array.from({ length: n }, () => Math.round(4 * rng.normal()) / 4),
  (n: number) => Array.from({ length: n }, () => rng.uniform()),
  (n: number) => Array.from({ length: n }, () => 1e9 + 1e-3 * rng.normal()),
];
const samples: number[][] = [];
for (const n of [8, 9, 12, 20, 35, 80, 200, 1000, 4000]) {
  for (const shape of shapes) {
    const x = shape(n);
    if (Math.min(...x) < Math.max(...x)) samples.push(x);
  }
}
const input = samples.map((x) => x.map((v) => v.toPrecision(17)).join(",")).join("\n") + "\n";

// For 1e9 + noise the reference runs on x − 1e9 (exact in binary, the statistics are
// location invariant), because numpy's centring of the raw values loses digits there.
const script = `
import sys, json, warnings
import numpy as np, scipy.stats as st
from statsmodels.stats.diagnostic import normal_ad, lilliefors
from statsmodels.stats._lilliefors import pval_lf
warnings.simplefilter("ignore")
for line in sys.stdin:
    a = np.array([float(v) for v in line.split(",")])
    n = len(a)
    if np.min(a) > 5e8:
        a = a - 1e9
    sk, ku, nt, jb = st.skewtest(a), st.kurtosistest(a), st.normaltest(a), st.jarque_bera(a)
    a2sm, pad = normal_ad(a)
    d, plf = lilliefors(a, dist="norm", pvalmethod="approx")
    print(json.dumps({
        "g1": float(st.skew(a)), "g2": float(st.kurtosis(a)),
        "G1": float(st.skew(a, bias=False)), "G2": float(st.kurtosis(a, bias=False)),
        "sd": float(np.std(a, ddof=1)),
        "zs": float(sk.statistic), "zk": float(ku.statistic), "k2": float(nt.statistic),
        "pk2": float(nt.pvalue), "jb": float(jb.statistic), "pjb": float(jb.pvalue),
        "a2": float(st.anderson(a).statistic),
        "a2sm": float(a2sm) if np.isfinite(a2sm) else None, "pad": float(pad),
        "d": float(d), "pdw": float(pval_lf(float(d), n)),
    }))
`;

const hasRefs = toolWorks(PYTHON, [
  "-c",
  "import scipy.stats, statsmodels.stats.diagnostic",
]);
Deno.test({
  name: `differential: moments, A², D, K², JB match live scipy/statsmodels (seed ${seed})`,
  ignore: skipWithout("/usr/bin/python3 with scipy and statsmodels", hasRefs),
  fn: async () => {
    const out = await runTool(PYTHON, ["-c", script], input);
    ok(out?.ok, out?.stderr);
    const rows = out!.stdout.trim().split("\n").map((l) => JSON.parse(l));
    equal(rows.length, samples.length);
    const tol = { rel: 1e-9, abs: 1e-12 };
    const pTol = { rel: 1e-9, abs: 1e-305 };
    samples.forEach((x, i) => {
      const e = rows[i];
      const ctx = `sample ${i} (n = ${x.length}, seed ${seed}) vs live scipy/statsmodels`;
      const m = moments(x);
      for (const k of ["g1", "g2", "G1", "G2", "sd"] as const) {
        assertClose(m[k], e[k], tol, `${k}, ${ctx}`);
      }
      const k2 = dagostinoPearson(x);
      const flipped = k2.warnings.some((w) => w.includes("Anscombe–Glynn"));
      assertClose(k2.kurtosisZ, flipped ? -e.zk : e.zk, tol, `kurtosis Z, ${ctx}`);
      if (e.g1 === 0) {
        // An exactly symmetric sample (e.g. nine equally spaced rounded values):
        // scipy 1.10's skewtest replaces a zero intermediate y by 1 and reports
        // Z ≈ 1.02 instead of 0, so its Z, K² and p are not a reference here;
        // D'Agostino's (1970) score of g1 = 0 is 0 and K² is the kurtosis score².
        equal(k2.skewnessZ, 0, `skewness Z of a symmetric sample, ${ctx}`);
        assertClose(k2.statistic, k2.kurtosisZ ** 2, tol, `K² = Zk², ${ctx}`);
      } else {
        assertClose(k2.skewnessZ, e.zs, tol, `skewness Z, ${ctx}`);
        assertClose(k2.statistic, e.k2, tol, `K², ${ctx}`);
        assertClose(k2.pValue, e.pk2, pTol, `K² p, ${ctx}`);
      }
      const jb = jarqueBera(x);
      assertClose(jb.statistic, e.jb, tol, `JB, ${ctx}`);
      assertClose(jb.pValue, e.pjb, pTol, `JB p, ${ctx}`);
      const ad = andersonDarling(x);
      assertClose(ad.statistic, e.a2, { rel: 1e-9 }, `A², ${ctx}`);
      const scale = ad.modified / ad.statistic;
      if (e.a2sm !== null && e.a2sm * scale <= 13) {
        const dA = Math.abs(e.a2sm - e.a2) * scale;
        const rel = 1e-9 + 6 * dA;
        assertClose(ad.pValue, e.pad, { rel }, `A-D p, ${ctx}`);
      }
      const li = lilliefors(x);
      assertClose(li.statistic, e.d, { rel: 1e-9 }, `D, ${ctx}`);
      if (e.pdw <= 0.1) assertClose(li.pValue, e.pdw, pTol, `Lilliefors p, ${ctx}`);
      else ok(li.pBound === "at-least" && li.pValue === 0.1, `Lilliefors bound, ${ctx}`);
    });
  },
});
