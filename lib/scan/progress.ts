/**
 * The default progress display of a scan: a line that updates in place in
 * a Deno Jupyter notebook, or on standard error in a terminal; nothing
 * elsewhere (pipes, CI logs). Private to `lib/scan`.
 *
 * @module
 */
import type { ScanProgress } from "./engine.ts";

interface _Jupyter {
  broadcast(type: string, content: Record<string, unknown>): Promise<void> | void;
}

function _line(p: ScanProgress): string {
  const pct = Number.isNaN(p.fraction) ? "" : ` ${Math.round(p.fraction * 100)}%`;
  return p.done
    ? `scan finished in ${p.elapsed.toFixed(1)} s`
    : `scan: ${p.step}${pct} (${p.elapsed.toFixed(1)} s)`;
}

/** A progress callback for the current environment, or undefined where none can be shown. */
export function _progressReporter(): ((p: ScanProgress) => void) | undefined {
  let jupyter: _Jupyter | undefined;
  try {
    // outside `deno jupyter` the namespace is a getter that throws
    jupyter = (Deno as unknown as { jupyter?: _Jupyter }).jupyter;
  } catch {
    jupyter = undefined;
  }
  if (jupyter && typeof jupyter.broadcast === "function") {
    const id = `plumbline-scan-${crypto.randomUUID()}`;
    let shown = false;
    return (p) => {
      const type = shown ? "update_display_data" : "display_data";
      shown = true;
      try {
        // broadcast may return a promise or nothing, depending on the kernel's version
        Promise.resolve(
          jupyter.broadcast(type, {
            data: { "text/plain": _line(p) },
            metadata: {},
            transient: { display_id: id },
          }),
        ).catch(() => {});
      } catch {
        // a progress line that cannot be shown must not stop the scan
      }
    };
  }
  let terminal = false;
  try {
    terminal = Deno.stderr.isTerminal();
  } catch {
    terminal = false;
  }
  if (!terminal) return undefined;
  const enc = new TextEncoder();
  return (p) => {
    Deno.stderr.writeSync(enc.encode(`\r${_line(p).padEnd(60)}${p.done ? "\n" : ""}`));
  };
}
