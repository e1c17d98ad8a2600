import { describe, it, expect } from 'vitest';
import { prismGz, gravityFromFactor, G } from '../../src/attraction.js';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { assertClose } from '../helpers/assert-close.js';

describe('attraction: G rho applied once', () => {
  it('uses CODATA 2018 G and reproduces the physics.md prism check value in m/s^2', () => {
    expect(G).toBe(6.6743e-11); // [CODATA2018]
    // docs/physics.md §5 [calc]: 2.7707754343 mGal = 2.7707754343e-5 m/s^2, 10 decimals in mGal.
    assertClose(prismGz(-50, 50, -50, 50, 10, 60, 2670), 2.7707754343e-5, { abs: 5e-16 });
  });

  it('is linear in density (0 density → 0, contrast sign respected)', () => {
    const f = prismGzFactor(10, 20, -5, 5, 0, 30);
    expect(prismGz(10, 20, -5, 5, 0, 30, 0)).toBe(0);
    expect(prismGz(10, 20, -5, 5, 0, 30, -300)).toBe(G * -300 * f);
    expect(gravityFromFactor(f, 2670)).toBe(G * 2670 * f);
  });
});
