/**
 * hyparquet and its decompressors, pinned: the one place `lib/` imports
 * them from (see README.md here). hyparquet reads Parquet files in plain
 * JavaScript with no dependencies; hyparquet-compressors adds the codecs
 * beyond snappy (gzip, zstd, brotli, lz4) that writers such as polars
 * use by default. `lib/data/parquet.ts` imports this file only when a
 * Parquet file is loaded.
 *
 * @module
 */
export { parquetMetadata, parquetRead, parquetSchema } from "npm:hyparquet@1.31.5";
export { compressors } from "npm:hyparquet-compressors@1.1.2";
