/**
 * Pyramid build memory benchmark: a synthetic 8000 x 8000 Float32 DEM (invented hills with a
 * metre-scale roughness and a sprinkle of nodata), then buildPyramid on it. Prints the build time,
 * the stored pyramid's bytes against the DEM's, and the process's peak RSS
 * (process.resourceUsage().maxRSS) before and after the build.
 * Target: peak RSS after the build <= 1.5 x DEM bytes + 200 MB.
 * Run: node --import tsx --expose-gc test/bench/pyramid-memory.bench.ts [size]
 */
import { gridFromFunction } from '../../src/dem/grid.js';
import { buildPyramid } from '../../src/terrain/pyramid.js';

const SIZE = Number(process.argv[2] ?? 8000);
const MB = 1024 * 1024;
const gc = (globalThis as { gc?: () => void }).gc ?? (() => {});

function peakRssBytes(): number {
  return process.resourceUsage().maxRSS * 1024;
}

const grid = gridFromFunction(
  {
    width: SIZE,
    height: SIZE,
    originX: 500000,
    originY: 5300000,
    cellSizeX: 30,
    cellSizeY: 30,
    crs: { kind: 'projected', proj4: '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', label: 'EPSG:32633', linearUnitM: 1 },
    source: `synthetic ${SIZE} x ${SIZE}`,
  },
  (x, y, row, col) =>
    (row * 7919 + col * 104729) % 100003 === 0 ? NaN : 800 + 400 * Math.sin(x / 3900) * Math.cos(y / 5100) + 3.7 * ((col * 7 + row * 3) % 11),
);
gc();
const demBytes = grid.data.byteLength;
const rssBefore = process.memoryUsage().rss;
const peakBefore = peakRssBytes();

const t0 = performance.now();
const pyramid = buildPyramid(grid);
const seconds = (performance.now() - t0) / 1000;
const peakAfter = peakRssBytes();
gc();

let storedBytes = 0;
for (const level of pyramid.levels) storedBytes += level.cells?.byteLength ?? 0;
const limit = 1.5 * demBytes + 200 * MB;
const mb = (bytes: number): string => `${(bytes / MB).toFixed(0)} MB`;
console.log(`DEM ${SIZE} x ${SIZE} float32: ${mb(demBytes)}; ${pyramid.levels.length} levels, stored ${mb(storedBytes)} = ${(storedBytes / demBytes).toFixed(2)} x DEM`);
console.log(`build ${seconds.toFixed(2)} s = ${((SIZE * SIZE) / seconds / 1e6).toFixed(1)} M native cells/s`);
console.log(
  `RSS before the build ${mb(rssBefore)} (peak so far ${mb(peakBefore)}); peak RSS after the build ${mb(peakAfter)} = ` +
    `${(peakAfter / demBytes).toFixed(2)} x DEM; build added ${mb(peakAfter - peakBefore)} to the peak ` +
    `(${((peakAfter - peakBefore - storedBytes) / demBytes).toFixed(2)} x DEM beyond the stored levels)`,
);
console.log(`target <= ${mb(limit)}: ${peakAfter <= limit ? 'met' : 'MISSED'}`);
