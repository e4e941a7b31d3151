// The residual chain, plumb(table, y).residuals({ covariates, factors }):
// its values against R 4.2.2's rstudent (tests/fixtures/linear_model.json,
// written by tools/fixtures/linear_model.R: R's own data sets and seeded
// badly scaled designs), tolerance 1e-9 relative as for the fit itself;
// the envelope, the reading, the sentence, the counts and the errors.
import assert from "node:assert/strict";
import { loadTable, plumb, PlumbError } from "../../mod.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import { assertClose } from "../_assert_close.ts";
import { assertPlumbError } from "../_shared.ts";

interface Case {
  name: string;
  response: string;
  y: (number | null)[];
  covariates: Record<string, (number | null)[]>;
  factors: Record<string, (string | null)[]>;
  interactions: string[][];
  aliased: "refuse" | "drop";
  expected: { rstudent: (number | null)[]; df: number };
}

const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/linear_model.json", import.meta.url)),
) as { library: { R: string }; cases: Case[] };

function tableOf(c: Case) {
  return loadTable({ [c.response]: c.y, ...c.covariates, ...c.factors });
}

Deno.test(`residual chain values equal R ${fixture.library.R} rstudent to 1e-9 on every fixture case`, async () => {
  let compared = 0;
  for (const c of fixture.cases) {
    if (c.expected.rstudent.some((v) => v === null)) continue; // leverage-1 rows: below
    const t = await tableOf(c);
    const r = plumb(t, c.response).residuals({
      covariates: Object.keys(c.covariates),
      factors: Object.keys(c.factors),
      interactions: c.interactions,
      aliased: c.aliased,
    });
    const v = r.values();
    const e = c.expected.rstudent as number[];
    assert.equal(v.length, e.length, `${c.name}: length`);
    const big = Math.max(...e.map(Math.abs));
    for (let i = 0; i < e.length; i++) {
      assertClose(v[i], e[i], { rel: 1e-9, abs: 1e-9 * big }, `${c.name} rstudent[${i}]`);
    }
    assert.equal(r.model().dfResidual, c.expected.df, c.name);
    compared++;
  }
  assert.ok(compared >= 12, `only ${compared} cases compared`);
});

Deno.test("a row fitted exactly is left out of the residual chain and said so", async () => {
  const c = fixture.cases.find((k) => k.name === "single-row-level")!;
  const t = await tableOf(c);
  const r = plumb(t, c.response).residuals({ covariates: ["x"], factors: ["g"] });
  const kept = c.expected.rstudent.filter((v) => v !== null) as number[];
  assert.equal(r.values().length, kept.length);
  for (let i = 0; i < kept.length; i++) {
    assertClose(
      r.values()[i],
      kept[i],
      { rel: 1e-9, abs: 1e-9 },
      `single-row-level rstudent[${i}]`,
    );
  }
  assert.ok(r.reading().points.some((p) => p.includes("fitted exactly (leverage 1")));
  assert.ok(r.values().every(Number.isFinite));
});

// An invented fill log: volume against line, shift and filler temperature.
function fills(n = 60, seed = 7) {
  let s = seed;
  const u = () => ((s = (s * 16807) % 2147483647) / 2147483647);
  const line = [], shift = [], temp = [], fill = [];
  for (let i = 0; i < n; i++) {
    line.push("ABC"[i % 3]);
    shift.push(["early", "late"][Math.floor(i / 3) % 2]);
    const t = 18 + 4 * u();
    temp.push(t);
    fill.push(500 + (i % 3) * 0.8 + 0.3 * t + (u() + u() + u() - 1.5));
  }
  return { fill_ml: fill, line, shift, temp_c: temp };
}

