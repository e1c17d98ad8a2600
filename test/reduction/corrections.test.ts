import { describe, it, expect } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { atmosphericCorrection } from '../../src/reduction/atmosphere.js';
import { freeAirCorrection, isFreeAirOrder } from '../../src/reduction/free-air.js';
import { bouguerSlab } from '../../src/reduction/bouguer-slab.js';
import { G } from '../../src/constants.js';
import { FOOT_M, MGAL } from '../../src/units.js';

const mgal = (x: number): number => x / MGAL;

describe('atmospheric correction', () => {
  it('matches 0.874 / 0.778560 / 0.609040 mGal at 0 / 1000 / 3000 m', () => {
    // [Hinze2005] after [Wenzel1985]; values recomputed from the polynomial (physics.md
    // section 2) and exact in 6 decimals, so 1e-9 mGal covers float64 rounding.
    assertClose(mgal(atmosphericCorrection(0)), 0.874, { abs: 1e-9 }, 'h 0');
    assertClose(mgal(atmosphericCorrection(1000)), 0.77856, { abs: 1e-9 }, 'h 1000');
    assertClose(mgal(atmosphericCorrection(3000)), 0.60904, { abs: 1e-9 }, 'h 3000');
    expect(atmosphericCorrection(Number.NaN)).toBeNaN();
  });
});

describe('free-air correction', () => {
  it('first order: 0.3086 mGal/m, 0.094061 mGal/ft, independent of latitude', () => {
    // Conventional mean gradient (common practice). The per-foot value is printed to 6
    // decimals (5e-7); 1e-9 elsewhere is float64 rounding.
    assertClose(mgal(freeAirCorrection(1000, 10, 1)), 308.6, { abs: 1e-9 }, '1000 m');
    assertClose(mgal(freeAirCorrection(FOOT_M, 80, 1)), 0.094061, { abs: 5e-7 }, '1 ft');
    assertClose(mgal(freeAirCorrection(-400, 31, 1)), -123.44, { abs: 1e-9 }, 'below datum');
  });

  it('second order matches the three printed check values', () => {
    // [Hinze2005] second-order formula; check values recomputed from it (physics.md
    // section 3), 6 decimals: 1e-6 mGal.
    assertClose(mgal(freeAirCorrection(1000, 45, 2)), 308.477075, { abs: 1e-6 }, '45 deg 1000 m');
    assertClose(mgal(freeAirCorrection(1000, 0, 2)), 308.696975, { abs: 1e-6 }, '0 deg 1000 m');
    assertClose(mgal(freeAirCorrection(3000, 90, 2)), 924.338775, { abs: 1e-6 }, '90 deg 3000 m');
  });

  it('is positive above the datum, zero on it, and NaN-propagating', () => {
    for (const order of [1, 2] as const) {
      expect(freeAirCorrection(10, 45, order)).toBeGreaterThan(0);
      expect(freeAirCorrection(0, 45, order)).toBe(0);
      expect(freeAirCorrection(Number.NaN, 45, order)).toBeNaN();
    }
    expect(freeAirCorrection(100, Number.NaN, 2)).toBeNaN();
    expect(isFreeAirOrder(1) && isFreeAirOrder(2)).toBe(true);
    expect(isFreeAirOrder(3) || isFreeAirOrder(Number.NaN)).toBe(false);
  });
});

describe('Bouguer slab', () => {
  it('2 pi G rho h = 111.968756 mGal for 2670 kg/m^3 and 1000 m', () => {
    // Bouguer slab [Hinze2005] with G = 6.6743e-11 [CODATA2018]; value recomputed
    // (physics.md section 4), 6 decimals: 1e-6 mGal.
    expect(G).toBe(6.6743e-11);
    assertClose(mgal(bouguerSlab(1000, 2670)), 111.968756, { abs: 1e-6 }, 'slab');
  });

  it('reproduces the textbook 0.04193 mGal per m per g/cm^3 with the older G = 6.673e-11', () => {
    // Textbook slab constant (common practice), 4 significant digits: +-5e-6 mGal.
    assertClose(mgal(bouguerSlab(1, 1000)) * (6.673e-11 / G), 0.04193, { abs: 5e-6 }, 'constant');
  });

  it('is odd in height and linear in density', () => {
    // exact scaling: float64 rounding only
    assertClose(bouguerSlab(-400, 2670), -bouguerSlab(400, 2670), { rel: 1e-15 }, 'odd');
    assertClose(bouguerSlab(250, 2000), 2 * bouguerSlab(250, 1000), { rel: 1e-15 }, 'linear');
  });
});
