// The sequence order of rows: numbers, ISO date-times (with offsets), file
// order only when asked, ties kept in file order, missing cells counted, and
// refusals for text that is not a date-time.
import assert from "node:assert/strict";
import { loadTable } from "../../lib/data/load_table.ts";
import { parseIsoTime, sequenceOrder } from "../../lib/data/sequence_order.ts";
import { assertPlumbError } from "../_shared.ts";

Deno.test("sequence order by numbers: ascending, ties in file order, missing counted", async () => {
  const t = await loadTable({ seq: [3, 1, null, 2, 1], v: [1, 2, 3, 4, 5] });
  const o = sequenceOrder(t, "seq");
  assert.deepEqual([...o.rows], [1, 4, 3, 0]);
  assert.equal(o.missing, 1);
  assert.equal(o.tied, 2);
  assert.equal(o.kind, "numbers");
  assert.deepEqual([...sequenceOrder(t, null).rows], [0, 1, 2, 3, 4]);
});

Deno.test("ISO 8601 date-times: dates, minutes, seconds, fractions, offsets", () => {
  const base = Date.UTC(2026, 2, 2);
  assert.equal(parseIsoTime("2026-03-02"), base);
  assert.equal(parseIsoTime("2026-03-02 06:30"), base + 6.5 * 3600e3);
  assert.equal(parseIsoTime("2026-03-02T06:30:15.25Z"), base + (6.5 * 3600 + 15.25) * 1e3);
  assert.equal(parseIsoTime("2026-03-02T08:30+02:00"), base + 6.5 * 3600e3);
  for (const bad of ["02/03/2026", "2026-13-01", "noon", "2026-03-02T25:00"]) {
    assert.ok(Number.isNaN(parseIsoTime(bad)), bad);
  }
});

Deno.test("sequence order refuses text that is not a date-time, text in a numeric column, no values", async () => {
  const t = await loadTable({ at: ["2026-03-02T06:00", "02/03/2026 07:00"], v: [1, 2] });
  assertPlumbError(
    () => sequenceOrder(t, "at"),
    "non-numeric",
    /^Cannot order the rows by at: row 2 holds "02\/03\/2026 07:00", which is neither a number nor an ISO 8601 date-time/,
  );
  const u = await loadTable({ seq: [1, 2, "x", 4, 5], v: [1, 2, 3, 4, 5] });
  assertPlumbError(
    () => sequenceOrder(u, "seq"),
    "non-numeric",
    /^Cannot order the rows by seq: 1 cell holds text \(row 3\)/,
  );
  assertPlumbError(() => sequenceOrder(u, "when"), "unknown-column", /when/);
  const e = await loadTable({ at: [null, null], v: [1, 2] });
  assertPlumbError(() => sequenceOrder(e, "at"), "too-few", /every cell of it is missing/);
});
