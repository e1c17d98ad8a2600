/**
 * Writes a small uncompressed Float32 GeoTIFF with geotiff.js's writer (test fixtures built at
 * test time; the DEM reader's own tests use GDAL-made fixtures).
 */
import { writeFileSync } from 'node:fs';
import { writeArrayBuffer } from 'geotiff';
import type { DemGrid } from '../../src/dem/grid.js';

export function writeGridGeoTiff(path: string, g: DemGrid, epsg: number, nodata?: number): void {
  const values = new Float32Array(g.width * g.height);
  for (let i = 0; i < values.length; i++) {
    const v = g.data[i] as number;
    values[i] = Number.isNaN(v) && nodata !== undefined ? nodata : v;
  }
  const geographic = g.crs.kind === 'geographic';
  const meta: Record<string, unknown> = {
    width: g.width,
    height: g.height,
    ModelPixelScale: [g.cellSizeX, g.cellSizeY, 0],
    ModelTiepoint: [0, 0, 0, g.originX, g.originY, 0],
    GTModelTypeGeoKey: geographic ? 2 : 1,
    GTRasterTypeGeoKey: 1,
    ...(geographic ? { GeographicTypeGeoKey: epsg } : { ProjectedCSTypeGeoKey: epsg }),
    ...(nodata !== undefined ? { GDAL_NODATA: String(nodata) } : {}),
  };
  const buf = writeArrayBuffer(values, meta as Parameters<typeof writeArrayBuffer>[1]);
  writeFileSync(path, Buffer.from(buf as ArrayBuffer));
}
