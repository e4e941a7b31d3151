/**
 * vega-lite, pinned: the one place `lib/` imports it from (see README.md here).
 *
 * @module
 */
export { compile } from "npm:vega-lite@5.23.0";
export type { Config, TopLevelSpec } from "npm:vega-lite@5.23.0";
