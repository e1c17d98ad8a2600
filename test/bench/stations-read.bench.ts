/**
 * Station reading speed on a generated 20000-row file (invented values): talus's reader
 * (hand-written split + validation + duplicate check) against csv-parse's sync parser alone
 * (no validation), and a projected-CRS file that needs the lon/lat conversion.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { readStations } from '../../src/stations/read-csv.js';

const N = 20_000;
const dir = mkdtempSync(join(tmpdir(), 'talus-bench-'));
const geo = join(dir, 'geo.csv');
const utm = join(dir, 'utm.csv');
let a = 'id,lon,lat,height_m,gobs_mgal,inner_tc_mgal,note\n';
let b = 'id,x,y,height_m,gobs_mgal\n';
for (let i = 0; i < N; i++) {
  const lon = 15 + (i % 200) * 0.001;
  const lat = 47 + Math.floor(i / 200) * 0.001;
  a += `S${i},${lon.toFixed(6)},${lat.toFixed(6)},${(500 + (i % 97)).toFixed(2)},${(980700 + (i % 13) * 0.1).toFixed(3)},0.05,"grid, row ${i}"\n`;
  b += `S${i},${(500000 + (i % 200) * 75).toFixed(3)},${(5200000 + Math.floor(i / 200) * 75).toFixed(3)},${500 + (i % 97)},980700\n`;
}
writeFileSync(geo, a);
writeFileSync(utm, b);

async function time(label: string, f: () => Promise<unknown> | unknown): Promise<number> {
  await f(); // warm-up
  const reps = 5;
  const t0 = performance.now();
  for (let r = 0; r < reps; r++) await f();
  const s = (performance.now() - t0) / 1000 / reps;
  console.log(`${label.padEnd(48)} ${(N / s / 1000).toFixed(0).padStart(6)} k rows/s  (${(s * 1000).toFixed(1)} ms)`);
  return s;
}

const ours = await time('readStations, lon/lat, quoted note column', () => readStations(geo, {}));
await time('readStations, EPSG:32633 x/y -> lon/lat', () => readStations(utm, { stationCrs: 'EPSG:32633' }));
const theirs = await time('csv-parse sync, parse only (no validation)', () =>
  parse(readFileSync(geo, 'utf8'), { columns: true, skip_empty_lines: true, comment: '#', bom: true }),
);
console.log(`csv-parse time / readStations time: ${(theirs / ours).toFixed(2)}`);
