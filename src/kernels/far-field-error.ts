/**
 * Error model for choosing a kernel from an error budget (docs/physics.md §5). All functions
 * return a relative-error MAGNITUDE (dimensionless, >= 0) for a square cell of side cellM
 * (pass the longer side of a rectangular cell) whose centre is at horizontal distance distM.
 *
 * Constants (derived, then measured in test/kernels/far-field-error.test.ts):
 * - line element: midpoint rule on the horizontal integral of z/r^3 for a thin layer,
 *   error (cell^2/24) * (2-D Laplacian of rho^-3 = 9 rho^-5) / rho^-3 = (3/8)(cell/D)^2; the
 *   line element UNDERESTIMATES. Measured -0.374 (D/cell = 10, thickness 1 m). For thick
 *   columns (thickness >= D) the coefficient falls towards 1/24 (Laplacian of 1/rho), so 3/8
 *   is the upper bound.
 * - 2x2 Gauss-Legendre: 1-D two-point error h^5 f''''/4320; on the cell's axis f_xxxx + f_yyyy
 *   = 405 D^-7 for a thin layer, giving (405/4320)(cell/D)^4 = (3/32)(cell/D)^4 (underestimate).
 *   Measured -0.0936 on axis, +0.015 on the diagonal; 3/32 is the azimuthal maximum.
 * - 8-term prism sum: rounding in terms of size ~D cancelling to a result ~s^2 h^2 / D^3 (top
 *   at the station level): K (D/s)^4 (s/h)^2. Measured worst K over random azimuths, D/s from
 *   10 to 3000, s/h from 0.1 to 10: 1.5e-15 to 2.0e-15 for thin layers, up to 3.4e-15 for
 *   thick ones at D/s = 10; K = 4e-15 bounds them all (physics.md quotes ~1e-14 for the
 *   16-log form; prism.ts merges logs).
 */

/** Line element relative-error coefficient, dimensionless (derived 3/8; measured 0.374). */
export const LINE_ELEMENT_ERROR_COEFF = 3 / 8;
/** 2x2 Gauss-Legendre relative-error coefficient, dimensionless (derived 3/32; measured 0.0936). */
export const GAUSS2X2_ERROR_COEFF = 3 / 32;
/** Prism cancellation coefficient K, dimensionless (bound on the measured 1.5e-15 .. 3.4e-15). */
export const PRISM_CANCELLATION_COEFF = 4e-15;

/**
 * Relative error of one line element replacing a prism.
 * @param cellM cell side, m
 * @param distM horizontal distance from the station to the cell centre, m
 */
export function lineElementRelError(cellM: number, distM: number): number {
  const q = cellM / distM;
  return LINE_ELEMENT_ERROR_COEFF * q * q;
}

/**
 * Relative error of the 2x2 Gauss-Legendre line-element form replacing a prism.
 * @param cellM cell side, m
 * @param distM horizontal distance to the cell centre, m
 */
export function gauss2x2RelError(cellM: number, distM: number): number {
  const q = cellM / distM;
  const q2 = q * q;
  return GAUSS2X2_ERROR_COEFF * q2 * q2;
}

/**
 * Relative rounding error of the closed-form prism from cancellation of its 8 corner terms.
 * @param cellM cell side s, m
 * @param distM horizontal distance D, m
 * @param thicknessM prism thickness h, m (top at the station level)
 */
export function prismCancellationRelError(cellM: number, distM: number, thicknessM: number): number {
  const d = distM / cellM;
  const a = cellM / thicknessM;
  return PRISM_CANCELLATION_COEFF * d * d * d * d * a * a;
}
