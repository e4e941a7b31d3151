/**
 * Side-by-side timing: plumbline against the Python reference libraries on the
 * same data in the same run. Prints the median time per call for each and the
 * ratio plumbline / reference (below 1 means plumbline is faster).
 *
 * Run: deno run -A bench/side_by_side.ts [case-name-filter]
 * Needs /usr/bin/python3 with scipy and statsmodels (Debian packages).
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { shapiroWilk } from "../lib/stats/shapiro_wilk.ts";

/** One comparison: data, our call, and the Python statement timed on `x`. */
export interface SideBySideCase {
  readonly name: string;
  readonly data: () => Float64Array;
  readonly ours: (x: Float64Array) => unknown;
  /** Python statement using `x` (a numpy array); `s` is scipy.stats, `np` numpy. */
  readonly python: string;
  /** Python setup lines (imports beyond numpy and scipy.stats). */
  readonly pythonSetup?: string;
}

const rng = seededRandom(7);
const normal = (n: number) => () => new Float64Array(n).map(() => 10 + 2 * rng.normal());

/** The cases this script knows; other bench files may add their own. */
export const CASES: SideBySideCase[] = [
  { name: "Shapiro–Wilk n=20", data: normal(20), ours: shapiroWilk, python: "s.shapiro(x)" },
  { name: "Shapiro–Wilk n=1000", data: normal(1000), ours: shapiroWilk, python: "s.shapiro(x)" },
  { name: "Shapiro–Wilk n=5000", data: normal(5000), ours: shapiroWilk, python: "s.shapiro(x)" },
];

/** Median seconds per call of `f`, over batches lasting about `budget` seconds in all. */
export function timeOurs(f: () => unknown, budget = 1, minBatches = 5): number {
  const times: number[] = [];
  let reps = 1;
  const t0 = performance.now();
  for (;;) {
    const a = performance.now();
    for (let i = 0; i < reps; i++) f();
    const dt = (performance.now() - a) / 1000;
    if (dt < 0.02) {
      reps *= 2;
      continue;
    }
    times.push(dt / reps);
    if ((performance.now() - t0) / 1000 > budget && times.length >= minBatches) break;
  }
  times.sort((p, q) => p - q);
  return times[Math.floor(times.length / 2)];
}

/** The data in a temporary file (removed afterwards) for numpy to read, passed to `use`. */
async function _withDataFile<T>(x: Float64Array, use: (file: string) => Promise<T>): Promise<T> {
  const file = await Deno.makeTempFile({ suffix: ".f64" });
  try {
    await Deno.writeFile(file, new Uint8Array(x.buffer, x.byteOffset, x.byteLength));
    return await use(file);
  } finally {
    await Deno.remove(file);
  }
}

/** The first lines of a timing script: imports, setup, the data as `x`, the statement as `f`. */
function _scriptHead(c: SideBySideCase, file: string): string[] {
  return [
    "import sys, timeit, numpy as np, scipy.stats as s",
    c.pythonSetup ?? "",
    `x = np.fromfile(${JSON.stringify(file)}, dtype='<f8')`,
    `f = lambda: ${c.python}`,
  ];
}

/** Time a Python statement on the same data; median seconds per call. */
export function timePython(c: SideBySideCase, x: Float64Array, budget = 1): Promise<number> {
  return _withDataFile(x, async (file) => {
    const script = [
      ..._scriptHead(c, file),
      "f()",
      "reps = 1",
      "while timeit.timeit(f, number=reps) < 0.02: reps *= 2",
      `n = max(5, int(${budget} / (timeit.timeit(f, number=reps) / reps) / reps))`,
      "ts = sorted(t / reps for t in timeit.repeat(f, number=reps, repeat=min(n, 50)))",
      "print(ts[len(ts) // 2])",
    ].join("\n");
    const out = await new Deno.Command("/usr/bin/python3", {
      args: ["-c", script],
      stdout: "piped",
      stderr: "piped",
    })
      .output();
    if (!out.success) throw new Error(new TextDecoder().decode(out.stderr));
    return Number(new TextDecoder().decode(out.stdout).trim());
  });
}

/** Paired timings of one case: per round, our median and the reference's, measured back to back. */
export interface PairedTimes {
  /** Our median seconds per call, one per round. */
  readonly ours: number[];
  /** The reference's median seconds per call, one per round. */
  readonly ref: number[];
}

