/**
 * The statistic of the censored-sample Shapiro–Francia test, apart from its
 * calibration so that the calibration script can simulate it. Private to
 * `lib/stats`.
 *
 * @module
 */
import { normalQuantile } from "../numeric/normal.ts";
import type { _GroupedPositions } from "./censored_positions.ts";

/**
 * 1 − W′ for the measured values at their plotting positions: one minus the
 * squared correlation of the sorted measured values with their normal scores
 * Φ⁻¹(p). Centred and scaled by the range, and formed as a difference of
 * squares, as in the uncensored Shapiro–Francia test.
 */
export function _oneMinusWPrime(g: _GroupedPositions): number {
  const x = g.obs;
  const k = x.length;
  const lo = x[0];
  const halve = !Number.isFinite(x[k - 1] - lo);
  const scale = halve ? x[k - 1] / 2 - lo / 2 : x[k - 1] - lo;
  const z = new Float64Array(k);
  const u = new Float64Array(k);
  let zBar = 0;
  let uBar = 0;
  for (let i = 0; i < k; i++) {
    z[i] = normalQuantile(g.pObs[i]);
    u[i] = (halve ? x[i] / 2 - lo / 2 : x[i] - lo) / scale;
    zBar += z[i];
    uBar += u[i];
  }
  zBar /= k;
  uBar /= k;
  let szz = 0;
  let suu = 0;
  let szu = 0;
  for (let i = 0; i < k; i++) {
    const dz = z[i] - zBar;
    const du = u[i] - uBar;
    szz += dz * dz;
    suu += du * du;
    szu += dz * du;
  }
  const root = Math.sqrt(szz * suu);
  return Math.max(0, ((root - szu) * (root + szu)) / (szz * suu));
}
