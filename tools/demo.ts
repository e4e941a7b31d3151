/**
 * `deno task demo`: write the invented demo data, screen it, and write a
 * self-contained HTML report; print a short summary with the report's path.
 *
 * The data are invented: a seeded simulation of a fictional bottling
 * plant's quality lab (see tools/make_demo_data.ts). Nothing is a real
 * measurement.
 *
 * @module
 */
import { loadTable } from "../lib/data/load_table.ts";
import { writeReport } from "../lib/plumb/report.ts";
import { survey } from "../lib/plumb/survey.ts";
import { proseP } from "../lib/plumb/sentence.ts";
import { VERDICT_WORDS } from "../lib/results/reading.ts";
import { demoCsv } from "./make_demo_data.ts";

const USAGE = `Usage: deno task demo [--out FILE]

Writes the invented bottling-plant data to out/bottling_lab.csv, screens
every numeric column (and each filler line), and writes a self-contained
HTML report (default out/plumbline-demo.html).`;

if (import.meta.main) {
  const args = [...Deno.args];
  if (args.includes("--help") || args.includes("-h")) {
    console.log(USAGE);
    Deno.exit(0);
  }
  const outIdx = args.indexOf("--out");
  const out = outIdx >= 0 ? args[outIdx + 1] : "out/plumbline-demo.html";
  await Deno.mkdir("out", { recursive: true });
  const csvPath = "out/bottling_lab.csv";
  await Deno.writeTextFile(csvPath, demoCsv());
  const table = await loadTable(csvPath);
  console.log("plumbline demo — invented data from a fictional bottling plant's quality lab\n");
  for (const c of table.columns) {
    const p = c.provenance;
    const extra = p.nonNumeric && c.kind === "numeric"
      ? `; ${p.nonNumeric} non-numeric (${
        p.nonNumericCells.map((x) => `row ${x.row}: "${x.text}"`).join(", ")
      })`
      : "";
    console.log(
      `  ${c.name.padEnd(22)} ${
        c.kind.padEnd(8)
      } ${p.numbers} numbers, ${p.missing} missing${extra}`,
    );
  }
  console.log("");
  const s = survey(table, { dropText: true }).result();
  for (const r of s.rows) {
    if (!r.analysis) continue;
    const a = r.analysis;
    console.log(
      `  ${r.column.padEnd(22)} W = ${a.primary.statistic.toFixed(4)}  ${
        proseP(a.primary.pValue).padEnd(9)
      }  ` +
        `${VERDICT_WORDS[a.reading.verdict].padEnd(31)} suggested: ${r.suggestion}`,
    );
  }
  const report = await writeReport(table, {
    by: "line",
    title: "plumbline demo: a fictional bottling plant's quality lab",
    note: "The data are invented (a seeded simulation); no real measurements are shown.",
    progress: (m) => console.error(`… ${m}`),
  });
  await Deno.writeTextFile(out, report.html);
  console.log(
    `\nReport written to ${out} (${Math.round(report.html.length / 1024)} KB, static, no scripts)`,
  );
  console.log(
    "A normality check is one input to a decision taken under your own procedures and the applicable standards.",
  );
}
