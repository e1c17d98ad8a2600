/**
 * The zone plan: which kernel and which pyramid level serve each distance, chosen from an
 * explicit error budget rather than fixed radii.
 *
 * Error model (measured in test/kernels/line-element-extent.test.ts and
 * test/terrain/zoned-vs-brute.test.ts):
 * - A cell of size s whose centre is at distance D, evaluated as one extent-corrected line
 *   element (or geocentric column with the same correction), errs by about
 *   EXTENT_ERROR_COEFF (s/D)^4 of its own contribution. Cells are accepted at a pyramid level
 *   when their NEAREST point is at least `acceptRatio` cell sizes away (so D/s >= ratio + 0.5).
 * - Requiring a per-cell relative error e = accuracy / TC_REFERENCE_UNIT_MGAL (both at the
 *   unit density 1000 kg/m^3) gives acceptRatio = (EXTENT_ERROR_COEFF / e)^(1/4): 5.8 for the
 *   default 0.01 mGal at 2670 kg/m^3. The reference is the summed absolute effect of the cells
 *   handled by these kernels in rugged terrain, taken as 50 mGal at 2670 kg/m^3 (a
 *   conservative figure: the whole TC of steep mountain stations is 10-50 mGal [Zahorec2010]).
 * - Native cells nearer than acceptRatio cells are exact prisms [Nagy2000]; the station's own
 *   window is integrated over a surface through the station (near-zone.ts).
 * - Coarse cells carry the mean, variance, third moment and height-position covariances of
 *   their native heights; each is evaluated as two columns (the two-point rule of
 *   cell-effect.ts, which reproduces all of them; stored in that form from pyramid level 2).
 * - Beyond Hammer zone M (21.9 km, the reported outer zone) cells are radial columns in
 *   geocentric geometry; nearer, flat geometry with every cell lowered by the sphere's drop
 *   (physics.md §5 "Earth curvature": ~0.0004 mGal residual).
 * - Cells cut by the outer radius are refined to 5 % of the radius and counted with the
 *   fraction of their area inside it (the terrain effect per unit area is smallest there).
 */

/** Measured relative error coefficient of the extent-corrected line element, (s/D)^4 law. */
export const EXTENT_ERROR_COEFF = 0.22;
/** Reference summed absolute effect for the budget at 1000 kg/m^3, mGal (50 mGal at 2670; see above). */
export const TC_REFERENCE_UNIT_MGAL = (50 * 1000) / 2670;
/** Outer radius of Hammer zone F, m [Hammer1939]: the end of the reported inner zone. */
export const INNER_ZONE_OUTER_M = 894.9;
/** Outer radius of Hammer zone M, m [Hammer1939]: the end of the reported middle zone. */
export const MIDDLE_ZONE_OUTER_M = 21944.4;

export interface ZonePlanOptions {
  /** Integration radius, m. */
  radiusM: number;
  /** Target accuracy of the TC at the unit density 1000 kg/m^3, mGal (scale from the reduction density). */
  accuracyMgal: number;
  /** Radius inside which the terrain is skipped (field inner-zone TC supplied), m. */
  fieldInnerRadiusM: number;
  /** Fine DEM cell size, m (largest side). */
  fineCellM: number;
  /** Stations more than this above the DEM surface are treated as above the terrain, m. */
  aboveTerrainM: number;
  /** Stations more than this below the DEM surface are flagged below the terrain, m. */
  belowTerrainM: number;
}

export interface ZonePlan extends ZonePlanOptions {
  /** Accept a cell at its level when nearest distance >= acceptRatio * cell size. */
  acceptRatio: number;
  /** Distance beyond which cells are geocentric radial columns, m. */
  geocentricFromM: number;
  /** Cells straddling the outer radius are refined to at most this size, m. */
  boundaryCellM: number;
  /** Half width of the near-station window, native cells. */
  nearHalfCells: number;
  /** Taper radius of the station height adjustment, m. */
  taperM: number;
  /** Quadrature segment length in the near window, m. */
  nearSegmentM: number;
}

export function planZones(o: ZonePlanOptions): ZonePlan {
  const perCellRel = o.accuracyMgal / TC_REFERENCE_UNIT_MGAL;
  const acceptRatio = Math.max(3, Math.pow(EXTENT_ERROR_COEFF / perCellRel, 0.25));
  // The window must hold the field inner disc plus two cells of taper.
  const nearHalfCells = Math.max(2, Math.ceil(o.fieldInnerRadiusM / o.fineCellM) + 2);
  return {
    ...o,
    acceptRatio,
    geocentricFromM: MIDDLE_ZONE_OUTER_M,
    boundaryCellM: Math.max(o.fineCellM, 0.05 * o.radiusM),
    nearHalfCells,
    taperM: 2 * o.fineCellM,
    nearSegmentM: o.fineCellM,
  };
}
