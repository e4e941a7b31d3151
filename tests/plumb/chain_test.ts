import { deepEqual, equal, match, notEqual, ok, throws } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { logShift } from "../../lib/reexpress/log.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { survey } from "../../lib/plumb/survey.ts";
import { DISPLAY, type MimeBundle } from "../../lib/results/display.ts";
import { SHAPES } from "./_shapes.ts";

// Invented test table: a skewed column with zeros, a near-normal one, a group column,
// one missing cell and one mistyped cell.
const csv = [
  "batch,lot,weight,gap",
  ...Array.from({ length: 40 }, (_, i) => {
    const w = (100 + 2 * Math.sin(i * 1.7) + (i % 5) * 0.3).toFixed(2);
    const g = i % 9 === 0 ? "0" : Math.exp(Math.cos(i) + i / 20).toFixed(3);
    return `${i + 1},${i % 2 ? "east" : "west"},${i === 7 ? "NA" : i === 11 ? "1O0.2" : w},${g}`;
  }),
].join("\n") + "\n";
const table = await loadTable(csv);
// The log shift the stated rule picks for "gap" (it has zeros), as the label writes it.
const shift = +logShift(table.numeric("gap").values).shift.toPrecision(4);

Deno.test("chain: methods return new frozen objects and never change the original", () => {
  const p = plumb(table, "gap");
  const q = p.reexpress("log");
  notEqual(p, q);
  ok(Object.isFrozen(p) && Object.isFrozen(q));
  equal(p.label, "gap");
  equal(q.label, `ln(gap + ${shift})`);
  equal(p.steps.length, 0);
  equal(q.steps.length, 1);
  // The original still analyses the raw values.
  equal(p.analysis().origin.transform, undefined);
  equal(q.analysis().origin.transform, `ln(gap + ${shift})`);
  throws(() => ((p as unknown as { column: string }).column = "x"), TypeError);
});

Deno.test("chain: the analysis runs once and is reused", () => {
  const p = plumb(table, "gap");
  ok(p.analysis() === p.analysis());
  ok(p.reading() === p.analysis().reading);
});

Deno.test("chain: text cells raise non-numeric naming the row and text, unless dropped and counted", () => {
  throws(() => plumb(table, "weight").analysis(), (e: unknown) => {
    ok(e instanceof PlumbError);
    equal(e.code, "non-numeric");
    match(e.message, /1O0\.2/);
    match(e.message, /row 12/);
    return true;
  });
  const a = plumb(table, "weight", { dropText: true }).analysis();
  equal(a.n, 38);
  equal(a.origin.missingDropped, 1);
  equal(a.origin.textDropped, 1);
});

Deno.test("chain: unknown columns and ambiguous sources give clear errors", () => {
  throws(
    () => plumb(table, "nope"),
    (e: unknown) =>
      e instanceof PlumbError && e.code === "unknown-column" &&
      e.message === 'No column named "nope": the table has "batch", "lot", "weight", "gap"',
  );
  throws(
    () => plumb(table),
    /has 3 numeric columns \(batch, weight, gap\): name the one to analyse/,
  );
  throws(
    () => plumb([1, 2, 3]).analysis(),
    (e: unknown) => e instanceof PlumbError && e.code === "too-few",
  );
  throws(
    () => plumb("data.csv" as never),
    /load it first with `const t = await loadTable\(path\)`/,
  );
});

Deno.test("chain: reexpress('best') carries the chosen candidate, labelled everywhere", async () => {
  const p = plumb(SHAPES.rightSkewed, "delay").reexpress("best");
  equal(p.label, "ln(delay)");
  const b = await p[DISPLAY]() as MimeBundle;
  ok(b["text/plain"].startsWith("ln(delay)\n"));
  match(p.sentence().text, /^ln\(delay\): n = 100\./);
  match(p.sentence().text, /re-expressed as ln\(delay\) before testing/);
});