/**
 * Time our call and the Python statement in alternation: `rounds` rounds,
 * each one batch of ours (about `budget` seconds, median per call) followed
 * at once by one batch of the reference's (same budget) in a Python process
 * kept open for the whole case. The load of a shared machine then weighs on
 * both sides of each round alike, and each round's ratio is a fair one even
 * when the load changes between rounds.
 */
export function timePaired(
  c: SideBySideCase,
  x: Float64Array,
  options: { rounds: number; budget: number; minBatches: number },
): Promise<PairedTimes> {
  return _withDataFile(x, async (file) => {
    const script = [
      ..._scriptHead(c, file),
      // The first call is the warm-up; it also sizes the batches.
      "reps, t = 1, timeit.timeit(f, number=1)",
      "while t < 0.02: reps, t = 2 * reps, timeit.timeit(f, number=2 * reps)",
      `k = int(${options.budget} / (t / reps) / reps)`,
      `k = max(${options.minBatches}, min(50, k))`,
      "print('ready', flush=True)",
      "for line in sys.stdin:",
      "    if line.strip() != 'go': break",
      "    ts = sorted(t / reps for t in timeit.repeat(f, number=reps, repeat=k))",
      "    print(ts[len(ts) // 2], flush=True)",
    ].join("\n");
    const child = new Deno.Command("/usr/bin/python3", {
      args: ["-c", script],
      stdin: "piped",
      stdout: "piped",
      stderr: "inherit",
    }).spawn();
    const lines = _lines(child.stdout);
    const writer = child.stdin.getWriter();
    const next = async () => {
      const r = await lines.next();
      if (r.done) throw new Error("the reference process stopped (its error is above)");
      return r.value;
    };
    try {
      await next(); // "ready": data loaded, the statement compiled and run once
      timeOurs(() => c.ours(x), Math.min(options.budget, 0.2), 1); // warm up ours the same way
      const ours: number[] = [];
      const ref: number[] = [];
      for (let r = 0; r < options.rounds; r++) {
        ours.push(timeOurs(() => c.ours(x), options.budget, options.minBatches));
        await writer.write(new TextEncoder().encode("go\n"));
        ref.push(Number(await next()));
      }
      return { ours, ref };
    } finally {
      await writer.write(new TextEncoder().encode("stop\n")).catch(() => {});
      await writer.close().catch(() => {});
      await child.status;
    }
  });
}

/** The lines of a byte stream. */
async function* _lines(stream: ReadableStream<Uint8Array>): AsyncGenerator<string> {
  let buffer = "";
  for await (const chunk of stream.pipeThrough(new TextDecoderStream())) {
    buffer += chunk;
    let at: number;
    while ((at = buffer.indexOf("\n")) >= 0) {
      yield buffer.slice(0, at);
      buffer = buffer.slice(at + 1);
    }
  }
  if (buffer) yield buffer;
}

/** Format seconds for people. */
export function fmtTime(s: number): string {
  if (s < 1e-3) return `${(s * 1e6).toFixed(1)} µs`;
  if (s < 1) return `${(s * 1e3).toFixed(2)} ms`;
  return `${s.toFixed(2)} s`;
}

/** Run cases and print a table: name, ours, reference, ratio. */
export async function runSideBySide(cases: readonly SideBySideCase[]): Promise<void> {
  const ver = await new Deno.Command("/usr/bin/python3", {
    args: [
      "-c",
      "import numpy, scipy, statsmodels; print(numpy.__version__, scipy.__version__, statsmodels.__version__)",
    ],
    stdout: "piped",
  }).output();
  const [np, sp, sm] = new TextDecoder().decode(ver.stdout).trim().split(" ");
  console.log(
    `reference: numpy ${np}, scipy ${sp}, statsmodels ${sm}; plumbline on Deno ${Deno.version.deno}`,
  );
  console.log("| case | plumbline | reference | ratio |\n| --- | ---: | ---: | ---: |");
  for (const c of cases) {
    const x = c.data();
    const ours = timeOurs(() => c.ours(x));
    const ref = await timePython(c, x);
    console.log(`| ${c.name} | ${fmtTime(ours)} | ${fmtTime(ref)} | ${(ours / ref).toFixed(2)} |`);
  }
}

if (import.meta.main) {
  const filter = Deno.args[0] ?? "";
  await runSideBySide(CASES.filter((c) => c.name.includes(filter)));
}
