/**
 * Exact GRS80 normal gravity at any point above (or slightly below) the ellipsoid, from the
 * closed-form normal potential in ellipsoidal-harmonic coordinates (u, beta)
 * ([HeiskanenMoritz1967] sections 1-20 and 2-7..2-9; the same closed form is used for
 * normal gravity above the ellipsoid in [Hinze2005]). On the ellipsoid it reduces to the
 * Somigliana formula; its vertical gradient there is Bruns' -2 gamma J - 2 omega^2.
 *
 * The second-order series of normal-gravity-height.ts drops terms of second order in f and m:
 * against this form it errs by up to ~1.07e-5 mGal per metre at the equator (0.01 mGal per km).
 *
 * Conditioning: the closed forms of q(u) and q'(u) lose ~6 digits near the Earth; the series
 * used instead keep the result smooth in h to float64 precision (its vertical gradient matches
 * Bruns' formula to ~2e-11 relative, against ~4e-8 with the closed forms).
 */
import { DEG } from '../units.js';
import { GRS80_FLATTENING, GRS80_SEMI_MAJOR_AXIS_M } from './normal-gravity-height.js';

/** GRS80 geocentric gravitational constant GM, m^3/s^2 (defining constant) [Moritz1980]. */
export const GRS80_GM_M3_S2 = 3.986005e14;
/** GRS80 angular velocity omega, rad/s (defining constant) [Moritz1980]. */
export const GRS80_OMEGA_RAD_S = 7.292115e-5;

const A = GRS80_SEMI_MAJOR_AXIS_M;
const B = A * (1 - GRS80_FLATTENING); // semi-minor axis, m (6356752.3141 m [Moritz1980])
const E2_LINEAR = A * A - B * B; // linear eccentricity squared E^2, m^2
const E_LINEAR = Math.sqrt(E2_LINEAR);
const ECC2 = E2_LINEAR / (A * A); // first eccentricity squared

/**
 * q(u) = 1/2 [(1 + 3u^2/E^2) atan(E/u) - 3u/E] [HeiskanenMoritz1967] eq. 2-58, and
 * q'(u) = 3 (1 + u^2/E^2)(1 - (u/E) atan(E/u)) - 1 (eq. 2-67). Both closed forms cancel
 * ~6 digits near the Earth (t = E/u ~ 0.08), so for t < 0.5 they are summed as the series
 * that follow from atan t = sum (-1)^n t^(2n+1)/(2n+1):
 *   q  = 2 sum_{n>=1} (-1)^(n+1) n t^(2n+1) / ((2n+1)(2n+3))
 *   q' = 6 sum_{n>=1} (-1)^(n+1) t^(2n) / ((2n+1)(2n+3))
 */
function qOf(u: number): number {
  const t = E_LINEAR / u;
  if (!(t < 0.5)) return 0.5 * ((1 + 3 / (t * t)) * Math.atan(t) - 3 / t);
  const t2 = t * t;
  let power = t * t2;
  let sum = 0;
  for (let n = 1; n <= 40; n++) {
    const term = (n * power) / ((2 * n + 1) * (2 * n + 3));
    sum += n % 2 === 1 ? term : -term;
    if (term < 1e-18 * sum) break;
    power *= t2;
  }
  return 2 * sum;
}

function qPrimeOf(u: number): number {
  const t = E_LINEAR / u;
  if (!(t < 0.5)) return 3 * (1 + 1 / (t * t)) * (1 - Math.atan(t) / t) - 1;
  const t2 = t * t;
  let power = t2;
  let sum = 0;
  for (let n = 1; n <= 40; n++) {
    const term = power / ((2 * n + 1) * (2 * n + 3));
    sum += n % 2 === 1 ? term : -term;
    if (term < 1e-18 * sum) break;
    power *= t2;
  }
  return 6 * sum;
}

const Q0 = qOf(B);

/**
 * Magnitude of GRS80 normal gravity, m/s^2, at geodetic latitude `latDeg` (degrees) and
 * ellipsoidal height `ellipsoidalHeightM` (m). Valid while the point stays outside the focal
 * disc (|h| far below 6000 km; any topographic height).
 */
export function normalGravityEllipsoidal(latDeg: number, ellipsoidalHeightM: number): number {
  const phi = latDeg * DEG;
  const sinPhi = Math.sin(phi);
  const cosPhi = Math.cos(phi);
  const h = ellipsoidalHeightM;
  // geodetic -> meridian-plane Cartesian (x: distance from the axis, z: along the axis)
  const nu = A / Math.sqrt(1 - ECC2 * sinPhi * sinPhi);
  const x = (nu + h) * cosPhi;
  const z = (nu * (1 - ECC2) + h) * sinPhi;
  // Cartesian -> ellipsoidal-harmonic (u, beta): x^2/(u^2+E^2) + z^2/u^2 = 1
  const d = x * x + z * z - E2_LINEAR;
  const u2 = 0.5 * d * (1 + Math.sqrt(1 + (4 * E2_LINEAR * z * z) / (d * d)));
  const u = Math.sqrt(u2);
  const v2 = u2 + E2_LINEAR;
  const v = Math.sqrt(v2);
  const beta = Math.atan2(z * v, u * x);
  const sinB = Math.sin(beta);
  const cosB = Math.cos(beta);
  const w = Math.sqrt((u2 + E2_LINEAR * sinB * sinB) / v2);
  const om2 = GRS80_OMEGA_RAD_S * GRS80_OMEGA_RAD_S;
  // [HeiskanenMoritz1967] eq. 2-67 (u component) and its beta companion
  const gammaU =
    -(
      GRS80_GM_M3_S2 / v2 +
      ((om2 * A * A * E_LINEAR) / v2) * (qPrimeOf(u) / Q0) * (0.5 * sinB * sinB - 1 / 6) -
      om2 * u * cosB * cosB
    ) / w;
  const gammaBeta = ((-(om2 * A * A) / v) * (qOf(u) / Q0) + om2 * v) * sinB * cosB / w;
  return Math.hypot(gammaU, gammaBeta);
}
