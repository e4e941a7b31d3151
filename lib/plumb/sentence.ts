/**
 * The write-up: one paragraph a user can paste into a report, with the
 * variable, n, W and p, the reading, and the cautions that apply.
 *
 * @module
 */
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import { formatCount, formatNumber } from "../results/format.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import type { Analysis } from "../results/analysis.ts";
import { optionNames } from "../results/options.ts";
import { VERDICT_WORDS } from "../results/reading.ts";
import { censoringWords } from "../results/censoring.ts";

/**
 * A p-value for prose: `p < 0.001` below 0.001, otherwise three decimals.
 *
 * @example
 * ```ts
 * import { proseP } from "./sentence.ts";
 * if (proseP(0.0004) !== "p < 0.001" || proseP(0.2371) !== "p = 0.237") throw new Error("p");
 * ```
 */
export function proseP(p: number): string {
  if (p < 0.001) return "p < 0.001";
  return `p = ${p.toFixed(3)}`;
}

/**
 * A shape statistic for prose: three significant digits, and 0 when it rounds to 0 at 3 decimals.
 *
 * @example
 * ```ts
 * import { proseShape } from "./sentence.ts";
 * if (proseShape(1e-17) !== "0.000" || proseShape(-0.4123) !== "−0.412") throw new Error("shape");
 * ```
 */
export function proseShape(v: number): string {
  return Math.abs(v) < 0.0005 ? "0.000" : formatNumber(v, 3);
}

/** Options for {@linkcode writeSentence}. */
export interface SentenceOptions {
  /**
   * A multiplicity-adjusted p-value to report beside the raw one, and the
   * method's name (e.g. `{ p: 0.03, method: "Holm", family: 12 }`).
   * @default undefined
   */
  readonly adjusted?: { readonly p: number; readonly method: string; readonly family: number };
  /**
   * End with the standard cautions (a large p is not proof; residuals before
   * a t-test; decisions follow your procedures). A list of sentences states
   * them once, after the last one, instead (`LIST_CAUTIONS`).
   * @default true
   */
  readonly cautions?: boolean;
}

/** The cautions a write-up ends with (once per list of sentences). */
export const SENTENCE_CAUTIONS: readonly string[] = Object.freeze([
  "Before a t-test or ANOVA, judge normality from the residuals' QQ plot rather than using this test as a gate.",
  "Where this result feeds a clinical, safety or product-release decision, that decision follows your organisation's own procedures and the applicable standards; a normality check is one input to it.",
]);

/**
 * The cautions a list of sentences (written with `cautions: false`) ends
 * with, once: a large p is not proof, then {@linkcode SENTENCE_CAUTIONS}.
 */
export const LIST_CAUTIONS: string = [
  "A large p does not show that data are normal, only that the sample cannot tell them apart from a normal distribution.",
  ...SENTENCE_CAUTIONS,
].join(" ");

/** What the reading found, as a clause for the write-up (empty when nothing is named). */
function _findings(a: Analysis): string[] {
  const f = a.reading.facts;
  const out: string[] = [];
  const rows = (list: readonly number[], total: number) =>
    `row${total === 1 ? "" : "s"} ${list.map(formatCount).join(", ")}${
      total > list.length ? ", …" : ""
    }`;
  if (f.cluster !== null) {
    out.push(
      `${formatCount(f.cluster.count)} values (${
        Number((100 * f.cluster.share).toPrecision(2))
      }%) form a separate cluster ${f.cluster.side === "high" ? "above" : "below"} the rest ` +
        `(${
          rows(f.cluster.rows, f.cluster.count)
        }); check those records before transforming the data.`,
    );
  }
  if (f.cause === "outliers") {
    const list = f.outliers.values.slice(0, 5).map((v) =>
      `${formatNumber(v.value, 4)} (row ${formatCount(v.row)})`
    ).join(", ");
    out.push(
      `${
        f.outliers.count === 1 ? "One value stands" : `${f.outliers.count} values stand`
      } apart by the ` +
        `generalized ESD procedure: ${list}${f.outliers.count > 5 ? ", …" : ""}; without ${
          f.outliers.count === 1 ? "it" : "them"
        } the rest looks normal, so check ${
          f.outliers.count === 1 ? "that record" : "those records"
        } first.`,
    );
  }
  if (f.pileUp !== null && f.cause === "pile-up") {
    out.push(
      `${formatCount(f.pileUp.count)} values sit exactly at the ${f.pileUp.end} (${
        formatNumber(f.pileUp.value, 4)
      }), as at a detection or reporting limit; no re-expression removes such a pile-up.`,
    );
  }
  if (f.tied) {
    out.push(
      `The values are recorded in steps of ${
        Number((f.step ?? 0).toPrecision(6))
      }, coarse against their spread, so the verdict rests on skewness, kurtosis and outliers rather than on p.`,
    );
  }
  return out;
}

/** Every option name of {@linkcode SentenceOptions}. */
export const SENTENCE_OPTION_NAMES: readonly string[] = optionNames<SentenceOptions>({
  adjusted: true,
  cautions: true,
});

/**
 * The pasteable paragraph for one analysis.
 *
 * @param a the analysis
 * @param options an adjusted p-value to include
 *
 * @example
 * ```ts
 * import { analyse } from "./analysis.ts";
 * import { writeSentence } from "./sentence.ts";
 * const x = new Float64Array([4.1, 3.9, 4.4, 4.0, 4.2, 3.7, 4.6, 4.3, 3.8, 4.1, 4.0, 4.5]);
 * const s = writeSentence(analyse(x, { label: "fill (L)", column: "fill", missingDropped: 0, textDropped: 0 }));
 * if (!s.startsWith("fill (L): n = 12.")) throw new Error(s);
 * ```
 */
