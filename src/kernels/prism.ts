/**
 * Vertical attraction of a right rectangular prism: closed form [Nagy1966], [Nagy2000].
 *
 * Convention (shared by every kernel): station at the origin, x east, y north, z positive
 * DOWN. The result is a geometric factor F in metres with g_z = G * rho * F, positive DOWN
 * (mass below the station gives F > 0, mass above gives F < 0).
 *
 * Numerics (docs/physics.md §5, "Prism numerics"):
 * - a corner term whose coefficient (x, y or z) is exactly 0 is dropped, so a station on a
 *   face, edge or corner never evaluates log(0) or 0/0;
 * - a log argument y + r with y < 0 is rewritten (x^2 + z^2) / (r - y), which is exact
 *   algebra and has no cancellation;
 * - the angle term uses atan(x y / (z r)), never atan2: atan2 adds a spurious ±pi where
 *   z < 0, which is wrong when the station is inside the footprint with mass above it;
 * - the four logs sharing one coefficient are merged into the log of one ratio of products
 *   (4 logs per prism instead of 16; same absolute rounding, a few ulp).
 * Far from the prism the 8-term sum cancels: relative error ≈ K (D/s)^4 (s/h)^2, see
 * far-field-error.ts. Swapping a pair of bounds negates the result.
 */

/** ln argument u + r without cancellation; vSq = r^2 - u^2 (sum of the other two squares). */
function logArgument(u: number, r: number, vSq: number): number {
  return u >= 0 ? u + r : vSq / (r - u);
}

/** atan term x y / (z r) for z != 0; a zero product x y gives exactly 0 (also when z r underflows). */
function angleTerm(xy: number, zr: number): number {
  return xy === 0 ? 0 : Math.atan(xy / zr);
}

/**
 * Geometric factor of a homogeneous right rectangular prism, g_z = G rho F.
 * @param x1 west bound, m (station-relative, x east)
 * @param x2 east bound, m
 * @param y1 south bound, m (y north)
 * @param y2 north bound, m
 * @param z1 top, m (z positive down; negative = above the station)
 * @param z2 bottom, m
 * @returns F in metres, positive for mass below the station; exactly 0 for zero thickness
 */
export function prismGzFactor(
  x1: number,
  x2: number,
  y1: number,
  y2: number,
  z1: number,
  z2: number,
): number {
  if (x1 === x2 || y1 === y2 || z1 === z2) return 0;
  const xa2 = x1 * x1;
  const xb2 = x2 * x2;
  const ya2 = y1 * y1;
  const yb2 = y2 * y2;
  const za2 = z1 * z1;
  const zb2 = z2 * z2;
  // Corner distances r_ijk, index order x, y, z; 1 = lower bound, 2 = upper bound.
  const r111 = Math.sqrt(xa2 + ya2 + za2);
  const r112 = Math.sqrt(xa2 + ya2 + zb2);
  const r121 = Math.sqrt(xa2 + yb2 + za2);
  const r122 = Math.sqrt(xa2 + yb2 + zb2);
  const r211 = Math.sqrt(xb2 + ya2 + za2);
  const r212 = Math.sqrt(xb2 + ya2 + zb2);
  const r221 = Math.sqrt(xb2 + yb2 + za2);
  const r222 = Math.sqrt(xb2 + yb2 + zb2);

  // [Nagy1966], [Nagy2000]: closed form of g_z (equation number not checked here), as the triple difference
  // B = [[[ x ln(y + r) + y ln(x + r) - z atan(x y / (z r)) ]]] with sign (-1)^(i+j+k),
  // i, j, k in {1, 2}; then g_z = -G rho B (z down).
  let bracket = 0;

  // x ln(y + r): for each x_i, sum_{j,k} s_j s_k ln(y_j + r) = ln(A22 A11 / (A21 A12)).
  if (x1 !== 0) {
    const p = logArgument(y2, r122, xa2 + zb2) * logArgument(y1, r111, xa2 + za2);
    const q = logArgument(y2, r121, xa2 + za2) * logArgument(y1, r112, xa2 + zb2);
    bracket -= x1 * Math.log(p / q);
  }
  if (x2 !== 0) {
    const p = logArgument(y2, r222, xb2 + zb2) * logArgument(y1, r211, xb2 + za2);
    const q = logArgument(y2, r221, xb2 + za2) * logArgument(y1, r212, xb2 + zb2);
    bracket += x2 * Math.log(p / q);
  }
  // y ln(x + r): for each y_j, sum_{i,k} s_i s_k ln(x_i + r).
  if (y1 !== 0) {
    const p = logArgument(x2, r212, ya2 + zb2) * logArgument(x1, r111, ya2 + za2);
    const q = logArgument(x2, r211, ya2 + za2) * logArgument(x1, r112, ya2 + zb2);
    bracket -= y1 * Math.log(p / q);
  }
  if (y2 !== 0) {
    const p = logArgument(x2, r222, yb2 + zb2) * logArgument(x1, r121, yb2 + za2);
    const q = logArgument(x2, r221, yb2 + za2) * logArgument(x1, r122, yb2 + zb2);
    bracket += y2 * Math.log(p / q);
  }
  // -z atan(x y / (z r)): for each z_k, sum_{i,j} s_i s_j atan(x_i y_j / (z_k r)).
  const x1y1 = x1 * y1;
  const x1y2 = x1 * y2;
  const x2y1 = x2 * y1;
  const x2y2 = x2 * y2;
  if (z1 !== 0) {
    const a =
      angleTerm(x2y2, z1 * r221) -
      angleTerm(x1y2, z1 * r121) -
      angleTerm(x2y1, z1 * r211) +
      angleTerm(x1y1, z1 * r111);
    bracket += z1 * a; // sign (-1) of z1 times the leading minus of the term
  }
  if (z2 !== 0) {
    const a =
      angleTerm(x2y2, z2 * r222) -
      angleTerm(x1y2, z2 * r122) -
      angleTerm(x2y1, z2 * r212) +
      angleTerm(x1y1, z2 * r112);
    bracket -= z2 * a;
  }
  return -bracket;
}
