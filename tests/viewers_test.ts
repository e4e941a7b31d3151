/**
 * The viewer checks (tools/notebooks/viewer_check.ts) tell a visible chart from a missing,
 * blank or wrongly sized one, in the classic Notebook page opened untrusted and in
 * Jupyter's stock HTML export opened without JavaScript. Skipped (with a message) where
 * Chromium, nbconvert or python3-notebook is missing; PLUMBLINE_REQUIRE_NOTEBOOKS=1 makes
 * that a failure.
 */
import assert from "node:assert/strict";
import { Buffer } from "node:buffer";
import { Browser } from "../tools/notebooks/_cdp.ts";
import { ClassicServer } from "../tools/notebooks/classic_server.ts";
import { missingClassicTools, skipUnless } from "../tools/notebooks/requirements.ts";
import { checkClassic, checkExportNoJs, expectedCharts } from "../tools/notebooks/viewer_check.ts";
import { rasterize } from "../lib/render/raster.ts";

const skip = skipUnless("Viewer checks", missingClassicTools());

const CHART_SVG = '<svg xmlns="http://www.w3.org/2000/svg" width="120" height="80">' +
  '<rect width="120" height="80" fill="#ffffff"/><path d="M10 70 L110 10" stroke="#0072B2" ' +
  'stroke-width="3"/><text x="10" y="20" font-size="12">fill (mL)</text></svg>';
const BLANK_SVG = '<svg xmlns="http://www.w3.org/2000/svg" width="120" height="80">' +
  '<rect width="120" height="80" fill="#ffffff"/></svg>';

async function pngB64(svg: string): Promise<string> {
  return Buffer.from((await rasterize(svg)).png).toString("base64");
}

/** A notebook whose stored outputs hold charts in every form the checks must judge. */
async function plantedNotebook(path: string): Promise<void> {
  const png = await pngB64(CHART_SVG);
  const blank = await pngB64(BLANK_SVG);
  const img = (b64: string, w = 120, h = 80) =>
    `<img src="data:image/png;base64,${b64}" width="${w}" height="${h}" alt="chart">`;
  const outputs = [
    // 0: inline SVG in HTML: removed by the untrusted page's sanitiser.
    { "text/html": `<div>${CHART_SVG}</div>`, "text/plain": "svg" },
    // 1: a data-URL PNG in HTML: kept by the sanitiser.
    { "text/html": `<div>${img(png)}</div>`, "text/plain": "img" },
    // 2: a PNG output of its own, shown at its CSS size through the metadata.
    { "image/png": png, "text/plain": "png" },
    // 3: a blank picture.
    { "text/html": img(blank), "text/plain": "blank" },
    // 4: a picture that does not decode (a broken image icon and its alt text).
    { "text/html": img("iVBORw0KGgoAAAAA"), "text/plain": "broken" },
  ];
  const nb = {
    cells: [
      { cell_type: "markdown", id: "m", metadata: {}, source: "# planted" },
      ...outputs.map((data, i) => ({
        cell_type: "code",
        execution_count: i + 1,
        id: `c${i}`,
        metadata: {},
        outputs: [
          { output_type: "stream", name: "stdout", text: "a line\n" },
          {
            output_type: "display_data",
            data,
            metadata: data["image/png"] ? { "image/png": { width: 120, height: 80 } } : {},
          },
        ],
        source: `show(${i})`,
      })),
    ],
    metadata: { kernelspec: { display_name: "Deno", language: "typescript", name: "deno" } },
    nbformat: 4,
    nbformat_minor: 5,
  };
  await Deno.writeTextFile(path, JSON.stringify(nb, null, 1));
}

