/**
 * `loadTable`: the one entry point from a file, CSV text or in-memory data to
 * a {@linkcode Table}.
 *
 * @module
 */
import type { MemorySource } from "./memory_source.ts";
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import { _tableFromCsv, type CsvOptions, tableFromCsv } from "./csv_text.ts";
import { type MemoryOptions, tableFromMemory } from "./in_memory.ts";
import { _isTable } from "./_table_store.ts";
import { checkOptions } from "../results/options.ts";
import { type _BinaryKind, _sniffBinary } from "./_encoding.ts";
import { tableFromWorkbook } from "./workbook.ts";
import { tableFromParquet } from "./parquet.ts";
import { tableFromArrowFile } from "./arrow_file.ts";

/**
 * What `loadTable` accepts: a file path (string or `file:` URL), CSV text,
 * or in-memory data (see `in_memory.ts` for the shapes).
 */
export type TableSource = string | URL | Table | MemorySource;

/** Options for {@linkcode loadTable}. */
export interface LoadTableOptions extends Omit<CsvOptions, "sourceName">, MemoryOptions {
  /**
   * What the source is. With `"auto"`: a `Table` is returned as it is; a
   * string with a line break (`\n` or `\r`) is CSV text; any other string,
   * and a `URL`, is a file path; anything else is in-memory data. A one-line
   * CSV text therefore needs `from: "text"`, and so do CSV bytes (a
   * `Uint8Array`, read with their byte-order mark or `encoding`).
   * @default "auto"
   */
  readonly from?: "auto" | "path" | "text" | "memory";
  /**
   * For an Excel workbook: the sheet to read, by name or 1-based position.
   * @default the first visible sheet
   */
  readonly sheet?: string | number;
}

/** Every option {@linkcode loadTable} knows. */
const LOAD_TABLE_OPTIONS: readonly string[] = Object.freeze([
  "from",
  "delimiter",
  "decimal",
  "thousands",
  "missing",
  "detectionLimits",
  "encoding",
  "sheet",
  "name",
  "reader",
]);

/**
 * Load a table from a file (CSV, Excel workbook, Parquet, Arrow IPC), CSV
 * text or in-memory data.
 *
 * Every cell ends up a number, missing, or text, and each column records how
 * many of each it had and the first text cells with their row (and line).
 * A file's provenance names the file without its folders.
 *
 * @param source a file path, CSV text, or in-memory data
 * @param given how to tell them apart, and how to read the cells (`null`
 *   is no options; an unknown option is refused, naming the nearest one)
 * @returns a frozen table
 * @throws {PlumbError} `"not-found"` when a path does not exist,
 *   `"bad-option"` when it cannot be read or an option is invalid;
 *   `"malformed"` for CSV that cannot be read as a table, naming the line
 *
 * @example
 * ```ts
 * import { loadTable } from "@plumbline/plumbline";
 * const table = await loadTable("volume,line\n500.1,A\n499.7,B\nNA,A\n");
 * const volume = table.numeric("volume");
 * if (volume.values.length !== 2 || volume.provenance.missingDropped !== 1) {
 *   throw new Error("unexpected");
 * }
 * if (table.text("line").values.join() !== "A,B,A") throw new Error("unexpected");
 * ```
 */
export async function loadTable(
  source: TableSource,
  given: LoadTableOptions | null = {},
): Promise<Table> {
  const options = checkOptions(given, LOAD_TABLE_OPTIONS, "loadTable");
  const from = options.from ?? "auto";
  if (!["auto", "path", "text", "memory"].includes(from)) {
    throw new PlumbError(
      "bad-option",
      `Unknown source kind ${JSON.stringify(from)}: use "auto", "path", "text" or "memory"`,
    );
  }
  if (from === "memory" || (from === "auto" && (_isTable(source) || _isMemory(source)))) {
    return tableFromMemory(source, options);
  }
  if (from === "text" || (from === "auto" && typeof source === "string" && /[\r\n]/.test(source))) {
    if (typeof source !== "string" && !(source instanceof Uint8Array)) {
      throw new PlumbError(
        "bad-option",
        'Cannot read this value as CSV text: with from: "text" give a string or its bytes (a Uint8Array)',
      );
    }
    return tableFromCsv(source, options);
  }
  if (typeof source !== "string" && !(source instanceof URL)) {
    throw new PlumbError(
      "bad-option",
      'Cannot read a file path from this value: with from: "path" give a string or URL',
    );
  }
  const buffer = await _readFile(source);
  const sourceName = _baseName(source);
  // Workbooks, Parquet and Arrow files are recognised by their bytes,
  // whatever the file is called (and by their name when the bytes are damaged).
  const kind = _sniffBinary(buffer.bytes) ?? _kindByName(sourceName);
  const reader = kind === "xlsx"
    ? tableFromWorkbook
    : kind === "parquet"
    ? tableFromParquet
    : kind === "arrow" || kind === "arrow-stream"
    ? tableFromArrowFile
    : null;
  if (reader !== null) {
    if (options.sheet !== undefined && kind !== "xlsx") {
      buffer.release();
      throw new PlumbError(
        "bad-option",
        `Cannot pick a sheet of ${sourceName}: it is not an Excel workbook; leave out the sheet option`,
      );
    }
    try {
      return await reader(buffer.bytes, { ...options, sourceName });
    } finally {
      buffer.release();
    }
  }
  if (options.sheet !== undefined) {
    buffer.release();
    throw new PlumbError(
      "bad-option",
      `Cannot pick a sheet of ${sourceName}: it is not an Excel workbook; leave out the sheet option`,
    );
  }
  // The buffer goes back for the next file unless the table keeps it.
  let kept = false;
  try {
    return _tableFromCsv(buffer.bytes, { ...options, sourceName }, () => {
      kept = true;
    });
  } finally {
    if (!kept) buffer.release();
  }
}

