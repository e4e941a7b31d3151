/**
 * Claims of the README that can drift from the code: the list of error codes.
 *
 * @module
 */
import assert from "node:assert/strict";

Deno.test("the README lists every PlumbError code, and no other", async () => {
  const errors = await Deno.readTextFile(new URL("../lib/errors.ts", import.meta.url));
  const union = errors.slice(errors.indexOf("export type PlumbErrorCode"), errors.indexOf(";"));
  const codes = [...union.matchAll(/\|\s*"([a-z-]+)"/g)].map((m) => m[1]).sort();
  assert.ok(codes.length >= 12, codes.join());
  const readme = await Deno.readTextFile(new URL("../README.md", import.meta.url));
  const start = readme.indexOf("throws `PlumbError` with a");
  const listed = readme.slice(start, readme.indexOf(")", start));
  const named = [...listed.matchAll(/`"([a-z-]+)"`/g)].map((m) => m[1]).sort();
  assert.deepEqual(named, codes);
});
