import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { assertClose } from '../helpers/assert-close.js';
import { CENTRE, FLAT_M, latOf, num, reduce, tempDir, writeCsv, writeDem } from './legacy-fixture.js';

// An invented legacy sheet over flat terrain: Potsdam gravity, heights in international feet,
// chart TCs, anomalies printed from the 1930 formula, 0.3086 mGal/m and a 2670 slab with
// G = 6.673e-11 (the set of data-samples/legacy/README.md).
const [X0, Y0] = CENTRE;
const FORMULAS = 'normal=igf1930,free-air=first-order,bouguer=slab,density=2670,atmospheric=no,g=6.673e-11';
const FT = 0.3048;
const STATIONS = [
  { id: 'L1', x: X0, y: Y0, ft: 1640.4, gPots: 980526.21, tc: 0.4 },
  { id: 'L2', x: X0 + 200, y: Y0 - 150, ft: 1642.0, gPots: 980519.87, tc: 0.2 },
  { id: 'L3', x: X0 - 180, y: Y0 + 90, ft: 1638.9, gPots: 980531.4, tc: 0.3 },
  { id: 'L4', x: X0 + 60, y: Y0 + 210, ft: 1641.2, gPots: 980522.05, tc: 0.1 },
];
const PLANTED = 'L3';

/** The legacy reduction by hand (physics.md §1, §3, §4): FAA and CBA, mGal. */
function legacyByHand(st: (typeof STATIONS)[number]): { fa: number; cba: number } {
  const phi = (latOf(st.x, st.y) * Math.PI) / 180;
  const gamma30 = 978049 * (1 + 0.0052884 * Math.sin(phi) ** 2 - 0.0000059 * Math.sin(2 * phi) ** 2);
  const h = st.ft * FT;
  const fa = st.gPots - gamma30 + 0.3086 * h;
  const slab = 2 * Math.PI * 6.673e-11 * 2670 * h * 1e5;
  return { fa, cba: fa - slab + st.tc };
}

let dir: string;
let flatDem: string;
let hillDem: string;
let legacyCsv: string;
beforeAll(() => {
  dir = tempDir();
  flatDem = writeDem(dir, 'flat.tif');
  // A ridge 1 km east of the centre, so that the new TC is not zero.
  hillDem = writeDem(dir, 'hill.tif', (x) => FLAT_M + 150 * Math.exp(-(((x - X0 - 1000) / 300) ** 2)));
  legacyCsv = writeCsv(
    dir,
    'legacy.csv',
    ['id', 'x', 'y', 'height_ft', 'gobs_mgal', 'legacy_tc_mgal', 'FA_OLD', 'legacy_cba_mgal', 'inner_tc_mgal'],
    STATIONS.map((st) => {
      const r = legacyByHand(st);
      return [st.id, st.x, st.y, st.ft.toFixed(1), st.gPots.toFixed(2), st.tc.toFixed(1), r.fa.toFixed(2), (r.cba + (st.id === PLANTED ? 1 : 0)).toFixed(2), '0.05'];
    }),
  );
});

const LEGACY_ARGS = ['--columns', 'height_m=height_ft,legacy_fa_mgal=FA_OLD', '--height-units', 'ft', '--gravity-datum', 'potsdam', '--legacy-formulas', FORMULAS];

