import assert from "node:assert/strict";
import { chartBundle } from "../../lib/render/chart_bundle.ts";
import { _hash } from "../../lib/render/svg.ts";
import { KINDS, specsFor } from "./_samples.ts";

/** A hash of every kind's bundle for a fixed seeded input. */
async function fingerprint(): Promise<string> {
  const specs = specsFor(3000, "cap torque (N·m)", 42);
  const parts: string[] = [];
  for (const kind of KINDS) {
    parts.push(`${kind}:${_hash(JSON.stringify(await chartBundle(specs[kind])))}`);
  }
  return parts.join(" ");
}

if (import.meta.main) {
  // run as a child process by the test below
  console.log(await fingerprint());
} else {
  Deno.test("the same input gives byte-identical bundles, within a process", async () => {
    const specs = specsFor(3000, "cap torque (N·m)", 42);
    for (const kind of KINDS) {
      const a = JSON.stringify(await chartBundle(specs[kind]));
      const b = JSON.stringify(await chartBundle(specsFor(3000, "cap torque (N·m)", 42)[kind]));
      assert.equal(a, b, kind);
    }
  });

  Deno.test("the same input gives byte-identical bundles in a fresh process", async () => {
    const here = await fingerprint();
    const out = await new Deno.Command(Deno.execPath(), {
      args: ["run", "--allow-read", "--allow-env", new URL(import.meta.url).pathname],
      stdout: "piped",
      stderr: "null",
    }).output();
    assert.ok(out.success, "child process ran");
    assert.equal(new TextDecoder().decode(out.stdout).trim(), here);
  });
}
