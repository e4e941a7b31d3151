/**
 * The reading: the shape of a sample in plain words, computed from the
 * numbers, with the sample size in view.
 *
 * Thresholds and their sources:
 * - skewness strength by |G1|: below 0.5 near symmetric, 0.5–1 moderate,
 *   above 1 strong (Bulmer 1979, Principles of Statistics, Dover, p. 63;
 *   from memory); a skew is only called when |G1| exceeds twice its
 *   standard error under normality (common practice);
 * - tails by G2 (excess kurtosis): called heavy or light only when |G2|
 *   exceeds twice its standard error; |G2| above 1 is "clearly" (common
 *   practice);
 * - ties: fewer than 70% distinct values (common practice, the same rule as
 *   the tests' ties warning); the apparent resolution is the smallest gap
 *   between distinct values;
 * - bimodality hint: Sarle's bimodality coefficient
 *   b = (G1² + 1) / (G2 + 3(n−1)²/((n−2)(n−3))) above 5/9, the value for a
 *   uniform distribution (Pfister et al. 2013, "Good things peak in pairs",
 *   Frontiers in Psychology 4:700), together with negative G2 so that a
 *   merely skewed sample is not flagged (common practice);
 * - a pile-up at an end: at least 3 values, and at least 2% of them, equal
 *   to the minimum (or the maximum) read as a floor (or ceiling) such as a
 *   detection limit (common practice);
 * - sample size: below 20 values the tests have little power, 20–49 modest
 *   power; above 2000 they flag departures too small to matter (common
 *   practice);
 * - the verdict: "clear departure" when Shapiro–Wilk p < 0.01 and an effect
 *   is large enough to matter (|G1| ≥ 0.5 or |G2| ≥ 1); "no clear
 *   departure" when p ≥ 0.05 and no effect is that large; otherwise "mild
 *   departure" (common practice). Above 2000 values the verdict rests on
 *   the effect sizes alone — large as above is clear, |G1| ≥ 0.25 or
 *   |G2| ≥ 0.5 is mild — because p is then small for trivial departures.
 *   Envelope exits are described but not counted in the verdict: a
 *   pointwise band's exits are strongly correlated between neighbours.
 *
 * Kept in one file because the thresholds above and the sentences they lead
 * to must be read side by side: the words are only as right as the rules
 * behind them.
 *
 * @module
 */
import { sortFloat64 } from "../numeric/sort.ts";
import type { DagostinoPearsonResult } from "../stats/dagostino_pearson.ts";
import type { Moments } from "../stats/moments.ts";
import type { QqData } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { formatNumber } from "../results/format.ts";
import type { Subsample } from "../results/analysis.ts";
import type { Reading, ReadingFacts, Verdict } from "../results/reading.ts";

/** What {@linkcode readShape} needs. */
export interface ReadingInput {
  readonly n: number;
  readonly moments: Moments;
  readonly primary: TestResult;
  readonly dagostino?: DagostinoPearsonResult;
  readonly qq: QqData;
  /** The values (any order); sorted internally for ties and resolution. */
  readonly values: ArrayLike<number>;
  /** The values already sorted, when the caller has them. */
  readonly sortedSample?: Float64Array;
  /** The seeded subsample the primary test ran on, when it did not use every value. */
  readonly subsample?: Subsample | null;
}

const f3 = (x: number) => formatNumber(x, 3);

/** How many values equal the one at position `at` of the sorted sample (an end). */
function _runLength(sorted: Float64Array, at: number): number {
  const v = sorted[at];
  let k = 0;
  if (at === 0) { while (k < sorted.length && sorted[k] === v) k++; }
  else while (k < sorted.length && sorted[sorted.length - 1 - k] === v) k++;
  return k;
}
const _cap = (s: string) => s[0].toUpperCase() + s.slice(1);

/**
 * Distinct values and the smallest gap between them. Gaps below 1e-9 of the
 * range count as ties: they are floating-point noise (e.g. residuals of
 * rounded data), not measurement resolution.
 */
function _ties(sorted: Float64Array): { distinct: number; resolution: number } {
  let distinct = sorted.length > 0 ? 1 : 0;
  let gap = Infinity;
  // Scaled before subtracting, so that a range beyond ±1.8e308 cannot overflow.
  const tiny = 1e-9 * sorted[sorted.length - 1] - 1e-9 * sorted[0];
  for (let i = 1; i < sorted.length; i++) {
    const d = sorted[i] - sorted[i - 1];
    if (d > tiny) {
      distinct++;
      if (d < gap) gap = d;
    }
  }
  // A gap between values of opposite sign near ±1.8e308 overflows: report the largest double.
  return { distinct, resolution: Math.min(gap, Number.MAX_VALUE) };
}

