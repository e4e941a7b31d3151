/**
 * Side-by-side timing of least-squares residuals: plumbline's fitLinearModel
 * (design, QR, rank, coefficients, residuals, leverages, standardised and
 * studentised residuals) against numpy on the same data in the same run.
 * Two numpy baselines: `lstsq` with the residuals (the least work: no
 * leverages), and reduced QR with the same diagnostics as plumbline.
 *
 * Run: deno run -A bench/linear_model_side_by_side.ts [rows] [covariates]
 * (default 1e6 rows, 10 covariates). Needs /usr/bin/python3 with numpy.
 *
 * @module
 */
import { seededRandom } from "../lib/numeric/random.ts";
import { fitLinearModel } from "../lib/stats/linear_model.ts";
import { fmtTime, timeOurs, timePython } from "./side_by_side.ts";

/**
 * The seeded data: `k` covariates, normal with sd 1…k around 50, then the
 * response (3·noise plus −1, 0, +1 times each covariate in turn), column
 * after column in one array.
 */
export function linearModelData(n: number, k: number): Float64Array {
  const rng = seededRandom(16);
  const all = new Float64Array(n * (k + 1));
  for (let j = 0; j < k; j++) {
    for (let i = 0; i < n; i++) all[j * n + i] = 50 + (j + 1) * rng.normal();
  }
  for (let i = 0; i < n; i++) {
    let s = 3 * rng.normal();
    for (let j = 0; j < k; j++) s += (j % 3 - 1) * all[j * n + i];
    all[k * n + i] = s;
  }
  return all;
}

/** plumbline's fit on {@linkcode linearModelData} laid out for `k` covariates. */
export function fitOurs(all: Float64Array, k: number): unknown {
  const n = all.length / (k + 1);
  const covariates: [string, Float64Array][] = Array.from(
    { length: k },
    (_, j) => [`x${j}`, all.subarray(j * n, (j + 1) * n)],
  );
  return fitLinearModel(all.subarray(k * n, (k + 1) * n), { covariates });
}

/** The two numpy statements on the same layout (`x` holds the data). */
export function numpyCases(k: number): { name: string; python: string }[] {
  return [
    {
      name: "numpy lstsq + residuals",
      python: `(lambda A: (lambda X, y: y - X @ np.linalg.lstsq(X, y, rcond=None)[0])` +
        `(np.column_stack([np.ones(A.shape[1]), A[:${k}].T]), A[${k}]))(x.reshape(${k + 1}, -1))`,
    },
    {
      name: "numpy QR + residuals, leverages, standardised and studentised",
      python:
        `(lambda A: (lambda X, y: (lambda Q: (lambda e, h: (lambda r: r * np.sqrt((len(y) - X.shape[1] - 1) / ` +
        `(len(y) - X.shape[1] - r * r)))(e / np.sqrt(e @ e / (len(y) - X.shape[1]) * (1 - h))))` +
        `(y - Q @ (Q.T @ y), np.einsum("ij,ij->i", Q, Q)))(np.linalg.qr(X)[0]))` +
        `(np.column_stack([np.ones(A.shape[1]), A[:${k}].T]), A[${k}]))(x.reshape(${k + 1}, -1))`,
    },
  ];
}

if (import.meta.main) {
  const n = Number(Deno.args[0] ?? 1e6), k = Number(Deno.args[1] ?? 10);
  const all = linearModelData(n, k);
  const loadavg = async () =>
    (await Deno.readTextFile("/proc/loadavg").catch(() => "? ? ?")).split(" ").slice(0, 3);
  console.log(`${n} rows × ${k} covariates; load average ${(await loadavg()).join(" ")}`);
  const ours = timeOurs(() => fitOurs(all, k), 3);
  console.log(`| case | plumbline | numpy | ratio |\n| --- | ---: | ---: | ---: |`);
  for (const c of numpyCases(k)) {
    const ref = await timePython(
      { name: c.name, data: () => all, ours: () => 0, python: c.python },
      all,
      3,
    );
    console.log(`| ${c.name} | ${fmtTime(ours)} | ${fmtTime(ref)} | ${(ours / ref).toFixed(2)} |`);
  }
  console.log(`load average after: ${(await loadavg()).join(" ")}`);
}
