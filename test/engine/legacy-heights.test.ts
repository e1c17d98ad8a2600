import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { assertClose } from '../helpers/assert-close.js';
import { squareGrid } from '../helpers/synthetic-grid.js';
import { writeGridGeoTiff } from '../helpers/write-geotiff.js';
import { CENTRE, FLAT_M, num, reduce, tempDir, UTM33N, writeCsv, writeDem } from './legacy-fixture.js';

const [X0, Y0] = CENTRE;
/** Invented geoid undulation, m: a plane (bilinear sampling reproduces it exactly between cell centres). */
const undulation = (x: number, y: number): number => 31.5 + 0.0004 * (x - X0) - 0.0003 * (y - Y0);
const PTS = [
  [X0, Y0, 980512.3],
  [X0 + 400, Y0 - 250, 980505.1],
  [X0 - 320, Y0 + 180, 980520.7],
  [X0 + 150, Y0 + 420, 980509.9],
  [X0 - 60, Y0 - 380, 980515.2],
] as const;
const atm = (h: number): number => 0.874 - 9.9e-5 * h + 3.56e-9 * h * h;

let dir: string;
let dem: string;
let geoid: string;
let ortho: string;
let ellip: string;
beforeAll(() => {
  dir = tempDir();
  dem = writeDem(dir, 'flat.tif');
  geoid = join(dir, 'geoid.tif');
  // 500 m cells over 10 km: covers every station with centres on both sides.
  writeGridGeoTiff(geoid, squareGrid(20, 500, undulation, [X0, Y0]), UTM33N);
  const head = ['id', 'x', 'y', 'height_m', 'gobs_mgal'];
  ortho = writeCsv(dir, 'ortho.csv', head, PTS.map(([x, y, g], k) => [`H${k}`, x, y, FLAT_M, g]));
  ellip = writeCsv(dir, 'ellip.csv', head, PTS.map(([x, y, g], k) => [`H${k}`, x, y, (FLAT_M + undulation(x, y)).toFixed(4), g]));
});

describe('talus reduce: station and DEM height types', () => {
  it('ellipsoidal heights with a geoid grid: FAA shifts by 0.3086 N (physics.md §6), terrain stage unchanged', async () => {
    const a = await reduce(ortho, dem, join(dir, 'ortho-out.csv'), ['--free-air', 'first-order']);
    const b = await reduce(ellip, dem, join(dir, 'ellip-out.csv'), ['--free-air', 'first-order', '--station-height-type', 'ellipsoidal', '--geoid', geoid]);
    expect(a.code, a.err).toBe(0);
    expect(b.code, b.err).toBe(0);
    PTS.forEach(([x, y], k) => {
      const N = undulation(x, y);
      // Expected shift: 0.3086 N plus the atmospheric correction's own height term (-0.003 mGal for N = 31 m).
      const shift = 0.3086 * N + atm(FLAT_M + N) - atm(FLAT_M);
      const d = num(b.rows[k], 'free_air_anomaly_mgal') - num(a.rows[k], 'free_air_anomaly_mgal');
      // 0.001: the two FAAs are printed to 4 decimals and h to 4 decimals (0.3086 * 5e-5).
      assertClose(d, shift, { abs: 0.001 }, `FAA shift row ${k}`);
      // 1e-3: N printed to 3 decimals; the plane is sampled exactly.
      assertClose(num(b.rows[k], 'geoid_undulation_m'), N, { abs: 1e-3 }, 'N');
      assertClose(num(b.rows[k], 'orthometric_height_m'), FLAT_M, { abs: 1e-3 }, 'H');
      // Terrain stage sees H in both runs: same misfit and TC.
      expect(num(b.rows[k], 'height_misfit_m')).toBeCloseTo(num(a.rows[k], 'height_misfit_m'), 3);
      expect(num(b.rows[k], 'terrain_corr_mgal')).toBeCloseTo(num(a.rows[k], 'terrain_corr_mgal'), 4);
    });
    const heights = b.provenance['heights'] as Record<string, string>;
    expect(heights['reductionHeightType']).toBe('ellipsoidal');
    expect(heights['terrainStageHeightType']).toBe('orthometric');
    expect((a.provenance['heights'] as Record<string, string>)['freeAirHeight']).toContain('orthometric height H');
  });

  it('refuses ellipsoidal stations on an orthometric DEM without a geoid grid (exit 2, names the options)', async () => {
    const r = await reduce(ellip, dem, join(dir, 'refused.csv'), ['--station-height-type', 'ellipsoidal']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('--geoid');
    expect(r.err).toContain('--station-height-type');
  });

  it('warns when misfits cluster around a constant (ellipsoidal heights declared orthometric)', async () => {
    const r = await reduce(ellip, dem, join(dir, 'suspect.csv'), ['--above-terrain', '100']);
    expect(r.code, r.err).toBe(0);
    const w = (r.provenance['warnings'] as string[]).find((s) => s.includes('ellipsoidal heights against an orthometric DEM'));
    expect(w).toBeDefined();
    expect(r.out).toContain('warning: station heights lie a nearly constant');
  });
});
