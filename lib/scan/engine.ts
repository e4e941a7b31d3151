/**
 * One embedded DuckDB database per scan: runs the statements of `sql.ts`,
 * reports progress for long queries, stops on request, and turns DuckDB's
 * errors into `PlumbError`s that say what to do. Private to `lib/scan`.
 *
 * @module
 */
import { type DuckDBConnection, type DuckDBInstance, loadDuckDB } from "../_deps/duckdb.ts";
import { PlumbError } from "../errors.ts";

/** Where a scan stands, handed to a progress callback. */
export interface ScanProgress {
  /** What the running query computes, in words. */
  readonly step: string;
  /** Fraction of the current query done, 0…1, or NaN when DuckDB cannot tell. */
  readonly fraction: number;
  /** Seconds since the scan started. */
  readonly elapsed: number;
  /** True on the last report of a finished scan. */
  readonly done: boolean;
}

/** Options for the engine. */
export interface EngineOptions {
  /**
   * Threads DuckDB may use.
   * @default DuckDB's own choice (the number of cores)
   */
  readonly threads?: number;
  /**
   * DuckDB's memory limit, e.g. `"500MB"`; larger intermediate results
   * spill to a temporary folder.
   * @default "500MB"
   */
  readonly memoryLimit?: string;
  /**
   * Stops the scan: the running query is interrupted and the scan rejects
   * with `PlumbError("cancelled")`; nothing partial is kept.
   * @default none
   */
  readonly signal?: AbortSignal;
  /**
   * Called about twice a second once a scan has run for `progressAfter`
   * seconds.
   * @default none
   */
  readonly onProgress?: (p: ScanProgress) => void;
  /**
   * Seconds before progress is first reported.
   * @default 2
   */
  readonly progressAfter?: number;
}

/** The part of a DuckDB data chunk read here. */
interface _Chunk {
  readonly rowCount: number;
  getColumnVector(c: number): { getItem(r: number): unknown };
}

/** A query result as plain rows of plain values (numbers, strings, null). */
export type Rows = (number | string | null)[][];

/** One statement run: what it computes, its SQL text and its seconds. */
export interface Pass {
  /** What the statement computes, in words. */
  readonly step: string;
  /** The SQL text sent to the engine. */
  readonly sql: string;
  /** Seconds it took, results read. */
  readonly seconds: number;
}

/** An open database with one connection. */
export class _Engine {
  readonly #instance: DuckDBInstance;
  readonly #con: DuckDBConnection;
  readonly #options: EngineOptions;
  readonly #start = performance.now();
  #lastStep = "";
  readonly #log: Pass[] = [];

  private constructor(instance: DuckDBInstance, con: DuckDBConnection, options: EngineOptions) {
    this.#instance = instance;
    this.#con = con;
    this.#options = options;
  }

  /** Open an in-memory database with the given limits. */
  static async open(options: EngineOptions = {}): Promise<_Engine> {
    const config: Record<string, string> = { memory_limit: options.memoryLimit ?? "500MB" };
    if (options.threads !== undefined) config.threads = String(options.threads);
    let duckdb: Awaited<ReturnType<typeof loadDuckDB>>;
    try {
      duckdb = await loadDuckDB();
    } catch (e) {
      throw new PlumbError(
        "unavailable",
        `Cannot start DuckDB for a scan: ${e instanceof Error ? e.message : String(e)}; ` +
          `run with --allow-ffi (or -A): DuckDB's native library ships in its npm package`,
      );
    }
    const instance = await duckdb.DuckDBInstance.create(":memory:", config);
    const con = await instance.connect();
    // Progress is tracked only while the progress bar is on (it is never printed by DuckDB), and
    // tracking costs CPU (a seeded sample of 1e8 rows took about twice as long with it on), so
    // it is on only when someone is listening.
    if (options.onProgress) {
      await con.run("SET enable_progress_bar = true");
      await con.run("SET enable_progress_bar_print = false");
    } else await con.run("SET enable_progress_bar = false");
    return new _Engine(instance, con, options);
  }

