/**
 * Gravity anomalies assembled from their reduction terms. Pure arithmetic, SI throughout; the
 * sign conventions are those of [Hinze2005]:
 *   FAA = g_obs - gamma0 + FAC + g_atm
 *   SBA = FAA - BC
 *   CBA = SBA + TC (+ inner-zone TC supplied by the user)
 */

export interface AnomalyTerms {
  /** Observed gravity, m/s^2 (NaN when the station has none: every anomaly is then NaN). */
  readonly gobs: number;
  /** Normal gravity on the ellipsoid at the station latitude, m/s^2. */
  readonly normal: number;
  /** Atmospheric correction, m/s^2, added. */
  readonly atm: number;
  /** Free-air correction, m/s^2, positive above the datum, added. */
  readonly freeAir: number;
  /** Bouguer correction (cap or slab), m/s^2, subtracted. */
  readonly bouguer: number;
  /** Terrain correction (Bullard C), m/s^2, added. NaN gives a NaN complete Bouguer anomaly. */
  readonly terrain: number;
  /** Field inner-zone terrain correction, m/s^2, added; omit when none was supplied. */
  readonly innerTerrain?: number;
}

export interface Anomalies {
  /** Free-air anomaly, m/s^2. */
  readonly freeAir: number;
  /** Simple Bouguer anomaly, m/s^2. */
  readonly simpleBouguer: number;
  /** Complete Bouguer anomaly, m/s^2. */
  readonly completeBouguer: number;
}

/** Free-air, simple and complete Bouguer anomalies, m/s^2. NaN in any term propagates. */
export function anomalies(terms: AnomalyTerms): Anomalies {
  const freeAir = terms.gobs - terms.normal + terms.freeAir + terms.atm;
  const simpleBouguer = freeAir - terms.bouguer;
  const completeBouguer = simpleBouguer + terms.terrain + (terms.innerTerrain ?? 0);
  return { freeAir, simpleBouguer, completeBouguer };
}
