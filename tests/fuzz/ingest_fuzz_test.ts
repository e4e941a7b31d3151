/**
 * Ingest fuzz: random and mutated CSV (quotes, delimiters, byte-order marks,
 * mixed line ends, invalid UTF-8, very long lines, very wide headers, empty
 * input) through `loadTable` as text and as a file. Every case returns a
 * table or throws a `PlumbError` ("malformed" naming the line where there is
 * one, or "bad-option"), within 10 s; header names and object keys such as
 * `__proto__` never reach `Object.prototype`.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { loadTable } from "../../lib/data/load_table.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";
import { tableFromMemory } from "../../lib/data/in_memory.ts";
import type { Table } from "../../lib/data/table.ts";
import { PlumbError } from "../../lib/errors.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { survey } from "../../lib/plumb/survey.ts";
import { CaseCounter, runs } from "./_fuzz.ts";

const CODES = ["malformed", "bad-option"];

const _decoder = new TextDecoder();
const _encoder = new TextEncoder();

/** Bytes that matter to a CSV reader or to UTF-8 decoding. */
const SPECIAL_BYTES = [
  0x22,
  0x2c,
  0x3b,
  0x09,
  0x7c,
  0x0d,
  0x0a,
  0x20,
  0x00,
  0xef,
  0xbb,
  0xbf,
  0xff,
  0xfe,
  0xc3,
  0x80,
  0xe2,
  0x8f,
  0xed,
  0xa0,
  0xf4,
  0x90,
  0x2e,
  0x2d,
  0x4e,
  0x41,
];

const cellArb = fc.oneof(
  { weight: 4, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }).map(String) },
  { weight: 3, arbitrary: fc.integer({ min: -1e6, max: 1e6 }).map(String) },
  { weight: 1, arbitrary: fc.constantFrom("", "NA", "N/A", "null", "NaN", "-", ".", " ", "1,5") },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      "<0.5",
      "< 2",
      ">1000",
      "≤1,5",
      "≥ 3",
      "<=4",
      ">=-1",
      "<",
      "<<2",
      "ND",
    ),
  },
  { weight: 2, arbitrary: fc.string({ unit: "binary", maxLength: 12 }) },
  {
    weight: 2,
    arbitrary: fc.string({ unit: "binary", maxLength: 12 }).map((s) =>
      `"${s.replace(/"/g, '""')}"`
    ),
  },
  { weight: 1, arbitrary: fc.constantFrom('"', '""', '"a"b', 'a"b', '"a""', "\r", "\n", "\r\n") },
);

const csvArb = fc.record({
  columns: fc.integer({ min: 1, max: 6 }),
  rows: fc.integer({ min: 0, max: 12 }),
  delimiter: fc.constantFrom(",", ";", "\t", "|"),
  ends: fc.array(fc.constantFrom("\n", "\r\n", "\r"), { minLength: 1, maxLength: 4 }),
  bom: fc.boolean(),
  trailing: fc.boolean(),
  ragged: fc.boolean(),
  clean: fc.boolean(),
  seed: fc.integer({ min: 0, max: 2 ** 31 - 1 }),
}).chain((shape) =>
  fc.record({
    shape: fc.constant(shape),
    header: fc.array(cellArb, { minLength: shape.columns, maxLength: shape.columns }),
    body: fc.array(
      fc.array(cellArb, {
        minLength: shape.ragged ? 0 : shape.columns,
        maxLength: shape.ragged ? shape.columns + 2 : shape.columns,
      }),
      { minLength: shape.rows, maxLength: shape.rows },
    ),
  })
).map(({ shape, header, body }) => {
  // "clean" texts quote every cell that needs it, so that many cases are valid tables.
  const needs = (c: string) => c.includes('"') || c.includes(shape.delimiter) || /[\r\n]/.test(c);
  const fix = (c: string) => (shape.clean && needs(c) ? `"${c.replace(/"/g, '""')}"` : c);
  const lines = [header, ...body].map((cells) => cells.map(fix).join(shape.delimiter));
  let text = shape.bom ? "\ufeff" : "";
  lines.forEach((l, i) => {
    text += l;
    if (i < lines.length - 1 || shape.trailing) text += shape.ends[i % shape.ends.length];
  });
  return text;
});

/** Byte-level mutations: insert, delete, duplicate a run, truncate. */
const mutationArb = fc.array(
  fc.record({
    op: fc.constantFrom("insert", "insert", "delete", "duplicate", "truncate"),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    len: fc.integer({ min: 1, max: 40 }),
    byte: fc.oneof(fc.constantFrom(...SPECIAL_BYTES), fc.integer({ min: 0, max: 255 })),
  }),
  { maxLength: 6 },
);