describe('talus reduce --legacy-formulas', () => {
  it('recomputes the printed legacy anomalies and flags only the planted +1.00 mGal row (legacy_mismatch)', async () => {
    const r = await reduce(legacyCsv, flatDem, join(dir, 'mismatch.csv'), LEGACY_ARGS);
    expect(r.code, r.err).toBe(0);
    STATIONS.forEach((st, k) => {
      const hand = legacyByHand(st);
      // 1e-4: recomputed columns are printed to 4 decimals; the hand values use the same printed inputs.
      assertClose(num(r.rows[k], 'legacy_fa_recomputed_mgal'), hand.fa, { abs: 1e-4 }, `${st.id} FA`);
      assertClose(num(r.rows[k], 'legacy_cba_recomputed_mgal'), hand.cba, { abs: 1e-4 }, `${st.id} CBA`);
      expect(r.rows[k]?.['flags']?.includes('legacy_mismatch'), st.id).toBe(st.id === PLANTED);
    });
    expect(r.out).toContain('legacy_mismatch: 1 stations');
    expect((r.provenance['stationCounts'] as { flagged: Record<string, number> }).flagged['legacy_mismatch']).toBe(1);
  });

  it('--legacy-tolerance 2 accepts the planted row', async () => {
    const r = await reduce(legacyCsv, flatDem, join(dir, 'tol.csv'), [...LEGACY_ARGS, '--legacy-tolerance', '2']);
    expect(r.code, r.err).toBe(0);
    expect(r.rows.every((row) => !(row['flags'] ?? '').includes('legacy_mismatch'))).toBe(true);
  });

  for (const variant of [
    { name: 'cap, second order, density 2500, field inner zone', args: ['--density', '2500', '--field-inner-radius', '10'] },
    { name: 'slab, first order, igf1967, extra densities', args: ['--bouguer', 'slab', '--free-air', 'first-order', '--normal', 'igf1967', '--densities', '2200'] },
    { name: 'like-for-like range 0:2000', args: ['--legacy-tc-range', '0:2000'] },
  ]) {
    it(`explain-change parts sum to delta_total within 1e-9 mGal and the new CBA is complete_bouguer_mgal (${variant.name})`, async () => {
      const r = await reduce(legacyCsv, hillDem, join(dir, `change-${variant.args.join('')}.csv`), [...LEGACY_ARGS, ...variant.args]);
      expect(r.code, r.err).toBe(0);
      const parts = Object.keys(r.rows[0] ?? {}).filter((c) => /^delta_.+_mgal$/.test(c) && c !== 'delta_total_mgal');
      expect(parts.length).toBeGreaterThanOrEqual(8);
      for (const row of r.rows) {
        const sum = parts.reduce((s, c) => s + num(row, c), 0);
        // 1e-9: each part is printed to 10 decimals (<= 5e-11 rounding) and they telescope exactly.
        assertClose(sum, num(row, 'delta_total_mgal'), { abs: 1e-9 }, `${row['id']} sum of parts`);
        // printed legacy CBA + total = new CBA; 1e-4: complete_bouguer_mgal is printed to 4 decimals (5e-5), the legacy cell is the value the total was taken from.
        assertClose(num(row, 'legacy_cba_mgal') + num(row, 'delta_total_mgal'), num(row, 'complete_bouguer_mgal'), { abs: 1e-4 }, `${row['id']} new CBA`);
        expect(num(row, 'terrain_corr_mgal')).toBeGreaterThan(0);
      }
      // The engine compares the explanation's new CBA with the CBA it wrote, unrounded, on every row.
      const legacy = r.provenance['legacy'] as Record<string, number>;
      expect(legacy['maxAbsNewCbaMinusCompleteBouguerMgal']).toBeLessThanOrEqual(1e-6);
      // Datum part: Potsdam -> IGSN71 is -14.0 mGal on every row (nothing else changes first).
      for (const row of r.rows) assertClose(num(row, 'delta_datum_mgal'), -14, { abs: 1e-9 }, 'datum part');
    });
  }
});

describe('talus reduce --legacy-formulas with a re-surveyed height', () => {
  it('legacy_height_m puts the height change in delta_height_mgal: 2 ft lower old height on flat terrain', async () => {
    // The old reduction used h_old = h - 2 ft. By hand (physics.md §3, §4): a height change dh
    // moves the CBA by about (free-air gradient - Bouguer gradient) dh = (0.3086 - 2 pi G rho) dh.
    const st = STATIONS[0] as (typeof STATIONS)[number];
    const csv = writeCsv(
      dir,
      'resurvey.csv',
      ['id', 'x', 'y', 'height_ft', 'old_height_ft', 'gobs_mgal', 'legacy_tc_mgal', 'legacy_cba_mgal'],
      [[st.id, st.x, st.y, st.ft.toFixed(1), (st.ft - 2).toFixed(1), st.gPots.toFixed(2), st.tc.toFixed(1), '']],
    );
    const args = ['--columns', 'height_m=height_ft,legacy_height_m=old_height_ft', '--height-units', 'ft', '--gravity-datum', 'potsdam', '--legacy-formulas', FORMULAS];
    const r = await reduce(csv, flatDem, join(dir, 'resurvey-out.csv'), args);
    expect(r.code, r.err).toBe(0);
    const row = r.rows[0];
    const dh = 2 * FT;
    const expected = (0.3086 - 2 * Math.PI * 6.673e-11 * 2670 * 1e5) * dh;
    // the height step is taken after the free-air and Bouguer switches in the fixed order, so it
    // is evaluated with the new formulas: second-order free-air and the cap at G = 6.6743e-11;
    // 0.002 mGal covers their difference from the old set over 0.61 m
    assertClose(num(row, 'delta_height_mgal'), expected, { abs: 0.002 }, 'height part');
    const partCols = Object.keys(row ?? {}).filter((k) => k.startsWith('delta_') && k !== 'delta_total_mgal');
    const sum = partCols.reduce((a, k) => a + num(row, k), 0);
    // parts printed to 10 decimals: the sum holds to 1e-9 mGal
    assertClose(sum, num(row, 'delta_total_mgal'), { abs: 1e-9 }, 'parts sum');
  });
});
