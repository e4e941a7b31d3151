/**
 * vega-lite, pinned: the one place `lib/` imports it from (see README.md here).
 *
 * @module
 */
// deno-lint-ignore no-import-prefix
import type * as VegaLite from "npm:vega-lite@5.23.0";
export { compile } from "npm:vega-lite@5.23.0";
export type { Config } from "npm:vega-lite@5.23.0";

/** A Vega-Lite 5 specification, as vega-lite's own `TopLevelSpec` type describes it. */
export type TopLevelSpec = VegaLite.TopLevelSpec;
