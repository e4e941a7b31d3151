import assert from "node:assert/strict";
import {
  formatCompact,
  formatCount,
  formatNumber,
  formatP,
  formatPClause,
  roundSig,
} from "../../lib/results/format.ts";

Deno.test("formatCount groups thousands", () => {
  assert.equal(formatCount(0), "0");
  assert.equal(formatCount(999), "999");
  assert.equal(formatCount(1000), "1,000");
  assert.equal(formatCount(1000000), "1,000,000");
  assert.equal(formatCount(-12345), "−12,345");
});

Deno.test("formatNumber: significant digits, true minus, exponent outside [1e-4, 1e6)", () => {
  assert.equal(formatNumber(3.14159), "3.142");
  assert.equal(formatNumber(-2.5, 3), "−2.50");
  assert.equal(formatNumber(0.000012346), "1.235e−5");
  assert.equal(formatNumber(-0.000012346), "−1.235e−5");
  assert.equal(formatNumber(123456789), "1.235e8");
  assert.equal(formatNumber(0), "0");
  assert.equal(formatNumber(Infinity), "∞");
  assert.equal(formatNumber(-Infinity), "−∞");
  assert.equal(formatNumber(NaN), "not computed");
});

Deno.test("formatCompact: no trailing zeros, true minus in the number and its exponent", () => {
  assert.equal(formatCompact(0.5), "0.5");
  assert.equal(formatCompact(-2), "−2");
  assert.equal(formatCompact(-0.0106543), "−0.01065");
  assert.equal(formatCompact(1.23456e-7), "1.235e−7");
  assert.equal(formatCompact(2.5e21), "2.5e21");
});

Deno.test("p-values: four decimals, a bound below 0.0001", () => {
  assert.equal(formatP(0.5), "0.5000");
  assert.equal(formatP(0.00012), "0.0001");
  assert.equal(formatP(0.00009), "< 0.0001");
  assert.equal(formatPClause(0.0457), "p = 0.0457");
  assert.equal(formatPClause(1e-12), "p < 0.0001");
});

Deno.test("roundSig keeps the stated significant digits", () => {
  assert.equal(roundSig(123.456789, 5), 123.46);
  assert.equal(roundSig(-0.000123456, 3), -0.000123);
  assert.equal(roundSig(0), 0);
});
