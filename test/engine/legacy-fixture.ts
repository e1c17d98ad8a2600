/**
 * Shared set-up of the legacy reprocessing tests: small UTM 33N GeoTIFFs written at test
 * time, station files, one in-process `talus reduce` run, and the results CSV as records.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import proj4 from 'proj4';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { squareGrid } from '../helpers/synthetic-grid.js';
import { writeGridGeoTiff } from '../helpers/write-geotiff.js';

/** Centre of the invented survey area, UTM 33N metres (about 45.1 N, 15 E). */
export const CENTRE = [500000, 5000000] as const;
export const UTM33N = 32633;
/** Flat terrain height, m. */
export const FLAT_M = 500;

export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'talus-legacy-'));
}

/** A 6 km square DEM of 50 m cells around CENTRE, heights f(x, y) (UTM metres). */
export function writeDem(dir: string, name: string, f: (x: number, y: number) => number = () => FLAT_M): string {
  const path = join(dir, name);
  writeGridGeoTiff(path, squareGrid(120, 50, f, [...CENTRE]), UTM33N);
  return path;
}

export function writeCsv(dir: string, name: string, header: string[], rows: (string | number)[][]): string {
  const path = join(dir, name);
  writeFileSync(path, [header.join(','), ...rows.map((r) => r.join(','))].join('\n') + '\n');
  return path;
}

export interface Run {
  code: number;
  out: string;
  err: string;
  rows: Record<string, string>[];
  provenance: Record<string, unknown>;
}

/** Runs `talus reduce` inline (0 workers, no progress) with a 2.5 km radius inside the DEM. */
export async function reduce(stations: string, dem: string, outPath: string, extra: string[] = []): Promise<Run> {
  const io = memoryIo();
  const argv = ['reduce', '--stations', stations, '--dem', dem, '--out', outPath, '--station-crs', `EPSG:${UTM33N}`];
  argv.push('--radius', '2500', '--workers', '0', '--no-progress', ...extra);
  const code = await runCli(argv, io);
  if (code !== 0) return { code, out: io.out(), err: io.err(), rows: [], provenance: {} };
  const lines = readFileSync(outPath, 'utf8').trim().split('\n');
  const header = (lines[0] as string).split(',');
  const rows = lines.slice(1).map((l) => {
    const cells = l.split(',');
    return Object.fromEntries(header.map((h, i) => [h, cells[i] ?? '']));
  });
  const provenance = JSON.parse(readFileSync(`${outPath}.provenance.json`, 'utf8')) as Record<string, unknown>;
  return { code, out: io.out(), err: io.err(), rows, provenance };
}

export const num = (row: Record<string, string> | undefined, col: string): number => {
  const text = row?.[col];
  if (text === undefined || text === '') return NaN;
  return Number(text);
};

/** Latitude, degrees, of a UTM 33N point, by proj4 (outside the project's reduction code). */
export function latOf(x: number, y: number): number {
  const [, lat] = proj4('+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', 'EPSG:4326', [x, y]) as [number, number];
  return lat;
}
