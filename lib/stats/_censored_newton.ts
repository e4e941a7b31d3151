/**
 * Newton's method for the censored normal log-likelihood in (μ, ln σ), on a
 * standardised sample reduced to its sufficient parts. Private to
 * `lib/stats` (see `censored_fit.ts` for the method and its sources).
 *
 * @module
 */
import { normalHazard, normalLogSf } from "../numeric/normal_log.ts";

const _LN_SQRT_2PI = 0.9189385332046728;
/** Converged when a full Newton step moves μ by less than this many σ and ln σ by less than this. */
const _STEP_TOL = 1e-12;

/** Log-likelihood, gradient and Hessian in (μ, τ = ln σ) on the standardised scale. */
export interface _Eval {
  l: number;
  gm: number;
  gt: number;
  hmm: number;
  hmt: number;
  htt: number;
}

/** The censored sample reduced to what the likelihood needs, on a standardised scale. */
export interface _Reduced {
  k: number;
  mean: number;
  m2: number;
  lows: Float64Array;
  lowCounts: Float64Array;
  highs: Float64Array;
  highCounts: Float64Array;
}

export function _evaluate(r: _Reduced, mu: number, tau: number, derivatives: boolean): _Eval {
  const sigma = Math.exp(tau);
  const inv = 1 / sigma;
  const d = r.mean - mu;
  const ss = r.m2 + r.k * d * d; // Σ (u − μ)² over measured values
  const e: _Eval = {
    l: -r.k * tau - ss * inv * inv / 2 - r.k * _LN_SQRT_2PI,
    gm: r.k * d * inv * inv,
    gt: -r.k + ss * inv * inv,
    hmm: -r.k * inv * inv,
    hmt: -2 * r.k * d * inv * inv,
    htt: -2 * ss * inv * inv,
  };
  // A "<c" value contributes ln Φ((c − μ)/σ) = ln Q(w), w = (μ − c)/σ; a ">c"
  // value ln Q(z), z = (c − μ)/σ. With h the hazard and h′ = h(h − ·):
  for (let side = -1; side <= 1; side += 2) {
    const limits = side < 0 ? r.lows : r.highs;
    const counts = side < 0 ? r.lowCounts : r.highCounts;
    for (let j = 0; j < limits.length; j++) {
      const w = counts[j];
      const z = side * (limits[j] - mu) * inv;
      e.l += w * normalLogSf(z);
      if (!derivatives) continue;
      const h = normalHazard(z);
      const hp = h * (h - z);
      e.gm += side * w * h * inv;
      e.gt += w * h * z;
      e.hmm -= w * hp * inv * inv;
      e.hmt -= side * w * (z * hp + h) * inv;
      e.htt -= w * z * (z * hp + h);
    }
  }
  return e;
}

export interface _Newton {
  mu: number;
  tau: number;
  e: _Eval;
  iterations: number;
  converged: boolean;
}

export function _newton(r: _Reduced, mu0: number, tau0: number, maxIterations: number): _Newton {
  let mu = mu0;
  let tau = tau0;
  let e = _evaluate(r, mu, tau, true);
  if (!Number.isFinite(e.l)) {
    // A start far out in a tail: fall back to the measured values.
    mu = r.mean;
    tau = 0.5 * Math.log(r.m2 / r.k);
    e = _evaluate(r, mu, tau, true);
  }
  let iterations = 0;
  let converged = false;
  while (iterations < maxIterations) {
    iterations++;
    // Newton direction d = −H⁻¹g, with H shifted to negative definite if needed.
    let shift = 0;
    let dm = 0;
    let dt = 0;
    for (let attempt = 0; attempt < 60; attempt++) {
      const a = e.hmm - shift;
      const b = e.hmt;
      const cc = e.htt - shift;
      const det = a * cc - b * b;
      if (a < 0 && det > 0) {
        dm = -(cc * e.gm - b * e.gt) / det;
        dt = -(a * e.gt - b * e.gm) / det;
        break;
      }
      shift = shift === 0 ? 1e-8 * (1 + Math.abs(e.hmm) + Math.abs(e.htt)) : shift * 4;
    }
    const sigma = Math.exp(tau);
    if (shift === 0 && Math.abs(dm) < _STEP_TOL * sigma && Math.abs(dt) < _STEP_TOL) {
      mu += dm;
      tau += dt;
      e = _evaluate(r, mu, tau, true);
      converged = true;
      break;
    }
    if (shift === 0 && Math.abs(dm) < 1e-4 * sigma && Math.abs(dt) < 1e-4) {
      // Near the maximum Newton converges quadratically, and the rise in ℓ
      // (about half the step times the gradient) drops below ℓ's own rounding,
      // where a line search could no longer see it: take the full step.
      mu += dm;
      tau += dt;
      e = _evaluate(r, mu, tau, true);
      continue;
    }
    // Cap the step, then halve it until the log-likelihood rises (Armijo).
    const cap = Math.max(Math.abs(dm) / (2 * sigma), Math.abs(dt) / 2, 1);
    dm /= cap;
    dt /= cap;
    const slope = e.gm * dm + e.gt * dt;
    let t = 1;
    let next: _Eval | undefined;
    for (let h = 0; h < 60; h++, t /= 2) {
      const trial = _evaluate(r, mu + t * dm, tau + t * dt, false);
      if (Number.isFinite(trial.l) && trial.l >= e.l + 1e-4 * t * slope) {
        next = trial;
        break;
      }
    }
    if (next === undefined) {
      // No ascent along the direction: at the maximum to rounding.
      converged = Math.abs(dm) < 1e-8 * sigma && Math.abs(dt) < 1e-8;
      break;
    }
    mu += t * dm;
    tau += t * dt;
    e = _evaluate(r, mu, tau, true);
  }
  return { mu, tau, e, iterations, converged };
}
