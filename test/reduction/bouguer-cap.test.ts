import { describe, it, expect } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { bouguerCap, bullardB } from '../../src/reduction/bouguer-cap.js';
import { bouguerSlab } from '../../src/reduction/bouguer-slab.js';
import { CAP_RADIUS_M, EARTH_RADIUS_M, G } from '../../src/constants.js';
import { MGAL } from '../../src/units.js';
import { shellSegmentAttraction } from './shell-quadrature.js';

const RHO = 2670;
const capMgal = (h: number): number => bouguerCap(h, RHO) / MGAL;
const bMgal = (h: number): number => bullardB(h, RHO) / MGAL;
const R0 = EARTH_RADIUS_M;
const ALPHA = CAP_RADIUS_M / R0;

describe('spherical Bouguer cap and Bullard B', () => {
  it('matches the printed cap and Bullard B values at 1000 and 3000 m', () => {
    // [LaFehr1991] closed form as printed in [Hinze2005]; check values recomputed from it
    // (physics.md section 4), 6 decimals: 1e-6 mGal.
    expect(G).toBe(6.6743e-11); // the table assumes CODATA 2018 G [CODATA2018]
    assertClose(capMgal(1000), 113.080455, { abs: 1e-6 }, 'cap 1000');
    assertClose(bMgal(1000), 1.111699, { abs: 1e-6 }, 'B 1000');
    assertClose(capMgal(3000), 337.122855, { abs: 1e-6 }, 'cap 3000');
    assertClose(bMgal(3000), 1.216587, { abs: 1e-6 }, 'B 3000');
  });

  it('agrees with an independent shell-segment quadrature for h = 1 m ... 5000 m', () => {
    // Nested Gauss-Legendre of the point-mass kernel (shell-quadrature.ts), not the closed
    // form. Measured: 1e-13 relative at km heights, 5e-11 mGal absolute at h = 1 m (the
    // quadrature's floor), so the bound is 1e-11 relative or 1e-10 mGal.
    for (const h of [1, 10, 100, 1000, 2000, 3000, 5000]) {
      const reference = shellSegmentAttraction(R0 + h, R0, R0 + h, ALPHA, RHO, G);
      assertClose(bouguerCap(h, RHO), reference, { rel: 1e-11, abs: 1e-10 * MGAL }, `h ${h}`);
    }
  });

  it('honours a smaller cap radius (20 km), checked by the same quadrature', () => {
    // Same independent reference and bound as above.
    const h = 1500;
    const reference = shellSegmentAttraction(R0 + h, R0, R0 + h, 20_000 / R0, RHO, G);
    assertClose(bouguerCap(h, RHO, 20_000), reference, { rel: 1e-11 }, '20 km cap');
  });

  it('below the datum equals -(layer attraction + 4 pi G rho (R0^3 - R^3)/(3 R^2))', () => {
    // For h < 0 the closed form is its analytic continuation. A = quadrature of the layer
    // between the station (bottom face) and the datum; the second term is the continuation's
    // jump across each sheet, 4 pi G rho (r/R)^2 dr (derived from the on-axis potential of a
    // spherical sheet). Measured agreement 2e-13 relative; bound 1e-11 (quadrature floor).
    for (const h of [-1, -100, -400, -1000]) {
      const radius = R0 + h;
      const layer = shellSegmentAttraction(radius, radius, R0, ALPHA, RHO, G);
      const jump = (4 * Math.PI * G * RHO * (R0 ** 3 - radius ** 3)) / (3 * radius * radius);
      assertClose(bouguerCap(h, RHO), -(layer + jump), { rel: 1e-11, abs: 1e-10 * MGAL }, `h ${h}`);
    }
    // Dead Sea shore, h = -400 m: cap -45.430121 mGal, Bullard B -0.642619 mGal (recomputed
    // from the closed form in 50-digit arithmetic; 1e-6 mGal for the 6 printed decimals).
    assertClose(capMgal(-400), -45.430121, { abs: 1e-6 }, 'cap -400');
    assertClose(bMgal(-400), -0.642619, { abs: 1e-6 }, 'B -400');
  });

  it('is continuous and smooth through h = 0', () => {
    // At h = 0 the cap is empty: the closed form cancels to ~1e-11 mGal (float64 of terms ~0.08
    // times R0); one-sided slopes over 1 m agree to the curvature term (B'' ~ 1e-6 mGal/m^2).
    assertClose(capMgal(0), 0, { abs: 1e-10 }, 'h = 0');
    assertClose(capMgal(1e-6), -capMgal(-1e-6), { abs: 1e-10 }, 'odd at 0');
    const up = capMgal(1) - capMgal(0);
    const down = capMgal(0) - capMgal(-1);
    assertClose(up, down, { abs: 2e-6 }, 'slopes');
  });

  it('thin-cap limit: cap/slab -> 1 + sin(alpha/2), not 1', () => {
    // A thin spherical sheet of surface density sigma, seen from a point on it, adds
    // 2 pi G sigma sin(alpha/2) to the flat 2 pi G sigma (the ring integral of the far sheet
    // gives pi G sigma cos(psi/2) dpsi; derived, common practice in potential theory).
    // The ratio departs from the limit linearly in h (3e-9 at 1 mm): bound 1e-7 at 1 cm.
    const ratio = bouguerCap(0.01, RHO) / bouguerSlab(0.01, RHO);
    assertClose(ratio, 1 + Math.sin(ALPHA / 2), { abs: 1e-7 }, 'ratio');
    // so cap -> slab only in the absolute sense: B -> 0 like 0.0131 x slab
    assertClose(bMgal(0.01), 0, { abs: 2e-5 }, 'B(1 cm)');
  });

  it('Bullard B peaks near 1.52 mGal around 2 km and changes sign near 4.15 km', () => {
    // physics.md section 4 (recomputed from [LaFehr1991]); [Whitman1991] reports up to about
    // 1.5 mGal in high mountains. Golden-section search for the peak, bisection for the root.
    let lo = 500;
    let hi = 4000;
    const phi = (Math.sqrt(5) - 1) / 2;
    while (hi - lo > 1e-3) {
      const a = hi - phi * (hi - lo);
      const b = lo + phi * (hi - lo);
      if (bMgal(a) > bMgal(b)) hi = b;
      else lo = a;
    }
    const peakH = (lo + hi) / 2;
    // 1.52 is printed to 2 decimals (+-0.005); "around 2 km" read as +-250 m.
    assertClose(bMgal(peakH), 1.52, { abs: 0.005 }, 'peak value');
    assertClose(peakH, 2000, { abs: 250 }, 'peak height');
    expect(bMgal(peakH)).toBeLessThan(1.55); // [Whitman1991] "about 1.5 mGal"
    let a = 3000;
    let b = 5000;
    while (b - a > 1e-6) {
      const m = (a + b) / 2;
      if (bMgal(m) > 0) a = m;
      else b = m;
    }
    // 4.15 km printed to 3 significant digits: +-5 m.
    assertClose(a, 4150, { abs: 5 }, 'sign change');
  });

  it('is linear in density and NaN height gives NaN', () => {
    // 2 pi G rho factors out of the closed form: rounding only.
    assertClose(bouguerCap(1234, 2 * RHO), 2 * bouguerCap(1234, RHO), { rel: 1e-14 }, 'density');
    expect(bouguerCap(Number.NaN, RHO)).toBeNaN();
    expect(bullardB(Number.NaN, RHO)).toBeNaN();
  });
});
