import assert from "node:assert/strict";
import { assertClose } from "../_assert_close.ts";
import { PlumbError } from "../../lib/errors.ts";
import { normalScores, plottingPosition } from "../../lib/stats/plotting_positions.ts";

const fixture = JSON.parse(
  await Deno.readTextFile(new URL("../fixtures/plotting_positions.json", import.meta.url)),
) as {
  library: { R: string };
  cases: { offset: number; n: number; ranks: number[]; z: number[] }[];
};

// Tolerance: 1e-14 relative or 1e-15 absolute (the normal quantile is
// accurate to about 1e-15; z = 0 has no relative scale).
Deno.test("normal scores match R's qnorm((i − a)/(n + 1 − 2a))", () => {
  for (const c of fixture.cases) {
    const z = normalScores(c.n, { offset: c.offset, ranks: c.ranks });
    c.ranks.forEach((i, k) =>
      assertClose(
        z[k],
        c.z[k],
        { rel: 1e-14, abs: 1e-15 },
        `a = ${c.offset}, n = ${c.n}, i = ${i}, R ${fixture.library.R}`,
      )
    );
  }
});

Deno.test("plotting positions follow their formula exactly", () => {
  assert.equal(plottingPosition(1, 4), 0.625 / 4.25);
  assert.equal(plottingPosition(3, 4, { offset: 0.5 }), 2.5 / 4);
  assert.equal(plottingPosition(2, 9, { offset: 0 }), 2 / 10);
});

Deno.test("normal scores are exactly antisymmetric", () => {
  for (const n of [2, 7, 100, 1001]) {
    const z = normalScores(n);
    for (let i = 0; i < n; i++) assert.equal(z[i] + z[n - 1 - i], 0, `n ${n} rank ${i + 1}`);
  }
});

Deno.test("bad plotting-position input throws PlumbError", () => {
  assert.throws(() => plottingPosition(1, 4, { offset: 1 }), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(
      e.message,
      "Cannot use plotting-position offset 1: use a number in [0, 1), such as 0.375 (Blom)",
    );
    return true;
  });
  assert.throws(() => plottingPosition(5, 4), (e) => {
    assert.ok(e instanceof PlumbError && e.code === "bad-option");
    assert.equal(
      e.message,
      "Cannot place rank 5 among 4 values: use whole numbers with 1 ≤ rank ≤ n",
    );
    return true;
  });
});
