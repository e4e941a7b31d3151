/**
 * The classic Jupyter Notebook page (Debian's `python3-notebook`) served on
 * loopback for the viewer checks: started on a free port with a fresh random
 * token, a throw-away configuration and runtime folder, and an in-memory
 * trust database, so every notebook it serves opens **untrusted**, as it does
 * for a colleague who did not run it. Stopped (with every kernel it started)
 * by {@linkcode ClassicServer.stop}.
 *
 * @module
 */
import { waitOrKill } from "./_cdp.ts";
import { PYTHON } from "./requirements.ts";

/** Options for {@linkcode ClassicServer.start}. */
export interface ClassicServerOptions {
  /** Python that can `import notebook`. @default "/usr/bin/python3" */
  python?: string;
  /** How long to wait for the server to answer, in milliseconds. @default 60000 */
  timeoutMs?: number;
}

/** A running classic Notebook server on 127.0.0.1. */
export class ClassicServer {
  /** `http://127.0.0.1:PORT` */
  readonly origin: string;
  /** The folder the server serves. */
  readonly root: string;
  readonly #token: string;
  readonly #child: Deno.ChildProcess;
  readonly #scratch: string;

  private constructor(
    origin: string,
    root: string,
    token: string,
    child: Deno.ChildProcess,
    scratch: string,
  ) {
    this.origin = origin;
    this.root = root;
    this.#token = token;
    this.#child = child;
    this.#scratch = scratch;
  }

  /**
   * Serves `root` (a folder of notebooks) on a free loopback port and waits until the
   * server answers.
   */
  static async start(root: string, options: ClassicServerOptions = {}): Promise<ClassicServer> {
    const { python = PYTHON, timeoutMs = 60_000 } = options;
    const scratch = await Deno.makeTempDir({ prefix: "plumbline_classic_" });
    const listener = Deno.listen({ hostname: "127.0.0.1", port: 0 });
    const port = (listener.addr as Deno.NetAddr).port;
    listener.close();
    const token = crypto.randomUUID().replaceAll("-", "");
    const child = new Deno.Command(python, {
      args: [
        "-m",
        "notebook",
        "--no-browser",
        "--allow-root",
        "--ip=127.0.0.1",
        `--port=${port}`,
        "--port-retries=0",
        `--notebook-dir=${root}`,
        `--NotebookApp.token=${token}`,
        "--NotebookApp.password=",
        // Nothing is trusted: a fresh, in-memory signature database.
        "--NotebookNotary.db_file=:memory:",
      ],
      env: {
        JUPYTER_CONFIG_DIR: `${scratch}/config`,
        JUPYTER_RUNTIME_DIR: `${scratch}/runtime`,
        IPYTHONDIR: `${scratch}/ipython`,
      },
      stdin: "null",
      stdout: "null",
      stderr: "piped",
    }).spawn();
    const log: string[] = [];
    const reader = child.stderr.pipeThrough(new TextDecoderStream()).getReader();
    (async () => {
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        log.push(value);
      }
    })().catch(() => {});
    const origin = `http://127.0.0.1:${port}`;
    const server = new ClassicServer(origin, root, token, child, scratch);
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      try {
        const r = await fetch(`${origin}/api/status?token=${token}`);
        await r.body?.cancel();
        if (r.ok) return server;
      } catch {
        // not listening yet
      }
      if (Date.now() > deadline) {
        await server.stop();
        throw new Error(
          `The classic Notebook server did not answer on ${origin} in ${timeoutMs} ms:\n` +
            log.join("").split("\n").slice(-10).join("\n"),
        );
      }
      await new Promise((r) => setTimeout(r, 200));
    }
  }

  /** The page URL of a notebook under the root (path relative to it), logged in by token. */
  notebookUrl(relative: string): string {
    const path = relative.split("/").map(encodeURIComponent).join("/");
    return `${this.origin}/notebooks/${path}?token=${this.#token}`;
  }

  /** Shuts the server and its kernels down (SIGTERM, then SIGKILL after 10 s). */
  async stop(): Promise<void> {
    try {
      this.#child.kill("SIGTERM");
    } catch {
      // already gone
    }
    await waitOrKill(this.#child, 10_000);
    await Deno.remove(this.#scratch, { recursive: true }).catch(() => {});
  }
}
