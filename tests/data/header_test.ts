import assert from "node:assert/strict";
import { uniqueNames } from "../../lib/data/header.ts";
import { loadTable } from "../../lib/data/load_table.ts";

Deno.test("empty names become column_<k>, duplicates get the first free suffix", () => {
  const { names, renamed } = uniqueNames(["a", "", "a", "a_2", " b ", "a"]);
  assert.deepEqual(names, ["a", "column_2", "a_3", "a_2", "b", "a_4"]);
  assert.deepEqual(renamed, [
    { index: 1, from: "", to: "column_2", reason: "empty" },
    { index: 2, from: "a", to: "a_3", reason: "duplicate" },
    { index: 5, from: "a", to: "a_4", reason: "duplicate" },
  ]);
  assert.deepEqual(uniqueNames(["column_2", ""]).names, ["column_2", "column_2_2"]);
});

Deno.test("header renames are recorded on the table and in the provenance", async () => {
  const table = await loadTable(new URL("../fixtures/csv/header_names.csv", import.meta.url));
  assert.deepEqual(table.columns.map((c) => c.name), [
    "x",
    "column_2",
    "x_3",
    "__proto__",
    "constructor",
    "toString",
    "x_2",
  ]);
  assert.deepEqual(table.renamed.map((r) => [r.from, r.to, r.reason]), [
    ["", "column_2", "empty"],
    ["x", "x_3", "duplicate"],
  ]);
  assert.equal(table.info("x_3").provenance.originalName, "x");
  assert.equal(table.info("x_2").provenance.originalName, "x_2");
});

// Names such as __proto__ and constructor are plain keys: nothing reaches
// Object.prototype and the columns read like any other.
Deno.test("prototype-related header names do not pollute and read normally", async () => {
  const probe = "polluted" as keyof object;
  const sources: [string, unknown][] = [
    ["csv", "__proto__,constructor,prototype,hasOwnProperty\n1,2,3,4\n5,6,7,8\n"],
    [
      "rows",
      JSON.parse(
        '[{"__proto__": 1, "constructor": 2, "prototype": 3}, {"__proto__": 5, "constructor": 6, "prototype": 7}]',
      ),
    ],
    ["columns", JSON.parse('{"__proto__": [1, 5], "constructor": [2, 6], "prototype": [3, 7]}')],
  ];
  for (const [label, source] of sources) {
    const table = await loadTable(source as string);
    assert.deepEqual(
      table.numericNames().slice(0, 3),
      ["__proto__", "constructor", "prototype"],
      label,
    );
    assert.deepEqual(Array.from(table.numeric("__proto__").values), [1, 5], label);
    assert.deepEqual(Array.from(table.numeric("constructor").values), [2, 6], label);
    assert.equal(({} as Record<string, unknown>)[probe], undefined, label);
    assert.equal(Object.getPrototypeOf({}), Object.prototype, label);
    assert.equal(table.has("toString"), false, label);
  }
  const polluting = await loadTable('__proto__\n"{""polluted"": 1}"\n');
  assert.deepEqual(polluting.text("__proto__").values, ['{"polluted": 1}']);
  assert.equal(({} as Record<string, unknown>)[probe], undefined);
});
