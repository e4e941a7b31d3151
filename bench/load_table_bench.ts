/**
 * `deno bench` for the ingest layer: the quick reader against csv-parse on
 * the same seeded numeric text, and the in-memory paths.
 *
 * @module
 */
import { tableFromCsv } from "../lib/data/csv_text.ts";
import { tableFromMemory } from "../lib/data/in_memory.ts";
import { uniqueNames } from "../lib/data/header.ts";
import { numericCsv } from "./_numeric_csv.ts";

const text = numericCsv(50_000, 10, 20260101);
const bytes = new TextEncoder().encode(text);
const columns = Object.fromEntries(
  Array.from(
    { length: 10 },
    (_, k) => [`m${k + 1}`, Float64Array.from({ length: 50_000 }, (_, i) => i * (k + 1))],
  ),
);

Deno.bench(
  "quick reader, 50,000 × 10 numeric, from bytes",
  { group: "csv", baseline: true },
  () => {
    tableFromCsv(bytes);
  },
);

Deno.bench("quick reader, 50,000 × 10 numeric, from a string", { group: "csv" }, () => {
  tableFromCsv(text);
});

Deno.bench("csv-parse reader, 50,000 × 10 numeric", { group: "csv" }, () => {
  tableFromCsv(text, { reader: "csv-parse" });
});

Deno.bench("object of 10 Float64Array columns, 50,000 rows", { group: "memory" }, () => {
  const t = tableFromMemory(columns);
  for (const name of t.numericNames()) t.numeric(name);
});

const sameNames = new Array(100_000).fill("x");
Deno.bench("100,000 identical header names made unique", { group: "header" }, () => {
  uniqueNames(sameNames);
});
