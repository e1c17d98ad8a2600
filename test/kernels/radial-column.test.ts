import { describe, it, expect } from 'vitest';
import { radialColumnGzFactor } from '../../src/kernels/radial-column.js';
import { lineElementGzFactor } from '../../src/kernels/line-element.js';
import { pointMassGzFactor } from '../../src/kernels/point-mass.js';
import { assertClose } from '../helpers/assert-close.js';
import { gaussLegendre, integrate1d } from '../helpers/gauss-legendre.js';

const R = 6_371_000; // mean Earth radius, m (docs/physics.md §4)
const GL16 = gaussLegendre(16);

/** Direct quadrature of omega ∫ r^2 (rs - r c) / L^3 dr, with L^2 in its cancellation-free form. */
function quadrature(omega: number, rs: number, r1: number, r2: number, c: number, panels: number): number {
  const w = 1 - c;
  return (
    omega *
    integrate1d(
      (r) => {
        const t = r - rs;
        const l2 = t * t + 2 * rs * r * w;
        return (r * r * (rs * w - t * c)) / (l2 * Math.sqrt(l2)); // rs - r c = rs (1 - c) - (r - rs) c
      },
      r1,
      r2,
      GL16,
      panels,
    )
  );
}

describe('radialColumnGzFactor: closed form against direct quadrature', () => {
  const rs = R + 100;
  const omega = 1e-8;
  // Thin columns: 16-point Gauss on one panel of ≤ 1 m at a distance ≥ 637 m is exact to
  // rounding; thick ones: panels ≤ 2.5 m, also converged. Target from the brief: 1e-9.
  const columns: Array<[string, number, number]> = [
    ['1 m thin, at the sphere', 0, 1],
    ['1 cm thin, at the sphere', 0, 0.01],
    ['1 m thin, above the station', 300, 301],
    ['1 cm thin, deep below', -3000, -2999.99],
    ['thick, straddling the station', -500, 2000],
  ];
  for (const psi of [1e-4, 1e-3, 1e-2, 0.03]) {
    for (const [name, a, b] of columns) {
      it(`${name}, psi = ${psi}: agrees to 1e-9 relative`, () => {
        const c = Math.cos(psi);
        const panels = Math.max(1, Math.ceil((b - a) / 2.5));
        const ref = quadrature(omega, rs, R + a, R + b, c, panels);
        assertClose(radialColumnGzFactor(omega, rs, R + a, R + b, c), ref, { rel: 1e-9 });
      });
    }
  }

  it('negative thickness returns exactly the negated value; zero thickness exactly 0', () => {
    const c = Math.cos(0.004);
    const f = radialColumnGzFactor(2e-9, rs, R - 50, R + 30, c);
    expect(radialColumnGzFactor(2e-9, rs, R + 30, R - 50, c)).toBe(-f);
    expect(radialColumnGzFactor(2e-9, rs, R + 30, R + 30, c)).toBe(0);
  });

  it('psi = 0 below the station: the on-axis line mass ∫ r^2 / (rs - r)^2 dr', () => {
    // cos psi = 1 makes q = 0, exercising the H = L - u branch; reference by quadrature on 400
    // panels of 2.5 m at distances ≥ 100 m (converged to rounding).
    const ref = quadrature(1e-9, rs, R - 1000, R, 1, 400);
    assertClose(radialColumnGzFactor(1e-9, rs, R - 1000, R, 1), ref, { rel: 1e-9 });
  });
});

describe('radialColumnGzFactor: limits', () => {
  it('flat-earth limit: agrees with the line element of the same mass in the tangent plane', () => {
    // Line element at horizontal distance (r1 + r2)/2 sin psi, depths z = rs - r cos psi below
    // the tangent plane, cross-section chosen to hold the column's mass. The two differ by the
    // column's tilt (ends displaced by ±(T/2) psi, worth ≤ 1.5 T/R relative) and by the r^2
    // growth of the cross-section (mass shifted up by ~T/R): tolerance 2.5 T/R.
    const rs = R + 200;
    const omega = 1e-10;
    for (const psi of [1e-4, 3e-4, 1e-3, 3e-3]) {
      for (const [a, b] of [
        [0, 100],
        [0, 1000],
      ] as const) {
        const c = Math.cos(psi);
        const r1 = R + a;
        const r2 = R + b;
        const mass = (omega * (r2 ** 3 - r1 ** 3)) / 3;
        const z1 = rs - r2 * c;
        const z2 = rs - r1 * c;
        const flat = lineElementGzFactor(mass / (z2 - z1), ((r1 + r2) / 2) * Math.sin(psi), z1, z2);
        assertClose(radialColumnGzFactor(omega, rs, r1, r2, c), flat, { rel: (2.5 * (b - a)) / R }, `psi=${psi}`);
      }
    }
  });

  it('far field: tends to a point mass at the centre of mass, error ≤ (T/L)^2 / 2', () => {
    // A line of length T seen from distance L has a quadrupole error (T/L)^2 / 12 times an
    // angular factor ≤ 6 (common practice: multipole expansion of a line mass).
    const rs = R + 200;
    const omega = 1e-8;
    const r1 = R;
    const r2 = R + 1000;
    const mass = (omega * (r2 ** 3 - r1 ** 3)) / 3;
    const rCentre = (0.75 * (r2 ** 4 - r1 ** 4)) / (r2 ** 3 - r1 ** 3);
    let previous = Infinity;
    for (const psi of [0.05, 0.1, 0.2, 0.4, 0.8]) {
      const c = Math.cos(psi);
      const x = rCentre * Math.sin(psi);
      const z = rs - rCentre * c;
      const point = mass * pointMassGzFactor(x, 0, z);
      const f = radialColumnGzFactor(omega, rs, r1, r2, c);
      const rel = Math.abs(point / f - 1);
      const dist = Math.hypot(x, z);
      expect(rel).toBeLessThanOrEqual(((r2 - r1) / dist) ** 2 / 2);
      expect(rel).toBeLessThan(previous); // the error falls with distance
      previous = rel;
    }
  });

  it("shell theorem: columns over the whole sphere attract like the shell's mass at the centre", () => {
    // Newton's shell theorem (common practice): a shell r1..r2 pulls a station outside it with
    // (4π/3)(r2^3 - r1^3) / rs^2 and one inside it with 0. Integrate omega = 2π sin psi dpsi in
    // t = ln psi from 1e-12 rad (the cap left out holds < 1e-15 of the total) to π on 300 panels of 16
    // points: the integrand's width near psi = 0 is ≥ 100 m / R = 1.6e-5 rad, resolved by the
    // log panels; converged to ~1e-12, tolerance 1e-9.
    const total = (rs: number, r1: number, r2: number): number =>
      integrate1d(
        (t) => {
          const psi = Math.exp(t);
          return 2 * Math.PI * Math.sin(psi) * psi * radialColumnGzFactor(1, rs, r1, r2, Math.cos(psi));
        },
        Math.log(1e-12),
        Math.log(Math.PI),
        GL16,
        300,
      );
    const r1 = R - 1000;
    const r2 = R;
    const outside = R + 100;
    assertClose(total(outside, r1, r2), ((4 * Math.PI) / 3) * ((r2 ** 3 - r1 ** 3) / outside ** 2), { rel: 1e-9 });
    const inside = R - 2000;
    // Zero within 1e-9 of the outside-station total (the scale of the cancelling halves).
    assertClose(total(inside, r1, r2), 0, { abs: 1e-9 * ((4 * Math.PI) / 3) * ((r2 ** 3 - r1 ** 3) / inside ** 2) });
  });
});
