/**
 * Render one chart of every kind (QQ, detrended QQ, histogram, comparison
 * panel, QQ by group, λ explorer) from invented, seeded data to SVG and to
 * PNG (plumbline's own in-process raster), for looking at by eye. With
 * `--browser`, also a headless-Chromium screenshot of each SVG
 * (`KIND.browser.png`, 1 CSS px per pixel), to compare the raster with how a
 * browser draws the same SVG. Not used by the tests.
 *
 * Run: `deno run -A tools/render_png.ts [outdir] [--browser]` (default outdir: `out/charts`).
 *
 * @module
 */
import type { TopLevelSpec } from "vega-lite";
import { rasterize } from "../lib/render/raster.ts";
import { renderSvg } from "../lib/render/svg.ts";
import { comparisonSpec } from "../lib/render/comparison_spec.ts";
import { groupSpec } from "../lib/render/group_spec.ts";
import { histogramSpec } from "../lib/render/histogram_spec.ts";
import { lambdaExplorerSpec } from "../lib/render/lambda_explorer_spec.ts";
import { detrendedSpec, qqSpec } from "../lib/render/qq_spec.ts";
import { histogramData } from "../lib/stats/histogram_data.ts";
import { qqData } from "../lib/stats/qq_data.ts";
import { censoredNormalFit } from "../lib/stats/censored_fit.ts";
import { censoredQqData } from "../lib/stats/censored_qq.ts";
import { censoredSample } from "../lib/stats/censored_sample.ts";
import { seededRandom } from "../lib/numeric/random.ts";
import { Browser } from "./notebooks/_cdp.ts";

/** Invented data: seeded standard normals. */
function normals(n: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  return Float64Array.from({ length: n }, () => rng.normal());
}

const boxCox = (x: Float64Array, l: number) =>
  x.map((v) => (l === 0 ? Math.log(v) : (v ** l - 1) / l));

/** Specs of every chart kind, on an invented bottling-plant sample. */
function specs(): Record<string, TopLevelSpec> {
  const oxygen = normals(400, 11).map((z) => Math.exp(0.9 + 0.55 * z)); // right skewed
  const q = qqData(oxygen);
  const lambdas = Array.from({ length: 31 }, (_, k) => Math.round((-1.5 + k * 0.1) * 10) / 10);
  let logSum = 0;
  for (const v of oxygen) logSum += Math.log(v);
  const logLik = lambdas.map((l) => {
    const y = boxCox(oxygen, l);
    const m = y.reduce((a, b) => a + b, 0) / y.length;
    const ss = y.reduce((a, b) => a + (b - m) ** 2, 0);
    return (-y.length / 2) * Math.log(ss / y.length) + (l - 1) * logSum;
  });
  const fills = [0, 1, 2].map((k) =>
    normals(80 + 30 * k, 20 + k).map((z) => 500 + 0.4 * k + (0.6 + 0.2 * k) * z)
  );
  // Residual chlorine, the lowest reported as "<0.05" or "<0.08" (two lab limits).
  const chlorine = normals(120, 31).map((z) => 0.12 + 0.05 * z);
  const limit = chlorine.map((_, i) => (i % 3 === 0 ? 0.08 : 0.05));
  const cl = censoredSample(
    chlorine.map((v, i) => Math.max(v, limit[i])),
    chlorine.map((v, i) => (v < limit[i] ? -1 : 0)),
  );
  const clq = censoredQqData(cl, censoredNormalFit(cl));
  return {
    qq: qqSpec(q, { name: "dissolved oxygen (mg/L)" }),
    qq_censored: qqSpec(clq, { name: "residual chlorine (mg/L)" }),
    detrended_censored: detrendedSpec(clq, { name: "residual chlorine (mg/L)" }),
    detrended: detrendedSpec(q, { name: "dissolved oxygen (mg/L)" }),
    histogram: histogramSpec(histogramData(oxygen), { name: "dissolved oxygen (mg/L)" }),
    comparison: comparisonSpec([
      { label: "as measured", qq: q, W: 0.89, p: 1e-9 },
      { label: "square root", qq: qqData(oxygen.map(Math.sqrt)), W: 0.975, p: 0.0002 },
      { label: "log", qq: qqData(oxygen.map(Math.log)), W: 0.997, p: 0.61, note: "best" },
    ], { name: "dissolved oxygen (mg/L)" }),
    groups: groupSpec(
      fills.map((f, k) => ({ group: `filler ${["A", "B", "C"][k]}`, qq: qqData(f) })),
      { name: "net fill (mL)", by: "filler line" },
    ),
    lambda: lambdaExplorerSpec({
      lambdas,
      logLik,
      lambdaHat: 0.04,
      ci: [-0.08, 0.16],
      perLambda: lambdas.map((l, k) => ({
        W: 0.9 + 0.003 * (15 - Math.abs(k - 15)),
        p: 0.01 * (15 - Math.abs(k - 15)) / 15,
        qq: qqData(boxCox(oxygen, l)),
      })),
    }, { name: "dissolved oxygen (mg/L)" }),
  };
}

if (import.meta.main) {
  const args = Deno.args.filter((a) => a !== "--browser");
  const out = args[0] ?? "out/charts";
  await Deno.mkdir(out, { recursive: true });
  const browser = Deno.args.includes("--browser") ? await Browser.launch() : undefined;
  try {
    for (const [kind, spec] of Object.entries(specs())) {
      const svg = await renderSvg(spec);
      const svgPath = `${out}/${kind}.svg`;
      await Deno.writeTextFile(svgPath, svg);
      const raster = await rasterize(svg);
      await Deno.writeFile(`${out}/${kind}.png`, raster.png);
      let line = `${svgPath} and ${out}/${kind}.png (${raster.png.length} bytes)`;
      if (browser !== undefined) {
        const page = await browser.newPage({ width: raster.width, height: raster.height });
        try {
          await page.goto(new URL(`file://${await Deno.realPath(svgPath)}`).href);
          line += ` and ${await page.screenshot(`${out}/${kind}.browser.png`)}`;
        } finally {
          await page.close();
        }
      }
      console.log(line);
    }
  } finally {
    await browser?.close();
  }
}
