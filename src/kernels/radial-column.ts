/**
 * Radial column in geocentric geometry, for distant cells with Earth curvature.
 *
 * A column between radii r1 < r2 (m from Earth's centre) whose cross-section grows as r^2,
 * so its mass is rho * omega * ∫ r^2 dr (omega = solid angle of the cell, sr). The station
 * sits at radius rs on the polar axis; the column's axis is at angular distance psi. The
 * result is the attraction component along the station's DOWNWARD radial direction:
 *   F = omega ∫_{r1}^{r2} r^2 (rs - r cos psi) / L^3 dr,  L^2 = rs^2 + r^2 - 2 rs r cos psi,
 * with g = G rho F (F in metres; positive = towards Earth's centre).
 *
 * Closed form (derived for talus by substituting u = r - rs cos psi, q^2 = rs^2 sin^2 psi,
 * L^2 = u^2 + q^2, integrating the four powers u^n / L^3 term by term and simplifying; checked
 * against an independent Gauss-Legendre quadrature in test/kernels/radial-column.test.ts):
 *   Phi(r) = -c L + rs (1 - 3c^2) ln(u + L) + rs [(4c^2 - 1) r - 2 rs c] / L,   c = cos psi.
 * Phi(r2) - Phi(r1) is evaluated as a sum of DIFFERENCES written analytically (each one a
 * product with T = r2 - r1), so a 1 cm column at r ~ 6.4e6 m keeps full precision:
 *   L2 - L1 = T (u1 + u2) / (L1 + L2)      (L^2 = (r - rs)^2 + 2 rs r (1 - c), no cancellation)
 *   ln((u2 + L2)/(u1 + L1)) = log1p(T (L1 + L2 + u1 + u2) / ((L1 + L2)(u1 + L1)))  if u1+u2 >= 0
 *                          = -log1p(-T (L1 + L2 - u1 - u2) / ((L1 + L2)(L1 - u1)))  otherwise
 *   P2/L2 - P1/L1 = T [(4c^2 - 1) L1 - P1 (L2 - L1)/T] / (L1 L2)
 * 1 - cosPsi is exact for cosPsi in [0.5, 1] (Sterbenz), so the geometry passed in is honoured
 * exactly; note that a double cosPsi quantises psi to about 1.1e-16 / sin(psi) rad (1e-12 rad
 * at psi = 1e-4), far below any DEM position error.
 * psi = 0 is allowed when the column does not contain the station (infinite attraction).
 * r2 < r1 returns exactly the negated value of the swapped column (a mass deficit).
 */

/**
 * @param solidAngleSr solid angle of the cell seen from Earth's centre, sr
 *   (cell area on the reference sphere of radius R divided by R^2)
 * @param stationRadiusM station distance from Earth's centre, m
 * @param r1M lower column radius, m
 * @param r2M upper column radius, m (r2 < r1 gives the negated value)
 * @param cosPsi cosine of the angular distance between station and column axis
 * @returns F in metres, g_down = G rho F
 */
export function radialColumnGzFactor(
  solidAngleSr: number,
  stationRadiusM: number,
  r1M: number,
  r2M: number,
  cosPsi: number,
): number {
  let ra = r1M;
  let rb = r2M;
  let sign = 1;
  if (rb < ra) {
    ra = r2M;
    rb = r1M;
    sign = -1;
  }
  const thick = rb - ra;
  if (thick === 0) return 0;
  const rs = stationRadiusM;
  const c = cosPsi;
  const w = 1 - c;
  const rsW = rs * w;
  const q2 = rs * rsW * (1 + c); // rs^2 sin^2 psi
  const ta = ra - rs;
  const tb = rb - rs;
  const ua = ta + rsW; // r - rs c
  const ub = tb + rsW;
  const la = Math.sqrt(ta * ta + 2 * rsW * ra);
  const lb = Math.sqrt(tb * tb + 2 * rsW * rb);
  const lSum = la + lb;
  const uSum = ua + ub;
  const dL = (thick * uSum) / lSum;

  // Difference of ln(u + L) between the ends, cancellation-free in both half-spaces.
  let dLog: number;
  if (uSum >= 0) {
    const ga = ua >= 0 ? ua + la : q2 / (la - ua);
    dLog = Math.log1p((thick * (lSum + uSum)) / (lSum * ga));
  } else {
    const ha = ua <= 0 ? la - ua : q2 / (la + ua);
    dLog = -Math.log1p((-thick * (lSum - uSum)) / (lSum * ha));
  }

  const k = 4 * c * c - 1;
  const pa = k * ta + rs * (k - 2 * c); // (4c^2 - 1) r1 - 2 rs c
  const dPoverL = (k * thick * la - pa * dL) / (la * lb);

  const diff = -c * dL + rs * (1 - 3 * c * c) * dLog + rs * dPoverL;
  return sign * solidAngleSr * diff;
}
