import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  LEGACY_SAMPLE_FORMULAS,
  LEGACY_SAMPLE_HEADER,
  makeLegacyRows,
  modernStationsFromRecords,
} from '../../data-samples/legacy/legacy-sample.js';
import { toIgsn71Mgal } from '../../src/legacy/gravity-datum.js';
import { checkLegacyAnomalies } from '../../src/legacy/legacy-reduction.js';
import { assertClose } from '../helpers/assert-close.js';

// An invented modern station list (not survey data).
const MODERN_CSV = `id,lon,lat,height_m,gobs_mgal,terrain_corr_mgal
S01,14.2010,46.3020,612.40,980421.113,0.84
S02,14.2305,46.3311,1104.75,980322.581,3.92
S03,14.2650,46.2877,1850.10,980170.442,
S04,14.3012,46.3105,2410.00,980061.209,12.37
S05,14.3400,46.3500,355.00,980479.950,0.05
`;

const records = MODERN_CSV.trim()
  .split('\n')
  .slice(1)
  .map((line) => {
    const cells = line.split(',');
    const keys = MODERN_CSV.split('\n')[0]?.split(',') ?? [];
    return Object.fromEntries(keys.map((k, i) => [k, cells[i] ?? '']));
  });
const stations = modernStationsFromRecords(records, 'modern.csv');
const rows = makeLegacyRows(stations, { seed: 1, oldDatumOffsetM: 0.25, plantMismatchIds: ['S04'] });
const col = (name: (typeof LEGACY_SAMPLE_HEADER)[number]): number => LEGACY_SAMPLE_HEADER.indexOf(name);

describe('invented legacy sample', () => {
  it('prints feet to 0.1 ft, Potsdam gravity and anomalies to 0.01 mGal, chart TC to 0.1 mGal', () => {
    for (const r of rows) {
      expect(r[col('height_ft')]).toMatch(/^-?\d+\.\d$/);
      expect(r[col('gobs_mgal')]).toMatch(/^\d+\.\d\d$/);
      expect(r[col('legacy_tc_mgal')]).toMatch(/^\d+\.\d$/);
      expect(r[col('legacy_fa_mgal')]).toMatch(/^-?\d+\.\d\d$/);
      expect(r[col('legacy_cba_mgal')]).toMatch(/^-?\d+\.\d\d$/);
    }
    // S01: (612.40 + 0.25) m / 0.3048 = 2010.01 ft -> 2010.0; Potsdam = 980421.113 + 14.0 -> 980435.11.
    expect(rows[0]?.[col('height_ft')]).toBe('2010.0');
    expect(rows[0]?.[col('gobs_mgal')]).toBe('980435.11');
  });

  it('the Potsdam values return to the modern IGSN71 ones within the 0.005 mGal print rounding', () => {
    stations.forEach((st, i) => {
      const back = toIgsn71Mgal(Number(rows[i]?.[col('gobs_mgal')]), 'potsdam');
      assertClose(back, st.gobsMgal, { abs: 0.005 + 1e-9 }, st.id);
    });
  });

  it('reproduces under the declared formulas except the planted copying error', () => {
    const flagged = rows.filter((r) => {
      const c = checkLegacyAnomalies(
        {
          latDeg: Number(r[col('lat')]),
          heightM: Number(r[col('height_ft')]) * 0.3048,
          gobsMgal: Number(r[col('gobs_mgal')]),
          tcMgal: Number(r[col('legacy_tc_mgal')]),
        },
        LEGACY_SAMPLE_FORMULAS,
        { faMgal: Number(r[col('legacy_fa_mgal')]), cbaMgal: Number(r[col('legacy_cba_mgal')]) },
      );
      return c.mismatch;
    });
    expect(flagged.map((r) => r[0])).toEqual(['S04']);
  });

  it('is deterministic for a seed', () => {
    expect(makeLegacyRows(stations, { seed: 1, oldDatumOffsetM: 0.25, plantMismatchIds: ['S04'] })).toEqual(rows);
  });

  it('rejects a station list without a required column, naming file, line and column', () => {
    expect(() => modernStationsFromRecords([{ id: 'X', lon: '1', lat: '2', height_m: '', gobs_mgal: '3' }], 'm.csv')).toThrow(
      'm.csv:2: column height_m is missing',
    );
  });
});

describe('make-legacy-sample command', () => {
  const dir = mkdtempSync(join(tmpdir(), 'talus-legacy-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('writes the header and one row per station', () => {
    const input = join(dir, 'modern.csv');
    const output = join(dir, 'legacy.csv');
    writeFileSync(input, MODERN_CSV);
    execFileSync(process.execPath, ['--import', 'tsx', 'data-samples/legacy/make-legacy-sample.ts', '--in', input, '--out', output, '--plant-mismatch', 'S04'], {
      stdio: 'pipe',
    });
    const lines = readFileSync(output, 'utf8').trim().split('\n');
    expect(lines[0]).toBe(LEGACY_SAMPLE_HEADER.join(','));
    expect(lines.slice(1)).toEqual(rows.map((r) => r.join(',')));
  });
});
