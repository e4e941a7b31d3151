import type { FrameLike } from "../../lib/data/memory_source.ts";
import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromMemory } from "../../lib/data/in_memory.ts";
import { frameColumns } from "../../lib/data/frame_like.ts";
import { PlumbError } from "../../lib/errors.ts";

const values = (t: Awaited<ReturnType<typeof loadTable>>, name: string) =>
  Array.from(t.numeric(name).values);

Deno.test("an array of numbers is one column named value (or by the name option)", async () => {
  const t = await loadTable([1.5, 2.5, NaN, null, 4]);
  assert.equal(t.source, "memory");
  assert.deepEqual(t.columns.map((c) => c.name), ["value"]);
  assert.deepEqual(values(t, "value"), [1.5, 2.5, 4]);
  assert.equal(t.info("value").provenance.missing, 2);
  assert.equal(t.delimiter, null);
  const named = await loadTable([1, 2], { name: "torque" });
  assert.deepEqual(named.numericNames(), ["torque"]);
});

Deno.test("typed arrays of every element type are read as one column", async () => {
  const arrays = [
    new Float64Array([1, 2, 3]),
    new Float32Array([1, 2, 3]),
    new Int32Array([1, 2, 3]),
    new Uint8Array([1, 2, 3]),
    new Int16Array([1, 2, 3]),
    new BigInt64Array([1n, 2n, 3n]),
  ];
  for (const a of arrays) {
    const t = await loadTable(a);
    assert.deepEqual(values(t, "value"), [1, 2, 3], a.constructor.name);
  }
});

Deno.test("cells: finite numbers are numbers, NaN/null/undefined missing, ±Infinity and objects text", async () => {
  const t = await loadTable([
    1,
    Infinity,
    -Infinity,
    true,
    new Date(0),
    "2,5",
    " 3 ",
    "NA",
    undefined,
    {},
  ]);
  const p = t.info("value").provenance;
  assert.equal(p.numbers, 2);
  assert.equal(p.missing, 2);
  assert.deepEqual(p.nonNumericCells.map((c) => [c.row, c.line, c.text]), [
    [2, null, "Infinity"],
    [3, null, "-Infinity"],
    [4, null, "true"],
    [5, null, "1970-01-01T00:00:00.000Z"],
    [6, null, "2,5"],
    [10, null, "[object Object]"],
  ]);
  const objectWithoutPrototype = Object.create(null);
  const u = await loadTable([1, 2, objectWithoutPrototype]);
  assert.equal(u.info("value").provenance.nonNumericCells[0].text, "[object Object]");
});

Deno.test("strings in memory follow the CSV cell rules, including decimal comma when asked", async () => {
  const t = await loadTable(["1,5", "2,25", "-"], { decimal: "," });
  assert.deepEqual(values(t, "value"), [1.5, 2.25]);
  assert.equal(t.info("value").provenance.missing, 1);
});

Deno.test("an array of row objects: keys in first-seen order, absent keys missing", async () => {
  const t = await loadTable([{ a: 1, b: "x" }, { b: "y", c: 3 }, { a: 2 }]);
  assert.deepEqual(t.columns.map((c) => c.name), ["a", "b", "c"]);
  assert.deepEqual(values(t, "a"), [1, 2]);
  assert.deepEqual(t.text("b").values, ["x", "y", ""]);
  assert.deepEqual(Array.from(t.numeric("c").rowIndex), [1]);
  assert.equal(t.info("c").provenance.missing, 2);
});

Deno.test("an object of columns and a Map of columns", async () => {
  const t = await loadTable({ x: [1, 2], y: new Float64Array([3, 4]), g: ["a", "b"] });
  assert.deepEqual(t.numericNames(), ["x", "y"]);
  assert.deepEqual(values(t, "y"), [3, 4]);
  const m = await loadTable(new Map([["x", [5, 6]]]));
  assert.deepEqual(values(m, "x"), [5, 6]);
});

Deno.test("columns of different lengths are malformed", async () => {
  await assert.rejects(() => loadTable({ x: [1, 2], y: [3] }), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "malformed");
    assert.equal(
      e.message,
      'Columns of different lengths: "x" has 2 values and "y" has 1; give every column one value per row',
    );
    return true;
  });
});

Deno.test("shapes that are not tables are refused with bad-option", async () => {
  const cases: [unknown, RegExp][] = [
    [[[1, 2], [3, 4]], /^Cannot read an array of arrays/],
    [[{ a: 1 }, 5], /^Cannot read row 2: it is not an object/],
    [{ x: 5 }, /^Cannot read column "x": its value is not an array/],
    [42, /^Cannot make a table from number/],
  ];
  for (const [data, message] of cases) {
    await assert.rejects(() => loadTable(data as never), (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "bad-option");
      assert.match(e.message, message);
      return true;
    });
  }
  await assert.rejects(() => loadTable([1], { name: " " }), /Cannot name a column " "/);
});

