/**
 * Local metric of the GRS80 ellipsoid, for turning degree offsets of geographic DEMs into
 * metres at the station [Moritz1980]: meridian radius M and prime-vertical radius N.
 */

/** GRS80 semi-major axis, m [Moritz1980]. */
export const GRS80_A_M = 6_378_137;
/** GRS80 first eccentricity squared [Moritz1980]. */
export const GRS80_E2 = 0.00669438002290;

/** Meridian radius of curvature M(phi), m. */
export function meridianRadiusM(latDeg: number): number {
  const s = Math.sin((latDeg * Math.PI) / 180);
  const w2 = 1 - GRS80_E2 * s * s;
  return (GRS80_A_M * (1 - GRS80_E2)) / (w2 * Math.sqrt(w2));
}

/** Prime-vertical radius of curvature N(phi), m. */
export function primeVerticalRadiusM(latDeg: number): number {
  const s = Math.sin((latDeg * Math.PI) / 180);
  return GRS80_A_M / Math.sqrt(1 - GRS80_E2 * s * s);
}

/**
 * Depth of a sphere of radius r below its tangent plane at horizontal distance d, m:
 * r - sqrt(r^2 - d^2), written without cancellation (~ d^2 / (2 r); physics.md §5:
 * 7.85 m at 10 km, 785 m at 100 km for r = 6371 km).
 */
export function sphereDropM(distM: number, radiusM: number): number {
  const d2 = distM * distM;
  return d2 / (radiusM + Math.sqrt(radiusM * radiusM - d2));
}
