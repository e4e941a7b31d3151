// `.stakes()` on the chain: the contract's JSON shape, the normal-theory
// figures by their formulas (computed here independently), the order-statistic
// coverage from the binomial distribution, a deterministic bootstrap, the
// re-expression the chain chose, options refused clearly, display and save.
import { deepEqual, equal, match, ok, rejects, throws } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { normalCdf, normalQuantile } from "../../lib/numeric/normal.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { studentTUpper } from "../../lib/numeric/student_t.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { DISPLAY, type MimeBundle } from "../../lib/results/display.ts";

const rng = seededRandom(20261202);
// Invented: fill volumes (mL) near 500, and dissolved oxygen (µg/L), right-skewed.
const fill = Array.from({ length: 150 }, () => 500.4 + 0.9 * rng.normal());
const oxygen = Array.from({ length: 200 }, () => Math.exp(2.5 + 0.8 * rng.normal()));

function meanSd(x: readonly number[]): [number, number] {
  const m = x.reduce((a, b) => a + b, 0) / x.length;
  const ss = x.reduce((a, b) => a + (b - m) ** 2, 0);
  return [m, Math.sqrt(ss / (x.length - 1))];
}

function near(a: number, b: number, rel: number, what: string): void {
  ok(Math.abs(a - b) <= rel * Math.abs(b), `${what}: ${a} vs ${b}`);
}

/** P(r ≤ B ≤ s − 1) for B ~ Binomial(n, p): the coverage of [x(r), x(s)] for the p-quantile. */
function binomialCoverage(n: number, p: number, r: number, s: number): number {
  let logC = 0; // log C(n, k), built up term by term
  let sum = 0;
  for (let k = 0; k <= n; k++) {
    if (k > 0) logC += Math.log(n - k + 1) - Math.log(k);
    if (k >= r && k <= s - 1) sum += Math.exp(logC + k * Math.log(p) + (n - k) * Math.log1p(-p));
  }
  return sum;
}

Deno.test("stakes on the chain: the contract's shape and the normal-theory formulas", () => {
  const json = plumb(fill, "fill_ml").stakes({ coverage: 0.95, lower: 498, upper: 503 })
    .toJSON() as Record<string, Record<string, unknown>>;
  for (const key of ["range", "outside", "capability", "mean"]) ok(key in json, key);
  const [m, sd] = meanSd(fill);
  const z = normalQuantile(0.975);
  const normal = json.range.normal as number[];
  near(normal[0], m - z * sd, 1e-13, "normal lower");
  near(normal[1], m + z * sd, 1e-13, "normal upper");
  equal((json.range.ranks as number[]).length, 2);
  equal((json.range.ranksCi as number[][]).length, 2);
  const fractionOut = normalCdf((498 - m) / sd) + normalCdf(-(503 - m) / sd);
  near(json.outside.normal as number, fractionOut, 1e-12, "normal fraction outside");
  const k = fill.filter((v) => v < 498 || v > 503).length;
  equal(json.outside.observed, k / fill.length);
  equal((json.outside.observedCi as number[]).length, 2);
  const cpk = Math.min(m - 498, 503 - m) / (3 * sd);
  near(json.capability.cpk as number, cpk, 1e-13, "Cpk");
  const [c0, c1] = json.capability.cpkCi as number[];
  ok(c0 < cpk && cpk < c1);
  const t = studentTUpper(0.025, fill.length - 1);
  const half = t * sd / Math.sqrt(fill.length);
  const tInt = json.mean.t as number[];
  near(tInt[0], m - half, 1e-13, "t lower");
  near(tInt[1], m + half, 1e-13, "t upper");
  const boot = json.mean.bootstrap as number[];
  ok(boot[0] < m && m < boot[1]);
});

Deno.test("stakes on the chain: the rank limits' intervals cover at least 90% (binomial sums)", () => {
  const s = plumb(fill, "fill_ml").stakes().result();
  const r = s.range;
  const n = fill.length;
  [0.025, 0.975].forEach((p, j) => {
    const [lo, hi] = r.ranksCiRanks[j];
    const coverage = binomialCoverage(n, p, lo, hi);
    ok(coverage >= 0.9, `side ${j}: coverage ${coverage}`);
    near(r.ranksCiCoverage[j], coverage, 1e-9, `reported coverage, side ${j}`);
  });
});

Deno.test("stakes on the chain: the bootstrap is deterministic, and the view is cached", () => {
  const a = plumb(oxygen, "oxygen").stakes({ upper: 60 }).toJSON();
  const b = plumb(oxygen, "oxygen").stakes({ upper: 60 }).toJSON();
  deepEqual(a.mean, b.mean);
  const p = plumb(oxygen, "oxygen");
  equal(p.stakes(), p.stakes());
  const seeded = p.stakes({ seed: 7 }).result().mean.bootstrap;
  ok(seeded[0] !== p.stakes().result().mean.bootstrap[0], "another seed, other resamples");
});

