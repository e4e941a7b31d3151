/**
 * What the notebook and browser checks need on the machine, and whether it is there.
 *
 * Each function returns `undefined` when everything is present, or a sentence naming
 * what is missing and how to install it, so tests can skip with that message. CI sets
 * `PLUMBLINE_REQUIRE_NOTEBOOKS=1`, which turns such a skip into a failure.
 *
 * @module
 */

/** Debian's Python, which carries jupyter_client, nbformat and nbconvert. */
export const PYTHON = "/usr/bin/python3";
/** Debian's Jupyter launcher. */
export const JUPYTER = "/usr/bin/jupyter";
/** Debian's Chromium. */
export const CHROMIUM = "/usr/bin/chromium";
/** Name of the Deno kernel the notebooks run in. */
export const KERNEL = "deno";

/** True when a missing tool must fail the tests instead of skipping them. */
export const REQUIRE_NOTEBOOKS = Deno.env.get("PLUMBLINE_REQUIRE_NOTEBOOKS") === "1";

const _INSTALL = "install them with `apt-get install --no-install-recommends jupyter-nbconvert " +
  "python3-nbclient jupyter-client chromium`";

function _isFile(path: string): boolean {
  try {
    return Deno.statSync(path).isFile;
  } catch {
    return false;
  }
}

function _runs(cmd: string, args: string[]): { ok: boolean; stdout: string } {
  try {
    const out = new Deno.Command(cmd, { args, stdout: "piped", stderr: "null" }).outputSync();
    return { ok: out.success, stdout: new TextDecoder().decode(out.stdout) };
  } catch {
    return { ok: false, stdout: "" };
  }
}

/**
 * Says what is missing to execute notebooks: Jupyter, Python's jupyter_client and
 * nbformat, and a registered Deno kernel whose program exists.
 *
 * @example
 * ```ts
 * import { missingNotebookTools } from "./requirements.ts";
 * const missing = missingNotebookTools();
 * console.log(missing ?? "Jupyter and the Deno kernel are ready");
 * ```
 */
export function missingNotebookTools(): string | undefined {
  if (!_isFile(JUPYTER)) return `${JUPYTER} is missing: ${_INSTALL}`;
  if (!_runs(PYTHON, ["-c", "import jupyter_client, nbformat"]).ok) {
    return `${PYTHON} cannot import jupyter_client and nbformat: ${_INSTALL}`;
  }
  const listed = _runs(JUPYTER, ["kernelspec", "list", "--json"]);
  if (!listed.ok) return `\`jupyter kernelspec list\` failed: ${_INSTALL}`;
  const specs = JSON.parse(listed.stdout).kernelspecs as Record<
    string,
    { spec: { argv: string[] } }
  >;
  const register = "register it with `deno run --allow-run --allow-read --allow-write " +
    "--allow-env tools/notebooks/install_kernel.ts`";
  const spec = specs[KERNEL];
  if (spec === undefined) return `No Jupyter kernel named '${KERNEL}': ${register}`;
  const program = spec.spec.argv[0];
  if (!_isFile(program)) {
    return `The '${KERNEL}' kernel starts ${program}, which does not exist: ${register}`;
  }
  return undefined;
}

/**
 * Says what is missing to check exported notebooks in a browser: Jupyter's nbconvert
 * and Chromium.
 *
 * @example
 * ```ts
 * import { missingBrowserTools } from "./requirements.ts";
 * console.log(missingBrowserTools() ?? "nbconvert and Chromium are ready");
 * ```
 */
export function missingBrowserTools(): string | undefined {
  if (!_isFile(JUPYTER)) return `${JUPYTER} is missing: ${_INSTALL}`;
  if (!_runs(PYTHON, ["-c", "import nbconvert"]).ok) {
    return `${PYTHON} cannot import nbconvert: ${_INSTALL}`;
  }
  if (!_isFile(CHROMIUM)) return `${CHROMIUM} is missing: ${_INSTALL}`;
  return undefined;
}

/**
 * Says what is missing to open notebooks in the classic Notebook page: the browser tools
 * and Debian's `python3-notebook`.
 *
 * @example
 * ```ts
 * import { missingClassicTools } from "./requirements.ts";
 * console.log(missingClassicTools() ?? "the classic Notebook page and Chromium are ready");
 * ```
 */
export function missingClassicTools(): string | undefined {
  const browser = missingBrowserTools();
  if (browser !== undefined) return browser;
  if (!_runs(PYTHON, ["-c", "import notebook.notebookapp"]).ok) {
    return `${PYTHON} cannot import notebook.notebookapp: ` +
      "install it with `apt-get install --no-install-recommends python3-notebook`";
  }
  return undefined;
}

/**
 * Decides whether tests that need `what` run: returns true to skip them (after saying
 * why on the console), throws when `PLUMBLINE_REQUIRE_NOTEBOOKS=1` forbids skipping.
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { skipUnless } from "./requirements.ts";
 * assert.equal(skipUnless("A check whose tools are present", undefined), false);
 * ```
 */
export function skipUnless(what: string, missing: string | undefined): boolean {
  if (missing === undefined) return false;
  const message = `${what} skipped: ${missing}`;
  if (REQUIRE_NOTEBOOKS) {
    throw new Error(`${message}; PLUMBLINE_REQUIRE_NOTEBOOKS=1 forbids skipping`);
  }
  console.warn(`SKIPPED: ${message}`);
  return true;
}
