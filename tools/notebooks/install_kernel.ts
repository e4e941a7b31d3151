/**
 * Registers the Deno Jupyter kernel so that it starts the very deno binary running this
 * script.
 *
 * `deno jupyter --install` writes into kernel.json whichever `deno` comes first on PATH
 * (under `npx` that is a path inside the npx cache; elsewhere it may be a different
 * version, or none at all). This script installs the kernelspec, then rewrites its
 * program to `Deno.execPath()` and checks that the program exists, so the notebooks run
 * under the same Deno as the tests.
 *
 * Run: `deno run --allow-run --allow-read --allow-write --allow-env tools/notebooks/install_kernel.ts`
 *
 * @module
 */

import { KERNEL as KERNEL_NAME } from "./requirements.ts";

/** Where Jupyter keeps the kernelspec named `name`, as `jupyter kernelspec list` reports. */
async function _kernelSpecDir(name: string): Promise<string | undefined> {
  const out = await new Deno.Command("jupyter", {
    args: ["kernelspec", "list", "--json"],
    stdout: "piped",
    stderr: "null",
  }).output();
  if (!out.success) return undefined;
  const listed = JSON.parse(new TextDecoder().decode(out.stdout)) as {
    kernelspecs: Record<string, { resource_dir: string }>;
  };
  return listed.kernelspecs[name]?.resource_dir;
}

async function _main(): Promise<void> {
  const deno = Deno.execPath();
  const install = await new Deno.Command(deno, {
    args: ["jupyter", "--install", "--force", "--name", KERNEL_NAME],
    stdout: "inherit",
    stderr: "inherit",
  }).output();
  if (!install.success) {
    throw new Error(`Cannot register the Deno kernel: '${deno} jupyter --install' failed`);
  }
  const dir = await _kernelSpecDir(KERNEL_NAME);
  if (dir === undefined) {
    throw new Error(
      `Cannot find the kernelspec '${KERNEL_NAME}' after installing it: check that ` +
        "jupyter is installed and on PATH",
    );
  }
  const file = `${dir}/kernel.json`;
  const spec = JSON.parse(await Deno.readTextFile(file)) as { argv: string[] };
  spec.argv[0] = deno;
  await Deno.writeTextFile(file, JSON.stringify(spec, null, 2) + "\n");
  const info = await Deno.stat(spec.argv[0]);
  if (!info.isFile) throw new Error(`Kernel program is not a file: ${spec.argv[0]}`);
  console.log(`Deno kernel '${KERNEL_NAME}' registered in ${file}, starting ${deno}`);
}

if (import.meta.main) await _main();
