/**
 * A headless Chromium driven over the DevTools protocol with Deno's own WebSocket.
 *
 * Every page opened here records each request it makes, lets through only requests for
 * `file:`, `data:`, `about:` and `blob:` URLs (everything else is failed before it leaves
 * the machine, and listed), and collects console errors, uncaught exceptions and
 * browser log errors.
 *
 * @module
 */

/** Chromium's location on Debian. */
export const DEFAULT_CHROMIUM = "/usr/bin/chromium";

/** Schemes a page may load; any other request is blocked and reported. */
const _LOCAL_SCHEMES = ["file:", "data:", "about:", "blob:"];

/**
 * True when a URL stays on this machine (file, data, about or blob).
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { isLocalUrl } from "./_cdp.ts";
 * assert.equal(isLocalUrl(new URL("./page.html", import.meta.url).href), true);
 * assert.equal(isLocalUrl("http://127.0.0.1:9/x.png"), false);
 * ```
 */
export function isLocalUrl(url: string): boolean {
  return _LOCAL_SCHEMES.some((scheme) => url.startsWith(scheme));
}

// deno-lint-ignore no-explicit-any
type _Json = any;

interface _CdpMessage {
  id?: number;
  method?: string;
  params?: _Json;
  result?: _Json;
  error?: { message: string; code: number };
  sessionId?: string;
}

class _Connection {
  #ws: WebSocket;
  #next = 1;
  #pending = new Map<
    number,
    { resolve: (v: _Json) => void; reject: (e: Error) => void; method: string }
  >();
  #listeners = new Set<(m: _CdpMessage) => void>();

  private constructor(ws: WebSocket) {
    this.#ws = ws;
    ws.onmessage = (event) => {
      const msg = JSON.parse(event.data as string) as _CdpMessage;
      if (msg.id !== undefined) {
        const waiter = this.#pending.get(msg.id);
        if (waiter === undefined) return;
        this.#pending.delete(msg.id);
        if (msg.error) {
          waiter.reject(new Error(`DevTools ${waiter.method} failed: ${msg.error.message}`));
        } else waiter.resolve(msg.result);
      } else {
        for (const listener of this.#listeners) listener(msg);
      }
    };
    ws.onclose = () => {
      for (const waiter of this.#pending.values()) {
        waiter.reject(new Error(`DevTools connection closed during ${waiter.method}`));
      }
      this.#pending.clear();
    };
  }

  static connect(url: string): Promise<_Connection> {
    return new Promise((resolve, reject) => {
      const ws = new WebSocket(url);
      ws.onopen = () => resolve(new _Connection(ws));
      ws.onerror = () => reject(new Error(`Cannot connect to Chromium's DevTools at ${url}`));
    });
  }

  send(method: string, params: _Json = {}, sessionId?: string, timeoutMs = 30_000): Promise<_Json> {
    const id = this.#next++;
    const message: _CdpMessage = { id, method, params };
    if (sessionId !== undefined) message.sessionId = sessionId;
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => {
        this.#pending.delete(id);
        reject(new Error(`DevTools ${method} got no answer in ${timeoutMs} ms`));
      }, timeoutMs);
      this.#pending.set(id, {
        resolve: (v) => {
          clearTimeout(timer);
          resolve(v);
        },
        reject: (e) => {
          clearTimeout(timer);
          reject(e);
        },
        method,
      });
      this.#ws.send(JSON.stringify(message));
    });
  }

  listen(listener: (m: _CdpMessage) => void): () => void {
    this.#listeners.add(listener);
    return () => this.#listeners.delete(listener);
  }

  /** Closes the socket and resolves once it is closed. */
  close(): Promise<void> {
    if (this.#ws.readyState === WebSocket.CLOSED) return Promise.resolve();
    const closed = new Promise<void>((resolve) => {
      this.#ws.addEventListener("close", () => resolve(), { once: true });
    });
    this.#ws.close();
    return closed;
  }
}

/** What one page did while it was open. */
export interface PageRecord {
  /** Every URL the page requested, in order. */
  requests: string[];
  /** Requests for anything other than file/data/about/blob URLs: blocked, never sent. */
  blocked: string[];
  /** Console errors, uncaught exceptions and browser log errors, as text. */
  errors: string[];
}

/** One open tab. */
export class Page {
  readonly record: PageRecord = { requests: [], blocked: [], errors: [] };
  #conn: _Connection;
  #session: string;
  #target: string;
  #unlisten: () => void;
  #loads = 0;
  #allow: readonly string[];