/**
 * A read buffer reused from one file to the next. Writing into memory for
 * the first time costs far more than writing it again (the system has to
 * hand out every page), so a large file read into a fresh buffer pays for
 * it once per load. The buffer is held only weakly, so the collector may
 * take it back between loads; it is lent to one load at a time, and a table
 * that keeps its bytes (to cut text from them later) keeps the buffer.
 */
let _spare: WeakRef<Uint8Array> | null = null;

function _borrow(size: number): Uint8Array {
  const old = _spare?.deref();
  _spare = null;
  if (old !== undefined && old.length >= size && old.length <= size + (size >> 3) + (1 << 16)) {
    return old;
  }
  return new Uint8Array(size);
}

/** The kind a file's name suggests, for files whose first bytes are damaged. */
function _kindByName(name: string): _BinaryKind | null {
  const ext = name.toLowerCase().split(".").pop() ?? "";
  if (ext === "xlsx" || ext === "xlsm") return "xlsx";
  if (ext === "parquet") return "parquet";
  if (ext === "arrow" || ext === "feather" || ext === "ipc") return "arrow";
  return null;
}

function _isMemory(source: unknown): boolean {
  return typeof source !== "string" && !(source instanceof URL);
}

function _baseName(path: string | URL): string {
  const s = path instanceof URL ? decodeURIComponent(path.pathname) : path;
  const parts = s.split(/[\\/]/).filter((p) => p !== "");
  return parts.length === 0 ? s : parts[parts.length - 1];
}

async function _readFile(
  path: string | URL,
): Promise<{ bytes: Uint8Array; release: () => void }> {
  const shown = JSON.stringify(path instanceof URL ? path.href : path);
  try {
    using file = await Deno.open(path);
    const info = await file.stat();
    if (info.isDirectory) {
      throw new PlumbError(
        "bad-option",
        `Cannot read ${shown}: it is a folder; give the path of a file inside it`,
        { path: String(path) },
      );
    }
    // A regular file is read in one go into a buffer of its size (faster than
    // Deno.readFile). Pipes, devices and files that report no size (/proc)
    // are read to their end, however long.
    const size = info.isFile ? info.size : 0;
    // One spare byte, so that a final line break can be added without a copy.
    let buffer = _borrow(Math.max(size, 1 << 16) + 1);
    const release = () => {
      _spare = new WeakRef(buffer);
    };
    let filled = 0;
    try {
      for (;;) {
        if (filled === buffer.length - 1) {
          // Full: more only if the source has more (a pipe, or a file that grew).
          const probe = new Uint8Array(1 << 16);
          const got = await file.read(probe);
          if (got === null) break;
          const bigger = new Uint8Array(Math.max(2 * buffer.length, filled + got + 1));
          bigger.set(buffer.subarray(0, filled));
          bigger.set(probe.subarray(0, got), filled);
          buffer = bigger;
          filled += got;
          continue;
        }
        const got = await file.read(buffer.subarray(filled, buffer.length - 1));
        if (got === null) break;
        filled += got;
      }
    } catch (e) {
      release();
      throw e;
    }
    // The spare byte after the content stays free: the CSV reader may end
    // the last line there (UTF-8 text only; a "\n" would break UTF-16).
    return { bytes: buffer.subarray(0, filled), release };
  } catch (e) {
    if (e instanceof PlumbError) throw e;
    if (e instanceof Deno.errors.NotFound) {
      throw new PlumbError(
        "not-found",
        `Cannot read the file ${shown}: it does not exist; check the path, or pass { from: "text" } if this string is CSV text`,
        { path: String(path) },
      );
    }
    if (e instanceof Deno.errors.NotCapable || e instanceof Deno.errors.PermissionDenied) {
      throw new PlumbError(
        "bad-option",
        `Cannot read the file ${shown}: reading is not permitted; run with --allow-read`,
        { path: String(path) },
      );
    }
    throw new PlumbError(
      "bad-option",
      `Cannot read the file ${shown}: ${
        (e as Error).message
      }; check that it is a readable text file`,
      { path: String(path) },
    );
  }
}
