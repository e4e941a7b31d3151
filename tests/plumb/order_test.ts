// plumb(table, y, { order }): serial dependence in a named order. The
// decision's size and power come from tools/sim/serial_dependence.ts (README);
// here a small seeded check through the chain (200 series each, fast), the
// ordering itself, the residual basis, the plot, the words and the errors.
import assert from "node:assert/strict";
import { loadTable, plumb, seededRandom, serialDependence } from "../../mod.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import { assertPlumbError } from "../_shared.ts";

function ar1(n: number, phi: number, seed: number): number[] {
  const rng = seededRandom(seed);
  let prev = rng.normal() / Math.sqrt(1 - phi * phi);
  return Array.from({ length: n }, () => (prev = phi * prev + rng.normal()));
}

/** The series stored in a shuffled row order, with its time in a column. */
function shuffledTable(x: number[], seed: number) {
  const rng = seededRandom(seed);
  const idx = x.map((_, i) => i);
  for (let i = idx.length - 1; i > 0; i--) {
    const j = Math.floor(rng.uniform() * (i + 1));
    [idx[i], idx[j]] = [idx[j], idx[i]];
  }
  return { t: idx.map((i) => i + 1), y: idx.map((i) => x[i]) };
}

Deno.test("the order column, not the file order, decides: same result as the series in time order", () => {
  const x = ar1(200, 0.7, 11);
  const p = plumb(shuffledTable(x, 5), "y", { order: "t" });
  const s = p.analysis().serial!;
  const direct = serialDependence(x);
  assert.equal(s.result.lagOne.r1, direct.lagOne.r1);
  assert.equal(s.result.runs.runs, direct.runs.runs);
  assert.equal(s.result.shows, true);
  assert.equal(s.order, "t");
  assert.match(
    p.reading().points[0],
    /^Serial dependence shows in t order: lag-1 autocorrelation r₁ = 0\.\d+/,
  );
  assert.match(p.sentence().text, /Every normality p-value here assumes independent observations/);
  // no order named: nothing about serial dependence, and file order is not assumed
  assert.equal(plumb(shuffledTable(x, 5), "y").analysis().serial, undefined);
});

Deno.test("AR(1) φ = 0.7 at n = 200 found, independent data not over-reported (200 seeded series each)", () => {
  let found = 0, false_alarms = 0;
  for (let k = 0; k < 200; k++) {
    if (
      plumb({ y: ar1(200, 0.7, 1000 + k) }, "y", { fileOrder: true }).analysis().serial!.result
        .shows
    ) found++;
    if (
      plumb({ y: ar1(50, 0, 5000 + k) }, "y", { fileOrder: true }).analysis().serial!.result.shows
    ) false_alarms++;
  }
  assert.ok(found >= 190, `AR(1) flagged ${found} of 200`);
  // nominal 5%; 200 series: 5% ± 3 standard errors is at most 9.6%
  assert.ok(false_alarms <= 19, `independent data flagged ${false_alarms} of 200`);
});

Deno.test("residuals in time order: the fit's basis allows for the correlation fitting induces", async () => {
  const log = await loadTable(new URL("../../demo/filling_log.csv", import.meta.url).pathname);
  const r = plumb(log, "fill_ml", { order: "checked_at" }).residuals({
    factors: ["line", "shift"],
    covariates: ["filler_temp_c"],
  });
  const s = r.analysis().serial!;
  assert.equal(s.kind, "date-times");
  assert.match(s.result.lagOne.method, /for the residuals of the fit/);
  assert.equal(s.result.n, r.values().length);
  const card = await r[DISPLAY]();
  assert.match(card["text/html"]!, /in checked_at order/);
  const spec = JSON.stringify(r.sequence().spec);
  assert.match(spec, /position in checked_at order/);
});

Deno.test("a long series is plotted as 500 slices; the spec stays bounded", () => {
  const p = plumb({ y: ar1(20000, 0.2, 3) }, "y", { fileOrder: true });
  const pts = p.analysis().serial!.points;
  assert.equal(pts.position.length, 500);
  assert.ok(pts.low.every((v, i) => v <= pts.value[i] && pts.value[i] <= pts.high[i]));
  assert.ok(JSON.stringify(p.sequence().spec).length < 150_000);
});

Deno.test("order errors name the column and what to do", () => {
  const data = { t: [1, 2, 3, 4, 5, 6], y: [3, 1, 4, 1, 5, 9] };
  assertPlumbError(
    () => plumb(data, "y", { order: "time" }),
    "unknown-column",
    /"time" to order the rows by/,
  );
  assertPlumbError(
    () => plumb(data, "y", { order: "t", fileOrder: true }),
    "bad-option",
    /not both/,
  );
  assertPlumbError(
    () => plumb(data, "y").sequence(),
    "bad-option",
    /no order was named, and file order is not assumed to be time order/,
  );
  assertPlumbError(
    () =>
      plumb({ t: ["mon", "tue", "wed", "thu"], y: [1, 2, 4, 3] }, "y", { order: "t" }).analysis(),
    "non-numeric",
    /ISO 8601/,
  );
});

Deno.test(".by(line) with an order checks each line in time order: the drifting line stands out", async () => {
  const log = await loadTable(new URL("../../demo/filling_log.csv", import.meta.url).pathname);
  const g = plumb(log, "fill_ml", { order: "checked_at" }).by("line");
  const r = g.result();
  assert.equal(r.order, "checked_at");
  const c = r.groups.find((x) => x.group === "C")!.analysis!.serial!;
  assert.equal(c.result.shows, true);
  assert.ok(c.result.lagOne.r1 > 0.3, `line C r₁ ${c.result.lagOne.r1}`);
  const t = g.table();
  assert.ok(t.columns.some((col) => col.title === "in checked_at order"));
  assert.ok(
    t.notes!.some((n) => n.startsWith("In checked_at order: serial dependence of each group")),
  );
});
