/**
 * Tables from Apache Arrow IPC files and streams (`.arrow`, `.feather` v2,
 * `.ipc`), read with the Arrow library's IPC reader. The columns then take
 * the same path as an in-memory Arrow table: null slots are missing cells,
 * dates are text, 64-bit integers are numbers when a double holds them
 * exactly (see `frame_like.ts`).
 *
 * @module
 */
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import type { CellOptions } from "./read_options.ts";
import { _tableFromPairs } from "./in_memory.ts";
import { frameColumns } from "./frame_like.ts";

/** Options for {@linkcode tableFromArrowFile}. */
export interface ArrowFileOptions extends CellOptions {
  /**
   * The file name shown as the table's source.
   * @default "arrow"
   */
  readonly sourceName?: string;
}

/**
 * Build a table from the bytes of an Arrow IPC file or stream.
 *
 * @param bytes the file's bytes
 * @param options the source name, and how text cells are read
 * @returns a frozen table
 * @throws {PlumbError} `"malformed"` for bytes that are not Arrow IPC
 *
 * @example
 * ```ts
 * import { tableFromArrowFile } from "./arrow_file.ts";
 * let refused = false;
 * try {
 *   await tableFromArrowFile(new TextEncoder().encode("ARROW1 but nothing else"));
 * } catch (e) {
 *   refused = (e as { code?: string }).code === "malformed";
 * }
 * if (!refused) throw new Error("expected a refusal");
 * ```
 */
export async function tableFromArrowFile(
  bytes: Uint8Array,
  options: ArrowFileOptions = {},
): Promise<Table> {
  const source = options.sourceName ?? "arrow";
  const { tableFromIPC } = await import("../_deps/apache_arrow.ts");
  let table: object;
  try {
    table = tableFromIPC(bytes);
  } catch (e) {
    throw new PlumbError(
      "malformed",
      `Cannot read ${source} as an Arrow file: ${
        String((e as Error)?.message ?? e).split("\n")[0]
      }; check that the file is complete`,
      { source },
    );
  }
  const frame = frameColumns(table);
  if (frame === null) {
    throw new PlumbError("malformed", `Cannot read ${source} as an Arrow file: it has no schema`);
  }
  return _tableFromPairs(frame.names.map((n) => [n, frame.read(n)]), options, { source });
}
