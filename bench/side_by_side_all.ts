/**
 * Every side-by-side comparison in one run, printed as a Markdown table of
 * ratios (plumbline time / reference time; below 1 means plumbline is
 * faster), with the library versions. The reference is Python's numpy,
 * scipy, statsmodels and pandas from /usr/bin/python3, timed on the same
 * data in the same run (the data are written to a temporary file and read
 * by numpy, so both sides see the same doubles). Every time is a median of
 * repeated batches ({@linkcode timeOurs}, {@linkcode timePython}).
 *
 * What is compared, case by case, is printed under the table.
 *
 * Run: deno run -A bench/side_by_side_all.ts [case-name-filter]
 *
 * @module
 */
import { loadTable } from "../lib/data/load_table.ts";
import { tableFromMemory } from "../lib/data/in_memory.ts";
import { seededRandom } from "../lib/numeric/random.ts";
import { sortFloat64 } from "../lib/numeric/sort.ts";
import { survey } from "../lib/plumb/survey.ts";
import { boxCoxFit } from "../lib/reexpress/box_cox_fit.ts";
import { andersonDarling } from "../lib/stats/anderson_darling.ts";
import { dagostinoPearson } from "../lib/stats/dagostino_pearson.ts";
import { shapiroWilk } from "../lib/stats/shapiro_wilk.ts";
import { numericCsv } from "./_numeric_csv.ts";
import { fmtTime, type SideBySideCase, timeOurs, timePython } from "./side_by_side.ts";

const rng = seededRandom(20261201);
const normal = (n: number) => () => new Float64Array(n).map(() => 10 + 2 * rng.normal());
const lognormal = (n: number) => () =>
  new Float64Array(n).map(() => Math.exp(1 + 0.5 * rng.normal()));

/** Fresh samples: `k` samples of `n`, back to back in one array. */
const FRESH = 20;

/** The survey case: columns × rows, column after column in one array. */
const SURVEY_COLS = 10;
const SURVEY_ROWS = 1_000_000;

const SURVEY_PY_SETUP = `
from statsmodels.stats.diagnostic import lilliefors
rng = np.random.default_rng(1)
def screen(x):
    out = []
    for c in x.reshape(${SURVEY_COLS}, -1):
        sub = c[rng.choice(c.size, 5000, replace=False)]
        out.append((s.shapiro(sub), s.anderson(c), s.normaltest(c), s.skew(c, bias=False),
                    s.kurtosis(c, bias=False), s.jarque_bera(c),
                    lilliefors(c, dist='norm', pvalmethod='approx'),
                    np.histogram(c, bins='fd')))
    return out
`;

function surveyTable(x: Float64Array) {
  const columns: Record<string, Float64Array> = {};
  for (let c = 0; c < SURVEY_COLS; c++) {
    columns[`c${c}`] = x.subarray(c * SURVEY_ROWS, (c + 1) * SURVEY_ROWS);
  }
  return tableFromMemory(columns);
}

let surveyCache: { x: Float64Array; table: ReturnType<typeof surveyTable> } | undefined;

const CASES: SideBySideCase[] = [
  ...[20, 1000, 5000].map((n) => ({
    name: `Shapiro–Wilk, n = ${n}`,
    data: normal(n),
    ours: shapiroWilk,
    python: "s.shapiro(x)",
  })),
  ...[20, 1000, 5000].map((n) => ({
    name: `Shapiro–Wilk, ${FRESH} fresh samples of n = ${n}`,
    data: normal(FRESH * n),
    ours: (x: Float64Array) => {
      for (let k = 0; k < FRESH; k++) shapiroWilk(x.subarray(k * n, (k + 1) * n));
    },
    python: `[s.shapiro(c) for c in x.reshape(${FRESH}, ${n})]`,
  })),
  {
    name: "Anderson–Darling, n = 1e6",
    data: normal(1e6),
    ours: andersonDarling,
    python: "s.anderson(x)",
  },
  {
    name: "D'Agostino–Pearson K², n = 1e6",
    data: normal(1e6),
    ours: dagostinoPearson,
    python: "s.normaltest(x)",
  },
  {
    name: "Box–Cox λ fit, lognormal, n = 1e6",
    data: lognormal(1e6),
    ours: (x) => boxCoxFit(x),
    python: "s.boxcox_normmax(x, method='mle')",
  },
  {
    name: `survey, ${SURVEY_ROWS} rows × ${SURVEY_COLS} columns`,
    data: normal(SURVEY_COLS * SURVEY_ROWS),
    ours: (x) => {
      if (surveyCache?.x !== x) surveyCache = { x, table: surveyTable(x) };
      return survey(surveyCache.table).result();
    },
    pythonSetup: SURVEY_PY_SETUP,
    python: "screen(x)",
  },
];

