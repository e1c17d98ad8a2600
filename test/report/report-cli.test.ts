import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { syntheticResultsCsv, writeSyntheticResults } from './synthetic-results.js';

const DEM = new URL('../fixtures/dem/plain-f32.tif', import.meta.url).pathname;

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'talus-report-cli-'));
});

describe('talus report', () => {
  it('writes the HTML file and says where (exit 0)', async () => {
    const results = writeSyntheticResults(dir);
    const out = join(dir, 'report.html');
    const io = memoryIo();
    expect(await runCli(['report', results, '-o', out], io)).toBe(0);
    expect(existsSync(out)).toBe(true);
    expect(io.out()).toContain(`wrote ${out}`);
    expect(io.err()).toContain('No DEM given');
  });

  it('--dem draws shaded relief under the maps (synthetic DEM fixture, same UTM grid as the stations)', async () => {
    const results = writeSyntheticResults(dir, { name: 'withdem.csv' });
    const out = join(dir, 'withdem.html');
    const io = memoryIo();
    expect(await runCli(['report', results, '-o', out, '--dem', DEM], io)).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect((html.match(/<image class="relief" href="data:image\/png;base64,/g) ?? []).length).toBe(3);
  });

  it('--dem in another kind of CRS than the station positions: report written, relief left out with a note', async () => {
    const results = writeSyntheticResults(dir, { name: 'geo.csv', coords: 'lonlat' });
    const out = join(dir, 'geo.html');
    const io = memoryIo();
    expect(await runCli(['report', results, '-o', out, '--dem', DEM], io)).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).not.toContain('<image class="relief"');
    expect(html).toContain('Shaded relief left out');
    expect(io.err()).toContain('Shaded relief left out');
  });

  it('a missing results file is an input error (exit 2) naming the file', async () => {
    const io = memoryIo();
    const missing = join(dir, 'nope.csv');
    expect(await runCli(['report', missing, '-o', join(dir, 'x.html')], io)).toBe(2);
    expect(io.err()).toContain(missing);
  });

  it('a CSV without complete_bouguer_mgal is an input error naming the column', async () => {
    const p = join(dir, 'nocba.csv');
    writeFileSync(p, 'id,x,y,height_m\nA,1,2,3\n');
    const io = memoryIo();
    expect(await runCli(['report', p, '-o', join(dir, 'x.html')], io)).toBe(2);
    expect(io.err()).toContain('complete_bouguer_mgal');
  });

  it('--columns maps renamed input columns; a mapping to an absent column is an input error', async () => {
    const csv = syntheticResultsCsv({ n: 30 }).replace(/^id,/, 'STN,');
    const p = join(dir, 'renamed.csv');
    writeFileSync(p, csv);
    const io = memoryIo();
    expect(await runCli(['report', p, '-o', join(dir, 'renamed.html'), '--columns', 'id=STN'], io)).toBe(0);
    expect(readFileSync(join(dir, 'renamed.html'), 'utf8')).toContain('S001');
    const io2 = memoryIo();
    expect(await runCli(['report', p, '-o', join(dir, 'renamed2.html'), '--columns', 'id=STATION'], io2)).toBe(2);
    expect(io2.err()).toContain('STATION');
  });

  it('--columns takes the mapping of talus reduce, including the legacy TC column', async () => {
    const csv = syntheticResultsCsv({ n: 30 }).replace(',legacy_tc_mgal,', ',OLDTC,');
    const p = join(dir, 'oldtc.csv');
    writeFileSync(p, csv);
    const without = join(dir, 'oldtc-without.html');
    const withMap = join(dir, 'oldtc-with.html');
    expect(await runCli(['report', p, '-o', without], memoryIo())).toBe(0);
    expect(await runCli(['report', p, '-o', withMap, '--columns', 'legacy_tc_mgal=OLDTC'], memoryIo())).toBe(0);
    expect(readFileSync(without, 'utf8')).not.toContain('data-chart="legacy-tc"');
    expect(readFileSync(withMap, 'utf8')).toContain('data-chart="legacy-tc"');
  });

  it('a non-numeric value in a results column is an input error naming line and column', async () => {
    const lines = syntheticResultsCsv({ n: 10 }).split('\n');
    const header = (lines[0] as string).split(',');
    const row = (lines[3] as string).split(',');
    row[header.indexOf('terrain_corr_mgal')] = 'abc';
    lines[3] = row.join(',');
    const p = join(dir, 'bad.csv');
    writeFileSync(p, lines.join('\n'));
    const io = memoryIo();
    expect(await runCli(['report', p, '-o', join(dir, 'bad.html')], io)).toBe(2);
    expect(io.err()).toContain(`${p}:4`);
    expect(io.err()).toContain('terrain_corr_mgal');
  });

  it('-o is required', async () => {
    const io = memoryIo();
    expect(await runCli(['report', join(dir, 'results.csv')], io)).toBe(2);
    expect(io.err()).toContain('--output');
  });
});
