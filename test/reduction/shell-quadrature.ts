/**
 * Independent reference for the spherical Bouguer cap: the downward attraction of a spherical
 * shell segment by nested Gauss-Legendre quadrature of the point-mass kernel in (r, psi).
 * Test-only code; a different method from the closed form it checks.
 *
 * The kernel is nearly singular at the station (r = R, psi = 0). Both directions are split
 * into intervals graded geometrically toward the station: psi into [psi_k / 2, psi_k], and r,
 * at each psi node, into intervals whose length doubles away from the station starting at
 * d = R psi (the horizontal distance). Every interval then holds a function that is smooth on
 * its own scale, and 16-point Gauss-Legendre is converged to ~1e-13 on each.
 */
import { gaussLegendre } from '../helpers/gauss-legendre.js';

const GL16 = gaussLegendre(16);
const GL = { x: GL16.nodes, w: GL16.weights };

function integrate(fn: (t: number) => number, a: number, b: number): number {
  const mid = 0.5 * (a + b);
  const half = 0.5 * (b - a);
  let sum = 0;
  for (let i = 0; i < GL.x.length; i++) sum += GL.w[i]! * fn(mid + half * GL.x[i]!);
  return sum * half;
}

/**
 * Downward attraction (m/s^2, positive toward the centre) at radius `stationRadiusM` on the
 * axis of a shell segment of density `densityKgM3` between radii `innerM` and `outerM` and
 * angular radius `alphaRad`. The station must sit on the inner or the outer surface.
 */
export function shellSegmentAttraction(
  stationRadiusM: number,
  innerM: number,
  outerM: number,
  alphaRad: number,
  densityKgM3: number,
  gravitationalConstant: number,
): number {
  const R = stationRadiusM;
  const onTop = Math.abs(R - outerM) <= Math.abs(R - innerM);
  const thickness = outerM - innerM;
  // radial integrand at fixed psi, as a function of distance t = |R - r| from the station
  const radial = (psi: number, t: number): number => {
    const r = onTop ? R - t : R + t;
    const sinHalf = Math.sin(psi / 2);
    const chord2 = (R - r) * (R - r) + 4 * R * r * sinHalf * sinHalf; // l^2, stable form
    const towardCentre = R - r + 2 * r * sinHalf * sinHalf; // R - r cos(psi), stable form
    return (towardCentre * r * r * Math.sin(psi)) / (chord2 * Math.sqrt(chord2));
  };
  const inner = (psi: number): number => {
    const d = Math.max(R * psi, 1e-300);
    let sum = 0;
    let t0 = 0;
    let t1 = Math.min(d, thickness);
    while (t0 < thickness) {
      sum += integrate((t) => radial(psi, t), t0, t1);
      t0 = t1;
      t1 = Math.min(2 * t1, thickness);
    }
    return sum;
  };
  // psi intervals [psi/2, psi] down to psiMin; the neglected [0, psiMin] is bounded by
  // R psiMin (the inner integral never exceeds R), i.e. 1e-13 of the thickness.
  const psiMin = (1e-13 * thickness) / R;
  let total = 0;
  let hi = alphaRad;
  while (hi > psiMin) {
    const lo = hi / 2;
    total += integrate(inner, lo, hi);
    hi = lo;
  }
  return 2 * Math.PI * gravitationalConstant * densityKgM3 * total;
}
