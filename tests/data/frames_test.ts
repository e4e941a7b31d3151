/**
 * Data frames and columnar tables from real libraries: Apache Arrow (tables
 * and vectors, with null masks, 64-bit integers and dates), nodejs-polars
 * (DataFrames and Series) and arquero (tables, filtered ones included).
 */
import assert from "node:assert/strict";
import * as arrow from "apache-arrow";
import pl from "nodejs-polars";
import * as aq from "arquero";
import { loadTable } from "../../lib/data/load_table.ts";
import { plumb } from "../../lib/plumb/plumb.ts";

// Twelve measurements, three of them null in the Arrow validity mask. Read
// through toArray() the nulls came out as 0: n = 12, mean 10.17.
const WITH_NULLS = [14.2, null, 13.1, 12.8, null, 14.9, 13.3, null, 12.5, 13.8, 14.1, 13.3];
const PRESENT = WITH_NULLS.filter((v): v is number => v !== null);
const MEAN = PRESENT.reduce((a, b) => a + b, 0) / PRESENT.length;

Deno.test("Arrow: null slots are missing cells, not zeros", async () => {
  const v = arrow.vectorFromArray(WITH_NULLS, new arrow.Float64());
  assert.deepEqual(Array.from(v.toArray()).filter((x) => x === 0).length, 3); // the trap
  const table = new arrow.Table({ fill_ml: v });
  const t = await loadTable(table);
  const p = t.info("fill_ml").provenance;
  assert.deepEqual([p.numbers, p.missing], [9, 3]);
  assert.deepEqual(Array.from(t.numeric("fill_ml").values), PRESENT);
  const a = plumb(t, "fill_ml").analysis();
  assert.equal(a.n, 9);
  assert.ok(Math.abs(a.moments.mean - MEAN) < 1e-12, `mean ${a.moments.mean} vs ${MEAN}`);
  // A bare vector is one column.
  const alone = await loadTable(v, { name: "fill_ml" });
  assert.deepEqual(Array.from(alone.numeric("fill_ml").values), PRESENT);
});

Deno.test("Arrow: nulls in integer, string and dictionary columns; dates are text", async () => {
  const table = new arrow.Table({
    count: arrow.vectorFromArray([3, null, 5], new arrow.Int32()),
    line: arrow.vectorFromArray(["A", null, "B"]),
    lot: arrow.vectorFromArray(
      ["x", "y", null],
      new arrow.Dictionary(new arrow.Utf8(), new arrow.Int32()),
    ),
    day: arrow.vectorFromArray(
      [new Date(0), null, new Date(86_400_000)],
      new arrow.DateMillisecond(),
    ),
  });
  const t = await loadTable(table);
  assert.deepEqual(Array.from(t.numericCells("count").missing), [0, 1, 0]);
  assert.deepEqual(t.text("line").values, ["A", "", "B"]);
  assert.deepEqual(t.text("lot").values, ["x", "y", ""]);
  assert.equal(t.info("day").kind, "text");
  assert.deepEqual(t.text("day").values, [
    "1970-01-01T00:00:00.000Z",
    "",
    "1970-01-02T00:00:00.000Z",
  ]);
});

Deno.test("Arrow: 64-bit integers are numbers when exact, and reported when a double cannot hold them", async () => {
  const big = 2n ** 60n + 1n;
  const table = new arrow.Table({
    ok: arrow.vectorFromArray([1n, 2n ** 53n, -(2n ** 60n)], new arrow.Int64()),
    id: arrow.vectorFromArray([7n, big, 9n], new arrow.Int64()),
  });
  const t = await loadTable(table);
  assert.deepEqual(Array.from(t.numeric("ok").values), [1, 2 ** 53, -(2 ** 60)]);
  assert.deepEqual(t.info("id").provenance.nonNumericCells, [
    { row: 2, line: null, text: String(big) },
  ]);
  assert.throws(
    () => t.numeric("id"),
    /integers beyond ±2\^53 \(9007199254740992\) cannot be held exactly/,
  );
  // Text, exactly as written: a BigInt id column groups without rounding.
  assert.equal(t.text("id").values[1], "1152921504606846977");
});

Deno.test("polars: a DataFrame's columns with nulls, and a Series named by its name", async () => {
  const df = pl.DataFrame({
    line: ["A", "B", null, "A"],
    torque_nm: [1.21, null, 1.35, 1.18],
    count: [3, 4, 5, null],
  });
  const t = await loadTable(df);
  assert.deepEqual(t.columns.map((c) => [c.name, c.kind]), [
    ["line", "text"],
    ["torque_nm", "numeric"],
    ["count", "numeric"],
  ]);
  assert.deepEqual(Array.from(t.numeric("torque_nm").values), [1.21, 1.35, 1.18]);
  assert.equal(t.info("count").provenance.missing, 1);
  const series = pl.Series("fill_ml", [500.1, null, 499.7, 500.4, 499.9, 500.2, 500.0]);
  const s = await loadTable(series);
  assert.deepEqual(s.columns.map((c) => c.name), ["fill_ml"]);
  assert.equal(s.info("fill_ml").provenance.missing, 1);
  const chain = plumb(series);
  assert.equal(chain.column, "fill_ml");
  assert.equal(chain.analysis().n, 6);
  // A Series without a name takes the name option.
  assert.deepEqual((await loadTable(pl.Series([1, 2]), { name: "v" })).numericNames(), ["v"]);
});

Deno.test("arquero: a table's columns, nulls missing, censored strings kept; a filtered table's rows only", async () => {
  const dt = aq.table({
    line: ["A", "B", null, "A"],
    fill_ml: [500.1, null, 499.7, 500.4],
    oxygen_ppb: ["<4", "12.5", "9.1", undefined],
  });
  const t = await loadTable(dt);
  assert.deepEqual(t.columns.map((c) => [c.name, c.kind]), [
    ["line", "text"],
    ["fill_ml", "numeric"],
    ["oxygen_ppb", "numeric"],
  ]);
  const o = t.info("oxygen_ppb").provenance;
  assert.deepEqual([o.numbers, o.censoredLeft, o.missing], [2, 1, 1]);
  const a = await loadTable(dt.filter((d: { line: string | null }) => d.line === "A"));
  assert.equal(a.rowCount, 2);
  assert.deepEqual(Array.from(a.numeric("fill_ml").values), [500.1, 500.4]);
});
