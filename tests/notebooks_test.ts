/**
 * The demo notebooks reproduce their committed outputs in a real Jupyter kernel, and the
 * runner that checks them fails on error outputs, failed cells, stale outputs and charts
 * without a static picture. Skipped (with a message) where Jupyter or the Deno kernel is
 * missing; PLUMBLINE_REQUIRE_NOTEBOOKS=1 makes that a failure.
 */

import assert from "node:assert/strict";
import { missingNotebookTools, PYTHON, skipUnless } from "../tools/notebooks/requirements.ts";

const RUNNER = new URL("../tools/notebooks/run_notebooks.py", import.meta.url).pathname;
const NOTEBOOKS = new URL("../notebooks", import.meta.url).pathname;
/** The runner's own fixture: hostile names and mixed outputs, not a user notebook. */
const SMOKE = new URL("./fixtures/notebooks/smoke.ipynb", import.meta.url).pathname;
const skip = skipUnless("Notebook execution tests", missingNotebookTools());

interface RunResult {
  code: number;
  stdout: string;
  stderr: string;
}

async function runRunner(args: string[]): Promise<RunResult> {
  const out = await new Deno.Command(PYTHON, {
    args: [RUNNER, ...args],
    stdout: "piped",
    stderr: "piped",
  }).output();
  const dec = new TextDecoder();
  return { code: out.code, stdout: dec.decode(out.stdout), stderr: dec.decode(out.stderr) };
}

interface CellSpec {
  source: string;
  outputs?: unknown[];
}

/** Writes an nbformat 4.5 notebook for the Deno kernel and returns its path. */
async function writeNotebook(dir: string, name: string, cells: CellSpec[]): Promise<string> {
  const nb = {
    cells: cells.map((c, i) => ({
      cell_type: "code",
      execution_count: null,
      id: `cell-${i}`,
      metadata: {},
      outputs: c.outputs ?? [],
      source: c.source,
    })),
    metadata: { kernelspec: { display_name: "Deno", language: "typescript", name: "deno" } },
    nbformat: 4,
    nbformat_minor: 5,
  };
  const path = `${dir}/${name}`;
  await Deno.writeTextFile(path, JSON.stringify(nb, null, 1) + "\n");
  return path;
}

/** A cell whose value displays as the given MIME bundle. */
function displayCell(bundle: Record<string, unknown>): string {
  return `({ [Symbol.for("Jupyter.display")]() { return ${JSON.stringify(bundle)}; } })`;
}

Deno.test({
  name: "run_notebooks --check: every committed notebook reproduces its outputs",
  ignore: skip,
  async fn() {
    const r = await runRunner(["--check", NOTEBOOKS, SMOKE]);
    assert.equal(r.code, 0, `runner failed:\n${r.stdout}\n${r.stderr}`);
    const names = [...Deno.readDirSync(NOTEBOOKS)]
      .filter((e) => e.name.endsWith(".ipynb"))
      .map((e) => e.name);
    assert.ok(names.length >= 3 && !names.includes("smoke.ipynb"), names.join());
    for (const name of [...names, "smoke.ipynb"]) {
      assert.match(r.stdout, new RegExp(`ok: ${name.replace(".", "\\.")}: .*matches`));
    }
  },
});

