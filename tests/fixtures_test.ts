/**
 * Every reference fixture names its generator's libraries the same way: a
 * `library` object from library name to version, so a check can always say
 * which reference it was compared with.
 *
 * @module
 */
import assert from "node:assert/strict";

const DIR = new URL("./fixtures/", import.meta.url);

Deno.test("every fixture carries `library`: { name: version, … }, and no other version key", async () => {
  let files = 0;
  for await (const e of Deno.readDir(DIR)) {
    if (!e.isFile || !e.name.endsWith(".json")) continue;
    files++;
    const data = JSON.parse(await Deno.readTextFile(new URL(e.name, DIR)));
    const lib = data.library;
    assert.ok(typeof lib === "object" && lib !== null && !Array.isArray(lib), `${e.name}: library`);
    const entries = Object.entries(lib);
    assert.ok(entries.length > 0, `${e.name}: library names at least one reference`);
    for (const [name, version] of entries) {
      assert.match(String(version), /^\d+\.\d+/, `${e.name}: ${name} has a version number`);
    }
    for (const other of ["libraries", "references"]) {
      assert.equal(data[other], undefined, `${e.name}: "${other}" instead of "library"`);
    }
  }
  assert.ok(files >= 9, `${files} fixture files`);
});
