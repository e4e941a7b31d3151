/**
 * csv-parse (synchronous API), pinned: the one place `lib/` imports it from
 * (see README.md here).
 *
 * @module
 */
export { parse } from "npm:csv-parse@6.2.0/sync";
