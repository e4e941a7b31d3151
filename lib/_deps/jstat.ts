/**
 * jStat, pinned: the one place `lib/` imports it from (see README.md here).
 *
 * @module
 */
export { default } from "npm:jstat@1.9.6";
