import { describe, expect, it } from 'vitest';
import { CHANGE_COLUMNS, changeRow, explainChange } from '../../src/legacy/explain-change.js';
import type { ReductionState } from '../../src/legacy/explain-change.js';
import { reduceWithFormulas } from '../../src/legacy/formula-set.js';
import { toIgsn71Mgal } from '../../src/legacy/gravity-datum.js';
import type { NormalFormula } from '../../src/reduction/index.js';
import { assertClose } from '../helpers/assert-close.js';
import { mulberry32 as uniformSource } from '../helpers/seeded-random.js';


const FORMULAS: NormalFormula[] = ['grs80', 'wgs84', 'wgs84-1987', 'igf1967', 'igf1967-short', 'igf1930'];

const LEGACY: ReductionState = {
  normal: 'igf1930',
  freeAir: 'first-order',
  bouguer: 'slab',
  densityKgM3: 2670,
  atmospheric: false,
  gobsMgal: 980620.0,
  heightM: 1000,
  tcMgal: 1.3,
};

describe('explain-change: the parts sum to the total', () => {
  it('on every row of a randomized set, within 1e-9 mGal', () => {
    const u = uniformSource(20240611);
    const pick = <T>(xs: readonly T[]): T => xs[Math.floor(u() * xs.length)] as T;
    for (let i = 0; i < 400; i++) {
      const latDeg = -90 + 180 * u();
      const oldHeight = -100 + 3500 * u();
      const legacy: ReductionState = {
        normal: pick(FORMULAS),
        freeAir: pick(['first-order', 'second-order'] as const),
        bouguer: pick(['slab', 'cap'] as const),
        densityKgM3: 2000 + 1000 * u(),
        atmospheric: u() < 0.5,
        gravitationalConstant: u() < 0.5 ? 6.673e-11 : undefined,
        gobsMgal: 978000 + 5000 * u(),
        heightM: oldHeight,
        tcMgal: 30 * u(),
      };
      const current: ReductionState = {
        normal: pick(FORMULAS),
        freeAir: pick(['first-order', 'second-order'] as const),
        bouguer: pick(['slab', 'cap'] as const),
        densityKgM3: 2000 + 1000 * u(),
        atmospheric: u() < 0.5,
        gobsMgal: toIgsn71Mgal(legacy.gobsMgal, pick(['potsdam', 'igsn71'] as const)),
        heightM: oldHeight + 20 * (u() - 0.5),
        tcMgal: -2 + 40 * u(),
      };
      const printed = u() < 0.3 ? NaN : reduceWithFormulas({ latDeg, ...legacy }, legacy).completeBouguerMgal + (u() - 0.5);
      const p = explainChange(latDeg, legacy, current, printed);
      const cells = changeRow(p);
      const sumOfParts = cells.slice(0, -1).reduce((a, b) => a + b, 0);
      // Tolerance (the brief's 1e-9 mGal): the parts are differences of anomalies of at most
      // ~1e3 mGal, each rounded to ~1e-13; the end states carry ~1e-10 from terms near 1e6 mGal.
      assertClose(sumOfParts, p.totalMgal, { abs: 1e-9 }, `row ${i}`);
      // The end states are the two reductions computed directly (same float rounding bound).
      const direct = reduceWithFormulas({ latDeg, ...current }, current).completeBouguerMgal;
      assertClose(p.newCbaMgal, direct, { abs: 1e-9 }, `row ${i} new`);
      const expectedTotal = direct - (Number.isNaN(printed) ? reduceWithFormulas({ latDeg, ...legacy }, legacy).completeBouguerMgal : printed);
      assertClose(p.totalMgal, expectedTotal, { abs: 1e-9 }, `row ${i} total`);
    }
  });

  it('emits one cell per column, total last', () => {
    const p = explainChange(45, LEGACY, { ...LEGACY, normal: 'grs80' });
    expect(changeRow(p)).toHaveLength(CHANGE_COLUMNS.length);
    expect(CHANGE_COLUMNS[CHANGE_COLUMNS.length - 1]).toBe('delta_total_mgal');
    expect(changeRow(p)[CHANGE_COLUMNS.length - 1]).toBe(p.totalMgal);
  });
});

