/**
 * Bouguer slab (Bullard A): the attraction of an infinite horizontal slab of thickness h at a
 * point on its top face.
 */
import { G } from '../constants.js';

/**
 * 2 pi G rho h, m/s^2 ([Hinze2005]; Bouguer's classical result). `heightM` is the station
 * height above the datum, m (negative below it gives a negative value); `densityKgM3` in kg/m^3.
 */
export function bouguerSlab(heightM: number, densityKgM3: number): number {
  return 2 * Math.PI * G * densityKgM3 * heightM;
}
