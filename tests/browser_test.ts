/**
 * The exported demo notebooks read correctly in a real headless Chromium, the page check
 * catches what it is there to catch, and a Vega-Lite slider rendered through vega-embed
 * changes the text its chart shows. Skipped (with a message) where nbconvert or Chromium
 * is missing; PLUMBLINE_REQUIRE_NOTEBOOKS=1 makes that a failure.
 */

import assert from "node:assert/strict";
import { Browser } from "../tools/notebooks/_cdp.ts";
import { checkNotebookPage, SLIDER_SAMPLE_SPEC } from "../tools/notebooks/browser_check.ts";
import { missingBrowserTools, skipUnless } from "../tools/notebooks/requirements.ts";
import { loadVegaBundles, renderVegaLite, type VegaBundles } from "../tools/notebooks/vega_page.ts";
import { loadTable } from "../lib/data/load_table.ts";
import { lambdaExplorer } from "../lib/plumb/lambda_view.ts";
import { shapiroWilk } from "../lib/stats/shapiro_wilk.ts";

const NOTEBOOKS = new URL("../notebooks", import.meta.url).pathname;
const skip = skipUnless("Browser tests", missingBrowserTools());
const VEGALITE = "application/vnd.vegalite.v5+json";
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

// One Chromium and one set of vega builds serve all steps; each step opens its own tab.
let browser: Browser;
let bundles: VegaBundles;
let dir: string;

async function assertPng(path: string): Promise<void> {
  const bytes = await Deno.readFile(path);
  assert.deepEqual([...bytes.subarray(0, 8)], PNG_SIGNATURE, `${path} is not a PNG`);
  assert.ok(bytes.length > 1000, `${path} is suspiciously small (${bytes.length} bytes)`);
}

/** A notebook with stored outputs only (nothing is executed to export it). */
async function writeOutputsNotebook(path: string, outputs: Record<string, unknown>[]) {
  const nb = {
    cells: outputs.map((data, i) => ({
      cell_type: "code",
      execution_count: i + 1,
      id: `cell-${i}`,
      metadata: {},
      outputs: [{ output_type: "display_data", data, metadata: {} }],
      source: `display(${i})`,
    })),
    metadata: { kernelspec: { display_name: "Deno", language: "typescript", name: "deno" } },
    nbformat: 4,
    nbformat_minor: 5,
  };
  await Deno.writeTextFile(path, JSON.stringify(nb, null, 1));
}

