/**
 * A cluster run: `talus reduce --shard K/N` on each share, then `talus merge`, must write the
 * whole run's results CSV byte for byte (the independent path: one `talus reduce` over every
 * station), including tc_outlier decided across share borders; and every way of joining the
 * wrong shares stops with exit 2 and one line naming the files.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { squareGrid } from '../helpers/synthetic-grid.js';
import { writeGridGeoTiff } from '../helpers/write-geotiff.js';

let dir = '';
const E0 = 500000;
const N0 = 5000000;
// the planted outlier: a 90 m square tower 250 m high, 60 m east of station SPIKE
const TOWER_E = E0 + 160;
const TOWER_N = N0 - 50;

/** Gentle hills (all stations within the 50 m height window of the neighbourhood check) and the tower. */
function terrain(x: number, y: number): number {
  const tower = Math.abs(x - TOWER_E) < 45 && Math.abs(y - TOWER_N) < 45 ? 250 : 0;
  return 600 + 12 * Math.sin((x - E0) / 900) * Math.cos((y - N0) / 700) + tower;
}

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIo();
  const code = await runCli(args, io);
  return { code, out: io.out(), err: io.err() };
}

const common = (): string[] => ['--stations', join(dir, 'stations.csv'), '--station-crs', 'EPSG:32633', '--dem', join(dir, 'dem.tif'), '--radius', '1500', '--workers', '0', '--keep-going', '--no-progress'];

async function shard(k: number, n: number, out: string, extra: string[] = []): Promise<void> {
  const r = await cli(['reduce', ...common(), '--shard', `${k}/${n}`, '--out', join(dir, out), ...extra]);
  expect(r.code, r.err).toBe(0);
}

