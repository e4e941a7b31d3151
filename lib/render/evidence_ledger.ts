/**
 * The card's evidence, grouped by what each measure looks at rather than
 * listed test by test: the ends of the distribution (tails, far values), its
 * lean (skew), its middle (the bulk's shape), and the whole QQ line. Each row
 * says how strongly its measure points away from normal, on one scale, so
 * that a user sees which part of the shape the departure lives in.
 *
 * What each measure is most sensitive to (sources):
 * - Anderson–Darling weights the empirical distribution's distance from the
 *   normal by 1/(F(1 − F)), so it looks hardest at the tails (Anderson &
 *   Darling 1954, JASA 49:765–769);
 * - Lilliefors' largest vertical gap between the two distribution functions
 *   falls mostly in the middle, where both change fastest (Stephens 1974,
 *   JASA 69:730–737, on the EDF statistics' power);
 * - D'Agostino's skewness and kurtosis scores each look at one moment
 *   (D'Agostino 1970; Anscombe & Glynn 1983), and G1, G2 against their
 *   standard errors (Joanes & Gill 1998) likewise;
 * - Shapiro–Wilk and Shapiro–Francia measure how straight the whole QQ plot
 *   is (W is the squared ratio of the order-statistic slope to the sd);
 *   K² and Jarque–Bera combine the two moments.
 *
 * Strength: for a test, −log₁₀ p / 2 (1 at p = 0.01); for G1 or G2,
 * |G| / (2.576·SE) (1 where it starts to count). Below 0.65 (p ≈ 0.05) the
 * mark is grey, up to 1 amber, beyond vermillion; the bar is capped at 4.
 *
 * @module
 */