/**
 * Build the reading of a sample from its moments, tests and QQ data.
 *
 * @param input the numbers (see {@linkcode ReadingInput})
 *
 * @example
 * ```ts
 * import { readShape } from "./reading.ts";
 * import { moments } from "@plumbline/plumbline";
 * import { qqData } from "@plumbline/plumbline";
 * import { shapiroWilk } from "@plumbline/plumbline";
 * const x = Array.from({ length: 200 }, (_, i) => Math.exp((i - 100) / 40));
 * const r = readShape({ n: 200, moments: moments(x), primary: shapiroWilk(x), qq: qqData(x), values: x });
 * if (r.facts.skew !== "right" || r.verdict !== "clear-departure") throw new Error(r.headline);
 * ```
 */
export function readShape(input: ReadingInput): Reading {
  const { n, moments: m, primary, qq } = input;
  const sorted = input.sortedSample ?? sortFloat64(Float64Array.from(input.values));
  const { distinct, resolution } = _ties(sorted);
  const tied = distinct < 0.7 * n;

  const skewSeen = Math.abs(m.G1) > 2 * m.seG1;
  const skew: ReadingFacts["skew"] = skewSeen ? (m.G1 > 0 ? "right" : "left") : "none";
  const a1 = Math.abs(m.G1);
  const skewStrength = a1 < 0.5 ? "slight" : a1 <= 1 ? "moderate" : "strong";
  const tailSeen = Math.abs(m.G2) > 2 * m.seG2;
  const tails: ReadingFacts["tails"] = tailSeen ? (m.G2 > 0 ? "heavy" : "light") : "as expected";
  const bimodality = (m.G1 * m.G1 + 1) / (m.G2 + (3 * (n - 1) ** 2) / ((n - 2) * (n - 3)));

  // Tails are the lowest and highest 10% of ranks (at least 3 each); the rest is the body.
  const tailSize = Math.max(3, Math.ceil(0.1 * n));
  const lowerTail = { below: 0, above: 0 };
  const upperTail = { below: 0, above: 0 };
  let body = 0;
  for (let k = 0; k < qq.shown; k++) {
    const o = qq.outside[k];
    if (o === 0) continue;
    const r = qq.rank[k];
    if (r <= tailSize) o < 0 ? lowerTail.below++ : lowerTail.above++;
    else if (r > n - tailSize) o < 0 ? upperTail.below++ : upperTail.above++;
    else body++;
  }

  const points: string[] = [];
  if (skew !== "none") {
    const side = skew === "right"
      ? "a longer tail towards high values"
      : "a longer tail towards low values";
    points.push(
      `${_cap(skewStrength)} ${skew} skew: G1 = ${f3(m.G1)} (standard error ${
        f3(m.seG1)
      }), ${side}`,
    );
  } else {
    points.push(
      `No skew beyond what chance gives at n = ${n}: G1 = ${f3(m.G1)} (standard error ${
        f3(m.seG1)
      })`,
    );
  }
  if (tails !== "as expected") {
    const strong = Math.abs(m.G2) >= 1 ? "clearly " : "";
    points.push(
      tails === "heavy"
        ? `Tails ${strong}heavier than normal: excess kurtosis G2 = ${f3(m.G2)} (standard error ${
          f3(m.seG2)
        }); extreme values are more common than a normal curve predicts`
        : `Tails ${strong}lighter than normal: excess kurtosis G2 = ${f3(m.G2)} (standard error ${
          f3(m.seG2)
        }); values bunch between the extremes, as in a flat or bounded distribution`,
    );
  }
  // [count, subject (one, many), where, what it means]
  const exitKinds: [number, string, string, string][] = [
    [
      lowerTail.below,
      "of the lowest values falls|of the lowest values fall",
      "below it",
      "the low end reaches further than a normal curve",
    ],
    [
      lowerTail.above,
      "of the lowest values sits|of the lowest values sit",
      "above it",
      "the low end stops short",
    ],
    [
      upperTail.above,
      "of the highest values rises|of the highest values rise",
      "above it",
      "the high end reaches further than a normal curve",
    ],
    [
      upperTail.below,
      "of the highest values sits|of the highest values sit",
      "below it",
      "the high end stops short",
    ],
    [
      body,
      "value in the middle lies|values in the middle lie",
      "outside it",
      "the bulk of the data bends away from the line",
    ],
  ];
  const exits = exitKinds.filter(([k]) => k > 0).map(([k, subject, where, meaning]) => {
    const [one, many] = subject.split("|");
    return `${k} ${k === 1 ? one : many} ${where} (${meaning})`;
  });
  const band = `${Math.round(qq.level * 100)}% ${qq.envelope} band`;
  if (exits.length > 0) {
    points.push(
      `Against the QQ plot's ${band}: ${
        exits.join("; ")
      }. Neighbouring points move together, so a run of exits at one end counts as one sign, not many`,
    );
  } else {
    points.push(`Every QQ point shown lies inside the ${band}`);
  }
  const extreme: string[] = [];
  if (qq.shown > 0 && qq.outside[0] === -1) {
    extreme.push(`the smallest value, ${f3(qq.value[0])} (row ${qq.row[0]})`);
  }
  if (qq.shown > 1 && qq.outside[qq.shown - 1] === 1) {
    extreme.push(`the largest value, ${f3(qq.value[qq.shown - 1])} (row ${qq.row[qq.shown - 1]})`);
  }
  if (extreme.length > 0) {
    points.push(
      `Possible outlier${extreme.length > 1 ? "s" : ""} beyond the band: ${
        extreme.join(" and ")
      }; check the record before anything else`,
    );
  }
  const atMin = _runLength(sorted, 0), atMax = _runLength(sorted, n - 1);
  for (
    const [count, value, end] of [[atMin, sorted[0], "minimum"], [
      atMax,
      sorted[n - 1],
      "maximum",
    ]] as const
  ) {
    if (count >= 3 && count >= 0.02 * n) {
      points.push(
        `${count} values sit exactly at the ${end}, ${f3(value)}: a ${
          end === "minimum" ? "floor" : "ceiling"
        } such as a detection or reporting limit; no re-expression makes a pile-up at a limit look normal, so consider methods for censored data`,
      );
    }
  }
  if (tied) {
    points.push(
      `Only ${distinct} distinct values among ${n}, apparent resolution ${
        f3(resolution)
      }: the data look rounded or counted, which alone can make the tests reject; the QQ plot will show steps`,
    );
  }
  if (bimodality > 5 / 9 && m.G2 < 0 && n >= 20) {
    points.push(
      `A hint of two peaks: bimodality coefficient ${
        f3(bimodality)
      } (above 0.555, the uniform's value) with light tails; look at the histogram, and consider whether two groups are mixed`,
    );
  }

  let sizeNote: string;
  if (n < 20) {
    sizeNote =
      `With only ${n} values the tests have little power: a large p is weak evidence, and the plot matters more than the p-value`;
  } else if (n < 50) {
    sizeNote =
      `With ${n} values the tests have modest power: moderate departures can go undetected`;
  } else if (n <= 2000) {
    sizeNote = `With ${n} values the tests have reasonable power for moderate departures`;
  } else {sizeNote =
      `With ${n} values even trivial departures give small p-values: judge by the plot and the effect sizes (G1, G2, 1 − W), not by p`;}
  if (input.subsample) {
    sizeNote += `. Shapiro–Wilk used a seeded random subsample of ${input.subsample.size} values ` +
      `(its p-value is calibrated up to 5000); the other tests used all ${n}`;
  }

  const a2 = Math.abs(m.G2);
  const bigEffect = a1 >= 0.5 || a2 >= 1;
  const someEffect = a1 >= 0.25 || a2 >= 0.5;
  const p = primary.pValue;
  let verdict: Verdict;
  if (n > 2000) {
    verdict = bigEffect ? "clear-departure" : someEffect ? "mild-departure" : "no-clear-departure";
  } else if (p < 0.01 && bigEffect) verdict = "clear-departure";
  else if (p >= 0.05 && !bigEffect) verdict = "no-clear-departure";
  else verdict = "mild-departure";

  const why = skew !== "none" && skewStrength !== "slight"
    ? `${skewStrength} ${skew} skew`
    : tails !== "as expected"
    ? `${tails} tails`
    : tied && verdict !== "no-clear-departure"
    ? "many tied values"
    : verdict === "no-clear-departure"
    ? "shape consistent with normal at this n"
    : "small departures in shape";
  const headline = `${_cap(why)} (W = ${formatNumber(primary.statistic, 4)}, n = ${n})`;

  return Object.freeze({
    verdict,
    headline,
    points: Object.freeze(points),
    sizeNote,
    facts: Object.freeze({
      skew,
      skewStrength,
      tails,
      distinct,
      resolution,
      tied,
      bimodality,
      lowerTail: Object.freeze(lowerTail),
      upperTail: Object.freeze(upperTail),
    }),
  });
}
