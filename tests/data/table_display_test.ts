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
      "column  kind     numbers  missing  text  note",
      "------  -------  -------  -------  ----  " + "-".repeat(48),
      "id      text           0        0     4",
      'v       numeric        2        1     1  text in a numeric column: row 3 (line 4): "oops"',
    ].join("\n"),
  );
  equal(
    b["text/markdown"]!.split("\n")[0],
    '**text: 4 rows, 2 columns (delimiter ",", decimal ".")**',
  );
});
