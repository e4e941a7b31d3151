/**
 * The classic Jupyter Notebook page (Debian's `python3-notebook`) served on
 * loopback for the viewer checks: started on a free port with a fresh random
 * token, a throw-away configuration and runtime folder, and its own trust
 * database. By default that database is empty and in memory, so every
 * notebook it serves opens **untrusted**, as it does for a colleague who did
 * not run it; with `trusted: true` every notebook in the folder is signed
 * first (`python3 -m nbformat.sign`, a fresh key), so it opens trusted, as it
 * does for the person who ran it. Stopped (with every kernel it started) by
 * {@linkcode ClassicServer.stop}.
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
  /** Sign every notebook in the folder first, so that each opens trusted. @default false */
  trusted?: boolean;
}

/** A running classic Notebook server on 127.0.0.1. */
export class ClassicServer {
  /** `http://127.0.0.1:PORT` */
  readonly origin: string;
  /** The folder the server serves. */
  readonly root: string;
  /** Whether the notebooks were signed, so that they open trusted. */
  readonly trusted: boolean;
  readonly #token: string;
  readonly #child: Deno.ChildProcess;
  readonly #scratch: string;

  private constructor(
    origin: string,
    root: string,
    trusted: boolean,
    token: string,
    child: Deno.ChildProcess,
    scratch: string,
  ) {
    this.origin = origin;
    this.root = root;
    this.trusted = trusted;
    this.#token = token;
    this.#child = child;
    this.#scratch = scratch;
  }

  /**
   * Serves `root` (a folder of notebooks) on a free loopback port and waits until the
   * server answers.
   */
  static async start(root: string, options: ClassicServerOptions = {}): Promise<ClassicServer> {
    const { python = PYTHON, timeoutMs = 60_000, trusted = false } = options;
    const scratch = await Deno.makeTempDir({ prefix: "plumbline_classic_" });
    const notary = trusted
      ? [
        `--NotebookNotary.db_file=${scratch}/signatures.db`,
        `--NotebookNotary.secret_file=${scratch}/secret`,
      ]
      : ["--NotebookNotary.db_file=:memory:"];
    if (trusted) {
      const notebooks = [...Deno.readDirSync(root)]
        .filter((e) => e.isFile && e.name.endsWith(".ipynb"))
        .map((e) => `${root}/${e.name}`);
      const signed = await new Deno.Command(python, {
        args: ["-m", "nbformat.sign", ...notary, ...notebooks],
        stdout: "null",
        stderr: "piped",
      }).output();
      if (!signed.success) {
        await Deno.remove(scratch, { recursive: true }).catch(() => {});
        throw new Error(`Cannot sign the notebooks: ${new TextDecoder().decode(signed.stderr)}`);
      }
    }
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
        ...notary,
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
    const server = new ClassicServer(origin, root, trusted, token, child, scratch);
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
