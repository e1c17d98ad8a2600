import { describe, it } from 'vitest';
import { normalGravity } from '../../src/reduction/index.js';
import { toMgal } from '../../src/units.js';
import { assertClose } from '../helpers/assert-close.js';

/** Published GRS80 minus GRS67 normal gravity, mGal, s = sin^2(lat) (physics.md §6). */
const publishedDifferenceMgal = (s: number): number => 0.8316 + 0.0781 * s - 0.0007 * s * s;

/**
 * GRS67 closed-form Somigliana normal gravity, mGal, from the GRS67 defining constants
 * (values from memory: a = 6378160 m, 1/f = 298.247167427, gamma_e = 978031.84558 mGal,
 * gamma_p = 983217.72792 mGal). Used only to show where the series form departs.
 */
function grs67ClosedFormMgal(s: number): number {
  const a = 6378160;
  const f = 1 / 298.247167427;
  const b = a * (1 - f);
  const gammaE = 978031.84558;
  const gammaP = 983217.72792;
  const e2 = 2 * f - f * f;
  const k = (b * gammaP) / (a * gammaE) - 1;
  return (gammaE * (1 + k * s)) / Math.sqrt(1 - e2 * s);
}

const latitudesDeg = Array.from({ length: 91 }, (_, i) => i);

describe('GRS80 minus GRS67 normal gravity', () => {
  it('the published polynomial is GRS80 minus the GRS67 closed form, within 1e-4 mGal over 0..90 deg', () => {
    // Tolerance: the polynomial's coefficients are printed to 1e-4 mGal.
    for (const lat of latitudesDeg) {
      const s = Math.sin((lat * Math.PI) / 180) ** 2;
      const diff = toMgal(normalGravity(lat, 'grs80')) - grs67ClosedFormMgal(s);
      assertClose(diff, publishedDifferenceMgal(s), { abs: 1e-4 }, `lat ${lat}`);
    }
  });

  it('with the 1967 series form the difference matches the polynomial within 0.01 mGal over 0..90 deg', () => {
    // Tolerance: the series form 978031.846 (1 + 0.005278895 s + 0.000023462 s^2) itself departs
    // from the GRS67 closed form by up to 0.008 mGal (at the pole), so GRS80 - series differs
    // from the published polynomial by that much; 1e-4 mGal is not reachable with the series.
    for (const lat of latitudesDeg) {
      const s = Math.sin((lat * Math.PI) / 180) ** 2;
      const diff = toMgal(normalGravity(lat, 'grs80') - normalGravity(lat, 'igf1967'));
      assertClose(diff, publishedDifferenceMgal(s), { abs: 0.01 }, `lat ${lat}`);
      // And the departure is exactly the series-vs-closed-form difference (float rounding only).
      const seriesMinusClosed = toMgal(normalGravity(lat, 'igf1967')) - grs67ClosedFormMgal(s);
      assertClose(diff - publishedDifferenceMgal(s), -seriesMinusClosed, { abs: 1e-4 }, `lat ${lat} split`);
    }
  });
});
