/**
 * Side-by-side timing of the BCa bootstrap of the mean (2000 resamples), the
 * costliest part of the stakes view, against R's boot package
 * (`boot(x, mean in index form, R = 2000)` then `boot.ci(type = "bca")` with
 * the exact influence values, so R does no regression) and scipy's
 * `scipy.stats.bootstrap(method="BCa")`, on the same data in the same run.
 * Prints median times and the ratios plumbline / reference.
 *
 * Run: deno run -A bench/stakes_side_by_side.ts
 * Needs Rscript with the boot package and /usr/bin/python3 with scipy (Debian).
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { bootstrapMean } from "../lib/stats/bootstrap_bca.ts";
import { stakes } from "../lib/stakes/stakes.ts";
import { fmtTime, timeOurs, timePython } from "./side_by_side.ts";

const rng = seededRandom(20260319);
const lognormal = (n: number) => new Float64Array(n).map(() => Math.exp(0.6 * rng.normal()));

/** Median seconds per call of the R expression `expr` on `x`. */
async function timeR(x: Float64Array, expr: string, reps: number): Promise<number> {
  const file = await Deno.makeTempFile({ suffix: ".f64" });
  try {
    await Deno.writeFile(file, new Uint8Array(x.buffer, x.byteOffset, x.byteLength));
    const script = [
      "suppressPackageStartupMessages(library(boot))",
      `x <- readBin(${JSON.stringify(file)}, "double", n = ${x.length}, endian = "little")`,
      `f <- function() { ${expr} }`,
      "invisible(f())",
      `ts <- sapply(seq_len(${reps}), function(i) system.time(f())[["elapsed"]])`,
      "cat(median(ts))",
    ].join("\n");
    const out = await new Deno.Command("Rscript", {
      args: ["-e", script],
      stdout: "piped",
      stderr: "piped",
    })
      .output();
    if (!out.success) throw new Error(new TextDecoder().decode(out.stderr));
    return Number(new TextDecoder().decode(out.stdout).trim());
  } finally {
    await Deno.remove(file);
  }
}

const load = () => Deno.loadavg().map((v) => v.toFixed(2)).join(", ");
console.log(`load average before: ${load()}`);
console.log(
  "| case | plumbline | R boot + boot.ci | ratio | scipy bootstrap (BCa) | ratio |\n" +
    "| --- | ---: | ---: | ---: | ---: | ---: |",
);
for (const n of [100, 1000, 10000]) {
  const x = lognormal(n);
  const ours = timeOurs(() => bootstrapMean(x, { resamples: 2000 }), 2);
  const r = await timeR(
    x,
    "b <- boot(x, function(d, i) mean(d[i]), R = 2000); boot.ci(b, type = 'bca', L = x - mean(x))",
    n >= 10000 ? 5 : 15,
  );
  const py = await timePython(
    {
      name: "",
      data: () => x,
      ours: () => 0,
      python: "s.bootstrap((x,), np.mean, n_resamples=2000, method='BCa', random_state=1)",
    },
    x,
    2,
  );
  console.log(
    `| BCa of the mean, B = 2000, n = ${n} | ${fmtTime(ours)} | ${fmtTime(r)} | ` +
      `${(ours / r).toFixed(2)} | ${fmtTime(py)} | ${(ours / py).toFixed(2)} |`,
  );
}
for (const n of [1000, 100000]) {
  const x = lognormal(n);
  const ours = timeOurs(() => stakes(x, { lower: 0.3, upper: 4 }), 2);
  console.log(
    `| whole stakes view (search, range, limits, mean), n = ${n} | ${fmtTime(ours)} | | | | |`,
  );
}
console.log(`load average after: ${load()}`);
