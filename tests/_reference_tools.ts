/**
 * Finding the reference tools (R, Python with scipy) for differential tests,
 * and running them. When a tool is missing the caller skips with a message;
 * CI sets PLUMBLINE_REQUIRE_REFERENCE=1 so that a missing tool fails instead.
 *
 * @module
 */

/** Run a command with text on stdin; resolve to stdout, or undefined if it cannot start. */
export async function runTool(
  cmd: string,
  args: string[],
  stdin: string,
): Promise<{ ok: boolean; stdout: string; stderr: string } | undefined> {
  try {
    const child = new Deno.Command(cmd, { args, stdin: "piped", stdout: "piped", stderr: "piped" })
      .spawn();
    const w = child.stdin.getWriter();
    await w.write(new TextEncoder().encode(stdin));
    await w.close();
    const out = await child.output();
    const dec = new TextDecoder();
    return { ok: out.success, stdout: dec.decode(out.stdout), stderr: dec.decode(out.stderr) };
  } catch {
    return undefined;
  }
}

/** Whether a command runs and exits 0 with the given arguments. */
export function toolWorks(cmd: string, args: string[]): boolean {
  try {
    return new Deno.Command(cmd, { args, stdout: "null", stderr: "null" }).outputSync().success;
  } catch {
    return false;
  }
}

/** Python with scipy and statsmodels, as Debian installs it. */
export const PYTHON = "/usr/bin/python3";
/** R's script runner. */
export const RSCRIPT = "Rscript";

/** Whether reference tools must be present (CI). */
export const REQUIRE_REFERENCE = Deno.env.get("PLUMBLINE_REQUIRE_REFERENCE") === "1";

/**
 * Decide whether a differential test runs. Returns true to skip (and says
 * why on the console), throws when CI requires the tool.
 */
export function skipWithout(what: string, available: boolean): boolean {
  if (available) return false;
  const msg = `${what} not found: differential test skipped (install it, see DEVELOPERS.md)`;
  if (REQUIRE_REFERENCE) throw new Error(`${msg}; PLUMBLINE_REQUIRE_REFERENCE=1 forbids skipping`);
  console.warn(`SKIPPED: ${msg}`);
  return true;
}
