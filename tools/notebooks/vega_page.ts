/**
 * Renders a Vega-Lite spec in headless Chromium with vega, vega-lite and vega-embed
 * inlined into one HTML page (no CDN, no network), and drives its range sliders.
 *
 * The browser builds come from the npm packages themselves: `npm pack` fetches the
 * tarballs of the exact versions (vega and vega-lite as pinned in deno.json, vega-embed
 * as pinned below) into a temporary folder, and the UMD files under `build/` are read
 * out of them. Nothing is added to the repository.
 *
 * @module
 */

import type { Browser, PageRecord } from "./_cdp.ts";

/** vega-embed release whose UMD build is used (6.x is the line for vega 5 / vega-lite 5). */
export const VEGA_EMBED_VERSION = "6.29.0";

/** The three browser builds, as JavaScript source. */
export interface VegaBundles {
  vega: string;
  vegaLite: string;
  vegaEmbed: string;
  /** Package versions the builds came from. */
  versions: { vega: string; vegaLite: string; vegaEmbed: string };
}

/** Options for {@linkcode loadVegaBundles}. */
export interface BundleOptions {
  /** deno.json to read the vega and vega-lite versions from. @default the repository's */
  denoJson?: string | URL;
  /** npm executable. @default "npm" */
  npm?: string;
}

function _pinned(imports: Record<string, string>, name: string): string {
  const spec = imports[name];
  const match = spec?.match(/^npm:[^@]+@(\d[^/]*)$/);
  if (!match) {
    throw new Error(
      `Cannot find a pinned version of ${name} in deno.json: add "npm:${name}@x.y.z"`,
    );
  }
  return match[1];
}

async function _run(cmd: string, args: string[], cwd: string): Promise<string> {
  const out = await new Deno.Command(cmd, { args, cwd, stdout: "piped", stderr: "piped" })
    .output();
  if (!out.success) {
    const err = new TextDecoder().decode(out.stderr).trim();
    throw new Error(`Command failed: ${cmd} ${args.join(" ")}: ${err}`);
  }
  return new TextDecoder().decode(out.stdout);
}

/**
 * Fetches the vega, vega-lite and vega-embed browser builds with `npm pack`.
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { loadVegaBundles } from "./vega_page.ts";
 * const bundles = await loadVegaBundles();
 * assert.ok(bundles.vegaEmbed.includes("vegaEmbed"));
 * ```
 */