function _mutate(
  bytes: Uint8Array,
  ops: readonly { op: string; at: number; len: number; byte: number }[],
): Uint8Array {
  let b = Array.from(bytes);
  for (const { op, at, len, byte } of ops) {
    const i = Math.min(b.length, Math.floor(at * (b.length + 1)));
    if (op === "insert") b.splice(i, 0, byte);
    else if (op === "delete") b.splice(i, len);
    else if (op === "duplicate") b.splice(i, 0, ...b.slice(i, i + len));
    else b = b.slice(0, i);
  }
  return Uint8Array.from(b);
}

/** What a load gave: a table's shape, or an error's code (with the error, for checks). */
type _Outcome = { ok: true; table: Table } | { ok: false; error: PlumbError };

function _check(o: _Outcome, input: string, what: string): void {
  if (!o.ok) {
    const e = o.error;
    assert.ok(CODES.includes(e.code), `${what}: code ${e.code}: ${e.message}`);
    assert.ok(/^[A-Z]/.test(e.message) && !e.message.endsWith("."), `${what}: message style`);
    const line = (e.detail as { line?: unknown } | undefined)?.line;
    if (e.code === "malformed" && typeof line === "number") {
      assert.ok(e.message.includes(`line ${line}`), `${what}: message names line ${line}`);
      const lines = input.split(/\r\n|\r|\n/).length;
      assert.ok(line >= 1 && line <= lines + 1, `${what}: line ${line} of ${lines}`);
    }
    return;
  }
  const t = o.table;
  assert.ok(Number.isInteger(t.rowCount) && t.rowCount >= 0, `${what}: rowCount`);
  const names = t.columns.map((c) => c.name);
  assert.equal(new Set(names).size, names.length, `${what}: names unique`);
  for (const c of t.columns) {
    assert.ok(c.name.length > 0, `${what}: empty column name`);
    assert.ok(t.has(c.name), `${what}: has(${JSON.stringify(c.name)})`);
    const p = c.provenance;
    const censored = p.censoredLeft + p.censoredRight;
    assert.equal(
      p.numbers + censored + p.missing + p.nonNumeric,
      t.rowCount,
      `${what}: cell counts`,
    );
    if (c.kind === "numeric") {
      const col = t.numeric(c.name, { dropText: true });
      assert.ok(col.values.every(Number.isFinite), `${what}: numeric values finite`);
      assert.equal(col.values.length, p.numbers + censored, `${what}: numbers used`);
      const sides = col.censor === undefined ? 0 : col.censor.filter((x) => x !== 0).length;
      assert.equal(sides, censored, `${what}: censored values flagged`);
    }
  }
}

async function _load(f: () => Promise<Table> | Table): Promise<_Outcome> {
  try {
    return { ok: true, table: await f() };
  } catch (e) {
    if (e instanceof PlumbError) return { ok: false, error: e };
    throw new assert.AssertionError({
      message: `threw ${(e as Error)?.constructor?.name} instead of PlumbError: ${
        (e as Error)?.message
      }`,
    });
  }
}

function _summary(o: _Outcome): string {
  if (!o.ok) return `error ${o.error.code}`;
  return JSON.stringify([
    o.table.rowCount,
    o.table.columns.map((c) => {
      const p = c.provenance;
      return [c.name, c.kind, p.numbers, p.censoredLeft, p.censoredRight, p.missing, p.nonNumeric];
    }),
  ]);
}

/**
 * Load `bytes` as text and from a temporary file; check both, and return the
 * slower time for the log (speed is measured by the benchmarks, not asserted).
 */
async function _loadBoth(bytes: Uint8Array, dir: string, what: string): Promise<number> {
  const text = _decoder.decode(bytes);
  let t0 = performance.now();
  const fromText = await _load(() => loadTable(text, { from: "text" }));
  let ms = performance.now() - t0;
  _check(fromText, text, `${what} (text)`);
  const path = `${dir}/case.csv`;
  await Deno.writeFile(path, bytes);
  t0 = performance.now();
  const fromFile = await _load(() => loadTable(path));
  const fileMs = performance.now() - t0;
  _check(fromFile, text, `${what} (file)`);
  ms = Math.max(ms, fileMs);
  return ms;
}

