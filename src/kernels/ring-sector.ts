/**
 * Hammer (1939) annular sector and zone table (docs/physics.md §5).
 * The result is the terrain-correction MAGNITUDE at the sector's centre, >= 0 and even in the
 * height difference: a hill above or a valley below the station both pull so as to reduce
 * g, and the correction adds it back. g = G rho F.
 */

/**
 * Annular sector of radii r1 < r2, angle theta, flat-topped terrain at height difference h.
 * [Hammer1939]: F = theta [ r2 - r1 + sqrt(r1^2 + h^2) - sqrt(r2^2 + h^2) ], evaluated as
 *   theta h^2 (r2 - r1) (1 + (r1 + r2)/(S1 + S2)) / ((r1 + S1)(r2 + S2)),  S_i = sqrt(r_i^2 + h^2)
 * (exact algebra: every factor positive, no cancellation when h << r).
 * @param r1M inner radius, m (>= 0)
 * @param r2M outer radius, m (r2 < r1 negates the result)
 * @param heightDiffM terrain height minus station height, m (sign irrelevant)
 * @param thetaRad sector angle, rad (2 pi for a whole ring)
 * @returns F in metres
 */
export function hammerSectorGzFactor(r1M: number, r2M: number, heightDiffM: number, thetaRad: number): number {
  if (heightDiffM === 0) return 0;
  const h2 = heightDiffM * heightDiffM;
  const s1 = Math.sqrt(r1M * r1M + h2);
  const s2 = Math.sqrt(r2M * r2M + h2);
  return (thetaRad * h2 * (r2M - r1M) * (1 + (r1M + r2M) / (s1 + s2))) / ((r1M + s1) * (r2M + s2));
}

/** One Hammer zone: letter, outer radius (m) and number of equal compartments. */
export interface HammerZone {
  readonly zone: string;
  readonly outerRadiusM: number;
  readonly compartments: number;
}

/**
 * Hammer zones B to M: outer radii converted from feet, compartments B 4, C-D 6, E-F 8,
 * G-I 12, J-M 16 [Hammer1939], as listed in docs/physics.md §5 (radii from memory there; zone
 * F 0.895 km and the 13.6 mile outer limit confirmed in published survey documentation).
 * Zone B's inner radius is 2 m (6.56 ft) in the classic chart (from memory).
 */
export const HAMMER_ZONES: readonly HammerZone[] = Object.freeze([
  { zone: 'B', outerRadiusM: 16.6, compartments: 4 },
  { zone: 'C', outerRadiusM: 53.3, compartments: 6 },
  { zone: 'D', outerRadiusM: 170.1, compartments: 6 },
  { zone: 'E', outerRadiusM: 390.1, compartments: 8 },
  { zone: 'F', outerRadiusM: 894.9, compartments: 8 },
  { zone: 'G', outerRadiusM: 1529.5, compartments: 12 },
  { zone: 'H', outerRadiusM: 2614.6, compartments: 12 },
  { zone: 'I', outerRadiusM: 4469.0, compartments: 12 },
  { zone: 'J', outerRadiusM: 6652.6, compartments: 16 },
  { zone: 'K', outerRadiusM: 9903.0, compartments: 16 },
  { zone: 'L', outerRadiusM: 14741.7, compartments: 16 },
  { zone: 'M', outerRadiusM: 21944.4, compartments: 16 },
].map((z) => Object.freeze(z)));
