import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { assertClose } from '../helpers/assert-close.js';
import { CENTRE, FLAT_M, num, reduce, tempDir, writeCsv, writeDem } from './legacy-fixture.js';

const [X0, Y0] = CENTRE;
// One block 400 x 400 m, 300 m high, centred 1500 m east of the station: outside 0:1000.
const BLOCK = { cx: X0 + 1500, cy: Y0, half: 200, topM: 300 };
const inBlock = (x: number, y: number): boolean => Math.abs(x - BLOCK.cx) < BLOCK.half && Math.abs(y - BLOCK.cy) < BLOCK.half;

let dir: string;
let dem: string;
let stations: string;
beforeAll(() => {
  dir = tempDir();
  dem = writeDem(dir, 'block.tif', (x, y) => FLAT_M + (inBlock(x, y) ? BLOCK.topM : 0));
  stations = writeCsv(dir, 'st.csv', ['id', 'x', 'y', 'height_m', 'gobs_mgal', 'legacy_tc_mgal'], [['B1', X0, Y0, FLAT_M, 980510, 0.0]]);
});

describe('talus reduce --legacy-tc-range', () => {
  it('a block outside the range: terrain_corr_range_mgal = 0 while the full TC is > 0', async () => {
    const r = await reduce(stations, dem, join(dir, 'range.csv'), ['--legacy-tc-range', '0:1000']);
    expect(r.code, r.err).toBe(0);
    const row = r.rows[0];
    // Flat terrain at station height inside 1 km has no effect; 1e-4 is the printed resolution.
    assertClose(num(row, 'terrain_corr_range_mgal'), 0, { abs: 1e-4 }, 'range TC');
    const full = num(row, 'terrain_corr_mgal');
    expect(full).toBeGreaterThan(0);
    // Hand estimate: the block as a point mass at its centre (1500 m away, 150 m up):
    // G rho V z / r^3. 15 %: the point mass ignores the block's extent (size/distance 0.27)
    // and the TC also counts the block's sides at their true distances.
    const V = (2 * BLOCK.half) ** 2 * BLOCK.topM;
    const z = BLOCK.topM / 2;
    const rr = Math.hypot(1500, z);
    const pointMgal = ((6.6743e-11 * 2670 * V * z) / rr ** 3) * 1e5;
    assertClose(full, pointMgal, { rel: 0.15 }, 'full TC vs point mass');
    expect((r.provenance['legacy'] as Record<string, unknown>)['tcRange']).toBeDefined();
  });

  it('a range beyond --radius is refused (exit 2)', async () => {
    const r = await reduce(stations, dem, join(dir, 'far.csv'), ['--legacy-tc-range', '0:5000']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('--legacy-tc-range');
  });
});
