/**
 * The standard normal distribution: density, lower and upper tail
 * probabilities, and quantile, accurate to close to double precision over
 * the whole range where the results are representable.
 *
 * - {@linkcode normalCdf} and {@linkcode normalSf} follow W. J. Cody's
 *   rational Chebyshev approximations (Cody 1969, "Rational Chebyshev
 *   approximations for the error function", Mathematics of Computation
 *   23:631–637), in the three-interval arrangement of his ANORM routine
 *   (Cody 1993, ACM Transactions on Mathematical Software 19:22–32,
 *   Algorithm 715). Coefficients are the published double-precision ones.
 *   The tail `exp(-z²/2)` is split as `exp(-zr²/2)·exp(-(z-zr)(z+zr)/2)`
 *   with `zr = trunc(16z)/16`, so the large exponent is formed without
 *   rounding error. Checked against mpmath 1.2.1 at 60 digits
 *   (tests/fixtures/normal.json): relative error at most 1e-14 for the
 *   upper tail on [−38, 37] and the lower tail on [−37, 38]
 *   (tests/numeric/normal_test.ts).
 * - {@linkcode normalQuantile} is Wichura's PPND16 (Wichura 1988, "The
 *   percentage points of the normal distribution", Applied Statistics
 *   37:477–484, Algorithm AS 241): three rational approximations in
 *   `q = p − ½` (|q| ≤ 0.425) and `r = √(−log min(p, 1−p))` (r ≤ 5, r > 5),
 *   stated accurate to about 1 part in 10¹⁶.
 *
 * Special cases: NaN in gives NaN out; `normalQuantile(0) = −∞`,
 * `normalQuantile(1) = +∞`, and a p outside [0, 1] gives NaN. These are
 * low-level functions: the statistics above them validate their input.
 *
 * @module
 */

const _SQRT_2PI_INV = 0.3989422804014327; // 1/√(2π)
const _SQRT_32 = 5.656854249492381; // √32, Cody's interval boundary
const _SMALL_Z = 0.66291; // Cody's first boundary: Φ(0.66291) ≈ 0.75

// Cody (1969/1993) coefficients, interval |z| ≤ 0.66291.
const _A = [
  2.2352520354606839287,
  161.02823106855587881,
  1067.6894854603709582,
  18154.981253343561249,
  0.065682337918207449113,
];
const _B = [
  47.20258190468824187,
  976.09855173777669322,
  10260.932208618978205,
  45507.789335026729956,
];
// Interval 0.66291 < |z| ≤ √32.
const _C = [
  0.39894151208813466764,
  8.8831497943883759412,
  93.506656132177855979,
  597.27027639480026226,
  2494.5375852903726711,
  6848.1904505362823326,
  11602.651437647350124,
  9842.7148383839780218,
  1.0765576773720192317e-8,
];
const _D = [
  22.266688044328115691,
  235.38790178262499861,
  1519.377599407554805,
  6485.558298266760755,
  18615.571640885098091,
  34900.952721145977266,
  38912.003286093271411,
  19685.429676859990727,
];
// Interval |z| > √32 (asymptotic form in 1/z²).
const _P = [
  0.21589853405795699,
  0.1274011611602473639,
  0.022235277870649807,
  0.001421619193227893466,
  2.9112874951168792e-5,
  0.02307344176494017303,
];
const _Q = [
  1.28426009614491121,
  0.468238212480865118,
  0.0659881378689285515,
  0.00378239633202758244,
  7.29751555083966205e-5,
];

/** exp(−z²/2) for z ≥ 0, with the square split so it carries no rounding error. */
function _gaussExp(z: number): number {
  const zr = Math.trunc(z * 16) / 16;
  const del = (z - zr) * (z + zr);
  return Math.exp(-zr * zr * 0.5) * Math.exp(-del * 0.5);
}

/** Upper tail Q(y) = 1 − Φ(y) for y > 0.66291 (Cody's second and third intervals). */
function _upperTailLarge(y: number): number {
  if (y <= _SQRT_32) {
    let num = _C[8] * y;
    let den = y;
    for (let i = 0; i < 7; i++) {
      num = (num + _C[i]) * y;
      den = (den + _D[i]) * y;
    }
    return _gaussExp(y) * (num + _C[7]) / (den + _D[7]);
  }
  if (y > 40) return 0; // below the smallest subnormal
  const w = 1 / (y * y);
  let num = _P[5] * w;
  let den = w;
  for (let i = 0; i < 4; i++) {
    num = (num + _P[i]) * w;
    den = (den + _Q[i]) * w;
  }
  const r = (w * (num + _P[4])) / (den + _Q[4]);
  return _gaussExp(y) * (_SQRT_2PI_INV - r) / y;
}

/** Φ(z) − ½ for |z| ≤ 0.66291 (Cody's first interval). */
function _centralPart(z: number): number {
  const zz = z * z;
  let num = _A[4] * zz;
  let den = zz;
  for (let i = 0; i < 3; i++) {
    num = (num + _A[i]) * zz;
    den = (den + _B[i]) * zz;
  }
  return (z * (num + _A[3])) / (den + _B[3]);
}

