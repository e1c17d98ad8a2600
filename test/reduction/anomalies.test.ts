import { describe, it, expect } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { anomalies } from '../../src/reduction/anomalies.js';
import { normalGravity } from '../../src/reduction/normal-gravity.js';
import { atmosphericCorrection } from '../../src/reduction/atmosphere.js';
import { freeAirCorrection } from '../../src/reduction/free-air.js';
import { bouguerCap } from '../../src/reduction/bouguer-cap.js';
import { MGAL } from '../../src/units.js';

const mgal = (x: number): number => x / MGAL;

describe('anomalies', () => {
  // Worked example built from the physics.md check values (lat 45 deg, h = 1000 m, rho = 2670):
  // gamma0 980619.920249, FAC 308.477075, g_atm 0.778560, cap 113.080455 mGal; an invented
  // g_obs = 980320.000 mGal and TC = 2.5 mGal. By hand ([Hinze2005] sign conventions):
  //   FAA = 980320 - 980619.920249 + 308.477075 + 0.778560 =    9.335386
  //   SBA = 9.335386 - 113.080455                          = -103.745069
  //   CBA = -103.745069 + 2.5                              = -101.245069 (+0.3 inner: -100.945069)
  // Tolerance 2e-6 mGal: each of four inputs is printed to 6 decimals.
  const terms = {
    gobs: 980320 * MGAL,
    normal: normalGravity(45, 'grs80'),
    atm: atmosphericCorrection(1000),
    freeAir: freeAirCorrection(1000, 45, 2),
    bouguer: bouguerCap(1000, 2670),
    terrain: 2.5 * MGAL,
  };

  it('assembles FAA, SBA and CBA from the worked example', () => {
    const a = anomalies(terms);
    assertClose(mgal(a.freeAir), 9.335386, { abs: 2e-6 }, 'FAA');
    assertClose(mgal(a.simpleBouguer), -103.745069, { abs: 2e-6 }, 'SBA');
    assertClose(mgal(a.completeBouguer), -101.245069, { abs: 2e-6 }, 'CBA');
  });

  it('adds a supplied inner-zone terrain correction to the complete anomaly only', () => {
    const a = anomalies({ ...terms, innerTerrain: 0.3 * MGAL });
    assertClose(mgal(a.simpleBouguer), -103.745069, { abs: 2e-6 }, 'SBA unchanged');
    assertClose(mgal(a.completeBouguer), -100.945069, { abs: 2e-6 }, 'CBA with inner zone');
  });

  it('NaN observed gravity gives NaN anomalies; NaN terrain only a NaN complete anomaly', () => {
    const none = anomalies({ ...terms, gobs: Number.NaN });
    expect(none.freeAir).toBeNaN();
    expect(none.simpleBouguer).toBeNaN();
    expect(none.completeBouguer).toBeNaN();
    const noTc = anomalies({ ...terms, terrain: Number.NaN });
    expect(Number.isFinite(noTc.simpleBouguer)).toBe(true);
    expect(noTc.completeBouguer).toBeNaN();
  });
});
