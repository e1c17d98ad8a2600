import { describe, it, expect } from 'vitest';
import { lineElementGzFactor, lineElementGauss2x2GzFactor } from '../../src/kernels/line-element.js';
import { pointMassGzFactor } from '../../src/kernels/point-mass.js';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { assertClose } from '../helpers/assert-close.js';
import { gaussLegendre, integrate1d } from '../helpers/gauss-legendre.js';

const GL16 = gaussLegendre(16);

describe('pointMassGzFactor', () => {
  it('is z / r^3: 3-4-12 triangle and sign conventions', () => {
    // r = 13 exactly; z / r^3 = 12 / 2197, one rounding: 1e-15 relative.
    assertClose(pointMassGzFactor(3, 4, 12), 12 / 2197, { rel: 1e-15 });
    expect(pointMassGzFactor(3, 4, -12)).toBe(-pointMassGzFactor(3, 4, 12)); // mass above pulls up
    expect(pointMassGzFactor(5, 0, 0)).toBe(0); // level mass: no vertical pull
  });
});

describe('lineElementGzFactor', () => {
  it('equals the integral of point masses along the line (independent quadrature)', () => {
    // ∫ A z / (s^2 + z^2)^{3/2} dz by 16-point Gauss-Legendre on 8 panels: integrand smooth on
    // the scale s = 40 m ≥ panel 12.5 m, so converged to rounding; tolerance 1e-13 relative.
    const area = 25;
    for (const [s, z1, z2] of [
      [40, 0, 100],
      [40, -30, 70],
      [40, 5, 6],
      [40, -100, -20],
    ] as const) {
      const ref = integrate1d((z) => area * pointMassGzFactor(s, 0, z), z1, z2, GL16, 8);
      assertClose(lineElementGzFactor(area, s, z1, z2), ref, { rel: 1e-13, abs: 1e-18 }, `s=${s} z=${z1}..${z2}`);
    }
  });

  it('stable form keeps full precision where 1/R1 - 1/R2 loses 9 digits', () => {
    // Thin sheet at station level far away: s = 1e5 m, z from 0 to 1 m. Series (common practice,
    // binomial expansion): 1/s - 1/sqrt(s^2 + t^2) = t^2/(2 s^3) (1 - 3t^2/(4 s^2) + ...); the
    // omitted term is (5/8)(t/s)^4 ~ 6e-21 relative, so 1e-15 is rounding only.
    const s = 1e5;
    const t = 1;
    const series = ((t * t) / (2 * s * s * s)) * (1 - (3 * t * t) / (4 * s * s));
    assertClose(lineElementGzFactor(1, s, 0, t), series, { rel: 1e-15 });
    const naive = 1 / s - 1 / Math.sqrt(s * s + t * t);
    expect(Math.abs(naive - series) / series).toBeGreaterThan(1e-8); // the digit loss is real
  });

  it('symmetric straddle gives exactly 0; reversed depths negate exactly', () => {
    expect(lineElementGzFactor(10, 50, -20, 20)).toBe(0);
    expect(lineElementGzFactor(10, 50, 30, 5)).toBe(-lineElementGzFactor(10, 50, 5, 30));
  });
});

describe('far-field convergence against the prism (log-log slopes)', () => {
  // Thin layer (10 m cells, 10 m thick, top at the station level) along the x axis. Reference:
  // the closed-form prism, accurate here to K (D/s)^4 (s/h)^2 ≤ 2e-15 * 40^4 = 5e-9 relative,
  // below 1 % of the smallest error measured (Gauss at D/s = 40: 3.6e-8) — so reference
  // error cannot change the fitted slopes by more than ~0.01.
  const cell = 10;
  const thick = 10;
  const ratios = [5, 10, 20, 40];
  function slope(errors: number[]): number {
    const xs = ratios.map((r) => Math.log(r));
    const ys = errors.map((e) => Math.log(Math.abs(e)));
    const mx = xs.reduce((a, b) => a + b) / xs.length;
    const my = ys.reduce((a, b) => a + b) / ys.length;
    let num = 0;
    let den = 0;
    for (let i = 0; i < xs.length; i++) {
      num += ((xs[i] as number) - mx) * ((ys[i] as number) - my);
      den += ((xs[i] as number) - mx) ** 2;
    }
    return num / den;
  }
  const prisms = ratios.map((r) => prismGzFactor(r * cell - cell / 2, r * cell + cell / 2, -cell / 2, cell / 2, 0, thick));

  it('single line element: slope ≈ -2', () => {
    const errors = ratios.map((r, i) => lineElementGzFactor(cell * cell, r * cell, 0, thick) / (prisms[i] as number) - 1);
    // Leading term (cell/D)^2 with an O((cell/D)^4) correction: over D/cell 5..40 the fitted
    // slope stays within 0.05 of -2 (the correction shifts the D/cell = 5 point by ~2 %).
    assertClose(slope(errors), -2, { abs: 0.05 });
    for (const e of errors) expect(e).toBeLessThan(0); // the line element underestimates
  });

  it('2x2 Gauss line elements: slope ≈ -4', () => {
    const errors = ratios.map(
      (r, i) => lineElementGauss2x2GzFactor(cell, cell, r * cell, 0, 0, thick) / (prisms[i] as number) - 1,
    );
    // Leading term (cell/D)^4, next O((cell/D)^6): within 0.1 of -4 over this range.
    assertClose(slope(errors), -4, { abs: 0.1 });
  });

  it('point mass at the centre of mass of a flat cell: slope ≈ -2', () => {
    // 10 x 10 x 2 m cell (top at the station level): its quadrupole moment is non-zero, so the
    // point mass errs at second order (common practice: multipole expansion). Prism reference
    // error 2e-15 * 40^4 * 5^2 = 1.3e-7, far below the 1e-4 errors measured.
    const flat = 2;
    const errors = ratios.map((r) => {
      const exact = prismGzFactor(r * cell - cell / 2, r * cell + cell / 2, -cell / 2, cell / 2, 0, flat);
      return (cell * cell * flat * pointMassGzFactor(r * cell, 0, flat / 2)) / exact - 1;
    });
    assertClose(slope(errors), -2, { abs: 0.1 }); // O((cell/D)^4) correction, as above
  });

  it('point mass of a cube: slope ≈ -4 (a cube has no quadrupole moment)', () => {
    // Cubic symmetry makes the second moments isotropic, so the quadrupole term vanishes and
    // the first error is the hexadecapole, O((cell/D)^4) (common practice: multipole expansion).
    const errors = ratios.map(
      (r, i) => (cell * cell * thick * pointMassGzFactor(r * cell, 0, thick / 2)) / (prisms[i] as number) - 1,
    );
    assertClose(slope(errors), -4, { abs: 0.1 });
  });

  it('2x2 Gauss handles a rectangular cell and a diagonal azimuth', () => {
    // 20 x 10 m cell at (300, 400): D/cell = 25; error bound (3/32)(20/500)^4 = 2.4e-7 relative,
    // plus the prism's own cancellation error 2e-15 * 25^4 * 2^2 ~ 3e-9.
    const exact = prismGzFactor(290, 310, 395, 405, 2, 30);
    assertClose(lineElementGauss2x2GzFactor(20, 10, 300, 400, 2, 30), exact, { rel: 2.5e-7 });
  });
});
