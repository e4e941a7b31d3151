/**
 * Every options object of the chain is checked: a misspelt option is a
 * `"bad-option"` error naming it and the nearest valid one, `null` means no
 * options, and survey's `columns` is read as names (a string is one name, a
 * name given twice is screened once).
 *
 * @module
 */
import { deepEqual, equal, match, ok } from "node:assert/strict";
import { caughtPlumbError as caught } from "../_shared.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { survey } from "../../lib/plumb/survey.ts";
import { histogramData } from "../../lib/stats/histogram_data.ts";
import { qqData } from "../../lib/stats/qq_data.ts";

// Invented values: two measured columns and a grouping column.
const data = {
  y: [4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1],
  x: [1.2, 0.8, 1.9, 1.1, 1.4, 2.6, 0.9, 1.3, 1.0, 5.2],
  g: ["a", "a", "a", "a", "a", "b", "b", "b", "b", "b"],
};

Deno.test("options: a misspelt option of every chain call is refused, naming the nearest one", () => {
  // deno-lint-ignore no-explicit-any
  const bad = (o: Record<string, unknown>) => o as any;
  const cases: [() => unknown, string, string, string][] = [
    [() => plumb(data, "y", bad({ dropTxt: true })), "dropTxt", "dropText", "plumb"],
    [() => plumb(data, "y", bad({ qq: { envelop: "pointwise" } })), "envelop", "envelope", "qq"],
    [() => plumb(data, "y").qq(bad({ envelop: "simultaneous" })), "envelop", "envelope", ".qq()"],
    [() => plumb(data, "y").detrended(bad({ levle: 0.9 })), "levle", "level", ".detrended()"],
    [() => plumb(data, "y").histogram(bad({ bin: 5 })), "bin", "bins", ".histogram()"],
    [() => plumb(data, "y").histogram(bad({ maxbin: 5 })), "maxbin", "maxBins", ".histogram()"],
    [() => plumb(data, "y").by("g", bad({ adjst: "bh" })), "adjst", "adjust", ".by()"],
    [() => plumb(data, "y").sentence(bad({ ajusted: null })), "ajusted", "adjusted", ".sentence()"],
    [() => survey(data, bad({ colums: ["y"] })), "colums", "columns", "survey"],
    [() => survey(data, bad({ droptext: true })), "droptext", "dropText", "survey"],
    [() => qqData(data.y, bad({ maxpoint: 40 })), "maxpoint", "maxPoints", "qqData"],
    [() => histogramData(data.y, bad({ curve: 9 })), "curve", "curvePoints", "histogramData"],
  ];
  for (const [call, option, near, where] of cases) {
    const e = caught(call);
    equal(e.code, "bad-option");
    match(
      e.message,
      new RegExp(`^Unknown option "${option}" of .*${where.replace(/[.()]/g, "\\$&")}`),
    );
    match(e.message, new RegExp(`did you mean "${near}"\\?`));
    ok(!e.message.endsWith("."), e.message);
  }
});

Deno.test("options: an option nothing resembles lists the options instead", () => {
  // deno-lint-ignore no-explicit-any
  const e = caught(() => plumb(data, "y").histogram({ colour: "red" } as any));
  equal(
    e.message,
    'Unknown option "colour" of .histogram(): the options are rule, width, bins, step, maxBins, curvePoints',
  );
});

Deno.test("options: null means no options everywhere; a non-object is refused", () => {
  const p = plumb(data, "y", null);
  equal(p.analysis().n, 10);
  equal(p.qq(null).spec !== undefined, true);
  equal(p.detrended(null).spec !== undefined, true);
  equal(p.histogram(null).spec !== undefined, true);
  match(p.sentence(null).text, /Shapiro–Wilk/);
  equal(p.by("g", null).result().groups.length, 2);
  equal(survey(data, null).result().rows.length, 2);
  // deno-lint-ignore no-explicit-any
  const e = caught(() => plumb(data, "y", "dropText" as any));
  equal(e.code, "bad-option");
  match(e.message, /^Cannot use string as the options of plumb: give an object/);
  // Options given where the column name goes.
  // deno-lint-ignore no-explicit-any
  const e2 = caught(() => plumb(data.y, { dropText: true } as any));
  match(e2.message, /^Cannot use object as the column name: plumb takes the source, then/);
});

Deno.test("options: a misspelt re-expression is refused with the nearest name", () => {
  const p = plumb(data, "x");
  // deno-lint-ignore no-explicit-any
  const bad = (r: unknown) => r as any;
  match(
    caught(() => p.reexpress(bad("sqr"))).message,
    /^Unknown re-expression "sqr": did you mean "sqrt"\?/,
  );
  match(
    caught(() => p.reexpress(bad({ boxcox: 0.5 }))).message,
    /^Unknown re-expression \{"boxcox":0.5\}: did you mean "boxCox"\?/,
  );
  match(
    caught(() => p.reexpress(bad({ log: { shft: 1 } }))).message,
    /^Unknown option "shft" of the log re-expression: did you mean "shift"\?/,
  );
});

Deno.test("survey: a column named twice is screened once, in a family of one", () => {
  const once = survey(data, { columns: ["y"] }).result();
  const twice = survey(data, { columns: ["y", "y"] });
  const r = twice.result();
  equal(r.rows.length, 1);
  equal(r.rows[0].column, "y");
  deepEqual(r.repeated, ["y"]);
  // The Holm family is the one column: the adjusted p is the raw p.
  equal(r.rows[0].adjustedP, r.rows[0].analysis!.primary.pValue);
  equal(r.rows[0].adjustedP, once.rows[0].adjustedP);
  ok(twice.table().notes!.some((n) => n === "Named more than once in columns, screened once: y."));
  deepEqual(once.repeated, []);
});

Deno.test("survey: a string is one column name, never its letters", () => {
  const one = survey(data, { columns: "y" }).result();
  deepEqual(one.rows.map((r) => r.column), ["y"]);
  // "xy" is not the columns x and y: the table has no column "xy".
  const e = caught(() => survey(data, { columns: "xy" }));
  equal(e.code, "unknown-column");
  match(e.message, /^No column named "xy": the table has "y", "x", "g"/);
  // deno-lint-ignore no-explicit-any
  const e2 = caught(() => survey(data, { columns: [1, 2] as any }));
  equal(e2.code, "bad-option");
  match(e2.message, /^Cannot read the columns option of survey: give column names/);
});
