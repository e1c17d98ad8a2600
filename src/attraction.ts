/**
 * The one place where G·rho multiplies the kernels' geometric factors (src/kernels/).
 * SI units: metres, kg/m^3, m/s^2. z positive down; results positive down.
 */
import { G } from './constants.js';
import { prismGzFactor } from './kernels/prism.js';

export { G };

/**
 * Vertical attraction of a homogeneous right rectangular prism at the origin.
 * @param x1 west bound, m (x east)
 * @param x2 east bound, m
 * @param y1 south bound, m (y north)
 * @param y2 north bound, m
 * @param z1 top, m (z down)
 * @param z2 bottom, m
 * @param densityKgM3 density (or density contrast), kg/m^3
 * @returns g_z in m/s^2, positive down
 */
export function prismGz(
  x1: number,
  x2: number,
  y1: number,
  y2: number,
  z1: number,
  z2: number,
  densityKgM3: number,
): number {
  return G * densityKgM3 * prismGzFactor(x1, x2, y1, y2, z1, z2);
}

/**
 * Turn any kernel's geometric factor into an attraction.
 * @param factor geometric factor F, m (prisms, lines, columns, sectors)
 * @param densityKgM3 density, kg/m^3
 * @returns g in m/s^2
 */
export function gravityFromFactor(factor: number, densityKgM3: number): number {
  return G * densityKgM3 * factor;
}