function rowsOf(path: string): string[][] {
  return readFileSync(path, 'utf8').trim().split('\n').map((l) => l.split(','));
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'talus-shard-'));
  // 12 km x 12 km at 30 m (UTM 33N)
  writeGridGeoTiff(join(dir, 'dem.tif'), squareGrid(400, 30, terrain, [E0, N0]), 32633);
  const rows = ['id,x,y,height_m,gobs_mgal,legacy_tc_mgal,note'];
  // 6 x 6 stations 600 m apart over the centre, scattered a little
  for (let i = 0; i < 36; i++) {
    const x = E0 - 1500 + 600 * (i % 6) + ((i * 37) % 90);
    const y = N0 - 1500 + 600 * Math.floor(i / 6) + ((i * 53) % 110);
    rows.push(`S${i},${x},${y},${terrain(x, y).toFixed(3)},${(980400 + i * 0.37).toFixed(3)},,"a, quoted note ${i}"`);
  }
  rows.push(`SPIKE,${E0 + 100},${N0 - 50},${terrain(E0 + 100, N0 - 50).toFixed(3)},980410,,`);
  rows.push(`MISFIT,${E0 - 700},${N0 + 900},${(terrain(E0 - 700, N0 + 900) + 25).toFixed(3)},980410,,`);
  rows.push(`LEGACY,${E0 + 800},${N0 - 900},${terrain(E0 + 800, N0 - 900).toFixed(3)},980410,7.5,`);
  rows.push(`DUP,${E0 - 1500},${N0 - 1500},${terrain(E0 - 1500, N0 - 1500).toFixed(3)},980411,,`);
  rows.push('BAD,abc,5000000,600,980400,,');
  writeFileSync(join(dir, 'stations.csv'), rows.join('\n') + '\n');
  const single = await cli(['reduce', ...common(), '--out', join(dir, 'single.csv')]);
  expect(single.code, single.err).toBe(0);
  for (const k of [1, 2, 3]) await shard(k, 3, `part${k}.csv`);
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('talus reduce --shard K/N and talus merge', () => {
  it('3 shards merged equal the single run byte for byte, tc_outlier across a shard border included', async () => {
    const r = await cli(['merge', join(dir, 'part1.csv'), join(dir, 'part2.csv'), join(dir, 'part3.csv'), '-o', join(dir, 'merged.csv')]);
    expect(r.code, r.err).toBe(0);
    const single = readFileSync(join(dir, 'single.csv'), 'utf8');
    expect(readFileSync(join(dir, 'merged.csv'), 'utf8')).toBe(single);
    // the planted flags are really there, so the comparison covers them
    const flagsOf = (id: string): string => (single.split('\n').find((l) => l.startsWith(`${id},`)) ?? '').split(',').pop() ?? '';
    expect(flagsOf('SPIKE')).toContain('tc_outlier');
    expect(flagsOf('MISFIT')).toContain('height_misfit');
    expect(flagsOf('LEGACY')).toContain('legacy_tc_change');
    expect(flagsOf('DUP')).toContain('duplicate_position');
    expect(flagsOf('BAD')).toContain('bad_row');
    // SPIKE's neighbours within 1 km lie in more than one shard: the flag needed the merge
    const shardOf = new Map<string, number>();
    const pos = new Map<string, [number, number]>();
    for (const k of [1, 2, 3]) {
      // a share leaves tc_outlier to the merge (the flags cell is the last one)
      expect(rowsOf(join(dir, `part${k}.csv`)).slice(1).map((row) => row[row.length - 1])).not.toContainEqual(expect.stringContaining('tc_outlier'));
      for (const row of rowsOf(join(dir, `part${k}.csv`)).slice(1)) {
        shardOf.set(row[1] as string, k);
        pos.set(row[1] as string, [Number(row[9]), Number(row[10])]);
      }
    }
    const [sx, sy] = pos.get('SPIKE') as [number, number];
    const near = [...pos].filter(([id, [x, y]]) => id !== 'SPIKE' && Math.hypot(x - sx, y - sy) < 1000).map(([id]) => shardOf.get(id));
    expect(new Set([...near, shardOf.get('SPIKE')]).size).toBeGreaterThan(1);
    expect(r.out).toContain('tc_outlier');
    // merged provenance: every station counted once, the flags recounted
    const prov = JSON.parse(readFileSync(join(dir, 'merged.csv.provenance.json'), 'utf8')) as { stationCounts: { total: number; flagged: Record<string, number> }; shards: unknown[] };
    expect(prov.stationCounts.total).toBe(41);
    expect(prov.stationCounts.flagged.tc_outlier).toBeGreaterThanOrEqual(1);
    expect(prov.shards).toHaveLength(3);
  });

  it('each shard reads a smaller DEM window than the single run', () => {
    type Prov = { dems: { windowRead: { width: number; height: number } }[]; shard?: { stations: number } };
    const cells = (p: string): number => {
      const w = (JSON.parse(readFileSync(p, 'utf8')) as Prov).dems[0]?.windowRead as { width: number; height: number };
      return w.width * w.height;
    };
    const whole = cells(join(dir, 'single.csv.provenance.json'));
    let stations = 0;
    for (const k of [1, 2, 3]) {
      expect(cells(join(dir, `part${k}.csv.provenance.json`))).toBeLessThan(whole);
      stations += (JSON.parse(readFileSync(join(dir, `part${k}.csv.provenance.json`), 'utf8')) as Prov).shard?.stations ?? 0;
    }
    expect(stations).toBe(41);
  });

  it('wrong sets of shards stop with exit 2 and one line naming the problem; nothing is written', async () => {
    await shard(2, 3, 'other2.csv', ['--density', '2600']);
    const p = (f: string): string => join(dir, f);
    const cases: [string[], RegExp][] = [
      [[p('part1.csv'), p('part3.csv')], /shard 2\/3 missing/],
      [[p('part1.csv'), p('other2.csv'), p('part3.csv')], /densityKgM3 is 2670 in .*part1\.csv but 2600 in .*other2\.csv/],
      [[p('part1.csv'), p('part2.csv'), p('part2.csv'), p('part3.csv')], /shard 2\/3 is given twice: .*part2\.csv and .*part2\.csv/],
      [[p('part1.csv'), p('single.csv'), p('part3.csv')], /single\.csv\.provenance\.json: the provenance has no shard record/],
    ];
    for (const [files, pattern] of cases) {
      const r = await cli(['merge', ...files, '-o', p('bad-merge.csv')]);
      expect(r.code, r.err).toBe(2);
      expect(r.err).toMatch(pattern);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
    expect(existsSync(p('bad-merge.csv'))).toBe(false);
  });

  it('--shard 0/3 and 4/3 stop with exit 2 and one line naming the option and value', async () => {
    for (const spec of ['0/3', '4/3', '2', 'a/b']) {
      const r = await cli(['reduce', ...common(), '--shard', spec, '--out', join(dir, 'never.csv')]);
      expect(r.code, r.err).toBe(2);
      expect(r.err).toContain(`option --shard: "${spec}"`);
      expect(r.err).toMatch(/expected K\/N with whole numbers 1 <= K <= N/);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
    expect(existsSync(join(dir, 'never.csv'))).toBe(false);
  });
});
