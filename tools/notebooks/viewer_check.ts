/**
 * Does a colleague see the charts? Opens executed notebooks the way people share them and
 * counts the chart outputs that show as a non-blank picture of the chart's size:
 *
 * - `classic-untrusted`: the classic Jupyter Notebook page (Debian `python3-notebook`),
 *   served on loopback by {@linkcode ClassicServer}, where every notebook opens untrusted
 *   (its HTML is sanitised: `<svg>` and styles removed);
 * - `classic-trusted`: the same page with the notebooks signed first, as for the person
 *   who ran them (HTML shown as it is; the page renders no Vega-Lite);
 * - `export-no-js`: Jupyter's own HTML export (`jupyter nbconvert --to html`, the stock
 *   template) opened with JavaScript disabled.
 *
 * A chart output is a display output whose stored data hold a chart: an `<svg>` or a
 * `data:image/png` or `data:image/svg+xml` `<img>` in its HTML, or an `image/png`. Each chart in it must show as a
 * visible `<img>` (loaded) or `<svg>` (with marks) of the chart's width and height (±1 px),
 * whose on-screen pixels are not blank (a screenshot of its box, read back). Screenshots of
 * whole pages land beside the report.
 *
 * Run: `deno run -A tools/notebooks/viewer_check.ts [--out DIR] [NOTEBOOK ...]` (without
 * notebooks: the demo notebooks `notebooks/0[1-9]*.ipynb`).
 *
 * @module
 */
import { Browser, type Page } from "./_cdp.ts";
import { ClassicServer } from "./classic_server.ts";
import { decodePng, inkFraction } from "./png_read.ts";
import { JUPYTER } from "./requirements.ts";

/** The viewers checked. */
export type Viewer = "classic-untrusted" | "classic-trusted" | "export-no-js";

/** A chart the stored notebook holds, with the size it should show at. */
export interface ExpectedChart {
  /** Index of the code cell among the notebook's code cells. */
  cell: number;
  /** Index of the output among the notebook's display outputs (page order). */
  output: number;
  width: number;
  height: number;
}

/** One chart as the viewer showed it. */
export interface SeenChart extends ExpectedChart {
  /** The element that showed it, when one of the right size was found. */
  shown?: { element: "img" | "svg"; width: number; height: number; ink: number };
}

/** What one viewer showed of one notebook. */
export interface ViewerReport {
  viewer: Viewer;
  notebook: string;
  /** Chart outputs in the notebook, and how many of them showed every chart they hold. */
  chartOutputs: number;
  visibleOutputs: number;
  charts: SeenChart[];
  /** Only for the classic page: whether it opened the notebook as trusted. */
  trusted?: boolean;
  screenshot: string;
  problems: string[];
}

interface _Output {
  output_type: string;
  data?: Record<string, unknown>;
}

const _join = (v: unknown) => (Array.isArray(v) ? v.join("") : typeof v === "string" ? v : "");

function _pngSizeB64(b64: string): { width: number; height: number } | undefined {
  const head = atob(b64.slice(0, 44));
  if (head.slice(1, 4) !== "PNG") return undefined;
  const u32 = (i: number) =>
    ((head.charCodeAt(i) << 24) | (head.charCodeAt(i + 1) << 16) |
      (head.charCodeAt(i + 2) << 8) | head.charCodeAt(i + 3)) >>> 0;
  return { width: u32(16), height: u32(20) };
}

/**
 * The charts a notebook's stored outputs hold, with the size each should show at; and the
 * number of display outputs (display_data and execute_result) in page order.
 */
