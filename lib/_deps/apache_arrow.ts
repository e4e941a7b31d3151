/**
 * Apache Arrow's JavaScript library, pinned: the one place `lib/` imports it
 * from (see README.md here). Only its IPC reader is used, for Arrow files
 * and streams; in-memory Arrow tables are recognised by their shape and
 * need no import. `lib/data/arrow_file.ts` imports this file only when an
 * Arrow file is loaded.
 *
 * @module
 */
export { tableFromIPC } from "npm:apache-arrow@21.2.0";
