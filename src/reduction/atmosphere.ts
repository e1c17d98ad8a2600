/**
 * Atmospheric correction: the attraction of the atmosphere above the station, which the normal
 * gravity formulas include in the Earth's mass. It is ADDED to observed gravity.
 */
import { MGAL } from '../units.js';

/**
 * Atmospheric correction, m/s^2, at height `heightM` (m above the ellipsoid, or above sea level
 * as the survey defines heights).
 * [Hinze2005] after [Wenzel1985]: g_atm = 0.874 - 9.9e-5 h + 3.56e-9 h^2 mGal (h in m).
 * NaN height gives NaN.
 */
export function atmosphericCorrection(heightM: number): number {
  return (0.874 - 9.9e-5 * heightM + 3.56e-9 * heightM * heightM) * MGAL;
}