Deno.test("the residual chain is a normal chain: card, QQ with the simulated envelope, reading, sentence", async () => {
  const data = fills();
  data.fill_ml[4] = NaN; // one missing response
  (data.temp_c as (number | null)[])[9] = null; // one missing covariate
  const p = plumb(data, "fill_ml");
  const r = p.residuals({ covariates: ["temp_c"], factors: ["line", "shift"] });
  assert.equal(r.label, "studentised residuals of fill_ml ~ line + shift + temp_c");
  const a = r.analysis();
  assert.equal(a.n, 58);
  assert.equal(a.origin.missingDropped, 2);
  assert.match(a.qq.envelopeMethod, /Atkinson 1981/);
  assert.equal(
    a.reading.points[0].startsWith(
      "These are the externally studentised residuals of fill_ml ~ line + shift + temp_c",
    ),
    true,
  );
  assert.match(a.reading.points[1], /approximate/);
  const s = r.sentence().text;
  assert.match(s, /externally studentised residuals/);
  assert.match(s, /Pierce & Kopecky 1979/);
  const card = await r[DISPLAY]();
  assert.match(card["text/html"]!, /studentised residuals of fill_ml/);
  assert.match(card["text/html"]!, /<img src="data:image\/png;base64,/); // the charts, as pictures
  // the envelope is the simulated one, deterministic
  const again = p.residuals({ covariates: ["temp_c"], factors: ["line", "shift"] }).analysis();
  assert.deepEqual(again.qq.lower, a.qq.lower);
  // rows: the 1-based source rows of the points skip rows 5 and 10
  assert.ok(!a.qq.row.includes(5) && !a.qq.row.includes(10));
  // a re-expressed response is fitted on its scale
  const logged = p.reexpress("log").residuals({ factors: ["line"] });
  assert.equal(logged.label, "studentised residuals of ln(fill_ml) ~ line");
  assert.equal(logged.analysis().origin.transform, "ln(fill_ml)");
  // a QQ plot with other options keeps the simulated envelope
  const spec = JSON.stringify(r.qq({ level: 0.9 }).spec);
  assert.ok(spec.length > 0);
});

Deno.test("residual chain errors name the column and what to do", () => {
  const data = {
    ...fills(),
    note: Array.from({ length: 60 }, (_, i) => `n${i}`),
    flat: new Array(60).fill(3),
  };
  const p = plumb(data, "fill_ml");
  assertPlumbError(
    () => p.residuals({ covariates: ["line"] }).values(),
    "non-numeric",
    /^Cannot use line as a covariate: it holds text such as "A"; list it under factors/,
  );
  assertPlumbError(() => p.residuals({ covariates: ["flat"] }).values(), "constant", /flat/);
  assertPlumbError(() => p.residuals({ covariates: ["tmp_c"] }), "unknown-column", /tmp_c/);
  assertPlumbError(
    () => p.residuals({ covarites: ["temp_c"] } as never),
    "bad-option",
    /did you mean "covariates"/,
  );
  assertPlumbError(() => p.residuals({ covariates: ["fill_ml"] }), "bad-option", /fill_ml/);
  assertPlumbError(
    () => p.residuals({ factors: ["line"] }).reexpress("log"),
    "bad-option",
    /on a chain of residuals/,
  );
  assertPlumbError(() => p.model(), "bad-option", /no model was fitted/);
  // too few residual degrees of freedom: 5 rows, 3 parameters
  const small = { y: [1, 2, 4, 3, 5], g: ["a", "b", "c", "a", "b"] };
  assertPlumbError(
    () => plumb(small, "y").residuals({ factors: ["g"] }).values(),
    "too-few",
    /residual degrees of freedom, and at least 3 are needed/,
  );
});

Deno.test("collinear covariates: refused by name, or dropped on request with no NaN", () => {
  const data = fills();
  const temp_f = data.temp_c.map((t) => 32 + 1.8 * t);
  const p = plumb({ ...data, temp_f }, "fill_ml");
  let message = "";
  try {
    p.residuals({ covariates: ["temp_c", "temp_f"] }).values();
  } catch (e) {
    assert.ok(e instanceof PlumbError && e.code === "collinear");
    message = e.message;
  }
  assert.match(message, /temp_f is explained by the other terms/);
  const r = p.residuals({ covariates: ["temp_c", "temp_f"], aliased: "drop" });
  assert.ok(r.values().every(Number.isFinite));
  assert.ok(r.reading().points.some((x) => x.includes("temp_f is left out of the fit")));
  assert.equal(r.model().rank, 2);
});
