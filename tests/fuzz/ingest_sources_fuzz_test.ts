/**
 * Ingest fuzz for the file and frame sources: random columns (numbers,
 * nulls, censored and other text) written as Parquet (nodejs-polars), Arrow
 * IPC (apache-arrow) and .xlsx (exceljs), and passed as Arrow tables and
 * polars DataFrames, must load with the same cells as the same columns
 * given as plain arrays; damaged bytes of each format give a table or a
 * PlumbError, never another exception, within the time bound.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import * as arrow from "apache-arrow";
import pl from "nodejs-polars";
import ExcelJS from "exceljs";
import { loadTable } from "../../lib/data/load_table.ts";
import type { Table } from "../../lib/data/table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { CaseCounter, runs } from "./_fuzz.ts";

const numberArb = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }),
  fc.integer({ min: -1000, max: 1000 }).map((k) => k / 8),
);
const textArb = fc.oneof(
  fc.constantFrom("<0.5", "> 1000", "≤2", "NA", "", "ND", " A", "A\u00a0", "x", "12,5"),
  fc.string({ maxLength: 6 }),
);
/** A column: all numbers (with nulls), or all text (with nulls). */
const columnArb = (rows: number) =>
  fc.oneof(
    fc.array(fc.option(numberArb, { freq: 4 }), { minLength: rows, maxLength: rows }),
    fc.array(fc.option(textArb, { freq: 4 }), { minLength: rows, maxLength: rows }),
  );
const tableArb = fc.integer({ min: 1, max: 12 }).chain((rows) =>
  fc.array(columnArb(rows), { minLength: 1, maxLength: 4 })
);

/** Every cell's class and value, for comparing two loads. */
function cells(t: Table): unknown[] {
  return t.columns.map((c) => {
    const p = c.provenance;
    const n = t.numericCells(c.name);
    return [
      c.name,
      p.numbers,
      p.censoredLeft,
      p.censoredRight,
      p.missing,
      p.nonNumeric,
      Array.from(n.values).map((v) => (Number.isNaN(v) ? null : v)),
      t.text(c.name).values,
    ];
  });
}

async function _writeXlsx(columns: (number | string | null)[][]): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("data");
  ws.addRow(columns.map((_, j) => `c${j}`));
  for (let r = 0; r < columns[0].length; r++) ws.addRow(columns.map((c) => c[r]));
  return new Uint8Array(await wb.xlsx.writeBuffer() as ArrayBuffer);
}

Deno.test("ingest sources fuzz: Parquet, Arrow and polars give the cells of plain arrays", async () => {
  const cases = new CaseCounter("ingest sources round trip");
  const dir = await Deno.makeTempDir({ prefix: "plumbline-fuzz-" });
  try {
    await fc.assert(
      fc.asyncProperty(tableArb, async (columns) => {
        cases.add();
        const names = columns.map((_, j) => `c${j}`);
        const plain = Object.fromEntries(names.map((n, j) => [n, columns[j]]));
        const expected = cells(await loadTable(plain));
        const isText = columns.map((c) => c.some((v) => typeof v === "string"));
        const arrowTable = new arrow.Table(Object.fromEntries(names.map((n, j) => [
          n,
          arrow.vectorFromArray(columns[j], isText[j] ? new arrow.Utf8() : new arrow.Float64()),
        ])));
        const what = JSON.stringify(plain).slice(0, 300);
        assert.deepEqual(cells(await loadTable(arrowTable)), expected, `Arrow table ${what}`);
        const df = pl.DataFrame(plain);
        assert.deepEqual(cells(await loadTable(df)), expected, `polars DataFrame ${what}`);
        df.writeParquet(`${dir}/case.parquet`);
        assert.deepEqual(
          cells(await loadTable(`${dir}/case.parquet`)),
          expected,
          `Parquet ${what}`,
        );
        await Deno.writeFile(`${dir}/case.arrow`, arrow.tableToIPC(arrowTable, "file"));
        assert.deepEqual(
          cells(await loadTable(`${dir}/case.arrow`)),
          expected,
          `Arrow file ${what}`,
        );
      }),
      { seed: 20261240, numRuns: runs(60) },
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  cases.report();
});

Deno.test("ingest sources fuzz: .xlsx sheets give the cells of plain arrays (text columns)", async () => {
  const cases = new CaseCounter("ingest xlsx round trip");
  const dir = await Deno.makeTempDir({ prefix: "plumbline-fuzz-" });
  try {
    await fc.assert(
      fc.asyncProperty(tableArb, async (columns) => {
        cases.add();
        // A sheet's header needs two filled cells, and a blank row is skipped.
        const used = [...columns, columns[0].map((_, r) => `r${r}`)];
        const names = used.map((_, j) => `c${j}`);
        const plain = Object.fromEntries(names.map((n, j) => [n, used[j]]));
        await Deno.writeFile(`${dir}/case.xlsx`, await _writeXlsx(used));
        const t = await loadTable(`${dir}/case.xlsx`);
        const expected = cells(await loadTable(plain));
        assert.deepEqual(cells(t), expected, `xlsx ${JSON.stringify(plain).slice(0, 300)}`);
      }),
      { seed: 20261241, numRuns: runs(30) },
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  cases.report();
});

Deno.test("ingest sources fuzz: damaged Parquet, Arrow and .xlsx bytes give a table or a PlumbError", async () => {
  const cases = new CaseCounter("ingest damaged files");
  let slowest = 0;
  const dir = await Deno.makeTempDir({ prefix: "plumbline-fuzz-" });
  try {
    const df = pl.DataFrame({ v: [1.5, null, 2.5, 3.5], g: ["a", "b", null, "<1"] });
    df.writeParquet(`${dir}/ok.parquet`);
    const originals: [string, Uint8Array][] = [
      ["parquet", await Deno.readFile(`${dir}/ok.parquet`)],
      [
        "arrow",
        arrow.tableToIPC(new arrow.Table({ v: arrow.vectorFromArray([1.5, null, 2.5]) }), "file"),
      ],
      ["xlsx", await _writeXlsx([[1.5, null, 2.5], ["a", "b", "<1"]])],
    ];
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...originals),
        fc.array(
          fc.record({
            at: fc.double({ min: 0, max: 1, noNaN: true }),
            byte: fc.integer({ min: 0, max: 255 }),
            cut: fc.boolean(),
          }),
          { minLength: 1, maxLength: 4 },
        ),
        async ([ext, original], edits) => {
          cases.add();
          const bytes = original.slice();
          let length = bytes.length;
          for (const { at, byte, cut } of edits) {
            const i = Math.min(length - 1, Math.floor(at * length));
            if (cut) length = Math.max(1, i);
            else bytes[i] = byte;
          }
          const path = `${dir}/damaged.${ext}`;
          await Deno.writeFile(path, bytes.subarray(0, length));
          const t0 = performance.now();
          try {
            await loadTable(path);
          } catch (e) {
            assert.ok(e instanceof PlumbError, `${ext}: ${(e as Error)?.constructor?.name}: ${e}`);
            assert.ok(
              /^[A-Z]/.test(e.message) && !e.message.endsWith("."),
              `${ext}: message style`,
            );
          }
          // Speed is the benchmarks' business; the slowest case is logged, not asserted.
          slowest = Math.max(slowest, performance.now() - t0);
        },
      ),
      { seed: 20261242, numRuns: runs(150) },
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  cases.report();
  console.log(`slowest damaged-file case: ${slowest.toFixed(0)} ms`);
});
