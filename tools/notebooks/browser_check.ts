/**
 * Checks executed notebooks the way a reader sees them: exports each one to HTML with
 * nbconvert, opens the page in headless Chromium and checks that
 *
 * - every output that carries a Vega-Lite spec shows a visible picture: a loaded `<img>`
 *   or an SVG with marks in it (the static fallback a reader sees where no Vega-Lite runs),
 * - the page logs no console error and throws no exception,
 * - the page requests nothing but file/data/about/blob URLs (anything else is blocked
 *   before it leaves the machine, and reported),
 * - no script planted in the outputs ran (`window.__pwned` stays undefined; the demo
 *   notebooks show names such as `<img src=x onerror=window.__pwned=1>`),
 *
 * and takes a full-page screenshot of each page. It also renders a small Vega-Lite spec
 * with a range slider through vega-embed and checks that moving the slider changes the
 * text the chart shows.
 *
 * The export uses the `offline_html` template beside this file: the stock page links
 * require.js and MathJax (from a CDN upstream, from system paths on Debian), which a
 * notebook of SVG and HTML outputs does not need.
 *
 * Run: `deno run -A tools/notebooks/browser_check.ts [--out DIR] [NOTEBOOK ...]`
 * (without notebooks it checks notebooks/*.ipynb).
 *
 * @module
 */

import { Browser, DEFAULT_CHROMIUM, isLocalUrl } from "./_cdp.ts";
import { loadVegaBundles, renderVegaLite } from "./vega_page.ts";

/** Jupyter's location on Debian. */
export const DEFAULT_JUPYTER = "/usr/bin/jupyter";

const _VEGALITE = "application/vnd.vegalite.v5+json";
const _TEMPLATE_BASE = new URL(".", import.meta.url).pathname;

/** How to find nbconvert. */
export interface ExportOptions {
  /** Jupyter executable. @default "/usr/bin/jupyter" */
  jupyter?: string;
}

