/**
 * resvg (WebAssembly build), pinned: the one place `lib/` imports it from
 * (see README.md here). resvg renders SVG to pixels in-process, with no
 * browser, no native add-on and no system fonts (fonts are handed to it as
 * bytes, see arimo_font.ts).
 *
 * @module
 */
export { initWasm, Resvg } from "npm:@resvg/resvg-wasm@2.6.2";

/** Where the package's WebAssembly module lies (a `file:` URL once the package is installed). */
export const RESVG_WASM_URL: string = import.meta.resolve(
  "npm:@resvg/resvg-wasm@2.6.2/index_bg.wasm",
);
