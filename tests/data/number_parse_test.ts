import assert from "node:assert/strict";
import fc from "fast-check";
import { _scanNumber, parseNumber } from "../../lib/data/number_parse.ts";
import { _wideDecimal } from "../../lib/data/_wide_decimal.ts";
import { tableFromCsv } from "../../lib/data/csv_text.ts";

Deno.test("parseNumber accepts the strict grammar", () => {
  const cases: [string, number][] = [
    ["0", 0],
    ["-0", -0],
    ["+3", 3],
    ["12", 12],
    ["1.5", 1.5],
    ["1.", 1],
    [".5", 0.5],
    ["-.5", -0.5],
    ["1e3", 1000],
    ["1E-3", 0.001],
    ["2.5e+2", 250],
    ["007", 7],
    ["  42  ", 42],
    ["\t-1.25", -1.25],
    ["0.1", 0.1],
    ["123456789012345678", 123456789012345680],
    ["1e-320", 1e-320],
  ];
  for (const [text, expected] of cases) {
    assert.ok(
      Object.is(parseNumber(text), expected),
      `${JSON.stringify(text)} → ${parseNumber(text)}`,
    );
  }
});

Deno.test("parseNumber rejects partial reads, non-finite values and other notations", () => {
  for (
    const text of [
      "",
      " ",
      "12abc",
      "abc12",
      "1.2.3",
      "1e",
      "1e+",
      "e5",
      "+",
      "-",
      ".",
      "Infinity",
      "-Infinity",
      "inf",
      "NaN",
      "0x10",
      "0b11",
      "1_000",
      "1,5",
      "1 000",
      "1e999",
      "--1",
      "1-",
    ]
  ) {
    assert.ok(Number.isNaN(parseNumber(text)), `${JSON.stringify(text)} should not be a number`);
  }
});

Deno.test("parseNumber reads a decimal comma only when asked", () => {
  assert.equal(parseNumber("2,5", { decimal: "," }), 2.5);
  assert.equal(parseNumber("-,5", { decimal: "," }), -0.5);
  assert.ok(Number.isNaN(parseNumber("2.5", { decimal: "," })));
  assert.ok(Number.isNaN(parseNumber("2,5")));
});

Deno.test("parseNumber accepts a thousands separator only when given, in groups of three", () => {
  assert.ok(Number.isNaN(parseNumber("1,234")));
  assert.equal(parseNumber("1,234", { thousands: "," }), 1234);
  assert.equal(parseNumber("1,234,567.25", { thousands: "," }), 1234567.25);
  assert.equal(parseNumber("1.234,5", { decimal: ",", thousands: "." }), 1234.5);
  assert.equal(parseNumber("1234", { thousands: "," }), 1234);
  assert.ok(Number.isNaN(parseNumber("12,34", { thousands: "," })));
  assert.ok(Number.isNaN(parseNumber("1,2345", { thousands: "," })));
});

// Property: for any finite double, its shortest round-trip text (String) and
// fixed/exponential forms read back as the double Number() gives (the
// engine's conversion is correctly rounded; ours must agree bit for bit).
Deno.test("parseNumber agrees bit for bit with Number() on generated numerals", () => {
  const double = fc.double({ noNaN: true, noDefaultInfinity: true });
  fc.assert(
    fc.property(double, fc.integer({ min: 0, max: 12 }), (x, digits) => {
      for (const text of [String(x), x.toFixed(Math.min(digits, 100)), x.toExponential(digits)]) {
        const expected = Number(text);
        if (!Number.isFinite(expected)) continue;
        assert.ok(
          Object.is(parseNumber(text), expected),
          `${text}: ${parseNumber(text)} vs ${expected}`,
        );
        assert.ok(Object.is(_scanNumber(text, 0, text.length, 46), expected));
      }
    }),
    { seed: 20260101, numRuns: 3000 },
  );
});

Deno.test("parseNumber agrees with Number() on short decimal numerals (the fast exact case)", () => {
  fc.assert(
    fc.property(
      fc.integer({ min: -999999999, max: 999999999 }),
      fc.integer({ min: 0, max: 9 }),
      (m, places) => {
        const s = String(Math.abs(m)).padStart(places + 1, "0");
        const text = `${m < 0 ? "-" : ""}${s.slice(0, s.length - places)}.${
          s.slice(s.length - places)
        }`;
        assert.ok(Object.is(parseNumber(text), Number(text)), text);
      },
    ),
    { seed: 7, numRuns: 5000 },
  );
});

// The 16–19 digit path (double-double with a rounding check) against the
// engine's correctly rounded Number(), on numerals built to sit near
// rounding boundaries: 17-digit shortest forms, their neighbours one unit in
// the last digit away, and 19-digit numerals.
Deno.test("16–19 significant digits round exactly like Number()", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 1e-6, max: 1e12, noNaN: true }),
      fc.integer({ min: -3, max: 3 }),
      fc.integer({ min: 0, max: 99 }),
      (x, nudge, tail) => {
        const shortest = x.toPrecision(17);
        const digits = shortest.replace(/e.*$/, "");
        const last = Number(digits.at(-1));
        const bumped = digits.slice(0, -1) + String(Math.min(9, Math.max(0, last + nudge)));
        const longer = digits + String(tail).padStart(2, "0");
        for (const text of [shortest, bumped, longer, `-${bumped}`]) {
          const expected = Number(text);
          assert.ok(
            Object.is(parseNumber(text), expected),
            `${text}: ${parseNumber(text)} vs ${expected}`,
          );
          const csv = tableFromCsv(`v\n${text}\n`, { reader: "simple" }).numeric("v").values[0];
          assert.ok(Object.is(csv, expected), `${text} (quick reader): ${csv} vs ${expected}`);
        }
      },
    ),
    { seed: 99, numRuns: 3000 },
  );
});

Deno.test("halfway cases with 17+ digits resolve like Number()", () => {
  // Decimal midpoints between adjacent doubles near 1, 2^53 and 0.1, written
  // out exactly, and one digit either side of them.
  const cases = [
    "1.00000000000000011102230246251565404", // 1 + 2^-53: ties to even (1)
    "1.0000000000000001110223024625156540",
    "1.0000000000000001110223024625156541",
    "9007199254740993", // 2^53 + 1: ties to even (2^53)
    "9007199254740995",
    "0.1000000000000000055511151231257827",
    "0.10000000000000000555",
    "4503599627370496.5",
    "4503599627370497.5",
  ];
  for (const text of cases) {
    assert.ok(
      Object.is(parseNumber(text), Number(text)),
      `${text}: ${parseNumber(text)} vs ${Number(text)}`,
    );
    const csv = tableFromCsv(`v\n${text}\n`).numeric("v").values[0];
    assert.ok(Object.is(csv, Number(text)), `${text} (quick reader)`);
  }
});

// The double-double path must decide nearly always (it falls back to
// Number() only near exact ties); otherwise long numerals would be slow.
Deno.test("the 16–19 digit path decides all but the near-tie cases", () => {
  let decided = 0;
  const runs = 2000;
  fc.assert(
    fc.property(
      fc.integer({ min: 1e14, max: 999999999999999 }),
      fc.integer({ min: 0, max: 99 }),
      fc.integer({ min: -22, max: -2 }),
      (high, low, k) => {
        const v = _wideDecimal(high, low, 2, k);
        if (v === v) {
          decided++;
          assert.ok(Object.is(v, Number(`${high}${String(low).padStart(2, "0")}e${k}`)));
        }
      },
    ),
    { seed: 5, numRuns: runs },
  );
  assert.ok(decided >= 0.99 * runs, `decided ${decided} of ${runs}`);
});