  constructor(conn: _Connection, session: string, target: string, allow: readonly string[] = []) {
    this.#conn = conn;
    this.#session = session;
    this.#target = target;
    this.#allow = allow;
    this.#unlisten = conn.listen((m) => {
      if (m.sessionId === session) this.#onEvent(m.method ?? "", m.params ?? {});
    });
  }

  #onEvent(method: string, params: _Json): void {
    switch (method) {
      case "Network.requestWillBeSent":
        this.record.requests.push(params.request.url);
        break;
      case "Fetch.requestPaused": {
        const url: string = params.request.url;
        if (isLocalUrl(url) || this.#allow.some((prefix) => url.startsWith(prefix))) {
          this.send("Fetch.continueRequest", { requestId: params.requestId }).catch(() => {});
        } else {
          this.record.blocked.push(url);
          this.send("Fetch.failRequest", {
            requestId: params.requestId,
            errorReason: "BlockedByClient",
          }).catch(() => {});
        }
        break;
      }
      case "Runtime.consoleAPICalled":
        if (params.type === "error" || params.type === "assert") {
          const parts = (params.args as _Json[]).map((a) =>
            a.value !== undefined ? String(a.value) : a.description ?? a.type
          );
          this.record.errors.push(`console.${params.type}: ${parts.join(" ")}`);
        }
        break;
      case "Runtime.exceptionThrown": {
        const d = params.exceptionDetails;
        this.record.errors.push(`uncaught: ${d.exception?.description ?? d.text}`);
        break;
      }
      case "Log.entryAdded":
        if (params.entry.level === "error") {
          const where = params.entry.url ? ` (${params.entry.url})` : "";
          this.record.errors.push(`log: ${params.entry.text}${where}`);
        }
        break;
      case "Page.loadEventFired":
        this.#loads++;
        break;
    }
  }

  /** Sends a DevTools command to this tab. */
  send(method: string, params: _Json = {}, timeoutMs?: number): Promise<_Json> {
    return this.#conn.send(method, params, this.#session, timeoutMs);
  }

  /** Opens a URL and waits for its load event, then `settleMs` more. */
  async goto(url: string, options: { timeoutMs?: number; settleMs?: number } = {}) {
    const { timeoutMs = 30_000, settleMs = 300 } = options;
    const before = this.#loads;
    const nav = await this.send("Page.navigate", { url });
    if (nav.errorText) throw new Error(`Cannot open ${url}: ${nav.errorText}`);
    const deadline = Date.now() + timeoutMs;
    while (this.#loads === before) {
      if (Date.now() > deadline) throw new Error(`Page did not load in ${timeoutMs} ms: ${url}`);
      await _sleep(25);
    }
    await _sleep(settleMs);
  }

  /** Evaluates an expression in the page and returns its value (promises are awaited). */
  async evaluate<T = _Json>(expression: string): Promise<T> {
    const r = await this.send("Runtime.evaluate", {
      expression,
      returnByValue: true,
      awaitPromise: true,
    });
    if (r.exceptionDetails) {
      const d = r.exceptionDetails;
      throw new Error(`Page script failed: ${d.exception?.description ?? d.text}`);
    }
    return r.result.value as T;
  }

  /** Waits until `expression` is truthy in the page. */
  async waitFor(expression: string, timeoutMs = 10_000): Promise<void> {
    const deadline = Date.now() + timeoutMs;
    while (!(await this.evaluate<boolean>(`Boolean(${expression})`))) {
      if (Date.now() > deadline) throw new Error(`Timed out after ${timeoutMs} ms: ${expression}`);
      await _sleep(50);
    }
  }

  /** Writes a PNG of the whole page (not just the viewport) and returns its path. */
  async screenshot(path: string): Promise<string> {
    const metrics = await this.send("Page.getLayoutMetrics");
    const size = metrics.cssContentSize ?? metrics.contentSize;
    const shot = await this.send("Page.captureScreenshot", {
      format: "png",
      captureBeyondViewport: true,
      clip: {
        x: 0,
        y: 0,
        width: Math.ceil(size.width),
        height: Math.min(Math.ceil(size.height), 16_000),
        scale: 1,
      },
    });
    const bytes = Uint8Array.from(atob(shot.data), (c) => c.charCodeAt(0));
    await Deno.writeFile(path, bytes);
    return path;
  }

  /** Closes the tab. */
  async close(): Promise<void> {
    this.#unlisten();
    await this.#conn.send("Target.closeTarget", { targetId: this.#target }).catch(() => {});
  }
}

/** Options for {@linkcode launchChromium}. */
export interface LaunchOptions {
  /** Chromium binary. @default "/usr/bin/chromium" */
  executable?: string;
  /** How long to wait for the DevTools port, in milliseconds. @default 30000 */
  timeoutMs?: number;
}