const NOTES = [
  "Shapiro–Wilk: plumbline `shapiroWilk(x)` vs `scipy.stats.shapiro(x)` on the same sample; " +
  `fresh samples: ${FRESH} different samples of the same n, one call each, timed as a batch.`,
  "Anderson–Darling: `andersonDarling(x)` (A², A²* and its p-value) vs `scipy.stats.anderson(x)` " +
  "(A² and critical values; scipy gives no p-value).",
  "K²: `dagostinoPearson(x)` vs `scipy.stats.normaltest(x)`.",
  "Box–Cox: `boxCoxFit(x)` (maximum-likelihood λ and its profile-likelihood interval) vs " +
  "`scipy.stats.boxcox_normmax(x, method='mle')` (λ only).",
  `survey: \`survey(table).result()\` on a ${SURVEY_COLS}-column in-memory table of normal data ` +
  "(every test, QQ data with envelope, histogram, reading, Holm adjustment; table construction " +
  "not timed) vs, per column: `shapiro` on a random subsample of 5000, `anderson`, `normaltest`, " +
  "`skew` and `kurtosis` (bias=False), `jarque_bera` (scipy), statsmodels' " +
  "`lilliefors(pvalmethod='approx')` and `numpy.histogram(bins='fd')`.",
  "CSV load: `loadTable(file)`, alone and followed by `table.numeric(name)` for every column " +
  "(each a fresh `Float64Array` copy), vs `pandas.read_csv(file)`; the same file, 1e6 rows × 10 " +
  "columns of 4-decimal numbers.",
];

async function versions(): Promise<string> {
  const out = await new Deno.Command("/usr/bin/python3", {
    args: [
      "-c",
      "import sys, numpy, scipy, statsmodels, pandas; print(sys.version.split()[0], " +
      "numpy.__version__, scipy.__version__, statsmodels.__version__, pandas.__version__)",
    ],
    stdout: "piped",
  }).output();
  const [py, np, sp, sm, pd] = new TextDecoder().decode(out.stdout).trim().split(" ");
  return `plumbline on Deno ${Deno.version.deno} (V8 ${Deno.version.v8}); reference: Python ${py}, ` +
    `numpy ${np}, scipy ${sp}, statsmodels ${sm}, pandas ${pd}`;
}

/** CSV load: medians of `repeats` loads, alone and with every numeric column read; pandas. */
async function csvLoad(repeats = 5): Promise<[number, number, number]> {
  const dir = await Deno.makeTempDir({ prefix: "plumbline_bench_" });
  const file = `${dir}/numeric.csv`;
  try {
    await Deno.writeTextFile(file, numericCsv(1_000_000, 10, 20260101, false));
    await loadTable(file); // compile the reader first
    const ours: number[] = [];
    const alone: number[] = [];
    for (let i = 0; i < repeats; i++) {
      let t0 = performance.now();
      await loadTable(file);
      alone.push((performance.now() - t0) / 1000);
      t0 = performance.now();
      const table = await loadTable(file);
      for (const name of table.numericNames()) table.numeric(name);
      ours.push((performance.now() - t0) / 1000);
    }
    const py = "import sys, time, pandas\nts = []\n" +
      `for _ in range(${repeats}):\n` +
      "    t0 = time.perf_counter(); pandas.read_csv(sys.argv[1]); ts.append(time.perf_counter() - t0)\n" +
      "ts.sort(); print(ts[len(ts) // 2])";
    const out = await new Deno.Command("/usr/bin/python3", { args: ["-c", py, file] }).output();
    if (!out.success) throw new Error(new TextDecoder().decode(out.stderr));
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(repeats / 2)];
    return [median(alone), median(ours), Number(new TextDecoder().decode(out.stdout).trim())];
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
}

if (import.meta.main) {
  const filter = Deno.args[0] ?? "";
  console.log(await versions());
  console.log(`load average before: ${(await Deno.readTextFile("/proc/loadavg")).trim()}`);
  console.log("\n| case | plumbline | reference | ratio |\n| --- | ---: | ---: | ---: |");
  const row = (name: string, ours: number, ref: number) =>
    console.log(`| ${name} | ${fmtTime(ours)} | ${fmtTime(ref)} | ${(ours / ref).toFixed(2)} |`);
  for (const c of CASES.filter((k) => k.name.includes(filter))) {
    const x = c.data();
    const budget = x.length >= 1e6 ? 3 : 1;
    row(c.name, timeOurs(() => c.ours(x), budget), await timePython(c, x, budget));
  }
  if ("CSV load".includes(filter)) {
    const [alone, ours, ref] = await csvLoad();
    row("CSV load, 1e6 rows × 10 columns: `loadTable`", alone, ref);
    row("CSV load, 1e6 rows × 10 columns: `loadTable` + every `numeric()` copy", ours, ref);
  }
  if ("Shapiro–Wilk vs sort".includes(filter) || filter === "") {
    const x = normal(5000)();
    const sw = timeOurs(() => shapiroWilk(x), 1);
    const sort = timeOurs(() => sortFloat64(x.slice()), 1);
    console.log(
      `\nShapiro–Wilk at n = 5000: ${fmtTime(sw)}; one radix sort of a copy of the same array: ` +
        `${fmtTime(sort)}; ratio ${(sw / sort).toFixed(2)} (target ≤ 1.5)`,
    );
  }
  console.log(`\nload average after: ${(await Deno.readTextFile("/proc/loadavg")).trim()}`);
  console.log("\nWhat is compared:\n");
  for (const note of NOTES) console.log(`- ${note}`);
}
