/** Writes a small uncompressed Float32 GeoTIFF at test time (the DEM reader's own tests use GDAL-made fixtures). */
import { writeFileSync } from 'node:fs';
import type { DemGrid } from '../../src/dem/grid.js';
import { encodeGeoTiff } from '../../src/dem/geotiff-write.js';

export function writeGridGeoTiff(path: string, g: DemGrid, epsg: number, nodata?: number): void {
  writeFileSync(path, encodeGeoTiff(g, epsg, nodata));
}
