/**
 * The terrain stage with the inputs users bring: a field inner zone, a geographic (degree) DEM,
 * and a coarse far-zone DEM taking over where the fine DEM ends.
 */
import { describe, expect, it } from 'vitest';
import { assertClose } from '../helpers/assert-close.js';
import { contextFor, runStation, squareGrid } from '../helpers/synthetic-grid.js';
import { TR, TERRAIN_FLAG, makeTerrainContext } from '../../src/terrain/station-terrain.js';
import { buildPyramid } from '../../src/terrain/pyramid.js';
import { planZones } from '../../src/terrain/zone-plan.js';
import { farWeights } from '../../src/engine/far-mask.js';
import { gridFromFunction } from '../../src/dem/grid.js';
import { meridianRadiusM, primeVerticalRadiusM } from '../../src/terrain/geodesy.js';
import { G } from '../../src/constants.js';

const UNIT = (G * 1000) / 1e-5; // mGal per metre of factor at 1000 kg/m^3
/** Hammer (1939) whole ring: G rho 2 pi [r2 - r1 + sqrt(r1^2 + h^2) - sqrt(r2^2 + h^2)], as a factor. */
const hammer = (r1: number, r2: number, h: number): number => 2 * Math.PI * (r2 - r1 + Math.hypot(r1, h) - Math.hypot(r2, h));

describe('terrain sources', () => {
  it('--field-inner-radius skips the terrain inside it: a ring cut at 250 m is Hammer from 250 to 600 m', () => {
    const grid = squareGrid(400, 5, (x, y) => {
      const r = Math.hypot(x, y);
      return r >= 100 && r < 600 ? 260 : 200;
    });
    const r = runStation(contextFor(grid, null, { radiusM: 990, fieldInnerRadiusM: 250 }), 0, 0, 200);
    // 1 %: the ring's outer edge is a 5 m staircase (as in the analytic ring test)
    assertClose(r[TR.tcUnitMgal] as number, hammer(250, 600, 60) * UNIT, { rel: 0.01 }, 'cut ring');
    const full = runStation(contextFor(grid, null, { radiusM: 990 }), 0, 0, 200);
    expect(full[TR.tcUnitMgal] as number).toBeGreaterThan((r[TR.tcUnitMgal] as number) * 1.5);
  });

  it('a geographic DEM (1 arc-second cells) gives the Hammer ring with cells of their true size', () => {
    // The ring is drawn in metres with the GRS80 local radii at 45 deg N; the engine must turn
    // degrees into metres the same way (common practice: M dphi north, N cos(phi) dlambda east).
    const lat0 = 45;
    const mPerDegN = (meridianRadiusM(lat0) * Math.PI) / 180;
    const mPerDegE = (primeVerticalRadiusM(lat0) * Math.cos((lat0 * Math.PI) / 180) * Math.PI) / 180;
    const cell = 1 / 3600;
    const n = 100;
    const grid = gridFromFunction(
      {
        width: n,
        height: n,
        originX: 10 - (n / 2) * cell,
        originY: lat0 + (n / 2) * cell,
        cellSizeX: cell,
        cellSizeY: cell,
        crs: { kind: 'geographic', proj4: '+proj=longlat +datum=WGS84 +no_defs', label: 'EPSG:4326', epsg: 4326, linearUnitM: NaN },
        source: 'synthetic geographic',
      },
      (lon, lat) => {
        const r = Math.hypot((lon - 10) * mPerDegE, (lat - lat0) * mPerDegN);
        return r >= 200 && r < 1000 ? 340 : 300;
      },
    );
    const ctx = contextFor(grid, null, { radiusM: 1300 });
    const r = runStation(ctx, 10, lat0, 300, lat0);
    // 2 %: 22 m x 31 m cells make a coarser staircase of the ring edges than the 5 m test
    assertClose(r[TR.tcUnitMgal] as number, hammer(200, 1000, 40) * UNIT, { rel: 0.02 }, 'geographic ring');
  });

  it('a far-zone DEM takes over where the fine DEM ends: same TC as one DEM covering everything, full coverage', () => {
    // Smooth regional relief (wavelengths >= 8 km) that a 1 km far DEM represents well.
    const relief = (x: number, y: number): number => 500 + 300 * Math.sin(x / 9000) * Math.cos(y / 7000) + 150 * Math.cos((x + y) / 13000);
    const radiusM = 50000;
    const whole = squareGrid(1100, 100, relief); // 110 km at 100 m
    const fine = squareGrid(200, 100, relief); // 20 km at 100 m
    const far = squareGrid(120, 1000, relief); // 120 km at 1 km
    const plan = planZones({ radiusM, accuracyMgal: (0.01 * 1000) / 2670, fieldInnerRadiusM: 0, fineCellM: 100, aboveTerrainM: 50, belowTerrainM: 50 });
    const both = makeTerrainContext(
      { grid: fine, pyramid: buildPyramid(fine) },
      { grid: far, pyramid: buildPyramid(far, farWeights(far, fine, (x, y) => [x, y])) },
      plan,
    );
    const one = makeTerrainContext({ grid: whole, pyramid: buildPyramid(whole) }, null, plan);
    const alone = makeTerrainContext({ grid: fine, pyramid: buildPyramid(fine) }, null, plan);
    for (const [x, y] of [[0, 0], [3100, -2700], [-5200, 4100]] as const) {
      const h = relief(x, y);
      const a = runStation(both, x, y, h);
      const b = runStation(one, x, y, h);
      // 0.02 mGal at 2670 kg/m^3 (0.0075 at unit density): the 1 km cells and the mask at the
      // fine DEM's edge against 100 m cells everywhere
      assertClose((a[TR.tcUnitMgal] as number) * 2.67, (b[TR.tcUnitMgal] as number) * 2.67, { abs: 0.02 }, `station ${x},${y}`);
      expect(a[TR.coverage]).toBe(1);
      expect(a[TR.flags]).toBe(0);
      // without the far DEM the station is flagged and its coverage says how much is missing
      const c = runStation(alone, x, y, h);
      expect((c[TR.flags] as number) & TERRAIN_FLAG.dem_partial).toBe(TERRAIN_FLAG.dem_partial);
      expect(c[TR.coverage] as number).toBeLessThan(0.2);
    }
  });
});
