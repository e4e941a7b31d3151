/**
 * Side-by-side timing of the λ fits against scipy on the same data in the
 * same run: `boxCoxFit` (λ̂ and its profile-likelihood interval) against
 * `scipy.stats.boxcox_normmax(x, method="mle")` (λ̂ only), and `yeoJohnsonFit`
 * against `scipy.stats.yeojohnson_normmax(x)`. Prints median times, the ratio
 * plumbline / scipy (below 1 means plumbline is faster) and both λ̂.
 *
 * Run: deno run -A bench/reexpress_side_by_side.ts
 * Needs /usr/bin/python3 with numpy and scipy (Debian packages).
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { boxCoxFit } from "../lib/reexpress/box_cox_fit.ts";
import { yeoJohnsonFit } from "../lib/reexpress/yeo_johnson_fit.ts";
import { fmtTime, type SideBySideCase, timeOurs, timePython } from "./side_by_side.ts";

const rng = seededRandom(20261201);
const lognormal = (n: number) => () =>
  new Float64Array(n).map(() => Math.exp(1 + 0.5 * rng.normal()));
const gamma2 = (n: number) => () =>
  new Float64Array(n).map(() => -Math.log(rng.uniform()) - Math.log(rng.uniform()));
const shiftedLognormal = (n: number) => () =>
  new Float64Array(n).map(() => Math.exp(0.8 * rng.normal()) - 1.5);

interface LambdaCase extends SideBySideCase {
  readonly lambda: (x: Float64Array) => number;
  readonly pythonLambda: string;
}

const CASES: LambdaCase[] = [];
for (const [label, gen] of [["lognormal", lognormal], ["gamma(2)", gamma2]] as const) {
  for (const n of [1e4, 1e5, 1e6]) {
    CASES.push({
      name: `boxCoxFit, ${label}, n=${n}`,
      data: gen(n),
      ours: (x) => boxCoxFit(x),
      lambda: (x) => boxCoxFit(x).lambda,
      python: "s.boxcox_normmax(x, method='mle')",
      pythonLambda: "repr(float(s.boxcox_normmax(x, method='mle')))",
    });
  }
}
CASES.push({
  name: "yeoJohnsonFit, both signs, n=1e6",
  data: shiftedLognormal(1e6),
  ours: (x) => yeoJohnsonFit(x),
  lambda: (x) => yeoJohnsonFit(x).lambda,
  python: "s.yeojohnson_normmax(x)",
  pythonLambda: "repr(float(s.yeojohnson_normmax(x)))",
});

async function scipyLambda(c: LambdaCase, x: Float64Array): Promise<number> {
  const file = await Deno.makeTempFile({ suffix: ".f64" });
  try {
    await Deno.writeFile(file, new Uint8Array(x.buffer, x.byteOffset, x.byteLength));
    const script = "import numpy as np, scipy.stats as s\n" +
      `x = np.fromfile(${JSON.stringify(file)}, dtype='<f8')\nprint(${c.pythonLambda})`;
    const out = await new Deno.Command("/usr/bin/python3", {
      args: ["-c", script],
      stdout: "piped",
    })
      .output();
    return Number(new TextDecoder().decode(out.stdout).trim());
  } finally {
    await Deno.remove(file);
  }
}

if (import.meta.main) {
  const filter = Deno.args[0] ?? "";
  const ver = await new Deno.Command("/usr/bin/python3", {
    args: ["-c", "import numpy, scipy; print(numpy.__version__, scipy.__version__)"],
    stdout: "piped",
  }).output();
  const [np, sp] = new TextDecoder().decode(ver.stdout).trim().split(" ");
  console.log(`reference: numpy ${np}, scipy ${sp}; plumbline on Deno ${Deno.version.deno}`);
  console.log("plumbline times include the profile-likelihood interval; scipy's do not");
  console.log(
    "| case | plumbline | scipy | ratio | λ̂ plumbline | λ̂ scipy |\n" +
      "| --- | ---: | ---: | ---: | ---: | ---: |",
  );
  for (const c of CASES.filter((k) => k.name.includes(filter))) {
    const x = c.data();
    const ours = timeOurs(() => c.ours(x), 2);
    const ref = await timePython(c, x, 2);
    const l1 = c.lambda(x);
    const l2 = await scipyLambda(c, x);
    console.log(
      `| ${c.name} | ${fmtTime(ours)} | ${fmtTime(ref)} | ${(ours / ref).toFixed(2)} | ` +
        `${l1.toPrecision(10)} | ${l2.toPrecision(10)} |`,
    );
  }
}