  /**
   * Run one statement (a materialised result: DuckDB's streaming mode costs
   * several times the CPU here) and hand its chunks to `read`, with progress
   * reports, cancellation, the statement log and DuckDB's errors mapped.
   */
  async #run<T>(
    sql: string,
    step: string,
    subject: string,
    read: (result: { fetchChunk(): Promise<_Chunk | null>; columnCount: number }) => Promise<T>,
  ): Promise<T> {
    const signal = this.#options.signal;
    if (signal?.aborted) throw _cancelled(subject);
    this.#lastStep = step;
    const onAbort = () => this.#con.interrupt();
    signal?.addEventListener("abort", onAbort);
    const timer = this.#options.onProgress ? setInterval(() => this.#report(step), 500) : undefined;
    const t0 = this.elapsed();
    try {
      const out = await read(await this.#con.run(sql));
      this.#log.push(Object.freeze({ step, sql, seconds: +(this.elapsed() - t0).toFixed(3) }));
      return out;
    } catch (e) {
      if (signal?.aborted) throw _cancelled(subject);
      if (e instanceof PlumbError) throw e;
      throw _queryError(e, subject);
    } finally {
      if (timer !== undefined) clearInterval(timer);
      signal?.removeEventListener("abort", onAbort);
    }
  }

  /**
   * Run one statement and return its rows. `step` names the work for
   * progress reports; `subject` names the source in error messages.
   */
  rows(sql: string, step: string, subject: string): Promise<Rows> {
    return this.#run(sql, step, subject, async (result) => {
      const out: Rows = [];
      const width = result.columnCount;
      for (;;) {
        const chunk = await result.fetchChunk();
        if (chunk === null || chunk.rowCount === 0) break;
        const cols = Array.from({ length: width }, (_, c) => chunk.getColumnVector(c));
        for (let r = 0; r < chunk.rowCount; r++) {
          const row: (number | string | null)[] = new Array(width);
          for (let c = 0; c < width; c++) row[c] = _plain(cols[c].getItem(r));
          out.push(row);
        }
      }
      return out;
    });
  }

  /**
   * Run one statement whose single column is a double and return its values
   * in a typed array. When `expected` is given, a different number of rows
   * is an error (the source changed between passes).
   */
  doubles(sql: string, step: string, subject: string, expected?: number): Promise<Float64Array> {
    return this.#run(sql, step, subject, async (result) => {
      let out = new Float64Array(expected ?? 1024);
      let n = 0;
      let more = false;
      for (;;) {
        const chunk = await result.fetchChunk();
        if (chunk === null || chunk.rowCount === 0) break;
        const col = chunk.getColumnVector(0);
        const rows = chunk.rowCount;
        if (n + rows > out.length) {
          if (expected !== undefined) {
            more = true;
            break;
          }
          const grown = new Float64Array(Math.max(2 * out.length, n + rows));
          grown.set(out);
          out = grown;
        }
        for (let r = 0; r < rows; r++) out[n++] = col.getItem(r) as number;
      }
      if (expected !== undefined && (more || n !== expected)) {
        throw new PlumbError(
          "query-failed",
          `Cannot scan ${subject}: a pass read ${
            more ? "more" : n
          } values where the previous one counted ${expected}; the source changed during the ` +
            `scan, so run it again`,
        );
      }
      return expected === undefined ? out.slice(0, n) : out;
    });
  }

  /** Every statement run so far. */
  log(): readonly Pass[] {
    return [...this.#log];
  }

  /** Seconds since the engine opened. */
  elapsed(): number {
    return (performance.now() - this.#start) / 1000;
  }

  /** Send the last progress report (the scan finished). */
  finish(): void {
    const cb = this.#options.onProgress;
    if (cb && this.elapsed() >= (this.#options.progressAfter ?? 2)) {
      cb(Object.freeze({ step: this.#lastStep, fraction: 1, elapsed: this.elapsed(), done: true }));
    }
  }

  #report(step: string): void {
    const cb = this.#options.onProgress;
    const elapsed = this.elapsed();
    if (!cb || elapsed < (this.#options.progressAfter ?? 2)) return;
    let fraction = NaN;
    try {
      const p = this.#con.progress.percentage;
      if (p >= 0) fraction = Math.min(1, p / 100);
    } catch {
      // progress is unavailable between statements
    }
    cb(Object.freeze({ step, fraction, elapsed, done: false }));
  }

  /** Close the connection and the database. */
  close(): void {
    this.#con.closeSync();
    this.#instance.closeSync();
  }
}

/** DuckDB values as plain JSON-able values: counts come back as doubles (the SQL casts them). */
function _plain(v: unknown): number | string | null {
  if (v === null || v === undefined) return null;
  if (typeof v === "number" || typeof v === "string") return v;
  if (typeof v === "bigint") return Number(v);
  if (typeof v === "boolean") return v ? 1 : 0;
  return String(v);
}

function _cancelled(subject: string): PlumbError {
  return new PlumbError(
    "cancelled",
    `The scan of ${subject} was cancelled: nothing was kept; run it again to get a result`,
  );
}

/** Map a DuckDB error to a PlumbError with DuckDB's own message and what to do. */
export function _queryError(e: unknown, subject: string): PlumbError {
  const raw = e instanceof Error ? e.message : String(e);
  const msg = raw.replace(/\s+/g, " ").trim().replace(/[.\s]+$/, "");
  if (/No files found|does not exist|cannot open file|No such file/i.test(msg)) {
    return new PlumbError(
      "not-found",
      `Cannot scan ${subject}: DuckDB says "${msg}"; check the path (relative paths start ` +
        `from the notebook's or program's working folder) or the glob pattern`,
      { engine: raw },
    );
  }
  if (/Referenced column .* not found|column .* does not exist/i.test(msg)) {
    return new PlumbError(
      "unknown-column",
      `Cannot scan ${subject}: DuckDB says "${msg}"; name a column the source has`,
      { engine: raw },
    );
  }
  return new PlumbError(
    "query-failed",
    `Cannot scan ${subject}: DuckDB says "${msg}"; check the file's format or the SQL text, ` +
      `and try the query on its own in DuckDB`,
    { engine: raw },
  );
}
