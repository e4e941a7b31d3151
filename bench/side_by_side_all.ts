/**
 * Every side-by-side comparison in one run, as a Markdown table of ratios
 * (plumbline time / reference time; below 1 means plumbline is faster), with
 * the library versions. The reference is Python's numpy, scipy, statsmodels
 * and pandas from /usr/bin/python3, timed on the same data in the same run
 * (the data are written to a temporary file and read by numpy, so both sides
 * see the same doubles). Each case is timed in paired rounds
 * ({@linkcode timePaired}): a batch of ours, then at once a batch of the
 * reference's in a Python process kept open for the case, so that a change
 * in the load of a shared machine weighs on both sides of a round alike; a
 * run's ratio is the median of its rounds' ratios. The whole set of cases is
 * run `--runs` times (default 3), and the table gives the median of the runs'
 * ratios and their range, with the load average (/proc/loadavg) before and
 * after each run: quote the ranges.
 *
 * What is compared, case by case, is printed under the table.
 *
 * Run: deno run -A bench/side_by_side_all.ts [--runs K] [--readme README.md] [case-name-filter]
 *
 * With `--readme FILE`, the table and the load line replace the lines
 * between `<!-- performance-table -->` and `<!-- /performance-table -->`
 * in FILE, so the README's figures come from one run of this script.
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
import { fitOurs, linearModelData, numpyCases } from "./linear_model_side_by_side.ts";
import { fmtTime, type SideBySideCase, timeOurs, timePaired } from "./side_by_side.ts";

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

/** The same screen, plus each column's maximum-likelihood Box–Cox λ (scipy). */
const SURVEY_LAMBDA_PY_SETUP = SURVEY_PY_SETUP +
  `
def screen_lambda(x):
    return screen(x), [s.boxcox_normmax(c, method='mle') for c in x.reshape(${SURVEY_COLS}, -1)]
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
  {
    name: `survey, lognormal, ${SURVEY_ROWS} rows × ${SURVEY_COLS} columns`,
    data: lognormal(SURVEY_COLS * SURVEY_ROWS),
    ours: (x) => {
      if (surveyCache?.x !== x) surveyCache = { x, table: surveyTable(x) };
      return survey(surveyCache.table).result();
    },
    pythonSetup: SURVEY_LAMBDA_PY_SETUP,
    python: "screen_lambda(x)",
  },
];

/** The least-squares case: rows × covariates. */
const LM_ROWS = 1_000_000;
const LM_COVARIATES = 10;

CASES.push(
  ...numpyCases(LM_COVARIATES).map((c, i) => ({
    name: i === 0
      ? `least-squares residuals, leverages, studentised, ${LM_ROWS} rows × ${LM_COVARIATES} ` +
        "covariates (numpy `lstsq` + residuals)"
      : "the same against numpy reduced QR with the same diagnostics",
    data: () => linearModelData(LM_ROWS, LM_COVARIATES),
    ours: (x: Float64Array) => fitOurs(x, LM_COVARIATES),
    python: c.python,
  })),
);

const NOTES = [
  "Timing: each case in paired rounds, a batch of plumbline then at once a batch of the reference " +
  "(kept open in one Python process), after one warm-up call each; a run's ratio is the median " +
  "of its rounds' ratios: 9 rounds of about 0.2 s a side below 1e6 values, 3 rounds of at least " +
  "3 calls a side at 1e6, one call a side for the surveys and least squares. CSV load: five " +
  "loads a side, medians, one side after the other.",
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
  "survey, lognormal: the same on lognormal columns, where every column departs, so plumbline " +
  "also ranks the re-expressions of each (with its Box–Cox λ and interval) to suggest one; the " +
  "reference adds `scipy.stats.boxcox_normmax(c, method='mle')` for each column.",
  "Shapiro–Wilk ÷ radix sort: `shapiroWilk(x)` at n = 5000 against one `sortFloat64` of a " +
  "copy of the same array (the sort is the floor of any order-statistic test).",
  "Least squares: `fitLinearModel(y, { covariates })` (design, QR, rank, coefficients, residuals, " +
  "leverages, standardised and studentised residuals) vs numpy `lstsq` with the residuals (the " +
  "least work, no leverages), and vs numpy reduced QR with the same diagnostics; the same seeded " +
  "data (`bench/linear_model_side_by_side.ts`).",
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

/** One line of the table: its name and, per run, our time, the reference's and their ratio. */
interface _Row {
  readonly name: string;
  readonly ours: number[];
  readonly ref: number[];
  /** Per run, the median over its rounds of the paired ratios. */
  readonly ratio: number[];
}

const _median = (xs: readonly number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

async function _loadavg(): Promise<string> {
  return (await Deno.readTextFile("/proc/loadavg")).split(" ").slice(0, 3).join(" ");
}

/**
 * Rounds per case and run, and seconds per side per round: small samples
 * get many short paired rounds, the 1e6-value cases a few, and a survey
 * (seconds to a minute per call) one pair of calls.
 */
function _plan(n: number): { rounds: number; budget: number; minBatches: number } {
  if (n > 1e6) return { rounds: 1, budget: 0, minBatches: 1 };
  if (n >= 1e6) return { rounds: 3, budget: 1, minBatches: 3 };
  return { rounds: 9, budget: 0.2, minBatches: 3 };
}

/** Run every case once; add its paired times to its row. */
async function _runOnce(filter: string, rows: Map<string, _Row>): Promise<void> {
  const add = (name: string, ours: number[], ref: number[]) => {
    const row = rows.get(name) ?? { name, ours: [], ref: [], ratio: [] };
    const ratio = _median(ours.map((o, i) => o / ref[i]));
    row.ours.push(_median(ours));
    row.ref.push(_median(ref));
    row.ratio.push(ratio);
    rows.set(name, row);
    console.log(
      `  ${name}: ${fmtTime(_median(ours))} / ${fmtTime(_median(ref))}, ` +
        `paired ratio ${ratio.toFixed(2)} (${ours.length} round${ours.length === 1 ? "" : "s"})`,
    );
  };
  for (const c of CASES.filter((k) => k.name.includes(filter))) {
    const x = c.data();
    const t = await timePaired(c, x, _plan(x.length));
    add(c.name, t.ours, t.ref);
  }
  if ("CSV load".includes(filter)) {
    const [alone, ours, ref] = await csvLoad();
    add("CSV load, 1e6 rows × 10 columns: `loadTable`", [alone], [ref]);
    add("CSV load, 1e6 rows × 10 columns: `loadTable` + every `numeric()` copy", [ours], [ref]);
  }
  if ("Shapiro–Wilk ÷ radix sort, n = 5000".includes(filter) || filter === "") {
    const x = normal(5000)();
    const sw: number[] = [];
    const sort: number[] = [];
    timeOurs(() => shapiroWilk(x), 0.2, 1);
    timeOurs(() => sortFloat64(x.slice()), 0.2, 1);
    for (let r = 0; r < 9; r++) {
      sw.push(timeOurs(() => shapiroWilk(x), 0.2, 3));
      sort.push(timeOurs(() => sortFloat64(x.slice()), 0.2, 3));
    }
    add("Shapiro–Wilk ÷ radix sort, n = 5000 (reference: one `sortFloat64`)", sw, sort);
  }
}

/** The table: median times, the median ratio and its range over the runs. */
function _table(rows: Iterable<_Row>, runs: number): string {
  const lines = [
    `| case | plumbline | reference | ratio (median) | ratio range, ${runs} run${
      runs === 1 ? "" : "s"
    } |`,
    "| --- | ---: | ---: | ---: | ---: |",
  ];
  for (const r of rows) {
    const ratios = r.ratio;
    lines.push(
      `| ${r.name} | ${fmtTime(_median(r.ours))} | ${fmtTime(_median(r.ref))} | ` +
        `${_median(ratios).toFixed(2)} | ${Math.min(...ratios).toFixed(2)}–${
          Math.max(...ratios).toFixed(2)
        } |`,
    );
  }
  return lines.join("\n");
}

/** Replace the lines between the performance-table markers of a Markdown file. */
async function _writeReadme(file: string, block: string): Promise<void> {
  const text = await Deno.readTextFile(file);
  const open = "<!-- performance-table -->";
  const close = "<!-- /performance-table -->";
  const a = text.indexOf(open);
  const b = text.indexOf(close);
  if (a < 0 || b < a) throw new Error(`${file} has no ${open} … ${close} block`);
  await Deno.writeTextFile(
    file,
    `${text.slice(0, a + open.length)}\n\n${block}\n\n${text.slice(b)}`,
  );
}

if (import.meta.main) {
  const args = [...Deno.args];
  const take = (flag: string) => {
    const i = args.indexOf(flag);
    return i < 0 ? undefined : args.splice(i, 2)[1];
  };
  const runs = Number(take("--runs") ?? 3);
  const readme = take("--readme");
  const filter = args[0] ?? "";
  const header = await versions();
  console.log(header);
  const rows = new Map<string, _Row>();
  const loads: string[] = [];
  for (let run = 1; run <= runs; run++) {
    const before = await _loadavg();
    await _runOnce(filter, rows);
    loads.push(`run ${run}: ${before} → ${await _loadavg()}`);
    console.log(`run ${run} of ${runs} done (load average ${loads[loads.length - 1]})`);
  }
  const table = _table(rows.values(), runs);
  const load = `Load average (1, 5, 15 min) before → after each run: ${loads.join("; ")}.`;
  console.log(`\n${table}\n\n${load}`);
  console.log("\nWhat is compared:\n");
  for (const note of NOTES) console.log(`- ${note}`);
  if (readme) {
    const notes = NOTES.map((note) => `- ${note}`).join("\n");
    await _writeReadme(
      readme,
      `${header}.\n\n${table}\n\n${load}\n\nWhat is compared:\n\n${notes}`,
    );
    console.log(`\nWrote the table into ${readme}`);
  }
}
