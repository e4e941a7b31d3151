/**
 * Compare two tables cell by cell: columns, kinds, provenance, every value
 * (bit for bit, so -0 and 0 differ), both masks, the censoring sides and
 * every cell's text.
 *
 * @module
 */
import assert from "node:assert/strict";
import type { Table } from "../../lib/data/table.ts";

/** Assert that two tables hold exactly the same cells and provenance. */
export function assertSameTable(a: Table, b: Table, context: string): void {
  assert.equal(a.rowCount, b.rowCount, `${context}: row count`);
  assert.deepEqual(
    JSON.parse(JSON.stringify(a)),
    JSON.parse(JSON.stringify(b)),
    `${context}: summary`,
  );
  for (const c of a.columns) {
    const x = a.numericCells(c.name);
    const y = b.numericCells(c.name);
    assert.deepEqual(Array.from(x.missing), Array.from(y.missing), `${context}: ${c.name} missing`);
    assert.deepEqual(
      Array.from(x.nonNumeric),
      Array.from(y.nonNumeric),
      `${context}: ${c.name} text`,
    );
    assert.deepEqual(
      x.censor && Array.from(x.censor),
      y.censor && Array.from(y.censor),
      `${context}: ${c.name} censored`,
    );
    for (let i = 0; i < x.values.length; i++) {
      assert.ok(
        Object.is(x.values[i], y.values[i]),
        `${context}: ${c.name} row ${i + 1}: ${x.values[i]} vs ${y.values[i]}`,
      );
    }
    assert.deepEqual(
      a.text(c.name).values,
      b.text(c.name).values,
      `${context}: ${c.name} text values`,
    );
  }
}
