// Differential test: fresh seeded designs each run (covariates, factors,
// interactions, badly scaled and nearly collinear columns), fitted live by
// R's lm and compared on rstudent, rstandard, hatvalues and residuals at
// 1e-9 relative (floor 1e-9 of the vector's largest entry). R's lm decides
// rank on uncentred columns, so for the design with an offset of 1e6 R is
// given the covariate and the response centred at their means (exact
// subtractions there: the same model). Skipped with a message when R is
// missing; .ci/run installs it and sets PLUMBLINE_REQUIRE_REFERENCE=1.
import { ok } from "node:assert/strict";
import { seededRandom } from "../../lib/numeric/random.ts";
import { fitLinearModel } from "../../lib/stats/linear_model.ts";
import { assertClose } from "../_assert_close.ts";
import { RSCRIPT, runTool, skipWithout, toolWorks } from "../_reference_tools.ts";

const seed = Number(Deno.env.get("PLUMBLINE_DIFF_SEED") ?? Date.now() % 1_000_000);
const rng = seededRandom(seed);

interface Design {
  readonly label: string;
  readonly y: number[];
  readonly x: Record<string, number[]>;
  readonly f: Record<string, string[]>;
  readonly interactions: string[][];
  /** Centre the numeric columns before R's lm (the offset-1e6 design). */
  readonly centre: boolean;
}

const level = (k: number) => Array.from({ length: k }, (_, i) => "abcdefgh"[i]);
const pick = (labels: string[], n: number) =>
  Array.from({ length: n }, (_, i) => labels[i < labels.length ? i : rng.integer(labels.length)]);

function design(kind: number, n: number): Design {
  const z = () => Array.from({ length: n }, () => rng.normal());
  const noise = z();
  if (kind === 0) {
    const x1 = z(), x2 = z().map(Math.exp), x3 = z().map((v) => Math.round(3 * v));
    const y = noise.map((e, i) => 1 + x1[i] - 0.5 * x2[i] + 0.2 * x3[i] + e);
    return { label: "3 covariates", y, x: { x1, x2, x3 }, f: {}, interactions: [], centre: false };
  }
  if (kind === 1) {
    const x1 = z(), fa = pick(level(3), n), fb = pick(level(2), n);
    const y = noise.map((e, i) => x1[i] + (fa[i] === "b" ? 1 : 0) * (fb[i] === "a" ? 2 : 0) + e);
    return {
      label: "covariate + two factors with interaction",
      y,
      x: { x1 },
      f: { fa, fb },
      interactions: [["fa", "fb"]],
      centre: false,
    };
  }
  if (kind === 2) {
    const u = z(), fa = pick(level(3), n);
    const x1 = u.map((v) => 1e6 + 1e-3 * v);
    const y = noise.map((e, i) => 1e6 + 1e-3 * (2 * u[i] + (fa[i] === "c" ? 1 : 0) + e));
    return {
      label: "offset 1e6, spread 1e-3",
      y,
      x: { x1 },
      f: { fa },
      interactions: [],
      centre: true,
    };
  }
  if (kind === 3) {
    const x1 = z(), fa = pick(level(4), n);
    const y = noise.map((e, i) => x1[i] * (fa[i] === "a" ? 2 : 1) + e);
    return {
      label: "covariate × factor",
      y,
      x: { x1 },
      f: { fa },
      interactions: [["fa", "x1"]],
      centre: false,
    };
  }
  const x1 = z(), x2 = x1.map((v) => v + 1e-4 * rng.normal()), x3 = z();
  const y = noise.map((e, i) => x1[i] + x3[i] + e);
  return {
    label: "nearly collinear (1e-4)",
    y,
    x: { x1, x2, x3 },
    f: {},
    interactions: [],
    centre: false,
  };
}

const designs: Design[] = [];
for (const n of [9, 30, 80, 400, 2000]) {
  // at n = 9 only the designs with few parameters (the others would leave cells of one row)
  for (const kind of n < 30 ? [0, 2, 4] : [0, 1, 2, 3, 4]) designs.push(design(kind, n));
}

const hasR = toolWorks(RSCRIPT, ["-e", "invisible(lm)"]);
Deno.test({
  name: `differential: rstudent, rstandard, hatvalues, residuals match live R lm (seed ${seed})`,
  ignore: skipWithout("Rscript (r-base-core)", hasR),
  fn: async () => {
    const dir = await Deno.makeTempDir({ prefix: "plumbline_lm_" });
    try {
      const manifest: string[] = [];
      for (const [k, d] of designs.entries()) {
        const cols = [["y", d.y], ...Object.entries(d.x), ...Object.entries(d.f)] as const;
        const lines = [cols.map((c) => c[0]).join(",")];
        for (let i = 0; i < d.y.length; i++) {
          lines.push(
            cols.map((
              [, v],
            ) => (typeof v[i] === "number" ? (v[i] as number).toPrecision(17) : v[i])).join(","),
          );
        }
        const path = `${dir}/case${k}.csv`;
        await Deno.writeTextFile(path, lines.join("\n") + "\n");
        const terms = [
          ...Object.keys(d.f),
          ...Object.keys(d.x),
          ...d.interactions.map((t) => t.join(":")),
        ];
        manifest.push(`${path}|y ~ ${terms.join(" + ")}|${d.centre ? 1 : 0}`);
      }
      const script =
        'for (l in readLines(file("stdin"))) { p <- strsplit(l, "|", fixed = TRUE)[[1]]; ' +
        'd <- read.csv(p[1], colClasses = "character"); ' +
        'for (v in names(d)) if (!startsWith(v, "f")) d[[v]] <- as.numeric(d[[v]]); ' +
        'if (p[3] == "1") for (v in names(d)) if (!startsWith(v, "f")) d[[v]] <- d[[v]] - mean(d[[v]]); ' +
        "m <- lm(as.formula(p[2]), data = d); " +
        'for (v in list(rstudent(m), rstandard(m), hatvalues(m), residuals(m))) cat(sprintf("%.17g", v), "\\n") }';
      const out = await runTool(RSCRIPT, ["-e", script], manifest.join("\n") + "\n");
      ok(out?.ok, out?.stderr);
      const rows = out!.stdout.trim().split("\n").map((l) => l.trim().split(/\s+/).map(Number));
      ok(rows.length === 4 * designs.length, `R printed ${rows.length} lines`);
      designs.forEach((d, k) => {
        const fit = fitLinearModel(d.y, {
          covariates: d.x,
          factors: d.f,
          interactions: d.interactions,
        });
        const ctx = `design ${k} (${d.label}, n = ${d.y.length}, seed ${seed}) vs live R`;
        const ours = [fit.studentized, fit.standardized, fit.leverages, fit.residuals];
        ["rstudent", "rstandard", "hatvalues", "residuals"].forEach((what, j) => {
          const ref = rows[4 * k + j];
          ok(ref.length === d.y.length, `${ctx}: ${what} length`);
          const big = Math.max(...ref.filter(Number.isFinite).map(Math.abs));
          // R's NaN marks a row with leverage 1: plumbline lists it in exactRows
          const nan = ref.flatMap((v, i) => (Number.isNaN(v) ? [i] : []));
          if (j < 2) ok(nan.join() === fit.exactRows.join(), `${ctx}: rows with leverage 1`);
          ref.forEach((v, i) =>
            Number.isNaN(v) ||
            assertClose(ours[j][i], v, { rel: 1e-9, abs: 1e-9 * big }, `${what}[${i}], ${ctx}`)
          );
        });
      });
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});