Deno.test("stakes on lognormal data: the log-scale range, the normal lower limit flagged below 0", () => {
  const logs = oxygen.map(Math.log);
  const [m, sd] = meanSd(logs);
  const z = normalQuantile(0.975);
  const want = [Math.exp(m - z * sd), Math.exp(m + z * sd)];
  const logged = plumb(oxygen, "oxygen").reexpress("log").stakes().result();
  equal(logged.reexpression?.kind, "log");
  near(logged.range.reexpressed![0]!, want[0], 1e-12, "ln lower");
  near(logged.range.reexpressed![1]!, want[1], 1e-12, "ln upper");
  // The chain's own choice (no .reexpress()): the ranked candidates' first.
  const chosen = plumb(oxygen, "oxygen").stakes().result();
  ok(chosen.reexpression !== null, chosen.reexpressionNote);
  near(chosen.range.reexpressed![0]!, want[0], 0.1, "chosen lower");
  near(chosen.range.reexpressed![1]!, want[1], 0.1, "chosen upper");
  ok(chosen.range.normal[0] < 0);
  ok(chosen.range.flags.some((f) => f.code === "below-zero" && f.side === "lower"));
  // Everything in original units: the rank limits are the data's, not the logs'.
  ok(logged.range.ranks[0] > 0 && logged.range.ranks[1] > 10);
  // "none" leaves the re-expressed figures out of the JSON.
  const none = plumb(oxygen, "oxygen").stakes({ reexpression: "none" }).toJSON();
  ok(!("reexpressed" in (none.range as object)));
});

Deno.test("stakes on the chain: options are checked, with the nearest name", () => {
  throws(
    () => plumb(fill, "fill_ml").stakes({ uper: 503 } as never),
    (e) =>
      e instanceof PlumbError && e.code === "bad-option" && /did you mean "upper"/.test(e.message),
  );
  throws(
    () => plumb(oxygen, "oxygen").reexpress("log").stakes({ reexpression: "none" }),
    (e) => e instanceof PlumbError && e.code === "bad-option" && /chain's own/.test(e.message),
  );
  const twice = plumb(oxygen, "oxygen").reexpress("sqrt").reexpress("log").stakes();
  throws(
    () => twice.result(),
    (e) =>
      e instanceof PlumbError && e.code === "bad-option" && /one \.reexpress\(\)/.test(e.message),
  );
  throws(
    () => plumb(fill, "fill_ml").stakes({ coverage: 95 }).result(),
    (e) => e instanceof PlumbError && e.code === "bad-option" && /between 0 and 1/.test(e.message),
  );
});

Deno.test("stakes on the chain: nothing is read until the view is", async () => {
  const table = await loadTable("fill\n500.1\n499.8\nabc\n500.3\n");
  const view = plumb(table, "fill").stakes(); // the text cell is not met yet
  throws(() => view.toJSON(), (e) => e instanceof PlumbError && e.code === "non-numeric");
});

Deno.test("stakes on the chain: displays as chart, table and paragraph with the caution", async () => {
  const view = plumb(oxygen, "oxygen (µg/L)").stakes({ upper: 60 });
  const b: MimeBundle = await view[DISPLAY]();
  match(b["text/html"]!, /<svg|<img/);
  match(b["text/html"]!, /<table/);
  match(b["text/markdown"]!, /\| central 95% range \|/);
  match(b["text/plain"], /organisation's procedures/);
  ok(view.sentence().text.startsWith("oxygen (µg/L) (n = 200): assuming a normal distribution"));
  equal(await view[DISPLAY](), b, "the bundle is made once");
});

Deno.test("stakes on the chain: saves as every format the view has, and refuses others", async () => {
  const view = plumb(fill, "fill_ml").stakes({ lower: 498, upper: 503 });
  const dir = await Deno.makeTempDir();
  try {
    const json = JSON.parse(await Deno.readTextFile((await view.save(`${dir}/s.json`)).path));
    deepEqual(json, JSON.parse(JSON.stringify(view.toJSON())));
    const csv = await Deno.readTextFile((await view.save(`${dir}/s.csv`)).path);
    match(csv, /^quantity,way,value,lower,upper,verdict\ncentral range,normal,,/);
    match(csv, /\nCpk,normal,[0-9.]+,[0-9.]+,[0-9.]+,/);
    match(await Deno.readTextFile(`${dir}/s.csv`), /\nmean,bootstrap BCa,/);
    const svg = await Deno.readTextFile((await view.save(`${dir}/s.svg`)).path);
    ok(svg.startsWith("<svg") && svg.includes("<title"));
    const png = await Deno.readFile((await view.save(`${dir}/s.png`)).path);
    deepEqual([...png.slice(1, 4)], [0x50, 0x4e, 0x47]);
    const html = await Deno.readTextFile((await view.save(`${dir}/s.html`)).path);
    ok(html.startsWith("<!DOCTYPE html>") && html.includes("<table"));
    match(await Deno.readTextFile((await view.save(`${dir}/s.md`)).path), /\| Cpk \|/);
    await rejects(
      view.save(`${dir}/s.xlsx`),
      (e) => e instanceof PlumbError && e.code === "unsupported-format",
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
