// A type test: one long chain must compile, so the types never drift from the code.
import { ok } from "node:assert/strict";
import { loadTable, plumb, survey } from "../../mod.ts";

Deno.test("types: one long chain compiles and runs", async () => {
  const t = await loadTable(
    "line,v\n" +
      Array.from({ length: 30 }, (_, i) => `${i % 2 ? "a" : "b"},${Math.exp(i / 9)}`).join("\n"),
  );
  const p = plumb(t, "v").reexpress("log").reexpress({ yeoJohnson: 0.5 }).reexpress("best");
  const label: string = p.label;
  const w: number = p.analysis().primary.statistic;
  const s: string = p.sentence().text;
  const groups = p.by("line", { adjust: "bh" });
  const rows: number = groups.result().groups.length;
  const q = p.qq({ level: 0.9 });
  const h = p.histogram({ rule: "sturges" });
  const d = p.detrended();
  const csv: string = p.tests().toCSV();
  const md: string = survey(t, { adjust: "holm" }).toMarkdown();
  ok(label && w > 0 && s && rows === 2 && q.spec && h.spec && d.spec && csv && md);
});