/** Exports one notebook (with its stored outputs; nothing is run) to HTML in `outDir`. */
async function _exportNotebookHtml(
  notebook: string,
  outDir: string,
  options: ExportOptions = {},
): Promise<string> {
  const { jupyter = DEFAULT_JUPYTER } = options;
  const stem = notebook.replace(/^.*\//, "").replace(/\.ipynb$/, "");
  const out = await new Deno.Command(jupyter, {
    args: [
      "nbconvert",
      "--to",
      "html",
      `--TemplateExporter.extra_template_basedirs=${_TEMPLATE_BASE}`,
      "--template",
      "offline_html",
      "--output-dir",
      outDir,
      "--output",
      stem,
      notebook,
    ],
    stdout: "piped",
    stderr: "piped",
  }).output();
  if (!out.success) {
    const err = new TextDecoder().decode(out.stderr).trim().split("\n").slice(-5).join("\n");
    throw new Error(`Cannot export ${notebook} to HTML: nbconvert failed:\n${err}`);
  }
  return `${outDir}/${stem}.html`;
}

/** One output's picture (PNG `<img>` or SVG) as laid out on the page. */
export interface ChartBox {
  /** Index of the output among all outputs of the notebook, in page order. */
  output: number;
  width: number;
  height: number;
  /** Visible path/rect/circle/line/polygon/ellipse/use/text elements inside an SVG; 1 for a loaded image. */
  marks: number;
}

/** What one notebook page showed. */
export interface NotebookPageReport {
  notebook: string;
  html: string;
  screenshot: string;
  /** Every URL the page requested. */
  requests: string[];
  /** Requests that would have left the machine (blocked). */
  external: string[];
  /** Console errors, uncaught exceptions and browser log errors. */
  errors: string[];
  /** The picture with the most marks of each output that carries a Vega-Lite spec. */
  charts: ChartBox[];
  /** True when a script planted in an output ran (`window.__pwned` was set). */
  scriptRan: boolean;
  /** Everything that is wrong, as sentences; empty when the page passed. */
  problems: string[];
}

interface _NbOutput {
  output_type: string;
  data?: Record<string, unknown>;
}

async function _outputsInPageOrder(notebook: string): Promise<_NbOutput[]> {
  const nb = JSON.parse(await Deno.readTextFile(notebook)) as {
    cells: { cell_type: string; outputs?: _NbOutput[] }[];
  };
  return nb.cells.filter((c) => c.cell_type === "code").flatMap((c) => c.outputs ?? []);
}

const _MEASURE = `(() => {
  const marks = "path, rect, circle, line, polygon, polyline, ellipse, use, text";
  const visible = (el) => { const b = el.getBoundingClientRect(); return b.width > 0 || b.height > 0; };
  return [...document.querySelectorAll(".jp-OutputArea-child")].map((child) =>
    [...child.querySelectorAll("svg, img")]
      .filter((pic) => !pic.parentElement.closest("svg"))
      .map((pic) => {
        const b = pic.getBoundingClientRect();
        // A loaded image counts as one mark; an SVG by its visible marks.
        const n = pic.tagName.toLowerCase() === "img"
          ? (pic.complete && pic.naturalWidth > 0 ? 1 : 0)
          : [...pic.querySelectorAll(marks)].filter(visible).length;
        return { width: b.width, height: b.height, marks: n };
      })
  );
})()`;

/** Options for {@linkcode checkNotebookPage}. */
export interface PageCheckOptions extends ExportOptions {
  /** Folder for the HTML and the screenshot. */
  outDir: string;
}

/**
 * Exports `notebook` to HTML, opens it in `browser` and checks it (see the module doc);
 * the report lists every problem found and the path of a full-page screenshot.
 *
 * @example
 * ```ts
 * import assert from "node:assert/strict";
 * import { Browser } from "./_cdp.ts";
 * import { checkNotebookPage } from "./browser_check.ts";
 * import { missingBrowserTools } from "./requirements.ts";
 * if (missingBrowserTools() === undefined) {
 *   const notebook = new URL("../../tests/fixtures/notebooks/smoke.ipynb", import.meta.url).pathname;
 *   const browser = await Browser.launch();
 *   try {
 *     const outDir = await Deno.makeTempDir();
 *     const report = await checkNotebookPage(browser, notebook, { outDir });
 *     assert.deepEqual(report.problems, []);
 *   } finally {
 *     await browser.close();
 *   }
 * }
 * ```
 */
export async function checkNotebookPage(
  browser: Browser,
  notebook: string,
  options: PageCheckOptions,
): Promise<NotebookPageReport> {
  const html = await _exportNotebookHtml(notebook, options.outDir, options);
  const outputs = await _outputsInPageOrder(notebook);
  const page = await browser.newPage();
  try {
    await page.goto(new URL(`file://${await Deno.realPath(html)}`).href, { settleMs: 500 });
    const boxes = await page.evaluate<{ width: number; height: number; marks: number }[][]>(
      _MEASURE,
    );
    const scriptRan = await page.evaluate<boolean>(`typeof window.__pwned !== "undefined"`);
    const screenshot = await page.screenshot(html.replace(/\.html$/, ".png"));
    const problems: string[] = [];
    const charts: ChartBox[] = [];
    if (boxes.length !== outputs.length) {
      problems.push(
        `The page shows ${boxes.length} outputs but the notebook has ${outputs.length}: ` +
          "check the export template",
      );
    } else {
      outputs.forEach((output, index) => {
        if (output.data === undefined || !(_VEGALITE in output.data)) return;
        const svgs = boxes[index];
        const best = svgs.toSorted((a, b) => b.marks - a.marks)[0];
        if (best === undefined || best.width <= 0 || best.height <= 0 || best.marks === 0) {
          problems.push(
            `Output ${index} carries a Vega-Lite chart but shows no visible picture: ` +
              `found ${JSON.stringify(svgs)}`,
          );
        }
        if (best !== undefined) charts.push({ output: index, ...best });
      });
    }
    const record = page.record;
    const external = [
      ...new Set([...record.blocked, ...record.requests.filter((u) => !isLocalUrl(u))]),
    ];
    if (external.length > 0) {
      problems.push(`The page tried to load from outside the machine: ${external.join(", ")}`);
    }
    if (record.errors.length > 0) {
      problems.push(`The page logged errors: ${record.errors.join(" | ")}`);
    }
    if (scriptRan) {
      problems.push("A script planted in an output ran (window.__pwned is set): escape the HTML");
    }
    return {
      notebook,
      html,
      screenshot,
      requests: record.requests,
      external,
      errors: record.errors,
      charts,
      scriptRan,
      problems,
    };
  } finally {
    await page.close();
  }
}

/** A small Vega-Lite spec whose range slider changes the number a text mark shows. */
export const SLIDER_SAMPLE_SPEC = {
  $schema: "https://vega.github.io/schema/vega-lite/v5.json",
  width: 300,
  height: 80,
  data: { values: [{ x: 1 }, { x: 2 }, { x: 3 }] },
  params: [{ name: "k", value: 2, bind: { input: "range", min: 1, max: 5, step: 1 } }],
  transform: [
    { aggregate: [{ op: "sum", field: "x", as: "total" }] },
    { calculate: "'k × sum = ' + format(datum.total * k, 'd')", as: "label" },
  ],
  mark: { type: "text", fontSize: 24 },
  encoding: { text: { field: "label", type: "nominal" } },
};

function _notebooksIn(dir: string): string[] {
  return [...Deno.readDirSync(dir)]
    .filter((e) => e.isFile && e.name.endsWith(".ipynb"))
    .map((e) => `${dir}/${e.name}`)
    .sort();
}

async function _main(args: string[]): Promise<number> {
  let outDir: string | undefined;
  const notebooks: string[] = [];
  for (let i = 0; i < args.length; i++) {
    if (args[i] === "--out") outDir = args[++i];
    else notebooks.push(args[i]);
  }
  if (notebooks.length === 0) {
    notebooks.push(..._notebooksIn(new URL("../../notebooks", import.meta.url).pathname));
  }
  outDir ??= await Deno.makeTempDir({ prefix: "plumbline_pages_" });
  await Deno.mkdir(outDir, { recursive: true });
  const browser = await Browser.launch({ executable: DEFAULT_CHROMIUM });
  let failed = 0;
  try {
    for (const notebook of notebooks) {
      const report = await checkNotebookPage(browser, notebook, { outDir });
      const charts = report.charts.map((c) => `${c.width}x${c.height}/${c.marks} marks`);
      if (report.problems.length === 0) {
        console.log(`ok: ${notebook}: charts ${charts.join(", ") || "none"}`);
      } else {
        failed++;
        for (const p of report.problems) console.error(`FAIL: ${notebook}: ${p}`);
      }
      console.log(`screenshot: ${report.screenshot}`);
    }
    const bundles = await loadVegaBundles();
    const slider = await renderVegaLite(browser, SLIDER_SAMPLE_SPEC, {
      bundles,
      sliderValues: [4],
      outDir,
      name: "slider_sample",
    });
    const before = slider.initialTexts.join(" ");
    const after = slider.steps[0].texts.join(" ");
    const problems = [...slider.record.errors, ...slider.record.blocked];
    if (before === after || problems.length > 0) {
      failed++;
      console.error(`FAIL: slider sample: "${before}" -> "${after}"; ${problems.join(" | ")}`);
    } else console.log(`ok: slider sample: "${before}" -> "${after}"`);
    console.log(`screenshot: ${slider.screenshot}`);
  } finally {
    await browser.close();
  }
  return failed === 0 ? 0 : 1;
}

if (import.meta.main) Deno.exit(await _main(Deno.args));
