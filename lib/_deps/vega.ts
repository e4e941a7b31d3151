/**
 * vega, pinned: the one place `lib/` imports it from (see README.md here).
 *
 * @module
 */
export * from "npm:vega@5.33.1";
