/**
 * The λ search shared by `boxCoxFit` and `yeoJohnsonFit`. Private to
 * `lib/reexpress`.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { formatCompact } from "../results/format.ts";
import { normalQuantile } from "../numeric/normal.ts";
import { minimizeInInterval } from "../numeric/optimize.ts";
import { findRoot } from "../numeric/roots.ts";
import type { LambdaFit, LambdaFitOptions } from "./lambda_fit.ts";
import { _logLik, type _Profile, type _ProfilePoint } from "./_profile.ts";

/** Grid points for locating the maximum before refining it. */
const _GRID = 21;
/** Multiples of the quadratic-approximation step tried first for an interval end. */
const _TRIALS = [1.02, 1.1, 1.5, 2];
/** Largest sample the grid is evaluated on; bigger samples use an even subsample. */
const _SUBSAMPLE = 4096;

/** Validate the shared options; returns [lo, hi], level and the χ²₁ cut-off. */
export function _fitOptions(
  options: LambdaFitOptions,
  what: string,
): { lo: number; hi: number; level: number; cut: number } {
  const level = options.level ?? 0.95;
  if (typeof level !== "number" || !(level > 0 && level < 1)) {
    throw new PlumbError(
      "bad-option",
      `Cannot run ${what} at level ${level}: the level must lie strictly between 0 and 1, e.g. 0.95`,
      { level },
    );
  }
  const range = options.range ?? [-5, 5];
  const [lo, hi] = range;
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo < hi)) {
    throw new PlumbError(
      "bad-option",
      `Cannot run ${what} over the range [${lo}, ${hi}]: give two finite numbers, lower first`,
      { range },
    );
  }
  const z = -normalQuantile((1 - level) / 2);
  return { lo, hi, level, cut: z * z };
}

/**
 * An even, deterministic subsample (every n/m-th value) for locating λ̂ when
 * n > 4096: m = n/32 clamped to [1024, 4096], so that the grid costs a small
 * fraction of one pass over the full sample at every size.
 */
export function _subsample(x: Float64Array): Float64Array {
  const n = x.length;
  if (n <= _SUBSAMPLE) return x;
  const m = Math.min(_SUBSAMPLE, Math.max(1024, Math.floor(n / 32)));
  const out = new Float64Array(m);
  for (let i = 0; i < m; i++) out[i] = x[Math.floor(((i + 0.5) * n) / m)];
  return out;
}

/**
 * The grid point (index, of 21 evenly spaced over [lo, hi]) where `score` is
 * smallest, and the grid spacing. Throws `PlumbError("no-convergence")`
 * when the score is not below +∞ anywhere.
 */
export function _gridMinimum(
  score: (lambda: number) => number,
  lo: number,
  hi: number,
  what: string,
): { best: number; spacing: number } {
  const spacing = (hi - lo) / (_GRID - 1);
  let best = -1;
  let bestH = Infinity;
  for (let j = 0; j < _GRID; j++) {
    const h = score(lo + j * spacing);
    if (h < bestH) {
      bestH = h;
      best = j;
    }
  }
  if (best < 0) {
    throw new PlumbError(
      "no-convergence",
      `Cannot fit ${what}: the profile likelihood is not finite anywhere on [${lo}, ${hi}]; ` +
        `check the data for extreme values or narrow the range`,
      { range: [lo, hi] },
    );
  }
  return { best, spacing };
}

/** The note for a maximum at an end of the searched range. */
export function _atEndNote(lambda: number): string {
  return `The likelihood is largest at the end of the searched range (λ = ${
    formatCompact(lambda)
  }); ` +
    `the maximum may lie beyond it: a few values probably dominate the fit, so look at them ` +
    `before widening the range`;
}

/** The notes for interval ends that are open (null) within [lo, hi]. */
export function _openEndNotes(
  ci: readonly [number | null, number | null],
  level: number,
  lo: number,
  hi: number,
): string[] {
  const pct = `${+(level * 100).toPrecision(6)}%`;
  const notes: string[] = [];
  for (const [v, side, edge] of [[ci[0], "lower", lo], [ci[1], "upper", hi]] as const) {
    if (v === null) {
      notes.push(
        `The ${pct} interval has no ${side} end within the searched range: the likelihood ` +
          `stays above the cut-off ${side === "lower" ? "down" : "up"} to λ = ${
            formatCompact(edge)
          }, so the data cannot rule out ` +
          `${side === "lower" ? "smaller" : "larger"} powers`,
      );
    }
  }
  return notes;
}

/**
 * Maximise the profile log-likelihood over [lo, hi] and find the interval.
 *
 * 1. Locate: h(λ) on a 21-point grid (on an even subsample of 1024–4096
 *    values when n > 4096),
 *    then Brent's minimiser between the best grid point's neighbours.
 * 2. Refine on the full data (through local series models when n > 4096):
 *    bracket a sign change of h′ around that point
 *    (doubling the step outwards, never past the range), then Brent's root
 *    finder on h′. Solving h′ = 0, rather than comparing values of h, gives
 *    λ to near machine precision even where h is flat.
 * 3. Interval: on each side, solve h(λ) = ĥ + χ²₁(level)/n (that is,
 *    ℓ(λ) = ℓ̂ − χ²₁/2) by Brent's root finder, starting from the quadratic
 *    approximation λ̂ ± √(2χ²₁/(n·h″)), trying 1.02, 1.1, 1.5 and 2 times that
 *    step and then doubling, to bracket it.
 *    No bracket before the end of the range means that end is open (null).
 */
