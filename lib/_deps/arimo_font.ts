/**
 * The Arimo typeface (regular and bold TrueType files), pinned: the font the
 * raster renderer draws every chart's text with, so a PNG looks the same on
 * every machine whatever fonts it has. Arimo is released under the SIL Open
 * Font License 1.1 (the package's `LICENSE_FONT`) and has the advance widths
 * of Arial/Helvetica, the metrics plumbline measures chart text with.
 *
 * The package's own script targets React Native, so only its `package.json`
 * is imported (which makes Deno install the package); the fonts are read as
 * files from beside it.
 *
 * @module
 */
// A full specifier on purpose: see README.md here.
// deno-lint-ignore no-import-prefix
import _pkg from "npm:@expo-google-fonts/arimo@0.4.3/package.json" with { type: "json" };

const _BASE = import.meta.resolve("npm:@expo-google-fonts/arimo@0.4.3/package.json");

/** The regular and bold faces' files (`file:` URLs once the package is installed). */
export const ARIMO_FONT_URLS: readonly string[] = Object.freeze([
  new URL("400Regular/Arimo_400Regular.ttf", _BASE).href,
  new URL("700Bold/Arimo_700Bold.ttf", _BASE).href,
]);

/** The family name inside the font files. */
export const ARIMO_FAMILY = "Arimo";

/** The package version, for provenance. */
export const ARIMO_VERSION: string = _pkg.version;