Deno.test("ingest fuzz: random and mutated CSV gives a table or a PlumbError", async () => {
  const cases = new CaseCounter("ingest random+mutated CSV");
  const dir = await Deno.makeTempDir({ prefix: "plumbline-fuzz-" });
  let slowest = 0;
  let tables = 0;
  let errors = 0;
  try {
    await fc.assert(
      fc.asyncProperty(csvArb, fc.oneof(fc.constant([]), mutationArb), async (text, ops) => {
        cases.add();
        const bytes = _mutate(_encoder.encode(text), ops);
        const what = `CSV ${JSON.stringify(_decoder.decode(bytes).slice(0, 200))}`;
        slowest = Math.max(slowest, await _loadBoth(bytes, dir, what));
        // The two readers must agree on every text, given as bytes (invalid
        // UTF-8 is an error for both) and as a decoded string.
        const decoded = _decoder.decode(bytes);
        const auto = await _load(() => tableFromCsv(bytes));
        const general = await _load(() => tableFromCsv(bytes, { reader: "csv-parse" }));
        assert.equal(_summary(general), _summary(auto), `${what}: readers disagree on bytes`);
        assert.equal(
          _summary(await _load(() => tableFromCsv(decoded, { reader: "csv-parse" }))),
          _summary(await _load(() => tableFromCsv(decoded))),
          `${what}: readers disagree on the decoded text`,
        );
        if (auto.ok) tables++;
        else errors++;
      }),
      { seed: 20261230, numRuns: runs(800) },
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  console.log(
    `ingest: ${tables} tables, ${errors} PlumbErrors; slowest case ${slowest.toFixed(1)} ms`,
  );
  cases.report();
});

Deno.test("ingest fuzz: extreme shapes give a table or a PlumbError", async () => {
  const cases = new CaseCounter("ingest extreme shapes");
  const dir = await Deno.makeTempDir({ prefix: "plumbline-fuzz-" });
  const mb = 1 << 20;
  const wide = Array.from({ length: 100_000 }, (_, i) => `c${i}`);
  const shapes: Record<string, string | Uint8Array> = {
    "empty": "",
    "only a BOM": "\ufeff",
    "only line ends": "\n\r\n\r\n",
    "only a header": "a,b,c\n",
    "only a header, no line end": "a;b;c",
    "1 MB unquoted line": `a,b\n1,${"x".repeat(mb)}\n2,3\n`,
    "1 MB quoted field with line breaks": `a,b\n1,"${"y\r\n".repeat(mb / 3)}"\n2,3\n`,
    "1 MB of digits": `a\n${"9".repeat(mb)}\n1\n`,
    "1 MB unclosed quote": `a,b\n1,"${"z".repeat(mb)}\n`,
    "100,000 columns": `${wide.join(",")}\n${wide.map((_, i) => i).join(",")}\n`,
    "100,000 identical names": `${wide.map(() => "x").join(",")}\n${wide.map(() => 1).join(",")}\n`,
    "100,000 empty names": `${",".repeat(99_999)}\n${wide.map(() => 2).join(",")}\n`,
    "100,000 rows of one column": `v\n${
      Array.from({ length: 100_000 }, (_, i) => i % 97).join("\n")
    }\n`,
    "invalid UTF-8 everywhere": Uint8Array.from(
      { length: 4096 },
      (_, i) => [0xff, 0x2c, 0xc3, 0x0a][i % 4],
    ),
    "NUL bytes": Uint8Array.from({ length: 4096 }, (_, i) => [0x00, 0x2c, 0x31, 0x0a][i % 4]),
    "lone CRs": "a,b\r1,2\r3,4\r",
    "mixed line ends": "a,b\r\n1,2\n3,4\r5,6\r\n",
    "BOM and CRLF": "\ufeffa;b\r\n1,5;2\r\n",
  };
  try {
    for (const [name, src] of Object.entries(shapes)) {
      cases.add();
      const bytes = typeof src === "string" ? _encoder.encode(src) : src;
      const ms = await _loadBoth(bytes, dir, name);
      console.log(`ingest ${name}: ${ms.toFixed(0)} ms`);
    }
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
  cases.report();
});

Deno.test("ingest fuzz: a ragged row or an unclosed quote is reported at its exact line", async () => {
  const cases = new CaseCounter("ingest exact error line");
  // Well-formed rows whose quoted fields hold line breaks of every kind, then one bad line.
  const field = fc.oneof(
    fc.integer({ min: -999, max: 999 }).map(String),
    fc.array(fc.constantFrom("a", " ", ",", '""', "\n", "\r\n", "\r"), { maxLength: 6 })
      .map((parts) => `"${parts.join("")}"`),
  );
  await fc.assert(
    fc.asyncProperty(
      fc.array(fc.tuple(field, field, field), { maxLength: 8 }),
      fc.array(fc.constantFrom("\n", "\r\n", "\r"), { minLength: 1, maxLength: 3 }),
      fc.constantFrom("ragged", "unclosed"),
      fc.constantFrom("auto", "csv-parse"),
      async (rows, ends, fault, reader) => {
        cases.add();
        let text = "a,b,c";
        let line = 1;
        rows.forEach((cells, i) => {
          text += ends[i % ends.length];
          line++;
          const row = cells.join(",");
          text += row;
          line += (row.match(/\r\n|\r|\n/g) ?? []).length;
        });
        text += ends[0];
        line++;
        text += fault === "ragged" ? "1,2" : '1,"open,3';
        text += ends[0] + "4,5,6" + ends[0];
        const what = `${fault} ${reader} ${JSON.stringify(text)}`;
        const r = await _load(() => loadTable(text, { from: "text", reader: reader as "auto" }));
        assert.ok(!r.ok, `${what}: should fail`);
        assert.equal(r.error.code, "malformed", what);
        assert.equal((r.error.detail as { line: number }).line, line, `${what}: line`);
        assert.ok(r.error.message.includes(`line ${line}:`), `${what}: ${r.error.message}`);
      },
    ),
    { seed: 20261232, numRuns: runs(300) },
  );
  cases.report();
});

/** Keys that reach Object.prototype when code assigns obj[key] on a plain object. */
const HOSTILE_KEYS = [
  "__proto__",
  "constructor",
  "prototype",
  "hasOwnProperty",
  "toString",
  "valueOf",
  "__defineGetter__",
  "isPrototypeOf",
  "polluted",
];

function _prototypeSnapshot(): string {
  const names = Object.getOwnPropertyNames(Object.prototype).sort();
  const kinds = names.map((n) => `${n}:${typeof (Object.prototype as Record<string, unknown>)[n]}`);
  return `${kinds.join(",")}|${String(Object.getPrototypeOf(Object.prototype))}`;
}

function _assertClean(before: string, what: string): void {
  assert.equal(_prototypeSnapshot(), before, `${what}: Object.prototype changed`);
  assert.equal(({} as { polluted?: unknown }).polluted, undefined, `${what}: ({}).polluted`);
  assert.equal(typeof ({}).hasOwnProperty, "function", `${what}: hasOwnProperty`);
  assert.equal(typeof ({}).toString, "function", `${what}: toString`);
}

Deno.test("ingest fuzz: header names and keys like __proto__ never pollute Object.prototype", async () => {
  const cases = new CaseCounter("ingest prototype pollution");
  const before = _prototypeSnapshot();
  const keyArb = fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...HOSTILE_KEYS) },
    { weight: 1, arbitrary: fc.string({ minLength: 1, maxLength: 8 }) },
  );
  await fc.assert(
    fc.asyncProperty(
      fc.uniqueArray(keyArb, { minLength: 1, maxLength: 6 }),
      fc.uniqueArray(fc.integer({ min: -100, max: 100 }), { minLength: 4, maxLength: 12 }),
      async (keys, values) => {
        cases.add();
        const what = `keys ${JSON.stringify(keys)}`;
        const safe = keys.map((k) => `"${k.replace(/"/g, '""')}"`);
        const csv = `${safe.join(",")}\n${
          values.map((v) => keys.map((_, j) => v + j).join(",")).join("\n")
        }\n`;
        const t = await loadTable(csv, { from: "text" });
        _assertClean(before, `${what} CSV`);
        for (const k of keys) {
          if (k.trim() === "") continue;
          assert.ok(t.has(k.trim()), `${what}: column ${JSON.stringify(k)}`);
        }
        // Columns as an object whose own keys are the hostile names (JSON.parse makes
        // "__proto__" an own property), and rows as such objects.
        const cols = JSON.parse(JSON.stringify(Object.fromEntries(keys.map((k) => [k, values]))));
        const colsWithProto = JSON.parse(
          `{"__proto__": ${JSON.stringify(values)}, ${
            keys.map((k) => `${JSON.stringify(k + "_")}: ${JSON.stringify(values)}`).join(",")
          }}`,
        );
        const rows = values.map((v) =>
          JSON.parse(`{${keys.map((k) => `${JSON.stringify(k)}: ${v}`).join(",")}}`)
        );
        for (
          const [how, src] of [["columns", cols], ["__proto__ column", colsWithProto], [
            "rows",
            rows,
          ]] as const
        ) {
          const m = tableFromMemory(src);
          _assertClean(before, `${what} ${how}`);
          for (const name of m.numericNames()) {
            assert.deepEqual(Array.from(m.numeric(name).values).length, values.length);
          }
          // and on through the chain and the survey, whose rows are keyed by column name
          const s = survey(m);
          s.result();
          s.toCSV();
          s.toJSON();
          const first = m.numericNames()[0];
          if (first !== undefined) plumb(m, first).analysis();
          _assertClean(before, `${what} ${how} survey/plumb`);
        }
        const viaMemory = await loadTable(colsWithProto);
        assert.ok(viaMemory.has("__proto__"), `${what}: the __proto__ column is kept as data`);
        _assertClean(before, `${what} loadTable(memory)`);
      },
    ),
    { seed: 20261231, numRuns: runs(150) },
  );
  cases.report();
});
