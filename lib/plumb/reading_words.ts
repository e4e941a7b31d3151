/**
 * The reading's words: the headline, the points in order of importance and
 * the note on sample size, written from the facts `reading.ts` gathers. No
 * threshold is decided here; each sentence says what was found, what it
 * means for the data, and what to do about it.
 *
 * @module
 */
import { formatCount, formatNumber } from "../results/format.ts";
import type { Moments } from "../stats/moments.ts";
import type { QqData } from "../stats/qq_data.ts";
import type { TestResult } from "../stats/result.ts";
import { READING_RULES } from "./reading_rules.ts";
import type { Subsample } from "../results/analysis.ts";
import type { ReadingFacts } from "../results/reading.ts";
import { cap, causePoints, f3, pct, plural, roundingPoint } from "./reading_causes.ts";

/** What the words are written from. */
export interface WordsInput {
  readonly n: number;
  readonly moments: Moments;
  readonly primary: TestResult;
  readonly qq: QqData;
  readonly facts: ReadingFacts;
  readonly twoPeaks: boolean;
  readonly subsample?: Subsample | null;
  /** Whether the order-statistic tests and the evidence came from a query source's seeded sample. */
  readonly sampleOnly?: boolean;
}

/** The reason for the verdict in a few words (no W, no n). */
function _reason(f: ReadingFacts): string {
  switch (f.cause) {
    case "pile-up":
      return `${formatCount(f.pileUp!.count)} values piled up at the ${f.pileUp!.end}, ${
        f3(f.pileUp!.value)
      }`;
    case "cluster":
      return `a separate cluster of ${formatCount(f.cluster!.count)} values (${
        pct(f.cluster!.share)
      }) ${f.cluster!.side === "high" ? "above" : "below"} the rest`;
    case "outliers":
      return `${f.outliers.count} outlier${
        plural(f.outliers.count, "", "s")
      } beyond an otherwise normal-looking sample`;
    case "skew":
      return `${f.skewStrength} ${f.skew} skew`;
    case "tails":
      return `${f.tails} tails`;
    case "two-peaks":
      return "a hint of two peaks";
    case "shape":
      return "small departures in shape";
    default:
      return "shape consistent with normal at this n";
  }
}

/** The sentences on skew and tails. */
function _shapePoints(f: ReadingFacts, m: Moments, n: number): string[] {
  const out: string[] = [];
  const named = f.cause === "cluster" || f.cause === "outliers" || f.cause === "pile-up";
  if (named && (f.skew !== "none" || f.tails !== "as expected")) {
    const what = f.cause === "cluster"
      ? "cluster"
      : f.cause === "outliers"
      ? "outliers"
      : "pile-up";
    return [
      `Skewness G1 = ${f3(m.G1)} (standard error ${f3(m.seG1)}) and excess kurtosis G2 = ${
        f3(m.G2)
      } (standard error ${
        f3(m.seG2)
      }) come from the ${what} described above, not from the shape of the rest`,
    ];
  }
  const se1 = `G1 = ${f3(m.G1)} (standard error ${f3(m.seG1)})`;
  if (f.skew !== "none") {
    const side = f.skew === "right"
      ? "a longer tail towards high values"
      : "a longer tail towards low values";
    out.push(`${cap(f.skewStrength)} ${f.skew} skew: ${se1}, ${side}`);
  } else out.push(`No skew beyond what chance gives at n = ${formatCount(n)}: ${se1}`);
  if (f.tails !== "as expected") {
    const clearly = Math.abs(m.G2) >= READING_RULES.tailsLarge ? "clearly " : "";
    const g2 = `excess kurtosis G2 = ${f3(m.G2)} (standard error ${f3(m.seG2)})`;
    out.push(
      f.tails === "heavy"
        ? `Tails ${clearly}heavier than normal: ${g2}; extreme values are more common than a normal curve predicts`
        : `Tails ${clearly}lighter than normal: ${g2}; values bunch between the extremes, as in a flat or bounded distribution`,
    );
  }
  return out;
}

/** The sentence on the QQ plot's band. */
function _bandPoint(f: ReadingFacts, qq: QqData): string {
  const kinds: [number, string, string, string][] = [
    [
      f.lowerTail.below,
      "of the lowest values falls|of the lowest values fall",
      "below it",
      "the low end reaches further than a normal curve",
    ],
    [
      f.lowerTail.above,
      "of the lowest values sits|of the lowest values sit",
      "above it",
      "the low end stops short",
    ],
    [
      f.upperTail.above,
      "of the highest values rises|of the highest values rise",
      "above it",
      "the high end reaches further than a normal curve",
    ],
    [
      f.upperTail.below,
      "of the highest values sits|of the highest values sit",
      "below it",
      "the high end stops short",
    ],
    [
      f.bodyExits,
      "value in the middle lies|values in the middle lie",
      "outside it",
      "the bulk of the data bends away from the line",
    ],
  ];
  const exits = kinds.filter(([k]) => k > 0).map(([k, subject, where, meaning]) => {
    const [one, many] = subject.split("|");
    return `${formatCount(k)} ${k === 1 ? one : many} ${where} (${meaning})`;
  });
  const band = `${Math.round(qq.level * 100)}% ${qq.envelope} band`;
  return exits.length > 0
    ? `Against the QQ plot's ${band}: ${
      exits.join("; ")
    }. Neighbouring points move together, so a run of exits at one end counts as one sign, not many`
    : `Every QQ point shown lies inside the ${band}`;
}

