/**
 * Saving any display to a file, the type following the extension. One place
 * for every displayable: a display describes what it can be written as (a
 * {@linkcode SaveSource}), and {@linkcode saveDisplay} picks the writer for
 * the path's extension, writes the file and says what it wrote.
 *
 * | extension         | written from                                            |
 * | ----------------- | ------------------------------------------------------- |
 * | `.html`, `.htm`   | the display's HTML in a static page ({@linkcode staticPage}) |
 * | `.md`, `.markdown`| its `text/markdown`                                     |
 * | `.txt`            | its `text/plain`                                        |
 * | `.json`           | its plain data (`toJSON`)                               |
 * | `.csv`            | its table, where it has one                             |
 * | `.svg`, `.png`    | its chart(s), where it has them                         |
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { composeSvg } from "./compose_svg.ts";
import { escapeHtml } from "./escape.ts";
import { rasterize } from "./raster.ts";

/** The file types a display can be saved as. */
export type SaveFormat = "html" | "md" | "txt" | "json" | "csv" | "svg" | "png";

const _EXTENSIONS: Readonly<Record<string, SaveFormat>> = Object.freeze({
  html: "html",
  htm: "html",
  md: "md",
  markdown: "md",
  txt: "txt",
  json: "json",
  csv: "csv",
  svg: "svg",
  png: "png",
});

/** What a display can be written as. Formats without a writer are refused clearly. */
export interface SaveSource {
  /** What the display is, for messages and page titles, e.g. "QQ plot of fill (mL)". */
  readonly what: string;
  /** Its MIME bundle (HTML, Markdown and plain text are taken from here). */
  readonly bundle: () => MimeBundle | Promise<MimeBundle>;
  /** Its plain data, for `.json`. */
  readonly json?: () => unknown;
  /** Its table as CSV, for `.csv`. */
  readonly csv?: () => string;
  /** Its chart(s) as one SVG document, for `.svg`. */
  readonly svg?: () => string | Promise<string>;
  /** Its chart(s) as a PNG file, for `.png`. */
  readonly png?: () => Uint8Array | Promise<Uint8Array>;
  /**
   * The HTML to put in a saved page, where it differs from the bundle's
   * (a chart on its own saves its SVG inline).
   */
  readonly html?: () => string | Promise<string>;
  /** Where to look for the formats this display does not write, e.g. `.qq().save("qq.png")`. */
  readonly hint?: string;
}

/** What {@linkcode saveDisplay} wrote. */
export interface SavedFile {
  /** The path written, as given. */
  readonly path: string;
  /** The file type written. */
  readonly format: SaveFormat;
  /** The file's size in bytes. */
  readonly bytes: number;
  /** `{ path, format, bytes }`. */
  toJSON(): { path: string; format: SaveFormat; bytes: number };
  /** "Saved <path> (<format>, <bytes> bytes)". */
  toString(): string;
}

/** A display, with the plain data and table it may offer (found by name). */
export interface SavableDisplay extends Displayable {
  /** Its plain data, saved as `.json`. */
  toJSON?(): unknown;
  /** Its table, saved as `.csv`. */
  toCSV?(): string;
}

/** What {@linkcode savable} adds to what a display offers by itself. */
export interface SavableExtras {
  /** Its charts as SVG documents; saved together as one `.svg` or `.png`. */
  readonly charts?: () => readonly string[] | Promise<readonly string[]>;
  /** The HTML of a saved page, where it differs from the display's. */
  readonly html?: () => string | Promise<string>;
  /** Where to look for the formats this display does not write. */
  readonly hint?: string;
}

/**
 * The save source of any display: its bundle (`.html`, `.md`, `.txt`), its
 * `toJSON()` and `toCSV()` where it has them, and its charts (`.svg`, `.png`:
 * one chart as drawn, several side by side in one picture, PNG at 2×). A new
 * display gets every format by giving its `save(path)` this one line:
 * `return saveDisplay(path, savable(this, "what it is", { charts }))`.
 *
 * @param display the display
 * @param what what it is, for messages and page titles
 * @param extras its charts, its page HTML, a hint for formats it lacks
 * @example
 * ```ts
 * import { DISPLAY } from "@plumbline/plumbline";
 * import { saveFormats, savable } from "./save.ts";
 * const d = { [DISPLAY]: () => ({ "text/plain": "n = 3" }), toCSV: () => "n\n3\n" };
 * if (saveFormats(savable(d, "a count")).join() !== "html,md,txt,csv") throw new Error("formats");
 * ```
 */
export function savable(
  display: SavableDisplay,
  what: string,
  extras: SavableExtras = {},
): SaveSource {
  const charts = extras.charts;
  const svg = charts ? async () => composeSvg(await charts(), { title: what }) : undefined;
  return Object.freeze({
    what,
    bundle: () => display[DISPLAY](),
    json: typeof display.toJSON === "function" ? () => display.toJSON!() : undefined,
    csv: typeof display.toCSV === "function" ? () => display.toCSV!() : undefined,
    svg,
    png: svg
      ? async () => (await rasterize(await svg(), { scale: 2, title: what })).png
      : undefined,
    html: extras.html,
    hint: extras.hint,
  });
}

