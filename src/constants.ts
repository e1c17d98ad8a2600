/**
 * Physical and geodetic constants, SI units. Sources: docs/references.md.
 */

/** Newtonian constant of gravitation, m^3 kg^-1 s^-2 [CODATA2018]. */
export const G = 6.6743e-11;

/** Mean Earth radius used for the spherical cap and curvature geometry, m [LaFehr1991] via [Hinze2005]. */
export const EARTH_RADIUS_M = 6_371_000;

/** Outer radius of the Bouguer cap / Hayford-Bowie zone O, m (arc length on the R0 sphere) [LaFehr1991]. */
export const CAP_RADIUS_M = 166_735;

/** Conventional reduction density of the upper crust, kg/m^3 (common practice). */
export const DEFAULT_DENSITY_KG_M3 = 2670;

/** Unit density used for the density-independent terrain effect columns, kg/m^3. */
export const UNIT_DENSITY_KG_M3 = 1000;