Deno.test("chain: candidates() lists ranked candidates with one chosen", () => {
  const v = plumb(table, "gap").candidates();
  const md = v.toMarkdown();
  ok(md.includes(`| 1 | ln(gap + ${shift}) |`), md);
  match(v.toCSV(), /^rank,reexpression,kind,lambda,shift,departure,W,p,g1,g2,close_to_best\n1,/);
});

Deno.test("chain: .by(column) adjusts p across groups and pools residuals", () => {
  const g = plumb(table, "weight", { dropText: true }).by("lot");
  const r = g.result();
  deepEqual(r.groups.map((x) => x.group), ["east", "west"]);
  equal(r.adjust, "holm");
  const ps = r.groups.map((x) => x.analysis!.primary.pValue);
  const adj = r.groups.map((x) => x.adjustedP!);
  // Holm with two tests: the smaller p doubles, the larger is max(that, itself).
  const lo = Math.min(...ps), hi = Math.max(...ps);
  deepEqual([...adj].sort(), [Math.min(1, 2 * lo), Math.max(Math.min(1, 2 * lo), hi)].sort());
  equal(r.residuals?.n, 38);
  match(r.residuals!.origin.label, /residuals within lot/);
  match(g.toCSV(), /^group,n,mean,sd,G1,G2,W,p,adjusted_p,adjustment,verdict,note\neast,18,/);
});

Deno.test("chain: tests() exports CSV and Markdown with every test, run or not", () => {
  const t = plumb([3.1, 2.7, 3.4, 2.9, 3.8, 3.3], "v").tests();
  const csvText = t.toCSV();
  match(csvText, /^test,statistic,value,p,method\nShapiro–Wilk,W,/);
  match(csvText, /\nAnderson–Darling,,,,Cannot run the Anderson–Darling test on 6 values/);
  match(t.toMarkdown(), /\| Lilliefors \| D \|/);
});

