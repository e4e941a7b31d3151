/**
 * The stakes view in words: a table with one row per quantity (the normal
 * model, the re-expressed model and the answer without a model side by
 * side, and the verdict), and the paragraph for a write-up.
 *
 * @module
 */
import type { StakesVerdict } from "../stakes/_judge.ts";
import type { Stakes } from "../stakes/stakes.ts";
import type { TableModel } from "./table.ts";

/** The verdict words shown in tables. */
export const STAKES_VERDICT_WORDS: Readonly<Record<StakesVerdict, string>> = Object.freeze({
  matters: "matters",
  negligible: "negligible",
  unclear: "unclear",
});

/** A number for prose and tables: 4 significant digits, trailing zeros dropped, minus U+2212. */
export function stakesNumber(v: number): string {
  return String(+v.toPrecision(4)).replace("-", "−");
}

/** A share for prose and tables: percent from 0.01%, parts per million below. */
export function stakesShare(v: number): string {
  if (v === 0) return "0%";
  return v * 100 >= 0.01 ? `${+(v * 100).toPrecision(3)}%` : `${+(v * 1e6).toPrecision(3)} ppm`;
}

const _n = stakesNumber;
const _pct = (level: number) => `${+(level * 100).toPrecision(6)}%`;
const _pair = (p: readonly [number | null, number | null]) => _span(p[0], p[1]);
const _span = (a: number | null, b: number | null) =>
  `${a === null ? "open" : _n(a)} to ${b === null ? "open" : _n(b)}`;

/**
 * The table of a stakes result: quantity, normal model, re-expressed model
 * (when there is one), without a model, verdict.
 *
 * @param s the stakes result
 */
export function stakesTable(s: Stakes): TableModel {
  const re = s.reexpression;
  const columns = [
    { title: "quantity" },
    { title: "normal model" },
    ...(re === null ? [] : [{ title: `${re.label} model` }]),
    { title: "no model" },
    { title: "verdict" },
  ];
  const row = (q: string, normal: string, reexpressed: string, free: string, v: StakesVerdict) => [
    q,
    normal,
    ...(re === null ? [] : [reexpressed]),
    free,
    STAKES_VERDICT_WORDS[v],
  ];
  const r = s.range;
  const rows: string[][] = [
    row(
      `central ${_pct(r.coverage)} range`,
      _span(r.normal[0], r.normal[1]),
      r.reexpressed === null ? "" : _span(r.reexpressed[0], r.reexpressed[1]),
      `${_span(r.ranks[0], r.ranks[1])} (ranks; ${_pct(r.ranksCiLevel)} CIs ` +
        `${_pair(r.ranksCi[0])}, ${_pair(r.ranksCi[1])})`,
      s.judgement.range.verdict,
    ),
  ];
  if (s.outside !== null && s.capability !== null) {
    const o = s.outside;
    const k = o.observedCounts[0] + o.observedCounts[1];
    rows.push(row(
      "share outside the limits",
      stakesShare(o.normal),
      o.reexpressed === null ? "" : stakesShare(o.reexpressed),
      `${k} of ${s.n} = ${stakesShare(o.observed)} (${_pct(o.level)} CI ` +
        `${stakesShare(o.observedCi[0])} to ${stakesShare(o.observedCi[1])})`,
      s.judgement.outside!.verdict,
    ));
    const c = s.capability;
    const ci = (v: number, [a, b]: readonly [number, number]) =>
      `${_n(v)} (${_pct(c.normal.level)} CI ${_n(a)} to ${_n(b)})`;
    rows.push(row(
      "Cpk",
      ci(c.normal.cpk, c.normal.cpkCi),
      c.reexpressed === null ? "" : ci(c.reexpressed.cpk, c.reexpressed.cpkCi),
      c.percentile.cpk === null
        ? "not given (too few values)"
        : `${_n(c.percentile.cpk)} (percentiles)`,
      s.judgement.capability!.verdict,
    ));
    if (c.normal.cp !== null) {
      rows.push(row(
        "Cp",
        ci(c.normal.cp, c.normal.cpCi!),
        c.reexpressed?.cp == null ? "" : ci(c.reexpressed.cp, c.reexpressed.cpCi!),
        c.percentile.cp === null
          ? "not given (too few values)"
          : `${_n(c.percentile.cp)} (percentiles)`,
        s.judgement.capability!.verdict,
      ));
    }
  }
  const m = s.mean;
  rows.push(row(
    `mean, ${_pct(m.level)} interval`,
    `${_span(m.t[0], m.t[1])} (t)`,
    "",
    `${_span(m.bootstrap[0], m.bootstrap[1])} (bootstrap BCa)`,
    s.judgement.mean.verdict,
  ));
  return {
    columns,
    rows,
    notes: [
      ...(s.range.notes),
      ...(s.capability?.notes ?? []),
      ...(s.mean.notes),
      s.reexpressionNote,
    ],
  };
}

/**
 * The paragraph for a write-up: whether the departure from normality
 * matters for each quantity, with the numbers, then the caution.
 *
 * @param s the stakes result
 * @param name the variable's name
 * @param options `caution: false` leaves the caution out (for a list of
 *   paragraphs that states it once)
 */
export function stakesSentence(
  s: Stakes,
  name: string,
  options: { readonly caution?: boolean } = {},
): string {
  const j = s.judgement;
  const parts: [string, StakesVerdict][] = [[
    `the central ${_pct(s.range.coverage)} range`,
    j.range.verdict,
  ]];
  if (j.outside !== null) parts.push(["the share outside the limits", j.outside.verdict]);
  if (j.capability !== null) parts.push(["Cpk", j.capability.verdict]);
  parts.push(["the mean's interval", j.mean.verdict]);
  const list = (v: StakesVerdict) => {
    const names = parts.filter(([, w]) => w === v).map(([q]) => q);
    return names.length <= 1
      ? names.join("")
      : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
  };
  const out: string[] = [];
  const matters = list("matters");
  const unclear = list("unclear");
  const negligible = list("negligible");
  const head = [
    matters && `changes ${matters}`,
    unclear && `leaves ${unclear} uncertain`,
    negligible && `makes no material difference to ${negligible}`,
  ].filter(Boolean);
  out.push(
    `${name} (n = ${s.n}): assuming a normal distribution ${
      head.length === 1 ? head[0] : `${head.slice(0, -1).join("; ")}; and ${head.at(-1)}`
    }.`,
  );
  const r = s.range;
  out.push(
    `Central ${_pct(r.coverage)} range: ${_pair(r.normal)} under the normal model` +
      (r.reexpressed === null ? "" : `, ${_pair(r.reexpressed)} under ${s.reexpression!.label}`) +
      `, ${_pair(r.ranks)} from the ranks. ${j.range.reasons.join(". ")}.`,
  );
  if (j.outside !== null) out.push(`${j.outside.reasons.join(". ")}.`);
  if (j.capability !== null) out.push(`${j.capability.reasons.join(". ")}.`);
  out.push(
    `Mean ${_n(s.mean.estimate)}: ${_pct(s.mean.level)} t interval ${_pair(s.mean.t)}, ` +
      `bootstrap ${_pair(s.mean.bootstrap)}. ${j.mean.reasons.join(". ")}.`,
  );
  if (options.caution ?? true) out.push(`${s.cautions.join(". ")}.`);
  return out.join(" ");
}
