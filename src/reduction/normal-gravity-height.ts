/**
 * Normal gravity above the ellipsoid: GRS80 normal gravity at ellipsoidal height h, by the
 * second-order series in h. gamma0 - gamma_h is, by definition, the (second-order) free-air
 * correction; free-air.ts holds the rounded polynomial of [Hinze2005], which agrees with this
 * series to about 1e-3 mGal at 1-3 km (pinned by test/reduction/normal-gravity-height.test.ts).
 */
import { DEG } from '../units.js';
import { normalGravity } from './normal-gravity.js';

/** GRS80 semi-major axis a, m (defining constant) [Moritz1980]. */
export const GRS80_SEMI_MAJOR_AXIS_M = 6_378_137;
/** GRS80 flattening f = 1/298.257222101, dimensionless (derived constant) [Moritz1980]. */
export const GRS80_FLATTENING = 1 / 298.257222101;
/** GRS80 m = omega^2 a^2 b / GM = 0.00344978600308, dimensionless (derived constant) [Moritz1980]. */
export const GRS80_M = 0.00344978600308;

/**
 * GRS80 normal gravity, m/s^2, at geodetic latitude `latDeg` (degrees) and ellipsoidal height
 * `ellipsoidalHeightM` (m; negative below the ellipsoid).
 * [HeiskanenMoritz1967] eq. 2-124, as used in [Hinze2005]:
 *   gamma_h = gamma0 [1 - 2/a (1 + f + m - 2 f sin^2 phi) h + 3 h^2 / a^2]
 * with gamma0 the closed-form GRS80 value. The neglected terms are of order f^2 h/a and
 * h^3/a^3 relative, i.e. below 1e-4 mGal for |h| <= 10 km.
 */
export function normalGravityAtHeight(latDeg: number, ellipsoidalHeightM: number): number {
  const a = GRS80_SEMI_MAJOR_AXIS_M;
  const f = GRS80_FLATTENING;
  const sinPhi = Math.sin(latDeg * DEG);
  const s = sinPhi * sinPhi;
  const h = ellipsoidalHeightM;
  const gamma0 = normalGravity(latDeg, 'grs80');
  // [HeiskanenMoritz1967] eq. 2-124
  return gamma0 * (1 - (2 / a) * (1 + f + GRS80_M - 2 * f * s) * h + (3 * h * h) / (a * a));
}