export async function loadVegaBundles(options: BundleOptions = {}): Promise<VegaBundles> {
  const { denoJson = new URL("../../deno.json", import.meta.url), npm = "npm" } = options;
  const config = JSON.parse(await Deno.readTextFile(denoJson)) as {
    imports: Record<string, string>;
  };
  const versions = {
    vega: _pinned(config.imports, "vega"),
    vegaLite: _pinned(config.imports, "vega-lite"),
    vegaEmbed: VEGA_EMBED_VERSION,
  };
  const dir = await Deno.makeTempDir({ prefix: "plumbline_vega_" });
  try {
    await _run(npm, [
      "pack",
      `vega@${versions.vega}`,
      `vega-lite@${versions.vegaLite}`,
      `vega-embed@${versions.vegaEmbed}`,
      "--prefer-offline",
      "--silent",
    ], dir);
    const read = (pkg: string, version: string, file: string) =>
      _run("tar", ["-xzOf", `${pkg}-${version}.tgz`, `package/build/${file}`], dir);
    return {
      vega: await read("vega", versions.vega, "vega.min.js"),
      vegaLite: await read("vega-lite", versions.vegaLite, "vega-lite.min.js"),
      vegaEmbed: await read("vega-embed", versions.vegaEmbed, "vega-embed.min.js"),
      versions,
    };
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
}

function _inlineScript(source: string, name: string): string {
  if (/<\/script/i.test(source)) {
    throw new Error(`Cannot inline ${name}: it contains a closing script tag`);
  }
  return `<script>${source}</script>`;
}

/**
 * A self-contained HTML page that embeds `spec` (SVG renderer, no action menu).
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { vegaPageHtml } from "./vega_page.ts";
 * const bundles = {
 *   vega: "/* vega *\/",
 *   vegaLite: "/* vega-lite *\/",
 *   vegaEmbed: "/* vega-embed *\/",
 *   versions: { vega: "0", vegaLite: "0", vegaEmbed: "0" },
 * };
 * const html = vegaPageHtml({ title: "</script>", mark: "point" }, bundles);
 * assert.ok(html.includes('"title":"\\u003c/script>"'));
 * ```
 */
export function vegaPageHtml(spec: unknown, bundles: VegaBundles): string {
  // Escaping "<" keeps any "</script>" inside the spec's strings from closing the tag.
  const json = JSON.stringify(spec).replace(/</g, "\\u003c");
  return [
    "<!DOCTYPE html>",
    '<html><head><meta charset="utf-8"><title>Vega-Lite check</title>',
    _inlineScript(bundles.vega, "vega"),
    _inlineScript(bundles.vegaLite, "vega-lite"),
    _inlineScript(bundles.vegaEmbed, "vega-embed"),
    "</head><body>",
    '<div id="vis"></div>',
    "<script>",
    `vegaEmbed("#vis", ${json}, { renderer: "svg", actions: false })`,
    "  .then((r) => { window.__view = r.view; window.__ready = true; })",
    "  .catch((e) => { window.__embedError = String(e); console.error(e); });",
    "</script>",
    "</body></html>",
  ].join("\n");
}

/** Options for {@linkcode renderVegaLite}. */
export interface RenderOptions {
  /** Browser builds, from {@linkcode loadVegaBundles}. */
  bundles: VegaBundles;
  /** Values to move the range slider to, one step each. @default [] */
  sliderValues?: number[];
  /** Name of the bound param whose slider to move. @default the first range slider */
  param?: string;
  /** Folder for the page and its screenshot. @default a new temporary folder */
  outDir?: string;
  /** File name stem for the page and screenshot. @default "vega" */
  name?: string;
}

/** What the rendered chart showed, before and after each slider move. */
export interface RenderReport {
  /** Text of the chart's text marks (axis labels excluded) as first drawn. */
  initialTexts: string[];
  /** Text of the text marks after each slider move. */
  steps: { value: number; texts: string[] }[];
  /** Visible marks (path, rect, circle, line, text, …) in the chart's SVG. */
  marks: number;
  /** Requests, blocked requests and errors of the page. */
  record: PageRecord;
  /** The HTML page that was opened. */
  html: string;
  /** Full-page PNG taken after the last step. */
  screenshot: string;
}

const _TEXTS =
  `[...document.querySelectorAll("#vis svg g.mark-text.role-mark text")].map((t) => t.textContent)`;

const _MARKS = `[...document.querySelectorAll(
  "#vis svg path, #vis svg rect, #vis svg circle, #vis svg line, #vis svg text"
)].filter((m) => { const b = m.getBoundingClientRect(); return b.width > 0 || b.height > 0; })
  .length`;

/**
 * Renders `spec` in a new tab, moves its slider through `sliderValues`, reads text marks.
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { Browser } from "./_cdp.ts";
 * import { missingBrowserTools } from "./requirements.ts";
 * import { loadVegaBundles, renderVegaLite } from "./vega_page.ts";
 * if (missingBrowserTools() === undefined) {
 *   const spec = {
 *     params: [{ name: "n", value: 1, bind: { input: "range", min: 1, max: 9, step: 1 } }],
 *     data: { values: [{}] },
 *     transform: [{ calculate: "'n is ' + n", as: "t" }],
 *     mark: "text",
 *     encoding: { text: { field: "t" } },
 *   };
 *   const browser = await Browser.launch();
 *   try {
 *     const bundles = await loadVegaBundles();
 *     const report = await renderVegaLite(browser, spec, { bundles, sliderValues: [7] });
 *     assert.deepEqual(report.initialTexts, ["n is 1"]);
 *     assert.deepEqual(report.steps[0].texts, ["n is 7"]);
 *   } finally {
 *     await browser.close();
 *   }
 * }
 * ```
 */
export async function renderVegaLite(
  browser: Browser,
  spec: unknown,
  options: RenderOptions,
): Promise<RenderReport> {
  const { bundles, sliderValues = [], param, name = "vega" } = options;
  const outDir = options.outDir ?? await Deno.makeTempDir({ prefix: "plumbline_vega_page_" });
  const html = `${outDir}/${name}.html`;
  await Deno.writeTextFile(html, vegaPageHtml(spec, bundles));
  const page = await browser.newPage({ width: 800, height: 600 });
  try {
    await page.goto(new URL(`file://${await Deno.realPath(html)}`).href);
    await page.waitFor("window.__ready || window.__embedError", 20_000);
    const embedError = await page.evaluate<string | undefined>("window.__embedError");
    if (embedError) throw new Error(`vega-embed could not render the spec: ${embedError}`);
    const initialTexts = await page.evaluate<string[]>(_TEXTS);
    const steps: { value: number; texts: string[] }[] = [];
    const selector = param === undefined
      ? ".vega-bindings input[type=range]"
      : `.vega-bindings input[type=range][name=${JSON.stringify(param)}]`;
    for (const value of sliderValues) {
      const found = await page.evaluate<boolean>(`(async () => {
        const input = document.querySelector(${JSON.stringify(selector)});
        if (!input) return false;
        input.value = ${JSON.stringify(String(value))};
        input.dispatchEvent(new Event("input", { bubbles: true }));
        await window.__view.runAsync();
        return true;
      })()`);
      if (!found) throw new Error(`The chart has no range slider matching ${selector}`);
      steps.push({ value, texts: await page.evaluate<string[]>(_TEXTS) });
    }
    const marks = await page.evaluate<number>(_MARKS);
    const screenshot = await page.screenshot(`${outDir}/${name}.png`);
    return { initialTexts, steps, marks, record: page.record, html, screenshot };
  } finally {
    await page.close();
  }
}
