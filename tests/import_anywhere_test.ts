/**
 * A user imports plumbline by the file URL of its mod.ts from a folder of their own, with
 * no configuration there (no deno.json, no import map, no node_modules): in a plain script
 * and in a notebook run by the Deno Jupyter kernel. The notebook part is skipped (with a
 * message) where Jupyter or the Deno kernel is missing; PLUMBLINE_REQUIRE_NOTEBOOKS=1 makes
 * that a failure.
 */
import assert from "node:assert/strict";
import { missingNotebookTools, PYTHON, skipUnless } from "../tools/notebooks/requirements.ts";

const MOD = new URL("../mod.ts", import.meta.url).href;
const RUNNER = new URL("../tools/notebooks/run_notebooks.py", import.meta.url).pathname;

// Invented measurements (fill volumes, mL); the cell prints the chain's sentence and
// draws its QQ plot, so the npm packages behind the charts must resolve too.
const USER_CODE = `import { plumb } from "${MOD}";
const fills = [500.2, 499.8, 500.5, 500.1, 499.6, 500.9, 500.0, 499.9, 500.3, 500.4, 499.7, 500.6];
const chain = plumb(fills, undefined, { name: "fill (mL)" });
console.log(chain.sentence().text.slice(0, 40));
const bundle = await chain.qq()[Symbol.for("Jupyter.display")]();
console.log("chart", bundle["image/png"].startsWith("iVBORw0KGgo"));
`;

async function emptyFolder(): Promise<string> {
  const dir = await Deno.makeTempDir({ prefix: "plumbline_user_" });
  // Nothing above a temporary folder may configure Deno for it.
  for (let d = dir; d !== "/"; d = d.replace(/\/[^/]*$/, "") || "/") {
    for (const f of ["deno.json", "deno.jsonc", "package.json"]) {
      assert.throws(() => Deno.statSync(`${d}/${f}`), `${d}/${f} would configure the user folder`);
    }
  }
  return dir;
}

Deno.test("a plain script in an empty folder imports mod.ts by file URL", async () => {
  const dir = await emptyFolder();
  try {
    await Deno.writeTextFile(`${dir}/screen.ts`, USER_CODE);
    const out = await new Deno.Command(Deno.execPath(), {
      args: ["run", "--allow-read", "--allow-env", "screen.ts"],
      cwd: dir,
      stdout: "piped",
      stderr: "piped",
    }).output();
    const stdout = new TextDecoder().decode(out.stdout);
    assert.equal(out.code, 0, new TextDecoder().decode(out.stderr));
    assert.match(stdout, /fill \(mL\)/);
    assert.match(stdout, /chart true/);
    assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name), ["screen.ts"]);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test({
  name: "a notebook in an empty folder imports mod.ts by file URL (Deno kernel)",
  ignore: skipUnless("Notebook import test", missingNotebookTools()),
  async fn() {
    const dir = await emptyFolder();
    try {
      const nb = {
        cells: [{
          cell_type: "code",
          execution_count: null,
          id: "cell-0",
          metadata: {},
          outputs: [],
          source: USER_CODE,
        }],
        metadata: { kernelspec: { display_name: "Deno", language: "typescript", name: "deno" } },
        nbformat: 4,
        nbformat_minor: 5,
      };
      await Deno.writeTextFile(`${dir}/screen.ipynb`, JSON.stringify(nb));
      const out = await new Deno.Command(PYTHON, {
        args: [RUNNER, "--write", `${dir}/screen.ipynb`],
        stdout: "piped",
        stderr: "piped",
      }).output();
      const dec = new TextDecoder();
      assert.equal(out.code, 0, dec.decode(out.stdout) + dec.decode(out.stderr));
      const ran = JSON.parse(await Deno.readTextFile(`${dir}/screen.ipynb`));
      const text = ran.cells[0].outputs.map((o: { text?: string | string[] }) =>
        [o.text ?? ""].flat().join("")
      ).join("");
      assert.match(text, /fill \(mL\)/);
      assert.match(text, /chart true/);
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});