/** The two σ estimates behind W. */
function _sigmaPoint(f: ReadingFacts, primary: TestResult, sub: WordsInput["subsample"]): string {
  const s = f.sigma;
  const on = sub
    ? ` (both on the ${formatCount(sub.size)} values of the subsample W comes from)`
    : "";
  const head = `Two estimates of σ${on}: ${formatNumber(s.slope, 4)} from the QQ plot's ` +
    `order-statistic slope (the dashed line; Shapiro–Wilk's numerator) and ${
      formatNumber(s.sd, 4)
    } ` +
    `from the sd; W = (slope/sd)² = ${formatNumber(s.ratio * s.ratio, 4)}`;
  const apart = primary.pValue < READING_RULES.pDeparture;
  return head +
    (!apart
      ? `: the two agree about as well as they do for normal data`
      : f.rounding.coarse
      ? `: the rounding's steps keep the ordered values off a straight line, so the slope falls short of the sd`
      : `: the ordered values bend away from a straight line, so the slope through them falls short of the sd`);
}

/** The note on what the sample size means for the tests. */
function _sizeNote(n: number, sub: WordsInput["subsample"], sampleOnly = false): string {
  const r = READING_RULES;
  let note: string;
  if (n < r.littlePower) {
    note =
      `With only ${n} values the tests have little power: a large p is weak evidence, and the plot matters more than the p-value`;
  } else if (n < r.modestPower) {
    note = `With ${n} values the tests have modest power: moderate departures can go undetected`;
  } else if (n <= r.largeN) {
    note = `With ${formatCount(n)} values the tests have reasonable power for moderate departures`;
  } else {
    note =
      `With ${
        formatCount(n)
      } values even trivial departures give small p-values, so effect sizes decide: ` +
      `skewness counts from |G1| ≥ ${r.skewSome}, kurtosis from |G2| ≥ ${r.tailsSome}`;
  }
  if (sub && sampleOnly) {
    note += `. Shapiro–Wilk, Shapiro–Francia, Anderson–Darling and Lilliefors used a seeded ` +
      `random sample of ${formatCount(sub.size)} of the ${
        formatCount(n)
      } values (seed ${sub.seed}), and ties, far values, clusters and pile-ups are counted in it; the moments, ` +
      `D'Agostino–Pearson, Jarque–Bera, the QQ plot and the histogram use all ${formatCount(n)}`;
  } else if (sub) {
    note += `. Shapiro–Wilk used a seeded random subsample of ${formatCount(sub.size)} of the ${
      formatCount(n)
    } values (seed ${sub.seed}; its calibration stops at 5,000); the other tests, the moments and the plot use all ${
      formatCount(n)
    }`;
  }
  return note;
}

/**
 * The headline, reason, points and size note of a reading.
 *
 * @param w the facts and the numbers they rest on
 *
 * @example
 * ```ts
 * import { analyse } from "./analysis.ts";
 * const a = analyse(new Float64Array([1, 2, 3, 4, 5, 6]), { label: "x", column: "x", missingDropped: 0, textDropped: 0 });
 * if (a.reading.verdict !== "no-clear-departure" || !a.reading.headline.startsWith("Shape consistent")) throw new Error(a.reading.headline);
 * ```
 */
export function readingWords(w: WordsInput): {
  headline: string;
  reason: string;
  points: readonly string[];
  sizeNote: string;
} {
  const { n, moments: m, primary, qq, facts: f } = w;
  const reason = _reason(f);
  const headline = `${cap(reason)} (W = ${formatNumber(primary.statistic, 4)}, n = ${
    formatCount(n)
  })`;
  // Counts from a query source's seeded sample are said against the sample's size.
  const cause = causePoints(f, w.sampleOnly ? w.subsample?.size ?? n : n);
  const points: string[] = [...cause.lead];
  const rounding = roundingPoint(f, n);
  if (rounding !== undefined && f.rounding.coarse) points.push(rounding);
  for (const p of [..._shapePoints(f, m, n), ...cause.after]) points.push(p);
  if (w.twoPeaks) {
    points.push(
      `A hint of two peaks: bimodality coefficient ${
        f3(f.bimodality)
      } (above 0.555, the uniform's value) ` +
        `with light tails; look at the histogram, and consider whether two groups are mixed`,
    );
  }
  points.push(_bandPoint(f, qq));
  points.push(_sigmaPoint(f, primary, w.subsample));
  if (rounding !== undefined && !f.rounding.coarse) points.push(rounding);
  return {
    headline,
    reason,
    points: Object.freeze(points),
    sizeNote: _sizeNote(n, w.subsample, w.sampleOnly),
  };
}
