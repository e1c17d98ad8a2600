import { describe, it } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { normalGravityAtHeight } from '../../src/reduction/normal-gravity-height.js';
import { normalGravityEllipsoidal } from '../../src/reduction/normal-gravity-ellipsoidal.js';
import { normalGravity } from '../../src/reduction/normal-gravity.js';
import { freeAirCorrection } from '../../src/reduction/free-air.js';
import { MGAL } from '../../src/units.js';

const LATS = [0, 15, 30, 45, 60, 75, 90];
const toMgal = (x: number): number => x / MGAL;

describe('normal gravity at height: second-order series', () => {
  it('equals the closed-form GRS80 value at h = 0', () => {
    // [HeiskanenMoritz1967] eq. 2-124 at h = 0 is gamma0 itself: float64 rounding only.
    for (const lat of LATS) {
      assertClose(normalGravityAtHeight(lat, 0), normalGravity(lat, 'grs80'), { rel: 1e-15 }, `lat ${lat}`);
    }
  });

  it('agrees with the exact ellipsoidal normal field within its truncation error', () => {
    // The series keeps first order in f and m; the dropped terms (~3.5e-5 of the gradient at
    // the equator, ~0 at the pole) give at most 1.1e-5 mGal per metre of height (measured
    // 1.02e-5 /m at the equator at 1 km, 7e-4 mGal at the pole at 3 km), plus 2e-4 mGal for
    // the h^2 terms to 5 km. Independent reference: normal-gravity-ellipsoidal.ts, itself
    // checked against Bruns' formula.
    for (const lat of LATS) {
      for (const h of [-500, 1000, 2000, 3000, 5000]) {
        const diff = toMgal(normalGravityAtHeight(lat, h) - normalGravityEllipsoidal(lat, h));
        assertClose(diff, 0, { abs: 1.1e-5 * Math.abs(h) + 2e-4 }, `lat ${lat} h ${h}`);
      }
    }
  });

  it('gamma0 - gamma_h reproduces the second-order free-air formula at the equator to 1e-4 mGal', () => {
    // [Hinze2005] second-order FAC, whose equatorial coefficients 0.3087691 and 7.2125e-8 are
    // those of the series (2 gamma_e (1+f+m)/a and 3 gamma_e/a^2): measured 3e-5 mGal at 3 km.
    for (const h of [1000, 2000, 3000]) {
      const fac = toMgal(normalGravityAtHeight(0, 0) - normalGravityAtHeight(0, h));
      assertClose(fac, toMgal(freeAirCorrection(h, 0, 2)), { abs: 1e-4 }, `h ${h}`);
    }
  });

  it('away from the equator series and second-order FAC differ by up to 0.026 mGal at 3 km', () => {
    // [Hinze2005]'s latitude coefficient 0.0004398 matches the exact field's gradient change
    // from equator to pole (0.000441 mGal/m, Bruns' formula), while the series, truncated at
    // first order, changes by 0.000430: measured differences at 3 km are 0 (equator) to
    // 0.0255 mGal (pole); 0.00925 mGal at 1 km at the pole. Bound: 9.3e-6 mGal/m x h + 1e-4.
    for (const lat of LATS) {
      for (const h of [1000, 2000, 3000]) {
        const fac = toMgal(normalGravityAtHeight(lat, 0) - normalGravityAtHeight(lat, h));
        assertClose(fac, toMgal(freeAirCorrection(h, lat, 2)), { abs: 9.3e-6 * h + 1e-4 }, `lat ${lat} h ${h}`);
      }
    }
  });

  it('exact free-air effect exceeds the second-order FAC by ~0.01 mGal per km at every latitude', () => {
    // Exact field (normal-gravity-ellipsoidal.ts) minus [Hinze2005]: measured 0.0092-0.0103
    // mGal at 1 km and 0.026-0.0285 mGal at 3 km. The polynomial's constant 0.3087691 is
    // first order in f and m; Bruns' formula gives 0.3087798 mGal/m at the equator.
    for (const lat of LATS) {
      for (const [h, lo, hi] of [
        [1000, 0.009, 0.0105],
        [3000, 0.025, 0.029],
      ] as const) {
        const exact = toMgal(normalGravityEllipsoidal(lat, 0) - normalGravityEllipsoidal(lat, h));
        const diff = exact - toMgal(freeAirCorrection(h, lat, 2));
        assertClose(diff, (lo + hi) / 2, { abs: (hi - lo) / 2 }, `lat ${lat} h ${h}`);
      }
    }
  });
});