export function writeSentence(a: Analysis, options: SentenceOptions = {}): string {
  const { origin, n, primary, moments: m, reading } = a;
  const dropped: string[] = [];
  if (origin.missingDropped > 0) {
    dropped.push(
      `${formatCount(origin.missingDropped)} missing cell${origin.missingDropped === 1 ? "" : "s"}`,
    );
  }
  if (origin.textDropped > 0) {
    dropped.push(
      `${formatCount(origin.textDropped)} non-numeric cell${origin.textDropped === 1 ? "" : "s"}`,
    );
  }
  const parts: string[] = [];
  parts.push(
    `${origin.label}: n = ${formatCount(n)}${
      dropped.length ? ` (${dropped.join(" and ")} left out)` : ""
    }.`,
  );
  const c = a.censoring;
  if (c) {
    const words = censoringWords(c, n);
    parts.push(
      `${words[0].toUpperCase()}${words.slice(1)}: mean ${formatNumber(c.mean, 4)} (standard ` +
        `error ${formatNumber(c.seMean, 3)}) and sd ${formatNumber(c.sd, 4)} by maximum ` +
        `likelihood under censoring (regression on order statistics: ${
          formatNumber(c.ros.mean, 4)
        } and ${formatNumber(c.ros.sd, 4)}); skewness and kurtosis include the censored values ` +
        `through that regression.`,
    );
  }
  let test = `${primary.test} ${primary.statisticName} = ${formatNumber(primary.statistic, 4)}, ${
    proseP(primary.pValue)
  }`;
  if (options.adjusted) {
    const adj = options.adjusted;
    test += ` (${proseP(adj.p).replace("p", `${adj.method}-adjusted p`)} over ${adj.family} test${
      adj.family === 1 ? "" : "s"
    })`;
  }
  parts.push(
    `${test}; skewness G1 = ${proseShape(m.G1)}, excess kurtosis G2 = ${proseShape(m.G2)}.`,
  );
  parts.push(
    `Reading: ${VERDICT_WORDS[reading.verdict]}${
      reading.verdict === "no-clear-departure" ? "" : `, from ${reading.reason}`
    }.`,
  );
  for (const finding of _findings(a)) parts.push(finding);
  for (const note of origin.notes ?? []) parts.push(`${note}.`);
  if (a.subsample) {
    parts.push(
      c
        ? `W′ and p come from a seeded random subsample of ${
          formatCount(a.subsample.size)
        } of the ${
          formatCount(n)
        } values that keeps each value's side, the limit of the test's calibration.`
        : `W and p come from a seeded random subsample of ${formatCount(a.subsample.size)} of the ${
          formatCount(n)
        } values, the limit of Royston's calibration.`,
    );
  }
  if (origin.transform) {
    parts.push(
      `The values were re-expressed as ${origin.transform} before testing, so these statements apply on that scale.`,
    );
  }
  if (primary.pValue >= 0.05 && !(options.cautions ?? true)) {
    // in a list the general caution comes once, at the end; the sample's own size stays here
    if (n < 50) parts.push(`With ${n} values a large p is weak evidence of normality.`);
  } else if (primary.pValue >= 0.05) {
    parts.push(
      `A large p does not show that the data are normal, only that this sample cannot tell them apart from a normal distribution${
        n < 50 ? `, and with ${n} values that is weak evidence` : ""
      }.`,
    );
  } else if (n > 2000) {
    parts.push(
      `With ${
        formatCount(n)
      } values a small p can reflect a departure too small to matter; weigh G1, G2 and the QQ plot.`,
    );
  }
  if (options.cautions ?? true) { for (const c of SENTENCE_CAUTIONS) parts.push(c); }
  return parts.join(" ");
}

/** A displayable sentence: the write-up paragraph. */
export interface Sentence extends Displayable {
  /** The paragraph. */
  readonly text: string;
  /** The paragraph. */
  toString(): string;
  /** The paragraph, as a JSON string. */
  toJSON(): string;
  /** The paragraph as plain text, Markdown and HTML. */
  [DISPLAY](): MimeBundle;
  /** Write the paragraph to a file: `.md`, `.txt`, `.html` or `.json`, by extension. */
  save(path: string): Promise<SavedFile>;
}

/**
 * The write-up paragraph as a displayable: plain text, Markdown and HTML.
 * Given a function, the paragraph is written on first read or display, once.
 *
 * @param text the paragraph, or a function that writes it
 * @example
 * ```ts
 * import { sentenceOf } from "./sentence.ts";
 * if (sentenceOf("n = 12.").toJSON() !== "n = 12.") throw new Error("sentence");
 * ```
 */
export function sentenceOf(text: string | (() => string)): Sentence {
  let written: string | undefined = typeof text === "string" ? text : undefined;
  const get = () => (written ??= (text as () => string)());
  let bundle: MimeBundle | undefined;
  const sentence: Sentence = Object.freeze({
    get text() {
      return get();
    },
    save: (path: string) => saveDisplay(path, savable(sentence, "the write-up")),
    [DISPLAY]: () => (bundle ??= Object.freeze({
      "text/plain": plainText(get()),
      "text/markdown": escapeMarkdown(get()),
      "text/html": `<p style="max-width:780px">${escapeHtml(get())}</p>`,
    })),
    toString: () => get(),
    toJSON: () => get(),
  });
  return sentence;
}