Deno.test("survey: a 20-column table, sorted by departure, Holm-adjusted, text columns named", () => {
  const cols: Record<string, number[] | string[]> = {
    site: Array.from({ length: 60 }, (_, i) => `s${i % 3}`),
  };
  for (let j = 0; j < 20; j++) {
    cols[`m${j}`] = Array.from({ length: 60 }, (_, i) => {
      const u = (i + 0.5) / 60;
      return j % 4 === 0 ? Math.exp(3 * u) : Math.sin(7 * i + j) + u;
    });
  }
  const s = survey(cols);
  const r = s.result();
  equal(r.rows.length, 20);
  deepEqual(r.textColumns, ["site"]);
  const verdicts = r.rows.map((x) => x.analysis!.reading.verdict);
  const rank = { "clear-departure": 0, "mild-departure": 1, "no-clear-departure": 2 };
  for (let k = 1; k < verdicts.length; k++) {
    ok(rank[verdicts[k - 1]] <= rank[verdicts[k]], "sorted by departure");
  }
  for (const row of r.rows) ok(row.adjustedP! >= row.analysis!.primary.pValue);
  match(
    s.toCSV(),
    /^column,n,missing,text_dropped,mean,sd,G1,G2,W,p,adjusted_p,adjustment,verdict,suggestion,note\n/,
  );
  const b = s[DISPLAY]();
  equal(
    (b["text/html"]!.match(/<img class="unconfined" src="data:image\/svg\+xml;base64,/g) ?? [])
      .length,
    20,
    "one sparkline per row",
  );
});

Deno.test("survey: a column with text cells is listed as not screened, with the reason", () => {
  const r = survey(table).result();
  const w = r.rows.find((x) => x.column === "weight")!;
  ok(w.skipped && /1O0\.2/.test(w.skipped));
  const d = survey(table, { dropText: true }).result().rows.find((x) => x.column === "weight")!;
  equal(d.textDropped, 1);
});

Deno.test("chain: building a chain computes nothing; the first read does, once, for every step", () => {
  // A table whose column turns out to be constant: any computation would throw.
  const flat = plumb({ v: [2, 2, 2, 2, 2, 2] }, "v");
  const built = [
    flat.reexpress(),
    flat.reexpress("log"),
    flat.reexpress({ boxCox: 0.5 }).reexpress("best"),
    flat.candidates(),
    flat.lambda(),
    flat.qq(),
    flat.detrended({ level: 0.9 }),
    flat.histogram({ rule: "scott" }),
    flat.tests(),
    flat.sentence(),
    flat.by("v"),
  ];
  equal(built.length, 11, "every method returned without reading the data");
  throws(() => flat.analysis(), (e: unknown) => e instanceof PlumbError && e.code === "constant");
  throws(() => flat.reexpress().label, (e: unknown) => e instanceof PlumbError);
});

Deno.test("chain: each step's work is cached, and chains built on a step share it", () => {
  const p = plumb(SHAPES.rightSkewed, "delay");
  ok(p.candidates() === p.candidates(), "one candidates view per chain");
  ok(p.lambda() === p.lambda(), "one λ explorer per chain");
  ok(p.tests() === p.tests() && p.sentence() === p.sentence() && p.qq() === p.qq());
  const view = p.candidates().toJSON();
  ok(view === p.candidates().toJSON(), "the search runs once");
  const best = p.reexpress();
  equal(best.label, "ln(delay)");
  // "best" reads the parent's search: no second search, the same chosen candidate.
  ok(p.candidates().toJSON() === view);
  equal(best.choice!.reexpression, view.chosen.reexpression);
  equal(best.choice!.reason, view.reason);
  ok(best.analysis() === best.analysis());
  // The spec of a lazy chart is made on first read and kept.
  ok(p.lambda().spec === p.lambda().spec);
});

Deno.test("chain: reexpress() always returns a chain; 'best' may keep the data as they are", () => {
  const x = Array.from({ length: 200 }, (_, i) => 10 + Math.sin(i * 1.3) + Math.cos(i * 0.7));
  const p = plumb(x, "fill");
  const kept = p.reexpress();
  ok(kept !== p);
  deepEqual(kept.steps, []);
  equal(kept.label, "fill");
  equal(kept.choice!.reexpression, null);
  match(kept.choice!.reason, /^No re-expression (needed|applied)/);
  deepEqual(kept.values(), p.values());
  equal(p.choice, null);
  throws(
    () => p.reexpress("logarithm" as never),
    (e: unknown) => e instanceof PlumbError && e.code === "bad-option",
    "a mistyped request fails where it is written",
  );
});

Deno.test("chain: a plain array is named by the second argument", () => {
  equal(plumb([1.2, 3.4, 2.2, 5.1], "torque_nm").label, "torque_nm");
  equal(plumb(new Float64Array([1.2, 3.4, 2.2, 5.1]), "torque_nm").label, "torque_nm");
  equal(plumb([1.2, 3.4, 2.2, 5.1]).label, "value");
  equal(plumb([{ t: 1 }, { t: 2 }], "t").label, "t", "rows: the second argument is a column");
});

Deno.test("chain: .by() honours the chain's qq option and counts each group's missing and text cells", () => {
  const g = plumb(table, "weight", { dropText: true, qq: { level: 0.9 } }).by("lot");
  const r = g.result();
  for (const row of r.groups) {
    equal(row.analysis!.qq.level, 0.9, `${row.group}: QQ envelope level`);
  }
  equal(r.residuals!.qq.level, 0.9);
  // Row 8 (NA) and row 12 (text) both have i odd, so both are in lot "east".
  const west = r.groups.find((x) => x.group === "west")!;
  const east = r.groups.find((x) => x.group === "east")!;
  deepEqual([east.missingDropped, east.textDropped], [1, 1]);
  deepEqual([west.missingDropped, west.textDropped], [0, 0]);
  deepEqual([east.analysis!.origin.missingDropped, east.analysis!.origin.textDropped], [1, 1]);
  equal(west.n + east.n, 38);
});
