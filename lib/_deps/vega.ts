/**
 * vega, pinned: the one place `lib/` imports it from (see README.md here).
 *
 * This loads vega's self-contained build (`build/vega.js`, every vega module
 * bundled in one file) rather than the package's entry point, so plumbline
 * works on its own copy of vega: the text measurement it installs for static
 * SVG (`lib/render/svg.ts`) stays inside that copy, and any other use of vega
 * in the same program or notebook kernel, through `npm:vega`, is untouched.
 * Only the types come from the package's entry point.
 *
 * @module
 */
// Full npm: specifiers on purpose: lib/ must resolve without this project's deno.json.
// deno-lint-ignore no-import-prefix
import type * as Vega from "npm:vega@5.33.1";
// deno-lint-ignore no-import-prefix
import bundle from "npm:vega@5.33.1/build/vega.js";

/** plumbline's private copy of vega. */
const vega = bundle as unknown as typeof Vega;
export default vega;