export function expectedCharts(notebookJson: string): { outputs: number; charts: ExpectedChart[] } {
  const nb = JSON.parse(notebookJson) as { cells: { cell_type: string; outputs?: _Output[] }[] };
  const charts: ExpectedChart[] = [];
  let output = 0;
  for (const [cellIndex, cell] of nb.cells.filter((c) => c.cell_type === "code").entries()) {
    for (const o of cell.outputs ?? []) {
      if (o.output_type !== "display_data" && o.output_type !== "execute_result") continue;
      const html = _join(o.data?.["text/html"]);
      if (html) {
        for (const m of html.matchAll(/<(svg|img)\b([^>]*)>/g)) {
          const attrs = m[2];
          if (m[1] === "img" && !/\bsrc="data:image\/(png|svg\+xml)/.test(attrs)) continue;
          const w = attrs.match(/\bwidth="(\d+(?:\.\d+)?)"/);
          const h = attrs.match(/\bheight="(\d+(?:\.\d+)?)"/);
          if (w && h) {
            charts.push({ cell: cellIndex, output, width: Number(w[1]), height: Number(h[1]) });
          }
        }
      } else if (typeof o.data?.["image/png"] === "string") {
        const size = _pngSizeB64(o.data["image/png"] as string);
        const meta = (o as { metadata?: { "image/png"?: { width?: number; height?: number } } })
          .metadata?.["image/png"];
        if (size) {
          charts.push({
            cell: cellIndex,
            output,
            width: meta?.width ?? size.width,
            height: meta?.height ?? size.height,
          });
        }
      }
      output++;
    }
  }
  return { outputs: output, charts };
}

// The pictures in each code cell's outputs, in page order (measured one by one by the
// caller). Code cells map one to one between the stored notebook and both pages (outputs
// do not: the classic page merges neighbouring stream outputs). Classic page:
// .code_cell / .output_wrapper; nbconvert's lab template: .jp-CodeCell / .jp-Cell-outputWrapper.
const _LIST = `(() => {
  const cells = [...document.querySelectorAll(".cell.code_cell, .jp-Cell.jp-CodeCell")];
  window.__plumblinePictures = cells.map((c) =>
    [...c.querySelectorAll(".output_wrapper img, .output_wrapper svg, " +
      ".jp-Cell-outputWrapper img, .jp-Cell-outputWrapper svg")]
      .filter((e) => !e.parentElement.closest("svg")));
  return window.__plumblinePictures.map((pics) => pics.length);
})()`;

const _BOX = (o: number, k: number) =>
  `(() => {
  const e = window.__plumblinePictures[${o}][${k}];
  e.scrollIntoView({ block: "start" });
  const b = e.getBoundingClientRect();
  const style = getComputedStyle(e);
  const shown = b.width > 0 && b.height > 0 && style.visibility !== "hidden" && style.display !== "none";
  const marks = e.tagName.toLowerCase() === "svg"
    ? e.querySelectorAll("path, rect, circle, line, polygon, polyline, ellipse, use, text").length
    : (e.complete && e.naturalWidth > 0 ? 1 : 0);
  return { element: e.tagName.toLowerCase(), x: b.x + scrollX, y: b.y + scrollY,
    width: b.width, height: b.height, shown, marks };
})()`;

interface _Box {
  element: "img" | "svg";
  x: number;
  y: number;
  width: number;
  height: number;
  shown: boolean;
  marks: number;
}

async function _ink(page: Page, b: _Box): Promise<number> {
  const shot = await page.send("Page.captureScreenshot", {
    format: "png",
    clip: { x: b.x, y: b.y, width: b.width, height: b.height, scale: 1 },
  });
  const bytes = Uint8Array.from(atob(shot.data), (c) => c.charCodeAt(0));
  return inkFraction(decodePng(bytes));
}

async function _measure(page: Page, expected: ExpectedChart[]): Promise<SeenChart[]> {
  const counts = await page.evaluate<number[]>(_LIST);
  const seen: SeenChart[] = [];
  // Within a cell, charts are matched to pictures in order: each picture serves one chart.
  let cell = -1;
  let next = 0;
  for (const chart of expected) {
    if (chart.cell !== cell) [cell, next] = [chart.cell, 0];
    const result: SeenChart = { ...chart };
    for (let k = next; k < (counts[chart.cell] ?? 0) && result.shown === undefined; k++) {
      const b = await page.evaluate<_Box>(_BOX(chart.cell, k));
      const fits = Math.abs(b.width - chart.width) <= 1 && Math.abs(b.height - chart.height) <= 1;
      if (!b.shown || b.marks === 0 || !fits) continue;
      const ink = await _ink(page, b);
      if (ink > 0.005) {
        result.shown = { element: b.element, width: b.width, height: b.height, ink };
        next = k + 1;
      }
    }
    seen.push(result);
  }
  return seen;
}

function _summarise(
  viewer: Viewer,
  notebook: string,
  charts: SeenChart[],
  screenshot: string,
  problems: string[],
): ViewerReport {
  const byOutput = new Map<number, boolean>();
  for (const c of charts) byOutput.set(c.output, (byOutput.get(c.output) ?? true) && !!c.shown);
  const missing = charts.filter((c) => !c.shown);
  if (missing.length > 0) {
    problems.push(
      `${missing.length} of ${charts.length} charts do not show as a non-blank picture of ` +
        `their size: ${
          missing.map((c) => `output ${c.output} (${c.width}×${c.height})`).join(", ")
        }`,
    );
  }
  return {
    viewer,
    notebook,
    chartOutputs: byOutput.size,
    visibleOutputs: [...byOutput.values()].filter(Boolean).length,
    charts,
    screenshot,
    problems,
  };
}

const _VIEWPORT = { width: 1400, height: 1000 };

/**
 * Opens a notebook (a path under `server.root`) in the classic Notebook page — untrusted,
 * or trusted when the server signed its notebooks — and reports which charts show.
 */
export async function checkClassic(
  browser: Browser,
  server: ClassicServer,
  notebook: string,
  outDir: string,
): Promise<ViewerReport> {
  const expected = expectedCharts(await Deno.readTextFile(`${server.root}/${notebook}`));
  const page = await browser.newPage(_VIEWPORT, { allow: [`${server.origin}/`] });
  try {
    await page.goto(server.notebookUrl(notebook), { timeoutMs: 60_000, settleMs: 500 });
    await page.waitFor(
      "window.Jupyter && Jupyter.notebook && Jupyter.notebook._fully_loaded",
      60_000,
    );
    const trusted = await page.evaluate<boolean>("Jupyter.notebook.trusted");
    const charts = await _measure(page, expected.charts);
    // The classic page scrolls inside #site; let it grow so the screenshot holds it all.
    await page.evaluate(
      `(() => { const s = document.querySelector("#site"); s.scrollTop = 0; ` +
        `s.style.height = "auto"; s.style.overflow = "visible"; ` +
        `document.body.style.overflow = "visible"; })()`,
    );
    const kind = server.trusted ? "trusted" : "untrusted";
    const screenshot = await page.screenshot(`${outDir}/${_stem(notebook)}.classic-${kind}.png`);
    const problems = trusted === server.trusted
      ? []
      : [`The classic page opened the notebook as ${trusted ? "trusted" : "untrusted"}`];
    return {
      ..._summarise(`classic-${kind}`, notebook, charts, screenshot, problems),
      trusted,
    };
  } finally {
    await page.close();
  }
}

/**
 * Exports a notebook with Jupyter's stock HTML template (nothing is run) and opens the page
 * with JavaScript disabled; reports which charts show.
 */
export async function checkExportNoJs(
  browser: Browser,
  notebook: string,
  outDir: string,
): Promise<ViewerReport> {
  const expected = expectedCharts(await Deno.readTextFile(notebook));
  const stem = _stem(notebook);
  const out = await new Deno.Command(JUPYTER, {
    args: ["nbconvert", "--to", "html", "--output-dir", outDir, "--output", stem, notebook],
    stdout: "piped",
    stderr: "piped",
  }).output();
  if (!out.success) {
    throw new Error(`nbconvert failed on ${notebook}: ${new TextDecoder().decode(out.stderr)}`);
  }
  const page = await browser.newPage(_VIEWPORT, { javascript: false });
  try {
    const html = await Deno.realPath(`${outDir}/${stem}.html`);
    await page.goto(new URL(`file://${html}`).href, { settleMs: 300 });
    const charts = await _measure(page, expected.charts);
    await page.evaluate("scrollTo(0, 0)");
    const screenshot = await page.screenshot(`${outDir}/${stem}.export.png`);
    return _summarise("export-no-js", notebook, charts, screenshot, []);
  } finally {
    await page.close();
  }
}

function _stem(path: string): string {
  return path.replace(/^.*\//, "").replace(/\.ipynb$/, "");
}

async function _main(args: string[]): Promise<number> {
  let outDir: string | undefined;
  let notebooks: string[] = [];
  for (let i = 0; i < args.length; i++) {
    if (args[i] === "--out") outDir = args[++i];
    else notebooks.push(args[i]);
  }
  if (notebooks.length === 0) {
    const dir = new URL("../../notebooks", import.meta.url).pathname;
    notebooks = [...Deno.readDirSync(dir)]
      .filter((e) => e.isFile && /^0[1-9].*\.ipynb$/.test(e.name))
      .map((e) => `${dir}/${e.name}`)
      .sort();
  }
  outDir ??= await Deno.makeTempDir({ prefix: "plumbline_viewers_" });
  await Deno.mkdir(outDir, { recursive: true });
  // Serve copies, so that nothing the page does can touch the notebooks themselves.
  const root = await Deno.makeTempDir({ prefix: "plumbline_served_" });
  for (const nb of notebooks) await Deno.copyFile(nb, `${root}/${_stem(nb)}.ipynb`);
  const trustedRoot = await Deno.makeTempDir({ prefix: "plumbline_served_trusted_" });
  for (const nb of notebooks) await Deno.copyFile(nb, `${trustedRoot}/${_stem(nb)}.ipynb`);
  const browser = await Browser.launch();
  const server = await ClassicServer.start(root);
  const trustedServer = await ClassicServer.start(trustedRoot, { trusted: true });
  let failed = 0;
  try {
    for (const nb of notebooks) {
      for (
        const report of [
          await checkClassic(browser, server, `${_stem(nb)}.ipynb`, outDir),
          await checkClassic(browser, trustedServer, `${_stem(nb)}.ipynb`, outDir),
          await checkExportNoJs(browser, nb, outDir),
        ]
      ) {
        const line = `${report.viewer}: ${_stem(nb)}: ${report.visibleOutputs} of ` +
          `${report.chartOutputs} chart outputs visible (${
            report.charts.filter((c) => c.shown).length
          } of ${report.charts.length} charts); screenshot ${report.screenshot}`;
        console.log(line);
        for (const p of report.problems) console.log(`  ${p}`);
        if (report.problems.length > 0) failed++;
      }
    }
  } finally {
    await server.stop();
    await trustedServer.stop();
    await browser.close();
    await Deno.remove(root, { recursive: true }).catch(() => {});
    await Deno.remove(trustedRoot, { recursive: true }).catch(() => {});
  }
  return failed === 0 ? 0 : 1;
}

if (import.meta.main) Deno.exit(await _main(Deno.args));
