import assert from "node:assert/strict";
import fc from "fast-check";
import { loadTable } from "../../lib/data/load_table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { assertSameTable } from "./_same_table.ts";

Deno.test("a string with a line break is CSV text; without one it is a path", async () => {
  const t = await loadTable("a,b\n1,2");
  assert.equal(t.source, "text");
  await assert.rejects(() => loadTable("a,b"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "not-found");
    assert.equal(
      e.message,
      'Cannot read the file "a,b": it does not exist; check the path, or pass { from: "text" } if this string is CSV text',
    );
    return true;
  });
  const one = await loadTable("a,b", { from: "text" });
  assert.equal(one.rowCount, 0);
  assert.deepEqual(one.columns.map((c) => c.name), ["a", "b"]);
});

Deno.test("a missing file gives PlumbError naming the path", async () => {
  await assert.rejects(() => loadTable("no_such_dir/missing.csv"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "not-found");
    assert.match(e.message, /^Cannot read the file "no_such_dir\/missing.csv": it does not exist;/);
    return true;
  });
});

Deno.test("a file path as a string and as a URL; the source is the file name", async () => {
  const url = new URL("../fixtures/csv/comma.csv", import.meta.url);
  const fromUrl = await loadTable(url);
  const fromPath = await loadTable(url.pathname, { from: "path" });
  assert.equal(fromUrl.source, "comma.csv");
  assert.equal(fromPath.source, "comma.csv");
  assert.equal(fromUrl.info("volume").provenance.source, "comma.csv");
  assert.deepEqual(Array.from(fromPath.numeric("torque").values), [1.25, 1.31, 1.18, 1.4]);
});

Deno.test("from names the source kind; wrong combinations are refused", async () => {
  await assert.rejects(
    () => loadTable([1], { from: "text" }),
    /^PlumbError: Cannot read this value as CSV text: with from: "text" give a string or its bytes/,
  );
  await assert.rejects(
    () => loadTable([1], { from: "path" }),
    /Cannot read a file path from this value/,
  );
  await assert.rejects(
    () => loadTable("x", { from: "disk" as "path" }),
    /^PlumbError: Unknown source kind "disk"/,
  );
  const t = await loadTable(["1", "2"], { from: "memory" });
  assert.deepEqual(Array.from(t.numeric("value").values), [1, 2]);
});

