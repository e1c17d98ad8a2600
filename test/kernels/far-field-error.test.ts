import { describe, it, expect } from 'vitest';
import {
  lineElementRelError,
  gauss2x2RelError,
  prismCancellationRelError,
  LINE_ELEMENT_ERROR_COEFF,
  GAUSS2X2_ERROR_COEFF,
  PRISM_CANCELLATION_COEFF,
} from '../../src/kernels/far-field-error.js';
import { lineElementGzFactor, lineElementGauss2x2GzFactor } from '../../src/kernels/line-element.js';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { assertClose } from '../helpers/assert-close.js';
import { gaussLegendre, prismByQuadrature } from '../helpers/gauss-legendre.js';
import { makeUniform } from '../helpers/seeded-random.js';

// High-precision reference for distant cells: exact vertical integral, 8x8 Gauss-Legendre in
// x and y. The integrand's nearest singularity is ≥ D - s/2 from the cell, so for D/s ≥ 10 the
// rule's error is below (s / 4D)^16 ~ 1e-26 (Bernstein-ellipse bound, common practice):
// independent of the prism's 8-term cancellation.
const GL8 = gaussLegendre(8);
const cell = 10;

function reference(cx: number, cy: number, z1: number, z2: number): number {
  return prismByQuadrature(cx - cell / 2, cx + cell / 2, cy - cell / 2, cy + cell / 2, z1, z2, GL8);
}

describe('measured error constants', () => {
  it('line element: coefficient ≈ -3/8 for a thin layer, smaller for thick columns', () => {
    // Thin layer, D/cell = 20: the O((cell/D)^4) remainder shifts the coefficient by < 0.5 %.
    const d = 200;
    const thin = (lineElementGzFactor(cell * cell, d, 0, 1) / reference(d, 0, 0, 1) - 1) * (d / cell) ** 2;
    assertClose(thin, -LINE_ELEMENT_ERROR_COEFF, { rel: 5e-3 }, 'thin layer coefficient');
    // Thick column (1 km at D = 200 m): coefficient between the 1/24 limit and 3/8.
    const thick = (lineElementGzFactor(cell * cell, d, 0, 1000) / reference(d, 0, 0, 1000) - 1) * (d / cell) ** 2;
    expect(-thick).toBeGreaterThan(1 / 24);
    expect(-thick).toBeLessThan(LINE_ELEMENT_ERROR_COEFF);
    expect(lineElementRelError(cell, d)).toBe(LINE_ELEMENT_ERROR_COEFF * (cell / d) ** 2);
  });

  it('2x2 Gauss: coefficient ≈ -3/32 on the axis, below it in magnitude on the diagonal', () => {
    const d = 200;
    const onAxis =
      (lineElementGauss2x2GzFactor(cell, cell, d, 0, 0, 1) / reference(d, 0, 0, 1) - 1) * (d / cell) ** 4;
    // O((cell/D)^6) remainder: < 1 % at D/cell = 20.
    assertClose(onAxis, -GAUSS2X2_ERROR_COEFF, { rel: 1e-2 }, 'axis coefficient');
    const c = d / Math.SQRT2;
    const diagonal =
      (lineElementGauss2x2GzFactor(cell, cell, c, c, 0, 1) / reference(c, c, 0, 1) - 1) * (d / cell) ** 4;
    expect(Math.abs(diagonal)).toBeLessThan(GAUSS2X2_ERROR_COEFF);
    expect(gauss2x2RelError(cell, d)).toBeCloseTo(GAUSS2X2_ERROR_COEFF * (cell / d) ** 4, 20);
  });

  it('prism cancellation: K (D/s)^4 (s/h)^2 with K from 200 random positions per geometry', () => {
    // Rounding errors are pseudo-random: the model must bound the worst case seen (K = 4e-15)
    // and not be vacuous (worst case ≥ K / 10).
    const uniform = makeUniform(12345);
    let worstK = 0;
    for (const thick of [1, 10, 100]) {
      for (const ratio of [10, 100, 1000]) {
        if (prismCancellationRelError(cell, ratio * cell, thick) > 0.1) continue; // result meaningless
        for (let k = 0; k < 200; k++) {
          const az = 2 * Math.PI * uniform();
          const d = ratio * cell * (1 + 0.1 * uniform());
          const cx = d * Math.cos(az);
          const cy = d * Math.sin(az);
          const f = prismGzFactor(cx - cell / 2, cx + cell / 2, cy - cell / 2, cy + cell / 2, 0, thick);
          const ref = reference(cx, cy, 0, thick);
          const rel = Math.abs(f / ref - 1);
          worstK = Math.max(worstK, rel / prismCancellationRelError(cell, d, thick) * PRISM_CANCELLATION_COEFF);
        }
      }
    }
    expect(worstK).toBeLessThanOrEqual(PRISM_CANCELLATION_COEFF);
    expect(worstK).toBeGreaterThan(PRISM_CANCELLATION_COEFF / 10);
  });
});

