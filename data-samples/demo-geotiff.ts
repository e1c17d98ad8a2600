/**
 * Writes a DemGrid as a compressed Float32 GeoTIFF: geotiff.js writes an uncompressed file
 * (it never compresses), then GDAL's gdal_translate compresses it (DEFLATE, floating-point
 * predictor, 256 x 256 tiles), and gdalinfo -json describes the result for the tests.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeArrayBuffer } from 'geotiff';
import type { DemGrid } from '../src/dem/grid.js';

/** Writes `g` to `path` (relative to the working directory) and returns gdalinfo's JSON text. */
export function writeCompressedGeoTiff(path: string, g: DemGrid, epsg: number): string {
  const geographic = g.crs.kind === 'geographic';
  const meta: Record<string, unknown> = {
    width: g.width,
    height: g.height,
    ModelPixelScale: [g.cellSizeX, g.cellSizeY, 0],
    ModelTiepoint: [0, 0, 0, g.originX, g.originY, 0],
    GTModelTypeGeoKey: geographic ? 2 : 1,
    GTRasterTypeGeoKey: 1, // pixel-is-area
    ...(geographic ? { GeographicTypeGeoKey: epsg } : { ProjectedCSTypeGeoKey: epsg }),
  };
  const dir = mkdtempSync(join(tmpdir(), 'talus-demo-'));
  try {
    const raw = join(dir, 'raw.tif');
    const buf = writeArrayBuffer(new Float32Array(g.data), meta as Parameters<typeof writeArrayBuffer>[1]);
    writeFileSync(raw, Buffer.from(buf as ArrayBuffer));
    execFileSync('gdal_translate', ['-q', '-a_srs', `EPSG:${epsg}`, '-co', 'COMPRESS=DEFLATE', '-co', 'PREDICTOR=3', '-co', 'ZLEVEL=9', '-co', 'TILED=YES', raw, path], {
      stdio: ['ignore', 'inherit', 'inherit'],
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return execFileSync('gdalinfo', ['-json', path], { encoding: 'utf8' });
}