Deno.test("a large generated file reads the same through both readers", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const lines = ["a,b,c"];
    for (let i = 0; i < 20000; i++) {
      lines.push(`${i},${(i * 0.37).toFixed(3)},${i % 7 === 0 ? "NA" : -i / 8}`);
    }
    const path = `${dir}/big.csv`;
    await Deno.writeTextFile(path, lines.join("\r\n"));
    const quick = await loadTable(path);
    const general = await loadTable(path, { reader: "csv-parse" });
    for (const name of ["a", "b", "c"]) {
      assert.deepEqual(quick.numeric(name).values, general.numeric(name).values, name);
    }
    assert.equal(quick.info("c").provenance.missing, 2858);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

// Round trip: a table of doubles written to CSV (shortest round-trip text,
// with missing cells as empty, in any of the four delimiters, optionally
// quoted and with CRLF) reads back as the same numbers, bit for bit.
Deno.test("property: numbers written to CSV read back identically", async () => {
  const cell = fc.oneof(
    { weight: 8, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
    { weight: 4, arbitrary: fc.integer({ min: -1e6, max: 1e6 }).map((k) => k / 1000) },
    { weight: 1, arbitrary: fc.constant(null) },
  );
  const table = fc.integer({ min: 1, max: 5 }).chain((cols) =>
    fc.array(fc.array(cell, { minLength: cols, maxLength: cols }), { minLength: 1, maxLength: 30 })
  );
  await fc.assert(
    fc.asyncProperty(
      table,
      fc.constantFrom(",", ";", "\t", "|"),
      fc.boolean(),
      fc.boolean(),
      async (rows, delimiter, quote, crlf) => {
        const cols = rows[0].length;
        const header = Array.from({ length: cols }, (_, k) => `c${k}`).join(delimiter);
        const show = (v: number | null) => {
          // A one-column row with an empty cell is written "" (as Python's csv
          // module does): a blank line at the end of a text is not a row.
          if (v === null) return cols === 1 ? '""' : "";
          // String(-0) is "0": write the sign so the round trip can keep it.
          const plain = Object.is(v, -0) ? "-0" : String(v);
          const s = delimiter === ";" ? plain.replace(".", ",") : plain;
          return quote ? `"${s}"` : s;
        };
        const eol = crlf ? "\r\n" : "\n";
        const text = [header, ...rows.map((r) => r.map(show).join(delimiter))].join(eol) + eol;
        const t = await loadTable(text, { delimiter });
        // The general reader gives the very same table.
        assertSameTable(t, await loadTable(text, { delimiter, reader: "csv-parse" }), text);
        for (let k = 0; k < cols; k++) {
          const expected = rows.map((r) => r[k]).filter((v): v is number => v !== null);
          const got = t.numeric(`c${k}`);
          assert.equal(got.values.length, expected.length);
          expected.forEach((v, i) =>
            assert.ok(Object.is(got.values[i], v), `${v} read as ${got.values[i]}`)
          );
          assert.equal(got.provenance.missingDropped, rows.length - expected.length);
        }
      },
    ),
    { seed: 424242, numRuns: 300 },
  );
});

Deno.test("a ';' file whose header holds a comma is read on ';' with decimal commas", async () => {
  const t = await loadTable("Zeit;Konzentration, mg/L\n1;2,5\n2;3,1\n3;4,7\n");
  assert.equal(t.delimiter, ";");
  assert.deepEqual(t.columns.map((c) => c.name), ["Zeit", "Konzentration, mg/L"]);
  assert.deepEqual(Array.from(t.numeric("Konzentration, mg/L").values), [2.5, 3.1, 4.7]);
});

Deno.test("a named pipe and a /proc file are read to their end; a folder is refused", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const fifo = `${dir}/lab.pipe`;
    const made = await new Deno.Command("mkfifo", { args: [fifo] }).output();
    assert.ok(made.success, "mkfifo");
    const text = "v\n" + Array.from({ length: 50_000 }, (_, i) => i % 97).join("\n") + "\n";
    const writer = (async () => {
      using f = await Deno.open(fifo, { write: true });
      const bytes = new TextEncoder().encode(text);
      for (let k = 0; k < bytes.length; k += 4096) await f.write(bytes.subarray(k, k + 4096));
    })();
    const t = await loadTable(fifo);
    await writer;
    assert.equal(t.rowCount, 50_000);
    assert.equal(t.info("v").provenance.numbers, 50_000);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  if (Deno.build.os === "linux") {
    // /proc files report a size of 0 and are read all the same.
    const t = await loadTable("/proc/self/status", { delimiter: ":" });
    assert.ok(t.rowCount > 10, `rows ${t.rowCount}`);
  }
  await assert.rejects(() => loadTable(new URL(".", import.meta.url)), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "bad-option");
    assert.match(e.message, /: it is a folder; give the path of a file inside it$/);
    return true;
  });
});

Deno.test("loadTable: misspelled options are refused naming the nearest one; null is no options", async () => {
  await assert.rejects(() => loadTable("a\n1\n", { delimitter: ";" } as never), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "bad-option");
    assert.match(
      e.message,
      /^Unknown option "delimitter" of loadTable: did you mean "delimiter"\? \(the options are from, delimiter, /,
    );
    assert.equal(e.detail?.suggestion, "delimiter");
    return true;
  });
  await assert.rejects(
    () => loadTable("a\n1\n", { colour: "red" } as never),
    /^PlumbError: Unknown option "colour" of loadTable: the options are /,
  );
  await assert.rejects(
    () => loadTable("a\n1\n", "utf-8" as never),
    /^PlumbError: Cannot use string as the options of loadTable: give an object/,
  );
  const t = await loadTable("a\n1\n", null);
  assert.deepEqual(Array.from(t.numeric("a").values), [1]);
});