Deno.test("expectedCharts reads the charts and their sizes from stored outputs", async () => {
  const dir = await Deno.makeTempDir();
  try {
    await plantedNotebook(`${dir}/planted.ipynb`);
    const e = expectedCharts(await Deno.readTextFile(`${dir}/planted.ipynb`));
    assert.equal(e.outputs, 5);
    assert.deepEqual(e.charts.map((c) => [c.cell, c.output, c.width, c.height]), [
      [0, 0, 120, 80],
      [1, 1, 120, 80],
      [2, 2, 120, 80],
      [3, 3, 120, 80],
      [4, 4, 120, 80],
    ]);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test({
  name:
    "viewer checks: classic page untrusted and trusted, JavaScript-free export, judged picture by picture",
  ignore: skip,
  async fn() {
    const root = await Deno.makeTempDir({ prefix: "plumbline_viewers_test_" });
    const out = await Deno.makeTempDir({ prefix: "plumbline_viewers_out_" });
    await plantedNotebook(`${root}/planted.ipynb`);
    const browser = await Browser.launch();
    const server = await ClassicServer.start(root);
    try {
      const classic = await checkClassic(browser, server, "planted.ipynb", out);
      console.log(`screenshot: ${classic.screenshot}`);
      assert.equal(classic.trusted, false);
      assert.deepEqual(classic.charts.map((c) => c.shown !== undefined), [
        false, // the sanitiser removed the SVG
        true,
        true,
        false, // blank
        false, // broken
      ]);
      assert.equal(classic.chartOutputs, 5);
      assert.equal(classic.visibleOutputs, 2);
      assert.match(classic.problems.join("\n"), /^3 of 5 charts do not show/);

      const trustedRoot = await Deno.makeTempDir({ prefix: "plumbline_viewers_trusted_" });
      await plantedNotebook(`${trustedRoot}/planted.ipynb`);
      const trustedServer = await ClassicServer.start(trustedRoot, { trusted: true });
      try {
        const trusted = await checkClassic(browser, trustedServer, "planted.ipynb", out);
        assert.equal(trusted.trusted, true);
        assert.deepEqual(trusted.charts.map((c) => c.shown?.element ?? "none"), [
          "svg", // not sanitised when trusted
          "img",
          "img",
          "none",
          "none",
        ]);
      } finally {
        await trustedServer.stop();
        await Deno.remove(trustedRoot, { recursive: true }).catch(() => {});
      }

      const exported = await checkExportNoJs(browser, `${root}/planted.ipynb`, out);
      console.log(`screenshot: ${exported.screenshot}`);
      assert.deepEqual(exported.charts.map((c) => c.shown?.element ?? "none"), [
        "svg", // no sanitiser in the export
        "img",
        "img",
        "none",
        "none",
      ]);
    } finally {
      await server.stop();
      await browser.close();
      await Deno.remove(root, { recursive: true }).catch(() => {});
    }
  },
});

Deno.test({
  name: "viewer checks: every chart of the demo notebooks shows in every viewer",
  ignore: skip,
  async fn() {
    const dir = new URL("../notebooks/", import.meta.url).pathname;
    const notebooks = [...Deno.readDirSync(dir)]
      .filter((e) => e.isFile && /^0[1-9].*\.ipynb$/.test(e.name))
      .map((e) => e.name)
      .sort();
    assert.ok(notebooks.length >= 3, `demo notebooks: ${notebooks.join(", ")}`);
    const out = await Deno.makeTempDir({ prefix: "plumbline_viewers_demo_" });
    // Served copies: the classic page may save what it opens.
    const roots = await Promise.all(
      [0, 1].map(() => Deno.makeTempDir({ prefix: "plumbline_viewers_served_" })),
    );
    for (const root of roots) {
      for (const nb of notebooks) await Deno.copyFile(`${dir}${nb}`, `${root}/${nb}`);
    }
    const browser = await Browser.launch();
    const untrusted = await ClassicServer.start(roots[0]);
    const trusted = await ClassicServer.start(roots[1], { trusted: true });
    let outputs = 0;
    let withCharts = 0; // the data-in notebook has tables only
    try {
      for (const nb of notebooks) {
        for (
          const report of [
            await checkClassic(browser, untrusted, nb, out),
            await checkClassic(browser, trusted, nb, out),
            await checkExportNoJs(browser, `${dir}${nb}`, out),
          ]
        ) {
          console.log(
            `${report.viewer}: ${nb}: ${report.visibleOutputs} of ${report.chartOutputs} chart ` +
              `outputs visible; screenshot ${report.screenshot}`,
          );
          assert.deepEqual(report.problems, [], `${report.viewer} ${nb}`);
          assert.equal(report.visibleOutputs, report.chartOutputs);
          if (report.viewer === "classic-untrusted") {
            outputs += report.chartOutputs;
            if (report.chartOutputs > 0) withCharts++;
          }
        }
      }
      assert.ok(outputs >= 10, `${outputs} chart outputs in the demo notebooks`);
      assert.ok(withCharts >= 3, `${withCharts} demo notebooks with charts`);
    } finally {
      await untrusted.stop();
      await trusted.stop();
      await browser.close();
      for (const root of roots) await Deno.remove(root, { recursive: true }).catch(() => {});
    }
  },
});
