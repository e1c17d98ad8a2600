/**
 * Vertical line element: the far-field form of a prism column (docs/physics.md §5).
 * Convention: station at the origin, z positive DOWN; result positive DOWN, g_z = G rho F.
 *
 * g_z = G rho A (1/R1 - 1/R2), R_i = sqrt(s^2 + z_i^2) (common practice: the integral of
 * z / r^3 along a vertical line). Written in the stable form
 *   A (z2 - z1)(z2 + z1) / (R1 R2 (R1 + R2)),
 * which has no cancellation; the naive difference of reciprocals loses up to 9 digits.
 * Against the prism it replaces, the relative error is about -(3/8)(cell/D)^2 for a thin
 * layer (far-field-error.ts); the 2x2 Gauss-Legendre form below is O((cell/D)^4).
 */

/** 1 / (2 sqrt 3): 2-point Gauss-Legendre abscissa on [-1/2, 1/2] (dimensionless). */
const GAUSS_HALF_OFFSET = 0.5 / Math.sqrt(3);

/**
 * Vertical line mass of cross-section A from depth z1 to z2 at horizontal distance s.
 * @param areaM2 cross-section A, m^2
 * @param horizDistM horizontal distance s from the station, m
 * @param z1 top depth, m (z down)
 * @param z2 bottom depth, m (z2 < z1 negates the result)
 * @returns F in metres (A times 1/m); s = 0 with z1 or z2 = 0 gives ±Infinity or NaN
 */
export function lineElementGzFactor(areaM2: number, horizDistM: number, z1: number, z2: number): number {
  const s2 = horizDistM * horizDistM;
  const r1 = Math.sqrt(s2 + z1 * z1);
  const r2 = Math.sqrt(s2 + z2 * z2);
  return (areaM2 * (z2 - z1) * (z2 + z1)) / (r1 * r2 * (r1 + r2));
}

/**
 * A dx × dy cell centred at (cx, cy), from depth z1 to z2, as 4 line elements of area
 * dx dy / 4 at the 2x2 Gauss-Legendre points (common practice: tensor Gauss-Legendre rule,
 * exact for bicubic integrands). Error O((cell/D)^4).
 * @param dx cell width east, m
 * @param dy cell width north, m
 * @param cx cell centre east of the station, m
 * @param cy cell centre north of the station, m
 * @param z1 top depth, m (z down)
 * @param z2 bottom depth, m
 * @returns F in metres
 */
export function lineElementGauss2x2GzFactor(
  dx: number,
  dy: number,
  cx: number,
  cy: number,
  z1: number,
  z2: number,
): number {
  const ox = dx * GAUSS_HALF_OFFSET;
  const oy = dy * GAUSS_HALF_OFFSET;
  const xa = cx - ox;
  const xb = cx + ox;
  const ya2 = (cy - oy) * (cy - oy);
  const yb2 = (cy + oy) * (cy + oy);
  const xa2 = xa * xa;
  const xb2 = xb * xb;
  const za2 = z1 * z1;
  const zb2 = z2 * z2;
  const sAA = xa2 + ya2;
  const sAB = xa2 + yb2;
  const sBA = xb2 + ya2;
  const sBB = xb2 + yb2;
  let r1 = Math.sqrt(sAA + za2);
  let r2 = Math.sqrt(sAA + zb2);
  let sum = 1 / (r1 * r2 * (r1 + r2));
  r1 = Math.sqrt(sAB + za2);
  r2 = Math.sqrt(sAB + zb2);
  sum += 1 / (r1 * r2 * (r1 + r2));
  r1 = Math.sqrt(sBA + za2);
  r2 = Math.sqrt(sBA + zb2);
  sum += 1 / (r1 * r2 * (r1 + r2));
  r1 = Math.sqrt(sBB + za2);
  r2 = Math.sqrt(sBB + zb2);
  sum += 1 / (r1 * r2 * (r1 + r2));
  return 0.25 * dx * dy * (z2 - z1) * (z2 + z1) * sum;
}
