/**
 * `talus reduce` end to end through the CLI: DEM GeoTIFFs and station CSVs written in a temp
 * directory, every flag case, determinism across pool sizes, and bad input.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { squareGrid } from '../helpers/synthetic-grid.js';
import { writeGridGeoTiff } from '../helpers/write-geotiff.js';
import { assertClose } from '../helpers/assert-close.js';

let dir = '';
const E0 = 500000;
const N0 = 5000000;

function hills(x: number, y: number): number {
  const e = x - E0;
  const n = y - N0;
  return 600 + 150 * Math.sin(e / 900) * Math.cos(n / 700) + 40 * Math.sin(e / 230 + n / 310);
}

function readCsv(path: string): { header: string[]; rows: Record<string, string>[] } {
  const lines = readFileSync(path, 'utf8').trim().split('\n');
  const header = (lines[0] as string).split(',');
  return {
    header,
    rows: lines.slice(1).map((l) => Object.fromEntries(l.split(',').map((v, i) => [header[i] as string, v]))),
  };
}

async function reduce(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIo();
  const code = await runCli(['reduce', ...args, '--no-progress'], io);
  return { code, out: io.out(), err: io.err() };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'talus-reduce-'));
  // 12 km x 12 km of hills at 30 m (UTM 33N), and the same with a nodata hole
  writeGridGeoTiff(join(dir, 'hills.tif'), squareGrid(400, 30, hills, [E0, N0]), 32633);
  const holed = squareGrid(400, 30, (x, y) => (Math.hypot(x - E0 - 2000, y - N0) < 200 ? NaN : hills(x, y)), [E0, N0]);
  writeGridGeoTiff(join(dir, 'holed.tif'), holed, 32633, -9999);
  writeGridGeoTiff(join(dir, 'flat.tif'), squareGrid(200, 100, () => 1000, [E0, N0]), 32633);
  const rows = ['id,x,y,height_m,gobs_mgal,legacy_tc_mgal'];
  for (let i = 0; i < 24; i++) {
    const x = E0 - 3000 + 250 * (i % 6) + 37 * i;
    const y = N0 - 3000 + 900 * Math.floor(i / 6);
    rows.push(`P${i},${x},${y},${hills(x, y).toFixed(3)},${(980400 + i * 0.5).toFixed(3)},`);
  }
  rows.push(`MISFIT,${E0 + 1500},${N0 + 1500},${(hills(E0 + 1500, N0 + 1500) + 20).toFixed(3)},980410,`);
  rows.push(`TOWER,${E0 - 1500},${N0 + 1500},${(hills(E0 - 1500, N0 + 1500) + 80).toFixed(3)},980410,`);
  rows.push(`TUNNEL,${E0 + 1500},${N0 - 1500},${(hills(E0 + 1500, N0 - 1500) - 90).toFixed(3)},980410,`);
  rows.push(`LEGACY,${E0 + 2500},${N0 - 2500},${hills(E0 + 2500, N0 - 2500).toFixed(3)},980410,9.5`);
  rows.push(`NOGOBS,${E0 + 100},${N0 + 100},${hills(E0 + 100, N0 + 100).toFixed(3)},,`);
  rows.push(`HOLE,${E0 + 2150},${N0},${hills(E0 + 2150, N0).toFixed(3)},980410,`);
  writeFileSync(join(dir, 'stations.csv'), rows.join('\n') + '\n');
  writeFileSync(join(dir, 'outside.csv'), `${rows[0]}\n${rows[1]}\nFAR,${E0 + 50000},${N0},500,980000,\n`);
  writeFileSync(join(dir, 'flat-stations.csv'), 'id,x,y,height_m,gobs_mgal\nF1,500100,5000200,1000,979700\n');
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('talus reduce end to end', () => {
  it('writes identical results for --workers 0, 1 and 2 (bit for bit)', async () => {
    const outs: string[] = [];
    for (const w of ['0', '1', '2']) {
      const out = join(dir, `det${w}.csv`);
      const r = await reduce(['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'hills.tif'), '--out', out, '--radius', '4000', '--workers', w, '--batch', '3', '--densities', '2200,2450']);
      expect(r.code, r.err).toBe(0);
      outs.push(readFileSync(out, 'utf8'));
    }
    expect(outs[1]).toBe(outs[0]);
    expect(outs[2]).toBe(outs[0]);
  });

  it('raises every terrain and QC flag where it belongs', async () => {
    const out = join(dir, 'flags.csv');
    const r = await reduce(['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'holed.tif'), '--out', out, '--radius', '4000', '--workers', '0']);
    expect(r.code, r.err).toBe(0);
    const { header, rows } = readCsv(out);
    // every input column first, untouched
    expect(header.slice(0, 6)).toEqual(['id', 'x', 'y', 'height_m', 'gobs_mgal', 'legacy_tc_mgal']);
    const byId = Object.fromEntries(rows.map((row) => [row.id, row]));
    const flagsOf = (id: string): string[] => ((byId[id] as Record<string, string>).flags ?? '').split(';').filter((f) => f !== '');
    expect(flagsOf('MISFIT')).toContain('height_misfit');
    expect(flagsOf('MISFIT')).not.toContain('above_terrain');
    expect(flagsOf('TOWER')).toEqual(expect.arrayContaining(['above_terrain', 'height_misfit']));
    expect(flagsOf('TUNNEL')).toEqual(expect.arrayContaining(['below_terrain', 'height_misfit']));
    expect(flagsOf('LEGACY')).toContain('legacy_tc_change');
    expect(flagsOf('HOLE')).toContain('nodata_near');
    // the 4 km disc leaves the 12 km DEM for stations near its edge
    expect(rows.some((row) => (row.flags ?? '').includes('dem_partial') && Number(row.dem_coverage) < 1)).toBe(true);
    // no gravity: anomalies empty, corrections present
    const nog = byId.NOGOBS as Record<string, string>;
    expect(nog.free_air_anomaly_mgal).toBe('');
    expect(nog.complete_bouguer_mgal).toBe('');
    expect(Number(nog.terrain_corr_mgal)).toBeGreaterThan(0);
    expect(r.out).toContain('QC:');
  });

  it('a DEM flat at the station height gives TC = 0 and topo_effect = the LaFehr cap (113.080455 mGal at 1000 m)', async () => {
    const out = join(dir, 'flat.csv');
    const r = await reduce(['--stations', join(dir, 'flat-stations.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'flat.tif'), '--out', out, '--radius', '9000', '--keep-going']);
    expect(r.code, r.err).toBe(0);
    const row = readCsv(out).rows[0] as Record<string, string>;
    // physics.md §4 [calc]: LaFehr (1991) cap, rho 2670, h 1000 m: 113.080455 mGal (CSV prints 4 decimals)
    expect(Number(row.terrain_corr_mgal)).toBe(0);
    assertClose(Number(row.topo_effect_mgal), 113.080455, { abs: 5e-5 }, 'topo effect');
    assertClose(Number(row.bouguer_cap_mgal), 113.080455, { abs: 5e-5 }, 'cap');
    // physics.md §4: slab 111.968756 mGal
    assertClose(Number(row.bouguer_slab_mgal), 111.968756, { abs: 5e-5 }, 'slab');
    // the provenance file records G and every parameter
    const prov = JSON.parse(readFileSync(`${out}.provenance.json`, 'utf8')) as { constants: { G: number }; parameters: Record<string, unknown>; dems: { sha256: string }[] };
    expect(prov.constants.G).toBe(6.6743e-11);
    expect(prov.parameters.densityKgM3).toBe(2670);
    expect(prov.dems[0]?.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('a station outside the DEM is an error naming it, or a flagged row with --keep-going', async () => {
    const out = join(dir, 'outside.csv.out');
    const r = await reduce(['--stations', join(dir, 'outside.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'hills.tif'), '--out', out, '--radius', '2000']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/outside\.csv:3: station FAR: station lies outside the DEM/);
    expect(existsSync(out)).toBe(false);
    const r2 = await reduce(['--stations', join(dir, 'outside.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'hills.tif'), '--out', out, '--radius', '2000', '--keep-going']);
    expect(r2.code, r2.err).toBe(0);
    const far = readCsv(out).rows.find((row) => row.id === 'FAR') as Record<string, string>;
    expect(far.flags).toBe('outside_dem');
    expect(far.terrain_corr_mgal).toBe('');
  });

  it('bad input stops with exit 2 and one line naming the problem; no output or temp file is left', async () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'id,x,y,height_m\nA,500000,5000000,abc\n');
    const cases: [string[], RegExp][] = [
      [['--stations', join(dir, 'missing.csv'), '--dem', join(dir, 'hills.tif'), '--out', join(dir, 'x.csv')], /missing\.csv/],
      [['--stations', bad, '--station-crs', 'EPSG:32633', '--dem', join(dir, 'hills.tif'), '--out', join(dir, 'x.csv')], /bad\.csv:2.*height_m/],
      [['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:32633', '--dem', bad, '--out', join(dir, 'x.csv')], /bad\.csv/],
      [['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'hills.tif'), '--out', join(dir, 'x.csv'), '--density', '2.67'], /--density.*kg\/m\^3/],
      [['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:99999', '--dem', join(dir, 'hills.tif'), '--out', join(dir, 'x.csv')], /99999/],
    ];
    for (const [args, pattern] of cases) {
      const r = await reduce(args);
      expect(r.code, r.err).toBe(2);
      expect(r.err).toMatch(pattern);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
    expect(existsSync(join(dir, 'x.csv'))).toBe(false);
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});