Deno.test({
  name: "run_notebooks: an error thrown inside a display method fails the run",
  ignore: skip,
  async fn() {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_nb_" });
    try {
      const path = await writeNotebook(dir, "throwing.ipynb", [
        { source: 'console.log("before")' },
        {
          source: '({ [Symbol.for("Jupyter.display")]() { throw new Error("display broke"); } })',
        },
        { source: 'console.log("after")' },
      ]);
      const before = await Deno.readTextFile(path);
      const r = await runRunner(["--write", path]);
      assert.equal(r.code, 1, `runner should fail:\n${r.stdout}\n${r.stderr}`);
      assert.match(r.stderr, /throwing\.ipynb: cell 1 produced an error output/);
      assert.match(r.stderr, /display broke/);
      assert.equal(await Deno.readTextFile(path), before, "a failed run must not write");
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test({
  name: "run_notebooks: a cell that throws fails the run",
  ignore: skip,
  async fn() {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_nb_" });
    try {
      const path = await writeNotebook(dir, "failing.ipynb", [
        { source: "1 + 1" },
        { source: 'throw new Error("cell went wrong")' },
      ]);
      const r = await runRunner(["--check", path]);
      assert.equal(r.code, 1, `runner should fail:\n${r.stdout}\n${r.stderr}`);
      assert.match(r.stderr, /failing\.ipynb: cell 1 /);
      assert.match(r.stderr, /cell went wrong/);
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test({
  name: "run_notebooks: a cell that outlasts --cell-timeout fails the run",
  ignore: skip,
  async fn() {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_nb_" });
    try {
      const path = await writeNotebook(dir, "slow.ipynb", [
        { source: 'await new Promise((r) => setTimeout(r, 30_000));\n"done"' },
      ]);
      // A runner that waited for the cell would see it finish ("done") and report no timeout.
      const r = await runRunner(["--check", "--cell-timeout", "2", path]);
      assert.equal(r.code, 1, `runner should fail:\n${r.stdout}\n${r.stderr}`);
      assert.match(r.stderr, /slow\.ipynb: cell 0 timed out after 2 s/);
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test({
  name: "run_notebooks: --write then --check passes; a changed committed output fails --check",
  ignore: skip,
  async fn() {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_nb_" });
    try {
      const path = await writeNotebook(dir, "stale.ipynb", [
        { source: 'console.log("same every time")' },
        { source: displayCell({ "text/plain": "bold", "text/html": "<b>fresh</b>" }) },
      ]);
      const written = await runRunner(["--write", path]);
      assert.equal(written.code, 0, written.stderr);
      const nb = JSON.parse(await Deno.readTextFile(path));
      assert.deepEqual(nb.cells[0].outputs[0].text, ["same every time\n"]);
      assert.deepEqual(nb.cells[1].outputs[0].data["text/html"], ["<b>fresh</b>"]);

      const clean = await runRunner(["--check", path]);
      assert.equal(clean.code, 0, `fresh outputs should match:\n${clean.stderr}`);

      nb.cells[1].outputs[0].data["text/html"] = ["<b>stale</b>"];
      await Deno.writeTextFile(path, JSON.stringify(nb, null, 1) + "\n");
      const stale = await runRunner(["--check", path]);
      assert.equal(stale.code, 1, `stale output should fail:\n${stale.stdout}`);
      assert.match(
        stale.stderr,
        /stale\.ipynb: cell 1, output 0, text\/html differs at character 3/,
      );
      assert.match(stale.stderr, /committed: '<b>stale<\/b>'/);
      assert.match(stale.stderr, /fresh: {5}'<b>fresh<\/b>'/);
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test({
  name: "run_notebooks: a Vega-Lite output without a static picture fails the run",
  ignore: skip,
  async fn() {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_nb_" });
    try {
      const spec = { mark: "point", data: { values: [{ x: 1 }] } };
      const path = await writeNotebook(dir, "no_svg.ipynb", [
        {
          source: displayCell({
            "text/plain": "chart",
            "text/html": "<p>no picture here</p>",
            "application/vnd.vegalite.v5+json": spec,
          }),
        },
      ]);
      const r = await runRunner(["--write", path]);
      assert.equal(r.code, 1, `runner should fail:\n${r.stdout}\n${r.stderr}`);
      assert.match(r.stderr, /no_svg\.ipynb: cell 0, output 0 carries .*without a static picture/);
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test("skipUnless: a missing tool skips with a message, or fails when CI requires it", async () => {
  const requirements = new URL("../tools/notebooks/requirements.ts", import.meta.url).href;
  const script = `import { skipUnless } from ${JSON.stringify(requirements)};
    console.log(skipUnless("Fake tests", "/nowhere/jupyter is missing: install it"));`;
  const run = async (env: Record<string, string>) => {
    const out = await new Deno.Command(Deno.execPath(), {
      args: ["eval", "--quiet", script],
      env,
      stdout: "piped",
      stderr: "piped",
    }).output();
    const dec = new TextDecoder();
    return { code: out.code, stdout: dec.decode(out.stdout), stderr: dec.decode(out.stderr) };
  };
  const skipped = await run({ PLUMBLINE_REQUIRE_NOTEBOOKS: "" });
  assert.equal(skipped.code, 0, skipped.stderr);
  assert.equal(skipped.stdout.trim(), "true");
  assert.match(skipped.stderr, /SKIPPED: Fake tests skipped: \/nowhere\/jupyter is missing/);
  const required = await run({ PLUMBLINE_REQUIRE_NOTEBOOKS: "1" });
  assert.notEqual(required.code, 0);
  assert.match(required.stderr, /PLUMBLINE_REQUIRE_NOTEBOOKS=1 forbids skipping/);
});
