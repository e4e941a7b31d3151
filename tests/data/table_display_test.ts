import { equal } from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { DISPLAY, type MimeBundle } from "../../lib/results/display.ts";

Deno.test("a loaded table displays its columns, counts and first text cells (exact text)", async () => {
  const t = await loadTable("id,v\na,1.5\nb,NA\nc,oops\nd,2\n");
  const b = (t as unknown as { [DISPLAY](): MimeBundle })[DISPLAY]();
  equal(
    b["text/plain"],
    [
      'text: 4 rows, 2 columns (delimiter ",", decimal ".")',
      "column  kind     numbers  censored  missing  text  note",
      "------  -------  -------  --------  -------  ----  " + "-".repeat(48),
      "id      text           0         0        0     4",
      'v       numeric        2         0        1     1  text in a numeric column: row 3 (line 4): "oops"',
    ].join("\n"),
  );
  equal(
    b["text/markdown"]!.split("\n")[0],
    '**text: 4 rows, 2 columns (delimiter ",", decimal ".")**',
  );
});

Deno.test("censored cells are counted apart, with their limits by side", async () => {
  const t = await loadTable("crp;lot\n1,2;A\n<0,5;B\n< 0,5;A\n<0,2;B\n>100;A\n2;A\n");
  const b = (t as unknown as { [DISPLAY](): MimeBundle })[DISPLAY]();
  equal(
    b["text/plain"],
    [
      'text: 6 rows, 2 columns (delimiter ";", decimal ",")',
      "column  kind     numbers  censored  missing  text  note",
      "------  -------  -------  --------  -------  ----  " + "-".repeat(46),
      "crp     numeric        2         4        0     0  censored below 0.2 (1), 0.5 (2); above 100 (1)",
      "lot     text           0         0        0     6",
    ].join("\n"),
  );
});
