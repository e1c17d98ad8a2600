import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { readFileSync } from 'node:fs';
import { assertClose } from '../helpers/assert-close.js';
import { tempDir } from './legacy-fixture.js';

const root = new URL('../../data-samples/', import.meta.url).pathname;
// The declared set of data-samples/legacy/README.md.
const FORMULAS = 'normal=igf1930,free-air=first-order,bouguer=slab,density=2670,atmospheric=no,g=6.673e-11';

describe('the invented legacy sample reprocessed over the demo DEMs', () => {
  it('feet, Potsdam, 1930 formula, slab and chart TCs: every printed anomaly reproduced, parts sum to the total', async () => {
    const out = join(tempDir(), 'legacy-results.csv');
    const io = memoryIo();
    const code = await runCli(
      [
        'reduce', '--stations', join(root, 'legacy/legacy-stations.csv'),
        '--dem', join(root, 'demo/fine-dem.tif'), '--far-dem', join(root, 'demo/far-dem.tif'),
        '--columns', 'height_m=height_ft', '--height-units', 'ft', '--gravity-datum', 'potsdam',
        '--legacy-formulas', FORMULAS, '--out', out, '--workers', '0', '--no-progress',
      ],
      io,
    );
    expect(code, io.err()).toBe(0);
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    const header = (lines[0] as string).split(',');
    const col = (name: string): number => header.indexOf(name);
    const parts = header.filter((h) => /^delta_.+_mgal$/.test(h) && h !== 'delta_total_mgal');
    expect(lines.length - 1).toBeGreaterThan(100);
    for (const line of lines.slice(1)) {
      const cells = line.split(',');
      const v = (name: string): number => Number(cells[col(name)]);
      // The sample was printed to 0.01 mGal from these very formulas: residual <= 0.005 mGal
      // (0.0051 allows the float rounding of the printed half-way cases).
      expect(Math.abs(v('legacy_cba_mgal') - v('legacy_cba_recomputed_mgal'))).toBeLessThanOrEqual(0.0051);
      expect(Math.abs(v('legacy_fa_mgal') - v('legacy_fa_recomputed_mgal'))).toBeLessThanOrEqual(0.0051);
      expect(cells[col('flags')]).not.toContain('legacy_mismatch');
      assertClose(v('delta_datum_mgal'), -14, { abs: 1e-9 }, 'Potsdam to IGSN71');
      // 1e-9: 10-decimal parts, exact telescoping.
      assertClose(parts.reduce((s, p) => s + v(p), 0), v('delta_total_mgal'), { abs: 1e-9 }, 'sum of parts');
    }
  });
});
