/**
 * Vertical line element with a correction for the cell's horizontal extent.
 *
 * A column of cross-section dx × dy centred at (cx, cy) (station at the origin, z DOWN) has
 * g_z = G rho ∫∫ [g(z1) - g(z2)] dx dy with g(z) = (x^2 + y^2 + z^2)^(-1/2). Averaging g over
 * the rectangle by Taylor expansion about its centre (midpoint rule with its error term,
 * common practice) gives
 *   mean g = g + (dx^2/24) g_xx + (dy^2/24) g_yy + O(cell^4 / D^5),
 *   g_xx = -q^-3 + 3 x^2 q^-5,  g_yy = -q^-3 + 3 y^2 q^-5,  q^2 = x^2 + y^2 + z^2.
 * The plain line element's relative error is about (3/8)(cell/D)^2; with this correction the
 * error is O((cell/D)^4) at the cost of one evaluation (measured constant in
 * far-field-error.ts / test/kernels/line-element-extent.test.ts).
 * All differences between the two depths are written in cancellation-free form.
 */

/**
 * @param dx cell width east, m
 * @param dy cell width north, m
 * @param cx cell centre east of the station, m
 * @param cy cell centre north of the station, m
 * @param z1 top depth, m (z down)
 * @param z2 bottom depth, m (z2 < z1 negates the result)
 * @returns F in metres, g_z = G rho F (positive down)
 */
export function lineElementExtentGzFactor(
  dx: number,
  dy: number,
  cx: number,
  cy: number,
  z1: number,
  z2: number,
): number {
  return lineElementParts(dx, dy, cx, cy, z1, z2, true);
}

/**
 * Only the extent correction term of lineElementExtentGzFactor (F_extent - F_line), m. Used
 * to correct kernels that treat a distant cell as one column (e.g. the geocentric radial
 * column) for the cell's horizontal size.
 */
export function lineElementExtentCorrectionFactor(
  dx: number,
  dy: number,
  cx: number,
  cy: number,
  z1: number,
  z2: number,
): number {
  return lineElementParts(dx, dy, cx, cy, z1, z2, false);
}

function lineElementParts(
  dx: number,
  dy: number,
  cx: number,
  cy: number,
  z1: number,
  z2: number,
  withLine: boolean,
): number {
  const h2 = cx * cx + cy * cy;
  const q1sq = h2 + z1 * z1;
  const q2sq = h2 + z2 * z2;
  const q1 = Math.sqrt(q1sq);
  const q2 = Math.sqrt(q2sq);
  // (z2^2 - z1^2) without cancellation
  const dzsq = (z2 - z1) * (z2 + z1);
  // q2 - q1 = (q2^2 - q1^2)/(q1 + q2)
  const dq = dzsq / (q1 + q2);
  const p = q1 * q2;
  // one division: the powers of 1/(q1 q2) by multiplication
  const ip = 1 / p;
  const ip3 = ip * ip * ip;
  // g(z1) - g(z2) = 1/q1 - 1/q2 = (q2 - q1)/(q1 q2)
  const d1 = dq * ip;
  // q1^-3 - q2^-3 = (q2 - q1)(q1^2 + q1 q2 + q2^2)/(q1 q2)^3
  const d3 = dq * (q1sq + p + q2sq) * ip3;
  // q1^-5 - q2^-5 = (q2 - q1)(q2^4 + q2^3 q1 + q2^2 q1^2 + q2 q1^3 + q1^4)/(q1 q2)^5
  const d5 = dq * (q2sq * q2sq + q2sq * p + p * p + q1sq * p + q1sq * q1sq) * (ip3 * ip * ip);
  const dx2 = dx * dx;
  const dy2 = dy * dy;
  const corr = (-(dx2 + dy2) * d3 + 3 * (dx2 * cx * cx + dy2 * cy * cy) * d5) / 24;
  return dx * dy * (withLine ? d1 + corr : corr);
}

/**
 * Extent correction for a column whose depths follow a sphere below the station's tangent
 * plane: z_i(x, y) = drop(x, y) + c_i, drop = rs - sqrt(rs^2 - x^2 - y^2). The cell average of
 * G(x, y) = g(x, y, drop(x, y) + c) picks up the chain-rule terms
 *   G_xx = g_xx + 2 g_xz drop_x + g_zz drop_x^2 + g_z drop_xx   (and likewise in y),
 * which matter for distant cells, where the column's effect is mostly the curvature term
 * linear in its height. Direct differences between the two depths are used: this form is
 * meant for cells many kilometres away, whose depths differ by far more than the rounding.
 * @param dx, dy cell size east / north, m
 * @param cx, cy cell centre east / north of the station, m
 * @param c1, c2 top and bottom depth offsets below the sphere at the cell centre, m (z down)
 * @param sphereRadiusM radius of the sphere through the station, m
 * @returns the correction (mean over the cell minus the centre value) of the line-element
 *   factor, m
 */
export function curvedExtentCorrectionFactor(
  dx: number,
  dy: number,
  cx: number,
  cy: number,
  c1: number,
  c2: number,
  sphereRadiusM: number,
): number {
  const rho2 = cx * cx + cy * cy;
  const t2 = sphereRadiusM * sphereRadiusM - rho2;
  const t = Math.sqrt(t2);
  const drop = rho2 / (sphereRadiusM + t);
  const it = 1 / t;
  const it3 = it * it * it;
  const dX = cx * it;
  const dY = cy * it;
  const dXX = it + cx * cx * it3;
  const dYY = it + cy * cy * it3;
  const a = dx * dx;
  const b = dy * dy;
  return (
    dx *
    dy *
    (curvedSecondDerivatives(drop + c1, cx, cy, rho2, a, b, dX, dY, dXX, dYY) -
      curvedSecondDerivatives(drop + c2, cx, cy, rho2, a, b, dX, dY, dXX, dYY))
  );
}

/** (dx^2 G_xx + dy^2 G_yy) / 24 at depth z (see curvedExtentCorrectionFactor). */
function curvedSecondDerivatives(
  z: number,
  cx: number,
  cy: number,
  rho2: number,
  dx2: number,
  dy2: number,
  dX: number,
  dY: number,
  dXX: number,
  dYY: number,
): number {
  const q2 = rho2 + z * z;
  // q^-3 and 3 q^-5 from one division
  const iq = 1 / Math.sqrt(q2);
  const iq2 = iq * iq;
  const i3 = iq2 * iq;
  const i5x3 = 3 * i3 * iq2;
  const gz = -z * i3;
  const gzz = z * z * i5x3 - i3;
  const gxx = cx * cx * i5x3 - i3;
  const gyy = cy * cy * i5x3 - i3;
  const gxz = cx * z * i5x3;
  const gyz = cy * z * i5x3;
  const Gxx = gxx + 2 * gxz * dX + gzz * dX * dX + gz * dXX;
  const Gyy = gyy + 2 * gyz * dY + gzz * dY * dY + gz * dYY;
  return (dx2 * Gxx + dy2 * Gyy) / 24;
}
