/**
 * MIME bundles and the Jupyter display protocol of the Deno kernel: an
 * object with a `[Symbol.for("Jupyter.display")]()` method is shown by the
 * bundle that method returns (the kernel awaits it when it is async).
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";

/** The symbol the Deno Jupyter kernel looks for. */
export const DISPLAY: unique symbol = Symbol.for("Jupyter.display") as never;

/** The Vega-Lite 5 MIME type. */
export const VEGALITE_MIME = "application/vnd.vegalite.v5+json";

/** A display bundle: MIME type → content. `text/plain` is always present. */
export interface MimeBundle {
  /** Plain text, no ANSI codes. */
  readonly "text/plain": string;
  /** HTML (static SVG for charts). */
  readonly "text/html"?: string;
  /** Markdown (tables and cards). */
  readonly "text/markdown"?: string;
  /** A PNG picture, base64 (a chart shown on its own). */
  readonly "image/png"?: string;
  /** A Vega-Lite 5 spec, for front ends that run Vega. */
  readonly "application/vnd.vegalite.v5+json"?: TopLevelSpec;
}

/** Anything the Deno kernel can display. */
export interface Displayable {
  /** Return the bundle to show. */
  [DISPLAY](): MimeBundle | Promise<MimeBundle>;
}

/** A displayable whose bundle is already made: display is synchronous. */
export interface ReadyDisplayable extends Displayable {
  /** The bundle. */
  readonly bundle: MimeBundle;
  /** Return the bundle (no work left to do). */
  [DISPLAY](): MimeBundle;
}

/**
 * Wrap a ready bundle as a displayable, frozen object.
 *
 * @param bundle the bundle to show
 * @example
 * ```ts
 * import { DISPLAY, displayable } from "./display.ts";
 * const d = displayable({ "text/plain": "hello" });
 * const b = await d[DISPLAY]();
 * if (b["text/plain"] !== "hello") throw new Error("display");
 * ```
 */
export function displayable(bundle: MimeBundle): ReadyDisplayable {
  const frozen = Object.freeze({ ...bundle });
  return Object.freeze({
    bundle: frozen,
    [DISPLAY]: () => frozen,
  });
}

/**
 * Wrap a bundle that is computed on first display (and cached) as a
 * displayable, frozen object; `prepare()` computes it ahead of display.
 *
 * @param compute makes the bundle, once
 * @example
 * ```ts
 * import { DISPLAY, lazyDisplayable } from "./display.ts";
 * let calls = 0;
 * const d = lazyDisplayable(() => Promise.resolve({ "text/plain": `call ${++calls}` }));
 * await d[DISPLAY]();
 * const b = await d[DISPLAY]();
 * if (calls !== 1 || b["text/plain"] !== "call 1") throw new Error("cache");
 * ```
 */
export function lazyDisplayable(
  compute: () => Promise<MimeBundle>,
): Displayable & { prepare(): Promise<ReadyDisplayable> } {
  let pending: Promise<MimeBundle> | undefined;
  const get = () => (pending ??= compute().then((b) => Object.freeze({ ...b })));
  return Object.freeze({
    [DISPLAY]: get,
    prepare: async () => displayable(await get()),
  });
}
