import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { assertClose } from '../helpers/assert-close.js';
import { CENTRE, FLAT_M, latOf, num, reduce, tempDir, writeCsv, writeDem } from './legacy-fixture.js';

// Invented stations on flat terrain at the DEM height (TC = 0).
const [X0, Y0] = CENTRE;
const IGSN71 = [980512.34, 980498.7, 980530.05];
const XS = [X0, X0 + 150, X0 - 100];
const YS = [Y0, Y0 + 80, Y0 - 120];

let dir: string;
let dem: string;
beforeAll(() => {
  dir = tempDir();
  dem = writeDem(dir, 'flat.tif');
});

const rowsOf = (g: (k: number) => string | number, extra: (k: number) => (string | number)[] = () => []): (string | number)[][] =>
  IGSN71.map((_, k) => [`S${k + 1}`, XS[k] as number, YS[k] as number, FLAT_M, g(k), ...extra(k)]);

describe('talus reduce: gravity datum and units', () => {
  it('Potsdam gravity is shifted by -14.0 mGal (Woollard & Godley 1980) before the reduction, end to end', async () => {
    const head = ['id', 'x', 'y', 'height_m', 'gobs_mgal'];
    const igsn = writeCsv(dir, 'igsn.csv', head, rowsOf((k) => (IGSN71[k] as number).toFixed(2)));
    const pots = writeCsv(dir, 'pots.csv', head, rowsOf((k) => ((IGSN71[k] as number) + 14).toFixed(2)));
    const a = await reduce(igsn, dem, join(dir, 'igsn-out.csv'));
    const b = await reduce(pots, dem, join(dir, 'pots-out.csv'), ['--gravity-datum', 'potsdam']);
    expect(a.code).toBe(0);
    expect(b.code).toBe(0);
    for (let k = 0; k < IGSN71.length; k++) {
      // Same IGSN71 value in both runs: the anomalies agree to the printed 4 decimals.
      for (const c of ['free_air_anomaly_mgal', 'complete_bouguer_mgal'])
        assertClose(num(b.rows[k], c), num(a.rows[k], c), { abs: 1e-9 }, `${c} row ${k}`);
      assertClose(num(b.rows[k], 'gobs_igsn71_mgal'), IGSN71[k] as number, { abs: 1e-9 }, 'converted gobs');
      // Hand computation: FAA = g - gamma_GRS80 + second-order FAC (Hinze et al. 2005) + g_atm (physics.md §1-3).
      const s = Math.sin((latOf(XS[k] as number, YS[k] as number) * Math.PI) / 180) ** 2;
      const gamma = (978032.67715 * (1 + 0.001931851353 * s)) / Math.sqrt(1 - 0.0066943800229 * s);
      const fac = (0.3087691 - 0.0004398 * s) * FLAT_M - 7.2125e-8 * FLAT_M ** 2;
      const atm = 0.874 - 9.9e-5 * FLAT_M + 3.56e-9 * FLAT_M ** 2;
      // 1e-4: the CSV prints 4 decimals (5e-5) and the latitude comes from another UTM inverse (< 1e-8 deg, < 1e-5 mGal).
      assertClose(num(b.rows[k], 'free_air_anomaly_mgal'), (IGSN71[k] as number) - gamma + fac + atm, { abs: 1e-4 }, 'hand FAA');
    }
    expect(a.rows[0]).not.toHaveProperty('gobs_igsn71_mgal');
    const conv = (b.provenance['conversions'] as { gravity: { step: string; description: string }[] }).gravity;
    expect(conv.map((c) => c.step)).toEqual(['datum']);
    expect(conv[0]?.description).toContain('-14.0 mGal');
    expect((a.provenance['conversions'] as { gravity: unknown[] }).gravity).toEqual([]);
  });

  it('g.u. with a removed constant and a per-row offset column (mapped by --columns) convert to IGSN71 mGal', async () => {
    // Stored: (g_Potsdam in g.u.) - 9800000 g.u.; row 2 carries its own offset of -13.5 mGal.
    const offsets = ['', '-13.5', ''];
    const path = writeCsv(
      dir,
      'gu.csv',
      ['id', 'x', 'y', 'height_m', 'gobs_mgal', 'OFFS'],
      rowsOf(
        (k) => (((IGSN71[k] as number) + 14) * 10 - 9800000).toFixed(1),
        (k) => [offsets[k] as string],
      ),
    );
    const r = await reduce(path, dem, join(dir, 'gu-out.csv'), [
      '--gravity-datum', 'potsdam', '--gravity-units', 'gu', '--gobs-offset', '9800000', '--columns', 'datum_offset_mgal=OFFS',
    ]);
    expect(r.code).toBe(0);
    // Hand: (stored + 9800000) / 10 + offset; row 2 uses -13.5 instead of -14.0, so it ends 0.5 mGal higher.
    const expected = IGSN71.map((g, k) => g + (k === 1 ? 0.5 : 0));
    // 1e-6: stored values are exact to 0.1 g.u. = 0.01 mGal, which the IGSN71 values carry; float rounding only.
    expected.forEach((g, k) => assertClose(num(r.rows[k], 'gobs_igsn71_mgal'), g, { abs: 1e-6 }, `row ${k}`));
    const steps = (r.provenance['conversions'] as { gravity: { step: string }[] }).gravity.map((c) => c.step);
    expect(steps).toEqual(['stored-offset', 'units', 'datum', 'per-row-datum-offset']);
  });

  it('a per-row offset that is not a number names file, line, station, column and value (exit 2)', async () => {
    const path = writeCsv(dir, 'badoff.csv', ['id', 'x', 'y', 'height_m', 'gobs_mgal', 'datum_offset_mgal'], rowsOf((k) => IGSN71[k] as number, (k) => [k === 2 ? 'abc' : '']));
    const r = await reduce(path, dem, join(dir, 'badoff-out.csv'));
    expect(r.code).toBe(2);
    expect(r.err).toContain('badoff.csv:4');
    expect(r.err).toContain('station S3');
    expect(r.err).toContain('column datum_offset_mgal');
    expect(r.err).toContain('"abc"');
  });
});