Deno.test({
  name: "browser: exported notebooks and Vega-Lite pages in headless Chromium",
  ignore: skip,
  async fn(t) {
    dir = await Deno.makeTempDir({ prefix: "plumbline_browser_test_" });
    bundles = await loadVegaBundles();
    browser = await Browser.launch();
    try {
      await t.step(
        "every committed notebook shows its charts as pictures, loads nothing remote, runs no planted script",
        async () => {
          const notebooks = [...Deno.readDirSync(NOTEBOOKS)]
            .filter((e) => e.name.endsWith(".ipynb"))
            .map((e) => `${NOTEBOOKS}/${e.name}`)
            .sort();
          assert.ok(notebooks.length > 0, "no notebooks found");
          for (const notebook of notebooks) {
            const report = await checkNotebookPage(browser, notebook, { outDir: dir });
            console.log(`screenshot: ${report.screenshot}`);
            assert.deepEqual(report.problems, [], `${notebook}: ${report.problems.join("\n")}`);
            const nb = JSON.parse(await Deno.readTextFile(notebook));
            const charts = nb.cells.flatMap((c: { outputs?: { data?: object }[] }) =>
              c.outputs ?? []
            )
              .filter((o: { data?: object }) => o.data !== undefined && VEGALITE in o.data).length;
            assert.equal(report.charts.length, charts, `${notebook}: chart count`);
            for (const chart of report.charts) {
              assert.ok(
                chart.width > 0 && chart.height > 0 && chart.marks > 0,
                JSON.stringify(chart),
              );
            }
            assert.equal(report.scriptRan, false);
            assert.ok(report.requests.length > 0, "the page's own load should be recorded");
            await assertPng(report.screenshot);
          }
        },
      );
      await t.step("the smoke notebook's hostile names show as text", async () => {
        const smoke = new URL("./fixtures/notebooks/smoke.ipynb", import.meta.url).pathname;
        const report = await checkNotebookPage(browser, smoke, {
          outDir: dir,
        });
        assert.deepEqual(report.problems, []);
        const html = await Deno.readTextFile(report.html);
        assert.ok(html.includes("&#60;img src=x onerror=window.__pwned=1&#62;"));
        assert.ok(!html.includes("<img src=x onerror"), "the hostile name reached the page raw");
      });
      await t.step(
        "the page check reports planted script, remote loads, console errors and empty charts",
        async () => {
          const notebook = `${dir}/planted.ipynb`;
          await writeOutputsNotebook(notebook, [
            { "text/plain": "raw", "text/html": "<img src=x onerror=window.__pwned=1>" },
            // Loopback only: the request is blocked by the page check before it is sent.
            { "text/plain": "remote", "text/html": '<img src="http://127.0.0.1:9/remote.png">' },
            {
              "text/plain": "noisy",
              "text/html": '<script>console.error("planted error")</script>',
            },
            {
              "text/plain": "empty chart",
              "text/html": '<svg width="100" height="50"></svg>',
              [VEGALITE]: { mark: "point", data: { values: [{ x: 1 }] } },
            },
          ]);
          const report = await checkNotebookPage(browser, notebook, { outDir: dir });
          assert.equal(report.scriptRan, true);
          assert.deepEqual(report.external, ["http://127.0.0.1:9/remote.png"]);
          assert.ok(
            report.errors.some((e) => e.includes("planted error")),
            report.errors.join("\n"),
          );
          const problems = report.problems.join("\n");
          assert.match(problems, /Output 3 carries a Vega-Lite chart but shows no visible picture/);
          assert.match(problems, /tried to load from outside the machine: http:\/\/127\.0\.0\.1:9/);
          assert.match(problems, /logged errors: .*planted error/);
          assert.match(problems, /planted in an output ran/);
          assert.equal(report.problems.length, 4, problems);
        },
      );
      await t.step(
        "moving a Vega-Lite range slider changes the text mark (vega-embed, no CDN)",
        async () => {
          const report = await renderVegaLite(browser, SLIDER_SAMPLE_SPEC, {
            bundles,
            sliderValues: [4, 1],
            outDir: dir,
          });
          console.log(`screenshot: ${report.screenshot}`);
          // The sample sums 1 + 2 + 3 = 6 and multiplies by the slider's k (2 at first).
          assert.deepEqual(report.initialTexts, ["k × sum = 12"]);
          assert.deepEqual(report.steps, [
            { value: 4, texts: ["k × sum = 24"] },
            { value: 1, texts: ["k × sum = 6"] },
          ]);
          assert.deepEqual(report.record.errors, []);
          assert.deepEqual(report.record.blocked, []);
          assert.ok(report.record.requests.every((u) => u.startsWith("file:")));
          await assertPng(report.screenshot);
          const html = await Deno.readTextFile(report.html);
          assert.ok(!/<script[^>]+src=/.test(html), "the page must inline its scripts");
        },
      );
      await t.step(
        "the λ explorer's slider redraws W for the chosen λ (vega-embed, no CDN)",
        async () => {
          // Invented demo data: minutes between stoppages (exponential-like).
          const values = (await loadTable(`${NOTEBOOKS}/../demo/bottling_lab.csv`))
            .numeric("minutes_between_stops").values;
          const spec = lambdaExplorer(() => values, () => "minutes_between_stops").spec;
          const report = await renderVegaLite(browser, spec, {
            bundles,
            sliderValues: [1, 0],
            param: "sel",
            outDir: dir,
            name: "lambda_explorer",
          });
          console.log(`screenshot: ${report.screenshot}`);
          const wText = (texts: string[]) => texts.find((x) => x.includes("W = ")) ?? "";
          // λ = 1 is the data as measured (Box–Cox shifts by −1, W unchanged); λ = 0 is the log.
          const w1 = shapiroWilk(values).statistic.toFixed(4);
          const w0 = shapiroWilk(values.map(Math.log)).statistic.toFixed(4);
          assert.ok(
            wText(report.steps[0].texts).includes(`W = ${w1}`),
            report.steps[0].texts.join(" | "),
          );
          assert.ok(
            wText(report.steps[1].texts).includes(`W = ${w0}`),
            report.steps[1].texts.join(" | "),
          );
          assert.notEqual(wText(report.initialTexts), wText(report.steps[0].texts));
          assert.deepEqual(report.record.errors, []);
          assert.deepEqual(report.record.blocked, []);
          await assertPng(report.screenshot);
        },
      );
      await t.step("renderVegaLite fails clearly when the chart has no slider", async () => {
        const spec = {
          data: { values: [{ t: "still" }] },
          mark: "text",
          encoding: { text: { field: "t" } },
        };
        await assert.rejects(
          renderVegaLite(browser, spec, { bundles, sliderValues: [1], outDir: dir }),
          /The chart has no range slider matching \.vega-bindings input\[type=range\]/,
        );
      });
    } finally {
      await browser.close();
    }
  },
});