/** The formats a source can be saved as, in the order messages list them. */
export function saveFormats(source: SaveSource): SaveFormat[] {
  const out: SaveFormat[] = [];
  if (source.svg) out.push("svg");
  if (source.png) out.push("png");
  out.push("html", "md", "txt");
  if (source.csv) out.push("csv");
  if (source.json) out.push("json");
  return out;
}

function _list(formats: readonly SaveFormat[]): string {
  const ext = formats.map((f) => `.${f}`);
  return ext.length === 1 ? ext[0] : `${ext.slice(0, -1).join(", ")} or ${ext[ext.length - 1]}`;
}

/**
 * A self-contained static HTML page around a display's HTML: UTF-8, no
 * scripts, no remote loads (pictures are inline), readable offline.
 *
 * @param title the page title (escaped)
 * @param body HTML to put in the page's body, as made by plumbline's renderers
 * @example
 * ```ts
 * import { staticPage } from "./save.ts";
 * const page = staticPage("fill <mL>", "<p>hello</p>");
 * if (!page.startsWith("<!DOCTYPE html>") || !page.includes("<title>fill &lt;mL&gt;</title>")) throw new Error("page");
 * ```
 */
export function staticPage(title: string, body: string): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>body{font-family:sans-serif;background:#ffffff;color:#111111;margin:24px;max-width:1400px}` +
    `h2{border-bottom:1px solid #ccc;padding-bottom:4px;margin-top:32px}img{max-width:100%;height:auto}</style>
</head><body>
${body}
</body></html>
`;
}

/**
 * Write a display to `path`; the file type follows the extension.
 *
 * @param path where to write (the folder must exist); `.svg`, `.png`, `.html`,
 *   `.md`, `.txt`, `.csv` or `.json`, as the display allows
 * @param source what the display can be written as
 * @returns what was written
 * @example
 * ```ts
 * import { saveDisplay } from "./save.ts";
 * const dir = await Deno.makeTempDir();
 * const saved = await saveDisplay(`${dir}/note.md`, {
 *   what: "a note",
 *   bundle: () => ({ "text/plain": "n = 12", "text/markdown": "**n** = 12" }),
 * });
 * if (saved.format !== "md" || (await Deno.readTextFile(saved.path)) !== "**n** = 12\n") throw new Error("md");
 * ```
 */
export async function saveDisplay(path: string, source: SaveSource): Promise<SavedFile> {
  if (typeof path !== "string" || path.trim() === "") {
    throw new PlumbError(
      "bad-option",
      `Cannot save ${source.what}: give a file path such as "chart.png" (the type follows the extension)`,
    );
  }
  const formats = saveFormats(source);
  const ext = path.match(/\.([A-Za-z0-9]+)$/)?.[1]?.toLowerCase();
  const format = ext === undefined ? undefined : _EXTENSIONS[ext];
  if (format === undefined || !formats.includes(format)) {
    const said = ext === undefined ? "a path without an extension" : `".${ext}"`;
    throw new PlumbError(
      "unsupported-format",
      `Cannot save ${source.what} as ${said}: the file type follows the extension, and this ` +
        `display saves as ${_list(formats)}: change the extension` +
        (source.hint ? ` (${source.hint})` : ""),
      { path, formats },
    );
  }
  const content = await _content(format, source);
  const bytes = typeof content === "string" ? new TextEncoder().encode(content) : content;
  try {
    await Deno.writeFile(path, bytes);
  } catch (e) {
    if (e instanceof Deno.errors.NotFound) {
      throw new PlumbError(
        "not-found",
        `Cannot save to ${path}: its folder does not exist: create the folder first`,
      );
    }
    if (e instanceof Deno.errors.NotCapable || e instanceof Deno.errors.PermissionDenied) {
      throw new PlumbError(
        "unavailable",
        `Cannot save to ${path}: ${(e as Error).message}: run Deno with --allow-write ` +
          "(a notebook kernel has it) or choose a folder you can write to",
      );
    }
    throw e;
  }
  const saved = { path, format, bytes: bytes.length };
  return Object.freeze({
    ...saved,
    toJSON: () => ({ ...saved }),
    toString: () => `Saved ${path} (${format}, ${bytes.length} bytes)`,
  });
}

async function _content(format: SaveFormat, source: SaveSource): Promise<string | Uint8Array> {
  switch (format) {
    case "svg":
      return await source.svg!();
    case "png":
      return await source.png!();
    case "csv":
      return source.csv!();
    case "json":
      return JSON.stringify(source.json!(), null, 2) + "\n";
    default: {
      if (format === "html" && source.html) return staticPage(source.what, await source.html());
      const bundle = await source.bundle();
      if (format === "html") {
        const html = bundle["text/html"] ?? `<pre>${escapeHtml(bundle["text/plain"])}</pre>`;
        return staticPage(source.what, html);
      }
      if (format === "md") return (bundle["text/markdown"] ?? bundle["text/plain"]) + "\n";
      return bundle["text/plain"] + "\n";
    }
  }
}
