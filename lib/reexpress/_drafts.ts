/**
 * The candidates a search tries, before any is scored: what is tried and
 * why, what is not and why, and the λ fits. Private to `lib/reexpress`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { boxCoxFit } from "./box_cox_fit.ts";
import { _fmt, type SearchOptions } from "./candidates.ts";
import type { LambdaFit } from "./lambda_fit.ts";
import { LADDER_POWERS, nearestLadderPower } from "./ladder.ts";
import { logShift } from "./log.ts";
import { type Reexpression, reexpression } from "./reexpression.ts";
import { yeoJohnsonFit } from "./yeo_johnson_fit.ts";

/** One candidate to try, with its place in the simplicity order and its notes. */
export interface _Draft {
  reexpression: Reexpression;
  simplicity: number;
  notes: string[];
}

/** The candidates of a search, the ones left out (with why) and the λ fits. */
export interface _Drafts {
  readonly drafts: _Draft[];
  readonly skipped: string[];
  readonly boxCox: LambdaFit | null;
  readonly yeoJohnson: LambdaFit | null;
}

/**
 * The candidates for finite, non-constant values `v` with the given range
 * and number of zeros (see `searchReexpressions` for the list and why).
 */
export function _candidateDrafts(
  v: Float64Array,
  range: { readonly min: number; readonly max: number; readonly zeros: number },
  options: SearchOptions,
): _Drafts {
  const { min, max, zeros } = range;
  const fitOptions = { level: options.level, range: options.range };
  const skipped: string[] = [];
  const drafts: _Draft[] = [{ reexpression: reexpression("identity"), simplicity: 0, notes: [] }];

  let shift: ReturnType<typeof logShift> | null = null;
  try {
    shift = logShift(v);
  } catch (e) {
    if (!(e instanceof PlumbError) || e.code !== "non-finite") throw e;
    skipped.push(`Log: ${e.message}`);
  }
  if (shift !== null) {
    drafts.push({
      reexpression: reexpression("log", { shift: shift.shift, base: options.logBase ?? "e" }),
      simplicity: 1,
      notes: shift.shift === 0 ? [] : [shift.rule],
    });
  }
  if (min >= 0) {
    drafts.push({ reexpression: reexpression("square-root"), simplicity: 2, notes: [] });
  } else skipped.push("Square root: the data have negative values (Yeo–Johnson tried instead)");
  if (zeros === 0 && (min > 0 || max < 0)) {
    drafts.push({ reexpression: reexpression("reciprocal"), simplicity: 3, notes: [] });
  } else {
    skipped.push(
      zeros > 0
        ? `Reciprocal: ${zeros} zero${zeros === 1 ? "" : "s"} in the data`
        : "Reciprocal: the data have both signs, so 1/x would not keep their order",
    );
  }

  let bc: LambdaFit | null = null;
  let yj: LambdaFit | null = null;
  // A fit the data cannot support in double precision is skipped, not fatal.
  const tryFit = (fit: () => LambdaFit, name: string): LambdaFit | null => {
    try {
      return fit();
    } catch (e) {
      if (!(e instanceof PlumbError) || e.code !== "no-convergence") throw e;
      skipped.push(`${name}: ${e.message}`);
      return null;
    }
  };
  if (min > 0) bc = tryFit(() => boxCoxFit(v, fitOptions), "Box–Cox");
  if (bc !== null) {
    const pct = `${+(bc.level * 100).toPrecision(6)}%`;
    const ladder = nearestLadderPower(bc);
    // 3 significant digits and a true minus sign (U+2212), as everywhere in the displays
    const num = (v: number) => String(Number(v.toPrecision(3))).replace("-", "−");
    if (ladder === null) {
      const iv = (v: number | null, open: string) => (v === null ? open : num(v));
      skipped.push(
        `Ladder power: none of the powers considered, ${
          LADDER_POWERS.map(num).join(", ")
        } (Tukey's ladder; 0 is the log), lies inside the Box–Cox ${pct} interval ${
          iv(bc.ci[0], "−∞")
        } to ${iv(bc.ci[1], "∞")}`,
      );
    } else if ([1, 0, 0.5, -1].includes(ladder)) {
      const which = drafts.find((d) =>
        d.simplicity === ({ 1: 0, 0: 1, 0.5: 2, [-1]: 3 } as Record<number, number>)[ladder]
      );
      which?.notes.push(
        `Box–Cox λ = ${num(ladder)} (the same shape) is the ladder power nearest λ̂ = ` +
          `${_fmt(bc.lambda)} inside its ${pct} interval`,
      );
    } else {
      drafts.push({
        reexpression: reexpression("box-cox", { lambda: ladder }),
        simplicity: 4,
        notes: [`Ladder power nearest λ̂ = ${_fmt(bc.lambda)} inside the ${pct} interval`],
      });
    }
    drafts.push({
      reexpression: reexpression("box-cox", { lambda: bc.lambda }),
      simplicity: 5,
      notes: ["Maximum-likelihood λ", ...bc.notes],
    });
  } else if (min <= 0) {
    skipped.push("Box–Cox: it needs positive values (Yeo–Johnson tried instead)");
  }
  if (min <= 0) yj = tryFit(() => yeoJohnsonFit(v, fitOptions), "Yeo–Johnson");
  if (yj !== null) {
    drafts.push({
      reexpression: reexpression("yeo-johnson", { lambda: yj.lambda }),
      simplicity: 6,
      notes: ["Maximum-likelihood λ", ...yj.notes],
    });
  }

  return { drafts, skipped, boxCox: bc, yeoJohnson: yj };
}
