import { describe, expect, it } from 'vitest';
import { gridFromFunction } from '../../src/dem/grid.js';
import type { DemGrid } from '../../src/dem/grid.js';
import { InputError } from '../../src/errors.js';
import { reduceWithFormulas } from '../../src/legacy/formula-set.js';
import type { FormulaSet } from '../../src/legacy/formula-set.js';
import { sampleBilinear, sampleUndulations } from '../../src/legacy/geoid-grid.js';
import {
  convertHeight,
  convertHeights,
  heightTypeMixError,
  parseHeightType,
  suspectHeightTypeMismatch,
} from '../../src/legacy/height-type.js';
import { assertClose } from '../helpers/assert-close.js';
import { mulberry32 as uniformSource } from '../helpers/seeded-random.js';

/** Synthetic projected geoid grid: 40 x 30 cells of 1 km, N = 25 + 2e-4 x - 1e-4 y m (linear). */
const undulationAt = (x: number, y: number): number => 25 + 2e-4 * (x - 500000) - 1e-4 * (y - 4000000);
const GEOID: DemGrid = gridFromFunction(
  {
    width: 40,
    height: 30,
    originX: 500000,
    originY: 4030000,
    cellSizeX: 1000,
    cellSizeY: 1000,
    crs: { kind: 'projected', proj4: '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', label: 'EPSG:32633', epsg: 32633, linearUnitM: 1 },
    source: 'synthetic linear geoid',
  },
  (x, y) => undulationAt(x, y),
);
// Float32 storage of values near 30 m: ~2e-6 m.
const FLOAT32_M = 1e-5;

describe('bilinear geoid sampling', () => {
  it('returns the value at a cell centre and reproduces a linear field between centres', () => {
    assertClose(sampleBilinear(GEOID, 500500, 4029500), undulationAt(500500, 4029500), { abs: FLOAT32_M });
    for (const [x, y] of [
      [512345.6, 4011111.1],
      [539000, 4001000.5],
      [500700, 4020250],
    ] as const) {
      assertClose(sampleBilinear(GEOID, x, y), undulationAt(x, y), { abs: FLOAT32_M }, `${x},${y}`);
    }
  });

  it('holds the edge value in the outer half cell and is NaN outside the grid', () => {
    // x = 500200 is left of the first centre (500500): same as at the centre column.
    assertClose(sampleBilinear(GEOID, 500200, 4015000), undulationAt(500500, 4015000), { abs: FLOAT32_M });
    expect(sampleBilinear(GEOID, 499999, 4015000)).toBeNaN();
    expect(sampleBilinear(GEOID, 520000, 4030001)).toBeNaN();
    expect(sampleBilinear(GEOID, NaN, 4015000)).toBeNaN();
  });

  it('is NaN next to a nodata node, but keeps a valid centre beside one', () => {
    const holed: DemGrid = { ...GEOID, data: GEOID.data.slice() };
    holed.data[10 * 40 + 10] = NaN; // centre x = 510500, y = 4019500
    expect(sampleBilinear(holed, 510700, 4019300)).toBeNaN();
    assertClose(sampleBilinear(holed, 511500, 4019500), undulationAt(511500, 4019500), { abs: FLOAT32_M });
  });
});

describe('height types', () => {
  it('h = H + N and back', () => {
    expect(convertHeight(1000, 'orthometric', 'ellipsoidal', 30)).toBe(1030);
    expect(convertHeight(1030, 'ellipsoidal', 'orthometric', 30)).toBe(1000);
    expect(convertHeight(1000, 'orthometric', 'orthometric', NaN)).toBe(1000);
    expect(convertHeight(1000, 'orthometric', 'ellipsoidal', NaN)).toBeNaN();
  });

  it('ellipsoidal instead of orthometric heights shift the FAA by 0.3086 N (physics.md §6)', () => {
    // First-order free-air (0.3086 mGal/m, common practice), so the shift is exactly 0.3086 N;
    // with the second-order form it differs by ~0.006 mGal at N = 30 m.
    const set: FormulaSet = { normal: 'grs80', freeAir: 'first-order', bouguer: 'cap', densityKgM3: 2670, atmospheric: false };
    const xs = new Float64Array([503210, 517000, 525555, 538100]);
    const ys = new Float64Array([4028000, 4012345, 4001500, 4020000]);
    const orthometric = new Float64Array([120, 845.5, 1630.2, 2210]);
    const n = sampleUndulations(GEOID, xs, ys);
    const ellipsoidal = convertHeights(orthometric, 'orthometric', 'ellipsoidal', n);
    for (let i = 0; i < xs.length; i++) {
      const base = { latDeg: 36.2, gobsMgal: 979500, tcMgal: 0 };
      const faH = reduceWithFormulas({ ...base, heightM: orthometric[i] ?? NaN }, set).freeAirAnomalyMgal;
      const fah = reduceWithFormulas({ ...base, heightM: ellipsoidal[i] ?? NaN }, set).freeAirAnomalyMgal;
      const expectedN = undulationAt(xs[i] ?? NaN, ys[i] ?? NaN);
      // Tolerance 0.001 mGal (physics.md §6 check); the float32 grid adds ~1e-6 mGal.
      assertClose(fah - faH, 0.3086 * expectedN, { abs: 0.001 }, `station ${i}`);
    }
  });

  it('refuses to mix a DEM and stations of different height types without a geoid grid', () => {
    const e = heightTypeMixError('orthometric', 'ellipsoidal', false);
    expect(e).toBeInstanceOf(InputError);
    expect(e?.message).toMatch(/ellipsoidal.*orthometric.*geoid/);
    expect(heightTypeMixError('orthometric', 'ellipsoidal', true)).toBeNull();
    expect(heightTypeMixError('ellipsoidal', 'ellipsoidal', false)).toBeNull();
  });

  it('parses height types and names a bad one', () => {
    expect(parseHeightType('Ellipsoidal', '--dem-height-type')).toBe('ellipsoidal');
    expect(() => parseHeightType('geoidal', '--dem-height-type')).toThrow(/--dem-height-type.*"geoidal"/);
  });
});

describe('suspected height type mismatch', () => {
  const u = uniformSource(7);
  /** Approximately normal noise: sum of 12 uniforms minus 6 (unit variance). */
  const gauss = (): number => Array.from({ length: 12 }, u).reduce((a, b) => a + b, 0) - 6;

  it('warns on a planted constant offset of -31.5 m with 2 m of scatter and a few NaN', () => {
    const misfits = Float64Array.from({ length: 60 }, (_, i) => (i % 17 === 0 ? NaN : -31.5 + 2 * gauss()));
    const w = suspectHeightTypeMismatch(misfits);
    expect(w).not.toBeNull();
    expect(w).toMatch(/3[01]\.\d m below the DEM/);
    expect(w).toMatch(/ellipsoidal/);
  });

  it('stays quiet on random misfits, a small offset, and too few stations', () => {
    expect(suspectHeightTypeMismatch(Float64Array.from({ length: 60 }, () => 20 * gauss()))).toBeNull();
    expect(suspectHeightTypeMismatch(Float64Array.from({ length: 60 }, () => 12 + 30 * gauss()))).toBeNull();
    expect(suspectHeightTypeMismatch(Float64Array.from({ length: 60 }, () => 3 + 0.5 * gauss()))).toBeNull();
    expect(suspectHeightTypeMismatch(new Float64Array([30, 30.2, 29.9, 30.1]))).toBeNull();
  });
});
