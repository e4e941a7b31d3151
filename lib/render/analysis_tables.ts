/**
 * Table models for analysis results: the compact test table of one sample.
 * Pure: plain result objects in, {@linkcode TableModel}s out.
 *
 * @module
 */
import type { TestOutcome } from "../results/analysis.ts";
import { formatNumber, formatP } from "../results/format.ts";
import type { TableModel } from "./table.ts";

/**
 * The p column: a bound where the published approximation only gives one
 * (a bound below 0.0001 is shown as "< 0.0001", never "≤ < 0.0001").
 *
 * @example
 * ```ts
 * import { pCell } from "./analysis_tables.ts";
 * if (pCell({ pValue: 2e-190, pBound: "at-most" }) !== "< 0.0001") throw new Error("tiny bound");
 * if (pCell({ pValue: 0.1, pBound: "at-least" }) !== "≥ 0.1000") throw new Error("lower bound");
 * ```
 */
export function pCell(r: { readonly pValue: number; readonly pBound?: string }): string {
  const tiny = r.pValue < 0.0001;
  if (r.pBound === "at-least") return `≥ ${tiny ? formatNumber(r.pValue, 2) : formatP(r.pValue)}`;
  if (r.pBound === "at-most") return tiny ? formatP(r.pValue) : `≤ ${formatP(r.pValue)}`;
  return formatP(r.pValue);
}

/**
 * The test table: one row per test, run or not.
 *
 * @param tests the outcomes, in display order
 * @param caption a caption
 *
 * @example
 * ```ts
 * import { testsTable } from "./analysis_tables.ts";
 * const t = testsTable([{ test: "Lilliefors", skipped: "Too few values" }], "Tests");
 * if (t.rows[0][3] !== "not run") throw new Error("skipped row");
 * ```
 */
export function testsTable(tests: readonly TestOutcome[], caption?: string): TableModel {
  const rows = tests.map((t) => {
    if (!t.result) return [t.test, "", "", "not run", t.skipped ?? ""];
    const r = t.result as TestOutcome["result"] & { pBound?: string };
    const digits = r.statisticName.startsWith("W") ? 5 : 4;
    return [t.test, r.statisticName, formatNumber(r.statistic, digits), pCell(r), r.method];
  });
  // The same caution from several tests is listed once, with every test it applies to.
  const byText = new Map<string, string[]>();
  for (const t of tests) {
    for (const w of t.result?.warnings ?? []) {
      const list = byText.get(w) ?? [];
      list.push(t.test);
      byText.set(w, list);
    }
  }
  const notes = [...byText].map(([w, names]) => `${names.join(", ")}: ${w}.`);
  return Object.freeze({
    caption,
    columns: [
      { title: "test" },
      { title: "statistic" },
      { title: "value", align: "right" as const },
      { title: "p", align: "right" as const },
      { title: "method" },
    ],
    rows,
    notes,
  });
}
