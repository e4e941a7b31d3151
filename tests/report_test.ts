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