import type { Analysis, TestOutcome } from "../results/analysis.ts";
import type { DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import type { TestResult } from "../stats/result.ts";
import { pCell } from "./analysis_tables.ts";
import { escapeHtml } from "./escape.ts";
import { formatCount, formatNumber, formatP } from "../results/format.ts";

/** One measure in the ledger. */
export interface LedgerRow {
  /** What the measure is, in a few words. */
  readonly what: string;
  /** Its value, as written. */
  readonly value: string;
  /** Its p-value (with any bound) or the effect against its standard error. */
  readonly evidence: string;
  /** How strongly it points away from normal (see the module header); null when not run. */
  readonly strength: number | null;
}

/** A group of measures that look at the same part of the shape. */
export interface LedgerGroup {
  readonly title: string;
  readonly rows: readonly LedgerRow[];
}

/** A p as written after "p": "= 0.0457", "< 0.0001", "≥ 0.1000". */
const _pText = (p: string) => (/^[<≤≥]/.test(p) ? `p ${p}` : `p = ${p}`);

const _pStrength = (p: number) => (p > 0 ? Math.min(10, -Math.log10(p)) / 2 : 5);

function _test(tests: readonly TestOutcome[], name: string): TestOutcome | undefined {
  return tests.find((t) => t.test === name);
}

function _testRow(
  o: TestOutcome | undefined,
  what: string,
  symbol: string,
  digits = 4,
): LedgerRow[] {
  if (o === undefined) return [];
  if (!o.result) {
    // "Cannot run … on 6 values: at least 8 are needed" reads "needs at least 8 values" here
    const least = /at least (\d+)/.exec(o.skipped ?? "");
    const most = /at most (\d+)/.exec(o.skipped ?? "");
    const why = least
      ? `needs at least ${least[1]} values`
      : most
      ? `calibrated for at most ${most[1]} values`
      : o.skipped ?? "";
    return [{ what, value: "not run", evidence: why, strength: null }];
  }
  const r = o.result as TestResult & { pBound?: string };
  const p = pCell(r);
  return [{
    what,
    value: `${symbol} = ${formatNumber(r.statistic, digits)}`,
    evidence: _pText(p),
    strength: _pStrength(r.pValue),
  }];
}

/** One of K²'s two component scores. */
function _scoreRow(what: string, z: number, p: number): LedgerRow {
  return {
    what,
    value: `z = ${formatNumber(z, 3)}`,
    evidence: _pText(formatP(p)),
    strength: _pStrength(p),
  };
}

function _effectRow(what: string, symbol: string, g: number, se: number): LedgerRow {
  return {
    what,
    value: `${symbol} = ${formatNumber(g, 3)}`,
    evidence: `${formatNumber(Math.abs(g) / se, 2)} × SE`,
    strength: Math.abs(g) / (2.576 * se),
  };
}

/**
 * The ledger of one analysis, in four groups.
 *
 * @param a the analysis
 *
 * @example
 * ```ts
 * import { analyse } from "../plumb/analysis.ts";
 * import { evidenceLedger } from "./evidence_ledger.ts";
 * const x = new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 4.5]);
 * const l = evidenceLedger(analyse(x, { label: "fill", column: "fill", missingDropped: 0, textDropped: 0 }));
 * const heads = l.map((g) => g.title.split(":")[0]).join("|");
 * if (heads !== "The ends|The lean|The middle|The whole line") throw new Error("groups");
 * ```
 */
export function evidenceLedger(a: Analysis): LedgerGroup[] {
  const m = a.moments;
  const f = a.reading.facts;
  const k2 = _test(a.tests, "D'Agostino–Pearson")?.result as DagostinoPearsonResult | undefined;
  const ends: LedgerRow[] = [
    _effectRow("excess kurtosis", "G2", m.G2, m.seG2),
    ..._testRow(_test(a.tests, "Anderson–Darling"), "Anderson–Darling, tail-weighted", "A²"),
  ];
  if (k2) ends.push(_scoreRow("D'Agostino kurtosis score", k2.kurtosisZ, k2.kurtosisP));
  const o = f.outliers;
  // Far values on the cluster's side belong to the cluster, not to the outliers.
  const apart = o.values.filter((v) => !(f.cluster !== null && v.side === f.cluster.side));
  ends.push({
    what: `outliers (ESD, ${Number((100 * o.level).toPrecision(2))}% level)`,
    value: apart.length === 0 ? "none" : `${apart.length}`,
    evidence: apart.length === 0
      ? (o.count > 0 ? "far values belong to the cluster" : "no value apart")
      : `farthest ${formatNumber(apart[0].value, 4)}${
        // A query source gives no rows (−1).
        apart[0].row >= 0 ? ` (row ${formatCount(apart[0].row)})` : ""}`,
    strength: apart.length === 0 ? 0 : 1.5,
  });
  ends.push({
    what: "separate cluster",
    value: f.cluster === null ? "none" : `${formatCount(f.cluster.count)} values`,
    evidence: f.cluster === null
      ? "no group cut off"
      : `${f.cluster.side === "high" ? "above" : "below"} a gap, ${
        formatNumber(f.cluster.gap[0], 4)
      } to ${formatNumber(f.cluster.gap[1], 4)}`,
    strength: f.cluster === null ? 0 : 2,
  });
  const lean: LedgerRow[] = [_effectRow("skewness", "G1", m.G1, m.seG1)];
  if (k2) lean.push(_scoreRow("D'Agostino skewness score", k2.skewnessZ, k2.skewnessP));
  const middle = _testRow(_test(a.tests, "Lilliefors"), "Lilliefors, largest CDF gap", "D");
  if (a.censoring) return _censoredLedger(a, ends, lean);
  const sw = _test(a.tests, "Shapiro–Wilk");
  const whole: LedgerRow[] = _testRow(sw, "Shapiro–Wilk", "W", 4).map((r) => ({
    ...r,
    value: `${r.value} = (${formatNumber(f.sigma.slope, 3)} / ${formatNumber(f.sigma.sd, 3)})²`,
    evidence: a.subsample
      ? `${r.evidence} (on ${formatCount(a.subsample.size)} of ${formatCount(a.n)})`
      : r.evidence,
  }));
  whole.push(
    ..._testRow(_test(a.tests, "Shapiro–Francia"), "Shapiro–Francia", "W′", 4),
    ..._testRow(_test(a.tests, "D'Agostino–Pearson"), "D'Agostino–Pearson, both moments", "K²"),
    ..._testRow(_test(a.tests, "Jarque–Bera"), "Jarque–Bera, both moments", "JB"),
  );
  return [
    { title: "The ends: tails and far values", rows: ends },
    { title: "The lean: skew", rows: lean },
    { title: "The middle: the bulk's shape", rows: middle },
    { title: "The whole line: overall straightness", rows: whole },
  ];
}

/**
 * The ledger of a censored sample: the tests for complete samples are not
 * run (one row says so, in the middle group), and the whole-line group holds
 * the censored-sample test.
 */
function _censoredLedger(a: Analysis, ends: LedgerRow[], lean: LedgerRow[]): LedgerGroup[] {
  const c = a.censoring!;
  const k = c.left + c.right;
  const whole = _testRow(
    { test: a.primary.test, result: a.primary },
    "Shapiro–Francia for censored values",
    "W′",
    4,
  ).map((r) => ({
    ...r,
    evidence: a.subsample
      ? `${r.evidence} (on ${formatCount(a.subsample.size)} of ${formatCount(a.n)})`
      : r.evidence,
  }));
  return [
    { title: "The ends: tails and far values", rows: ends.filter((r) => r.value !== "not run") },
    { title: "The lean: skew", rows: lean },
    {
      title: "The middle: the bulk's shape",
      rows: [{
        what: "tests for complete samples",
        value: "not run",
        evidence: `${formatCount(k)} of ${formatCount(a.n)} values censored`,
        strength: null,
      }],
    },
    { title: "The whole line: overall straightness", rows: whole },
  ];
}

/** The strength mark: a short bar, grey, amber or vermillion by strength. */
function _mark(s: number | null): string {
  if (s === null) return "";
  const w = Math.round(6 + 44 * Math.min(4, s) / 4);
  const colour = s < 0.65 ? "#bbbbbb" : s < 1 ? "#E69F00" : "#D55E00";
  return `<span style="display:inline-block;width:50px"><span style="display:inline-block;` +
    `width:${w}px;height:7px;border-radius:3px;background:${colour};vertical-align:middle">` +
    `</span></span>`;
}

/**
 * The ledger as HTML: one small heading per group, one line per measure.
 *
 * @param groups the ledger
 */
export function ledgerHtml(groups: readonly LedgerGroup[]): string {
  const cell = "padding:1px 6px;vertical-align:top";
  const body = groups.map((g) =>
    `<tr><td colspan="3" style="padding:7px 6px 1px;font-weight:bold;border-bottom:1px solid #ddd">${
      escapeHtml(g.title)
    }</td></tr>` +
    g.rows.map((r) =>
      `<tr><td style="${cell};width:1%;white-space:nowrap">${_mark(r.strength)}</td>` +
      `<td style="${cell};width:1%;white-space:nowrap">${escapeHtml(r.what)}</td>` +
      `<td style="${cell}">${escapeHtml(r.value)}<span style="color:#555"> · ${
        escapeHtml(r.evidence)
      }</span></td></tr>`
    ).join("")
  ).join("");
  return `<table class="plumbline-ledger" style="border-collapse:collapse;font-size:88%;width:100%">` +
    `<caption style="text-align:left;font-weight:bold;padding:0 6px 2px">Where the evidence points</caption>${body}</table>`;
}

/**
 * The ledger as lines of text (Markdown list items or plain text).
 *
 * @param groups the ledger
 */
export function ledgerLines(groups: readonly LedgerGroup[]): string[] {
  const out: string[] = ["Where the evidence points:"];
  for (const g of groups) {
    out.push(`${g.title}:`);
    for (const r of g.rows) out.push(`  - ${r.what}: ${r.value}, ${r.evidence}`);
  }
  return out;
}
