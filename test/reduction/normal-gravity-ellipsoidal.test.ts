import { describe, it } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { normalGravityEllipsoidal, GRS80_OMEGA_RAD_S } from '../../src/reduction/normal-gravity-ellipsoidal.js';
import { MGAL } from '../../src/units.js';

describe('exact GRS80 normal gravity in ellipsoidal-harmonic coordinates', () => {
  it('reduces to the GRS80 Somigliana table on the ellipsoid', () => {
    // physics.md section 1 table, GRS80 closed form [Moritz1980]. The potential uses the
    // defining constants (a, GM, omega) and f; the Somigliana constants are printed to 10-11
    // digits, so the two agree to ~1e-11 relative = 1e-5 mGal (measured 3.5e-6 mGal).
    const table: [number, number][] = [
      [0, 978032.67715],
      [45, 980619.920249],
      [90, 983218.636848],
    ];
    for (const [lat, g] of table) {
      assertClose(normalGravityEllipsoidal(lat, 0) / MGAL, g, { abs: 1e-5 }, `lat ${lat}`);
    }
  });

  it("vertical gradient on the ellipsoid obeys Bruns' formula -2 gamma J - 2 omega^2", () => {
    // Bruns' formula for the normal field outside the masses [HeiskanenMoritz1967] (ch. 2),
    // with J the mean curvature (1/M + 1/N)/2 of the ellipsoid: an independent identity, not
    // the closed form itself. Central difference over +-10 m: truncation ~1e-18 relative,
    // float64 rounding ~2e-11 relative of the gradient, so 1e-9 relative.
    const a = 6378137; // [Moritz1980] defining constant
    const f = 1 / 298.257222101; // [Moritz1980] derived constant
    const e2 = f * (2 - f);
    for (const lat of [0, 20, 45, 70, 90]) {
      const s = Math.sin((lat * Math.PI) / 180) ** 2;
      const w = Math.sqrt(1 - e2 * s);
      const nRadius = a / w;
      const mRadius = (a * (1 - e2)) / w ** 3;
      const bruns = -normalGravityEllipsoidal(lat, 0) * (1 / mRadius + 1 / nRadius) - 2 * GRS80_OMEGA_RAD_S ** 2;
      const gradient = (normalGravityEllipsoidal(lat, 10) - normalGravityEllipsoidal(lat, -10)) / 20;
      assertClose(gradient, bruns, { rel: 1e-9 }, `lat ${lat}`);
    }
  });

  it('gradient at the equator and pole: 0.30878 and 0.30834 mGal/m', () => {
    // Bruns' formula evaluated by hand with GRS80 constants (common practice values for the
    // normal free-air gradient, 5 decimals): 1e-5 mGal/m is the last printed digit.
    const grad = (lat: number): number =>
      (normalGravityEllipsoidal(lat, -10) - normalGravityEllipsoidal(lat, 10)) / 20 / MGAL;
    assertClose(grad(0), 0.30878, { abs: 1e-5 }, 'equator');
    assertClose(grad(90), 0.30834, { abs: 1e-5 }, 'pole');
  });

  it('spherical approximation 2g/R = 0.30668 mGal/m falls short of the exact gradient by f + m', () => {
    // physics.md section 3: dg/dr = -2g/R with g = 978031.85 mGal, R = 6378137 m gives 0.30668
    // mGal/m (common practice, 5 decimals: +-5e-6). The ellipsoidal gradient at the equator
    // is 2 gamma_e/a (1 + f + m) to first order [HeiskanenMoritz1967] eq. 2-124; the second
    // order terms are 3.5e-5 relative, so the ratio is checked to 5e-5.
    const spherical = (2 * 978031.85) / 6378137;
    assertClose(spherical, 0.30668, { abs: 5e-6 }, '2g/R');
    const exact = (normalGravityEllipsoidal(0, -10) - normalGravityEllipsoidal(0, 10)) / 20 / MGAL;
    const fPlusM = 1 / 298.257222101 + 0.00344978600308; // [Moritz1980] f and m
    assertClose(exact / spherical - 1, fPlusM, { abs: 5e-5 }, 'ratio');
  });
});
