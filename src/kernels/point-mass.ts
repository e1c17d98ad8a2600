/**
 * Point mass. Convention: station at the origin, x east, y north, z positive DOWN; result
 * positive DOWN.
 */

/**
 * Geometric factor of a point mass: F = z / r^3, so g_z = G m F.
 * @param x east offset of the mass, m
 * @param y north offset, m
 * @param z depth below the station, m (z down)
 * @returns F in 1/m^2; the mass at the station itself (r = 0) gives NaN (undefined attraction)
 */
export function pointMassGzFactor(x: number, y: number, z: number): number {
  const r2 = x * x + y * y + z * z;
  return z / (r2 * Math.sqrt(r2));
}