Deno.test("a table passed to loadTable comes back as it is", async () => {
  const t = await loadTable([1, 2, 3]);
  assert.equal(await loadTable(t), t);
});

// Small fakes with the method shapes of common column-oriented data-frame
// libraries; no library is imported.
Deno.test("duck-typed data frames: every supported method shape", async () => {
  const data: Record<string, unknown[]> = { x: [1, 2, 3], g: ["a", "b", "a"] };
  const names = () => Object.keys(data);
  const fakes: [string, FrameLike][] = [
    ["columnNames + array", { columnNames: names, array: (n: string) => data[n] }],
    ["columnNames + column (get/length)", {
      columnNames: names,
      column: (n: string) => ({ length: data[n].length, get: (i: number) => data[n][i] }),
    }],
    ["columns array + getColumn (toArray)", {
      columns: names(),
      getColumn: (n: string) => ({ toArray: () => data[n] }),
    }],
    ["columns array + get (values)", {
      columns: names(),
      get: (n: string) => ({ values: data[n] }),
    }],
    ["getColumnNames + getSeries (iterator)", {
      getColumnNames: names,
      getSeries: (n: string) => ({ [Symbol.iterator]: () => data[n][Symbol.iterator]() }),
    }],
    ["schema.fields + getChild (toArray of typed)", {
      schema: { fields: [{ name: "x" }, { name: "g" }] },
      getChild: (n: string) => ({
        toArray: () => n === "x" ? new Float64Array([1, 2, 3]) : data[n],
      }),
    }],
    ["columns() method + column (array)", { columns: names, column: (n: string) => data[n] }],
  ];
  for (const [label, fake] of fakes) {
    const t = await loadTable(fake);
    assert.deepEqual(t.columns.map((c) => c.name), ["x", "g"], label);
    assert.deepEqual(values(t, "x"), [1, 2, 3], label);
    assert.deepEqual(t.text("g").values, ["a", "b", "a"], label);
  }
});

Deno.test("a frame whose column objects have no known shape is refused by name", async () => {
  const fake = { columnNames: () => ["x"], array: () => 7 };
  await assert.rejects(() => loadTable(fake), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "bad-option");
    assert.match(e.message, /^Cannot read column "x" of the data frame: array\(\) gave neither/);
    return true;
  });
  assert.equal(frameColumns({ columns: ["x"] }), null);
  assert.equal(frameColumns({ get: () => [1] }), null);
});

Deno.test("tableFromMemory is the synchronous form", () => {
  const t = tableFromMemory({ v: [1, 2] });
  assert.deepEqual(Array.from(t.numeric("v").values), [1, 2]);
});

Deno.test("values that are not tables are refused, saying what to give instead", async () => {
  function* readings() {
    yield 1;
  }
  const cases: [unknown, RegExp][] = [
    [readings(), /^Cannot make a table from an iterator or generator: collect its values first/],
    [new Set([1, 2]), /^Cannot make a table from a Set: give its values as an array, Array\.from/],
    [new ArrayBuffer(16), /^Cannot make a table from raw bytes \(ArrayBuffer\): for numbers, view/],
    [new DataView(new ArrayBuffer(8)), /^Cannot make a table from raw bytes \(DataView\)/],
    [Promise.resolve([1, 2]), /^Cannot make a table from a promise: await it first/],
    [{}, /^Cannot make a table from an object with no columns \(an empty object\)/],
    [new Map(), /^Cannot make a table from an empty Map: it has no columns/],
    [
      new (class Batch {})(),
      /^Cannot make a table from an object with no columns \(an instance of Batch\)/,
    ],
    [new Date(0), /^Cannot make a table from a Date/],
    [true, /^Cannot make a table from boolean/],
  ];
  for (const [data, message] of cases) {
    await assert.rejects(() => loadTable(data as never), (e: unknown) => {
      assert.ok(e instanceof PlumbError, String(e));
      assert.equal(e.code, "bad-option");
      assert.match(e.message, message);
      return true;
    }, String(message));
  }
});

Deno.test("BigInt cells: numbers when a double holds them exactly, text (reported) otherwise", async () => {
  const t = await loadTable([1n, 2n ** 53n, 2n ** 53n + 1n, -(2n ** 64n), 5n]);
  const p = t.info("value").provenance;
  assert.equal(p.numbers, 4);
  assert.deepEqual(p.nonNumericCells, [{ row: 3, line: null, text: "9007199254740993" }]);
  assert.throws(() => t.numeric("value"), (e: unknown) => {
    assert.ok(e instanceof PlumbError);
    assert.equal(e.code, "non-numeric");
    assert.match(
      e.message,
      /row 3 "9007199254740993" \(integers beyond ±2\^53 \(9007199254740992\) cannot be held exactly as numbers; convert them with Number\(\) first if rounding them is acceptable\)/,
    );
    assert.doesNotMatch(e.message, /decimal/);
    return true;
  });
});