describe('where the 8-term prism sum degrades', () => {
  it('10 m cube at D/s = 1000 loses ~3 digits; the 2x2 Gauss form is better there', () => {
    const uniform = makeUniform(777);
    let worstPrism = 0;
    let worstGauss = 0;
    for (let k = 0; k < 20; k++) {
      const az = 2 * Math.PI * uniform();
      const cx = 10_000 * Math.cos(az);
      const cy = 10_000 * Math.sin(az);
      const ref = reference(cx, cy, 0, cell);
      const prism = prismGzFactor(cx - 5, cx + 5, cy - 5, cy + 5, 0, cell);
      const gauss = lineElementGauss2x2GzFactor(cell, cell, cx, cy, 0, cell);
      worstPrism = Math.max(worstPrism, Math.abs(prism / ref - 1));
      worstGauss = Math.max(worstGauss, Math.abs(gauss / ref - 1));
    }
    // Model: 4e-15 * 1000^4 * 1 = 4e-3. Observed must be of that order (> 1e-5) yet bounded.
    expect(worstPrism).toBeGreaterThan(1e-5);
    expect(worstPrism).toBeLessThanOrEqual(prismCancellationRelError(cell, 10_000, cell));
    // Gauss error (3/32) 1e-12 plus rounding of a 4-term sum (~1e-15).
    expect(worstGauss).toBeLessThan(gauss2x2RelError(cell, 10_000) + 1e-14);
  });

  it('at D/s = 10 the same cube is still good to 1e-10', () => {
    // Model 4e-15 * 1e4 = 4e-11.
    const ref = reference(100, 0, 0, cell);
    assertClose(prismGzFactor(95, 105, -5, 5, 0, cell), ref, { rel: 1e-10 });
  });

  it('the error budget picks a switch distance, and it is right on both sides', () => {
    // 1 m layer of 10 m cells (s/h = 10): the models cross where (3/32) q^4 = K q^-4 (s/h)^2.
    const thick = 1;
    const crossing = Math.pow(GAUSS2X2_ERROR_COEFF / (PRISM_CANCELLATION_COEFF * 100), 1 / 8);
    assertClose(gauss2x2RelError(cell, crossing * cell), prismCancellationRelError(cell, crossing * cell, thick), {
      rel: 1e-12, // algebra only
    });
    const uniform = makeUniform(4242);
    const worst = (ratio: number): [number, number] => {
      let prism = 0;
      let gauss = 0;
      for (let k = 0; k < 20; k++) {
        const az = 2 * Math.PI * uniform();
        const cx = ratio * cell * Math.cos(az);
        const cy = ratio * cell * Math.sin(az);
        const ref = reference(cx, cy, 0, thick);
        prism = Math.max(prism, Math.abs(prismGzFactor(cx - 5, cx + 5, cy - 5, cy + 5, 0, thick) / ref - 1));
        gauss = Math.max(gauss, Math.abs(lineElementGauss2x2GzFactor(cell, cell, cx, cy, 0, thick) / ref - 1));
      }
      return [prism, gauss];
    };
    const [prismNear, gaussNear] = worst(crossing / 2);
    expect(prismNear).toBeLessThan(gaussNear); // inside the crossing the prism is better
    const [prismFar, gaussFar] = worst(crossing * 2);
    expect(gaussFar).toBeLessThan(prismFar); // beyond it the Gauss form is better
  });
});