/**
 * The standard normal density φ(z) = exp(−z²/2)/√(2π).
 *
 * @example
 * ```ts
 * import { normalPdf } from "@plumbline/plumbline";
 * if (Math.abs(normalPdf(0) - 0.3989422804014327) > 1e-16) throw new Error("φ(0)");
 * ```
 */
export function normalPdf(z: number): number {
  if (Number.isNaN(z)) return NaN;
  return _SQRT_2PI_INV * _gaussExp(Math.abs(z));
}

/**
 * The standard normal lower tail Φ(z) = P(Z ≤ z), with full relative
 * accuracy for negative z down to about −38 (where Φ underflows).
 *
 * @example
 * ```ts
 * import { normalCdf } from "@plumbline/plumbline";
 * // Φ(−10) = 7.619853024160526066e-24 (mpmath 1.2.1, 60 digits)
 * if (Math.abs(normalCdf(-10) / 7.619853024160526e-24 - 1) > 1e-14) throw new Error("Φ(−10)");
 * ```
 */
export function normalCdf(z: number): number {
  if (Number.isNaN(z)) return NaN;
  const y = Math.abs(z);
  if (y <= _SMALL_Z) return 0.5 + _centralPart(z);
  const tail = _upperTailLarge(y);
  return z > 0 ? 1 - tail : tail;
}

/**
 * The standard normal upper tail Q(z) = 1 − Φ(z) = P(Z > z), computed
 * directly (not as 1 − Φ) so that small p-values keep their digits: full
 * relative accuracy up to z ≈ 38.
 *
 * @example
 * ```ts
 * import { normalSf } from "@plumbline/plumbline";
 * // Q(37) = 5.725571222524576823e-300 (mpmath 1.2.1, 60 digits)
 * if (Math.abs(normalSf(37) / 5.725571222524577e-300 - 1) > 1e-14) throw new Error("Q(37)");
 * ```
 */
export function normalSf(z: number): number {
  return normalCdf(-z);
}

// Wichura (1988) AS 241, PPND16 coefficients.
const _PA = [
  3.3871328727963666080,
  133.14166789178437745,
  1971.5909503065514427,
  13731.693765509461125,
  45921.953931549871457,
  67265.770927008700853,
  33430.575583588128105,
  2509.0809287301226727,
];
const _PB = [
  1,
  42.313330701600911252,
  687.18700749205790830,
  5394.1960214247511077,
  21213.794301586595867,
  39307.895800092710610,
  28729.085735721942674,
  5226.4952788528545610,
];
const _PC = [
  1.42343711074968357734,
  4.63033784615654529590,
  5.76949722146069140550,
  3.64784832476320460504,
  1.27045825245236838258,
  0.241780725177450611770,
  0.0227238449892691845833,
  0.000774545014278341407640,
];
const _PD = [
  1,
  2.05319162663775882187,
  1.67638483018380384940,
  0.689767334985100004550,
  0.148103976427480074590,
  0.0151986665636164571966,
  0.000547593808499534494600,
  1.05075007164441684324e-9,
];
const _PE = [
  6.65790464350110377720,
  5.46378491116411436990,
  1.78482653991729133580,
  0.296560571828504891230,
  0.0265321895265761230930,
  0.00124266094738807843860,
  0.0000271155556874348757815,
  2.01033439929228813265e-7,
];
const _PF = [
  1,
  0.599832206555887937690,
  0.136929880922735805310,
  0.0148753612908506148525,
  0.000786869131145613259100,
  0.0000184631831751005468180,
  1.42151175831644588870e-7,
  2.04426310338993978564e-15,
];

/** Evaluate c[0] + c[1]x + … + c[7]x⁷ by Horner's rule. */
function _poly7(c: readonly number[], x: number): number {
  return ((((((c[7] * x + c[6]) * x + c[5]) * x + c[4]) * x + c[3]) * x + c[2]) * x + c[1]) * x +
    c[0];
}

/**
 * The standard normal quantile Φ⁻¹(p): the z with P(Z ≤ z) = p.
 *
 * Relative error at most 1e-14 for p in [1e-300, 1 − 2⁻⁵³]
 * (tests/numeric/normal_test.ts, against mpmath 1.2.1 at 60 digits).
 *
 * @example
 * ```ts
 * import { normalQuantile } from "@plumbline/plumbline";
 * // Φ⁻¹(0.975) = 1.959963984540054236 (mpmath 1.2.1, 60 digits)
 * if (Math.abs(normalQuantile(0.975) / 1.9599639845400543 - 1) > 1e-14) throw new Error("z.975");
 * ```
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) {
    const r = 0.180625 - q * q;
    return (q * _poly7(_PA, r)) / _poly7(_PB, r);
  }
  let r = q < 0 ? p : 1 - p;
  r = Math.sqrt(-Math.log(r));
  let z: number;
  if (r <= 5) {
    r -= 1.6;
    z = _poly7(_PC, r) / _poly7(_PD, r);
  } else {
    r -= 5;
    z = _poly7(_PE, r) / _poly7(_PF, r);
  }
  return q < 0 ? -z : z;
}