/** A running headless Chromium with a throw-away profile. */
export class Browser {
  #conn: _Connection;
  #child: Deno.ChildProcess;
  #profile: string;

  private constructor(conn: _Connection, child: Deno.ChildProcess, profile: string) {
    this.#conn = conn;
    this.#child = child;
    this.#profile = profile;
  }

  /**
   * Starts Chromium headless with a fresh profile and connects to it.
   *
   * @example
   * ```ts
   * import assert from "node:assert/strict";
   * import { Browser } from "./_cdp.ts";
   * import { missingBrowserTools } from "./requirements.ts";
   * if (missingBrowserTools() === undefined) {
   *   const browser = await Browser.launch();
   *   try {
   *     const page = await browser.newPage();
   *     await page.goto("data:text/html,<p id=p>local</p>");
   *     assert.equal(await page.evaluate("document.getElementById('p').textContent"), "local");
   *     assert.deepEqual(page.record.errors, []);
   *   } finally {
   *     await browser.close();
   *   }
   * }
   * ```
   */
  static async launch(options: LaunchOptions = {}): Promise<Browser> {
    const { executable = DEFAULT_CHROMIUM, timeoutMs = 30_000 } = options;
    const profile = await Deno.makeTempDir({ prefix: "plumbline_chromium_" });
    const child = new Deno.Command(executable, {
      args: [
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--disable-extensions",
        "--disable-default-apps",
        "--hide-scrollbars",
        "--force-color-profile=srgb",
        "--window-size=1000,800",
        "--remote-debugging-port=0",
        `--user-data-dir=${profile}`,
        "about:blank",
      ],
      stdin: "null",
      stdout: "null",
      stderr: "null",
    }).spawn();
    const portFile = `${profile}/DevToolsActivePort`;
    const deadline = Date.now() + timeoutMs;
    let lines: string[] = [];
    while (lines.length < 2) {
      if (Date.now() > deadline) {
        child.kill("SIGKILL");
        await child.status;
        throw new Error(`Chromium did not open its DevTools port in ${timeoutMs} ms`);
      }
      await _sleep(50);
      try {
        lines = (await Deno.readTextFile(portFile)).trim().split("\n");
      } catch {
        lines = [];
      }
    }
    try {
      const conn = await _Connection.connect(`ws://127.0.0.1:${lines[0]}${lines[1]}`);
      return new Browser(conn, child, profile);
    } catch (err) {
      child.kill("SIGKILL");
      await child.status;
      await Deno.remove(profile, { recursive: true }).catch(() => {});
      throw err;
    }
  }

  /**
   * Opens a blank tab that records its requests and errors and blocks remote loads.
   * `options.allow` lists URL prefixes it may load besides local files (a loopback
   * server's origin); `options.javascript: false` opens it with scripts disabled.
   */
  async newPage(
    viewport: { width: number; height: number } = { width: 1000, height: 800 },
    options: { allow?: readonly string[]; javascript?: boolean } = {},
  ) {
    const { targetId } = await this.#conn.send("Target.createTarget", { url: "about:blank" });
    const { sessionId } = await this.#conn.send("Target.attachToTarget", {
      targetId,
      flatten: true,
    });
    const page = new Page(this.#conn, sessionId, targetId, options.allow);
    if (options.javascript === false) {
      await page.send("Emulation.setScriptExecutionDisabled", { value: true });
    }
    await page.send("Fetch.enable", { patterns: [{ urlPattern: "*" }] });
    await page.send("Network.enable");
    await page.send("Runtime.enable");
    await page.send("Log.enable");
    await page.send("Page.enable");
    await page.send("Emulation.setDeviceMetricsOverride", {
      ...viewport,
      deviceScaleFactor: 1,
      mobile: false,
    });
    return page;
  }

  /** Closes Chromium and removes its profile. */
  async close(): Promise<void> {
    await this.#conn.send("Browser.close", {}, undefined, 5_000).catch(() => {});
    await this.#conn.close();
    await waitOrKill(this.#child, 5_000);
    await Deno.remove(this.#profile, { recursive: true }).catch(() => {});
  }
}

/** Waits up to `ms` for a child process to exit, then kills it (SIGKILL) and waits. */
export async function waitOrKill(child: Deno.ChildProcess, ms: number): Promise<void> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const exited = await Promise.race([
    child.status,
    new Promise<null>((resolve) => timer = setTimeout(() => resolve(null), ms)),
  ]);
  clearTimeout(timer);
  if (exited === null) {
    child.kill("SIGKILL");
    await child.status;
  }
}

function _sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}