export function _fitLambda(
  full: _Profile,
  sub: _Profile,
  options: LambdaFitOptions,
  what: string,
): LambdaFit {
  const { lo, hi, level, cut } = _fitOptions(options, what);
  const n = full.n;
  const notes: string[] = [];
  const clamp = (t: number) => Math.min(hi, Math.max(lo, t));

  // 1. Locate.
  const { best, spacing } = _gridMinimum((t) => sub.h(t), lo, hi, what);
  // On a subsample only a starting point is needed (its own λ̂ differs from the full
  // sample's by sampling error far above 1e-4), so the search stops early there.
  const located = minimizeInInterval(
    (t) => sub.h(t),
    [lo + Math.max(0, best - 1) * spacing, lo + Math.min(_GRID - 1, best + 1) * spacing],
    sub === full ? {} : { relativeTolerance: 1e-4, absoluteTolerance: 1e-4 },
  ).x;

  // 2. Refine on the full data. On a large sample the evaluations from here on
  // lie close together, so they go through local series models of the profile
  // (exact to rounding, one pass per model; see _profile.ts).
  const fine = sub !== full && full.local ? full.local() : full;
  const seen = new Map<number, _ProfilePoint>();
  const at = (t: number): _ProfilePoint => {
    let p = seen.get(t);
    if (p === undefined) {
      p = fine.hd(t);
      seen.set(t, p);
    }
    return p;
  };
  let w = sub === full ? 1e-6 * (1 + Math.abs(located)) : spacing / 16;
  let a = clamp(located - w);
  let b = clamp(located + w);
  let fa = at(a).dh;
  let fb = at(b).dh;
  while (!(fa <= 0) && a > lo) {
    b = a;
    fb = fa;
    w *= 2;
    a = clamp(a - w);
    fa = at(a).dh;
  }
  while (!(fb >= 0) && b < hi) {
    a = b;
    fa = fb;
    w *= 2;
    b = clamp(b + w);
    fb = at(b).dh;
  }
  let lambda: number;
  let atEnd = false;
  if (!(fa <= 0) && a === lo) {
    lambda = lo;
    atEnd = true;
  } else if (!(fb >= 0) && b === hi) {
    lambda = hi;
    atEnd = true;
  } else {
    lambda = findRoot((t) => at(t).dh, [a, b], {
      endValues: [fa, fb],
      absoluteTolerance: 1e-13,
    }).x;
  }
  const top = at(lambda);
  const hHat = top.h;
  if (atEnd) {
    // Flat: even the far end of the range stays inside the interval, so the data
    // hardly prefer one power to another (a small spread relative to the values'
    // own size makes every power nearly linear over them).
    const far = fine.h(lambda === lo ? hi : lo);
    const flat = Number.isFinite(far) && (far - hHat) * n <= cut;
    notes.push(
      flat
        ? `The likelihood is largest at the end of the searched range (λ = ${
          formatCompact(lambda)
        }), but it is ` +
          `nearly flat across the whole range: every power from ${formatCompact(lo)} to ${
            formatCompact(hi)
          } fits almost equally ` +
          `well, because the values vary little relative to their own size, so any power bends them ` +
          `alike. λ is not determined by these data, and no re-expression changes their shape much`
        : _atEndNote(lambda),
    );
  }
  if (!Number.isFinite(hHat)) {
    // ln var(z) = −∞: the transformed values are equal in double precision
    // (values a few bits apart) or their variance underflows (subnormal values).
    throw new PlumbError(
      "no-convergence",
      `Cannot fit ${what}: the variance of the transformed values is not representable in ` +
        `double precision at λ = ${lambda} (the values are too close together or too small); ` +
        `rescale the data, e.g. change its units, and fit again`,
      { lambda },
    );
  }

  // Curvature h″ at λ̂ from the nearest other evaluation.
  let hpp = NaN;
  let nearest = Infinity;
  for (const [t, p] of seen) {
    const dist = Math.abs(t - lambda);
    if (dist > 0 && dist < nearest && Number.isFinite(p.dh)) {
      nearest = dist;
      hpp = (p.dh - top.dh) / (t - lambda);
    }
  }

  // 3. Interval.
  const target = hHat + cut / n;
  const g = (t: number) => fine.h(t) - target;
  const end = (side: -1 | 1): number | null => {
    const edge = side < 0 ? lo : hi;
    if (lambda === edge) return null;
    const quad = hpp > 0 && Number.isFinite(hpp) ? Math.sqrt((2 * cut) / (n * hpp)) : spacing;
    // Trial steps: just past the quadratic guess first (the root is usually within a few
    // per cent of it, so the first bracket is tight), then further out, then doubling.
    let k = 0;
    const stepAt = (i: number) => quad * (i < _TRIALS.length ? _TRIALS[i] : 2 ** (i - 1));
    let prev = lambda;
    let gPrev = hHat - target;
    let t = clamp(lambda + side * stepAt(k));
    while (true) {
      const gt = g(t);
      if (gt >= 0) {
        const br: [number, number] = side < 0 ? [t, prev] : [prev, t];
        const ends: [number, number] = side < 0 ? [gt, gPrev] : [gPrev, gt];
        return findRoot(g, br, { endValues: ends, absoluteTolerance: 1e-10 }).x;
      }
      if (t === edge) return null;
      prev = t;
      gPrev = gt;
      k++;
      t = clamp(lambda + side * stepAt(k));
    }
  };
  const ciLo = end(-1);
  const ciHi = end(1);
  for (const note of _openEndNotes([ciLo, ciHi], level, lo, hi)) notes.push(note);
  return Object.freeze({
    family: full.family,
    lambda,
    ci: Object.freeze([ciLo, ciHi]) as readonly [number | null, number | null],
    level,
    logLikelihood: _logLik(n, hHat),
    n,
    range: Object.freeze([lo, hi]) as readonly [number, number],
    lambdaAtRangeEnd: atEnd,
    notes: Object.freeze(notes),
    passes: full.passes(),
  });
}
