/**
 * DEM read benchmark: an 8000 x 8000 Float32 DEM, deflate + floating-point predictor, 256-px
 * tiles (made once with GDAL into the system temp dir), read whole with readDemWindow.
 * Prints decode rate (MB of float32 grid per second) and peak RSS against the grid size; each
 * mode runs in its own process so maxRSS belongs to that mode alone.
 * Target: peak RSS <= 1.3 x grid bytes + 150 MB.
 */
import { spawnSync, execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { openDem } from '../../src/dem/geotiff-open.js';
import { readDemWindow } from '../../src/dem/read-window.js';
import { readStrips } from '../../src/dem/strip-reader.js';

const SIZE = 8000;
const dir = join(tmpdir(), 'talus-bench');
const demPath = join(dir, `dem-${SIZE}-deflate-pred3.tif`);
const MB = 1024 * 1024;

function makeDem(): void {
  mkdirSync(dir, { recursive: true });
  // invented terrain: a 200 x 200 awk grid of hills, upsampled bilinearly to 8000 x 8000
  const asc = join(dir, 'seed.asc');
  const lines = ['ncols 200', 'nrows 200', 'xllcorner 500000', 'yllcorner 5000000', 'cellsize 400'];
  for (let r = 0; r < 200; r++) {
    const row: string[] = [];
    for (let c = 0; c < 200; c++) row.push((800 + 400 * Math.sin(c / 13) * Math.cos(r / 17) + 3.7 * ((c * 7 + r * 3) % 11)).toFixed(3));
    lines.push(row.join(' '));
  }
  writeFileSync(asc, lines.join('\n') + '\n');
  execFileSync('gdalwarp', ['-q', '-overwrite', '-s_srs', 'EPSG:32633', '-ts', String(SIZE), String(SIZE), '-r', 'bilinear', '-ot', 'Float32',
    '-co', 'TILED=YES', '-co', 'BLOCKXSIZE=256', '-co', 'BLOCKYSIZE=256', '-co', 'COMPRESS=DEFLATE', '-co', 'PREDICTOR=3', asc, demPath]);
}

async function runMode(mode: string): Promise<void> {
  const src = await openDem(demPath);
  const t0 = performance.now();
  let cells: number;
  if (mode === 'full') {
    cells = (await readDemWindow(src)).data.length;
  } else if (mode === 'full-cache') {
    // the same strips with geotiff.js's (unbounded) decoded-tile cache switched on
    let n = 0;
    await readStrips(src, { col0: 0, col1: src.width, row0: 0, row1: src.height }, (s) => { n += s.length; }, { cache: true });
    cells = n;
  } else {
    const x0 = src.originX + 3500 * src.cellSizeX;
    const y1 = src.originY - 3500 * src.cellSizeY;
    cells = (await readDemWindow(src, { minX: x0, maxX: x0 + 1000 * src.cellSizeX, minY: y1 - 1000 * src.cellSizeY, maxY: y1 })).data.length;
  }
  const s = (performance.now() - t0) / 1000;
  const gridBytes = cells * 4;
  const rssBytes = process.resourceUsage().maxRSS * 1024;
  const limit = 1.3 * gridBytes + 150 * MB;
  console.log(
    `${mode.padEnd(11)} ${cells} cells in ${s.toFixed(2)} s = ${(gridBytes / MB / s).toFixed(1)} MB/s of float32 grid; ` +
      `peak RSS ${(rssBytes / MB).toFixed(0)} MB = ${(rssBytes / gridBytes).toFixed(2)} x grid (${(gridBytes / MB).toFixed(0)} MB); ` +
      `target <= ${(limit / MB).toFixed(0)} MB: ${rssBytes <= limit ? 'met' : 'MISSED'}`,
  );
}

const mode = process.argv[2];
if (mode !== undefined) {
  await runMode(mode);
} else {
  if (!existsSync(demPath)) {
    const t = performance.now();
    makeDem();
    console.log(`made ${demPath} with gdalwarp in ${((performance.now() - t) / 1000).toFixed(1)} s`);
  }
  console.log(`DEM ${SIZE} x ${SIZE} Float32, deflate + predictor 3, 256 x 256 tiles, file ${(statSync(demPath).size / MB).toFixed(0)} MB`);
  const self = fileURLToPath(import.meta.url);
  for (const m of ['full', 'full-cache', 'window-1000']) {
    const r = spawnSync(process.execPath, ['--import', 'tsx', self, m], { stdio: 'inherit' });
    if (r.status !== 0) process.exit(r.status ?? 1);
  }
}