describe('explain-change: single ingredient changes land in their own part', () => {
  // Float rounding of anomalies built from terms near 1e6 mGal.
  const ROUNDING_MGAL = 1e-9;

  it('datum: Potsdam to IGSN71 is -14.0 mGal [WoollardGodley1980]', () => {
    const p = explainChange(45, LEGACY, { ...LEGACY, gobsMgal: toIgsn71Mgal(LEGACY.gobsMgal, 'potsdam') });
    assertClose(p.datumMgal, -14.0, { abs: ROUNDING_MGAL });
    assertClose(p.totalMgal, -14.0, { abs: ROUNDING_MGAL });
    expect([p.normalMgal, p.freeAirMgal, p.bouguerMgal, p.terrainMgal, p.densityMgal, p.heightMgal]).toEqual([0, 0, 0, 0, 0, 0]);
  });

  it('normal: 1930 to GRS80 at 45 deg is gamma30 - gamma80 = +9.466428 mGal', () => {
    // physics.md §1 check values [calc]: 980629.386677 (1930) - 980619.920249 (GRS80).
    const p = explainChange(45, LEGACY, { ...LEGACY, normal: 'grs80' });
    // Tolerance: the check values are printed to 1e-6 mGal.
    assertClose(p.normalMgal, 980629.386677 - 980619.920249, { abs: 2e-6 });
  });

  it('free-air: first to second order at 45 deg, 1000 m is 308.477075 - 308.6 mGal', () => {
    // physics.md §3 check value [calc] for the second-order form; 0.3086 x 1000 for the first.
    const p = explainChange(45, LEGACY, { ...LEGACY, freeAir: 'second-order' });
    // Tolerance: the check value is printed to 1e-6 mGal.
    assertClose(p.freeAirMgal, 308.477075 - 308.6, { abs: 2e-6 });
  });

  it('free-air part includes switching the atmospheric correction on: +0.778560 mGal at 1000 m', () => {
    // physics.md §2 check value [calc] at h = 1000 m.
    const p = explainChange(45, LEGACY, { ...LEGACY, atmospheric: true });
    assertClose(p.freeAirMgal, 0.77856, { abs: 2e-6 });
  });

  it('bouguer: slab to cap at 1000 m, 2670 kg/m^3 is minus Bullard B = -1.111699 mGal', () => {
    // physics.md §4 check value [calc] (G = 6.6743e-11).
    const p = explainChange(45, LEGACY, { ...LEGACY, bouguer: 'cap' });
    // Tolerance: printed to 1e-6 mGal.
    assertClose(p.bouguerMgal, -1.111699, { abs: 2e-6 });
  });

  it('terrain and density: a new TC at the old density, then the density scales slab and TC', () => {
    const current = { ...LEGACY, tcMgal: 2.5, densityKgM3: 2400 };
    const p = explainChange(45, LEGACY, current);
    // Terrain first, at the legacy density 2670: the new TC at 2670 would be 2.5 x 2670/2400.
    assertClose(p.terrainMgal, 2.5 * (2670 / 2400) - 1.3, { abs: ROUNDING_MGAL });
    // Density: slab 2 pi G (2400 - 2670) 1000 m removed less, TC from 2.78125 to 2.5 mGal.
    // 2 pi x 6.6743e-11 x 270 x 1000 m = 1.1322e-5 m/s^2 = 1.13226 mGal (slab, [Hinze2005]).
    const slabChangeMgal = 2 * Math.PI * 6.6743e-11 * 270 * 1000 * 1e5;
    assertClose(p.densityMgal, slabChangeMgal + (2.5 - 2.5 * (2670 / 2400)), { abs: ROUNDING_MGAL });
  });

  it('height: 10 ft more on a new vertical datum, first-order free-air and slab', () => {
    // 1000 m old; new 1000 + 3.048 m. Part = (0.3086 - 2 pi G 2670 1e5) x 3.048 mGal.
    const p = explainChange(45, LEGACY, { ...LEGACY, heightM: 1000 + 10 * 0.3048 });
    const slabPerMetreMgal = 2 * Math.PI * 6.6743e-11 * 2670 * 1e5;
    assertClose(p.heightMgal, (0.3086 - slabPerMetreMgal) * 3.048, { abs: ROUNDING_MGAL });
  });

  it('a printed legacy CBA that the old formulas do not reproduce shows as delta_legacy_residual', () => {
    const recomputed = reduceWithFormulas({ latDeg: 45, ...LEGACY }, LEGACY).completeBouguerMgal;
    const p = explainChange(45, LEGACY, LEGACY, recomputed + 0.4);
    assertClose(p.legacyResidualMgal, -0.4, { abs: ROUNDING_MGAL });
    assertClose(p.totalMgal, -0.4, { abs: ROUNDING_MGAL });
  });
});
