import assert from "node:assert/strict";
import { detectDelimiter } from "../../lib/data/delimiter.ts";

Deno.test("detectDelimiter picks the candidate that splits every line alike", () => {
  const cases: [string, string][] = [
    ["a,b,c\n1,2,3\n", ","],
    ["a;b\n1,5;2,5\n3,5;4\n", ";"],
    ["a\tb\n1\t2\n", "\t"],
    ["a|b\n1|2\n", "|"],
    ['name,"note; more"\nx,"y; z"\n', ","],
    ["a;b;c\n1,5;2;3\n", ";"],
    ["single\n1\n2\n", ","],
    ["", ","],
    ["a,b|c\n1,2|3\n4,5|6\n", ","],
    // A header with a comma in a name, over decimal-comma numbers: ";" splits them.
    ["Zeit;Konzentration, mg/L\n1;2,5\n2;3,1\n3;4,7\n", ";"],
    ["Probe;Wert, µg/L;Lot\n1;2,5;A\n2;3,1;B\n", ";"],
  ];
  for (const [text, expected] of cases) {
    assert.equal(detectDelimiter(text), expected, JSON.stringify(text));
  }
});

Deno.test("detectDelimiter prefers consistency over count", () => {
  // "|" appears twice in the header but not below; ";" once on every line.
  assert.equal(detectDelimiter("a;b||\n1;2\n3;4\n"), ";");
});
