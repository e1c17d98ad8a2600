/**
 * Writes a DemGrid as a compressed Float32 GeoTIFF: geotiff.js writes an uncompressed file
 * (it never compresses), then GDAL's gdal_translate compresses it (DEFLATE, floating-point
 * predictor, 256 x 256 tiles), and gdalinfo -json describes the result for the tests.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { DemGrid } from '../src/dem/grid.js';
import { encodeGeoTiff } from '../src/dem/geotiff-write.js';

/** Writes `g` to `path` (relative to the working directory) and returns gdalinfo's JSON text. */
export function writeCompressedGeoTiff(path: string, g: DemGrid, epsg: number): string {
  const dir = mkdtempSync(join(tmpdir(), 'talus-demo-'));
  try {
    const raw = join(dir, 'raw.tif');
    writeFileSync(raw, encodeGeoTiff(g, epsg));
    execFileSync('gdal_translate', ['-q', '-a_srs', `EPSG:${epsg}`, '-co', 'COMPRESS=DEFLATE', '-co', 'PREDICTOR=3', '-co', 'ZLEVEL=9', '-co', 'TILED=YES', raw, path], {
      stdio: ['ignore', 'inherit', 'inherit'],
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return execFileSync('gdalinfo', ['-json', path], { encoding: 'utf8' });
}
