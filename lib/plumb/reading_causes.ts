/**
 * The reading's words for what a departure comes from and what to do about
 * it: a separate cluster, outliers, a pile-up at a limit, and the step
 * against the spread; with the small formatting helpers the reading's words
 * share. No threshold is decided here.
 *
 * @module
 */
import { formatCount, formatNumber } from "../results/format.ts";
import type { ReadingFacts, ValueAtRow } from "../results/reading.ts";

/** Three significant digits; 0 when it rounds to 0 at three decimals (sums of symmetric data). */
export const f3 = (x: number) => (Math.abs(x) < 5e-4 ? "0" : formatNumber(x, 3));
/** A step or level as written: up to 6 significant digits, no trailing zeros, true minus sign. */
export const short = (x: number) => String(Number(x.toPrecision(6))).replace("-", "−");
export const cap = (s: string) => s[0].toUpperCase() + s.slice(1);
export const plural = (k: number, one: string, many: string) => (k === 1 ? one : many);
export const pct = (share: number) => `${short(Number((100 * share).toPrecision(2)))}%`;
export const listRows = (rows: readonly number[], total: number) =>
  rows.length === 0 || rows[0] < 0
    ? "rows not known: the values came through a query"
    : `row${plural(total, "", "s")} ${rows.map(formatCount).join(", ")}${
      total > rows.length ? ", …" : ""
    }`;
/** A value with its row, or alone when the source gives no rows (−1). */
export const valueAt = (v: ValueAtRow) =>
  v.row >= 0 ? `${f3(v.value)} (row ${formatCount(v.row)})` : f3(v.value);

/**
 * The sentences that name a cause and its remedy (cluster, outliers, pile-up),
 * and separately the far values that belong to the shape (said after it).
 */
export function causePoints(f: ReadingFacts, n: number): { lead: string[]; after: string[] } {
  const out: string[] = [];
  const after: string[] = [];
  const c = f.cluster;
  if (c !== null) {
    const where = c.side === "high" ? "above" : "below";
    const [lo, hi] = c.gap;
    out.push(
      `A separate cluster: ${formatCount(c.count)} values (${
        pct(c.share)
      }) lie ${where} the rest, ` +
        `beyond an empty stretch from ${f3(lo)} to ${f3(hi)} (${
          listRows(c.rows, c.count)
        }); without ` +
        `them the rest is consistent with a normal distribution. The departure comes from this ` +
        `group, not from the shape of the data: find out how these records differ (source, ` +
        `instrument, handling) before any re-expression`,
    );
  }
  const o = f.outliers;
  // A cluster or a pile-up already accounts for the far values on its side.
  const others = o.values.filter((v) =>
    !(c !== null && v.side === c.side) && !(f.pileUp !== null && f.cause === "pile-up")
  );
  if (
    others.length > 0 &&
    (o.alone || f.cause === "skew" || f.cause === "tails" || f.cause === "shape")
  ) {
    const shown = others.slice(0, 5);
    const list = shown.map(valueAt).join(", ") + (others.length > shown.length ? ", …" : "");
    const level = `${short(100 * o.level)}% level`;
    (o.alone ? out : after).push(
      o.alone
        ? `${o.count} outlier${
          plural(o.count, "", "s")
        } by the generalized ESD procedure at the ${level} ` +
          `(Rosner 1983): ${list}; without ${
            plural(o.count, "it", "them")
          } the rest is consistent ` +
          `with a normal distribution. Check ${plural(o.count, "this record", "these records")} ` +
          `first; a re-expression would bend every value to accommodate ${
            plural(o.count, "one", "a few")
          }`
        : `The most extreme value${plural(others.length, "", "s")}, ${list}, stand${
          plural(others.length, "s", "")
        } out even by the generalized ESD procedure (${level}), but the rest is not normal either: ` +
          `${
            plural(others.length, "it belongs", "they belong")
          } to the shape described here rather than to a separate cause`,
    );
  }
  const p = f.pileUp;
  if (p !== null) {
    out.push(
      `${formatCount(p.count)} of ${formatCount(n)} values sit exactly at the ${p.end}, ${
        f3(p.value)
      }: ` +
        `a ${
          p.end === "minimum" ? "floor" : "ceiling"
        } such as a detection or reporting limit; no ` +
        `re-expression makes a pile-up at a limit look normal, so consider methods for censored data`,
    );
  }
  return { lead: out, after };
}

/** The step against the spread, when it is worth a word. */
export function roundingPoint(f: ReadingFacts, n: number): string | undefined {
  const r = f.rounding;
  if (f.step === null) return undefined;
  const ratio = `step/sd = ${formatNumber(r.ratio, 2)}`;
  if (r.coarse) {
    return `Recorded in steps of ${short(f.step)}, coarse against the spread (${ratio}, ` +
      `above ${formatNumber(r.limit, 2)} at n = ${
        formatCount(n)
      }): rounding this coarse can by itself ` +
      `make Shapiro–Wilk reject normal data, so its p is set aside and the verdict rests on ` +
      `skewness, kurtosis, outliers and clusters; the QQ plot shows the steps`;
  }
  if (f.distinct < 0.7 * n) {
    return `Recorded in steps of ${short(f.step)}: ${formatCount(f.distinct)} distinct ` +
      `values among ${formatCount(n)}, but the step is fine against the spread (${ratio}, within ` +
      `${formatNumber(r.limit, 2)} at this n), so the repeats do not distort the tests`;
  }
  return undefined;
}
