/**
 * Free-air correction: normal gravity decreases with height above the ellipsoid; the correction
 * is positive above the datum and ADDED to observed gravity.
 */
import { DEG, MGAL } from '../units.js';

/** 1: constant gradient 0.3086 mGal/m; 2: latitude- and height-dependent second order form. */
export type FreeAirOrder = 1 | 2;

/** Conventional mean vertical gradient of normal gravity, m/s^2 per m (0.3086 mGal/m; common practice). */
export const FREE_AIR_GRADIENT_MS2_PER_M = 0.3086 * MGAL;

export function isFreeAirOrder(n: number): n is FreeAirOrder {
  return n === 1 || n === 2;
}

/**
 * Free-air correction, m/s^2, for a station at `heightM` (m above the datum; negative below it)
 * and geodetic latitude `latDeg` (degrees, used by order 2 only).
 * - order 1: 0.3086 h mGal (common practice)
 * - order 2: (0.3087691 - 0.0004398 sin^2 phi) h - 7.2125e-8 h^2 mGal ([Hinze2005], from
 *   [HeiskanenMoritz1967] eq. 2-124 with GRS80 constants)
 * NaN height (or NaN latitude with order 2) gives NaN.
 */
export function freeAirCorrection(heightM: number, latDeg: number, order: FreeAirOrder): number {
  switch (order) {
    case 1:
      return FREE_AIR_GRADIENT_MS2_PER_M * heightM;
    case 2: {
      const sinPhi = Math.sin(latDeg * DEG);
      // [Hinze2005] second-order free-air correction
      return ((0.3087691 - 0.0004398 * sinPhi * sinPhi) * heightM - 7.2125e-8 * heightM * heightM) * MGAL;
    }
  }
}
