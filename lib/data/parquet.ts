/**
 * Tables from Parquet files, read with hyparquet (plain JavaScript, every
 * Parquet encoding, and with hyparquet-compressors every codec: snappy,
 * gzip, zstd, brotli, lz4).
 *
 * Each top-level column becomes a column of the table, through the same
 * cell rules as in-memory data: nulls are missing cells; numbers are
 * numbers; 64-bit integers are numbers when a double holds them exactly
 * and text otherwise; strings are read like CSV cells (so `"<0.5"` is
 * censored); dates and timestamps are text; booleans are text.
 *
 * @module
 */
import type { Table } from "./table.ts";
import { PlumbError } from "../errors.ts";
import type { CellOptions } from "./read_options.ts";
import { _dateText, _tableFromPairs } from "./in_memory.ts";

/** Options for {@linkcode tableFromParquet}. */
export interface ParquetOptions extends CellOptions {
  /**
   * The file name shown as the table's source.
   * @default "parquet"
   */
  readonly sourceName?: string;
}

/**
 * Build a table from the bytes of a Parquet file.
 *
 * @param bytes the file's bytes
 * @param options the source name, and how text cells are read
 * @returns a frozen table
 * @throws {PlumbError} `"malformed"` for bytes that are not a readable
 *   Parquet file (the message gives the reader's reason)
 *
 * @example
 * ```ts
 * import { tableFromParquet } from "./parquet.ts";
 * // A Parquet file is at least its magic number at both ends and a footer.
 * let refused = false;
 * try {
 *   await tableFromParquet(new TextEncoder().encode("PAR1 not really PAR1"));
 * } catch (e) {
 *   refused = (e as { code?: string }).code === "malformed";
 * }
 * if (!refused) throw new Error("expected a refusal");
 * ```
 */
export async function tableFromParquet(
  bytes: Uint8Array,
  options: ParquetOptions = {},
): Promise<Table> {
  const source = options.sourceName ?? "parquet";
  const { compressors, parquetMetadata, parquetRead, parquetSchema } = await import(
    "../_deps/hyparquet.ts"
  );
  const file = bytes.slice().buffer as ArrayBuffer;
  const columns = new Map<string, unknown[]>();
  let names: string[];
  try {
    const metadata = parquetMetadata(file);
    const rows = Number(metadata.num_rows);
    names = parquetSchema(metadata).children.map((c) => c.element.name);
    for (const name of names) columns.set(name, new Array(rows).fill(null));
    await parquetRead({
      file,
      compressors,
      onChunk: ({ columnName, columnData, rowStart }) => {
        const target = columns.get(columnName);
        if (target === undefined) return;
        for (let i = 0; i < columnData.length; i++) target[rowStart + i] = columnData[i];
      },
    });
  } catch (e) {
    throw new PlumbError(
      "malformed",
      `Cannot read ${source} as a Parquet file: ${
        String((e as Error)?.message ?? e).split("\n")[0]
      }; check that the file is complete (a Parquet file ends with its footer)`,
      { source },
    );
  }
  const pairs = names.map((n) =>
    [n, (columns.get(n) as unknown[]).map(_cell)] as [string, unknown[]]
  );
  return _tableFromPairs(pairs, options, { source });
}

/** A Parquet value as a cell: dates as text, nested values as JSON text. */
function _cell(v: unknown): unknown {
  if (v instanceof Date) return _dateText(v);
  if (typeof v === "object" && v !== null && !ArrayBuffer.isView(v)) {
    return JSON.stringify(v, (_k, x) => (typeof x === "bigint" ? String(x) : x));
  }
  return v;
}
