import { ok, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { studentTUpper } from "../../lib/numeric/student_t.ts";
import { assertClose } from "../_assert_close.ts";

// Reference: tests/fixtures/outliers.json, written by tools/fixtures/outliers.R from
// R's stats::qt (R's version is in the file).
const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/outliers.json", import.meta.url)),
) as { library: { R: string }; t: { q: number; df: number; t: number }[] };
const src = `R ${fixture.library.R} qt`;

Deno.test(`studentTUpper matches ${src} to 1e-11 relative, df 1 to 1e6, tails to 1e-12`, () => {
  for (const c of fixture.t) {
    assertClose(
      studentTUpper(c.q, c.df),
      c.t,
      { rel: 1e-11 },
      `q = ${c.q}, df = ${c.df} vs ${src}`,
    );
  }
});

Deno.test("studentTUpper: closed forms and limits", () => {
  // df = 1 is Cauchy: t = cot(πq); df = 2: t = (1 − 2q)/√(2q(1 − q))
  for (const q of [0.3, 0.1, 0.01, 1e-5]) {
    assertClose(studentTUpper(q, 1), 1 / Math.tan(Math.PI * q), { rel: 1e-12 }, `Cauchy ${q}`);
    assertClose(
      studentTUpper(q, 2),
      (1 - 2 * q) / Math.sqrt(2 * q * (1 - q)),
      { rel: 1e-12 },
      `t2 ${q}`,
    );
  }
  // a huge df approaches the normal: z(0.025) = 1.959963984540054 (mpmath, 50 digits)
  ok(Math.abs(studentTUpper(0.025, 1e12) - 1.959963984540054) < 1e-9);
});

Deno.test("studentTUpper refuses probabilities outside (0, ½) and non-positive df", () => {
  for (const [q, df] of [[0, 3], [0.5, 3], [-1, 3], [0.1, 0], [0.1, -2], [0.1, NaN], [NaN, 3]]) {
    throws(() => studentTUpper(q, df), (e) => e instanceof PlumbError && e.code === "bad-option");
  }
});
