/**
 * Parquet files (written here by nodejs-polars 0.25.2 with each codec) and
 * Arrow IPC files and streams (written by apache-arrow 21.2.0), read back by
 * loadTable with their nulls as missing cells.
 */
import assert from "node:assert/strict";
import * as arrow from "apache-arrow";
import pl from "nodejs-polars";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";

const FILL = [500.1, null, 499.7, 500.4, null, 499.9, 500.2];
const LINE = ["A", "B", null, "A", "B", "A", "B"];
const OXYGEN = ["12.5", "<4", "9.1", null, "<4", "15.2", "<2"];

Deno.test("Parquet with nulls, from every codec polars writes", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const df = pl.DataFrame({
      fill_ml: FILL,
      line: LINE,
      oxygen_ppb: OXYGEN,
      n: [1, 2, 3, 4, 5, 6, null],
    });
    for (
      const compression of ["uncompressed", "snappy", "gzip", "zstd", "lz4", "brotli"] as const
    ) {
      const path = `${dir}/lab_${compression}.parquet`;
      df.writeParquet(path, { compression });
      const t = await loadTable(path);
      assert.equal(t.source, `lab_${compression}.parquet`, compression);
      assert.deepEqual(t.columns.map((c) => [c.name, c.kind]), [
        ["fill_ml", "numeric"],
        ["line", "text"],
        ["oxygen_ppb", "numeric"],
        ["n", "numeric"],
      ], compression);
      const fill = t.info("fill_ml").provenance;
      assert.deepEqual([fill.numbers, fill.missing], [5, 2], compression);
      assert.deepEqual(Array.from(t.numeric("fill_ml").values), FILL.filter((v) => v !== null));
      assert.deepEqual(t.text("line").values, ["A", "B", "", "A", "B", "A", "B"]);
      const oxygen = t.info("oxygen_ppb").provenance;
      assert.deepEqual(
        [oxygen.numbers, oxygen.censoredLeft, oxygen.missing],
        [3, 3, 1],
        compression,
      );
      assert.equal(t.info("n").provenance.missing, 1);
    }
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("Parquet dates are text; 64-bit integers are numbers", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const df = pl.DataFrame({
      sampled: [new Date(Date.UTC(2026, 0, 5)), null, new Date(Date.UTC(2026, 0, 6, 8))],
      id: pl.Series("id", [1, 2 ** 40, 3], pl.Int64),
    });
    const path = `${dir}/dates.parquet`;
    df.writeParquet(path);
    const t = await loadTable(path);
    assert.deepEqual(t.text("sampled").values, ["2026-01-05", "", "2026-01-06T08:00:00.000Z"]);
    // Stored as INT64 (read as BigInt), exact as doubles. Values beyond 2^53
    // take the BigInt rule, tested with Arrow tables and in memory.
    assert.deepEqual(Array.from(t.numeric("id").values), [1, 2 ** 40, 3]);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("Arrow IPC files and streams, nulls honoured", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const table = new arrow.Table({
      fill_ml: arrow.vectorFromArray(FILL, new arrow.Float64()),
      line: arrow.vectorFromArray(LINE),
    });
    for (const [name, format] of [["lab.arrow", "file"], ["lab_stream.ipc", "stream"]] as const) {
      await Deno.writeFile(`${dir}/${name}`, arrow.tableToIPC(table, format));
      const t = await loadTable(`${dir}/${name}`);
      assert.equal(t.source, name);
      assert.deepEqual(Array.from(t.numeric("fill_ml").values), FILL.filter((v) => v !== null));
      assert.equal(t.info("fill_ml").provenance.missing, 2);
      assert.deepEqual(t.text("line").values, ["A", "B", "", "A", "B", "A", "B"]);
    }
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("damaged Parquet and Arrow files are refused by name, not read as CSV", async () => {
  const dir = await Deno.makeTempDir();
  try {
    await Deno.writeTextFile(`${dir}/cut.parquet`, "PAR1 and then nothing");
    await Deno.writeTextFile(`${dir}/cut.arrow`, "not arrow at all");
    for (
      const [name, what] of [["cut.parquet", "a Parquet file"], ["cut.arrow", "an Arrow file"]]
    ) {
      await assert.rejects(() => loadTable(`${dir}/${name}`), (e: unknown) => {
        assert.ok(e instanceof PlumbError, String(e));
        assert.equal(e.code, "malformed");
        assert.match(
          e.message,
          new RegExp(`^Cannot read ${name.replace(".", "\\.")} as ${what}: `),
        );
        return true;
      });
    }
    await assert.rejects(
      () => loadTable(`${dir}/cut.parquet`, { sheet: 1 }),
      /Cannot pick a sheet of cut\.parquet: it is not an Excel workbook/,
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
