import { deepEqual, equal, match, ok, throws } from "node:assert/strict";
import { loadTable } from "../lib/data/load_table.ts";
import { PlumbError } from "../lib/errors.ts";
import { writeReport } from "../lib/plumb/report.ts";
import { parseArgs, USAGE } from "../tools/report.ts";

Deno.test("report CLI: arguments, repeated columns, unknown flags", () => {
  deepEqual(
    parseArgs(["data.csv", "--column", "a", "--column", "b", "--by", "g", "--out", "r.html"]),
    {
      file: "data.csv",
      columns: ["a", "b"],
      by: "g",
      out: "r.html",
      title: undefined,
      help: false,
    },
  );
  equal(parseArgs(["--help"]).help, true);
  throws(
    () => parseArgs(["x.csv", "--colour", "red"]),
    (e: unknown) => e instanceof PlumbError && e.message === "Unknown option --colour: see --help",
  );
  throws(() => parseArgs(["x.csv", "--by"]), /Option --by needs a value/);
  match(USAGE, /^Usage: deno task report <file\.csv> \[options\]/);
});

Deno.test("report: self-contained HTML (no scripts, no remote URLs), sentences, stray text counted", async () => {
  // Invented data: a skewed column with one mistyped cell, grouped by site.
  const csv = "site,delay\n" +
    Array.from(
      { length: 40 },
      (_, i) => `${i % 2 ? "north" : "south"},${i === 5 ? "n/a?" : Math.exp(i / 12).toFixed(3)}`,
    )
      .join("\n");
  const t = await loadTable(csv);
  const messages: string[] = [];
  const r = await writeReport(t, {
    by: "site",
    note: "Invented data.",
    progress: (m) => messages.push(m),
  });
  ok(r.html.startsWith("<!DOCTYPE html>"));
  ok(!/<script/i.test(r.html), "no scripts");
  ok(!/(src|href)="https?:/i.test(r.html), "no remote resources");
  ok(r.html.includes("<em>Invented data.</em>"));
  ok(r.html.includes("1 non-numeric left out"));
  deepEqual(messages, ["surveying 1 columns", "column delay"]);
  ok(r.sentences.length >= 1);
  match(r.sentences[r.sentences.length - 1], /^delay: n = 39 \(1 non-numeric cell left out\)\./);
});

Deno.test("report() from a notebook: a table gives the command line's report; chains their own", async () => {
  const { loadTable, plumb, report } = await import("../mod.ts");
  const { writeReport } = await import("../lib/plumb/report.ts");
  const csv = "g,v\n" +
    Array.from({ length: 30 }, (_, i) => `${"ab"[i % 2]},${Math.exp(i / 8).toFixed(3)}`).join("\n");
  const table = await loadTable(csv);
  const dir = await Deno.makeTempDir({ prefix: "plumbline_report_" });
  try {
    const view = report(table, { note: "Invented data." });
    const saved = await view.save(`${dir}/r.html`);
    equal(saved.format, "html");
    const html = await Deno.readTextFile(`${dir}/r.html`);
    equal(html, (await writeReport(table, { note: "Invented data." })).html);
    ok(!/<script/i.test(html) && html.includes("<h2>Survey</h2>"));
    const chains = report([plumb(table, "v"), plumb(table, "v").reexpress("log")], { by: "g" });
    await chains.save(`${dir}/c.md`);
    const md = await Deno.readTextFile(`${dir}/c.md`);
    match(md, /^\*\*Normality report: v, ln\(v\)\*\*/);
    const r = await chains.report();
    ok(r.html.includes("<h2>ln(v)</h2>") && r.html.includes("<h3>v by g</h3>"));
    equal(r.sentences.length >= 2, true);
    await view.save(`${dir}/r.json`);
    deepEqual(JSON.parse(await Deno.readTextFile(`${dir}/r.json`)), await view.data());
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
